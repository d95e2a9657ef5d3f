/**
 * Test helpers shared by several packages' tests, imported by relative path
 * (a package's own helpers stay in its test/ directory).
 */
import { expect } from 'vitest';
import { InputError } from '@penumbra/core';

/** The InputError `call` throws; the test fails if it throws anything else or nothing. */
export function inputErrorOf(call: () => unknown): InputError {
  try {
    call();
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return e as InputError;
  }
  throw new Error('expected an InputError, but nothing was thrown');
}

/** The parameter named by the InputError `call` throws (the test fails on any other outcome). */
export function parameterOf(call: () => unknown): string {
  return inputErrorOf(call).parameter;
}
