/**
 * Fit runs as the API sends them and the worker stores them (docs/api-workflow.md,
 * "Fit runs"), plus the engine settings every fit of this build uses. Shared by
 * api/, worker/ and web/.
 */
import { z } from 'zod';

export const FIT_RUN_STATUSES = ['queued', 'running', 'succeeded', 'failed', 'cancelled'] as const;
export type FitRunStatus = (typeof FIT_RUN_STATUSES)[number];
export const FINAL_FIT_RUN_STATUSES: readonly FitRunStatus[] = ['succeeded', 'failed', 'cancelled'];

/**
 * The engine settings of a fit (part of the inputs hash). They name what the
 * engine does (docs/timing.md §1.1); `engineVersion` changes whenever a change
 * of the engine may change results, so old results are not reused after it.
 */
export const FIT_ENGINE_SETTINGS = {
  ephemeris: 'DE405',
  clock: 'observatory clock corrections → UTC',
  timeScale: 'TDB via ERFA dtdb (topocentric)',
  earthOrientation: 'IAU 2006/2000A, UT1 = UTC, no polar motion',
  jupiterShapiro: 'not included',
  engineVersion: 'pulsekeeper-engine/0.1.0',
} as const;
export type FitEngineSettings = { [K in keyof typeof FIT_ENGINE_SETTINGS]: string };

export interface FitParameterResult {
  value: string; // file notation (sexagesimal for ra/dec, MJD text for epochs)
  uncertainty: number; // 1σ in `unit` (formal, not scaled by √χ²_red)
  unit: string;
  startValue: string; // the revision's value, same notation
  changeSigma: number; // (value − startValue) / uncertainty
}

export interface FitResult {
  parameters: Record<string, FitParameterResult>;
  chi2: number;
  dof: number;
  reducedChi2: number;
  weightedRmsUs: number;
  iterations: number;
  converged: boolean;
  warnings: string[];
  phaseOffsetTurns: number;
  conditionNumber: number;
  engineSettings: Record<string, string>; // as the engine reported them
  fittedModel: Record<string, unknown>; // the model file JSON (docs/formats.md §2)
}

export interface UserRef { id: number; displayName: string }

export interface FitRun {
  id: number;
  pulsarId: number;
  revisionId: number;
  campaignId: number | null;
  status: FitRunStatus;
  progress: { percent: number; stage: string };
  inputsHash: string;
  settings: FitEngineSettings;
  toaCount: number | null;
  excludedCount: number | null;
  requestedBy: UserRef | null;
  queuedAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  durationMs: number | null;
  errorMessage: string | null;
  result: FitResult | null;
}

/** FitRun without result.parameters and result.fittedModel (lists). */
export type FitRunSummary = Omit<FitRun, 'result'> & { result: Omit<FitResult, 'parameters' | 'fittedModel'> | null };

/** GET /api/fit-runs/:id/residuals (columnar). */
export interface ResidualTable {
  count: number;
  toaId: number[];
  mjd: string[];
  residualUs: number[];
  uncertaintyUs: number[];
  frequencyMhz: (number | null)[]; // null = infinite
  backend: string[];
  observatory: string[];
}

export const CreateFitRunBody = z.strictObject({
  revisionId: z.number({ error: 'revisionId: must be a number' }).int().positive(),
  recompute: z.boolean().optional(),
});
export type CreateFitRunBody = z.infer<typeof CreateFitRunBody>;
