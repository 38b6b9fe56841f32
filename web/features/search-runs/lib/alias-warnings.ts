// Peak warnings from the engine start with a stable code and a colon (api/contracts/search-runs.ts,
// SearchPeak.aliasWarnings): "one-year: peak at 365.3 d is near 1 year …".

export interface AliasWarning {
  /** the stable code before the colon ('one-year', 'half-year', 'cadence', …); '' when there is none */
  code: string;
  /** the text after the code */
  text: string;
}

/** Splits "code: text"; a warning without a code keeps its whole text. */
export function parseAliasWarning(warning: string): AliasWarning {
  const match = /^([a-z][a-z-]*):\s*(.*)$/s.exec(warning);
  return match ? { code: match[1], text: match[2] } : { code: '', text: warning };
}

/** The short name shown before each kind of warning. */
export const ALIAS_CODE_LABELS: Record<string, string> = {
  'one-year': 'Near one year',
  'half-year': 'Near half a year',
  'sidereal-day': 'Near a sidereal day',
  'solar-day': 'Near a solar day',
  cadence: 'Observing cadence',
  'window-peak': 'Sampling window',
  'window-alias': 'Possible alias',
};

/** Wording for a peak near one year (common practice: annual residuals point at the astrometry). */
export const ONE_YEAR_ADVICE = 'likely a position or proper-motion error — fit astrometry first';

export function isOneYearWarning(warning: AliasWarning): boolean {
  return warning.code === 'one-year';
}
