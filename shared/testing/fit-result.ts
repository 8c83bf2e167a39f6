/**
 * The result of a pumping-test analysis (design.md §8: `{ "fits": [ { "method",
 * "transmissivity_m2_s", "storativity", "leakageFactor_m"?, "rmse_m", "interval"? } ] }`),
 * extended with what the designer needs to judge a fit: validity, departures, the fitted curve
 * and residuals for the plots. One TypeBox schema; the types derive from it.
 */
import { Type, type Static } from '@sinclair/typebox';
import { NullableNum, Num } from '../schema/result-numbers';

const Range = (description: string) => Type.Tuple([Type.Number(), Type.Number()], { description });

export const TestMethodSchema = Type.Union([Type.Literal('theis'), Type.Literal('cooper-jacob'), Type.Literal('recovery'), Type.Literal('hantush'), Type.Literal('step')], {
  description: 'Theis curve fit, Cooper–Jacob straight line, Theis recovery, Hantush–Jacob leaky fit, step-drawdown analysis.',
});
export type TestMethod = Static<typeof TestMethodSchema>;

export const FitIntervalSchema = Type.Object({
  confidence: Num('Two-sided confidence level of the intervals (0.95).'),
  transmissivity_m2_s: Type.Optional(Range('T interval, m²/s.')),
  storativity: Type.Optional(Range('S interval (−).')),
  leakageFactor_m: Type.Optional(Range('B interval, m.')),
  wellLoss_s2_m5: Type.Optional(Range('C interval, s²/m⁵.')),
});
export type FitInterval = Static<typeof FitIntervalSchema>;

export const StraightLineSchema = Type.Object({
  slope_m_per_log_cycle: Num('Δs per log₁₀ cycle of the abscissa, m.'),
  intercept_m: Num('Drawdown where the abscissa is 1 (log₁₀ = 0), m.'),
  abscissa: Type.Union([Type.Literal('time/r² (s/m²)'), Type.Literal("t/t'")]),
  /** Abscissa where the line crosses zero drawdown (Cooper–Jacob: (t/r²)₀). */
  zeroDrawdownAbscissa: NullableNum('Abscissa at zero drawdown (Cooper–Jacob (t/r²)₀, s/m²).'),
  windowFrom_s: Num('First time used, s.'),
  windowTo_s: Num('Last time used, s.'),
  points: Num('Readings on the line.'),
});
export type StraightLine = Static<typeof StraightLineSchema>;

export const StepResultSchema = Type.Object({
  rate_m3_s: Num('Step rate, m³/s.'),
  drawdown_m: Num('Drawdown at the end of the step, m.'),
  specificDrawdown_s_m2: Num('s_w/Q, s/m².'),
  efficiency: Num('Well efficiency B·Q/(B·Q + C·Q²) (−).'),
});

export const CurvePointSchema = Type.Object({ time_s: Num('s'), drawdown_m: Num('m') });
export const FitCurveSchema = Type.Object({
  well: Type.String(),
  distance_m: Num('m'),
  points: Type.Array(CurvePointSchema, { description: 'Fitted curve over the readings’ time span (log-spaced).' }),
});

export const ResidualSchema = Type.Object({ well: Type.String(), time_s: Num('s'), residual_m: Num('Observed − fitted drawdown, m.') });

export const PumpingTestFitSchema = Type.Object({
  method: TestMethodSchema,
  well: Type.Union([Type.String(), Type.Null()], { description: 'Observation well fitted (null: every well at once).' }),
  transmissivity_m2_s: NullableNum('T, m²/s (null: the method gives none, e.g. a step test).'),
  storativity: NullableNum('S (−) (null: the method gives none, e.g. recovery).'),
  leakageFactor_m: Type.Optional(Num('B = sqrt(T·c), m (Hantush–Jacob).')),
  linearLoss_s_m2: Type.Optional(Num('Step test: aquifer-loss coefficient B in s_w = B·Q + C·Q², s/m².')),
  wellLoss_s2_m5: Type.Optional(Num('Step test: well-loss coefficient C, s²/m⁵.')),
  steps: Type.Optional(Type.Array(StepResultSchema)),
  rmse_m: Num('Root-mean-square misfit of the readings used, m.'),
  interval: Type.Optional(FitIntervalSchema),
  line: Type.Optional(StraightLineSchema),
  validity: Type.Object({
    readings: Num('Readings used.'),
    fractionSmallU: NullableNum('Share of the readings used with u below the method’s limit (null: not applicable).'),
    uMax: NullableNum('That limit of u (Cooper–Jacob and recovery: 0.05 by default).'),
    notes: Type.Array(Type.String()),
  }),
  departures: Type.Array(Type.String({ description: 'Departures from the method’s model seen in the data, in words.' })),
  curve: Type.Array(FitCurveSchema),
  residuals: Type.Array(ResidualSchema),
});
export type PumpingTestFit = Static<typeof PumpingTestFitSchema>;

export const PumpingTestResultSchema = Type.Object({
  fits: Type.Array(PumpingTestFitSchema),
  readings: Type.Object({
    count: Num('Readings read.'),
    wells: Type.Array(Type.Object({ well: Type.String(), distance_m: Num('m'), count: Num('readings'), recovery: Num('recovery readings') })),
  }),
  rate_m3_s: Num('Pumping rate used, m³/s.'),
  stop_s: NullableNum('Pump stop time, s.'),
  cautions: Type.Array(Type.String()),
});
export type PumpingTestResult = Static<typeof PumpingTestResultSchema>;
