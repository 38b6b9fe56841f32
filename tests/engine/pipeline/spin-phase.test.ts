import { describe, expect, it } from 'vitest';
import { prepareSpin, spinPhase, spinPhaseAtMjd } from '../../../worker/timing/pipeline/spin-phase';
import { mjdFromParts } from '../../../worker/timing/time/mjd-arithmetic';
import { parseMjd } from '../../../worker/timing/time/mjd-string';
import Decimal from 'decimal.js';
import type { Glitch } from '../../../worker/timing/model/timing-model';
import type { DoubleDouble } from '../../../worker/timing/time/epoch';

const epoch = mjdFromParts(58000, 0);

/** The exact value of a double as a Decimal (Decimal(number) would go through the shortest decimal string). */
function exactDecimal(x: number): Decimal {
  let scaled = Math.abs(x);
  let exponent = 0;
  while (!Number.isInteger(scaled)) {
    scaled *= 2; // exact
    exponent -= 1;
  }
  return new Decimal(BigInt(scaled).toString()).times(new Decimal(2).pow(exponent)).times(Math.sign(x) || 1);
}
function spinModel(frequency: DoubleDouble, derivatives: number[], glitches: Glitch[] = []) {
  return { epochMjd: epoch, spin: { frequencyHz: frequency, frequencyDerivatives: derivatives }, glitches };
}

describe('spin phase', () => {
  it('matches a 40-digit decimal evaluation of the series over 30 years (to 1e-12 turn)', () => {
    Decimal.set({ precision: 50 });
    const fHi = 716.358123456789;
    const f: DoubleDouble = [1.234e-14, fHi];
    const derivs = [-1.3e-15, 2e-26, -3e-36];
    const spin = prepareSpin(spinModel(f, derivs));
    const dt: DoubleDouble = [3.1e-8, 9.4e8 + 0.123456789];
    const got = spinPhase(spin, dt, { turnsHi: 0, turnsLo: 0, frequencyHz: 0 });
    const D = exactDecimal;
    const t = D(dt[1]).plus(D(dt[0]));
    const F = D(f[1]).plus(D(f[0]));
    const want = F.times(t)
      .plus(D(derivs[0]).times(t.pow(2)).div(2))
      .plus(D(derivs[1]).times(t.pow(3)).div(6))
      .plus(D(derivs[2]).times(t.pow(4)).div(24));
    const err = D(got.turnsHi).plus(D(got.turnsLo)).minus(want).abs().toNumber();
    expect(err).toBeLessThan(1e-12);
    const wantFreq = F.plus(D(derivs[0]).times(t)).plus(D(derivs[1]).times(t.pow(2)).div(2)).plus(D(derivs[2]).times(t.pow(3)).div(6));
    expect(Math.abs(got.frequencyHz - wantFreq.toNumber())).toBeLessThan(1e-12);
  });
  it('glitch adds phase, frequency and decaying terms only after its epoch', () => {
    const glitch: Glitch = {
      epochMjd: parseMjd('58100'), phaseStepTurns: 0.1, frequencyStepHz: 1e-6, frequencyDerivativeStepHzPerS: -1e-14,
      decayingFrequencyStepHz: 2e-7, decayTimeDays: 50,
    };
    const plain = prepareSpin(spinModel([0, 10], []));
    const glitched = prepareSpin(spinModel([0, 10], [], [glitch]));
    const before = parseMjd('58099.5');
    expect(spinPhaseAtMjd(glitched, epoch, before).turnsHi).toBe(spinPhaseAtMjd(plain, epoch, before).turnsHi);
    const after = parseMjd('58130');
    const sinceS = 30 * 86400;
    const tau = 50 * 86400;
    const want = 0.1 + 1e-6 * sinceS + 0.5 * -1e-14 * sinceS ** 2 + 2e-7 * tau * (1 - Math.exp(-sinceS / tau));
    const a = spinPhaseAtMjd(glitched, epoch, after);
    const b = spinPhaseAtMjd(plain, epoch, after);
    expect(Math.abs(a.turnsHi - b.turnsHi + (a.turnsLo - b.turnsLo) - want)).toBeLessThan(1e-9);
    const wantF = 1e-6 - 1e-14 * sinceS + 2e-7 * Math.exp(-sinceS / tau);
    expect(Math.abs(a.frequencyHz - b.frequencyHz - wantF)).toBeLessThan(1e-15);
  });
});
