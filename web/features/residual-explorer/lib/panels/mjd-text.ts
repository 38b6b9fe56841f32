const MJD_TEXT = /^(-?)(\d+)(?:\.(\d*))?$/;

/**
 * `mjdText` + `offsetDays` as MJD text with `decimals` fractional digits. The day count is kept as
 * an integer and only the fraction meets floating point, so the result keeps the offset's digits
 * (~1e-10 d for offsets of a few thousand days) whatever the size of the MJD.
 *
 * @param mjdText     an MJD as decimal text, e.g. "58000" or "58000.25"
 * @param offsetDays  days to add (finite)
 * @param decimals    fractional digits of the result, 0–12 (default 9, ≈ 86 µs)
 * @returns           the sum, e.g. "58010.500000000"
 * Throws RangeError for text that is not a plain decimal or a non-finite offset.
 */
export function addDaysToMjdText(mjdText: string, offsetDays: number, decimals = 9): string {
  const match = MJD_TEXT.exec(mjdText.trim());
  if (!match) throw new RangeError(`mjdText: must be a decimal MJD such as 58000.5, got "${mjdText}"`);
  if (!Number.isFinite(offsetDays)) throw new RangeError(`offsetDays: must be finite, got ${offsetDays}`);
  if (!(Number.isInteger(decimals) && decimals >= 0 && decimals <= 12)) throw new RangeError(`decimals: must be an integer 0–12, got ${decimals}`);
  const sign = match[1] === '-' ? -1 : 1;
  let day = sign * Number(match[2]);
  let fraction = sign * Number(`0.${match[3] || '0'}`) + offsetDays;
  const whole = Math.floor(fraction);
  day += whole;
  fraction -= whole;
  const unit = 10 ** decimals;
  let scaled = Math.round(fraction * unit);
  if (scaled >= unit) {
    day += 1;
    scaled -= unit;
  }
  return decimals === 0 ? String(day) : `${day}.${String(scaled).padStart(decimals, '0')}`;
}
