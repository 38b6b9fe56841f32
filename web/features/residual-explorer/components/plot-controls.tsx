import { useId } from 'react';
import { Select } from '../../../components/select';
import { GROUP_BY_OPTIONS, type GroupBy } from '../lib/explorer-groups';
import { Y_UNIT_LABELS, Y_UNITS, type YUnit } from '../lib/explorer-traces';
import { X_QUANTITIES, X_QUANTITY_LABELS, type XQuantity } from '../lib/x-quantities';
import { CURVE_X_QUANTITIES } from '../lib/companion-curve';

export interface PlotChoices {
  x: XQuantity;
  y: YUnit;
  groupBy: GroupBy;
  /** The companion used for orbital phase and the delay curve ('' = none). */
  companion: string;
  showCurve: boolean;
}

const GROUP_LABELS: Record<GroupBy, string> = { backend: 'Backend', observatory: 'Observatory' };

function LabelledSelect({ label, value, onChange, children, disabled }: { label: string; value: string; onChange(value: string): void; children: React.ReactNode; disabled?: boolean }) {
  const id = useId();
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label htmlFor={id} className="text-xs font-medium text-night-300">
        {label}
      </label>
      <Select id={id} value={value} disabled={disabled} onChange={(event) => onChange(event.target.value)} className="h-9">
        {children}
      </Select>
    </div>
  );
}

/** What goes on the axes, how TOAs are grouped, and the companion whose phase or delay curve is drawn. */
export function PlotControls({ choices, onChange, companionNames }: { choices: PlotChoices; onChange(choices: PlotChoices): void; companionNames: string[] }) {
  const curveId = useId();
  const set = <K extends keyof PlotChoices>(key: K, value: PlotChoices[K]) => onChange({ ...choices, [key]: value });
  const needsCompanion = choices.x === 'orbital-phase' || choices.showCurve;
  const curvePossible = CURVE_X_QUANTITIES.has(choices.x) && companionNames.length > 0;
  return (
    <div role="group" aria-label="Plot settings" className="grid grid-cols-2 items-end gap-3 md:grid-cols-5">
      <LabelledSelect label="Horizontal axis" value={choices.x} onChange={(v) => set('x', v as XQuantity)}>
        {X_QUANTITIES.map((q) => (
          <option key={q} value={q} disabled={q === 'orbital-phase' && companionNames.length === 0}>
            {X_QUANTITY_LABELS[q]}
          </option>
        ))}
      </LabelledSelect>
      <LabelledSelect label="Residuals in" value={choices.y} onChange={(v) => set('y', v as YUnit)}>
        {Y_UNITS.map((u) => (
          <option key={u} value={u}>
            {Y_UNIT_LABELS[u]}
          </option>
        ))}
      </LabelledSelect>
      <LabelledSelect label="Colour and symbol by" value={choices.groupBy} onChange={(v) => set('groupBy', v as GroupBy)}>
        {GROUP_BY_OPTIONS.map((g) => (
          <option key={g} value={g}>
            {GROUP_LABELS[g]}
          </option>
        ))}
      </LabelledSelect>
      <LabelledSelect label="Companion for phase and curve" value={choices.companion} onChange={(v) => set('companion', v)} disabled={companionNames.length === 0}>
        {companionNames.length === 0 ? <option value="">(model has none)</option> : null}
        {companionNames.map((name) => (
          <option key={name} value={name}>
            {name}
          </option>
        ))}
      </LabelledSelect>
      <label htmlFor={curveId} className="flex h-9 items-center gap-2 text-sm text-night-200">
        <input
          id={curveId}
          type="checkbox"
          className="size-4 accent-ember-500 focus-ring"
          checked={choices.showCurve && curvePossible}
          disabled={!curvePossible}
          onChange={(event) => set('showCurve', event.target.checked)}
        />
        Draw its delay curve
      </label>
      {needsCompanion && companionNames.length === 0 ? (
        <p className="col-span-full text-xs text-night-400">Orbital phase and delay curves need a companion in the model.</p>
      ) : null}
    </div>
  );
}
