/**
 * The residuals of a finished fit run, from its one fit_residuals row
 * (api/db/residual-columns.ts), columnar or as CSV. 404 for an unknown run,
 * 409 when the run has no residuals (not succeeded).
 */
import type { Knex } from 'knex';
import type { ResidualTable } from '../../contracts/fit-runs';
import { decodeResidualColumns, type EncodedResidualColumns, type ResidualColumns } from '../../db/residual-columns';
import { AppError, notFound } from '../../errors';

export async function loadFitResiduals(knex: Knex, fitRunId: number): Promise<ResidualColumns> {
  const run = (await knex('fit_runs').where({ id: fitRunId }).first('id', 'status')) as { id: number; status: string } | undefined;
  if (!run) throw notFound('fit run');
  const row = (await knex('fit_residuals').where({ fit_run_id: fitRunId }).first()) as EncodedResidualColumns | undefined;
  if (!row) throw new AppError(409, 'no_residuals', `fit run ${fitRunId} has no residuals (status ${run.status})`);
  return decodeResidualColumns(row);
}

export function residualTable(c: ResidualColumns): ResidualTable {
  return {
    count: c.count,
    toaId: Array.from(c.toaIds),
    mjd: c.mjd,
    residualUs: Array.from(c.residualUs),
    uncertaintyUs: Array.from(c.uncertaintyUs),
    frequencyMhz: Array.from(c.frequencyMhz, (f) => (f === Infinity ? null : f)),
    backend: c.backend,
    observatory: c.observatory,
  };
}

/** RFC 4180 field: quoted when it holds a comma, quote or line break. */
function csvField(text: string): string {
  return /[",\r\n]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
}

/** `toa_id,mjd,residual_us,uncertainty_us,frequency_mhz,observatory,backend` (numbers in shortest round-trip form, `inf`). */
export function residualCsv(c: ResidualColumns): string {
  const lines = ['toa_id,mjd,residual_us,uncertainty_us,frequency_mhz,observatory,backend'];
  for (let i = 0; i < c.count; i++) {
    const f = c.frequencyMhz[i];
    lines.push(
      [String(c.toaIds[i]), c.mjd[i], String(c.residualUs[i]), String(c.uncertaintyUs[i]), f === Infinity ? 'inf' : String(f), csvField(c.observatory[i]), csvField(c.backend[i])].join(','),
    );
  }
  return `${lines.join('\n')}\n`;
}
