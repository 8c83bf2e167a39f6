/**
 * Settlement of a compressible layer from a drawdown, by one-dimensional consolidation: the fall
 * of the piezometric head Δh raises the vertical effective stress by Δσ' = γw·Δh (total stress
 * unchanged, pore pressure down by γw·Δh — Terzaghi's principle of effective stress), and the
 * layer of thickness H compresses by s = m_v·Δσ'·H (Craig's Soil Mechanics, ch. on consolidation
 * settlement, s_c = m_v·Δσ'·H; Powrie, Soil Mechanics: Concepts and Applications, the same
 * oedometer relation; Preene (2000) applies it to groundwater control — from memory).
 *
 * Where the drawdown varies over the layer's depth the mean of Δσ' over the thickness is used
 * (exact for m_v constant over the layer): 'uniform' — Δh everywhere; 'linear' — Δh at the base
 * falling to 0 at the top, mean Δh/2. Full (drained, long-term) consolidation is assumed: a clay
 * reaches it only after its consolidation time, so the value is the upper bound of the settlement
 * at the time the drawdown holds.
 */
import { layerCompressibility_m2_kN, type CompressibleLayer } from '../schema';
import { WATER_UNIT_WEIGHT_kN_m3 } from '../floor/floor-options';

/** Strain m_v·Δσ' above which the small-strain, constant-m_v model is flagged (common practice, from memory). */
export const LARGE_STRAIN_LIMIT = 0.05;

export interface ConsolidationSettlementOptions {
  /** Drawdown of the piezometric head at the receptor, m (positive downward; negative: a rise). */
  drawdown_m: number;
  layer: CompressibleLayer;
}

export interface ConsolidationSettlement {
  /** Mean drawdown over the layer's thickness, m. */
  meanDrawdown_m: number;
  /** Mean rise in vertical effective stress Δσ' = γw·Δh_mean, kPa. */
  effectiveStressRise_kPa: number;
  /** Vertical strain m_v·Δσ' (−). */
  strain: number;
  /** Settlement s = m_v·Δσ'·H, m (negative for a head rise: swelling, which m_v of loading overstates). */
  settlement_m: number;
}

/** s = m_v·γw·Δh_mean·H (see the file comment). */
export function consolidationSettlement({ drawdown_m, layer }: ConsolidationSettlementOptions): ConsolidationSettlement {
  const meanDrawdown_m = (layer.headChange ?? 'uniform') === 'linear' ? drawdown_m / 2 : drawdown_m;
  const effectiveStressRise_kPa = WATER_UNIT_WEIGHT_kN_m3 * meanDrawdown_m;
  const strain = layerCompressibility_m2_kN(layer) * effectiveStressRise_kPa;
  return { meanDrawdown_m, effectiveStressRise_kPa, strain, settlement_m: strain * layer.thickness_m };
}

/** The drawdown that gives settlement s: Δh = s / (m_v·γw·H·f), f = 1 (uniform) or ½ (linear). */
export function drawdownForSettlement(settlement_m: number, layer: CompressibleLayer): number {
  const f = (layer.headChange ?? 'uniform') === 'linear' ? 0.5 : 1;
  return settlement_m / (layerCompressibility_m2_kN(layer) * WATER_UNIT_WEIGHT_kN_m3 * layer.thickness_m * f);
}
