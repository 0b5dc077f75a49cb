/** The message of the InputError that `run` throws; fails the test when it throws nothing or another error. */
import { InputError } from '../../src/shared/errors.ts';

export function inputErrorMessage(run: () => unknown): string {
  try {
    run();
  } catch (error) {
    if (error instanceof InputError) return error.message;
    throw error;
  }
  throw new Error('expected an InputError');
}
