/**
 * Stage between solve and verify: practical rates. A rate above zero but below the minimum
 * practical rate is raised to it; every rate is rounded up to a multiple of the step (e.g.
 * 0.05 L/s). Rates only go up, and every unit response is a lowering, so the targets the solve
 * met stay met; the well limits may not, so the rounded rates are what the field engine verifies
 * next (`verify-design.ts`), and every later stage (times, standby, bid) uses them.
 */
import { Type, type Static } from '@sinclair/typebox';
import type { ResolvedDesignOptions } from './design-options';

export const RateRoundingSchema = Type.Object(
  {
    minimumRate_m3_s: Type.Number({ description: 'Smallest practical rate applied, m³/s (0: none).' }),
    rateStep_m3_s: Type.Number({ description: 'Rates rounded up to multiples of this, m³/s (0: none).' }),
    raisedToMinimumWellIds: Type.Array(Type.String(), { description: 'Wells whose solved rate was below the minimum and was raised to it.' }),
    totalBefore_m3_s: Type.Number({ description: 'Sum of the solved rates before rounding, m³/s.' }),
    totalAfter_m3_s: Type.Number({ description: 'Sum after rounding (the design total), m³/s.' }),
    largestChange_m3_s: Type.Number({ description: 'Largest rise of one well’s rate, m³/s.' }),
  },
  { description: 'How the solved rates were made practical; the design was re-checked by the field engine with the rounded rates.' },
);
export type RateRounding = Static<typeof RateRoundingSchema>;

export interface RoundDesignRatesOptions {
  rates: Float64Array;
  wellIds: readonly string[];
  options: Pick<ResolvedDesignOptions, 'minimumRate_m3_s' | 'rateStep_m3_s'>;
}

/** Rates made practical (a new array) and what changed; `rounding` is null when neither option is set. */
export function roundDesignRates({ rates, wellIds, options }: RoundDesignRatesOptions): { rates: Float64Array; rounding: RateRounding | null } {
  const { minimumRate_m3_s: qMin, rateStep_m3_s: step } = options;
  if (!(qMin > 0) && !(step > 0)) return { rates, rounding: null };
  const out = new Float64Array(rates.length);
  const raised: string[] = [];
  let largest = 0;
  rates.forEach((q0, j) => {
    if (!(q0 > 0)) return;
    let q = q0;
    if (q < qMin) {
      q = qMin;
      raised.push(wellIds[j]!);
    }
    // Up to the next step; a rate already on a step (to 1e-9 of a step) stays, so float noise does not add a step.
    if (step > 0) q = Math.ceil(q / step - 1e-9) * step;
    // Write the multiple cleanly (0.00035, not 0.00035000000000000005).
    out[j] = Number(q.toPrecision(12));
    largest = Math.max(largest, out[j]! - q0);
  });
  const sum = (a: Float64Array) => a.reduce((s, q) => s + q, 0);
  return {
    rates: out,
    rounding: { minimumRate_m3_s: qMin, rateStep_m3_s: step, raisedToMinimumWellIds: raised, totalBefore_m3_s: sum(rates), totalAfter_m3_s: sum(out), largestChange_m3_s: largest },
  };
}
