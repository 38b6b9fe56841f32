/** Runs `run`, asserts it throws the engine's TimingInputError, and returns that error for closer checks. */
import { expect } from 'vitest';
import { TimingInputError } from '../../../worker/timing/engine-error';

export function inputError(run: () => unknown): TimingInputError {
  try {
    run();
  } catch (error) {
    expect(error).toBeInstanceOf(TimingInputError);
    return error as TimingInputError;
  }
  throw new Error('expected a TimingInputError');
}
