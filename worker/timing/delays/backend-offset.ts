/**
 * Per-backend time offsets (docs/formats.md §2: `seconds` is how late that
 * backend's arrival times are relative to the others; it is subtracted).
 */
import type { BackendOffset } from '../model/timing-model';

/**
 * Offset in seconds for each backend named in the model (absent backends: 0).
 *
 * @param offsets  the model's offsets
 * @returns        map backend → seconds to subtract from that backend's arrival times
 */
export function backendOffsetsS(offsets: readonly BackendOffset[]): Map<string, number> {
  const byBackend = new Map<string, number>();
  for (const offset of offsets) byBackend.set(offset.backend, offset.seconds);
  return byBackend;
}
