/** The engine's model-file problems as API error details under `['model', …]`. */
import type { ErrorDetail } from '../../errors';
import type { EngineErrorDetail } from '../../../worker/timing/engine-error';

/** `companions[0].period_days` → ['companions', 0, 'period_days']; `offsets[wb-2]` keeps the name as a string. */
export function splitModelPath(path: string): (string | number)[] {
  const parts: (string | number)[] = [];
  for (const match of path.matchAll(/([^.[\]]+)|\[([^\]]*)\]/g)) {
    if (match[1] !== undefined) parts.push(match[1]);
    else parts.push(/^\d+$/.test(match[2]) ? Number(match[2]) : match[2]);
  }
  return parts;
}

export function modelErrorDetails(message: string, details: readonly EngineErrorDetail[]): ErrorDetail[] {
  if (details.length === 0) return [{ path: ['model'], message }];
  return details.map((d) => ({ path: ['model', ...splitModelPath(d.path ?? '')], message: d.message }));
}
