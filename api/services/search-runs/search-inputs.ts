/**
 * What a search run's inputs are, and their hash: the revision's model JSON,
 * the TOA selection (included ids with their batch checksums, excluded ids),
 * the resolved search options and the engine settings. Identical inputs give
 * the same hash, so a finished search can be offered instead of a recomputation.
 */
import { createHash } from 'node:crypto';
import { SEARCH_DEFAULTS, SEARCH_ENGINE_SETTINGS, type CreateSearchRunBody, type SearchEngineSettings, type SearchOptions } from '../../contracts/search-runs';
import { canonicalJson, type FitSelection } from '../fit-runs/fit-inputs';

/** The request's options with every default filled in (periods stay null: the engine chooses them from the data). */
export function resolveSearchOptions(body: Omit<CreateSearchRunBody, 'revisionId' | 'recompute'>): SearchOptions {
  return {
    minPeriodDays: body.minPeriodDays ?? null,
    maxPeriodDays: body.maxPeriodDays ?? null,
    maxCompanions: body.maxCompanions ?? SEARCH_DEFAULTS.maxCompanions,
    falseAlarmThreshold: body.falseAlarmThreshold ?? SEARCH_DEFAULTS.falseAlarmThreshold,
    assumedPulsarMassSolar: body.assumedPulsarMassSolar ?? SEARCH_DEFAULTS.assumedPulsarMassSolar,
  };
}

/**
 * SHA-256 (hex) over the canonical JSON of
 * `{ kind: 'search', model, included: [[id, batchChecksum]…], excludedIds, options, settings }`.
 *
 * @param modelJson  the revision's stored model JSON text
 * @param selection  loadFitSelection(…) of the pulsar
 * @param options    resolveSearchOptions(…)
 * @param settings   engine settings (default: this build's SEARCH_ENGINE_SETTINGS)
 */
export function searchInputsHash(
  modelJson: string,
  selection: FitSelection,
  options: SearchOptions,
  settings: SearchEngineSettings = SEARCH_ENGINE_SETTINGS,
): string {
  const included = [...selection.included].sort((a, b) => a.id - b.id).map((t) => [t.id, t.batchChecksum]);
  const excludedIds = [...selection.excludedIds].sort((a, b) => a - b);
  const canonical = canonicalJson({ kind: 'search', model: JSON.parse(modelJson) as unknown, included, excludedIds, options, settings });
  return createHash('sha256').update(canonical, 'utf8').digest('hex');
}
