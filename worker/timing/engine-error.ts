/**
 * The one error the engine throws for input that has no answer (bad files,
 * unknown observatories, TOAs outside the ephemeris, degenerate fits, ...).
 * `message` is one line that names the field, row or parameter at fault;
 * `details` optionally lists every individual problem.
 */
export interface EngineErrorDetail {
  line?: number;
  row?: number;
  column?: string;
  path?: string;
  message: string;
}

export class TimingInputError extends Error {
  readonly details: EngineErrorDetail[];
  constructor(message: string, details: EngineErrorDetail[] = []) {
    super(message);
    this.name = 'TimingInputError';
    this.details = details;
  }
}
