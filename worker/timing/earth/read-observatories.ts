/**
 * Observatory objects of docs/formats.md §3: validation (zod; the API reuses
 * `observatoryFileSchema`), lists, and the command line's set = built-ins plus
 * the JSON file named by PULSEKEEPER_OBSERVATORIES.
 */
import { readFileSync } from 'node:fs';
import { z } from 'zod';
import type { Observatory } from './observatory';
import { RESERVED_OBSERVATORY_CODES } from './observatory';
import type { EngineErrorDetail } from '../engine-error';
import { TimingInputError } from '../engine-error';
import { compareMjd } from '../time/mjd-arithmetic';
import { formatMjd } from '../time/mjd-string';
import { mjdField, numberField, parseOrThrow, textField, throwInputProblems } from '../model/model-file-fields';
import { builtinObservatories } from './builtin-observatories';

export const OBSERVATORIES_FILE_VARIABLE = 'PULSEKEEPER_OBSERVATORIES';
const MIN_GEOCENTRIC_DISTANCE_KM = 6350; // below the Earth's polar radius (6356.8 km, common practice) by a margin
const MAX_GEOCENTRIC_DISTANCE_KM = 6400; // above the equatorial radius (6378.1 km) plus the highest sites
const CODE_PATTERN = /^[a-z0-9_-]{2,16}$/;
const RESERVED: ReadonlySet<string> = new Set(RESERVED_OBSERVATORY_CODES);

const clockPointSchema = z.strictObject({ mjd: mjdField(), correction_us: numberField() });

/**
 * zod schema of one observatory object (file keys); its output is an `Observatory`.
 * Checks: code 2–16 of `a-z 0-9 - _` and not `ssb`/`geocenter`; the ITRF point
 * 6350–6400 km from the geocentre; clock-correction MJDs strictly increasing.
 */
export const observatoryFileSchema = z
  .strictObject({
    code: textField(CODE_PATTERN, 'must be 2–16 characters of a-z, 0-9, - and _'),
    name: textField(/^\S(?:.{0,118}\S)?$/, 'must be 1–120 characters without leading or trailing spaces'),
    itrf_x_m: numberField(),
    itrf_y_m: numberField(),
    itrf_z_m: numberField(),
    clock_corrections: z.array(clockPointSchema, { error: 'expected an array' }).default([]),
  })
  .superRefine((site, ctx) => {
    if (RESERVED.has(site.code)) {
      ctx.addIssue({ code: 'custom', path: ['code'], message: `"${site.code}" is reserved (ssb and geocenter are built into the arrival-time format)` });
    }
    const distanceKm = Math.hypot(site.itrf_x_m, site.itrf_y_m, site.itrf_z_m) / 1000;
    if (!(distanceKm >= MIN_GEOCENTRIC_DISTANCE_KM && distanceKm <= MAX_GEOCENTRIC_DISTANCE_KM)) {
      ctx.addIssue({
        code: 'custom',
        path: ['itrf_x_m'],
        message: `the site is ${distanceKm.toFixed(3)} km from the geocentre; ITRF coordinates in metres must put it ${MIN_GEOCENTRIC_DISTANCE_KM}–${MAX_GEOCENTRIC_DISTANCE_KM} km away`,
      });
    }
    site.clock_corrections.forEach((point, i) => {
      if (i > 0 && compareMjd(point.mjd, site.clock_corrections[i - 1].mjd) <= 0) {
        ctx.addIssue({
          code: 'custom',
          path: ['clock_corrections', i, 'mjd'],
          message: `MJD ${formatMjd(point.mjd, 6)} is not after the previous point's (clock corrections must be sorted by strictly increasing mjd)`,
        });
      }
    });
  })
  .transform((site): Observatory => ({
    code: site.code,
    name: site.name,
    itrfXM: site.itrf_x_m,
    itrfYM: site.itrf_y_m,
    itrfZM: site.itrf_z_m,
    clockCorrections: site.clock_corrections.map((p) => ({ mjd: p.mjd, correctionUs: p.correction_us })),
  }));

/**
 * One observatory object (parsed JSON) → `Observatory`.
 * Throws TimingInputError with a `{ path, message }` per problem.
 */
export function parseObservatory(json: unknown): Observatory {
  return parseOrThrow(observatoryFileSchema, json);
}

/**
 * An array of observatory objects → `Observatory[]`; paths are `[i].key`.
 * Throws TimingInputError listing every problem, including repeated codes.
 */
export function parseObservatoryList(json: unknown): Observatory[] {
  const list = parseOrThrow(z.array(observatoryFileSchema, { error: 'expected an array of observatory objects' }), json);
  const problems: EngineErrorDetail[] = [];
  const firstIndex = new Map<string, number>();
  list.forEach((site, i) => {
    const earlier = firstIndex.get(site.code);
    if (earlier === undefined) firstIndex.set(site.code, i);
    else problems.push({ path: `[${i}].code`, message: `duplicate code "${site.code}" (also [${earlier}])` });
  });
  if (problems.length > 0) throwInputProblems(problems);
  return list;
}

/**
 * The observatories the command line knows: built-ins, plus those of the JSON
 * file named by PULSEKEEPER_OBSERVATORIES when it is set.
 *
 * @param env  environment (default process.env)
 * @returns    code → observatory, built-ins first
 * Throws TimingInputError naming the file when it cannot be read, is not JSON,
 * fails validation, or repeats a built-in code.
 */
export function loadObservatories(env: NodeJS.ProcessEnv = process.env): Map<string, Observatory> {
  const sites = new Map<string, Observatory>();
  for (const site of builtinObservatories()) sites.set(site.code, site);
  const file = env[OBSERVATORIES_FILE_VARIABLE];
  if (file === undefined || file === '') return sites;
  const context = `${OBSERVATORIES_FILE_VARIABLE} file ${file}`;
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (error) {
    throw new TimingInputError(`${context}: cannot be read (${(error as NodeJS.ErrnoException).code ?? (error as Error).message})`);
  }
  let json: unknown;
  try {
    json = JSON.parse(text.charCodeAt(0) === 0xfeff ? text.slice(1) : text);
  } catch (error) {
    throw new TimingInputError(`${context}: not valid JSON (${(error as Error).message})`);
  }
  let list: Observatory[];
  try {
    list = parseObservatoryList(json);
  } catch (error) {
    if (error instanceof TimingInputError) throw new TimingInputError(`${context}: ${error.message}`, error.details);
    throw error;
  }
  const clashes: EngineErrorDetail[] = [];
  list.forEach((site, i) => {
    if (sites.has(site.code)) clashes.push({ path: `[${i}].code`, message: `"${site.code}" is a built-in observatory code` });
  });
  if (clashes.length > 0) throwInputProblems(clashes, context);
  for (const site of list) sites.set(site.code, site);
  return sites;
}
