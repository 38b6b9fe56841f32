/**
 * The zod schema of the timing-model file (docs/formats.md §2), key by key.
 * Objects are strict: an unknown key is an error naming its full path. The
 * schema's output is still file-shaped (snake_case keys) but with numbers,
 * double-doubles, `Mjd`s and radians in place of text; read-model-file.ts maps
 * it onto `TimingModel` and runs the checks that span several keys.
 */
import { z } from 'zod';
import { doubleDoubleField, mjdField, numberField, parsedTextField, textField } from './model-file-fields';
import { parseDms, parseHms } from './sexagesimal';

export const MODEL_FORMAT_TAG = 'pulsekeeper-model/1';
/** Companion names and offset/noise backends appear inside `[...]` in parameter paths. */
const PATH_NAME = /^[^\s[\]]{1,64}$/;
const PATH_NAME_RULE = 'must be 1–64 characters without spaces or square brackets';

const enabledField = z.boolean({ error: 'expected true or false' }).default(true);
const companionName = textField(PATH_NAME, PATH_NAME_RULE);
const eccentricity = numberField({ min: 0, below: 1 });

/** Keys after `enabled` shared by the Keplerian orbit and the orbit with Shapiro and Einstein terms. */
const keplerianOrbitKeys = {
  period_days: numberField({ above: 0 }),
  projected_semimajor_axis_lt_s: numberField(),
  eccentricity: eccentricity.default(0),
  periastron_longitude_deg: numberField().default(0),
  periastron_epoch_mjd: mjdField(),
  period_derivative: numberField().default(0),
  periastron_advance_deg_per_yr: numberField().default(0),
  einstein_delay_s: numberField().default(0),
};

const keplerianFile = z.strictObject({
  name: companionName,
  kind: z.literal('keplerian'),
  enabled: enabledField,
  ...keplerianOrbitKeys,
});

const lowEccentricityFile = z
  .strictObject({
    name: companionName,
    kind: z.literal('low-eccentricity'),
    enabled: enabledField,
    period_days: numberField({ above: 0 }),
    projected_semimajor_axis_lt_s: numberField(),
    ascending_node_epoch_mjd: mjdField(),
    e_sin_omega: numberField({ above: -1, below: 1 }).default(0),
    e_cos_omega: numberField({ above: -1, below: 1 }).default(0),
    period_derivative: numberField().default(0),
  })
  .superRefine((value, ctx) => {
    const e = Math.hypot(value.e_sin_omega, value.e_cos_omega);
    if (!(e < 1)) {
      ctx.addIssue({ code: 'custom', path: ['e_sin_omega'], message: `eccentricity √(e_sin_omega² + e_cos_omega²) = ${e} must be < 1` });
    }
  });

const damourDeruelleFile = z.strictObject({
  name: companionName,
  kind: z.literal('damour-deruelle'),
  enabled: enabledField,
  ...keplerianOrbitKeys,
  shapiro_range_s: numberField({ min: 0 }).default(0),
  shapiro_shape: numberField({ min: -1, max: 1 }).default(0),
});

export const companionFileSchema = z.discriminatedUnion('kind', [keplerianFile, lowEccentricityFile, damourDeruelleFile]);

const glitchFile = z.strictObject({
  epoch_mjd: mjdField(),
  phase_step_turns: numberField().default(0),
  frequency_step_hz: numberField().default(0),
  frequency_derivative_step_hz_per_s: numberField().default(0),
  decaying_frequency_step_hz: numberField().default(0),
  decay_time_days: numberField({ min: 0 }).default(0),
});

const offsetFile = z.strictObject({
  backend: textField(PATH_NAME, PATH_NAME_RULE),
  seconds: numberField().default(0),
});

const noiseFile = z.strictObject({
  backend: textField(PATH_NAME, PATH_NAME_RULE),
  uncertainty_scale: numberField({ above: 0 }).default(1),
  added_jitter_us: numberField({ min: 0 }).default(0),
});

const list = <T extends z.ZodType>(item: T) => z.array(item, { error: 'expected an array' }).default([]);

export const modelFileSchema = z.strictObject({
  format: z.literal(MODEL_FORMAT_TAG, { error: `must be "${MODEL_FORMAT_TAG}"` }),
  pulsar: textField(/^\S(?:.{0,62}\S)?$/, 'must be 1–64 characters without leading or trailing spaces'),
  epoch_mjd: mjdField(),
  spin: z.strictObject({
    frequency_hz: doubleDoubleField({ above: 0 }),
    frequency_derivatives: list(numberField()),
  }),
  astrometry: z.strictObject({
    ra_hms: parsedTextField(parseHms),
    dec_dms: parsedTextField(parseDms),
    pm_ra_cosdec_mas_per_yr: numberField().default(0),
    pm_dec_mas_per_yr: numberField().default(0),
    parallax_mas: numberField().default(0),
  }),
  dispersion: z
    .strictObject({
      dm_pc_per_cm3: numberField().default(0),
      dm_derivatives: list(numberField()),
    })
    .default({ dm_pc_per_cm3: 0, dm_derivatives: [] }),
  companions: list(companionFileSchema),
  offsets: list(offsetFile),
  noise: list(noiseFile),
  glitches: list(glitchFile),
  solve_for: list(z.string({ error: 'expected a parameter path string' })),
});

export type ModelFile = z.output<typeof modelFileSchema>;
export type CompanionFile = z.output<typeof companionFileSchema>;
