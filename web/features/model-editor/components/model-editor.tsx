import { useRef, useState, type ReactNode } from 'react';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { Card, CardTitle } from '../../../components/card';
import { describeError } from '../../../components/query-state';
import { isApiError } from '../../../lib/api-client';
import { useCreateModelRevision } from '../api/create-model-revision';
import type { RevisionWithModel } from '../../revisions/api/get-revision';
import { formStateToModel } from '../lib/form-state-to-model';
import { ASTROMETRY_KEYS, type ModelFormState, type NoiseForm, type OffsetForm } from '../lib/model-form-state';
import { modelToFormState } from '../lib/model-to-form-state';
import { newCompanion, newNoise, newOffset } from '../lib/model-edits';
import { errorsByField, modelFieldErrors, type ModelFieldError } from '../lib/server-field-errors';
import { CompanionCard } from './companion-card';
import { ParamRow, TextRow } from './param-row';
import { SaveRevisionDialog } from './save-revision-dialog';
import { ValueList } from './value-list';

const ASTROMETRY_LABELS: Record<(typeof ASTROMETRY_KEYS)[number], { label: string; unit: string; hint?: string }> = {
  ra_hms: { label: 'Right ascension', unit: 'hh:mm:ss.s', hint: 'ICRS at the epoch' },
  dec_dms: { label: 'Declination', unit: '±dd:mm:ss.s', hint: 'ICRS at the epoch' },
  pm_ra_cosdec_mas_per_yr: { label: 'Proper motion in RA · cos(dec)', unit: 'mas/yr' },
  pm_dec_mas_per_yr: { label: 'Proper motion in declination', unit: 'mas/yr' },
  parallax_mas: { label: 'Parallax', unit: 'mas' },
};

function Section({ title, description, children }: { title: string; description?: string; children: ReactNode }) {
  return (
    <Card aria-label={title}>
      <CardTitle className="mb-1">{title}</CardTitle>
      {description ? <p className="mb-4 text-xs text-night-400">{description}</p> : <div className="mb-3" />}
      {children}
    </Card>
  );
}

/** Saves `text` as a download named `fileName` (export of the current model). */
function downloadText(fileName: string, text: string): void {
  const url = URL.createObjectURL(new Blob([text], { type: 'application/json' }));
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  document.body.append(link);
  link.click();
  link.remove();
  URL.revokeObjectURL(url);
}

/**
 * The model editor: a form over the model file (spin, position, dispersion, companions, offsets,
 * noise) with a solve-for switch beside each fittable value, JSON import/export, and "Save as new
 * revision". Server problems land beside their fields and are all listed at the top.
 */
export function ModelEditor({
  pulsarId,
  initialModel,
  parentId,
  onSaved,
}: {
  pulsarId: string;
  initialModel: unknown;
  parentId: number | null;
  onSaved: (revision: RevisionWithModel) => void;
}) {
  const [state, setState] = useState<ModelFormState>(() => modelToFormState(initialModel));
  const [serverErrors, setServerErrors] = useState<ModelFieldError[]>([]);
  const [importNote, setImportNote] = useState<{ tone: 'error' | 'info'; text: string } | null>(null);
  const [dialogOpen, setDialogOpen] = useState(false);
  const [dialogError, setDialogError] = useState<string | null>(null);
  const importRef = useRef<HTMLInputElement>(null);
  const save = useCreateModelRevision(pulsarId);
  const errors = errorsByField(serverErrors);

  const update = (change: (draft: ModelFormState) => void) =>
    setState((old) => {
      const draft = structuredClone(old);
      change(draft);
      return draft;
    });

  const importFile = async (file: File) => {
    let parsed: unknown;
    try {
      parsed = JSON.parse(await file.text());
    } catch (error) {
      setImportNote({ tone: 'error', text: `${file.name} is not valid JSON: ${error instanceof Error ? error.message : String(error)}` });
      return;
    }
    if (typeof parsed !== 'object' || parsed === null || Array.isArray(parsed)) {
      setImportNote({ tone: 'error', text: `${file.name} does not hold a model object (found ${Array.isArray(parsed) ? 'an array' : typeof parsed}).` });
      return;
    }
    setState(modelToFormState(parsed));
    setServerErrors([]);
    setImportNote({ tone: 'info', text: `Imported ${file.name}. Nothing is saved until you save a new revision.` });
  };

  const exportFile = () => {
    const model = formStateToModel(state);
    downloadText(`${state.pulsar.trim() || 'model'}.model.json`, `${JSON.stringify(model, null, 2)}\n`);
  };

  const submit = (message: string) => {
    setDialogError(null);
    save.mutate(
      { model: formStateToModel(state), message, ...(parentId !== null ? { parentId } : {}) },
      {
        onSuccess: (revision) => {
          setDialogOpen(false);
          setServerErrors([]);
          onSaved(revision);
        },
        onError: (error) => {
          if (isApiError(error) && error.details.length > 0) {
            const found = modelFieldErrors(error.details);
            const aboutMessage = found.filter((e) => e.field === 'message');
            if (aboutMessage.length > 0 && aboutMessage.length === found.length) {
              setDialogError(aboutMessage.map((e) => e.message).join(' '));
              return;
            }
            setServerErrors(found);
            setDialogOpen(false);
          } else {
            setDialogError(describeError(error));
          }
        },
      },
    );
  };

  const updateOffset = (index: number, next: OffsetForm) => update((d) => void (d.offsets[index] = next));
  const updateNoise = (index: number, next: NoiseForm) => update((d) => void (d.noise[index] = next));

  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <div className="flex flex-wrap gap-2">
          <label htmlFor="model-import-input" className="sr-only">
            Import model file
          </label>
          <input
            id="model-import-input"
            ref={importRef}
            type="file"
            accept=".json,application/json"
            className="sr-only"
            tabIndex={-1}
            onChange={(event) => {
              const file = event.target.files?.[0];
              event.target.value = '';
              if (file) void importFile(file);
            }}
          />
          <Button variant="secondary" onClick={() => importRef.current?.click()}>
            Import JSON…
          </Button>
          <Button variant="secondary" onClick={exportFile}>
            Export JSON
          </Button>
        </div>
        <Button
          onClick={() => {
            setDialogError(null);
            setDialogOpen(true);
          }}
        >
          Save as new revision
        </Button>
      </div>

      {importNote ? <Alert tone={importNote.tone}>{importNote.text}</Alert> : null}
      {serverErrors.length > 0 ? (
        <Alert tone="error" title={`The server did not accept this model (${serverErrors.length} ${serverErrors.length === 1 ? 'problem' : 'problems'})`}>
          <ul aria-label="Problems in the model" className="mt-1 list-disc pl-5">
            {serverErrors.map((e, i) => (
              <li key={i}>
                <span className="font-mono">{e.field || 'model'}</span>: {e.message}
              </li>
            ))}
          </ul>
        </Alert>
      ) : null}

      <Section title="Pulsar and epoch">
        <div className="grid grid-cols-1 gap-4 md:grid-cols-2">
          <TextRow label="Pulsar name" value={state.pulsar} onChange={(v) => update((d) => void (d.pulsar = v))} error={errors.pulsar} hint="Must equal the pulsar's name" />
          <TextRow label="Reference epoch (MJD, TDB)" value={state.epoch_mjd} onChange={(v) => update((d) => void (d.epoch_mjd = v))} error={errors.epoch_mjd} />
        </div>
        {errors.format ? <p className="mt-2 text-xs text-alarm-300">format: {errors.format}</p> : null}
      </Section>

      <Section title="Spin" description="Frequency as text, so every digit you type is kept.">
        <div className="flex flex-col gap-4">
          <ParamRow label="Spin frequency" unit="Hz" field={state.spin.frequency_hz} error={errors['spin.frequency_hz']} onChange={(f) => update((d) => void (d.spin.frequency_hz = f))} />
          <ValueList
            itemLabel={(k) => `Frequency derivative ${k + 1}`}
            unitOf={(k) => (k === 0 ? 'Hz/s' : `Hz/s^${k + 1}`)}
            items={state.spin.frequency_derivatives}
            errors={errors}
            errorPrefix="spin.frequency_derivatives"
            addLabel="Add frequency derivative"
            onChange={(items) => update((d) => void (d.spin.frequency_derivatives = items))}
          />
        </div>
      </Section>

      <Section title="Position" description="Right ascension and declination fit in seconds of time and arcseconds.">
        <div className="grid grid-cols-1 gap-4 md:grid-cols-2">
          {ASTROMETRY_KEYS.map((key) => (
            <ParamRow
              key={key}
              label={ASTROMETRY_LABELS[key].label}
              unit={ASTROMETRY_LABELS[key].unit}
              hint={ASTROMETRY_LABELS[key].hint}
              field={state.astrometry[key]}
              placeholder={key === 'ra_hms' || key === 'dec_dms' ? undefined : '0'}
              error={errors[`astrometry.${key}`]}
              onChange={(f) => update((d) => void (d.astrometry[key] = f))}
            />
          ))}
        </div>
      </Section>

      <Section title="Dispersion">
        <div className="flex flex-col gap-4">
          <ParamRow label="Dispersion measure" unit="pc/cm^3" field={state.dispersion.dm_pc_per_cm3} placeholder="0" error={errors['dispersion.dm_pc_per_cm3']} onChange={(f) => update((d) => void (d.dispersion.dm_pc_per_cm3 = f))} />
          <ValueList
            itemLabel={(k) => `DM derivative ${k + 1}`}
            unitOf={(k) => (k === 0 ? 'pc/cm^3/yr' : `pc/cm^3/yr^${k + 1}`)}
            items={state.dispersion.dm_derivatives}
            errors={errors}
            errorPrefix="dispersion.dm_derivatives"
            addLabel="Add DM derivative"
            onChange={(items) => update((d) => void (d.dispersion.dm_derivatives = items))}
          />
        </div>
      </Section>

      <Section title="Companions" description="Each companion adds an orbit; its kind decides which values it has.">
        <div className="flex flex-col gap-4">
          {state.companions.length === 0 ? <p className="text-sm text-night-400">No companions: an isolated pulsar.</p> : null}
          {state.companions.map((companion, index) => (
            <CompanionCard
              key={companion.uid}
              companion={companion}
              index={index}
              errors={errors}
              onChange={(next) => update((d) => void (d.companions[index] = next))}
              onRemove={() => update((d) => void d.companions.splice(index, 1))}
            />
          ))}
          <div>
            <Button variant="secondary" size="sm" onClick={() => update((d) => void d.companions.push(newCompanion('keplerian', d.companions.map((c) => c.name))))}>
              Add companion
            </Button>
          </div>
        </div>
      </Section>

      <Section title="Offsets" description="Per backend: how many seconds late its arrival times are relative to the others.">
        <div className="flex flex-col gap-4">
          {state.offsets.map((offset, index) => (
            <div key={offset.uid} aria-label={`Offset ${index + 1}`} role="group" className="grid grid-cols-1 items-start gap-4 md:grid-cols-[1fr_1fr_auto]">
              <TextRow label={`Offset ${index + 1} backend`} value={offset.backend} error={errors[`offsets.${index}.backend`]} onChange={(backend) => updateOffset(index, { ...offset, backend })} />
              <ParamRow label={`Offset ${index + 1} seconds`} unit="s" field={offset.seconds} placeholder="0" error={errors[`offsets.${index}.seconds`]} onChange={(seconds) => updateOffset(index, { ...offset, seconds })} />
              <Button variant="ghost" size="sm" className="mt-7" onClick={() => update((d) => void d.offsets.splice(index, 1))}>
                Remove
              </Button>
            </div>
          ))}
          <div>
            <Button variant="secondary" size="sm" onClick={() => update((d) => void d.offsets.push(newOffset()))}>
              Add offset
            </Button>
          </div>
        </div>
      </Section>

      <Section title="Noise" description="Per backend: effective uncertainty = √((scale·σ)² + jitter²). Not fitted.">
        <div className="flex flex-col gap-4">
          {state.noise.map((noise, index) => (
            <div key={noise.uid} role="group" aria-label={`Noise ${index + 1}`} className="grid grid-cols-1 items-start gap-4 md:grid-cols-[1fr_1fr_1fr_auto]">
              <TextRow label={`Noise ${index + 1} backend`} value={noise.backend} error={errors[`noise.${index}.backend`]} onChange={(backend) => updateNoise(index, { ...noise, backend })} />
              <TextRow label={`Noise ${index + 1} uncertainty scale`} value={noise.uncertainty_scale} error={errors[`noise.${index}.uncertainty_scale`]} onChange={(v) => updateNoise(index, { ...noise, uncertainty_scale: v })} />
              <TextRow label={`Noise ${index + 1} added jitter (µs)`} value={noise.added_jitter_us} error={errors[`noise.${index}.added_jitter_us`]} onChange={(v) => updateNoise(index, { ...noise, added_jitter_us: v })} />
              <Button variant="ghost" size="sm" className="mt-7" onClick={() => update((d) => void d.noise.splice(index, 1))}>
                Remove
              </Button>
            </div>
          ))}
          <div>
            <Button variant="secondary" size="sm" onClick={() => update((d) => void d.noise.push(newNoise()))}>
              Add noise setting
            </Button>
          </div>
        </div>
      </Section>

      {state.glitches.length > 0 || state.otherSolveFor.length > 0 ? (
        <p className="text-xs text-night-400">
          Kept from the file without a control here: {state.glitches.length} glitch{state.glitches.length === 1 ? '' : 'es'}
          {state.otherSolveFor.length > 0 ? `; solve-for paths ${state.otherSolveFor.join(', ')}` : ''}.
        </p>
      ) : null}

      {dialogOpen ? <SaveRevisionDialog busy={save.isPending} error={dialogError} onSave={submit} onClose={() => setDialogOpen(false)} /> : null}
    </div>
  );
}
