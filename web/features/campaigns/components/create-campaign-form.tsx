import { useState } from 'react';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Input } from '../../../components/input';
import { describeError } from '../../../components/query-state';
import { isApiError } from '../../../lib/api-client';
import { useCreateCampaign, type CreateCampaignBody } from '../api/create-campaign';
import type { Campaign } from '../api/get-campaigns';

export interface PulsarChoice {
  id: number | string;
  name: string;
}

const MAX_NAME_LENGTH = 120; // docs/api-workflow.md: name 1–120 characters

function Radio({ name, value, checked, onChange, children }: { name: string; value: string; checked: boolean; onChange: () => void; children: string }) {
  return (
    <label className="flex items-center gap-2 text-sm text-night-100">
      <input type="radio" name={name} value={value} checked={checked} onChange={onChange} className="accent-ember-500" />
      {children}
    </label>
  );
}

/** The "new campaign" form: name, all pulsars or a checklist, which revision, e-mail when done. */
export function CreateCampaignForm({
  pulsars,
  pulsarsLoading,
  onCreated,
}: {
  pulsars: PulsarChoice[];
  pulsarsLoading: boolean;
  onCreated: (campaign: Campaign) => void;
}) {
  const create = useCreateCampaign();
  const [name, setName] = useState('');
  const [scope, setScope] = useState<'all' | 'chosen'>('all');
  const [chosen, setChosen] = useState<ReadonlySet<number>>(new Set());
  const [revisionChoice, setRevisionChoice] = useState<CreateCampaignBody['revisionChoice']>('released');
  const [notifyMe, setNotifyMe] = useState(true);
  const [problems, setProblems] = useState<{ name?: string; pulsars?: string; other?: string }>({});

  const toggle = (id: number) =>
    setChosen((old) => {
      const next = new Set(old);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });

  const submit = () => {
    const found: typeof problems = {};
    const trimmed = name.trim();
    if (trimmed.length === 0) found.name = 'Name: give the campaign a name.';
    else if (trimmed.length > MAX_NAME_LENGTH) found.name = `Name: at most ${MAX_NAME_LENGTH} characters.`;
    if (scope === 'chosen' && chosen.size === 0) found.pulsars = 'Pulsars: choose at least one, or take all.';
    setProblems(found);
    if (found.name || found.pulsars) return;
    const body: CreateCampaignBody = {
      name: trimmed,
      pulsarIds: scope === 'all' ? 'all' : pulsars.map((p) => Number(p.id)).filter((id) => chosen.has(id)),
      revisionChoice,
      notifyMe,
    };
    create.mutate(body, {
      onSuccess: onCreated,
      onError: (error) => {
        const byField: typeof problems = {};
        if (isApiError(error)) {
          for (const d of error.details) {
            if (d.path[0] === 'name') byField.name = d.message;
            else if (d.path[0] === 'pulsarIds') byField.pulsars = d.message;
          }
        }
        setProblems({ ...byField, other: describeError(error) });
      },
    });
  };

  return (
    <form
      aria-label="Start a campaign"
      noValidate
      className="flex flex-col gap-4"
      onSubmit={(event) => {
        event.preventDefault();
        submit();
      }}
    >
      {problems.other ? <Alert tone="error">{problems.other}</Alert> : null}
      <Field label="Campaign name" error={problems.name} hint="For example: refit after the clock-file update">
        {(control) => <Input {...control} value={name} onChange={(event) => setName(event.target.value)} autoComplete="off" />}
      </Field>

      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-sm font-medium text-night-100">Pulsars</legend>
        <Radio name="scope" value="all" checked={scope === 'all'} onChange={() => setScope('all')}>
          All pulsars
        </Radio>
        <Radio name="scope" value="chosen" checked={scope === 'chosen'} onChange={() => setScope('chosen')}>
          Chosen pulsars
        </Radio>
        {scope === 'chosen' ? (
          pulsarsLoading ? (
            <p className="text-sm text-night-400">Loading pulsars…</p>
          ) : pulsars.length === 0 ? (
            <p className="text-sm text-night-400">There are no pulsars yet.</p>
          ) : (
            <ul aria-label="Pulsars to refit" className="ml-6 grid max-h-56 grid-cols-1 gap-1 overflow-y-auto sm:grid-cols-2">
              {pulsars.map((p) => (
                <li key={p.id}>
                  <label className="flex items-center gap-2 font-mono text-sm text-night-100">
                    <input type="checkbox" checked={chosen.has(Number(p.id))} onChange={() => toggle(Number(p.id))} className="accent-ember-500" />
                    {p.name}
                  </label>
                </li>
              ))}
            </ul>
          )
        ) : null}
        {problems.pulsars ? <p className="text-xs font-medium text-alarm-300">{problems.pulsars}</p> : null}
      </fieldset>

      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-sm font-medium text-night-100">Model revision</legend>
        <Radio name="revision" value="released" checked={revisionChoice === 'released'} onChange={() => setRevisionChoice('released')}>
          Latest released revision (pulsars without one are skipped)
        </Radio>
        <Radio name="revision" value="latest" checked={revisionChoice === 'latest'} onChange={() => setRevisionChoice('latest')}>
          Latest revision of each pulsar, released or not
        </Radio>
      </fieldset>

      <label className="flex items-center gap-2 text-sm text-night-100">
        <input type="checkbox" checked={notifyMe} onChange={(event) => setNotifyMe(event.target.checked)} className="accent-ember-500" />
        E-mail me when it finishes
      </label>

      <Button type="submit" busy={create.isPending}>
        Start campaign
      </Button>
    </form>
  );
}
