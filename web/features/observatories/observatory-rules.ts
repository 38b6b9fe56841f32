import { z } from 'zod';
import {
  MAX_GEOCENTRIC_RADIUS_KM,
  MIN_GEOCENTRIC_RADIUS_KM,
  ObservatoryCode,
  observatoryProblems,
  splitMjdText,
} from '../../../api/contracts/observatory';

// The client applies the API's own observatory rules (api/contracts/observatory.ts) before sending:
// code pattern, a point 6350–6400 km from the geocentre, clock points in increasing MJD.
export const MIN_GEOCENTRIC_DISTANCE_KM = MIN_GEOCENTRIC_RADIUS_KM;
export const MAX_GEOCENTRIC_DISTANCE_KM = MAX_GEOCENTRIC_RADIUS_KM;
const METRES_PER_KM = 1000;

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

const metres = (axis: string) => z.number({ error: `ITRF ${axis}: enter a number of metres` });

// The MJD stays text from input to request body, so no digit passes through a float.
export const ClockCorrectionPoint = z.object({
  mjd: z
    .string()
    .trim()
    .refine((v) => splitMjdText(v) !== null, 'MJD: a non-negative decimal such as 60000.5'),
  correction_us: z.number({ error: 'Correction: enter a number of microseconds' }),
});

export const ObservatoryFormValues = z
  .object({
    code: z
      .string()
      .trim()
      .refine((c) => ObservatoryCode.safeParse(c).success, 'Code: 2–16 characters of a–z, 0–9, - or _ (not "ssb" or "geocenter")'),
    name: z.string().trim().min(1, 'Name: enter the observatory name').max(200, 'Name: use at most 200 characters'),
    itrf_x_m: metres('x'),
    itrf_y_m: metres('y'),
    itrf_z_m: metres('z'),
    clock_corrections: z.array(ClockCorrectionPoint),
  })
  .superRefine((values, ctx) => {
    const points = values.clock_corrections.map((p) => ({ mjd: splitMjdText(p.mjd), correction_us: p.correction_us }));
    if (points.some((p) => p.mjd === null)) return; // the per-point check already reported it
    const ordering = observatoryProblems({
      itrf_x_m: values.itrf_x_m,
      itrf_y_m: values.itrf_y_m,
      itrf_z_m: values.itrf_z_m,
      clock_corrections: points.map((p) => ({ mjd: p.mjd!, correction_us: p.correction_us })),
    }).filter((p) => p.path[0] === 'clock_corrections');
    for (const problem of ordering) {
      ctx.addIssue({ code: 'custom', path: problem.path, message: 'MJD: must be later than the point above' });
    }
  });
export type ObservatoryFormValues = z.infer<typeof ObservatoryFormValues>;
