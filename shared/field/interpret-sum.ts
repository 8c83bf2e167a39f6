/**
 * Turns a superposed value at a point into level, drawdown and validity flags.
 */
import type { FieldModel } from './field-model';
import { FLAG_BITS, type PointFlag } from './types';

/** Drawdown beyond this fraction of the saturated thickness raises `large-drawdown` (common practice: Dupuit/Jacob degrade beyond ~25 %). */
export const LARGE_DRAWDOWN_FRACTION = 0.25;

/** Level and drawdown at a point, and the flag bits (FLAG_BITS) of the interpretation itself. */
export interface InterpretedSum {
  level_m: number;
  drawdown_m: number;
  flagBits: number;
}

/**
 * Interprets a superposed sum (s for confined/leaky, s_c for unconfined), writing into `out`.
 * Unconfined: s = H − sqrt(H² − 2H·s_c) exactly; where 2H·s_c ≥ H² the point is dewatered and
 * reported at the base with drawdown H (flagged, never NaN). Confined/leaky: a head the solution
 * puts below the aquifer base is held at the base and flagged `dewatered` as well.
 */
export function interpretSum(model: FieldModel, sum: number, out: InterpretedSum): InterpretedSum {
  let bits = 0;
  if (model.kind === 'unconfined') {
    const H = model.thickness_m;
    const disc = H * H - 2 * H * sum;
    if (disc <= 0) {
      out.level_m = model.base_m;
      out.drawdown_m = H;
      bits |= FLAG_BITS.dewatered | FLAG_BITS['large-drawdown'];
    } else {
      const s = H - Math.sqrt(disc);
      out.level_m = model.staticLevel_m - s;
      out.drawdown_m = s;
      if (Math.abs(s) > LARGE_DRAWDOWN_FRACTION * H) bits |= FLAG_BITS['large-drawdown'];
    }
  } else {
    out.level_m = model.staticLevel_m - sum;
    out.drawdown_m = sum;
    if (model.top_m !== undefined && out.level_m < model.top_m) bits |= FLAG_BITS['confined-to-unconfined'];
    if (out.level_m < model.base_m) {
      // The confined solution would put the head below the aquifer's base: the aquifer is drained
      // there. Hold the head at the base and flag it; the model says nothing lower.
      out.level_m = model.base_m;
      out.drawdown_m = model.staticLevel_m - model.base_m;
      bits |= FLAG_BITS.dewatered;
    }
  }
  out.flagBits = bits;
  return out;
}

const FLAG_ORDER = Object.keys(FLAG_BITS) as PointFlag[];

/** Flag names of a bit mask, in FLAG_BITS order. */
export function flagsFromBits(bits: number): PointFlag[] {
  const flags: PointFlag[] = [];
  if (bits === 0) return flags;
  for (const f of FLAG_ORDER) if (bits & FLAG_BITS[f]) flags.push(f);
  return flags;
}

/** Zeroed count per flag. */
export function emptyFlagCounts(): Record<PointFlag, number> {
  const counts = {} as Record<PointFlag, number>;
  for (const f of FLAG_ORDER) counts[f] = 0;
  return counts;
}
