/**
 * Design options added for bid review (spread into `DesignOptionsSchema`): per-kind pump
 * efficiency and well cost, the currency label, and the rounding of design rates.
 */
import { Type } from '@sinclair/typebox';

const PerKind = (description: string, range: { minimum?: number; exclusiveMinimum?: number; maximum?: number }) =>
  Type.Object(
    {
      wellpoint: Type.Optional(Type.Number(range)),
      deep: Type.Optional(Type.Number(range)),
      ejector: Type.Optional(Type.Number(range)),
    },
    { additionalProperties: false, description },
  );

export const DESIGN_BID_OPTION_FIELDS = {
  efficiencyByKind: Type.Optional(
    PerKind(
      'Wire-to-water efficiency per well kind (−). Defaults: well points and deep wells pumpEfficiency (0.6, common practice); ejectors 0.2 (ejector systems run far below pump efficiency, roughly 10–30 % overall: from memory, after Powrie & Roberts 1990 and Preene, Roberts & Powrie 2016, CIRIA C750 — check the source).',
      { exclusiveMinimum: 0, maximum: 1 },
    ),
  ),
  wellCostByKind: Type.Optional(PerKind('Cost of installing one well of each kind, bid currency. Default: wellCost for every kind (placeholder).', { minimum: 0 })),
  currency: Type.Optional(Type.String({ minLength: 1, maxLength: 16, description: 'Currency label of the bid summary (e.g. an ISO 4217 code, "EUR"). Default "XXX" (ISO 4217: no currency; the prices are placeholders).' })),
  minimumRate_m3_s: Type.Optional(
    Type.Number({ minimum: 0, maximum: 1, description: 'Smallest practical rate of a pumping well, m³/s: a design rate above 0 but below it is raised to it. Default 0 (none).' }),
  ),
  rateStep_m3_s: Type.Optional(
    Type.Number({ minimum: 0, maximum: 1, description: 'Design rates are rounded up to a multiple of this step, m³/s (e.g. 5e-5 = 0.05 L/s); the design is re-checked by the field engine after rounding. Default 0 (no rounding).' }),
  ),
};
