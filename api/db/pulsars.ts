/** Row type of `pulsars` and its JSON presentation (TOA statistics written by the toa-statistics job). */
import type { PulsarWorkflowSummary } from './pulsar-workflow-summary';

export interface PulsarRow {
  id: number;
  name: string;
  ra_hms: string;
  dec_dms: string;
  created_by: number | null;
  toa_count: number;
  first_mjd: string | null;
  last_mjd: string | null;
  observatories: string | string[] | null; // JSON column: text from MariaDB
  statistics_updated_at: Date | null;
  created_at: Date;
}

export interface Pulsar {
  id: number;
  name: string;
  raHms: string;
  decDms: string;
  toaCount: number;
  firstMjd: string | null;
  lastMjd: string | null;
  observatories: string[];
  statisticsUpdatedAt: string | null;
  createdAt: string;
  latestFit: PulsarWorkflowSummary['latestFit'];
  revisionCount: number;
}

function observatoryCodes(value: PulsarRow['observatories']): string[] {
  if (value === null) return [];
  const parsed: unknown = typeof value === 'string' ? JSON.parse(value) : value;
  return Array.isArray(parsed) ? parsed.filter((c): c is string => typeof c === 'string') : [];
}

export function presentPulsar(row: PulsarRow, summary: PulsarWorkflowSummary = { latestFit: null, revisionCount: 0 }): Pulsar {
  return {
    id: row.id,
    name: row.name,
    raHms: row.ra_hms,
    decDms: row.dec_dms,
    toaCount: Number(row.toa_count),
    firstMjd: row.first_mjd,
    lastMjd: row.last_mjd,
    observatories: observatoryCodes(row.observatories),
    statisticsUpdatedAt: row.statistics_updated_at ? row.statistics_updated_at.toISOString() : null,
    createdAt: row.created_at.toISOString(),
    latestFit: summary.latestFit,
    revisionCount: summary.revisionCount,
  };
}
