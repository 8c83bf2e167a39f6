/**
 * Stage 9 of a design run: the cautions that go with the result — the model's idealisation, the
 * linear well limits, late-time well levels, validity flags at the check points, common-practice
 * limits, steady-state start-up flow and how the layout search ended.
 */
import { collectCapacityAllowanceCautions } from './capacity-allowance-cautions';
import { CONFINED_TO_UNCONFINED_DESIGN_CONSEQUENCE, CONFINED_TO_UNCONFINED_EFFECT, wellLevels, type PointResult } from '../field';
import type { Scenario } from '../schema';
import type { DesignContext } from './design-context';
import type { DesignWellResult } from './design-result';
import { formatFigure as fmt } from './design-wording';
import { sichardtCapacity, wettedScreenLength } from './sichardt-capacity';
import type { LayoutSearch } from './solve-design-rates';

export interface CollectDesignCautionsOptions {
  ctx: DesignContext;
  rates: Float64Array;
  /** The scenario with the design rates applied. */
  solved: Scenario;
  endTime_s: number | null;
  pointResults: PointResult[];
  wellResults: DesignWellResult[];
  layoutSearch: LayoutSearch | null;
  /** True when the rate solve ended optimal. */
  solvedOptimally: boolean;
  designPointCount: number;
}

/** Every caution of the design result, most general first. */
export function collectDesignCautions({ ctx, rates, solved, endTime_s, pointResults, wellResults, layoutSearch, solvedOptimally, designPointCount }: CollectDesignCautionsOptions): string[] {
  const { scenario, options, wells, mode, designTime_s } = ctx;
  const a = scenario.aquifer;
  const cautions: string[] = [
    'Idealised model (homogeneous aquifer, infinite except the stated straight boundaries; partial screens by Hantush’s correction, other wells fully penetrating): treat rates and levels as estimates; confirm by site investigation and pumping tests, follow local codes, and have the design checked by a licensed engineer.',
  ];
  if (a.kind === 'unconfined' || wells.some((w) => w.wellLoss_s2_m5 > 0))
    cautions.push(
      'Well limits are checked with linear, conservative rows: unconfined pumping levels use the chord of the Dupuit level curve and well loss C·Q² its secant, so capacities and suction-lift margins are under-, never over-stated; the reported pumping levels are the engine’s exact values.',
    );
  if (endTime_s !== null && designTime_s !== null && endTime_s > designTime_s && rates.some((q) => q > 0)) {
    const late = wellLevels({ scenario: solved, time_s: endTime_s });
    const over = wells.filter((w, j) => {
      const q = rates[j]!;
      if (!(q > 0)) return false;
      const pl = late[w.scenarioIndex]!.pumpingLevel_m;
      const cap = sichardtCapacity({ radius_m: w.radius_m, wettedLength_m: wettedScreenLength(w.screenTop_m, w.screenBottom_m, pl), conductivity_m_s: a.conductivity_m_s });
      return pl < w.minimumLevel_m || q > cap;
    });
    if (over.length > 0)
      cautions.push(
        `Kept at the design rates to the end of pumping (${fmt(endTime_s / 86400)} days), ${over.length} well(s) would pass their suction-lift or wetted-screen limit (${over
          .slice(0, 8)
          .map((w) => w.id)
          .join(', ')}${over.length > 8 ? ', …' : ''}): plan to reduce the rates once the target is reached, and check the levels as pumping goes on.`,
      );
  }
  const flagged = (flag: string) => pointResults.filter((p) => p.flags.includes(flag as never)).length;
  if (flagged('large-drawdown') > 0)
    cautions.push(`${flagged('large-drawdown')} check point(s) are drawn down more than about 25 % of the saturated thickness: Dupuit–Jacob results degrade there; treat levels as approximate.`);
  if (flagged('dewatered') > 0) cautions.push(`${flagged('dewatered')} check point(s) are dewatered to the aquifer base in the model.`);
  if (flagged('confined-to-unconfined') > 0)
    cautions.push(
      `${flagged('confined-to-unconfined')} check point(s) have the head below the aquifer top: the aquifer turns unconfined there; ${CONFINED_TO_UNCONFINED_EFFECT}. For this design: ${CONFINED_TO_UNCONFINED_DESIGN_CONSEQUENCE}.`,
    );
  if (wellResults.some((w) => w.flags.includes('dewatered'))) cautions.push('Some wells are dewatered at the face in the model: check the screens.');
  if (wells.some((w) => w.kind === 'wellpoint'))
    cautions.push(`Suction-lift limit ${options.suctionLiftLimit_m} m below the header is common practice (well points work to about 5–6 m), not a property of the site.`);
  if (designTime_s === null)
    cautions.push(`Steady design: allow about ${Math.round((options.initialRateFactor - 1) * 100)} % more flow for the first ${fmt(options.initialPeriod_s / 86400)} days while storage drains (UFC 3-220-05).`);
  if (layoutSearch !== null)
    cautions.push(
      `Layout choice by mixed-integer programming: ${layoutSearch.status === 'time-limit' ? 'the search stopped at its time limit' : 'the search stopped'} with the chosen layout's cost within ${fmt(100 * (layoutSearch.mipGap ?? 0), 2)} % of the best possible; costs per well and per m³ are the options' placeholders unless you set them.`,
    );
  if (mode === 'uniform' && solvedOptimally) cautions.push('Uniform mode: every well pumps the same rate; wells at the ends of a line carry more load in reality.');
  cautions.push(...collectCapacityAllowanceCautions(ctx, wellResults));
  if (designPointCount === 0) cautions.push('The scenario has no excavations or control points: there is nothing to design for, so every rate is 0.');
  return cautions;
}
