import { z } from 'zod';

// Client-side checks for an observatory, the same rules the API applies to POST/PATCH
// /api/observatories (its schema is the engine's observatory reader, which the client does not
// bundle): code 2–16 of a-z 0-9 - _ and not reserved, name up to 120 characters, a point
// 6350–6400 km from the geocentre, clock points in strictly increasing MJD.
export const MIN_GEOCENTRIC_DISTANCE_KM = 6350;
export const MAX_GEOCENTRIC_DISTANCE_KM = 6400;
const METRES_PER_KM = 1000;

export const OBSERVATORY_CODE_PATTERN = /^[a-z0-9_-]{2,16}$/;
export const RESERVED_OBSERVATORY_CODES: ReadonlySet<string> = new Set(['ssb', 'geocenter']);

// A plain non-negative decimal MJD; the API keeps up to 28 fractional digits.
const MJD_TEXT = /^(\d{1,7})(?:\.(\d{1,28}))?$/;

/** Distance of an ITRF point (metres) from the geocentre, in km: the Euclidean norm √(x²+y²+z²). */
export function geocentricDistanceKm(xM: number, yM: number, zM: number): number {
  return Math.hypot(xM, yM, zM) / METRES_PER_KM;
}

/** Null when the point lies in the allowed shell, else a message that shows the distance found. */
export function geocentricDistanceProblem(xM: number, yM: number, zM: number): string | null {
  const distanceKm = geocentricDistanceKm(xM, yM, zM);
  if (distanceKm >= MIN_GEOCENTRIC_DISTANCE_KM && distanceKm <= MAX_GEOCENTRIC_DISTANCE_KM) return null;
  return (
    `This point is ${distanceKm.toFixed(1)} km from the geocentre; an observatory must lie ` +
    `${MIN_GEOCENTRIC_DISTANCE_KM}–${MAX_GEOCENTRIC_DISTANCE_KM} km from it. Check the ITRF x, y, z (in metres).`
  );
}

/**
 * Orders two decimal MJD strings exactly (integer day first, then the fraction's digits),
 * never through a float. Both must match the MJD text pattern. Returns <0, 0 or >0.
 */
export function compareMjdText(a: string, b: string): number {
  const [, dayA, fracA = ''] = MJD_TEXT.exec(a.trim()) ?? [];
  const [, dayB, fracB = ''] = MJD_TEXT.exec(b.trim()) ?? [];
  if (Number(dayA) !== Number(dayB)) return Number(dayA) - Number(dayB);
  const width = Math.max(fracA.length, fracB.length);
  const [fa, fb] = [fracA.padEnd(width, '0'), fracB.padEnd(width, '0')];
  return fa < fb ? -1 : fa > fb ? 1 : 0;
}

const metres = (axis: string) => z.number({ error: `ITRF ${axis}: enter a number of metres` });

// The MJD stays text from input to request body, so no digit passes through a float.
export const ClockCorrectionPoint = z.object({
  mjd: z.string().trim().regex(MJD_TEXT, 'MJD: a non-negative decimal such as 60000.5'),
  correction_us: z.number({ error: 'Correction: enter a number of microseconds' }),
});

export const ObservatoryFormValues = z
  .object({
    code: z
      .string()
      .trim()
      .regex(OBSERVATORY_CODE_PATTERN, 'Code: 2–16 characters of a–z, 0–9, - or _')
      .refine((c) => !RESERVED_OBSERVATORY_CODES.has(c), 'Code: "ssb" and "geocenter" are reserved'),
    name: z.string().trim().min(1, 'Name: enter the observatory name').max(120, 'Name: use at most 120 characters'),
    itrf_x_m: metres('x'),
    itrf_y_m: metres('y'),
    itrf_z_m: metres('z'),
    clock_corrections: z.array(ClockCorrectionPoint),
  })
  .superRefine(({ clock_corrections: points }, ctx) => {
    if (points.some((p) => !MJD_TEXT.test(p.mjd.trim()))) return; // the per-point check reports those
    for (let i = 1; i < points.length; i++) {
      if (compareMjdText(points[i - 1].mjd, points[i].mjd) >= 0) {
        ctx.addIssue({ code: 'custom', path: ['clock_corrections', i, 'mjd'], message: 'MJD: must be later than the point above' });
      }
    }
  });
export type ObservatoryFormValues = z.infer<typeof ObservatoryFormValues>;
