/**
 * Where each body's coefficients sit in a DE405 32-day record, as listed by the
 * table's `x` column keyword `Description` (JPL's pointer table for DE405,
 * group 1050 of the ephemeris header; Standish 1998, JPL IOM 312.F-98-048).
 * Offsets are 1-based in the full JPL record, which begins with two dates that
 * the casacore table leaves out, so the index into a table row is offset − 3.
 * Checked against python-casacore in tests/engine/ephemeris/casacore-table-reader.test.ts.
 */
export const DE405_COEFFICIENTS_PER_ROW = 1018;
export const DE405_DAYS_PER_ROW = 32;

export interface BodyLayout {
  /** 1-based offset in the full JPL record. */
  recordOffset: number;
  coefficientsPerComponent: number;
  subIntervals: number;
}

// Order of the pointer table: Mercury, Venus, Earth–Moon barycentre, Mars, Jupiter,
// Saturn, Uranus, Neptune, Pluto, Moon (geocentric), Sun, nutations, librations.
export const DE405_POINTER_TABLE: readonly number[] = [
  3, 171, 231, 309, 342, 366, 387, 405, 423, 441, 753, 819, 899,
  14, 10, 13, 11, 8, 7, 6, 6, 6, 13, 11, 10, 10,
  4, 2, 2, 1, 1, 1, 1, 1, 1, 8, 2, 4, 4,
];

export const DE405_BODY_INDEX = {
  mercury: 0,
  venus: 1,
  'earth-moon-barycentre': 2,
  mars: 3,
  jupiter: 4,
  saturn: 5,
  uranus: 6,
  neptune: 7,
  pluto: 8,
  'moon-geocentric': 9,
  sun: 10,
} as const;

/** Layout of body `index` (an entry of DE405_BODY_INDEX). */
export function de405BodyLayout(index: number): BodyLayout {
  return {
    recordOffset: DE405_POINTER_TABLE[index],
    coefficientsPerComponent: DE405_POINTER_TABLE[13 + index],
    subIntervals: DE405_POINTER_TABLE[26 + index],
  };
}
