/**
 * Argument guards shared by the well functions. Callers (the field engine) never pass these
 * values on purpose, so a bad one is a bug upstream: fail loudly with the argument's name rather
 * than hand back a NaN that would silently spread through a superposition sum.
 */

/**
 * Throws a RangeError unless `value` is a number strictly greater than zero (NaN fails).
 * `+Infinity` is accepted: every well function has a defined limit there.
 * @param fn name of the calling function, for the message
 * @param name name of the argument, for the message
 */
export function requirePositive(fn: string, name: string, value: number): void {
  if (!(value > 0)) {
    throw new RangeError(`${fn}: argument ${name} must be a number > 0, got ${String(value)}`);
  }
}

/**
 * Throws a RangeError unless `value` is a number ≥ 0 (NaN fails). `+Infinity` is accepted.
 * @param fn name of the calling function, for the message
 * @param name name of the argument, for the message
 */
export function requireNonNegative(fn: string, name: string, value: number): void {
  if (!(value >= 0)) {
    throw new RangeError(`${fn}: argument ${name} must be a number >= 0, got ${String(value)}`);
  }
}
