/**
 * What changed between two timing-model JSON documents (docs/formats.md §2), as a flat list of
 * paths in the model file's own path syntax: dotted keys, `[k]` for an array index, `[name]` for
 * an array item that carries a `name` or `backend` (companions, offsets, noise).
 *
 * Notes:
 * 1. Numbers are compared as decimal values, not as text or through a float: the format allows a
 *    number or a string for any numeric field, so `0` and `"0"`, or `"41.30"` and `41.3`, are the
 *    same value, while two 20-digit strings that one double cannot tell apart still differ.
 * 2. `solve_for` is a set of paths; its changes are reported per entry as added or removed.
 * 3. A whole object or array that appears or disappears is one change at its own path.
 */

export type ModelChangeKind = 'added' | 'removed' | 'changed';

export interface ModelChange {
  path: string;
  kind: ModelChangeKind;
  /** JSON text of the old value; null when added. */
  before: string | null;
  /** JSON text of the new value; null when removed. */
  after: string | null;
}

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };

const DECIMAL = /^([+-]?)(\d*)(?:\.(\d*))?(?:[eE]([+-]?\d+))?$/;

/** A decimal number as sign, significant digits and exponent, or null when `value` is not a number (Note 1). */
export function canonicalDecimal(value: unknown): string | null {
  const text = typeof value === 'number' ? (Number.isFinite(value) ? String(value) : null) : typeof value === 'string' ? value.trim() : null;
  if (text === null) return null;
  const match = DECIMAL.exec(text);
  if (!match || (match[2] === '' && (match[3] ?? '') === '')) return null;
  const [, sign, whole, fraction = '', exponent = '0'] = match;
  let digits = whole + fraction;
  let exp = Number(exponent) - fraction.length; // value = digits × 10^exp
  const leading = /^0*/.exec(digits)![0].length;
  digits = digits.slice(leading);
  if (digits === '') return '0';
  const trailing = /0*$/.exec(digits)![0].length;
  digits = digits.slice(0, digits.length - trailing);
  exp += trailing;
  return `${sign === '-' ? '-' : ''}${digits}e${exp}`;
}

function sameLeaf(a: Json, b: Json): boolean {
  const da = canonicalDecimal(a);
  const db = canonicalDecimal(b);
  if (da !== null && db !== null) return da === db;
  return a === b;
}

const isObject = (v: Json | undefined): v is { [key: string]: Json } => typeof v === 'object' && v !== null && !Array.isArray(v);

/** The name an array item is known by (`name`, else `backend`), or null. */
function itemKey(item: Json): string | null {
  if (!isObject(item)) return null;
  if (typeof item.name === 'string') return item.name;
  if (typeof item.backend === 'string') return item.backend;
  return null;
}

const show = (v: Json): string => JSON.stringify(v);

function childPath(parent: string, key: string): string {
  return parent === '' ? key : `${parent}.${key}`;
}

function diffArrays(path: string, before: Json[], after: Json[], out: ModelChange[]): void {
  const keysBefore = before.map(itemKey);
  const keysAfter = after.map(itemKey);
  const keyed =
    before.length + after.length > 0 &&
    [...keysBefore, ...keysAfter].every((k) => k !== null) &&
    new Set(keysBefore).size === keysBefore.length &&
    new Set(keysAfter).size === keysAfter.length;
  if (keyed) {
    const byKeyAfter = new Map(after.map((item, i) => [keysAfter[i]!, item]));
    const byKeyBefore = new Map(before.map((item, i) => [keysBefore[i]!, item]));
    for (const [key, item] of byKeyBefore) diffValues(`${path}[${key}]`, item, byKeyAfter.get(key), out);
    for (const [key, item] of byKeyAfter) if (!byKeyBefore.has(key)) diffValues(`${path}[${key}]`, undefined, item, out);
    return;
  }
  for (let i = 0; i < Math.max(before.length, after.length); i++) {
    diffValues(`${path}[${i}]`, i < before.length ? before[i] : undefined, i < after.length ? after[i] : undefined, out);
  }
}

function diffSolveFor(path: string, before: Json, after: Json, out: ModelChange[]): boolean {
  if (!Array.isArray(before) || !Array.isArray(after)) return false;
  if (![...before, ...after].every((v) => typeof v === 'string')) return false;
  const was = new Set(before as string[]);
  const now = new Set(after as string[]);
  for (const entry of was) if (!now.has(entry)) out.push({ path, kind: 'removed', before: show(entry), after: null });
  for (const entry of now) if (!was.has(entry)) out.push({ path, kind: 'added', before: null, after: show(entry) });
  return true;
}

function diffValues(path: string, before: Json | undefined, after: Json | undefined, out: ModelChange[]): void {
  if (before === undefined && after === undefined) return;
  if (before === undefined) {
    out.push({ path, kind: 'added', before: null, after: show(after!) });
    return;
  }
  if (after === undefined) {
    out.push({ path, kind: 'removed', before: show(before), after: null });
    return;
  }
  if (path === 'solve_for' && diffSolveFor(path, before, after, out)) return;
  if (isObject(before) && isObject(after)) {
    for (const key of Object.keys(before)) diffValues(childPath(path, key), before[key], after[key], out);
    for (const key of Object.keys(after)) if (!(key in before)) diffValues(childPath(path, key), undefined, after[key], out);
    return;
  }
  if (Array.isArray(before) && Array.isArray(after)) {
    diffArrays(path, before, after, out);
    return;
  }
  if (isObject(before) || isObject(after) || Array.isArray(before) || Array.isArray(after)) {
    out.push({ path, kind: 'changed', before: show(before), after: show(after) });
    return;
  }
  if (!sameLeaf(before, after)) out.push({ path, kind: 'changed', before: show(before), after: show(after) });
}

/**
 * Every change from model `before` to model `after`, in the order of `before`'s keys with
 * additions after them (Notes 1–3). Identical models give an empty list.
 *
 * @param before  the older model file, parsed JSON
 * @param after   the newer model file, parsed JSON
 */
export function modelDiff(before: unknown, after: unknown): ModelChange[] {
  const out: ModelChange[] = [];
  diffValues('', before as Json, after as Json, out);
  return out.map((c) => (c.path === '' ? { ...c, path: '(whole model)' } : c));
}
