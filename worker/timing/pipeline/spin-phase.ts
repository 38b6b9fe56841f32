/**
 * Rotational phase of the pulsar at an emission time, in double-double, with
 * glitches.
 */
import type { DoubleDouble, Mjd } from '../time/epoch';
import type { Glitch, TimingModel } from '../model/timing-model';
import { mjdDiffSeconds } from '../time/mjd-arithmetic';
import { ddAdd, ddSub, ddTimes, ddTimesNumber } from '../time/double-double-typed';

const SECONDS_PER_DAY = 86_400;

/** Spin parameters with glitch epochs turned into seconds since the model epoch. */
export interface PreparedSpin {
  frequencyHz: DoubleDouble;
  frequencyDerivatives: readonly number[];
  glitches: readonly { offsetS: DoubleDouble; glitch: Glitch }[];
}

/** Prepares the model's spin and glitch parameters for `spinPhase`. */
export function prepareSpin(model: Pick<TimingModel, 'spin' | 'glitches' | 'epochMjd'>): PreparedSpin {
  return {
    frequencyHz: model.spin.frequencyHz,
    frequencyDerivatives: model.spin.frequencyDerivatives,
    glitches: model.glitches.map((glitch) => ({ offsetS: mjdDiffSeconds(glitch.epochMjd, model.epochMjd), glitch })),
  };
}

/** Result of `spinPhase`: phase in turns (hi + lo) and the instantaneous frequency. */
export interface SpinPhaseValue {
  turnsHi: number;
  turnsLo: number;
  frequencyHz: number;
}

/**
 * Spin phase φ(t) = F·dt + Ḟ·dt²/2 + F̈·dt³/6 + … plus glitch terms.
 *
 * @param spin       prepared spin (prepareSpin)
 * @param dtSeconds  emission time − model epoch, seconds TDB, double-double (Note 1)
 * @param out        reused result: phase in turns (turnsHi + turnsLo) and dφ/dt in Hz
 *
 * Notes: 1. docs/formats.md §2 series. F·dt and Ḟ·dt²/2 are formed in double-double (they carry up to
 *           ~10¹¹ turns); the higher terms in double (their size times 1e-16 is far below 1e-9 turn).
 *        2. Glitch at t_g (for t > t_g, τ = decay time): Δφ = Δφ₀ + ΔF·Δt + ΔḞ·Δt²/2 +
 *           ΔF_d·τ·(1 − e^(−Δt/τ)) (Edwards, Hobbs & Manchester 2006, MNRAS 372, 1549, glitch model).
 * Accuracy: ≲ 1e-12 turn from the series for |dt| ≤ 10⁹ s, F ≤ 1 kHz.
 * References: Lorimer & Kramer 2005, Handbook of Pulsar Astronomy, ch. 8; Edwards et al. 2006.
 */
export function spinPhase(spin: PreparedSpin, dtSeconds: DoubleDouble, out: SpinPhaseValue): SpinPhaseValue {
  const dt = dtSeconds[1] + dtSeconds[0];
  let phase = ddTimes(spin.frequencyHz, dtSeconds); // F·dt
  let frequency = spin.frequencyHz[1] + spin.frequencyHz[0];
  const derivatives = spin.frequencyDerivatives;
  if (derivatives.length > 0) {
    const dtSquared = ddTimes(dtSeconds, dtSeconds);
    phase = ddAdd(phase, ddTimesNumber(dtSquared, 0.5 * derivatives[0])); // Ḟ·dt²/2
    frequency += derivatives[0] * dt;
    let higherPhase = 0;
    let power = (dt * dt) / 2; // dt^(k+1)/(k+1)!
    for (let k = 1; k < derivatives.length; k += 1) {
      frequency += derivatives[k] * power; // dφ/dt term: F^(k)·dt^(k+1)/(k+1)!
      power *= dt / (k + 2);
      higherPhase += derivatives[k] * power; // F^(k)·dt^(k+2)/(k+2)!
    }
    phase = ddAddScalar(phase, higherPhase);
  }
  let glitchPhase = 0;
  for (const { offsetS, glitch } of spin.glitches) {
    const sinceS = ddSub(dtSeconds, offsetS);
    const since = sinceS[1] + sinceS[0];
    if (since <= 0) continue;
    const tauS = glitch.decayTimeDays * SECONDS_PER_DAY;
    const decay = tauS > 0 ? Math.exp(-since / tauS) : 0;
    glitchPhase +=
      glitch.phaseStepTurns +
      glitch.frequencyStepHz * since +
      0.5 * glitch.frequencyDerivativeStepHzPerS * since * since +
      (tauS > 0 ? glitch.decayingFrequencyStepHz * tauS * (1 - decay) : 0); // Note 2: Edwards et al. 2006
    frequency += glitch.frequencyStepHz + glitch.frequencyDerivativeStepHzPerS * since + glitch.decayingFrequencyStepHz * decay;
  }
  phase = ddAddScalar(phase, glitchPhase);
  out.turnsHi = phase[1];
  out.turnsLo = phase[0];
  out.frequencyHz = frequency;
  return out;
}

function ddAddScalar(x: DoubleDouble, y: number): DoubleDouble {
  return y === 0 ? x : ddAdd(x, [0, y]);
}

/** Spin phase at an emission instant (convenience wrapper; seconds from the model epoch in TDB). */
export function spinPhaseAtMjd(spin: PreparedSpin, epochMjd: Mjd, emissionTdb: Mjd): SpinPhaseValue {
  return spinPhase(spin, mjdDiffSeconds(emissionTdb, epochMjd), { turnsHi: 0, turnsLo: 0, frequencyHz: 0 });
}
