import { describe, expect, it } from 'vitest';
import { bindErfaLibrary, erfaLibrary } from '../../../worker/timing/erfa/erfa-library';

describe('ERFA binding', () => {
  it('says how to install liberfa when the library is missing', () => {
    expect(() => bindErfaLibrary('/nonexistent/liberfa.so.1')).toThrow('liberfa1 not installed: apt-get install liberfa1');
  });

  it('is loaded once', () => {
    expect(erfaLibrary()).toBe(erfaLibrary());
  });

  // Source: ERFA test suite t_cal2jd / t_jd2cal: eraCal2jd(2003, 6, 1) → 2400000.5 + 52791; eraJd2cal(2400000.5, 50123.9999) → 1996-02-10, fd 0.9999.
  it('converts calendar dates both ways as ERFA’s own tests do', () => {
    const djm0 = new Float64Array(1);
    const djm = new Float64Array(1);
    expect(erfaLibrary().eraCal2jd(2003, 6, 1, djm0, djm)).toBe(0);
    expect([djm0[0], djm[0]]).toEqual([2400000.5, 52791]);
    const iy = new Int32Array(1);
    const im = new Int32Array(1);
    const id = new Int32Array(1);
    const fd = new Float64Array(1);
    expect(erfaLibrary().eraJd2cal(2400000.5, 50123.9999, iy, im, id, fd)).toBe(0);
    expect([iy[0], im[0], id[0]]).toEqual([1996, 2, 10]);
    expect(fd[0]).toBeCloseTo(0.9999, 7);
  });
});
