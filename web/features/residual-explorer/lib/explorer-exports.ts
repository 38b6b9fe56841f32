/**
 * The explorer's file exports built in the browser: the shown residuals as CSV and the fitted
 * model as JSON (the model file of docs/formats.md §2).
 */
import type { ExplorerTable } from '../../../../api/contracts/explorer';

export const RESIDUALS_CSV_COLUMNS = [
  'toa_id', 'batch_id', 'batch_row', 'mjd', 'observatory', 'backend', 'frequency_mhz', 'uncertainty_us', 'residual_us', 'excluded',
] as const;

/** RFC 4180 quoting: fields holding a comma, quote or line break are quoted, quotes doubled. */
function csvField(value: string): string {
  return /[",\r\n]/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
}

/**
 * The residuals as shown (fitted, or previewed for an edited model) as CSV text, one row per TOA
 * in table order; `frequency_mhz` is `inf` for infinite frequency (docs/formats.md §1); `residual_us` is
 * empty for a TOA the engine could not evaluate.
 *
 * @param table       the explorer table
 * @param residualUs  the residual per TOA that is on screen, µs
 * @param isExcluded  whether TOA i is excluded now
 * @param comment     first line, written as a `#` comment (e.g. which fit and which preview)
 */
export function residualsCsv(table: ExplorerTable, residualUs: ArrayLike<number>, isExcluded: (i: number) => boolean, comment: string): string {
  const lines = [`# ${comment.replace(/[\r\n]+/g, ' ')}`, RESIDUALS_CSV_COLUMNS.join(',')];
  for (let i = 0; i < table.count; i++) {
    const frequency = table.frequencyMhz[i];
    lines.push(
      [
        String(table.toaId[i]),
        String(table.batchId[i]),
        String(table.batchRow[i]),
        table.mjd[i],
        csvField(table.observatory[i]),
        csvField(table.backend[i]),
        frequency === null ? 'inf' : String(frequency),
        String(table.uncertaintyUs[i]),
        Number.isFinite(residualUs[i]) ? String(residualUs[i]) : '',
        isExcluded(i) ? 'true' : 'false',
      ].join(','),
    );
  }
  return `${lines.join('\n')}\n`;
}

/** The fitted model file, pretty-printed. */
export function fittedModelJson(table: ExplorerTable): string {
  return `${JSON.stringify(table.fittedModel, null, 2)}\n`;
}

/** Offers `text` as a download named `fileName`. */
export function downloadText(fileName: string, text: string, mimeType: string): void {
  const url = URL.createObjectURL(new Blob([text], { type: mimeType }));
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 0);
}
