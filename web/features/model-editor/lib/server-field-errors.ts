/** One problem the server reported about the saved model, keyed by the form field it belongs to. */
export interface ModelFieldError {
  /** The field key, e.g. `spin.frequency_hz`, `companions.0.period_days`, `offsets.1.seconds`. */
  field: string;
  message: string;
}

/**
 * The editor's key for a model path: parts joined with dots, array indexes as numbers, whether the
 * server split `companions[0].period_days` into parts or sent parts of it still joined.
 */
export function fieldKeyOf(path: readonly (string | number)[]): string {
  return path
    .map(String)
    .join('.')
    .replace(/\[(\d+)\]/g, '.$1')
    .replace(/^\.+/, '');
}

/**
 * Server `details` (docs/api-workflow.md: paths start with 'model') → field errors. Details outside
 * the model (e.g. `message`) keep their own key so they still show in the list at the top.
 */
export function modelFieldErrors(details: readonly { path: readonly (string | number)[]; message: string }[]): ModelFieldError[] {
  return details.map((d) => ({
    field: d.path[0] === 'model' ? fieldKeyOf(d.path.slice(1)) : fieldKeyOf(d.path),
    message: d.message,
  }));
}

/** First message per field, for showing beside the field. */
export function errorsByField(errors: readonly ModelFieldError[]): Record<string, string> {
  const byField: Record<string, string> = {};
  for (const e of errors) byField[e.field] ??= e.message;
  return byField;
}
