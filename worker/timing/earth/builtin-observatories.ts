/**
 * The product's built-in observatories (docs/formats.md §3): two fictional
 * sites used by the demo and the command line. Names, codes and clock
 * corrections are invented; the coordinates are physically valid points on
 * the Earth's surface computed from an invented geodetic latitude, longitude
 * and height on the WGS 84 ellipsoid:
 *   x = (N + h)·cos φ·cos λ,  y = (N + h)·cos φ·sin λ,  z = (N·(1 − e²) + h)·sin φ,
 *   N = a / √(1 − e²·sin²φ), a = 6 378 137 m, f = 1/298.257223563
 * (geodetic → geocentric conversion, NIMA TR8350.2 (2000) §4, from memory).
 * ITRF and WGS 84 agree to centimetres, far below anything the demo needs.
 */
import type { Observatory } from './observatory';
import { parseMjd } from '../time/mjd-string';

/**
 * Built-in observatories, keyed by nothing: callers copy them into their own
 * map (loadObservatories). Each call returns fresh objects.
 */
export function builtinObservatories(): Observatory[] {
  return [
    {
      // invented site: φ = +38.4215°, λ = −112.8473°, h = 1720 m → 6371.641 km from the geocentre
      code: 'harrow-ridge',
      name: 'Harrow Ridge Radio Observatory',
      itrfXM: -1_943_260.447,
      itrfYM: -4_612_171.913,
      itrfZM: 3_943_274.984,
      clockCorrections: [],
    },
    {
      // invented site: φ = −38.9126°, λ = −68.3345°, h = 610 m → 6370.352 km from the geocentre
      code: 'cardenal-plateau',
      name: 'Cardenal Plateau Array',
      itrfXM: 1_834_824.441,
      itrfYM: -4_618_803.782,
      itrfZM: -3_985_155.132,
      clockCorrections: [
        // invented maser-to-UTC offsets, microseconds
        { mjd: parseMjd('58000'), correctionUs: 0.42 },
        { mjd: parseMjd('59000'), correctionUs: 0.17 },
        { mjd: parseMjd('60000'), correctionUs: -0.08 },
      ],
    },
  ];
}
