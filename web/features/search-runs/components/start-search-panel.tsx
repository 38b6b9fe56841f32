import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Input } from '../../../components/input';
import { describeError } from '../../../components/query-state';
import { Select } from '../../../components/select';
import { TextLink } from '../../../components/text-link';
import { paths } from '../../../config/paths';
import { isApiError } from '../../../lib/api-client';
import { formatDateTimeUtc } from '../../../lib/format';
import { CreateSearchRunBody, SEARCH_DEFAULTS } from '../../../../api/contracts/search-runs';
import type { Revision } from '../../revisions/api/get-revisions';
import { RevisionOptions } from '../../revisions/components/revision-options';
import type { SearchRun } from '../api/get-search-run';
import { useStartSearchRun } from '../api/start-search-run';

/** The optional numeric fields of the start form, in the contract's names. */
const NUMBER_FIELDS = ['minPeriodDays', 'maxPeriodDays', 'maxCompanions', 'falseAlarmThreshold', 'assumedPulsarMassSolar'] as const;
type NumberField = (typeof NUMBER_FIELDS)[number];
type FieldName = NumberField | 'revisionId';

const FIELD_LABELS: Record<FieldName, string> = {
  revisionId: 'Model revision',
  minPeriodDays: 'Shortest period (days)',
  maxPeriodDays: 'Longest period (days)',
  maxCompanions: 'Most companions',
  falseAlarmThreshold: 'False-alarm threshold',
  assumedPulsarMassSolar: 'Assumed pulsar mass (M☉)',
};

const FIELD_HINTS: Record<NumberField, string> = {
  minPeriodDays: 'Empty: twice the observing cadence.',
  maxPeriodDays: 'Empty: the span of the TOAs.',
  maxCompanions: `1–10; empty: ${SEARCH_DEFAULTS.maxCompanions}.`,
  falseAlarmThreshold: `A peak becomes a candidate only below this; empty: ${SEARCH_DEFAULTS.falseAlarmThreshold}.`,
  assumedPulsarMassSolar: `For the minimum companion masses; empty: ${SEARCH_DEFAULTS.assumedPulsarMassSolar}.`,
};

type Problems = Partial<Record<FieldName | 'form', string>>;

/** The contract's field names as they read inside a sentence. */
const FIELD_WORDS: Record<NumberField, string> = {
  minPeriodDays: 'the shortest period',
  maxPeriodDays: 'the longest period',
  maxCompanions: 'the most companions',
  falseAlarmThreshold: 'the false-alarm threshold',
  assumedPulsarMassSolar: 'the assumed pulsar mass',
};

/**
 * "minPeriodDays: must be > 0" → "must be > 0" (the field's label already names it); another
 * field named inside the message is written in words ("must be greater than the shortest period").
 */
function withoutFieldPrefix(message: string, field: string): string {
  const text = message.startsWith(`${field}: `) ? message.slice(field.length + 2) : message;
  return NUMBER_FIELDS.reduce((t, name) => t.replace(new RegExp(`\\b${name}\\b`, 'g'), FIELD_WORDS[name]), text);
}

function problemsFrom(issues: readonly { path: readonly PropertyKey[]; message: string }[]): Problems {
  const found: Problems = {};
  for (const issue of issues) {
    const field = String(issue.path[0] ?? '');
    if (field in FIELD_LABELS) found[field as FieldName] ??= withoutFieldPrefix(issue.message, field);
    else found.form ??= issue.message;
  }
  return found;
}

/**
 * Builds the request body from the form's text: an empty field is left out (the server's default
 * applies), anything else becomes a number — text that is no number stays NaN so the shared
 * schema rejects it with its own message.
 */
export function searchBodyFromForm(revisionId: number, text: Record<NumberField, string>): Record<string, unknown> {
  const body: Record<string, unknown> = { revisionId };
  for (const field of NUMBER_FIELDS) {
    const t = text[field].trim();
    if (t !== '') body[field] = Number(t);
  }
  return body;
}

/**
 * "Start a companion search" on a chosen revision, with the optional period range, number of
 * companions, false-alarm threshold and assumed pulsar mass. Checked with the API's own schema
 * before sending; server field errors land on the same fields. When identical inputs were
 * searched already (`reused: true`), the user opens that result or recomputes.
 */
export function StartSearchPanel({ pulsarId, revisions }: { pulsarId: string; revisions: Revision[] }) {
  const navigate = useNavigate();
  const start = useStartSearchRun(pulsarId);
  const [chosen, setChosen] = useState('');
  const revisionId = Number(chosen || revisions[0]?.id);
  const [text, setText] = useState<Record<NumberField, string>>({
    minPeriodDays: '',
    maxPeriodDays: '',
    maxCompanions: '',
    falseAlarmThreshold: '',
    assumedPulsarMassSolar: '',
  });
  const [problems, setProblems] = useState<Problems>({});
  const [queued, setQueued] = useState<SearchRun | null>(null);
  const [reused, setReused] = useState<SearchRun | null>(null);

  if (revisions.length === 0) {
    return <p className="text-sm text-night-300">Save a model revision first; a search starts from one.</p>;
  }

  const send = (recompute: boolean) => {
    setQueued(null);
    const parsed = CreateSearchRunBody.safeParse({ ...searchBodyFromForm(revisionId, text), ...(recompute ? { recompute: true } : {}) });
    if (!parsed.success) {
      setProblems(problemsFrom(parsed.error.issues));
      return;
    }
    setProblems({});
    start.mutate(parsed.data, {
      onSuccess: (answer) => {
        if (answer.reused) {
          setReused(answer.searchRun);
        } else {
          setReused(null);
          setQueued(answer.searchRun);
        }
      },
      onError: (error) => {
        const byField = isApiError(error) ? problemsFrom(error.details) : {};
        setProblems({ ...byField, form: byField.form ?? describeError(error) });
      },
    });
  };

  const numberField = (field: NumberField, inputMode: 'decimal' | 'numeric' = 'decimal') => (
    <Field key={field} label={FIELD_LABELS[field]} hint={FIELD_HINTS[field]} error={problems[field]}>
      {(control) => (
        <Input
          {...control}
          inputMode={inputMode}
          autoComplete="off"
          value={text[field]}
          onChange={(event) => setText((old) => ({ ...old, [field]: event.target.value }))}
        />
      )}
    </Field>
  );

  return (
    <form
      aria-label="Start a companion search"
      className="flex flex-col gap-4"
      noValidate
      onSubmit={(event) => {
        event.preventDefault();
        send(false);
      }}
    >
      <Field label={FIELD_LABELS.revisionId} error={problems.revisionId}>
        {(control) => (
          <Select
            {...control}
            value={String(revisionId)}
            onChange={(e) => {
              setChosen(e.target.value);
              setReused(null);
            }}
          >
            <RevisionOptions revisions={revisions} />
          </Select>
        )}
      </Field>
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        {numberField('minPeriodDays')}
        {numberField('maxPeriodDays')}
        {numberField('maxCompanions', 'numeric')}
        {numberField('falseAlarmThreshold')}
        {numberField('assumedPulsarMassSolar')}
      </div>
      <p className="text-xs text-night-400">
        The search fits the revision to the current TOAs, then repeatedly looks for the strongest periodic signal in the residuals and,
        while its false-alarm probability is below the threshold, adds a Keplerian companion and refits.
      </p>
      <div>
        <Button type="submit" busy={start.isPending && !reused}>
          Start search
        </Button>
      </div>
      {problems.form ? <Alert tone="error">{problems.form}</Alert> : null}
      {queued ? (
        <Alert tone="success">
          Search queued as <TextLink to={paths.searchRun.href(queued.id)}>search #{queued.id}</TextLink>.
        </Alert>
      ) : null}
      {reused ? (
        <div role="group" aria-label="Existing search" className="rounded-md border border-ember-500/50 bg-ember-500/10 px-4 py-3 text-sm text-night-100">
          <p className="font-semibold text-ember-200">These inputs were searched already</p>
          <p className="mt-1 text-night-200">
            Search #{reused.id} used the same revision, TOAs and options
            {reused.finishedAt ? ` and finished ${formatDateTimeUtc(reused.finishedAt)}` : ''}
            {reused.result ? `: ${reused.result.companionsFound} companion${reused.result.companionsFound === 1 ? '' : 's'} found` : ''}. Nothing was queued.
          </p>
          <div className="mt-3 flex flex-wrap gap-2">
            <Button size="sm" onClick={() => navigate(paths.searchRun.href(reused.id))}>
              Open existing result
            </Button>
            <Button size="sm" variant="secondary" busy={start.isPending} onClick={() => send(true)}>
              Search again anyway
            </Button>
          </div>
        </div>
      ) : null}
    </form>
  );
}
