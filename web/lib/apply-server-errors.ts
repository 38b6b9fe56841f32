import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { isApiError } from './api-client';

/**
 * Puts an API error onto a react-hook-form form: each `details[]` issue whose path names one of
 * `fields` lands on that field (`setError(path)`); everything else becomes `root.server`.
 * Returns true when at least one issue landed on a field.
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fields: readonly Path<T>[],
  fallbackMessage: (error: unknown) => string,
): boolean {
  let placed = false;
  const leftover: string[] = [];
  if (isApiError(error) && error.details.length > 0) {
    for (const issue of error.details) {
      const name = issue.path.join('.');
      if ((fields as readonly string[]).includes(name)) {
        setError(name as Path<T>, { type: 'server', message: issue.message });
        placed = true;
      } else if ((fields as readonly string[]).includes(String(issue.path[0]))) {
        setError(String(issue.path[0]) as Path<T>, { type: 'server', message: issue.message });
        placed = true;
      } else {
        leftover.push(issue.path.length ? `${name}: ${issue.message}` : issue.message);
      }
    }
  }
  if (!placed || leftover.length > 0) {
    const message = leftover.length > 0 ? leftover.join(' ') : fallbackMessage(error);
    setError('root.server' as Path<T>, { type: 'server', message });
  }
  return placed;
}
