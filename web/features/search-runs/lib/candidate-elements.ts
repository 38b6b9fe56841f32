import type { SearchCandidate } from '../api/get-search-run';

export interface ElementSpec {
  key: string;
  label: string;
}

/** The keplerian elements in the order an analyst reads them (docs/formats.md §2 field names). */
export const ELEMENT_SPECS: readonly ElementSpec[] = [
  { key: 'period_days', label: 'Period' },
  { key: 'projected_semimajor_axis_lt_s', label: 'Projected semi-major axis' },
  { key: 'eccentricity', label: 'Eccentricity' },
  { key: 'periastron_longitude_deg', label: 'Periastron longitude' },
  { key: 'periastron_epoch_mjd', label: 'Periastron epoch' },
];

/** The candidate's elements: the five named ones first, then any others the engine fitted. */
export function orderedElements(candidate: Pick<SearchCandidate, 'elements'>): (ElementSpec & { present: boolean })[] {
  const named = ELEMENT_SPECS.map((spec) => ({ ...spec, present: spec.key in candidate.elements }));
  const known = new Set(ELEMENT_SPECS.map((s) => s.key));
  const others = Object.keys(candidate.elements)
    .filter((key) => !known.has(key))
    .map((key) => ({ key, label: key.replaceAll('_', ' '), present: true }));
  return [...named, ...others];
}

/** Only accepted candidates are discoveries (in the resulting model); unstable and degenerate ones are not. */
export const isAccepted = (candidate: Pick<SearchCandidate, 'status'>) => candidate.status === 'accepted';
