/**
 * Design stage: the pit-floor check of every excavation with the chosen rates — factors of safety
 * at the critical point (EN 1997-1 UPL and HYD, see `shared/floor`), the governing check and its
 * margin, the safe-dig sequence over time, and the time from a power failure in the design state
 * until the floor becomes unsafe (what standby power must beat).
 *
 * Steady designs: the safe-dig table is one step, `time_s: null`, the deepest safe formation at the
 * steady state — a steady design says nothing about how soon that state is reached, and a transient
 * run of the same rates would not converge to the steady cone where the steady state rests on a
 * radius of influence. The power failure starts from the steady state (`design-recovery.ts`).
 *
 * Heads are the plan model's piezometric heads in the pumped aquifer; the checks are
 * one-dimensional vertical equilibrium with no side friction, no slab and no cut-off wall.
 */
import { logSpacedTimes } from '../field';
import { heaveFactorOfSafety, requiredUpliftFactor, safeDigSequence, timeUntilLevelAbove, upliftFactorOfSafety } from '../floor';
import type { ControlPoint } from './control-points';
import { applyDesignRates, pointXY, type DesignContext } from './design-context';
import { designRecovery } from './design-recovery';
import type { DesignFloorResult } from './design-result';
import { recoverySpan } from './design-times';

const SAFE_DIG_SAMPLES = 12;

export interface FloorStageOptions {
  ctx: DesignContext;
  rates: Float64Array;
  checkPoints: ControlPoint[];
  /** Computed levels at the check points at the design time (the verified levels). */
  pointLevels_m: ArrayLike<number>;
}

/** The floor block of every excavation, by id. */
export function checkFloors({ ctx, rates, checkPoints, pointLevels_m }: FloorStageOptions): Map<string, DesignFloorResult> {
  const { scenario, options, designTime_s } = ctx;
  const out = new Map<string, DesignFloorResult>();
  const solved = applyDesignRates(scenario, ctx.wells, rates);
  const pumping = rates.some((q) => q > 0);
  const recoveryModel = pumping ? designRecovery(ctx, rates) : null;
  const recovery = recoveryModel?.ok ? recoveryModel.recovery : null;
  for (const e of scenario.excavations) {
    const floor = ctx.floors.get(e.id);
    const own = checkPoints.map((p, i) => ({ p, i })).filter(({ p }) => p.excavationId === e.id);
    if (!floor || own.length === 0) continue;
    const worst = own.reduce((a, b) => (pointLevels_m[b.i]! > pointLevels_m[a.i]! ? b : a));
    const head = pointLevels_m[worst.i]!;
    const { ground, target } = floor;
    const points = own.map(({ p }) => pointXY(p));

    const safeDig = !pumping
      ? []
      : safeDigSequence({
          scenario: solved,
          excavation: e,
          options: options.floor,
          points,
          times_s: designTime_s === null ? [null] : logSpacedTimes({ end_s: designTime_s, count: SAFE_DIG_SAMPLES, start_s: designTime_s / 1000 }),
        });
    const allowable = target.allowableLevel_m;
    const timeToUnsafe_s =
      allowable === null || recovery === null || head > allowable
        ? null
        : timeUntilLevelAbove({ levelsAt: recovery.levelsAt, points, level_m: allowable, span_s: recoverySpan(recovery.stop_s) });

    out.set(e.id, {
      governing: target.governing,
      profileSource: floor.profileSource,
      allowableLevel_m: allowable,
      upliftFS: ground?.plug ? upliftFactorOfSafety(ground.plug, head) : null,
      requiredUpliftFS: ground?.plug ? requiredUpliftFactor(options.floor) : null,
      heaveFS: target.heaveLevel_m !== null && ground?.granular ? heaveFactorOfSafety(ground.granular, e.formationLevel_m, head) : null,
      requiredHeaveFS: target.heaveLevel_m !== null ? options.floor.heaveFactor : null,
      plugBase_m: ground?.plug?.base_m ?? null,
      plugWeight_kPa: ground?.plug?.weight_kPa ?? null,
      critical: { x: worst.p.x, y: worst.p.y, level_m: head },
      margin_m: target.targetLevel_m - head,
      safeDig,
      timeToUnsafe_s,
    });
  }
  return out;
}
