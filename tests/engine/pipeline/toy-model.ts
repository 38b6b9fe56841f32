/** An invented millisecond pulsar with a companion, for pipeline tests. */
import type { TimingModel } from '../../../worker/timing/model/timing-model';
import { parseMjd } from '../../../worker/timing/time/mjd-string';

export function toyModel(overrides: Partial<TimingModel> = {}): TimingModel {
  return {
    pulsar: 'J0000+0000-test',
    epochMjd: parseMjd('58500'),
    spin: { frequencyHz: [1.3e-14, 346.531996491274], frequencyDerivatives: [-1.2e-15, 0] },
    astrometry: { raRad: 1.91, decRad: 0.31, pmRaCosDecMasPerYr: -4.2, pmDecMasPerYr: 7.5, parallaxMas: 0.8 },
    dispersion: { dmPcPerCm3: 21.7, dmDerivatives: [1e-3] },
    companions: [
      {
        kind: 'keplerian', name: 'b', enabled: true, periodDays: 5.741, projectedSemimajorAxisLtS: 3.366, eccentricity: 0.0438,
        periastronLongitudeDeg: 112.3, periastronEpochMjd: parseMjd('58501.372'), periodDerivative: 0,
        periastronAdvanceDegPerYr: 0, einsteinDelayS: 0,
      },
    ],
    offsets: [],
    noise: [],
    glitches: [],
    solveFor: [],
    ...overrides,
  };
}
