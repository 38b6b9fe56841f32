/** A registered observatory (docs/formats.md §3). */
import type { Mjd } from '../time/epoch';

export interface ClockCorrectionPoint { mjd: Mjd; correctionUs: number }

export interface Observatory {
  code: string;
  name: string;
  itrfXM: number;
  itrfYM: number;
  itrfZM: number;
  clockCorrections: ClockCorrectionPoint[]; // sorted by mjd; empty = no correction
}

export const RESERVED_OBSERVATORY_CODES = ['ssb', 'geocenter'] as const;
