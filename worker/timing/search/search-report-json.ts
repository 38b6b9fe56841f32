/**
 * The companion search in the product's public JSON shape (docs/formats.md §4,
 * `search`), shared by the command line and any job that stores search results.
 */
import type { KeplerianCompanion, TimingModel } from '../model/timing-model';
import { writeModelFile } from '../model/write-model-file';
import type { CompanionSearchReport, SearchCandidate } from './companion-search-report';

export interface SearchPeakJson {
  period_days: number;
  power: number;
  false_alarm_probability: number;
  round: number;
  frequency_per_day: number;
  alias_warnings: string[];
}

export interface SearchCandidateJson {
  round: number;
  name: string;
  status: SearchCandidate['status'];
  reason?: string;
  companion: Record<string, unknown>;
  uncertainties: Record<string, number>;
  false_alarm_probability: number;
  seed_period_days: number;
  chi2_before: number;
  /** null when the orbit fit failed */
  chi2_after: number | null;
  chi2_change: number | null;
  converged: boolean;
  eccentricity_test: { attempted: boolean; statistic: number; probability: number; kept: boolean };
  derived: {
    mass_function_solar: number | null;
    pulsar_mass_solar: number;
    minimum_companion_mass_solar: number | null;
    minimum_companion_mass_jupiter: number | null;
    minimum_companion_mass_earth: number | null;
    separation_au: number | null;
  };
}

export interface SearchReportJson {
  peaks: SearchPeakJson[];
  /** the accepted companions as in the final model, each with its 1σ by field name */
  companions: Record<string, unknown>[];
  model: Record<string, unknown>;
  candidates: SearchCandidateJson[];
  stop_reason: CompanionSearchReport['stopReason'];
  converged: boolean;
  chi2: number;
  dof: number;
  reduced_chi2: number;
  weighted_rms_us: number;
  warnings: string[];
  settings: Record<string, unknown>;
  ephemeris: CompanionSearchReport['finalFit']['ephemeris'];
}

/**
 * CompanionSearchReport → the `search` output object (ready for JSON.stringify).
 *
 * @param report  searchCompanions(…)
 * @returns       the documented keys `peaks`, `companions` (file format plus `uncertainties` keyed by the
 *                companion's own field names, from the final fit) and `model` (the final model), plus
 *                `candidates` (every candidate, accepted or not, with χ² change, F-test and derived masses),
 *                `stop_reason`, the final fit's statistics, `warnings`, `settings` and `ephemeris`.
 *                Numbers that are not finite (a failed orbit fit) are written as null.
 */
export function searchReportJson(report: CompanionSearchReport): SearchReportJson {
  const fit = report.finalFit;
  const accepted = report.candidates.filter((c) => c.status === 'accepted');
  return {
    peaks: report.peaks.map((p) => ({
      period_days: p.periodDays,
      power: p.power,
      false_alarm_probability: p.falseAlarmProbability,
      round: p.round,
      frequency_per_day: p.frequencyPerDay,
      alias_warnings: [...p.aliasWarnings],
    })),
    companions: accepted.map((c) => ({ ...companionJson(report.model, c.companion), uncertainties: { ...c.uncertainties } })),
    model: writeModelFile(report.model),
    candidates: report.candidates.map((c) => candidateJson(report.model, c)),
    stop_reason: report.stopReason,
    converged: fit.converged,
    chi2: fit.chi2,
    dof: fit.dof,
    reduced_chi2: fit.reducedChi2,
    weighted_rms_us: fit.weightedRmsUs,
    warnings: [...report.warnings],
    settings: {
      min_period_days: report.settings.minPeriodDays,
      max_period_days: report.settings.maxPeriodDays,
      max_companions: report.settings.maxCompanions,
      false_alarm_threshold: report.settings.falseAlarmThreshold,
      eccentricity_f_test_threshold: report.settings.eccentricityThreshold,
      pulsar_mass_solar: report.settings.pulsarMassSolar,
      oversampling: report.settings.oversampling,
      frequency_count: report.settings.frequencyCount,
      span_days: report.settings.spanDays,
      periodogram: report.settings.periodogram,
      ...report.settings.fit,
    },
    ephemeris: fit.ephemeris,
  };
}

function candidateJson(model: TimingModel, c: SearchCandidate): SearchCandidateJson {
  const m = c.derived.minimumCompanionMass;
  return {
    round: c.round,
    name: c.name,
    status: c.status,
    ...(c.reason !== undefined ? { reason: c.reason } : {}),
    companion: companionJson(model, c.companion),
    uncertainties: Object.fromEntries(Object.entries(c.uncertainties).map(([k, v]) => [k, v])),
    false_alarm_probability: c.falseAlarmProbability,
    seed_period_days: c.seedPeriodDays,
    chi2_before: c.chi2Before,
    chi2_after: finiteOrNull(c.chi2After),
    chi2_change: finiteOrNull(c.chi2After - c.chi2Before),
    converged: c.converged,
    eccentricity_test: { ...c.eccentricityTest },
    derived: {
      mass_function_solar: finiteOrNull(c.derived.massFunctionSolar),
      pulsar_mass_solar: c.derived.pulsarMassSolar,
      minimum_companion_mass_solar: finiteOrNull(m.solarMasses),
      minimum_companion_mass_jupiter: finiteOrNull(m.jupiterMasses),
      minimum_companion_mass_earth: finiteOrNull(m.earthMasses),
      separation_au: finiteOrNull(c.derived.separationAu),
    },
  };
}

/** One companion in the model file's notation (writeModelFile's companion object). */
function companionJson(model: TimingModel, companion: KeplerianCompanion): Record<string, unknown> {
  const file = writeModelFile({ ...model, companions: [companion], solveFor: [] });
  return (file.companions as Record<string, unknown>[])[0];
}

function finiteOrNull(x: number): number | null {
  return Number.isFinite(x) ? x : null;
}
