import { useState } from 'react';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import type { ImageFormat } from './explorer-plot';

export interface ExportActionsProps {
  /** Null until the plot is drawn. */
  onImage: ((format: ImageFormat) => Promise<void>) | null;
  onResidualsCsv(): void;
  onFittedModel(): void;
}

/** Exports: the plot as PNG or SVG, the shown residuals as CSV, the fitted model as JSON. */
export function ExportActions({ onImage, onResidualsCsv, onFittedModel }: ExportActionsProps) {
  const [error, setError] = useState<string | null>(null);
  const image = (format: ImageFormat) => {
    if (!onImage) return;
    setError(null);
    onImage(format).catch((e: unknown) => setError(`The ${format.toUpperCase()} could not be made: ${e instanceof Error ? e.message : String(e)}`));
  };
  return (
    <section aria-labelledby="explorer-exports-title" className="flex flex-col gap-2">
      <h3 id="explorer-exports-title" className="text-sm font-semibold text-night-100">
        Export
      </h3>
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" size="sm" disabled={!onImage} onClick={() => image('png')}>
          Plot as PNG
        </Button>
        <Button variant="secondary" size="sm" disabled={!onImage} onClick={() => image('svg')}>
          Plot as SVG
        </Button>
        <Button variant="secondary" size="sm" onClick={onResidualsCsv}>
          Residuals CSV
        </Button>
        <Button variant="secondary" size="sm" onClick={onFittedModel}>
          Fitted model JSON
        </Button>
      </div>
      <p className="text-xs text-night-400">The CSV holds the residuals as shown, including a companion preview.</p>
      {error ? <Alert tone="error">{error}</Alert> : null}
    </section>
  );
}
