import { cleanup, screen, waitFor } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { ObservatoryForm } from '../../web/features/observatories/components/observatory-form';
import { resetCsrfToken } from '../../web/lib/api-client';
import { fail, mockApi, ok } from './helpers/mock-api';
import { renderWithClient } from './helpers/render-app';

beforeEach(() => resetCsrfToken());
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

// An invented site on the surface: |(3 000 000, 4 000 000, 4 000 000)| = √41e12 m ≈ 6403.1 km,
// so shrink it slightly: (3 000 000, 4 000 000, 3 950 000) m → √(9 + 16 + 15.6025)e12 = 6372.0 km (hand arithmetic).
const SURFACE_POINT = { x: '3000000', y: '4000000', z: '3950000' };

type User = ReturnType<typeof renderWithClient>['user'];

async function fillObservatory(user: User, point: { x: string; y: string; z: string }) {
  await user.type(screen.getByLabelText('Code'), 'hilltop');
  await user.type(screen.getByLabelText('Name'), 'Hilltop Array');
  await user.type(screen.getByLabelText('ITRF x (m)'), point.x);
  await user.type(screen.getByLabelText('ITRF y (m)'), point.y);
  await user.type(screen.getByLabelText('ITRF z (m)'), point.z);
}

/** The text of the error line tied to a control through aria-describedby. */
function describedErrorOf(control: HTMLElement): string {
  const ids = (control.getAttribute('aria-describedby') ?? '').split(' ').filter(Boolean);
  return ids.map((id) => document.getElementById(id)?.textContent ?? '').join(' ');
}

describe('observatory form', () => {
  it('refuses a point that is not 6350–6400 km from the geocentre and shows the distance', async () => {
    const server = mockApi({});
    const { user } = renderWithClient(<ObservatoryForm />);
    // 6 000 000 m on one axis only: 6000.0 km from the geocentre.
    await fillObservatory(user, { x: '6000000', y: '0', z: '0' });
    expect(screen.getByText(/Distance from the geocentre:/).textContent).toContain('6000.0 km');
    await user.click(screen.getByRole('button', { name: 'Add observatory' }));
    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('This point is 6000.0 km from the geocentre');
    expect(alert.textContent).toContain('6350–6400 km');
    expect(server.calls).toHaveLength(0);
  });

  it('shows the live distance for a point on the surface and sends the observatory', async () => {
    const server = mockApi({
      'GET /api/auth/csrf': ok({ token: 'tok' }),
      'POST /api/observatories': (call) => ok(call.body, 201),
    });
    const onDone = vi.fn();
    const { user } = renderWithClient(<ObservatoryForm onDone={onDone} />);
    await fillObservatory(user, SURFACE_POINT);
    expect(screen.getByText(/Distance from the geocentre:/).textContent).toContain('6372.0 km');
    await user.click(screen.getByRole('button', { name: 'Add clock-correction point' }));
    await user.type(screen.getByLabelText('MJD of point 1'), '60000.123456789012345');
    await user.type(screen.getByLabelText('Correction (µs) of point 1'), '-1.5');
    await user.click(screen.getByRole('button', { name: 'Add observatory' }));
    await waitFor(() => expect(onDone).toHaveBeenCalledTimes(1));
    expect(server.callsTo('POST', '/api/observatories')[0].body).toEqual({
      code: 'hilltop',
      name: 'Hilltop Array',
      itrf_x_m: 3_000_000,
      itrf_y_m: 4_000_000,
      itrf_z_m: 3_950_000,
      // The MJD travels as text, every digit kept.
      clock_corrections: [{ mjd: '60000.123456789012345', correction_us: -1.5 }],
    });
  });

  it('puts server field errors from details[].path on the matching fields', async () => {
    mockApi({
      'GET /api/auth/csrf': ok({ token: 'tok' }),
      'POST /api/observatories': fail(400, 'validation_failed', 'code: already registered', [
        { path: ['code'], message: 'an observatory with this code already exists' },
        { path: ['clock_corrections', 0, 'correction_us'], message: 'must be finite' },
      ]),
    });
    const { user } = renderWithClient(<ObservatoryForm />);
    await fillObservatory(user, SURFACE_POINT);
    await user.click(screen.getByRole('button', { name: 'Add clock-correction point' }));
    await user.type(screen.getByLabelText('MJD of point 1'), '60000');
    await user.type(screen.getByLabelText('Correction (µs) of point 1'), '2');
    await user.click(screen.getByRole('button', { name: 'Add observatory' }));

    const code = screen.getByLabelText('Code');
    await waitFor(() => expect(code.getAttribute('aria-invalid')).toBe('true'));
    expect(describedErrorOf(code)).toContain('an observatory with this code already exists');
    expect(screen.getByLabelText('Correction (µs) of point 1').getAttribute('aria-invalid')).toBe('true');
    expect(screen.getByText('must be finite')).toBeTruthy();
    expect(screen.getByLabelText('Name').getAttribute('aria-invalid')).toBeNull();
  });

  it('puts the server radius error (path itrf_x_m) on the x field', async () => {
    mockApi({
      'GET /api/auth/csrf': ok({ token: 'tok' }),
      'POST /api/observatories': fail(400, 'validation_failed', 'itrf_x_m: out of range', [
        { path: ['itrf_x_m'], message: 'the position is 6300.000 km from the geocentre' },
      ]),
    });
    const { user } = renderWithClient(<ObservatoryForm />);
    await fillObservatory(user, SURFACE_POINT);
    await user.click(screen.getByRole('button', { name: 'Add observatory' }));
    const x = screen.getByLabelText('ITRF x (m)');
    await waitFor(() => expect(describedErrorOf(x)).toContain('6300.000 km'));
  });

  it('rejects clock points whose MJD does not increase, before calling the API', async () => {
    const server = mockApi({});
    const { user } = renderWithClient(<ObservatoryForm />);
    await fillObservatory(user, SURFACE_POINT);
    for (const [mjd, us] of [['60010', '1'], ['60005', '2']]) {
      await user.click(screen.getByRole('button', { name: 'Add clock-correction point' }));
      const n = screen.getAllByRole('button', { name: /^Remove point/ }).length;
      await user.type(screen.getByLabelText(`MJD of point ${n}`), mjd);
      await user.type(screen.getByLabelText(`Correction (µs) of point ${n}`), us);
    }
    await user.click(screen.getByRole('button', { name: 'Add observatory' }));
    expect(await screen.findByText('MJD: must be later than the point above')).toBeTruthy();
    expect(screen.getByLabelText('MJD of point 2').getAttribute('aria-invalid')).toBe('true');
    expect(server.calls).toHaveLength(0);
  });

  it('edits without sending the code, and removes a clock point row', async () => {
    const server = mockApi({
      'GET /api/auth/csrf': ok({ token: 'tok' }),
      'PATCH /api/observatories/:code': (call) => ok({ code: 'hilltop', ...(call.body as object) }),
    });
    const onDone = vi.fn();
    const existing = {
      code: 'hilltop',
      name: 'Hilltop Array',
      itrf_x_m: 3_000_000,
      itrf_y_m: 4_000_000,
      itrf_z_m: 3_950_000,
      clock_corrections: [
        { mjd: '60000.5', correction_us: 1 },
        { mjd: '60001.5', correction_us: 2 },
      ],
    };
    const { user } = renderWithClient(<ObservatoryForm observatory={existing} onDone={onDone} />);
    expect((screen.getByLabelText('Code') as HTMLInputElement).readOnly).toBe(true);
    await user.click(screen.getByRole('button', { name: 'Remove point 1' }));
    await user.clear(screen.getByLabelText('Name'));
    await user.type(screen.getByLabelText('Name'), 'Hilltop Array II');
    await user.click(screen.getByRole('button', { name: 'Save changes' }));
    await waitFor(() => expect(onDone).toHaveBeenCalled());
    const [patch] = server.callsTo('PATCH', '/api/observatories/hilltop');
    expect(patch.body).toEqual({
      name: 'Hilltop Array II',
      itrf_x_m: 3_000_000,
      itrf_y_m: 4_000_000,
      itrf_z_m: 3_950_000,
      clock_corrections: [{ mjd: '60001.5', correction_us: 2 }],
    });
  });
});
