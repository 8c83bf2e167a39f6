/** The DrydigError a call throws, for asserting its code and message (fails the test if it does not throw one). */
import { DrydigError } from '../../shared/schema';

export function drydigErrorOf(fn: () => unknown): DrydigError {
  try {
    fn();
  } catch (error) {
    if (error instanceof DrydigError) return error;
    throw error;
  }
  throw new Error('expected a DrydigError, but the call returned');
}

/** `CODE: message` of the DrydigError a call throws. */
export function drydigMessageOf(fn: () => unknown): string {
  const e = drydigErrorOf(fn);
  return `${e.code}: ${e.message}`;
}
