/**
 * Writing arrival times in the product's CSV format (docs/formats.md §1), the
 * inverse of readToaCsv: reading the output gives back the same arrival times,
 * with each MJD equal to the printed digits (Note 1).
 */
import type { Toa } from './toa';
import { formatMjd } from '../time/mjd-string';
import { quoteCsvField } from './csv-text';
import { OPTIONAL_TOA_COLUMNS, REQUIRED_TOA_COLUMNS } from './read-toa-csv';

export interface WriteToaCsvOptions {
  fractionDigits?: number; // decimals of the MJD, 0–40 (default 18 ≈ 0.1 ps)
  comments?: string[]; // written first, one `# ` line per line of text
}

/**
 * Arrival times → CSV text (LF line ends, a final line end).
 *
 * @param toas     rows in output order
 * @param options  MJD digits and leading comment lines
 * @returns        header `mjd,uncertainty_us,frequency_mhz,observatory,backend`,
 *                 then `pulse_number` if any row has one, then the label columns
 *                 in order of first appearance
 *
 * Notes: 1. MJDs are printed exactly to `fractionDigits` decimals (formatMjd);
 *           numbers with the shortest text that reads back to the same double;
 *           infinite frequency as `inf`. A missing label or pulse number is an
 *           empty field.
 * Throws RangeError when a value holds a line break or a label is named like a
 * standard column.
 */
export function writeToaCsv(toas: Toa[], options: WriteToaCsvOptions = {}): string {
  const fractionDigits = options.fractionDigits ?? 18;
  const standard = new Set<string>([...REQUIRED_TOA_COLUMNS, ...OPTIONAL_TOA_COLUMNS]);
  const labelColumns: string[] = [];
  const labelSeen = new Set<string>();
  for (const toa of toas) {
    for (const name of Object.keys(toa.labels)) {
      if (labelSeen.has(name)) continue;
      if (standard.has(name) || name.trim() === '') throw new RangeError(`writeToaCsv: label column "${name}" clashes with a standard column or is empty`);
      labelSeen.add(name);
      labelColumns.push(name);
    }
  }
  const withPulseNumbers = toas.some((t) => t.pulseNumber !== null);
  const header = ['mjd', 'uncertainty_us', 'frequency_mhz', 'observatory', 'backend', ...(withPulseNumbers ? ['pulse_number'] : []), ...labelColumns];

  const lines: string[] = [];
  for (const comment of options.comments ?? []) {
    for (const part of comment.split(/\r?\n/)) lines.push(`# ${part}`);
  }
  lines.push(header.map(quoteCsvField).join(','));
  for (const toa of toas) {
    const fields = [
      formatMjd(toa.mjd, fractionDigits),
      String(toa.uncertaintyUs),
      toa.frequencyMhz === Infinity ? 'inf' : String(toa.frequencyMhz),
      quoteCsvField(toa.observatory),
      quoteCsvField(toa.backend),
    ];
    if (withPulseNumbers) fields.push(toa.pulseNumber === null ? '' : String(toa.pulseNumber));
    for (const name of labelColumns) fields.push(quoteCsvField(toa.labels[name] ?? ''));
    lines.push(fields.join(','));
  }
  return `${lines.join('\n')}\n`;
}
