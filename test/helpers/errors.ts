/** The InputError a call throws; fails the test when it throws nothing or another kind of error. */
import { InputError } from '../../src/errors.js';

export function inputError(f: () => unknown): InputError {
  try {
    f();
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error('expected an InputError');
}
