/**
 * Root of a continuous function on a bracket [lo, hi] where it changes sign, by bisection.
 *
 * @param fn   the function; fn(lo) and fn(hi) must have opposite signs (or one is 0)
 * @param lo   lower end of the bracket
 * @param hi   upper end of the bracket (> lo)
 * @returns    x with the bracket shrunk to adjacent doubles (or fn(x) = 0)
 *
 * Notes: 1. Bisection is chosen for robustness: it cannot leave the bracket and needs
 *           at most ~1100 halvings to reach adjacent doubles (≈ 60 for brackets within
 *           one binade, as used here). Speed does not matter for the few calls made.
 * Accuracy: the root to the last bit of its bracket, for a monotonic fn.
 * References: Press et al. 2007, Numerical Recipes, 3rd ed., §9.1 (bisection).
 */
export function bracketedRoot(fn: (x: number) => number, lo: number, hi: number): number {
  if (!(hi > lo)) throw new RangeError(`hi: must be > lo (${lo}), got ${hi}`);
  let fLo = fn(lo);
  const fHi = fn(hi);
  if (fLo === 0) return lo;
  if (fHi === 0) return hi;
  if (Math.sign(fLo) === Math.sign(fHi) || Number.isNaN(fLo) || Number.isNaN(fHi)) {
    throw new RangeError(`lo, hi: fn must change sign on [${lo}, ${hi}], got ${fLo} and ${fHi}`);
  }
  for (let i = 0; i < 2000; i++) {
    const mid = lo + (hi - lo) / 2;
    if (mid <= lo || mid >= hi) break; // adjacent doubles: nothing left to halve
    const fMid = fn(mid);
    if (fMid === 0) return mid;
    if (Math.sign(fMid) === Math.sign(fLo)) {
      lo = mid;
      fLo = fMid;
    } else {
      hi = mid;
    }
  }
  return Math.abs(fLo) <= Math.abs(fn(hi)) ? lo : hi;
}
