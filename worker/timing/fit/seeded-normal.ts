/**
 * A reproducible standard-normal generator for simulations and tests.
 *
 * Uniforms: mulberry32, a 32-bit-state generator (Tommy Ettinger, 2017,
 * public domain; passes the gjrand and PractRand batteries to 2^32 outputs,
 * period 2^32). Two consecutive outputs are joined into one 53-bit uniform in
 * (0, 1), so every double in that grid can occur.
 * Normals: the Marsaglia polar method (Marsaglia & Bray 1964, SIAM Review 6,
 * 260), which turns a pair of uniforms inside the unit disc into two
 * independent N(0, 1) deviates; the second one is cached for the next call.
 *
 * Not for cryptography. The same seed always yields the same sequence on every
 * platform (only 32-bit integer operations and IEEE doubles are used).
 */

/**
 * A function returning independent N(0, 1) deviates, reproducible from `seed`.
 *
 * @param seed  any finite number; its low 32 bits (after truncation) select the sequence
 * @returns     draw(): one standard-normal deviate per call (mean 0, variance 1)
 * Throws RangeError when `seed` is not finite.
 */
export function createSeededNormal(seed: number): () => number {
  if (!Number.isFinite(seed)) throw new RangeError(`createSeededNormal: seed must be finite, got ${seed}`);
  const uniform = createSeededUniform(seed);
  let spare: number | undefined;
  return () => {
    if (spare !== undefined) {
      const z = spare;
      spare = undefined;
      return z;
    }
    let u: number;
    let v: number;
    let s: number;
    do {
      u = 2 * uniform() - 1;
      v = 2 * uniform() - 1;
      s = u * u + v * v;
    } while (s >= 1 || s === 0);
    const factor = Math.sqrt((-2 * Math.log(s)) / s); // polar method: Marsaglia & Bray 1964
    spare = v * factor;
    return u * factor;
  };
}

/**
 * A function returning uniform deviates in the open interval (0, 1) with 53
 * random bits, reproducible from `seed` (module header).
 */
export function createSeededUniform(seed: number): () => number {
  let state = Math.trunc(seed) | 0;
  const next32 = (): number => {
    // mulberry32 (Ettinger 2017): a Weyl step followed by a multiply–xorshift output mix.
    state = (state + 0x6d2b79f5) | 0;
    let t = Math.imul(state ^ (state >>> 15), 1 | state);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return (t ^ (t >>> 14)) >>> 0;
  };
  return () => {
    let x: number;
    do {
      const high = next32() >>> 5; // 27 bits
      const low = next32() >>> 6; // 26 bits
      x = (high * 67108864 + low) / 9007199254740992; // (high·2^26 + low) / 2^53
    } while (x === 0);
    return x;
  };
}
