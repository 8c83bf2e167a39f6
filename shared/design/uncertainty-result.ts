/**
 * Result blocks of the designs that survive the unknowns (additive fields of `DesignResultSchema`):
 * `sensitivity` (the table), `uncertainty` (Monte Carlo, design.md §8) and `robust` (N − 1 and
 * a K range). All SI; names carry units.
 */
import { Type, type Static } from '@sinclair/typebox';
import { NullableNum, Num } from '../schema/result-numbers';


export const SensitivityRowSchema = Type.Object({
  parameter: Type.Union([Type.Literal('conductivity'), Type.Literal('storage')], { description: 'What was scaled: K, or S (Sy when unconfined).' }),
  factor: Num('Factor on the parameter (−).'),
  value: Num('The scaled value: K in m/s, or S (−).'),
  totalRate_m3_s: NullableNum('Least total flow that meets every target with the scaled value (re-solved), m³/s; null: none within the well limits.'),
  feasible: Type.Boolean({ description: 'The re-solve meets every target within every well limit.' }),
  met: Type.Boolean({ description: 'The chosen design’s rates still meet every target with the scaled value.' }),
  worstShortfall_m: NullableNum('With the chosen rates: highest level above its target, m (≤ 0 when met; null: not computed, see the note).'),
  upliftFS: NullableNum('With the chosen rates: the least uplift factor of safety over the excavations with a floor check (null: no plug).'),
  note: Type.Optional(Type.String()),
});
export type SensitivityRow = Static<typeof SensitivityRowSchema>;

export const SensitivityResultSchema = Type.Object({
  factors: Type.Array(Type.Number()),
  rows: Type.Array(SensitivityRowSchema),
  note: Type.String(),
});
export type SensitivityResult = Static<typeof SensitivityResultSchema>;

export const HistogramBinSchema = Type.Object({
  from_m3_s: Num('Lower edge of the bin, m³/s.'),
  to_m3_s: Num('Upper edge, m³/s.'),
  count: Num('Realisations whose re-solved total flow falls in the bin.'),
});

export const BidAtFlowSchema = Type.Object({
  totalRate_m3_s: Num('Total flow priced, m³/s (the P90).'),
  designFlow_m3_s: Num('× safety factor, m³/s.'),
  inputPower_kW: Num('kW.'),
  installedPower_kW: Num('kW.'),
  energy_kWh: Num('kWh over the duration.'),
  dischargeVolume_m3: Num('m³ over the duration.'),
  energyCost: Num('Bid currency.'),
  pumpedVolumeCost: Num('Bid currency.'),
  wellCost: Num('Bid currency (the design’s wells).'),
  totalCost: Num('Bid currency.'),
  currency: Type.String(),
  note: Type.String(),
});
export type BidAtFlow = Static<typeof BidAtFlowSchema>;

export const UncertaintyResultSchema = Type.Object({
  runs: Num('Realisations.'),
  seed: Num('Seed of the random numbers (the same seed gives the same answer).'),
  kSpread: Num('Geometric standard deviation of K used (−).'),
  kSpreadSource: Type.Union([Type.Literal('option'), Type.Literal('pumping-test'), Type.Literal('default')], { description: 'Where the K spread came from.' }),
  sSpread: Num('Geometric standard deviation of S used (−; 1 = held).'),
  probabilityMet: Num('Share of realisations in which the chosen rates meet every target (−).'),
  feasibleShare: Num('Share of realisations in which some rates within the well limits meet every target (−).'),
  totalRate_m3_s: Type.Object({
    p50: NullableNum('Median of the re-solved total flow, m³/s (null: more than half the realisations have no feasible design).'),
    p90: NullableNum('90th percentile, m³/s (null: more than 10 % have no feasible design).'),
    mean: NullableNum('Mean over the feasible realisations, m³/s.'),
  }),
  histogram: Type.Array(HistogramBinSchema, { description: 'Re-solved total flow of the feasible realisations.' }),
  bidAtP90: Type.Optional(BidAtFlowSchema),
  failedRuns: Num('Realisations whose scaled values left the physical range (counted as not met and infeasible).'),
  elapsed_ms: Num('Wall-clock time of the realisations, ms.'),
  workers: Num('Worker threads the realisations ran on (0: in process).'),
  note: Type.String(),
});
export type UncertaintyResult = Static<typeof UncertaintyResultSchema>;

export const RobustDesignSchema = Type.Object({
  kind: Type.Union([Type.Literal('one-well-out'), Type.Literal('conductivity-range')]),
  conductivityFactor: Type.Optional(Num('K ÷ f … K × f covered (−).')),
  feasible: Type.Boolean({ description: 'Rates within the well limits that meet every target in every case were found.' }),
  totalRate_m3_s: NullableNum('Total of the robust design’s rates, m³/s (null: none found).'),
  extraRate_m3_s: NullableNum('Robust total minus the ordinary design’s total, m³/s: what the robustness costs.'),
  extraShare: NullableNum('That as a share of the ordinary total (−).'),
  wells: Type.Array(Type.Object({ id: Type.String(), rate_m3_s: Num('m³/s.') })),
  worstShortfall_m: NullableNum('Over every case covered (each well out; K ÷ f and K × f): highest level above its target with these rates, m (≤ 0 when met; null: not computed).'),
  worstCase: Type.String({ description: 'The case that governs, in words.' }),
  rounds: Num('LP solves (cases’ rows added where the check grid stood above target).'),
  note: Type.String(),
});
export type RobustDesign = Static<typeof RobustDesignSchema>;
