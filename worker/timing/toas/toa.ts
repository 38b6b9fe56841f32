/** One arrival time as read from the arrival-time file (docs/formats.md §1). */
import type { Mjd } from '../time/epoch';

export interface Toa {
  row: number; // 1-based data row (header and comments not counted)
  line: number; // 1-based line in the file
  mjd: Mjd; // observatory clock (UTC before clock corrections); TDB for `ssb`; TT for `geocenter`
  uncertaintyUs: number;
  frequencyMhz: number; // Infinity for `inf`
  observatory: string; // registered code, `ssb` or `geocenter`
  backend: string; // default 'default'
  pulseNumber: number | null; // integer, may exceed 2^53? no: |N| < 2^53 is checked
  labels: Record<string, string>; // unknown columns, kept verbatim
  mjdText?: string; // the `mjd` field exactly as written in the file (only when the reader is asked to keep it)
}
