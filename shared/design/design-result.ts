/**
 * The design result: the JSON contract of design.md section 4 (mode, feasible, totalRate_m3_s,
 * wells, excavations, reasons) plus capacities, times, checks, the pump and bid summary,
 * cautions and model notes. All SI; names carry units. One TypeBox schema; the TypeScript types
 * derive from it, and the HTTP route answers with it (so the OpenAPI document lists it).
 */
import { Type, type Static } from '@sinclair/typebox';
import { NullableNum, Num } from '../schema/result-numbers';
import { DesignModeSchema, ScenarioWarningSchema } from '../schema';
import { RateRoundingSchema } from './round-design-rates';
import { RobustDesignSchema, SensitivityResultSchema, UncertaintyResultSchema } from './uncertainty-result';
import { ReceptorResultSchema } from '../receptors/receptor-result';


export const DesignReasonCodeSchema = Type.Union(
  [
    Type.Literal('well-capacity'),
    Type.Literal('wetted-screen'),
    Type.Literal('suction-lift'),
    Type.Literal('air-entry'),
    Type.Literal('constant-head-boundary'),
    Type.Literal('target-below-aquifer-base'),
    Type.Literal('no-well-influence'),
    Type.Literal('no-active-wells'),
    Type.Literal('solver'),
    Type.Literal('receptor-drawdown-limit'),
  ],
  { description: 'Why a target cannot be met (stable codes; the message says it in words).' },
);
export type DesignReasonCode = Static<typeof DesignReasonCodeSchema>;

export const DesignReasonSchema = Type.Object({
  code: DesignReasonCodeSchema,
  message: Type.String(),
  wellIds: Type.Optional(Type.Array(Type.String(), { description: 'Wells whose limit binds.' })),
  excavationId: Type.Optional(Type.String()),
  receptorId: Type.Optional(Type.String({ description: 'Receptor whose drawdown limit keeps the target from being met.' })),
});
export type DesignReason = Static<typeof DesignReasonSchema>;

export const WellLimitSchema = Type.Union([Type.Literal('capacity'), Type.Literal('wetted-screen'), Type.Literal('suction-lift'), Type.Literal('air-entry'), Type.Null()], {
  description: 'Limit binding in the solve: Sichardt capacity (× the utilisation factor) with the whole screen wetted, the same with the wetted screen left, suction lift, air entry (a well point drawn to its screen top); null: none.',
});
export type WellLimit = Static<typeof WellLimitSchema>;

export const ControlPointKindSchema = Type.Union([Type.Literal('vertex'), Type.Literal('edge'), Type.Literal('grid'), Type.Literal('user')]);

export const DesignWellResultSchema = Type.Object({
  id: Type.String(),
  kind: Type.Union([Type.Literal('wellpoint'), Type.Literal('deep'), Type.Literal('ejector')]),
  x: Num('Easting, m.'),
  y: Num('Northing, m.'),
  rate_m3_s: Num('Design rate, m³/s (0 for a well not used).'),
  installed: Type.Boolean({ description: 'In the quantities and cost: pumps at a rate above zero (layout mode: also chosen by the search).' }),
  start_s: Num('Time the well is switched on, s (staged start; 0 otherwise).'),
  capacity_m3_s: Num('Sichardt capacity with the wetted screen at the verified pumping level, m³/s.'),
  fullScreenCapacity_m3_s: Num('Sichardt capacity with the whole screen wetted, m³/s.'),
  utilisation: NullableNum('rate / capacity (−); null when the screen is dry but the well has a rate.'),
  pumpingLevel_m: Num('Pumping level in the well at the design time (well loss included), m.'),
  minimumPumpingLevel_m: Num('Lowest pumping level allowed (well points: suction lift or the given screen top, air entry; screen bottom otherwise), m.'),
  allowedCapacity_m3_s: Type.Optional(Num('Sichardt capacity at the verified pumping level × the utilisation factor: what the design may use, m³/s.')),
  limit: WellLimitSchema,
  head_m: NullableNum('Total dynamic head of this well’s pump (deep wells, ejectors), m.'),
  flags: Type.Array(Type.String()),
  idle: Type.Boolean({ description: 'The design leaves this well at zero rate: it may be omitted, and it is not in the quantities or the cost.' }),
  note: Type.Optional(Type.String({ description: 'In words, e.g. "idle — may be omitted".' })),
  injection: Type.Optional(Type.Boolean({ description: 'An injection (recharge) well: its rate is ≤ 0 and its capacity the injection capacity.' })),
});
export type DesignWellResult = Static<typeof DesignWellResultSchema>;

export const DesignCriticalPointSchema = Type.Object({
  x: Num('Easting, m.'),
  y: Num('Northing, m.'),
  level_m: Num('Computed level there at the design time, m.'),
  targetLevel_m: Num('Target level there, m.'),
  kind: ControlPointKindSchema,
});
export type DesignCriticalPoint = Static<typeof DesignCriticalPointSchema>;

export const SafeDigStepSchema = Type.Object({
  time_s: NullableNum('Time since pumping started, s; null: the steady state (a steady design has one step).'),
  safeFormationLevel_m: Num('Deepest formation level that meets the governing floor criterion at that time, m.'),
});

/** The pit-floor check of one excavation (design.md §8). */
export const DesignFloorResultSchema = Type.Object({
  governing: Type.Union([Type.Literal('dry'), Type.Literal('uplift'), Type.Literal('heave')], { description: 'The check that sets the target level.' }),
  profileSource: Type.Union([Type.Literal('excavation'), Type.Literal('site'), Type.Null()], { description: 'Ground profile used; null: none given (only the dry check).' }),
  allowableLevel_m: NullableNum('Highest aquifer head that keeps the floor safe (uplift or heave, the stricter), m; null where neither applies.'),
  upliftFS: NullableNum('Uplift factor of safety W / (γw·h_p) at the critical point with the chosen rates; null: no plug, or no pressure under it.'),
  requiredUpliftFS: NullableNum('γG;dst / γG;stb (EN 1997-1 Table A.15 recommended values unless set); null: no plug.'),
  heaveFS: NullableNum('Critical over upward gradient in a granular floor at the critical point; null: no granular floor or no upward gradient.'),
  requiredHeaveFS: NullableNum('Required heave factor; null: no granular floor.'),
  plugBase_m: NullableNum('Base of the plug left under formation, m.'),
  plugWeight_kPa: NullableNum('Weight of the ground between formation and the plug base, kPa.'),
  critical: Type.Object({ x: Num('Easting, m.'), y: Num('Northing, m.'), level_m: Num('Aquifer head there at the design time, m.') }),
  margin_m: Num('Governing target minus the computed head at the critical point, m (≥ 0 when met).'),
  safeDig: Type.Array(SafeDigStepSchema, { description: 'Excavation sequence with the chosen rates: deepest safe formation level over time (transient designs); a steady design has one step, time_s null, at the steady state.' }),
  timeToUnsafe_s: NullableNum('Every pump stops in the design state (at the design time; a steady design at the steady state): time until the floor becomes unsafe (head above the allowable level), s; null: no floor-safety check, already unsafe, or not within the checked span.'),
});
export type DesignFloorResult = Static<typeof DesignFloorResultSchema>;

export const DesignExcavationResultSchema = Type.Object({
  id: Type.String(),
  targetLevel_m: Num('Level the design must reach: the governing floor check (formation − margin when the floor must be dry), m.'),
  formationLevel_m: Num('Formation level, m.'),
  met: Type.Boolean(),
  worstShortfall_m: Num('Highest computed level inside the excavation minus its target, m (≤ 0 when met).'),
  critical: DesignCriticalPointSchema,
  timeToTarget_s: NullableNum('Time the whole excavation first reaches its target, s (null: not by the design time, or a steady design).'),
  recoveryToFormation_s: NullableNum('Power failure: every pump stops in the design state (at the design time; a steady design at the steady state); time until the level at the critical point is back at formation level, s. Null where it does not apply, with recoveryNote saying why.'),
  recoveryNote: Type.Union([Type.String(), Type.Null()], { description: 'Why there is no power-failure figure (infeasible design, target not met, head held above formation, no storage, beyond the checked span); null when the figure is given.' }),
  controlPointCount: Num('Control points used (design grid plus points added in refinement).'),
  checkPointCount: Num('Check points (twice as dense) the result was verified on.'),
  pointsAboveTarget: Num('Check points where the computed level stays above the target (0 when met).'),
  floor: Type.Optional(DesignFloorResultSchema),
});
export type DesignExcavationResult = Static<typeof DesignExcavationResultSchema>;

export const DesignControlPointResultSchema = Type.Object({
  x: Num('Easting, m.'),
  y: Num('Northing, m.'),
  kind: ControlPointKindSchema,
  excavationId: Type.Union([Type.String(), Type.Null()]),
  targetLevel_m: Num('Target level, m.'),
  level_m: Num('Computed level at the design time, m.'),
  timeToTarget_s: NullableNum('First time the point reaches its target, s (null: not by the design time, or steady).'),
  flags: Type.Array(Type.String()),
});
export type DesignControlPointResult = Static<typeof DesignControlPointResultSchema>;

export const LevelTimePointSchema = Type.Object({ time_s: Num('Time since pumping started, s.'), level_m: Num('Level, m.') });
export type LevelTimePoint = Static<typeof LevelTimePointSchema>;

export const DesignTimeSeriesSchema = Type.Object({
  x: Num('Easting of the critical point, m.'),
  y: Num('Northing, m.'),
  excavationId: Type.String(),
  targetLevel_m: Num('Target level, m.'),
  formationLevel_m: Num('Formation level, m.'),
  pumping: Type.Array(LevelTimePointSchema, { description: 'Pumping continues: level at the critical point.' }),
  recovery: Type.Array(LevelTimePointSchema, { description: 'Every pump stops at stop_s, in the design state: recovery at the critical point (the first sample is the design state).' }),
  stop_s: NullableNum('Time the pumps stop in the recovery curve, s; null: a steady design, stopped at the steady state (the recovery times then count from the stop).'),
});
export type DesignTimeSeries = Static<typeof DesignTimeSeriesSchema>;

export const OutOfServiceCheckSchema = Type.Object({
  wellId: Type.String({ description: 'Well taken out (the chosen one, or the one whose loss hurts most).' }),
  chosenBy: Type.Union([Type.Literal('option'), Type.Literal('worst-case')]),
  met: Type.Boolean({ description: 'Every target still met by the other wells at their design rates.' }),
  worstShortfall_m: Num('Highest level minus target with that well out, m.'),
  worstWellId: Type.String({ description: 'The well whose loss hurts most.' }),
  worstWellShortfall_m: Num('Highest level minus target with that well out, m.'),
});
export type OutOfServiceCheck = Static<typeof OutOfServiceCheckSchema>;

export const PumpSummarySchema = Type.Object({
  totalRate_m3_s: Num('Computed total flow, m³/s.'),
  designFlow_m3_s: Num('Total × safety factor, m³/s: what pumps and discharge are sized for.'),
  safetyFactor: Num('−'),
  initialRate_m3_s: NullableNum('Steady designs: rate for the first weeks while storage drains, m³/s.'),
  initialPeriod_s: NullableNum('Steady designs: length of that period, s.'),
  headerSystemHead_m: NullableNum('Well-point header pump head, m.'),
  maxWellHead_m: NullableNum('Largest deep-well total dynamic head, m.'),
  hydraulicPower_kW: Num('ρ·g·Q·H summed, kW.'),
  inputPower_kW: Num('ρ·g·Q·H/η summed, kW.'),
  installedPower_kW: Num('Input power at the safety-factored flow, kW.'),
  pumpCapacity_m3_s: Num('Rated flow of one pump set, m³/s.'),
  dutyPumps: Num('Duty pumps: one per deep well plus ⌈header flow / capacity⌉.'),
  standbyPumps: Num('Standby pumps.'),
  undersizedPumpWellIds: Type.Array(Type.String(), { description: 'Deep wells whose rate × safety factor exceeds the pump capacity.' }),
  duration_s: Num('Pumping duration, s.'),
  energy_kWh: Num('Energy over the duration, kWh.'),
  dischargeVolume_m3: Num('Discharge volume over the duration, m³ (for the permit).'),
  energyCost: Num('Bid currency.'),
  pumpedVolumeCost: Num('Bid currency.'),
  wellCost: Num('Bid currency.'),
  totalCost: Num('Bid currency.'),
  quantities: Type.Object({
    wells: Num('Wells used.'),
    wellsByKind: Type.Object({ wellpoint: Type.Number(), deep: Type.Number(), ejector: Type.Number() }),
    screen_m: Num('Screen length, m.'),
    header_m: Num('Well-point header length, m.'),
  }),
  currency: Type.String({ description: 'Currency label of every cost (the designOptions currency; "XXX" = none set, placeholder prices).' }),
  wellCostByKind: Type.Object({ wellpoint: Type.Number(), deep: Type.Number(), ejector: Type.Number() }, { description: 'Well cost per kind: wells of the kind × its price, bid currency.' }),
  efficiencyByKind: Type.Object({ wellpoint: Type.Number(), deep: Type.Number(), ejector: Type.Number() }, { description: 'Wire-to-water efficiency used per well kind (−).' }),
  idleWellIds: Type.Array(Type.String(), { description: 'Design wells left at zero rate: idle, may be omitted; not in quantities or cost.' }),
});
export type PumpSummary = Static<typeof PumpSummarySchema>;

export const QuickCheckSchema = Type.Object({
  excavationId: Type.String(),
  equivalentWellInflow_m3_s: NullableNum('Equivalent-well estimate of the total inflow, m³/s (null when it does not apply).'),
  equivalentRadius_m: NullableNum('sqrt(A/π), m.'),
  superpositionTotal_m3_s: Num('Superposition total of the design, m³/s.'),
  ratio: NullableNum('superposition / equivalent well (−); far from 1 deserves a second look.'),
  boundaryFactor: NullableNum('Factor the image wells of the drawn boundaries put on the unbounded estimate (1 without boundaries).'),
  flags: Type.Array(Type.String(), {
    description: 'Outside the estimate’s validity: elongated-plan, boundary-crosses-equivalent-well, not-developed-by-design-time, implausible-rate (figure withheld), ratio-far-from-one, not-applicable.',
  }),
  validity: Type.String({ description: 'Where the equivalent-well estimate holds.' }),
  note: Type.String(),
});
export type QuickCheck = Static<typeof QuickCheckSchema>;

export const DesignResultSchema = Type.Object(
  {
    mode: DesignModeSchema,
    rateSource: Type.Optional(
      Type.Union([Type.Literal('solved'), Type.Literal('scenario')], { description: 'solved: the solver chose the rates; scenario: the scenario’s own rates were checked as they stand (no solve).' }),
    ),
    feasible: Type.Boolean({ description: 'Every target met within every well limit, verified by the field engine.' }),
    totalRate_m3_s: Num('Sum of the design rates, m³/s (abstraction; injection wells are in injectionRate_m3_s).'),
    injectionRate_m3_s: Type.Optional(Num('Water put back by injection wells, m³/s (positive; present when the scenario has injection wells).')),
    receptors: Type.Optional(Type.Array(ReceptorResultSchema, { description: 'Receptors (neighbours) under the design: drawdown, settlement, angular distortion (present when the scenario has receptors).' })),
    wells: Type.Array(DesignWellResultSchema),
    excavations: Type.Array(DesignExcavationResultSchema),
    reasons: Type.Array(DesignReasonSchema, { description: 'Why targets cannot be met (empty when feasible).' }),
    designTime_s: NullableNum('Design time, s; null for steady state.'),
    limitCheckTime_s: NullableNum('Time the well limits were checked at, s.'),
    controlPoints: Type.Array(DesignControlPointResultSchema),
    timeSeries: Type.Union([DesignTimeSeriesSchema, Type.Null()]),
    outOfService: Type.Union([OutOfServiceCheckSchema, Type.Null()]),
    summary: PumpSummarySchema,
    quickCheck: Type.Array(QuickCheckSchema),
    rateRounding: Type.Optional(RateRoundingSchema),
    sensitivity: Type.Optional(SensitivityResultSchema),
    uncertainty: Type.Optional(UncertaintyResultSchema),
    robust: Type.Optional(Type.Array(RobustDesignSchema, { description: 'Robust design options (designOptions.robust), each beside the ordinary design.' })),
    chosenWellIds: Type.Optional(Type.Array(Type.String(), { description: 'Layout mode: wells chosen for installation.' })),
    solver: Type.Object({
      status: Type.String(),
      rounds: Num('Solve rounds (control points added where the check grid stood above target; limit linearisation narrowed).'),
      objective: NullableNum('Objective of the last solve.'),
      layoutStatus: Type.Optional(Type.String({ description: 'Layout mode: how the integer search ended.' })),
      mipGap: Type.Optional(Num('Layout mode: relative gap between the chosen layout’s cost and the best bound.')),
      solveTime_ms: Num('Time in the LP/MIP solver, ms.'),
    }),
    cautions: Type.Array(Type.String()),
    modelNotes: Type.Array(Type.String()),
    warnings: Type.Array(ScenarioWarningSchema, { description: 'Scenario fields accepted but probably not meant, by JSON pointer (not errors).' }),
  },
  { description: 'A design (design.md section 4) with its checks, bid summary and cautions.' },
);
export type DesignResult = Static<typeof DesignResultSchema>;
