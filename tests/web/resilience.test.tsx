import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { PanelErrorBoundary } from '../../web/components/panel-error-boundary';
import { resetCsrfToken } from '../../web/lib/api-client';
import { fail, mockApi, ok, VIEWER_ME } from './helpers/mock-api';
import { renderApp } from './helpers/render-app';

beforeEach(() => resetCsrfToken());
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  vi.restoreAllMocks();
});

describe('panel error boundary', () => {
  it('replaces only the failed panel and renders it again after "Try again"', async () => {
    vi.spyOn(console, 'error').mockImplementation(() => {}); // React reports the caught error; expected here
    let broken = true;
    function Fragile() {
      if (broken) throw new Error('render failed');
      return <p>Panel content</p>;
    }
    const onReset = vi.fn();
    render(
      <div>
        <h1>Page title</h1>
        <PanelErrorBoundary onReset={onReset}>
          <Fragile />
        </PanelErrorBoundary>
      </div>,
    );
    expect(screen.getByText('This part of the page stopped working')).toBeTruthy();
    expect(screen.getByRole('heading', { name: 'Page title' })).toBeTruthy();
    broken = false;
    await userEvent.setup().click(screen.getByRole('button', { name: 'Try again' }));
    expect(screen.getByText('Panel content')).toBeTruthy();
    expect(onReset).toHaveBeenCalledTimes(1);
  });
});

describe('lost session', () => {
  it('goes back to sign-in, remembering the page, when the session ends while a page loads data', async () => {
    let sessionAlive = true;
    mockApi({
      'GET /api/auth/me': () => (sessionAlive ? ok(VIEWER_ME) : fail(401, 'not_signed_in', 'Sign in first')),
      'GET /api/observatories': () => {
        sessionAlive = false; // the session expired between the two requests
        return fail(401, 'not_signed_in', 'Sign in first');
      },
    });
    const { router } = renderApp('/observatories');
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeTruthy();
    expect(router.state.location.search).toBe('?redirectTo=%2Fobservatories');
  });
});
