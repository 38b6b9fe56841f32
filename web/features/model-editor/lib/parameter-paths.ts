/**
 * Parameter paths of docs/formats.md §2 ("Parameter paths"): dotted keys, `[k]` for an array
 * index (zero-based, no leading zeros), `[name]` for a companion or offset by its name/backend.
 */
export const parameterPath = {
  spin: (key: 'frequency_hz') => `spin.${key}`,
  frequencyDerivative: (index: number) => `spin.frequency_derivatives[${index}]`,
  astrometry: (key: string) => `astrometry.${key}`,
  dm: () => 'dispersion.dm_pc_per_cm3',
  dmDerivative: (index: number) => `dispersion.dm_derivatives[${index}]`,
  companion: (name: string, key: string) => `companions[${name}].${key}`,
  offset: (backend: string) => `offsets[${backend}].seconds`,
};

export type ParsedParameterPath =
  | { section: 'spin'; key: 'frequency_hz' }
  | { section: 'frequency_derivatives'; index: number }
  | { section: 'astrometry'; key: string }
  | { section: 'dm' }
  | { section: 'dm_derivatives'; index: number }
  | { section: 'companion'; name: string; key: string }
  | { section: 'offset'; backend: string };

const INDEX = '(0|[1-9]\\d*)';
const NAME = '([^\\s[\\]]{1,64})';
const PATTERNS: [RegExp, (m: RegExpExecArray) => ParsedParameterPath][] = [
  [/^spin\.frequency_hz$/, () => ({ section: 'spin', key: 'frequency_hz' })],
  [new RegExp(`^spin\\.frequency_derivatives\\[${INDEX}\\]$`), (m) => ({ section: 'frequency_derivatives', index: Number(m[1]) })],
  [/^astrometry\.(ra_hms|dec_dms|pm_ra_cosdec_mas_per_yr|pm_dec_mas_per_yr|parallax_mas)$/, (m) => ({ section: 'astrometry', key: m[1] })],
  [/^dispersion\.dm_pc_per_cm3$/, () => ({ section: 'dm' })],
  [new RegExp(`^dispersion\\.dm_derivatives\\[${INDEX}\\]$`), (m) => ({ section: 'dm_derivatives', index: Number(m[1]) })],
  [new RegExp(`^companions\\[${NAME}\\]\\.([a-z_]+)$`), (m) => ({ section: 'companion', name: m[1], key: m[2] })],
  [new RegExp(`^offsets\\[${NAME}\\]\\.seconds$`), (m) => ({ section: 'offset', backend: m[1] })],
];

/** Reads one `solve_for` entry; null for paths the editor has no switch for (glitches, typos). */
export function parseParameterPath(path: string): ParsedParameterPath | null {
  for (const [pattern, build] of PATTERNS) {
    const match = pattern.exec(path);
    if (match) return build(match);
  }
  return null;
}
