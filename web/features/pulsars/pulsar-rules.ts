import { z } from 'zod';

// Client-side checks for a new pulsar, the same rules the API applies to POST /api/pulsars
// (its body schema in api/). The server stays the authority; its field errors land on the same fields.
export const PULSAR_NAME_PATTERN = /^[A-Za-z0-9+_-]{1,32}$/;
const RA_HMS = /^(\d{1,2}):(\d{2}):(\d{2})(\.\d{1,12})?$/;
const DEC_DMS = /^([+-]?)(\d{1,2}):(\d{2}):(\d{2})(\.\d{1,12})?$/;

/** Right ascension "hh:mm:ss[.s…]" with 0 ≤ hh < 24 and minutes, seconds < 60. */
export function isRaHms(text: string): boolean {
  const m = RA_HMS.exec(text);
  return m !== null && Number(m[1]) < 24 && Number(m[2]) < 60 && Number(m[3]) < 60;
}

/** Declination "±dd:mm:ss[.s…]" within ±90° (exactly 90:00:00 at a pole) and minutes, seconds < 60. */
export function isDecDms(text: string): boolean {
  const m = DEC_DMS.exec(text);
  if (!m) return false;
  const degrees = Number(m[2]);
  const minutes = Number(m[3]);
  const seconds = Number(`${m[4]}${m[5] ?? ''}`);
  if (minutes >= 60 || seconds >= 60) return false;
  return degrees < 90 || (degrees === 90 && minutes === 0 && seconds === 0);
}

export const CreatePulsarBody = z.object({
  name: z.string().trim().regex(PULSAR_NAME_PATTERN, 'Name: 1–32 letters, digits or + - _ (for example J1101-4417)'),
  raHms: z
    .string()
    .trim()
    .refine(isRaHms, 'Right ascension: use hh:mm:ss.s with hours 0–23, minutes and seconds below 60 (for example 11:01:07.43)'),
  decDms: z
    .string()
    .trim()
    .refine(isDecDms, 'Declination: use ±dd:mm:ss with degrees from −90 to +90, minutes and seconds below 60 (for example -44:17:21.9)'),
});
export type CreatePulsarBody = z.infer<typeof CreatePulsarBody>;
