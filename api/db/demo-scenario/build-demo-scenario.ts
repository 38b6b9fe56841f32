/**
 * The demo timing scenario built from its plan (demo-pulsars.ts): TOAs
 * simulated with the engine from each pulsar's true model (seeded, so every
 * build gives the same bytes) and written as the product's arrival-time CSV.
 * Pure: engine only, no database.
 */
import type { Toa } from '../../../worker/timing/toas/toa';
import type { Observatory } from '../../../worker/timing/earth/observatory';
import { builtinObservatories } from '../../../worker/timing/earth/builtin-observatories';
import { readModelFile } from '../../../worker/timing/model/read-model-file';
import { writeModelFile } from '../../../worker/timing/model/write-model-file';
import { simulateToas } from '../../../worker/timing/simulate/simulate-toas';
import { writeToaCsv } from '../../../worker/timing/toas/write-toa-csv';
import { parseMjd } from '../../../worker/timing/time/mjd-string';
import { compareMjd } from '../../../worker/timing/time/mjd-arithmetic';
import { DEMO_PULSAR_PLANS, type DemoPulsarPlan } from './demo-pulsars';

export interface DemoBatch {
  fileName: string;
  csv: string;
  rowCount: number;
}

export interface DemoPulsarData {
  name: string;
  /** catalogue position for the pulsars table: the starting model's, as written in the plan */
  raHms: string;
  decDms: string;
  description: string;
  /** the model the TOAs were simulated from (model file JSON); never stored as a revision */
  trueModel: Record<string, unknown>;
  /** the imperfect model stored as revision 1 (model file JSON) */
  startingModel: Record<string, unknown>;
  batches: DemoBatch[];
}

/**
 * Simulates and writes the whole demo scenario.
 *
 * @param observatories  observatories by code (default: the engine's built-in fictional ones)
 * @returns              one entry per demo pulsar, in the plan's order
 *
 * Notes: 1. Each observing block is one simulateToas call with its own seed (seedBase + block
 *           index) and σ = base uncertainty × the block's factor; the blocks of one observatory
 *           are merged in time order into one batch.
 *        2. Models are normalised through the engine (readModelFile → writeModelFile), so the
 *           JSON carries every key with its default.
 * Throws what simulateToas throws (an invalid plan); the plan in demo-pulsars.ts is fixed.
 */
export function buildDemoScenario(observatories: ReadonlyMap<string, Observatory> = builtinObservatoryMap()): DemoPulsarData[] {
  return DEMO_PULSAR_PLANS.map((plan) => buildDemoPulsar(plan, observatories));
}

function buildDemoPulsar(plan: DemoPulsarPlan, observatories: ReadonlyMap<string, Observatory>): DemoPulsarData {
  const trueModel = readModelFile(plan.trueModel);
  const startingModel = writeModelFile(readModelFile(plan.startingModel)); // Note 2
  const simulated = plan.blocks.map((block, k) => ({
    block,
    toas: simulateToas(trueModel, {
      startMjd: parseMjd(block.startMjd),
      endMjd: parseMjd(block.endMjd),
      count: block.count,
      observatory: block.observatory,
      backend: block.backend,
      frequencyMhz: block.frequencyMhz,
      uncertaintyUs: roundedUncertaintyUs(plan.baseUncertaintyUs * block.uncertaintyFactor),
      seed: plan.seedBase + k, // Note 1
    }, observatories).toas,
  }));
  const batches = plan.batches.map((batch) => {
    const toas = timeOrdered(simulated.filter((s) => s.block.observatory === batch.observatory).flatMap((s) => s.toas));
    const csv = writeToaCsv(toas, {
      comments: [
        `Demo data (invented): simulated arrival times of ${plan.name} at ${batch.observatory}.`,
        'Made by the Pulsekeeper engine from an invented timing model; not an observation.',
      ],
    });
    return { fileName: batch.fileName, csv, rowCount: toas.length };
  });
  const astrometry = plan.startingModel.astrometry as { ra_hms: string; dec_dms: string }; // the text as planned
  return {
    name: plan.name,
    raHms: astrometry.ra_hms,
    decDms: astrometry.dec_dms,
    description: plan.description,
    trueModel: writeModelFile(trueModel),
    startingModel,
    batches,
  };
}

/** Uncertainties as an observer would write them: three significant digits. */
function roundedUncertaintyUs(us: number): number {
  return Number(us.toPrecision(3));
}

function timeOrdered(toas: Toa[]): Toa[] {
  const sorted = [...toas].sort((a, b) => compareMjd(a.mjd, b.mjd));
  return sorted.map((toa, i) => ({ ...toa, row: i + 1, line: i + 1 }));
}

function builtinObservatoryMap(): Map<string, Observatory> {
  return new Map(builtinObservatories().map((o) => [o.code, o]));
}
