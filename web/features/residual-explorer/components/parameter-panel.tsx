import { useId, useMemo, useState } from 'react';
import type { ExplorerTable } from '../../../../api/contracts/explorer';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Input } from '../../../components/input';
import { describeError } from '../../../components/query-state';
import { Spinner } from '../../../components/spinner';
import { TextLink } from '../../../components/text-link';
import { paths } from '../../../config/paths';
import { isApiError } from '../../../lib/api-client';
import { cn } from '../../../lib/cn';
import { useFitRun, type FitRun, type FittedParameter } from '../../fit-runs/api/get-fit-run';
import { useQueueFitRun } from '../../fit-runs/api/queue-fit-run';
import { formatUncertainty } from '../../fit-runs/lib/format-fit';
import { useCreateModelRevision } from '../../model-editor/api/create-model-revision';
import { SaveRevisionDialog } from '../../model-editor/components/save-revision-dialog';
import { Switch } from '../../model-editor/components/solve-switch';
import { modelFieldErrors, type ModelFieldError } from '../../model-editor/lib/server-field-errors';
import type { RevisionWithModel } from '../../revisions/api/get-revision';
import {
  companionNames,
  parameterGroups,
  solveForOf,
  textAt,
  valueAt,
  withoutCompanion,
  withSolveFor,
  withText,
  type ModelFileJson,
  type ParameterGroup,
  type ParameterSpec,
} from '../lib/panels/model-parameters';

export interface ParameterPanelProps {
  pulsarId: number;
  /** the fit being explored: its fitted model is the starting point, its run gives the uncertainties */
  explorer: ExplorerTable;
  /** the model being edited (model file JSON, docs/formats.md §2) */
  editedModel: ModelFileJson;
  /** every edit, reset or removal; the screen previews the residuals from it */
  onEditedModelChange(model: ModelFileJson): void;
  /** false hides "Save as revision" and "Queue fit" (roles without models:edit and fits:run); default true */
  canSave?: boolean;
  /** after a revision is saved (by either button) */
  onRevisionSaved?(revision: RevisionWithModel): void;
  /** after "Queue fit" queued a run (or found one with identical inputs: `reused`) */
  onFitQueued?(fitRun: FitRun, reused: boolean): void;
}

const NUMBER_TEXT = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?$/;

/** A typed value the preview cannot use, or undefined. Sexagesimal and blank optional values pass. */
function localProblem(spec: ParameterSpec, text: string): string | undefined {
  const trimmed = text.trim();
  if (trimmed === '') return spec.optional ? undefined : 'required';
  if (spec.path.endsWith('ra_hms') || spec.path.endsWith('dec_dms')) {
    return /^[-+]?\d{1,3}:\d{1,2}:\d{1,2}(?:\.\d+)?$/.test(trimmed) ? undefined : 'use the form dd:mm:ss.sss';
  }
  return NUMBER_TEXT.test(trimmed) ? undefined : 'not a number';
}

type Outcome =
  | { kind: 'saved'; revision: RevisionWithModel }
  | { kind: 'queued'; revision: RevisionWithModel; fitRun: FitRun; reused: boolean };

/**
 * The model's parameters grouped as spin, position, dispersion, each companion, offsets and noise:
 * each value editable as text (every digit kept), its fitted ± 1σ, and a "solve for" switch.
 * Edited values are marked and can be reset one by one or all at once. "Save as revision" and
 * "Queue fit" ask for a message; the second saves the revision and then queues a fit of it.
 */
export function ParameterPanel({ pulsarId, explorer, editedModel, onEditedModelChange, canSave = true, onRevisionSaved, onFitQueued }: ParameterPanelProps) {
  const titleId = useId();
  const baseline = explorer.fittedModel;
  const fitRun = useFitRun(String(explorer.fitRunId));
  const fitted = fitRun.data?.result?.parameters ?? {};
  const groups = useMemo(() => parameterGroups(editedModel), [editedModel]);
  const baselineCompanions = useMemo(() => new Set(companionNames(baseline)), [baseline]);
  const solveFor = useMemo(() => new Set(solveForOf(editedModel)), [editedModel]);
  const baselineSolveFor = useMemo(() => new Set(solveForOf(baseline)), [baseline]);
  const [dialog, setDialog] = useState<'save' | 'queue' | null>(null);
  const [dialogError, setDialogError] = useState<string | null>(null);
  const [serverErrors, setServerErrors] = useState<ModelFieldError[]>([]);
  const [outcome, setOutcome] = useState<Outcome | null>(null);
  const create = useCreateModelRevision(String(pulsarId));
  const queue = useQueueFitRun(String(pulsarId));
  const busy = create.isPending || queue.isPending;

  const changedPaths = groups.flatMap((g) => g.parameters.filter((p) => textAt(editedModel, p.path) !== textAt(baseline, p.path)).map((p) => p.path));
  const solveChanges = [...solveFor].filter((p) => !baselineSolveFor.has(p)).length + [...baselineSolveFor].filter((p) => !solveFor.has(p)).length;
  const addedCompanions = companionNames(editedModel).filter((n) => !baselineCompanions.has(n));
  const removedCompanions = [...baselineCompanions].filter((n) => !companionNames(editedModel).includes(n));
  const editCount = changedPaths.length + solveChanges + removedCompanions.length;

  const edit = (spec: ParameterSpec, text: string) => {
    try {
      onEditedModelChange(withText(editedModel, spec.path, text, spec.optional));
    } catch (error) {
      // Only a path the model lacks (a list changed under the input); the next render drops the row.
      if (!(error instanceof RangeError)) throw error;
    }
  };
  const resetOne = (spec: ParameterSpec) => {
    const original = valueAt(baseline, spec.path);
    onEditedModelChange(withText(editedModel, spec.path, original === undefined ? '' : textAt(baseline, spec.path), original === undefined || spec.optional));
  };

  const submit = async (message: string) => {
    setDialogError(null);
    let revision: RevisionWithModel;
    try {
      revision = await create.mutateAsync({ model: editedModel, message, parentId: explorer.revisionId });
    } catch (error) {
      if (isApiError(error) && error.details.length > 0) {
        const found = modelFieldErrors(error.details);
        if (found.every((e) => e.field === 'message')) {
          setDialogError(found.map((e) => e.message).join(' '));
          return;
        }
        setServerErrors(found);
        setDialog(null);
        return;
      }
      setDialogError(describeError(error));
      return;
    }
    setServerErrors([]);
    onRevisionSaved?.(revision);
    if (dialog !== 'queue') {
      setDialog(null);
      setOutcome({ kind: 'saved', revision });
      return;
    }
    try {
      const answer = await queue.mutateAsync({ revisionId: revision.id });
      setDialog(null);
      setOutcome({ kind: 'queued', revision, fitRun: answer.fitRun, reused: answer.reused });
      onFitQueued?.(answer.fitRun, answer.reused);
    } catch (error) {
      setDialog(null);
      setOutcome({ kind: 'saved', revision });
      setDialogError(null);
      setServerErrors([{ field: 'fit', message: `Revision #${revision.id} was saved, but the fit was not queued: ${describeError(error)}` }]);
    }
  };

  return (
    <section aria-labelledby={titleId} className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <div>
          <h2 id={titleId} className="text-base font-semibold text-night-100">
            Parameters
          </h2>
          <p className="text-xs text-night-400" aria-live="polite">
            Starting from fit run #{explorer.fitRunId} (revision #{explorer.revisionId}).{' '}
            {editCount === 0 && addedCompanions.length === 0
              ? 'No edits yet: change a value to preview its residuals.'
              : `${editCount} ${editCount === 1 ? 'edit' : 'edits'}${addedCompanions.length > 0 ? `, ${addedCompanions.length} new ${addedCompanions.length === 1 ? 'companion' : 'companions'}` : ''} (previewed, not saved).`}
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          <Button variant="ghost" size="sm" disabled={editCount === 0 && addedCompanions.length === 0} onClick={() => onEditedModelChange(structuredClone(baseline))}>
            Reset all edits
          </Button>
          {canSave ? (
            <>
              <Button variant="secondary" size="sm" onClick={() => { setDialogError(null); setDialog('save'); }}>
                Save as revision
              </Button>
              <Button size="sm" onClick={() => { setDialogError(null); setDialog('queue'); }}>
                Queue fit
              </Button>
            </>
          ) : null}
        </div>
      </div>
      {!canSave ? <p className="text-xs text-night-400">Your role can preview edits here; saving a revision or queueing a fit needs an analyst.</p> : null}

      {fitRun.isPending ? <Spinner size="sm" label="Loading the fitted uncertainties…" /> : null}
      {fitRun.isError ? (
        <Alert tone="error" title="Could not load the fitted uncertainties">
          {describeError(fitRun.error)}{' '}
          <Button variant="secondary" size="sm" className="ml-2" onClick={() => void fitRun.refetch()}>
            Try again
          </Button>
        </Alert>
      ) : null}

      {serverErrors.length > 0 ? (
        <Alert tone="error" title={`Not saved: ${serverErrors.length} ${serverErrors.length === 1 ? 'problem' : 'problems'}`}>
          <ul aria-label="Problems in the model" className="mt-1 list-disc pl-5">
            {serverErrors.map((e, i) => (
              <li key={i}>
                {e.field && e.field !== 'fit' ? <span className="font-mono">{e.field}: </span> : null}
                {e.message}
              </li>
            ))}
          </ul>
        </Alert>
      ) : null}
      {outcome ? <OutcomeNote outcome={outcome} /> : null}

      {groups.map((group) => (
        <GroupSection
          key={group.id}
          group={group}
          isNew={group.item !== undefined && group.id.startsWith('companion:') && !baselineCompanions.has(group.item)}
          editedModel={editedModel}
          baseline={baseline}
          fitted={fitted}
          solveFor={solveFor}
          onEdit={edit}
          onReset={resetOne}
          onSolve={(spec, solve) => onEditedModelChange(withSolveFor(editedModel, spec.path, solve))}
          onRemoveCompanion={(name) => onEditedModelChange(withoutCompanion(editedModel, name))}
        />
      ))}
      {removedCompanions.length > 0 ? (
        <p className="text-xs text-night-300">Removed from the edited model: companion {removedCompanions.join(', ')} (“Reset all edits” brings it back).</p>
      ) : null}

      {dialog ? (
        <SaveRevisionDialog
          title={dialog === 'queue' ? 'Save and queue a fit' : 'Save as a new revision'}
          description={
            dialog === 'queue'
              ? 'The edited model is saved as a new revision (revisions never change), then a fit of it is queued with the current TOA selection.'
              : 'The edited model is saved as a new revision; revisions never change. No fit is started.'
          }
          hint="For example: added companion c from the periodogram, freed its period"
          submitLabel={dialog === 'queue' ? 'Save and queue fit' : 'Save revision'}
          busy={busy}
          error={dialogError}
          onSave={(message) => void submit(message)}
          onClose={() => setDialog(null)}
        />
      ) : null}
    </section>
  );
}

function OutcomeNote({ outcome }: { outcome: Outcome }) {
  if (outcome.kind === 'saved') return <Alert tone="success">Saved as revision #{outcome.revision.id}.</Alert>;
  const run = outcome.fitRun;
  return (
    <Alert tone="success">
      Saved as revision #{outcome.revision.id}.{' '}
      {outcome.reused ? (
        <>
          These inputs were fitted already: <TextLink to={paths.fitRun.href(String(run.id))}>run #{run.id}</TextLink> (nothing new was queued).
        </>
      ) : (
        <>
          Fit queued as <TextLink to={paths.fitRun.href(String(run.id))}>run #{run.id}</TextLink>; open it in the explorer when it has finished.
        </>
      )}
    </Alert>
  );
}

function GroupSection({
  group,
  isNew,
  editedModel,
  baseline,
  fitted,
  solveFor,
  onEdit,
  onReset,
  onSolve,
  onRemoveCompanion,
}: {
  group: ParameterGroup;
  isNew: boolean;
  editedModel: ModelFileJson;
  baseline: ModelFileJson;
  fitted: Record<string, FittedParameter>;
  solveFor: ReadonlySet<string>;
  onEdit(spec: ParameterSpec, text: string): void;
  onReset(spec: ParameterSpec): void;
  onSolve(spec: ParameterSpec, solve: boolean): void;
  onRemoveCompanion(name: string): void;
}) {
  const isCompanion = group.id.startsWith('companion:');
  // Optional values the fitted model leaves unset and unsolved sit behind "More values", keeping the
  // column short. Decided from a fixed reference, so a row never moves (and loses focus) while typed in.
  // A companion new in the edited model (seeded) is judged by its values when it appeared.
  const [reference] = useState(() => (isNew ? editedModel : baseline));
  const referenceSolveFor = solveForOf(reference);
  const unset = (spec: ParameterSpec) => spec.optional && textAt(reference, spec.path) === '' && !referenceSolveFor.includes(spec.path);
  const main = group.parameters.filter((spec) => !unset(spec));
  const more = group.parameters.filter(unset);
  const row = (spec: ParameterSpec) => (
    <ParameterRow
      key={spec.path}
      spec={spec}
      suffix={isCompanion ? `, companion ${group.item}` : ''}
      text={textAt(editedModel, spec.path)}
      original={textAt(baseline, spec.path)}
      isNewItem={isNew}
      fitted={fitted[spec.path]}
      solve={solveFor.has(spec.path)}
      onEdit={(text) => onEdit(spec, text)}
      onReset={() => onReset(spec)}
      onSolve={(solve) => onSolve(spec, solve)}
    />
  );
  return (
    <details open className="rounded-lg border border-night-700 bg-night-900/60" aria-label={group.title}>
      <summary className="cursor-pointer rounded-lg px-3 py-2 text-sm font-semibold text-night-100 focus-ring">
        {group.title}
        {isNew ? <span className="ml-2 rounded-full border border-ember-400/70 px-2 text-xs font-medium text-ember-200">new, not fitted yet</span> : null}
      </summary>
      <div className="flex flex-col divide-y divide-night-800 px-3 pb-2">
        {group.parameters.length === 0 ? <p className="py-2 text-xs text-night-400">No values this screen can edit for this kind.</p> : null}
        {main.map(row)}
        {more.length > 0 ? (
          <details className="py-2" open={more.some((spec) => textAt(editedModel, spec.path) !== '' || solveFor.has(spec.path)) || undefined}>
            <summary className="cursor-pointer rounded text-xs font-medium text-night-300 focus-ring">
              More values ({more.length}, not set in the fit): {more.map((spec) => spec.label).join(', ')}
            </summary>
            <div className="flex flex-col divide-y divide-night-800">{more.map(row)}</div>
          </details>
        ) : null}
        {isCompanion && group.item !== undefined ? (
          <div className="pt-2">
            <Button variant="ghost" size="sm" onClick={() => onRemoveCompanion(group.item!)}>
              Remove companion {group.item}
            </Button>
          </div>
        ) : null}
      </div>
    </details>
  );
}

function ParameterRow({
  spec,
  suffix,
  text,
  original,
  isNewItem,
  fitted,
  solve,
  onEdit,
  onReset,
  onSolve,
}: {
  spec: ParameterSpec;
  suffix: string;
  text: string;
  original: string;
  isNewItem: boolean;
  fitted: FittedParameter | undefined;
  solve: boolean;
  onEdit(text: string): void;
  onReset(): void;
  onSolve(solve: boolean): void;
}) {
  const changed = !isNewItem && text !== original;
  const problem = localProblem(spec, text);
  const label = `${spec.label}${suffix}`;
  return (
    <div className={cn('flex flex-col gap-1.5 py-2', changed && '-mx-3 border-l-2 border-ember-400 bg-ember-500/5 px-3')}>
      <Field
        label={`${label} (${spec.unit})`}
        error={problem}
        hint={
          <>
            {fitted ? (
              <span className="font-mono tabular-nums">
                fitted ± {formatUncertainty(fitted.uncertainty)} {fitted.unit}
              </span>
            ) : (
              <span>{!spec.solvable ? 'setting, not fitted' : isNewItem ? 'new: fit it to get an uncertainty' : 'not fitted in this run'}</span>
            )}
            {changed ? (
              <span className="ml-2 text-ember-200">
                edited — was <span className="font-mono">{original === '' ? 'not set' : original}</span>
              </span>
            ) : null}
          </>
        }
      >
        {(control) => (
          <Input
            {...control}
            className="h-8 font-mono"
            inputMode="decimal"
            spellCheck={false}
            autoComplete="off"
            placeholder={spec.optional ? 'not set (0)' : undefined}
            value={text}
            onChange={(event) => onEdit(event.target.value)}
          />
        )}
      </Field>
      <div className="flex flex-wrap items-center gap-2">
        {spec.solvable ? <Switch checked={solve} onChange={onSolve} label={`Solve for ${label}`} visibleLabel="solve" /> : null}
        {changed ? (
          <Button variant="ghost" size="sm" className="h-7 px-2" onClick={onReset} aria-label={`Reset ${label}`}>
            Reset
          </Button>
        ) : null}
      </div>
    </div>
  );
}
