/** Plain words for the engine's validity flags (shared/field/types.ts `PointFlag`). */
import { CONFINED_TO_UNCONFINED_SHORT } from '../../shared/field/validity-wording';
export const FLAG_LABELS: Record<string, { title: string; meaning: string }> = {
  dewatered: { title: 'Dewatered', meaning: 'drawn down to the aquifer base; the level shown is the base and the true yield is limited' },
  'large-drawdown': { title: 'Large drawdown', meaning: 'more than about a quarter of the saturated thickness; Dupuit/Jacob results are less reliable' },
  'beyond-influence-radius': { title: 'Beyond R', meaning: 'farther than the radius of influence; drawdown taken as zero by assumption' },
  'confined-to-unconfined': { title: 'Confined → unconfined', meaning: `head below the aquifer top; the aquifer turns unconfined here and the confined solution is only approximate (it ${CONFINED_TO_UNCONFINED_SHORT})` },
  'within-well-radius': { title: 'Inside a well', meaning: 'closer than the well radius; evaluated at the well face' },
  'beyond-boundary': { title: 'Beyond a boundary', meaning: 'across a boundary line, outside the modelled aquifer' },
};
