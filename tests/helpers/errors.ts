// Catching the project's own errors in tests: the error must be a TallyError, and its code and sentence
// are then the test's to check.
import { expect } from 'vitest';
import { isTallyError, TallyError } from '../../shared-core/errors';

/** The TallyError that `run` throws; fails the test when it throws something else or nothing. */
export function caught(run: () => unknown): TallyError {
  try {
    run();
  } catch (e) {
    expect(e).toBeInstanceOf(TallyError);
    return e as TallyError;
  }
  throw new Error('expected a TallyError');
}

/** The TallyError that the promise from `run` rejects with; as caught, for async work. */
export async function rejected(run: () => Promise<unknown>): Promise<TallyError> {
  try {
    await run();
  } catch (e) {
    expect(e).toBeInstanceOf(TallyError);
    return e as TallyError;
  }
  throw new Error('expected a TallyError');
}

/** The code of the TallyError `fn` throws, 'not a TallyError' for any other throw, undefined when it returns. */
export function codeOf(fn: () => unknown): string | undefined {
  try {
    fn();
  } catch (e) {
    return isTallyError(e) ? e.code : 'not a TallyError';
  }
  return undefined;
}
