import { MODEL_FORMAT } from './model-form-state';

/** A starting model for a pulsar with no revision yet: the required keys, values left for the user. */
export function blankModel(pulsarName: string, raHms = '', decDms = ''): Record<string, unknown> {
  return {
    format: MODEL_FORMAT,
    pulsar: pulsarName,
    epoch_mjd: '',
    spin: { frequency_hz: '', frequency_derivatives: [] },
    astrometry: { ra_hms: raHms, dec_dms: decDms },
    companions: [],
    offsets: [],
    noise: [],
    glitches: [],
    solve_for: [],
  };
}
