/** The three companion kinds of docs/formats.md §2 and the numeric keys each carries, in display order. */
export const COMPANION_KINDS = ['keplerian', 'low-eccentricity', 'damour-deruelle'] as const;
export type CompanionKind = (typeof COMPANION_KINDS)[number];

export const COMPANION_KIND_LABELS: Record<CompanionKind, string> = {
  keplerian: 'Keplerian (Blandford–Teukolsky)',
  'low-eccentricity': 'Low eccentricity (Lange et al.)',
  'damour-deruelle': 'Damour–Deruelle',
};

export interface CompanionFieldSpec {
  key: string;
  label: string;
  unit: string;
  /** Required by the file format; a blank required field is still written (as "") so the server names it. */
  required: boolean;
}

const PERIOD: CompanionFieldSpec = { key: 'period_days', label: 'Orbital period', unit: 'days', required: true };
const SEMIMAJOR: CompanionFieldSpec = { key: 'projected_semimajor_axis_lt_s', label: 'Projected semi-major axis', unit: 'lt-s', required: true };
const PERIOD_DERIVATIVE: CompanionFieldSpec = { key: 'period_derivative', label: 'Period derivative', unit: 'dimensionless', required: false };
const ECCENTRIC_ORBIT: readonly CompanionFieldSpec[] = [
  PERIOD,
  SEMIMAJOR,
  { key: 'eccentricity', label: 'Eccentricity', unit: '0 ≤ e < 1', required: false },
  { key: 'periastron_longitude_deg', label: 'Longitude of periastron', unit: 'deg', required: false },
  { key: 'periastron_epoch_mjd', label: 'Epoch of periastron', unit: 'MJD', required: true },
  PERIOD_DERIVATIVE,
  { key: 'periastron_advance_deg_per_yr', label: 'Periastron advance', unit: 'deg/yr', required: false },
  { key: 'einstein_delay_s', label: 'Einstein delay amplitude', unit: 's', required: false },
];

export const COMPANION_FIELDS: Record<CompanionKind, readonly CompanionFieldSpec[]> = {
  keplerian: ECCENTRIC_ORBIT,
  'low-eccentricity': [
    PERIOD,
    SEMIMAJOR,
    { key: 'ascending_node_epoch_mjd', label: 'Epoch of ascending node', unit: 'MJD', required: true },
    { key: 'e_sin_omega', label: 'e · sin ω', unit: 'dimensionless', required: false },
    { key: 'e_cos_omega', label: 'e · cos ω', unit: 'dimensionless', required: false },
    PERIOD_DERIVATIVE,
  ],
  'damour-deruelle': [
    ...ECCENTRIC_ORBIT,
    { key: 'shapiro_range_s', label: 'Shapiro range', unit: 's', required: false },
    { key: 'shapiro_shape', label: 'Shapiro shape (sin i)', unit: '−1 … 1', required: false },
  ],
};

export function isCompanionKind(value: string): value is CompanionKind {
  return (COMPANION_KINDS as readonly string[]).includes(value);
}

/** Every numeric key any kind carries; keys outside this set are kept verbatim as extras. */
export const ALL_COMPANION_FIELD_KEYS: ReadonlySet<string> = new Set(Object.values(COMPANION_FIELDS).flatMap((specs) => specs.map((s) => s.key)));
