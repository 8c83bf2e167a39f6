/**
 * One well out of service at the design time: is every target still met by the others at their
 * design rates? By superposition the loss of well j removes column j of the response times its rate.
 */
import type { ControlPoint } from './control-points';
import { responseDot, type DesignContext } from './design-context';
import type { OutOfServiceCheck } from './design-result';

/** The chosen well (option) or the one whose loss hurts most; null when no well pumps. */
export function checkOneWellOut(ctx: DesignContext, checkPoints: ControlPoint[], checkResponse: Float64Array, rates: Float64Array): OutOfServiceCheck | null {
  const nW = ctx.wells.length;
  if (nW === 0) return null;
  const base = checkPoints.map((_, i) => responseDot(checkResponse, i, nW, rates));
  const relevant = checkPoints.map((p) => p.excavationId !== null || p.kind === 'user');
  const worstWithout = (j: number) => {
    let worst = -Infinity;
    checkPoints.forEach((p, i) => {
      if (!relevant[i] || !Number.isFinite(ctx.variableForLevel(p.targetLevel_m))) return;
      const level = ctx.levelForVariable(base[i]! - checkResponse[i * nW + j]! * rates[j]!);
      worst = Math.max(worst, level - p.targetLevel_m);
    });
    return worst;
  };
  let worstWell = -1;
  let worstValue = -Infinity;
  const perWell = ctx.wells.map((_, j) => (rates[j]! > 0 ? worstWithout(j) : -Infinity));
  perWell.forEach((v, j) => {
    if (v > worstValue) {
      worstValue = v;
      worstWell = j;
    }
  });
  if (worstWell < 0 || !Number.isFinite(worstValue)) return null;
  const chosen = ctx.options.outOfServiceWell !== null ? ctx.wells.findIndex((w) => w.id === ctx.options.outOfServiceWell) : -1;
  const j = chosen >= 0 ? chosen : worstWell;
  const value = chosen >= 0 ? worstWithout(chosen) : worstValue;
  return {
    wellId: ctx.wells[j]!.id,
    chosenBy: chosen >= 0 ? 'option' : 'worst-case',
    met: value <= 0,
    worstShortfall_m: Number.isFinite(value) ? value : worstValue,
    worstWellId: ctx.wells[worstWell]!.id,
    worstWellShortfall_m: worstValue,
  };
}
