/**
 * zod building blocks for the product's JSON files (docs/formats.md §2–3):
 * numeric fields that accept a number or a decimal string, high-precision
 * fields read losslessly from their text, and the translation of zod issues
 * into `{ path, message }` problems with paths written as in the docs
 * (`companions[0].period_dayz: unknown key`).
 */
import { z } from 'zod';
import type { DoubleDouble, Mjd } from '../time/epoch';
import { parseMjd } from '../time/mjd-string';
import type { EngineErrorDetail } from '../engine-error';
import { TimingInputError } from '../engine-error';
import { isDecimalNumberText, parseDecimalToDd } from './decimal-double-double';

export interface NumberRange {
  min?: number; // inclusive
  above?: number; // exclusive lower bound
  below?: number; // exclusive upper bound
  max?: number; // inclusive
  integer?: boolean;
}

/** JSON type name of a value, for messages. */
export function describeJsonType(value: unknown): string {
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'an array';
  if (typeof value === 'object') return 'an object';
  if (typeof value === 'string') return `the string "${value.length > 40 ? `${value.slice(0, 40)}…` : value}"`;
  return `${typeof value} ${String(value)}`;
}

function rangeProblem(x: number, range: NumberRange): string | null {
  if (range.integer === true && !Number.isInteger(x)) return `must be an integer (got ${x})`;
  if (range.min !== undefined && !(x >= range.min)) return `must be ≥ ${range.min} (got ${x})`;
  if (range.above !== undefined && !(x > range.above)) return `must be > ${range.above} (got ${x})`;
  if (range.max !== undefined && !(x <= range.max)) return `must be ≤ ${range.max} (got ${x})`;
  if (range.below !== undefined && !(x < range.below)) return `must be < ${range.below} (got ${x})`;
  return null;
}

type RefinementContext = z.core.$RefinementCtx<unknown>;

function numberText(value: unknown, ctx: RefinementContext): string | null {
  if (value === undefined) {
    ctx.addIssue({ code: 'custom', message: 'required key is missing' });
    return null;
  }
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) {
      ctx.addIssue({ code: 'custom', message: `must be finite (got ${value})` });
      return null;
    }
    return String(value);
  }
  if (typeof value === 'string') {
    if (!isDecimalNumberText(value)) {
      ctx.addIssue({ code: 'custom', message: `"${value}" is not a decimal number` });
      return null;
    }
    return value;
  }
  ctx.addIssue({ code: 'custom', message: `expected a number or a decimal string, got ${describeJsonType(value)}` });
  return null;
}

/** A float64 field: number or decimal string, checked against `range`. */
export function numberField(range: NumberRange = {}) {
  return z.unknown().transform((value, ctx): number => {
    const text = numberText(value, ctx);
    if (text === null) return z.NEVER;
    const x = Number(text);
    const problem = Number.isFinite(x) ? rangeProblem(x, range) : `"${text}" is out of the range of double precision`;
    if (problem !== null) {
      ctx.addIssue({ code: 'custom', message: problem });
      return z.NEVER;
    }
    return x;
  });
}

/** A double-double field read exactly from its text (decimal-double-double.ts). */
export function doubleDoubleField(range: NumberRange = {}) {
  return z.unknown().transform((value, ctx): DoubleDouble => {
    const text = numberText(value, ctx);
    if (text === null) return z.NEVER;
    let dd: DoubleDouble;
    try {
      dd = parseDecimalToDd(text);
    } catch (error) {
      ctx.addIssue({ code: 'custom', message: (error as Error).message });
      return z.NEVER;
    }
    const problem = rangeProblem(dd[1] + dd[0], range);
    if (problem !== null) {
      ctx.addIssue({ code: 'custom', message: problem });
      return z.NEVER;
    }
    return dd;
  });
}

/** An MJD field: plain decimal string (or number), read by parseMjd without a float64 step. */
export function mjdField() {
  return z.unknown().transform((value, ctx): Mjd => {
    const text = numberText(value, ctx);
    if (text === null) return z.NEVER;
    try {
      return parseMjd(text);
    } catch {
      ctx.addIssue({ code: 'custom', message: `"${text}" is not a plain decimal MJD (digits and an optional point, no exponent)` });
      return z.NEVER;
    }
  });
}

/** The value as a string, or null after an issue when it is missing or not a string. */
function requiredText(value: unknown, ctx: RefinementContext): string | null {
  if (value === undefined) {
    ctx.addIssue({ code: 'custom', message: 'required key is missing' });
    return null;
  }
  if (typeof value !== 'string') {
    ctx.addIssue({ code: 'custom', message: `expected a string, got ${describeJsonType(value)}` });
    return null;
  }
  return value;
}

/** A string field with a custom pattern and message. */
export function textField(pattern: RegExp, patternMessage: string) {
  return z.unknown().transform((value, ctx): string => {
    const text = requiredText(value, ctx);
    if (text === null) return z.NEVER;
    if (!pattern.test(text)) {
      ctx.addIssue({ code: 'custom', message: `"${text}" ${patternMessage}` });
      return z.NEVER;
    }
    return text;
  });
}

/** A text value converted by `parse` (which throws RangeError with a message naming the text). */
export function parsedTextField<T>(parse: (text: string) => T) {
  return z.unknown().transform((value, ctx): T => {
    const text = requiredText(value, ctx);
    if (text === null) return z.NEVER;
    try {
      return parse(text);
    } catch (error) {
      ctx.addIssue({ code: 'custom', message: (error as Error).message });
      return z.NEVER;
    }
  });
}

/** `companions[0].period_days` from zod's path array. */
export function formatIssuePath(path: readonly PropertyKey[]): string {
  let text = '';
  for (const key of path) {
    if (typeof key === 'number') text += `[${key}]`;
    else text += text === '' ? String(key) : `.${String(key)}`;
  }
  return text;
}

function joinPath(base: string, key: string): string {
  return base === '' ? key : `${base}.${key}`;
}

/** zod issues → one `{ path, message }` per problem (one per unknown key). */
export function issuesToDetails(issues: readonly z.core.$ZodIssue[]): EngineErrorDetail[] {
  const details: EngineErrorDetail[] = [];
  for (const issue of issues) {
    const path = formatIssuePath(issue.path);
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) details.push({ path: joinPath(path, key), message: 'unknown key' });
    } else if (issue.code === 'invalid_type') {
      const message = issue.input === undefined
        ? 'required key is missing'
        : `expected ${issue.expected === 'object' ? 'an object' : issue.expected === 'array' ? 'an array' : `a ${issue.expected}`}, got ${describeJsonType(issue.input)}`;
      details.push({ path, message });
    } else if (issue.code === 'invalid_union' && 'discriminator' in issue) {
      const options = (issue as unknown as { options: unknown[] }).options.map((o) => `"${String(o)}"`).join(', ');
      const input = (issue.input as Record<string, unknown> | undefined)?.[String(issue.discriminator)];
      details.push({ path, message: `${input === undefined ? 'required key is missing' : `unknown kind ${describeJsonType(input)}`}; one of ${options}` });
    } else {
      details.push({ path, message: issue.message });
    }
  }
  return details;
}

/** `path: message` of the first problem, plus "(and N more)". */
export function summarizeDetails(details: readonly EngineErrorDetail[]): string {
  const first = details[0];
  const head = first.path !== undefined && first.path !== '' ? `${first.path}: ${first.message}` : first.message;
  return details.length > 1 ? `${head} (and ${details.length - 1} more)` : head;
}

/** Throws one TimingInputError listing every problem, prefixed by `context` when given. */
export function throwInputProblems(details: readonly EngineErrorDetail[], context?: string): never {
  const summary = summarizeDetails(details);
  throw new TimingInputError(context === undefined ? summary : `${context}: ${summary}`, [...details]);
}

/** schema.safeParse with zod issues turned into a TimingInputError. */
export function parseOrThrow<S extends z.ZodType>(schema: S, json: unknown, context?: string): z.output<S> {
  const result = schema.safeParse(json, { reportInput: true });
  if (!result.success) throwInputProblems(issuesToDetails(result.error.issues), context);
  return result.data;
}
