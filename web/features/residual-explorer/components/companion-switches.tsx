import { Switch } from '../../model-editor/components/solve-switch';

export interface CompanionSummary {
  name: string;
  kind: string;
  enabled: boolean;
  periodDays: string;
}

/** A decimal for a label: at most 7 significant digits (the model keeps every digit). */
function shortNumber(text: string): string {
  const value = Number(text);
  return Number.isFinite(value) && text.replace(/[^0-9]/g, '').replace(/^0+/, '').length > 7 ? String(Number(value.toPrecision(7))) : text;
}

/** The companions of a model-file JSON, as the switches list them (missing keys shown as "?"). */
export function companionsOfModel(model: Record<string, unknown>): CompanionSummary[] {
  const list = Array.isArray(model.companions) ? (model.companions as Record<string, unknown>[]) : [];
  return list.map((c) => ({
    name: String(c.name ?? '?'),
    kind: String(c.kind ?? '?'),
    enabled: c.enabled !== false,
    periodDays: c.period_days === undefined ? '?' : shortNumber(String(c.period_days)),
  }));
}

/** A copy of `model` with companion `name` switched on or off (the rest untouched). */
export function withCompanionEnabled(model: Record<string, unknown>, name: string, enabled: boolean): Record<string, unknown> {
  const list = Array.isArray(model.companions) ? (model.companions as Record<string, unknown>[]) : [];
  return { ...model, companions: list.map((c) => (c.name === name ? { ...c, enabled } : c)) };
}

/**
 * One on/off switch per companion. Off puts the companion's delay back into the residuals (its
 * signature shows); on removes it again. Computed in the browser, no fit is queued.
 */
export function CompanionSwitches({
  model,
  onModelChange,
  previewMs,
}: {
  model: Record<string, unknown>;
  onModelChange(model: Record<string, unknown>): void;
  previewMs: number | null;
}) {
  const companions = companionsOfModel(model);
  return (
    <section aria-labelledby="companion-switches-title" className="flex flex-col gap-3">
      <h3 id="companion-switches-title" className="text-sm font-semibold text-night-100">
        Companions
      </h3>
      {companions.length === 0 ? (
        <p className="text-xs text-night-300">
          This model has no companion. A periodic pattern in the residuals may be one: look at the periodogram below and seed one from a
          peak.
        </p>
      ) : (
        <ul className="flex flex-col gap-2">
          {companions.map((c) => (
            <li key={c.name} className="flex items-center justify-between gap-3 rounded-md border border-night-700 bg-night-900 px-3 py-2">
              <span className="text-sm text-night-100">
                {c.name}
                <span className="ml-2 text-xs text-night-400">
                  {c.kind}, {c.periodDays} d
                </span>
              </span>
              <Switch
                checked={c.enabled}
                onChange={(enabled) => onModelChange(withCompanionEnabled(model, c.name, enabled))}
                label={`Companion ${c.name} in the model`}
                visibleLabel={c.enabled ? 'on' : 'off'}
              />
            </li>
          ))}
        </ul>
      )}
      {companions.length > 0 ? (
        <p className="text-xs text-night-400">
          Off: the residuals show the companion's delay. {previewMs === null ? '' : `Last preview took ${previewMs < 1 ? '<1' : Math.round(previewMs)} ms.`}
        </p>
      ) : null}
    </section>
  );
}
