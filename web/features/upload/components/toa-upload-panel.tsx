import { useRef, useState, type DragEvent } from 'react';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { describeError } from '../../../components/query-state';
import { TextLink } from '../../../components/text-link';
import { cn } from '../../../lib/cn';
import { UploadError, type UploadProgress } from '../../../lib/upload-with-progress';
import { useUploadToaBatch, type UploadedBatch } from '../api/upload-toa-batch';
import { formatBytes, MAX_UPLOAD_BYTES, precheckUpload } from '../upload-rules';
import { ToaFileErrorTable, toaFileProblemsFrom, totalProblemsFrom, type ToaFileProblem } from './toa-file-error-table';
import { UploadProgressBar, UploadStageIndicator } from './upload-progress-bar';
import { UploadSummary } from './upload-summary';

type UploadState =
  | { step: 'idle' }
  | { step: 'uploading'; progress: UploadProgress }
  | { step: 'processing' }
  | { step: 'stored'; batch: UploadedBatch }
  | { step: 'invalid'; message: string; problems: ToaFileProblem[]; total: number | null }
  | { step: 'duplicate'; existingBatchId: number | null }
  | { step: 'too-large'; message: string }
  | { step: 'failed'; message: string };

function existingBatchIdFrom(error: UploadError): number | null {
  const id = error.rawDetails.map((d) => d.existingBatchId).find((v) => typeof v === 'number' || typeof v === 'string');
  return id === undefined ? null : Number(id);
}

/**
 * The whole upload flow for one pulsar: choose or drop a CSV, pre-check it, send it with byte
 * progress, then show the stage, the server's verdict (problems table, duplicate question, too
 * large) or the stored batch.
 */
export function ToaUploadPanel({ pulsarId, pulsarHref }: { pulsarId: string; pulsarHref: string }) {
  const upload = useUploadToaBatch(pulsarId);
  const inputRef = useRef<HTMLInputElement>(null);
  const abortRef = useRef<AbortController | null>(null);
  const [file, setFile] = useState<File | null>(null);
  const [dragging, setDragging] = useState(false);
  const [state, setState] = useState<UploadState>({ step: 'idle' });
  const check = file ? precheckUpload(file) : { errors: [], warnings: [] };
  const busy = state.step === 'uploading' || state.step === 'processing';

  const choose = (chosen: File | undefined) => {
    if (!chosen || busy) return;
    setFile(chosen);
    setState({ step: 'idle' });
  };

  const send = async (confirmDuplicate: boolean) => {
    if (!file || check.errors.length > 0) return;
    const controller = new AbortController();
    abortRef.current = controller;
    setState({ step: 'uploading', progress: { loadedBytes: 0, totalBytes: file.size || null } });
    try {
      const batch = await upload(file, confirmDuplicate, {
        signal: controller.signal,
        onProgress: (progress) => setState((s) => (s.step === 'uploading' ? { step: 'uploading', progress } : s)),
        onSent: () => setState({ step: 'processing' }),
      });
      setState({ step: 'stored', batch });
    } catch (error) {
      if (error instanceof UploadError && error.code === 'invalid_toa_file') {
        setState({ step: 'invalid', message: error.message, problems: toaFileProblemsFrom(error.rawDetails), total: totalProblemsFrom(error.message) });
      } else if (error instanceof UploadError && error.code === 'duplicate_upload') {
        setState({ step: 'duplicate', existingBatchId: existingBatchIdFrom(error) });
      } else if (error instanceof UploadError && error.status === 413) {
        setState({ step: 'too-large', message: error.message });
      } else if (error instanceof UploadError && error.code === 'aborted') {
        setState({ step: 'idle' });
      } else {
        setState({ step: 'failed', message: describeError(error) });
      }
    } finally {
      abortRef.current = null;
    }
  };

  const onDrop = (event: DragEvent<HTMLDivElement>) => {
    event.preventDefault();
    setDragging(false);
    choose(event.dataTransfer.files[0]);
  };

  if (state.step === 'stored') {
    return (
      <div className="flex flex-col gap-5">
        <UploadStageIndicator stage="done" />
        <Alert tone="success" title={`Stored ${state.batch.rowCount} TOAs from ${state.batch.fileName}`}>
          The arrival times are now part of this pulsar; the next fit uses them.
        </Alert>
        <UploadSummary batch={state.batch} />
        <div className="flex flex-wrap items-center gap-4 text-sm">
          <TextLink to={pulsarHref}>Back to the pulsar</TextLink>
          <Button
            variant="secondary"
            size="sm"
            onClick={() => {
              setFile(null);
              setState({ step: 'idle' });
            }}
          >
            Upload another file
          </Button>
        </div>
      </div>
    );
  }

  return (
    <div className="flex flex-col gap-5">
      <div
        data-testid="drop-zone"
        onDragOver={(event) => {
          event.preventDefault();
          if (!busy) setDragging(true);
        }}
        onDragLeave={() => setDragging(false)}
        onDrop={onDrop}
        className={cn(
          'flex flex-col items-center gap-3 rounded-xl border-2 border-dashed px-6 py-10 text-center transition-colors',
          dragging ? 'border-ember-400 bg-ember-500/5' : 'border-night-600',
        )}
      >
        <p className="text-sm text-night-200">Drop a TOA file (CSV) here, or</p>
        <label htmlFor="toa-file-input" className="sr-only">
          TOA file
        </label>
        <input
          id="toa-file-input"
          ref={inputRef}
          type="file"
          accept=".csv,text/csv"
          className="sr-only"
          tabIndex={-1}
          disabled={busy}
          onChange={(event) => {
            choose(event.target.files?.[0]);
            event.target.value = '';
          }}
        />
        <Button variant="secondary" onClick={() => inputRef.current?.click()} disabled={busy}>
          Choose a file…
        </Button>
        <p className="text-xs text-night-400">Columns mjd, uncertainty_us, frequency_mhz, observatory; up to {formatBytes(MAX_UPLOAD_BYTES)}.</p>
      </div>

      {file ? (
        <div className="flex flex-wrap items-center justify-between gap-3 rounded-md border border-night-700 px-4 py-3">
          <p className="text-sm">
            <span className="font-mono text-night-100">{file.name}</span>{' '}
            <span className="text-night-400">({formatBytes(file.size)})</span>
          </p>
          {busy ? (
            state.step === 'uploading' ? (
              <Button variant="ghost" size="sm" onClick={() => abortRef.current?.abort()}>
                Cancel upload
              </Button>
            ) : null
          ) : (
            <Button onClick={() => void send(false)} disabled={check.errors.length > 0}>
              Upload {file.name}
            </Button>
          )}
        </div>
      ) : null}

      {check.errors.map((message) => (
        <Alert key={message} tone="error" title="This file cannot be uploaded">
          {message}
        </Alert>
      ))}
      {check.warnings.map((message) => (
        <Alert key={message} tone="info" title="Check the file">
          {message}
        </Alert>
      ))}

      {busy ? (
        <div className="flex flex-col gap-3">
          <UploadStageIndicator stage={state.step === 'uploading' ? 'uploading' : 'processing'} />
          {state.step === 'uploading' ? (
            <UploadProgressBar loadedBytes={state.progress.loadedBytes} totalBytes={state.progress.totalBytes} />
          ) : (
            <p role="status" className="text-sm text-night-300">
              Every byte is sent. The server is checking each row and storing the TOAs…
            </p>
          )}
        </div>
      ) : null}

      {state.step === 'invalid' ? (
        <div className="flex flex-col gap-3">
          <Alert tone="error" title="The file was rejected">
            {state.message}
          </Alert>
          <ToaFileErrorTable problems={state.problems} total={state.total} />
        </div>
      ) : null}
      {state.step === 'duplicate' ? (
        <Alert tone="info" title="Already uploaded">
          <p>
            This exact file was already uploaded{state.existingBatchId !== null ? ` (batch #${state.existingBatchId})` : ''}. Store it again?
          </p>
          <div className="mt-3 flex gap-2">
            <Button size="sm" onClick={() => void send(true)}>
              Confirm
            </Button>
            <Button size="sm" variant="secondary" onClick={() => setState({ step: 'idle' })}>
              Cancel
            </Button>
          </div>
        </Alert>
      ) : null}
      {state.step === 'too-large' ? (
        <Alert tone="error" title="The file is too large">
          {state.message} The limit is {formatBytes(MAX_UPLOAD_BYTES)} or 500 000 rows; split the file and upload the parts.
        </Alert>
      ) : null}
      {state.step === 'failed' ? (
        <Alert tone="error" title="The upload failed">
          {state.message}
        </Alert>
      ) : null}
    </div>
  );
}
