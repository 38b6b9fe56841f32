import { describe, expect, it } from 'vitest';
import { formStateToModel, solveForPaths } from '../../web/features/model-editor/lib/form-state-to-model';
import { modelToFormState } from '../../web/features/model-editor/lib/model-to-form-state';
import { jsonValueOfText } from '../../web/features/model-editor/lib/model-number-text';
import { newCompanion, withCompanionKind } from '../../web/features/model-editor/lib/model-edits';
import { fieldKeyOf, modelFieldErrors } from '../../web/features/model-editor/lib/server-field-errors';
import { parseParameterPath } from '../../web/features/model-editor/lib/parameter-paths';

// An invented model touching every section; values chosen to need more digits than a double holds.
const MODEL = {
  format: 'pulsekeeper-model/1',
  pulsar: 'J1745-0952',
  epoch_mjd: '58000.000000000000000000123',
  spin: { frequency_hz: '716.358712478123456789', frequency_derivatives: ['-8.1e-16', '0', '1.25e-27'] },
  astrometry: {
    ra_hms: '17:45:09.123456789012',
    dec_dms: '-09:52:11.98765',
    pm_ra_cosdec_mas_per_yr: -3.1,
    pm_dec_mas_per_yr: '0.100000000000000000001',
    parallax_mas: 0,
  },
  dispersion: { dm_pc_per_cm3: 41.27, dm_derivatives: [0.0002] },
  companions: [
    {
      name: 'b',
      kind: 'keplerian',
      enabled: true,
      period_days: '41.300000000000000001',
      projected_semimajor_axis_lt_s: 0.00085,
      eccentricity: 0.0,
      periastron_longitude_deg: 12.5,
      periastron_epoch_mjd: '58010.50000000000000000007',
    },
    { name: 'c', kind: 'low-eccentricity', enabled: false, period_days: 5.7, projected_semimajor_axis_lt_s: '1.2', ascending_node_epoch_mjd: '58001.25', e_sin_omega: '1e-5' },
  ],
  offsets: [{ backend: 'wideband-2', seconds: '0.000001234567890123456789' }],
  noise: [{ backend: 'wideband-1', uncertainty_scale: 1.1, added_jitter_us: 0.3 }],
  glitches: [{ epoch_mjd: '58500.1', phase_step_turns: 0.2 }],
  solve_for: [
    'spin.frequency_hz',
    'spin.frequency_derivatives[0]',
    'astrometry.ra_hms',
    'dispersion.dm_derivatives[0]',
    'companions[b].period_days',
    'companions[c].e_sin_omega',
    'offsets[wideband-2].seconds',
    'glitches[0].phase_step_turns',
  ],
};

/** Every leaf as "path = text", so a lost key or a changed digit shows up as a difference. */
function leaves(value: unknown, path = ''): string[] {
  if (Array.isArray(value)) return value.flatMap((v, i) => leaves(v, `${path}[${i}]`));
  if (typeof value === 'object' && value !== null) {
    return Object.entries(value).flatMap(([k, v]) => leaves(v, path ? `${path}.${k}` : k));
  }
  return [`${path} = ${String(value)}`];
}

describe('model JSON ↔ editor state', () => {
  it('round trip keeps every key and every digit', () => {
    const back = formStateToModel(modelToFormState(MODEL));
    const { solve_for: solveIn, ...restIn } = MODEL;
    const { solve_for: solveOut, ...restOut } = back as typeof MODEL;
    expect(leaves(restOut).sort()).toEqual(leaves(restIn).sort());
    expect([...solveOut].sort()).toEqual([...solveIn].sort());
  });

  it('keeps long digit strings as strings and the spin frequency exactly', () => {
    const back = formStateToModel(modelToFormState(MODEL)) as typeof MODEL;
    expect(back.spin.frequency_hz).toBe('716.358712478123456789');
    expect(back.epoch_mjd).toBe('58000.000000000000000000123');
    expect(back.astrometry.pm_dec_mas_per_yr).toBe('0.100000000000000000001');
    expect(back.companions[0].period_days).toBe('41.300000000000000001');
    expect(back.offsets[0].seconds).toBe('0.000001234567890123456789');
    // Short numbers come back as JSON numbers with the same text.
    expect(back.dispersion.dm_pc_per_cm3).toBe(41.27);
    expect(back.companions[0].projected_semimajor_axis_lt_s).toBe(0.00085);
  });

  it('a second round trip changes nothing at all', () => {
    const once = formStateToModel(modelToFormState(MODEL));
    expect(formStateToModel(modelToFormState(once))).toEqual(once);
  });

  it('writes numbers as numbers only when the text reads back identically', () => {
    expect(jsonValueOfText('41.27', false)).toBe(41.27);
    expect(jsonValueOfText('0.0', false)).toBe('0.0'); // 0 would drop the typed ".0"
    expect(jsonValueOfText('1e-21', false)).toBe(1e-21);
    expect(jsonValueOfText('716.358712478123456789', false)).toBe('716.358712478123456789');
    expect(jsonValueOfText('58000.5', true)).toBe('58000.5');
    expect(jsonValueOfText('abc', false)).toBe('abc');
  });

  it('keeps unknown keys and leaves out optional keys the file did not have', () => {
    const model = { ...MODEL, astrometry: { ra_hms: '01:00:00', dec_dms: '+01:00:00', colour: 'red' }, dispersion: undefined, comment: 'x' };
    const back = formStateToModel(modelToFormState(model)) as Record<string, unknown>;
    expect(back.astrometry).toEqual({ ra_hms: '01:00:00', dec_dms: '+01:00:00', colour: 'red' });
    expect(back.dispersion).toBeUndefined();
    expect(back.comment).toBe('x');
  });

  it('writes a blank required value as "" so the server names it', () => {
    const state = modelToFormState(MODEL);
    state.spin.frequency_hz.text = '  ';
    state.companions[0].fields.periastron_epoch_mjd.text = '';
    state.companions[0].fields.eccentricity.text = '';
    const back = formStateToModel(state) as typeof MODEL;
    expect(back.spin.frequency_hz).toBe('');
    expect(back.companions[0].periastron_epoch_mjd).toBe('');
    expect('eccentricity' in back.companions[0]).toBe(false);
  });
});

describe('solve-for switches', () => {
  it('produce the documented paths', () => {
    const state = modelToFormState({ ...MODEL, solve_for: [] });
    state.spin.frequency_derivatives[1].solve = true;
    state.astrometry.parallax_mas.solve = true;
    state.dispersion.dm_pc_per_cm3.solve = true;
    state.companions[0].fields.periastron_epoch_mjd.solve = true;
    state.offsets[0].seconds.solve = true;
    expect(solveForPaths(state)).toEqual([
      'spin.frequency_derivatives[1]',
      'astrometry.parallax_mas',
      'dispersion.dm_pc_per_cm3',
      'companions[b].periastron_epoch_mjd',
      'offsets[wideband-2].seconds',
    ]);
  });

  it('follow a renamed companion and keep paths the form has no switch for', () => {
    const state = modelToFormState(MODEL);
    state.companions[0].name = 'inner';
    expect(solveForPaths(state)).toContain('companions[inner].period_days');
    expect(solveForPaths(state)).not.toContain('companions[b].period_days');
    expect(solveForPaths(state)).toContain('glitches[0].phase_step_turns');
    expect(state.otherSolveFor).toEqual(['glitches[0].phase_step_turns']);
  });

  it('reads paths back into the right switch', () => {
    expect(parseParameterPath('companions[b].period_days')).toEqual({ section: 'companion', name: 'b', key: 'period_days' });
    expect(parseParameterPath('spin.frequency_derivatives[2]')).toEqual({ section: 'frequency_derivatives', index: 2 });
    expect(parseParameterPath('spin.frequency_derivatives[02]')).toBeNull(); // no leading zeros (docs/formats.md §2)
    expect(parseParameterPath('offsets[wideband-2].seconds')).toEqual({ section: 'offset', backend: 'wideband-2' });
    // A path to a derivative that does not exist is kept as it was, not dropped.
    const state = modelToFormState({ ...MODEL, solve_for: ['spin.frequency_derivatives[7]'] });
    expect(state.otherSolveFor).toEqual(['spin.frequency_derivatives[7]']);
  });
});

describe('companion kinds', () => {
  it('a kind switch writes only the new kind’s keys and keeps typed values for switching back', () => {
    const state = modelToFormState(MODEL);
    state.companions[0] = withCompanionKind(state.companions[0], 'damour-deruelle');
    state.companions[0].fields.shapiro_shape.text = '0.99';
    let back = formStateToModel(state) as { companions: Record<string, unknown>[] };
    expect(back.companions[0].kind).toBe('damour-deruelle');
    expect(back.companions[0].shapiro_shape).toBe(0.99);
    state.companions[0] = withCompanionKind(state.companions[0], 'low-eccentricity');
    back = formStateToModel(state) as { companions: Record<string, unknown>[] };
    expect(Object.keys(back.companions[0]).sort()).toEqual(['ascending_node_epoch_mjd', 'enabled', 'kind', 'name', 'period_days', 'projected_semimajor_axis_lt_s'].sort());
    state.companions[0] = withCompanionKind(state.companions[0], 'keplerian');
    back = formStateToModel(state) as { companions: Record<string, unknown>[] };
    expect(back.companions[0].periastron_epoch_mjd).toBe('58010.50000000000000000007');
  });

  it('a new companion takes the first free name', () => {
    expect(newCompanion('keplerian', ['b', 'c']).name).toBe('d');
  });
});

describe('server error paths', () => {
  it('map onto field keys', () => {
    expect(fieldKeyOf(['companions', 0, 'period_days'])).toBe('companions.0.period_days');
    expect(fieldKeyOf(['companions[1].eccentricity'])).toBe('companions.1.eccentricity');
    expect(
      modelFieldErrors([
        { path: ['model', 'spin', 'frequency_hz'], message: 'must be > 0' },
        { path: ['message'], message: 'too long' },
      ]),
    ).toEqual([
      { field: 'spin.frequency_hz', message: 'must be > 0' },
      { field: 'message', message: 'too long' },
    ]);
  });
});
