/**
 * Generalized (floating-mean, weighted) Lomb–Scargle power at one frequency
 * from the weighted trigonometric sums.
 *
 * @param s  weighted sums at angular frequency ω (weights summing to 1,
 *           y taken about its weighted mean, Note 1):
 *           c = Σw cos ωt, s = Σw sin ωt, yc = Σw y cos ωt, ys = Σw y sin ωt,
 *           c2 = Σw cos 2ωt, s2 = Σw sin 2ωt; spreadYY = Σw y²
 * @returns  normalised power p ∈ [0, 1]; 0 when the data are constant (Note 2)
 *
 * Notes: 1. With y about its weighted mean, Y = 0, so YC = yc and YS = ys.
 * 2. Constant data (YY = 0) carry no periodic signal; power 0 by definition.
 *    A degenerate frequency (D = 0, e.g. all phases equal) also gives 0.
 * Accuracy: limited by the cancellation in CC = Σw cos² − C² when ω·span ≪ 1;
 *   relative error ~1e-16/(ω·span)² there.
 * References: Zechmeister & Kürster 2009, A&A 496, 577, eqs. 5, 8–15.
 */
export interface WeightedTrigSums {
  c: number; s: number; yc: number; ys: number; c2: number; s2: number; spreadYY: number;
}

export function generalizedPowerFromSums(sums: WeightedTrigSums): number {
  const { c, s, yc, ys, c2, s2, spreadYY } = sums;
  if (!(spreadYY > 0)) return 0;
  const cc = 0.5 * (1 + c2) - c * c; // CC = Σw cos² − C², cos² = (1 + cos 2ωt)/2: Zechmeister & Kürster 2009, eq. 13
  const ss = 0.5 * (1 - c2) - s * s; // SS = Σw sin² − S²: Zechmeister & Kürster 2009, eq. 14
  const cs = 0.5 * s2 - c * s; // CS = Σw cos sin − C·S: Zechmeister & Kürster 2009, eq. 15
  const d = cc * ss - cs * cs; // D = CC·SS − CS²: Zechmeister & Kürster 2009, eq. 6
  if (!(d > 0)) return 0;
  const p = (ss * yc * yc + cc * ys * ys - 2 * cs * yc * ys) / (spreadYY * d); // Zechmeister & Kürster 2009, eq. 5
  return Math.min(1, Math.max(0, p));
}
