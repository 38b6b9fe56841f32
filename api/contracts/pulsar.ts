/** Pulsar input as the API accepts it, shared with the web client's forms. */
import { z } from 'zod';

export const PulsarName = z.string().regex(/^[A-Za-z0-9+_-]{1,32}$/, 'must be 1–32 characters of letters, digits, + - _');

const RA = /^(\d{1,2}):(\d{2}):(\d{2})(\.\d{1,12})?$/;
const DEC = /^([+-]?)(\d{1,2}):(\d{2}):(\d{2})(\.\d{1,12})?$/;

/** Right ascension "hh:mm:ss[.s…]" with 0 ≤ h < 24, minutes and seconds < 60. */
export function isRaHms(text: string): boolean {
  const m = RA.exec(text);
  return m !== null && Number(m[1]) < 24 && Number(m[2]) < 60 && Number(m[3]) < 60;
}

/** Declination "±dd:mm:ss[.s…]" within ±90°, minutes and seconds < 60. */
export function isDecDms(text: string): boolean {
  const m = DEC.exec(text);
  if (!m) return false;
  const [deg, min, sec] = [Number(m[2]), Number(m[3]), Number(`${m[4]}${m[5] ?? ''}`)];
  if (min >= 60 || sec >= 60) return false;
  return deg < 90 || (deg === 90 && min === 0 && sec === 0);
}

export const RaHms = z.string().refine(isRaHms, 'must be hh:mm:ss[.s…] with 0 ≤ hh < 24 (e.g. 04:12:37.25)');
export const DecDms = z.string().refine(isDecDms, 'must be ±dd:mm:ss[.s…] within ±90° (e.g. +27:33:12.4)');

export const CreatePulsarBody = z.strictObject({ name: PulsarName, raHms: RaHms, decDms: DecDms });
export type CreatePulsarBody = z.infer<typeof CreatePulsarBody>;
