import { lazy, Suspense, useCallback, useMemo, useRef, useState } from 'react';
import type { ToaExclusion } from '../../../../api/contracts/toas';
import type { Companion } from '../../../../worker/timing/model/timing-model';
import { readModelFile } from '../../../../worker/timing/model/read-model-file';
import { Alert } from '../../../components/alert';
import { Card, CardTitle } from '../../../components/card';
import { LoadingPanel } from '../../../components/query-state';
import type { ExplorerData } from '../api/get-explorer-data';
import { useChangeExclusions, type ExclusionChange } from '../api/change-exclusions';
import { activeExcludedToaIds } from '../api/get-exclusions';
import { barycentricDaysOf, companionDelayCurve } from '../lib/companion-curve';
import { downloadText, fittedModelJson, residualsCsv } from '../lib/explorer-exports';
import { groupToas } from '../lib/explorer-groups';
import { explorerTraces, hoverDetails, usToTurns, Y_AXIS_TITLES, type ExplorerTrace } from '../lib/explorer-traces';
import { residualSummary } from '../lib/residual-summary';
import { fittedResidualsUs, prepareShownPreview, shownResiduals } from '../lib/shown-residuals';
import { X_AXIS_TITLES, xValues } from '../lib/x-quantities';
import { CompanionSwitches, companionsOfModel } from './companion-switches';
import { DelayComponentsTable, type DelayComponentsRow } from './delay-components-table';
import type { ImageFormat, PlotHandle } from './explorer-plot';
import { ExportActions } from './export-actions';
import { GroupToggles } from './group-toggles';
import { ParameterPanel } from './parameter-panel';
import { PeriodogramPanel } from './periodogram-panel';
import type { SeededCompanion } from '../lib/panels/companion-seed';
import { PlotControls, type PlotChoices } from './plot-controls';
import { RefitPanel } from './refit-panel';
import { SelectionActions } from './selection-actions';
import { SummaryLine } from './summary-line';

// React.lazy keeps Plotly (several MB) out of the page chunk until the plot is shown.
const ExplorerPlot = lazy(() => import('./explorer-plot'));

const CURVE_COLOUR = '#f5f7ff';

export interface ResidualExplorerProps {
  pulsarId: string;
  table: ExplorerData;
  /** The pulsar's exclusion history (null while it loads: the fit-time exclusions are shown). */
  exclusions: readonly ToaExclusion[] | null;
  canExclude: boolean;
  canRunFits: boolean;
  /** models:edit — saving the edited model as a revision (with fits:run, also "save and queue fit"). */
  canEditModels: boolean;
}

/** An undoable step: what was done, and the change that reverts it. */
interface AppliedChange {
  label: string;
  undo: ExclusionChange;
}

/**
 * `model` with a companion seeded from a periodogram peak appended, its period, projected
 * semi-major axis and epoch added to `solve_for` (a fit refines them; the panel's switches can change that).
 */
export function addSeededCompanion(model: Record<string, unknown>, companion: SeededCompanion): Record<string, unknown> {
  const companions = Array.isArray(model.companions) ? model.companions : [];
  const solveFor = Array.isArray(model.solve_for) ? (model.solve_for as string[]) : [];
  const added = ['period_days', 'projected_semimajor_axis_lt_s', 'periastron_epoch_mjd'].map((key) => `companions[${companion.name}].${key}`);
  return { ...model, companions: [...companions, companion], solve_for: [...solveFor, ...added.filter((p) => !solveFor.includes(p))] };
}

/** The names of companions enabled in `fitted` but off in `edited`. */
function companionsSwitchedOff(fitted: Record<string, unknown>, edited: Record<string, unknown>): string[] {
  const before = new Map(companionsOfModel(fitted).map((c) => [c.name, c.enabled]));
  return companionsOfModel(edited)
    .filter((c) => !c.enabled && before.get(c.name) !== false)
    .map((c) => c.name);
}

/**
 * The residual explorer of one fit: summary line, residual plot with its settings, selection
 * actions (exclude, include again, undo), companion switches with an instant preview, exports,
 * the delay chain of the selected TOAs and a fit queued with the current exclusions.
 */
export function ResidualExplorer({ pulsarId, table, exclusions, canExclude, canRunFits, canEditModels }: ResidualExplorerProps) {
  const [editedState, setEditedModel] = useState<Record<string, unknown>>(table.fittedModel);
  // An edit that ends where it began (a companion off, then on again) shows the fit itself again.
  const editedModel = useMemo(
    () => (editedState === table.fittedModel || JSON.stringify(editedState) === JSON.stringify(table.fittedModel) ? table.fittedModel : editedState),
    [editedState, table.fittedModel],
  );
  const [choices, setChoices] = useState<PlotChoices>(() => {
    const first = companionsOfModel(table.fittedModel)[0];
    return { x: 'mjd', y: 'us', groupBy: 'backend', companion: first?.name ?? '', showCurve: false };
  });
  const [selected, setSelected] = useState<ReadonlySet<number>>(new Set());
  const [hiddenGroups, setHiddenGroups] = useState<ReadonlySet<string>>(new Set());
  const [history, setHistory] = useState<AppliedChange[]>([]);
  const [queuedRunId, setQueuedRunId] = useState<number | null>(null);
  const plotHandle = useRef<PlotHandle | null>(null);
  const [plotReady, setPlotReady] = useState(false);
  const change = useChangeExclusions(pulsarId);

  // Exclusions in force now: from the history when loaded, else as they were at fit time.
  const excludedNow = useMemo(() => {
    const flags = new Uint8Array(table.count);
    if (exclusions === null) {
      table.excluded.forEach((e, i) => (flags[i] = e ? 1 : 0));
      return flags;
    }
    const ids = activeExcludedToaIds(exclusions);
    table.toaId.forEach((id, i) => (flags[i] = ids.has(id) ? 1 : 0));
    return flags;
  }, [exclusions, table]);
  const isExcluded = useCallback((i: number) => excludedNow[i] === 1, [excludedNow]);
  const exclusionsChanged = useMemo(() => table.excluded.some((e, i) => e !== (excludedNow[i] === 1)), [table, excludedNow]);

  const days = useMemo(() => barycentricDaysOf(table), [table]);
  const hover = useMemo(() => hoverDetails(table), [table]);
  const spinFrequencyHz = Number(table.spinFrequencyHz);
  const freeParameters = (Array.isArray(table.fittedModel.solve_for) ? table.fittedModel.solve_for.length : 0) + 1; // + the phase offset

  const fitted = useMemo(() => fittedResidualsUs(table), [table]);
  const prepared = useMemo(() => {
    try {
      return prepareShownPreview(table, excludedNow);
    } catch (e) {
      return e instanceof Error ? e : new Error(String(e));
    }
  }, [table, excludedNow]);
  const shown = useMemo(() => shownResiduals(table, fitted, prepared, editedModel), [table, fitted, prepared, editedModel]);
  const summary = useMemo(() => residualSummary(shown.residualUs, table.uncertaintyUs, isExcluded, freeParameters), [shown, table, isExcluded, freeParameters]);

  // Engine companions of the edited model (for orbital phase and the curve); null while it does not parse.
  const engineCompanions = useMemo<Companion[] | null>(() => {
    try {
      return readModelFile(editedModel).companions;
    } catch {
      return null;
    }
  }, [editedModel]);
  const companionNames = companionsOfModel(editedModel).map((c) => c.name);
  const chosenCompanion = engineCompanions?.find((c) => c.name === choices.companion) ?? engineCompanions?.[0] ?? null;

  const x = useMemo(
    () => xValues(choices.x, { mjd: table.mjd, frequencyMhz: table.frequencyMhz, uncertaintyUs: table.uncertaintyUs, barycentricDays: days }, chosenCompanion),
    [choices.x, table, days, chosenCompanion],
  );
  const groups = useMemo(() => groupToas(choices.groupBy === 'backend' ? table.backend : table.observatory, isExcluded), [choices.groupBy, table, isExcluded]);
  const revision = useRef(0);
  const traces = useMemo(() => {
    const list: ExplorerTrace[] = explorerTraces({
      groups,
      x,
      residualUs: shown.residualUs,
      uncertaintyUs: table.uncertaintyUs,
      yUnit: choices.y,
      spinFrequencyHz,
      hover,
      selected: selected.size > 0 ? selected : null,
      hidden: hiddenGroups,
    });
    if (choices.showCurve && chosenCompanion) {
      const curve = companionDelayCurve(chosenCompanion, days, choices.x);
      if (curve) {
        list.push({
          type: 'scatter',
          mode: 'lines',
          name: `Delay of ${chosenCompanion.name}`,
          x: curve.x,
          y: choices.y === 'turns' ? curve.yUs.map((v) => usToTurns(v, spinFrequencyHz)) : curve.yUs,
          line: { color: CURVE_COLOUR, width: 1.5, dash: 'dot' },
          hoverinfo: 'skip',
        });
      }
    }
    revision.current += 1;
    return list;
  }, [groups, x, shown, table, choices.y, choices.showCurve, choices.x, spinFrequencyHz, hover, selected, hiddenGroups, chosenCompanion, days]);
  const toggleGroup = useCallback(
    (name: string) =>
      setHiddenGroups((hidden) => {
        const next = new Set(hidden);
        if (next.has(name)) next.delete(name);
        else if (groups.some((g) => g.name !== name && !hidden.has(g.name))) next.add(name); // never hide the last group
        return next;
      }),
    [groups],
  );
  const isolateGroup = useCallback((name: string) => setHiddenGroups(new Set(groups.map((g) => g.name).filter((n) => n !== name))), [groups]);

  // The periodogram looks at the TOAs in use that have a residual, as shown (after toggles and edits).
  const periodogramInput = useMemo(() => {
    const used: number[] = [];
    for (let i = 0; i < table.count; i++) if (!isExcluded(i) && Number.isFinite(shown.residualUs[i])) used.push(i);
    return {
      tDays: Float64Array.from(used, (i) => days.hi[i] + days.lo[i]),
      residualUs: Float64Array.from(used, (i) => shown.residualUs[i]),
      uncertaintyUs: Float64Array.from(used, (i) => table.uncertaintyUs[i]),
    };
  }, [table, isExcluded, shown, days]);
  const seedCompanion = useCallback((companion: SeededCompanion) => {
    setEditedModel((model) => addSeededCompanion(model, companion));
    setChoices((c) => ({ ...c, companion: companion.name }));
  }, []);

  const selectedIndices = useMemo(() => [...selected].sort((a, b) => a - b), [selected]);
  const selectedExcludedCount = selectedIndices.filter(isExcluded).length;

  const apply = (step: ExclusionChange, label: string, undo: ExclusionChange | null) => {
    change.mutate(step, {
      onSuccess: () => {
        if (undo) setHistory((h) => [...h, { label, undo }]);
        setSelected(new Set());
      },
    });
  };
  const excludeSelected = (reason: string) => {
    const ids = selectedIndices.filter((i) => !isExcluded(i)).map((i) => table.toaId[i]);
    if (ids.length === 0) return;
    apply({ kind: 'exclude', toaIds: ids, reason }, `excluded ${ids.length} TOA${ids.length === 1 ? '' : 's'}`, { kind: 'restore', toaIds: ids });
  };
  const includeSelected = () => {
    const ids = selectedIndices.filter(isExcluded).map((i) => table.toaId[i]);
    if (ids.length === 0) return;
    const reasons = new Map((exclusions ?? []).filter((e) => e.restoredAt === null).map((e) => [e.toaId, e.reason]));
    const reason = reasons.get(ids[0]) ?? 'excluded again';
    apply({ kind: 'restore', toaIds: ids }, `included ${ids.length} TOA${ids.length === 1 ? '' : 's'} again`, {
      kind: 'exclude',
      toaIds: ids,
      reason: `undo of an inclusion: ${reason}`.slice(0, 500),
    });
  };
  const undoLast = () => {
    const last = history.at(-1);
    if (!last) return;
    change.mutate(last.undo, { onSuccess: () => setHistory((h) => h.slice(0, -1)) });
  };
  const selectRange = (lo: number, hi: number) => {
    const next = new Set<number>();
    for (let i = 0; i < x.length; i++) if (x[i] >= lo && x[i] <= hi) next.add(i);
    setSelected(next);
  };

  const onSelect = useCallback((indices: number[]) => setSelected(new Set(indices)), []);
  const onReady = useCallback((handle: PlotHandle | null) => {
    plotHandle.current = handle;
    setPlotReady(handle !== null);
  }, []);

  const baseName = `${String(table.fittedModel.pulsar ?? `pulsar-${table.pulsarId}`)}_fit-${table.fitRunId}`;
  const off = companionsSwitchedOff(table.fittedModel, editedModel);
  const previewNote =
    editedModel === table.fittedModel
      ? null
      : shown.error
        ? null
        : [
            `preview of the edited model${off.length ? ` (companion${off.length === 1 ? '' : 's'} ${off.join(', ')} off)` : ''}, not a fit`,
            shown.firstOrder.length ? `first order in ${shown.firstOrder.join(', ')}` : null,
            shown.notPreviewed.length ? `not shown until a fit: ${shown.notPreviewed.join(', ')}` : null,
          ]
            .filter(Boolean)
            .join('; ');

  const delayRows: DelayComponentsRow[] = selectedIndices.map((i) => ({
    toaId: table.toaId[i],
    mjd: table.mjd[i],
    clockS: table.delays.clockS[i],
    ttMinusUtcS: table.delays.ttMinusUtcS[i],
    tdbMinusTtS: table.delays.tdbMinusTtS[i],
    roemerS: table.delays.roemerS[i],
    shapiroS: table.delays.shapiroS[i],
    dispersionS: table.delays.dispersionS[i],
    companionsS: table.delays.companionsS[i],
  }));

  return (
    <div className="flex flex-col gap-4">
      <SummaryLine summary={summary} settings={table.settings} fitRunId={table.fitRunId} previewNote={previewNote} exclusionsChanged={exclusionsChanged} />
      {shown.error ? (
        <Alert tone="error" title="The edited model cannot be previewed">
          {shown.error} The fit's own residuals are shown.
        </Alert>
      ) : null}
      <div className="grid grid-cols-1 items-start gap-4 xl:grid-cols-[minmax(0,1fr)_20rem]">
        <div className="flex min-w-0 flex-col gap-4">
          <Card aria-label="Residual plot" className="flex flex-col gap-3 p-4">
            <PlotControls choices={choices} onChange={setChoices} companionNames={companionNames} />
            <Suspense fallback={<LoadingPanel label="Loading the plot…" />}>
              <ExplorerPlot
                traces={traces}
                xTitle={choices.x === 'orbital-phase' && chosenCompanion ? `Orbital phase of ${chosenCompanion.name} (turns)` : X_AXIS_TITLES[choices.x]}
                yTitle={Y_AXIS_TITLES[choices.y]}
                revision={revision.current}
                onSelect={onSelect}
                onReady={onReady}
                onLegendToggle={toggleGroup}
                onLegendIsolate={isolateGroup}
              />
            </Suspense>
            <GroupToggles groups={groups} hidden={hiddenGroups} onHiddenChange={setHiddenGroups} />
            <p className="text-xs text-night-400">
              Each {choices.groupBy} has its own colour and symbol; hollow grey points are excluded from fits. Click a legend entry (or a
              button above) to hide its group, double-click the entry to show only it. Drag to select TOAs (the lasso is in the plot's toolbar).
            </p>
            <SelectionActions
              selectedCount={selected.size}
              selectedExcludedCount={selectedExcludedCount}
              canExclude={canExclude}
              busy={change.isPending}
              error={change.error}
              undoLabel={history.at(-1)?.label ?? null}
              onExclude={excludeSelected}
              onInclude={includeSelected}
              onUndo={undoLast}
              onClear={() => setSelected(new Set())}
              onSelectRange={selectRange}
              xTitle={X_AXIS_TITLES[choices.x]}
            />
          </Card>
          <Card aria-labelledby="periodogram-title">
            <CardTitle>
              <span id="periodogram-title">Periodogram of the shown residuals</span>
            </CardTitle>
            <PeriodogramPanel
              tDays={periodogramInput.tDays}
              residualUs={periodogramInput.residualUs}
              uncertaintyUs={periodogramInput.uncertaintyUs}
              referenceMjd={table.referenceMjd}
              existingCompanionNames={companionNames}
              onSeedCompanion={seedCompanion}
            />
          </Card>
          <Card aria-labelledby="delay-chain-title">
            <CardTitle>
              <span id="delay-chain-title">Corrections of the selected TOAs</span>
            </CardTitle>
            <DelayComponentsTable rows={delayRows} />
          </Card>
        </div>
        <aside className="flex flex-col gap-4" aria-label="Model and actions">
          <Card className="p-4">
            <CompanionSwitches model={editedModel} onModelChange={setEditedModel} previewMs={shown.previewMs} />
          </Card>
          {canRunFits ? (
            <Card className="p-4">
              <RefitPanel pulsarId={pulsarId} revisionId={table.revisionId} queuedRunId={queuedRunId} onQueued={setQueuedRunId} />
            </Card>
          ) : null}
          <Card className="p-4">
            <ExportActions
              onImage={plotReady ? (format: ImageFormat) => plotHandle.current!.downloadImage(format, `${baseName}_residuals`) : null}
              onResidualsCsv={() =>
                downloadText(
                  `${baseName}_residuals.csv`,
                  residualsCsv(table, shown.residualUs, isExcluded, `residuals of fit ${table.fitRunId}${previewNote ? `, ${previewNote}` : ''}; µs`),
                  'text/csv',
                )
              }
              onFittedModel={() => downloadText(`${baseName}_fitted-model.json`, fittedModelJson(table), 'application/json')}
            />
          </Card>
          <Card className="p-4" aria-label="Parameters">
            <ParameterPanel
              pulsarId={Number(pulsarId)}
              explorer={table}
              editedModel={editedModel}
              onEditedModelChange={setEditedModel}
              canSave={canEditModels && canRunFits}
              onFitQueued={(run) => setQueuedRunId(run.id)}
            />
          </Card>
        </aside>
      </div>
    </div>
  );
}
