/**
 * The residuals the explorer shows: the fit's own, or a browser preview for an edited model
 * (companion switches, parameter edits) from the stored barycentric days, without a fit
 * (worker/timing/pipeline/companion-toggle-preview.ts does the arithmetic).
 */
import type { ExplorerTable } from '../../../../api/contracts/explorer';
import { readModelFile } from '../../../../worker/timing/model/read-model-file';
import { preparePreview, previewResiduals, type PreparedPreview } from '../../../../worker/timing/pipeline/companion-toggle-preview';

export interface ShownResiduals {
  /** µs per TOA; NaN where the engine could not evaluate the TOA. */
  residualUs: Float64Array;
  /** Wall time of the preview (model parse + residuals), ms; null when the fit's own residuals are shown. */
  previewMs: number | null;
  /** Why the edited model could not be previewed (the fit's residuals are shown then). */
  error: string | null;
  /** Edits applied to first order only, and edits the preview cannot show (need a fit). */
  firstOrder: string[];
  notPreviewed: string[];
}

/** The fit's residuals with null (not evaluated) as NaN. */
export function fittedResidualsUs(table: ExplorerTable): Float64Array {
  return Float64Array.from(table.residualUs, (r) => (r === null ? Number.NaN : r));
}

/**
 * Prepares previews of one fit with the TOAs in use now: the preview's weighted mean (the
 * always-fitted phase offset) is taken over the TOAs not excluded now.
 *
 * @param table       the explorer table
 * @param excludedNow 1 where TOA i is excluded now
 * Throws TimingInputError when the fitted model or the columns are unusable.
 */
export function prepareShownPreview(table: ExplorerTable, excludedNow: Uint8Array): PreparedPreview {
  return preparePreview({ ...table, excluded: Array.from(excludedNow, (e) => e === 1) }, readModelFile(table.fittedModel));
}

/**
 * @param table        the explorer table of the shown fit
 * @param fitted       fittedResidualsUs(table)
 * @param prepared     prepareShownPreview(...), or the error it threw
 * @param editedModel  model-file JSON; the very object `table.fittedModel` means "no edit"
 */
export function shownResiduals(
  table: ExplorerTable,
  fitted: Float64Array,
  prepared: PreparedPreview | Error,
  editedModel: Record<string, unknown>,
): ShownResiduals {
  const unchanged = { residualUs: fitted, previewMs: null, firstOrder: [], notPreviewed: [] };
  if (editedModel === table.fittedModel) return { ...unchanged, error: null };
  if (prepared instanceof Error) return { ...unchanged, error: prepared.message };
  const started = performance.now();
  try {
    const result = previewResiduals(prepared, readModelFile(editedModel));
    return { residualUs: result.residualUs, previewMs: performance.now() - started, error: null, firstOrder: result.firstOrder, notPreviewed: result.notPreviewed };
  } catch (e) {
    return { ...unchanged, error: e instanceof Error ? e.message : String(e) };
  }
}
