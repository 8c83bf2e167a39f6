/**
 * The `receptors` block of a design result: per receptor, the drawdown, settlement and angular
 * distortion the design causes and how they stand against the receptor's limits.
 */
import { Type, type Static } from '@sinclair/typebox';
import { NullableNum, Num } from '../schema/result-numbers';


export const ReceptorFlagSchema = Type.Union(
  [
    Type.Literal('drawdown-exceeds'),
    Type.Literal('settlement-exceeds'),
    Type.Literal('angular-distortion-exceeds'),
    Type.Literal('head-rise'),
    Type.Literal('large-strain'),
    Type.Literal('no-compressible-layer'),
  ],
  {
    description:
      'drawdown-exceeds / settlement-exceeds / angular-distortion-exceeds: above the receptor’s limit; head-rise: the head rises somewhere (injection), swelling is not modelled (m_v of loading overstates it); large-strain: m_v·Δσ′ above 5 %, beyond the small-strain model; no-compressible-layer: no settlement computed.',
  },
);
export type ReceptorFlag = Static<typeof ReceptorFlagSchema>;

export const ReceptorPointResultSchema = Type.Object({
  x: Num('Easting, m.'),
  y: Num('Northing, m.'),
  drawdown_m: Num('Drawdown at the design time, m.'),
  settlement_m: NullableNum('Settlement at the design time, m (null without a compressible layer).'),
  maxDrawdownOverDig_m: Num('Largest drawdown over the pumping period (design time included), m.'),
  maxSettlementOverDig_m: NullableNum('Settlement from that drawdown, m.'),
});
export type ReceptorPointResult = Static<typeof ReceptorPointResultSchema>;

export const ReceptorResultSchema = Type.Object({
  id: Type.String(),
  kind: Type.String(),
  label: Type.String(),
  /** Largest over the receptor's sample points (own points and those between). */
  drawdown_m: Num('Largest drawdown on the receptor at the design time, m (own points and points between, ≤ 5 m apart).'),
  maxDrawdownOverDig_m: Num('Largest drawdown on the receptor over the pumping period, m.'),
  maxDrawdown_m: NullableNum('The receptor’s drawdown limit, m (null: none).'),
  settlement_m: NullableNum('Largest settlement at the receptor’s points over the pumping period, m (one-dimensional, m_v·γw·Δh·H).'),
  allowableSettlement_m: NullableNum('Allowable settlement, m (null: none given).'),
  differentialSettlement_m: NullableNum('Largest settlement difference between neighbouring points, m (null for a point).'),
  maxAngularDistortion: NullableNum('Largest angular distortion β = Δs/L between neighbouring points (−; null for a point).'),
  allowableAngularDistortion: Num('Allowable β (−; default 1/500, Bjerrum 1963).'),
  /** Pair of points where β is largest (index of the first). */
  criticalSegment: NullableNum('Index of the first point of the pair with the largest β (null for a point).'),
  points: Type.Array(ReceptorPointResultSchema, { description: 'The receptor’s own points.' }),
  flags: Type.Array(ReceptorFlagSchema),
  status: Type.Union([Type.Literal('ok'), Type.Literal('exceeds'), Type.Literal('not-checked')], {
    description: 'ok: within every limit given; exceeds: beyond one (see flags); not-checked: no limit given.',
  }),
});
export type ReceptorResult = Static<typeof ReceptorResultSchema>;
