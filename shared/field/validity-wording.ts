/**
 * The one statement of what a validity flag means for the numbers, shared by the model note of
 * every evaluation, the design caution and the client's flag labels, so the three cannot disagree.
 *
 * Confined → unconfined (the head drawn below the top of a confined or leaky aquifer). The
 * confined solution keeps the transmissivity T = K·b of the full thickness b. Where the head is
 * below the top the saturated thickness is h − base < b, so the real T is smaller there. At steady
 * state the discharge potential of the combined confined–unconfined flow (Girinskii 1946; Bear
 * 1972, Dynamics of Fluids in Porous Media, §8.2) gives, for one well, Q_confined − Q_real =
 * 2π·K·(b − h_w)²/(2·ln(R/r_w)) ≥ 0 for the same pumping level h_w: the confined formula needs
 * more flow for the same lowering, i.e. for the same rates it understates the drawdown (the real
 * levels are lower, most of all in and beside the wells). In a transient run the water released
 * by draining that zone (specific yield, far larger than the elastic storativity) is left out,
 * so the drawdown is overstated early and targets may be reached later than shown.
 */

/** What the confined solution does where the aquifer turns unconfined (flag "confined-to-unconfined"). */
export const CONFINED_TO_UNCONFINED_EFFECT =
  'the saturated section there is thinner than the aquifer thickness the confined solution assumes, so at steady state it understates the drawdown for the given rates (real levels are lower, most of all in and beside the wells); in a transient run it leaves out the water drained from that zone (specific yield), so it overstates the early drawdown and a target may be reached later than shown';

/** What that means for a design: the excavation side is on the safe side at steady state, the wells are not. */
export const CONFINED_TO_UNCONFINED_DESIGN_CONSEQUENCE =
  'at steady state the rates are on the safe side for the targets, but the pumping levels in the wells may be lower than shown (check suction lift and wetted screen); in a transient design check the time to target with a pumping test or a model that drains the dewatered zone';

/** Short form for a flag label. */
export const CONFINED_TO_UNCONFINED_SHORT = 'understates the steady drawdown; overstates the early transient drawdown';
