/**
 * Design stage: the pit-floor check of every excavation with the chosen rates — factors of safety
 * at the critical point (EN 1997-1 UPL and HYD, see `shared/floor`), the governing check and its
 * margin, the safe-dig sequence over time, and the time from a power failure at the design time
 * until the floor becomes unsafe (what standby power must beat).
 *
 * Heads are the plan model's piezometric heads in the pumped aquifer; the checks are
 * one-dimensional vertical equilibrium with no side friction, no slab and no cut-off wall.
 */
import { logSpacedTimes } from '../field';
import { heaveFactorOfSafety, requiredUpliftFactor, safeDigSequence, timeUntilHeadAbove, upliftFactorOfSafety } from '../floor';
import type { ControlPoint } from './control-points';
import { applyDesignRates, pointXY, type DesignContext } from './design-context';
import type { DesignFloorResult } from './design-result';

const SAFE_DIG_SAMPLES = 12;

export interface FloorStageOptions {
  ctx: DesignContext;
  rates: Float64Array;
  checkPoints: ControlPoint[];
  /** Computed levels at the check points at the design time (the verified levels). */
  pointLevels_m: ArrayLike<number>;
  /** Time the pumps stop in the power-failure check, s. */
  stop_s: number;
}

/** The floor block of every excavation, by id. */
export function checkFloors({ ctx, rates, checkPoints, pointLevels_m, stop_s }: FloorStageOptions): Map<string, DesignFloorResult> {
  const { scenario, options, designTime_s } = ctx;
  const out = new Map<string, DesignFloorResult>();
  const solved = applyDesignRates(scenario, ctx.wells, rates);
  const stopped = applyDesignRates(scenario, ctx.wells, rates, stop_s);
  const pumping = rates.some((q) => q > 0);
  for (const e of scenario.excavations) {
    const floor = ctx.floors.get(e.id);
    const own = checkPoints.map((p, i) => ({ p, i })).filter(({ p }) => p.excavationId === e.id);
    if (!floor || own.length === 0) continue;
    const worst = own.reduce((a, b) => (pointLevels_m[b.i]! > pointLevels_m[a.i]! ? b : a));
    const head = pointLevels_m[worst.i]!;
    const { ground, target } = floor;
    const points = own.map(({ p }) => pointXY(p));

    const safeDig =
      designTime_s === null || !pumping
        ? []
        : safeDigSequence({
            scenario: solved,
            excavation: e,
            options: options.floor,
            points,
            times_s: logSpacedTimes({ end_s: designTime_s, count: SAFE_DIG_SAMPLES, start_s: designTime_s / 1000 }),
          });
    const allowable = target.allowableLevel_m;
    const timeToUnsafe_s =
      allowable === null || !pumping || head > allowable
        ? null
        : timeUntilHeadAbove({ stopped, points, stop_s, level_m: allowable, span_s: Math.max(100 * stop_s, 1e7) });

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
