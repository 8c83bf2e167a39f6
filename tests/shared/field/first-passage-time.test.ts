import { describe, expect, it } from 'vitest';
import { firstPassageTime } from '../../../shared/field';
import { theisWellFunction } from '../../../shared/wells';
import { expectClose } from '../design/design-test-helpers';

describe('firstPassageTime', () => {
  it('finds a step threshold to a relative 1e-8', () => {
    expectClose(firstPassageTime({ reached: (t) => t >= 1234.5, start_s: 1, end_s: 1e7 })!, 1234.5, { rel: 1e-8 });
  });
  it('finds the time a Theis drawdown reaches a level (checked by the well function at the found time)', () => {
    // r²S/(4T) = 100 s: s/(Q/4πT) = W(100/t) reaches 2 at t = 100/u*.
    const t = firstPassageTime({ reached: (t) => t > 0 && theisWellFunction(100 / t) >= 2, start_s: 1, end_s: 1e6 })!;
    expectClose(theisWellFunction(100 / t), 2, { abs: 1e-7 }, 'W at the found time');
  });
  it('is 0 when the threshold is already crossed at the start, and null beyond the span', () => {
    expect(firstPassageTime({ reached: () => true, start_s: 1, end_s: 10 })).toBe(0);
    expect(firstPassageTime({ reached: (t) => t > 100, start_s: 1, end_s: 10 })).toBeNull();
  });
});
