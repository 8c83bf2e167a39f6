/**
 * Cautions on the capacity allowance and air entry while those limits are not rows of the solve:
 * wells using more of Sichardt's capacity than common practice allows, and well points drawn
 * below their screen top.
 */
import type { DesignContext } from './design-context';
import type { DesignWellResult } from './design-result';
import { COMMON_CAPACITY_UTILISATION } from './design-options';
import { listIds } from './design-wording';

/** The cautions (empty when both limits are rows of the solve or nothing passes them). */
export function collectCapacityAllowanceCautions(ctx: DesignContext, wellResults: DesignWellResult[]): string[] {
  const { options, scenario } = ctx;
  const cautions: string[] = [];
  if (options.capacityUtilisationFactor > COMMON_CAPACITY_UTILISATION) {
    const high = wellResults.filter((w) => w.rate_m3_s > 0 && w.utilisation !== null && w.utilisation > COMMON_CAPACITY_UTILISATION + 1e-9).map((w) => w.id);
    if (high.length > 0)
      cautions.push(
        `${high.length} well(s) use more than ${COMMON_CAPACITY_UTILISATION * 100} % of their Sichardt capacity (${listIds(high)}); common practice keeps a utilisation factor of ${COMMON_CAPACITY_UTILISATION}: set designOptions.capacityUtilisationFactor to make it a limit of the design (now ${options.capacityUtilisationFactor}).`,
      );
  }
  if (!options.airEntryCheck) {
    const below = wellResults
      .filter((w) => {
        const given = scenario.wells.find((s) => s.id === w.id)?.screenTop_m;
        return w.kind === 'wellpoint' && w.rate_m3_s > 0 && given !== undefined && w.pumpingLevel_m < given;
      })
      .map((w) => w.id);
    if (below.length > 0)
      cautions.push(
        `${below.length} well point(s) are drawn below their screen top and would suck air (${listIds(below)}): set designOptions.airEntryCheck to keep pumping levels above the screens, set the screens deeper, or use deep wells or ejectors.`,
      );
  }
  return cautions;
}
