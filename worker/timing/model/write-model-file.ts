/**
 * `TimingModel` → the JSON object of the model file (docs/formats.md §2).
 *
 * High-precision values are written as decimal strings that read back to the
 * identical value: the spin frequency with the fewest significant digits that
 * round-trip through the reader (≤ 34 for any double-double in practice),
 * epochs with the fewest fractional digits that parseMjd reads back to the
 * identical `Mjd` (≤ 40; formatMjdRoundTrip Note 1), right ascension and declination with the fewest
 * decimals that parse back to the identical double. Ordinary float64 fields
 * are JSON numbers (JSON numbers round-trip doubles exactly).
 */
import type { Mjd } from '../time/epoch';
import { formatMjd, parseMjd } from '../time/mjd-string';
import type { Companion, TimingModel } from './timing-model';
import { MODEL_FORMAT_TAG } from './model-file-schema';
import { formatDoubleDouble } from './decimal-double-double';
import { formatDms, formatHms } from './sexagesimal';

const MAX_MJD_FRACTION_DIGITS = 40;

function sameMjd(a: Mjd, b: Mjd): boolean {
  return a.day === b.day && a.frac[0] === b.frac[0] && a.frac[1] === b.frac[1];
}

/**
 * Decimal text of an epoch with the fewest fractional digits that parseMjd reads
 * back to the identical day and fraction (Note 1).
 *
 * Notes: 1. parseMjd reads the fraction correctly rounded, so epochs that came
 *           from decimal text, and any double-double fraction (say, after a fit)
 *           of at least ~1e-3 day, read back bit for bit within 40 digits
 *           (tests/engine/model/write-model-file.test.ts). A fraction within a few
 *           seconds of midnight carries more significant digits than 40 decimals
 *           hold; the 40-digit text is then written, which reads back within
 *           ~1e-40 day.
 */
export function formatMjdRoundTrip(m: Mjd): string {
  for (let digits = 0; digits < MAX_MJD_FRACTION_DIGITS; digits += 1) {
    const text = formatMjd(m, digits);
    if (sameMjd(parseMjd(text), m)) return text;
  }
  return formatMjd(m, MAX_MJD_FRACTION_DIGITS);
}

function companionToFile(c: Companion): Record<string, unknown> {
  const head = {
    name: c.name,
    kind: c.kind,
    enabled: c.enabled,
    period_days: c.periodDays,
    projected_semimajor_axis_lt_s: c.projectedSemimajorAxisLtS,
  };
  if (c.kind === 'low-eccentricity') {
    return {
      ...head,
      ascending_node_epoch_mjd: formatMjdRoundTrip(c.ascendingNodeEpochMjd),
      e_sin_omega: c.eSinOmega,
      e_cos_omega: c.eCosOmega,
      period_derivative: c.periodDerivative,
    };
  }
  const eccentric = {
    ...head,
    eccentricity: c.eccentricity,
    periastron_longitude_deg: c.periastronLongitudeDeg,
    periastron_epoch_mjd: formatMjdRoundTrip(c.periastronEpochMjd),
    period_derivative: c.periodDerivative,
    periastron_advance_deg_per_yr: c.periastronAdvanceDegPerYr,
    einstein_delay_s: c.einsteinDelayS,
  };
  if (c.kind === 'keplerian') return eccentric;
  return { ...eccentric, shapiro_range_s: c.shapiroRangeS, shapiro_shape: c.shapiroShape };
}

/**
 * The model as a model-file JSON object (ready for JSON.stringify).
 *
 * @param model  a model as readModelFile returns it (declination within ±π/2)
 * @returns      every key written, defaults included; readModelFile of the result
 *               deep-equals `model`
 */
export function writeModelFile(model: TimingModel): Record<string, unknown> {
  return {
    format: MODEL_FORMAT_TAG,
    pulsar: model.pulsar,
    epoch_mjd: formatMjdRoundTrip(model.epochMjd),
    spin: {
      frequency_hz: formatDoubleDouble(model.spin.frequencyHz),
      frequency_derivatives: [...model.spin.frequencyDerivatives],
    },
    astrometry: {
      ra_hms: formatHms(model.astrometry.raRad),
      dec_dms: formatDms(model.astrometry.decRad),
      pm_ra_cosdec_mas_per_yr: model.astrometry.pmRaCosDecMasPerYr,
      pm_dec_mas_per_yr: model.astrometry.pmDecMasPerYr,
      parallax_mas: model.astrometry.parallaxMas,
    },
    dispersion: { dm_pc_per_cm3: model.dispersion.dmPcPerCm3, dm_derivatives: [...model.dispersion.dmDerivatives] },
    companions: model.companions.map(companionToFile),
    offsets: model.offsets.map((o) => ({ backend: o.backend, seconds: o.seconds })),
    noise: model.noise.map((n) => ({ backend: n.backend, uncertainty_scale: n.uncertaintyScale, added_jitter_us: n.addedJitterUs })),
    glitches: model.glitches.map((g) => ({
      epoch_mjd: formatMjdRoundTrip(g.epochMjd),
      phase_step_turns: g.phaseStepTurns,
      frequency_step_hz: g.frequencyStepHz,
      frequency_derivative_step_hz_per_s: g.frequencyDerivativeStepHzPerS,
      decaying_frequency_step_hz: g.decayingFrequencyStepHz,
      decay_time_days: g.decayTimeDays,
    })),
    solve_for: [...model.solveFor],
  };
}
