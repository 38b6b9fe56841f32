/**
 * Fixtures for the fit-run tests: an invented observatory registered in the
 * database, TOAs simulated by the engine from an invented model and stored
 * through the TOA upload service, and the starting model (slightly off the
 * truth, so the fit has work to do).
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Knex } from 'knex';
import { expect } from 'vitest';
import { mjdColumns, type ObservatoryJson } from '../../api/db/observatories';
import { storeToaBatch } from '../../api/services/toas/store-toa-batch';
import { parseObservatory } from '../../worker/timing/earth/read-observatories';
import { readModelFile } from '../../worker/timing/model/read-model-file';
import { simulateToas } from '../../worker/timing/simulate/simulate-toas';
import { parseMjd } from '../../worker/timing/time/mjd-string';
import { writeToaCsv } from '../../worker/timing/toas/write-toa-csv';
import type { Client } from '../api/helpers/agents';
import { uniqueSuffix } from '../api/helpers/factories';

const DEMO_MODEL = path.join(import.meta.dirname, '../fixtures/cli/demo-model.json');

/** The invented demo model of tests/fixtures/cli, renamed to `pulsarName`. */
export function demoModelJson(pulsarName: string): Record<string, unknown> {
  const model = JSON.parse(readFileSync(DEMO_MODEL, 'utf8')) as Record<string, unknown>;
  return { ...model, pulsar: pulsarName };
}

/** The model with another spin frequency (a start the fit must correct). */
export function offsetStartModel(truth: Record<string, unknown>, frequencyHz: string): Record<string, unknown> {
  const spin = truth.spin as Record<string, unknown>;
  return { ...truth, spin: { ...spin, frequency_hz: frequencyHz } };
}

/** Registers an invented observatory (Harrow Ridge's invented coordinates, two invented clock points); returns its JSON. */
export async function createTestObservatory(knex: Knex): Promise<ObservatoryJson> {
  const code = `fit-${uniqueSuffix()}`;
  const json: ObservatoryJson = {
    code,
    name: `Fit test site ${code}`,
    itrf_x_m: -1943260.447,
    itrf_y_m: -4612171.913,
    itrf_z_m: 3943274.984,
    clock_corrections: [
      { mjd: '58000', correction_us: 0.31 },
      { mjd: '59500.5', correction_us: -0.12 },
    ],
  };
  const [id] = await knex('observatories').insert({ code, name: json.name, itrf_x_m: json.itrf_x_m, itrf_y_m: json.itrf_y_m, itrf_z_m: json.itrf_z_m });
  await knex('observatory_clock_corrections').insert(
    json.clock_corrections.map((p) => ({ observatory_id: id, ...mjdColumns(parseMjd(p.mjd)), correction_us: p.correction_us })),
  );
  return json;
}

/** A simulated arrival-time CSV (noise σ = `uncertaintyUs`, seeded) of the model at the observatory. */
export function simulatedCsv(modelJson: Record<string, unknown>, observatory: ObservatoryJson, count: number, seed = 7, uncertaintyUs = 1.5): string {
  const model = readModelFile(modelJson);
  const site = parseObservatory(observatory);
  const { toas } = simulateToas(
    model,
    { startMjd: parseMjd('58200'), endMjd: parseMjd('59400'), count, observatory: site.code, uncertaintyUs, frequencyMhz: 1400, seed },
    new Map([[site.code, site]]),
  );
  return writeToaCsv(toas, { fractionDigits: 20 });
}

/** Stores a CSV for the pulsar through the upload service (returns the batch id). */
export async function storeCsv(knex: Knex, pulsarId: number, csv: string, uploadedBy: number | null = null): Promise<number> {
  const batch = await storeToaBatch(knex, { pulsarId, fileName: 'simulated.csv', uploadedBy, bytes: Buffer.from(csv, 'utf8') } );
  return batch.id;
}

/** Saves `model` as a new revision of the pulsar through the API (fails the test otherwise); returns its id. */
export async function saveRevision(client: Client, pulsarId: number, model: Record<string, unknown>, message = 'start'): Promise<number> {
  const res = await client.agent.post(`/api/pulsars/${pulsarId}/revisions`).set('x-csrf-token', client.csrf).send({ model, message });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.data.id as number;
}
