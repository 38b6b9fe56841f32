import { describe, expect, it } from 'vitest';
import reference from '../../fixtures/formats/sexagesimal-reference.json';
import { formatDms, formatHms, parseDms, parseHms } from '../../../worker/timing/model/sexagesimal';
import { expectWithin } from '../time/expect-within';

const ANGLE_TOLERANCE_RAD = 1e-12;

describe('hand-checkable cases (source: the definitions 24 h = 360° = 2π rad, 1° = 3600″)', () => {
  it('12:00:00 is π rad exactly', () => {
    expect(parseHms('12:00:00')).toBe(Math.PI);
  });
  it('06:00:00 is π/2 and 00:00:00 is 0', () => {
    expect(parseHms('06:00:00')).toBe(Math.PI / 2);
    expect(parseHms('00:00:00')).toBe(0);
  });
  it('-00:00:01.0 is −1 arcsec = −π/648000 rad', () => {
    expectWithin(parseDms('-00:00:01.0'), -Math.PI / 648_000, 1e-22, 'dec (rad)');
    expect(parseDms('-00:00:01.0')).toBeLessThan(0);
  });
  it('+90:00:00 and -90:00:00 are ±π/2', () => {
    expect(parseDms('+90:00:00')).toBe(Math.PI / 2);
    expect(parseDms('-90:00:00')).toBe(-Math.PI / 2);
  });
});

describe('negative-zero declinations keep their sign', () => {
  it('-00:30:00 is −0.5°', () => {
    expectWithin(parseDms('-00:30:00'), (-0.5 * Math.PI) / 180, 1e-18, 'dec (rad)');
  });
  it('-00:00:00 is −0 and prints back with a minus sign', () => {
    expect(Object.is(parseDms('-00:00:00'), -0)).toBe(true);
    expect(formatDms(-0)).toBe('-00:00:00');
  });
  it('formats −0.5° as -00:30:00 and reads it back negative', () => {
    const text = formatDms((-0.5 * Math.PI) / 180, 3);
    expect(text).toBe('-00:30:00.000');
    expect(parseDms(text)).toBeLessThan(0);
  });
});

describe('round trips', () => {
  it('shortest text reads back to the identical double (right ascension)', () => {
    for (const text of ['11:01:07.4302', '00:00:00.000001', '23:59:59.9999999', '05:34:31.94']) {
      const rad = parseHms(text);
      const written = formatHms(rad);
      expect(parseHms(written)).toBe(rad);
    }
    let state = 12345;
    for (let i = 0; i < 300; i += 1) {
      state = (state * 1103515245 + 12345) % 2 ** 31;
      const rad = (state / 2 ** 31) * 2 * Math.PI;
      expect(parseHms(formatHms(rad))).toBe(rad);
    }
  });
  it('shortest text reads back to the identical double (declination)', () => {
    let state = 777;
    for (let i = 0; i < 300; i += 1) {
      state = (state * 1103515245 + 12345) % 2 ** 31;
      const rad = (state / 2 ** 31 - 0.5) * Math.PI;
      expect(parseDms(formatDms(rad))).toBe(rad);
    }
  });
  it('keeps the digits a file gave', () => {
    expect(formatHms(parseHms('11:01:07.4302'))).toBe('11:01:07.4302');
    expect(formatDms(parseDms('-44:17:21.880'))).toBe('-44:17:21.88');
  });
  it('carries rounding into minutes and hours, and wraps 24 h to 0', () => {
    expect(formatHms(parseHms('10:59:59.9996'), 3)).toBe('11:00:00.000');
    expect(formatHms(parseHms('23:59:59.9999'), 2)).toBe('00:00:00.00');
    expect(formatHms(-parseHms('01:00:00'), 0)).toBe('23:00:00');
  });
});

describe('rejects malformed and out-of-range text', () => {
  it.each(['24:00:00', '12:60:00', '12:00:60', '12:00', '12h00m00s', '', ' 12:00:00', '-01:00:00'])('right ascension %j', (text) => {
    expect(() => parseHms(text)).toThrow(RangeError);
  });
  it.each(['+90:00:00.1', '91:00:00', '10:60:00', '10:00:60.0', '10:00', '--10:00:00'])('declination %j', (text) => {
    expect(() => parseDms(text)).toThrow(RangeError);
  });
  it('formatDms refuses |angle| > π/2', () => {
    expect(() => formatDms(2)).toThrow(RangeError);
  });
});

describe(`agreement with ${reference.source}`, () => {
  it.each(reference.parse_ra)('parses RA $text ($group)', ({ text, rad }) => {
    expectWithin(parseHms(text), rad, ANGLE_TOLERANCE_RAD, `${text} (rad)`);
  });
  it.each(reference.parse_dec)('parses dec $text ($group)', ({ text, rad }) => {
    expectWithin(parseDms(text), rad, ANGLE_TOLERANCE_RAD, `${text} (rad)`);
  });
  it.each(reference.format_ra)('formats RA $rad rad with $digits decimals', ({ rad, digits, text }) => {
    expect(formatHms(rad, digits)).toBe(text);
  });
  it.each(reference.format_dec)('formats dec $rad rad with $digits decimals', ({ rad, digits, text }) => {
    expect(formatDms(rad, digits)).toBe(text);
  });
});
