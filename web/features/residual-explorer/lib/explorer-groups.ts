/**
 * Grouping of TOAs for colour and symbol (by backend or by observatory), with the
 * currently excluded TOAs kept apart in their own hollow grey group.
 */
import { backendStyle, type BackendStyle } from '../../residual-plot/lib/backend-styles';

export const GROUP_BY_OPTIONS = ['backend', 'observatory'] as const;
export type GroupBy = (typeof GROUP_BY_OPTIONS)[number];

/** Hollow grey for excluded TOAs: it reads as "not counted" without needing colour. */
export const EXCLUDED_STYLE: BackendStyle = { colour: '#8b90a7', symbol: 'circle-open' };
export const EXCLUDED_GROUP_NAME = 'Excluded from fits';

export interface ToaGroup {
  name: string;
  style: BackendStyle;
  /** Row indices into the explorer table, in table order. */
  indices: Int32Array;
  excluded: boolean;
}

/**
 * One group per backend (or observatory) name in sorted order, each with its own colour and
 * symbol (Okabe–Ito, residual-plot/lib/backend-styles.ts), then one group of the excluded TOAs.
 *
 * @param labels      backend or observatory per TOA
 * @param isExcluded  whether TOA i is excluded now
 * @returns           the included groups (never empty ones) and, if any, the excluded group last
 */
export function groupToas(labels: readonly string[], isExcluded: (i: number) => boolean): ToaGroup[] {
  const byName = new Map<string, number[]>();
  const excluded: number[] = [];
  for (let i = 0; i < labels.length; i++) {
    if (isExcluded(i)) {
      excluded.push(i);
      continue;
    }
    const name = labels[i] || '(none)';
    let list = byName.get(name);
    if (!list) byName.set(name, (list = []));
    list.push(i);
  }
  // Styles follow the sorted names of ALL TOAs, so excluding a group's last TOA does not repaint the others.
  const allNames = [...new Set(labels.map((l) => l || '(none)'))].sort((a, b) => a.localeCompare(b));
  const groups: ToaGroup[] = allNames
    .filter((name) => byName.has(name))
    .map((name) => ({ name, style: backendStyle(allNames.indexOf(name)), indices: Int32Array.from(byName.get(name)!), excluded: false }));
  if (excluded.length > 0) groups.push({ name: EXCLUDED_GROUP_NAME, style: EXCLUDED_STYLE, indices: Int32Array.from(excluded), excluded: true });
  return groups;
}
