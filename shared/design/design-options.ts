/**
 * Design options with their defaults filled in. The scenario's `designOptions` is read first,
 * then `overrides` (CLI flags, API `options`) replace it field by field.
 */
import {
  DesignOptionsSchema,
  structuralIssuesOf,
  DrydigError,
  summariseIssues,
  type DesignControlPoint,
  type DesignMode,
  type DesignOptions,
  type DesignStage,
  type FieldIssue,
  type Scenario,
  type WellKind,
} from '../schema';

import { resolveFloorOptions, type FloorCheckOptions } from '../floor/floor-options';

const DAY_S = 86_400;

/** Design options after defaults are applied; see `DesignOptionsSchema` for meanings and units. */
export interface ResolvedDesignOptions {
  mode: DesignMode;
  /** Null: chosen per excavation from its size (see `defaultControlSpacing`). */
  controlSpacing_m: number | null;
  controlPoints: DesignControlPoint[];
  suctionLiftLimit_m: number;
  /** Share of the Sichardt capacity the design may use (−). */
  capacityUtilisationFactor: number;
  /** Well points' pumping level kept above their given screen top (air entry) as a limit row. */
  airEntryCheck: boolean;
  headerLevel_m: number;
  pumpEfficiency: number;
  dischargeHead_m: number;
  frictionAllowance_m: number;
  safetyFactor: number;
  initialRateFactor: number;
  initialPeriod_s: number;
  pumpCapacity_m3_s: number;
  standbyRatio: number;
  energyPrice_per_kWh: number;
  wellCost: number;
  pumpedVolumeCost_per_m3: number;
  duration_s: number;
  stages: DesignStage[];
  layoutTimeLimit_s: number;
  outOfServiceWell: string | null;
  /** Pit-floor checks: EN 1997-1 UPL partial factors and the heave factor. */
  floor: FloorCheckOptions;
  /** Wire-to-water efficiency per well kind (−). */
  efficiencyByKind: Record<WellKind, number>;
  /** Cost of one well per kind, bid currency. */
  wellCostByKind: Record<WellKind, number>;
  /** Currency label of the bid summary. */
  currency: string;
  /** Smallest practical rate, m³/s (0: none). */
  minimumRate_m3_s: number;
  /** Rates rounded up to multiples of this, m³/s (0: none). */
  rateStep_m3_s: number;
  /** Sensitivity table (null: not asked for). */
  sensitivity: { factors: number[]; parameters: Array<'conductivity' | 'storage'> } | null;
  /** Monte Carlo analysis as given (null: not asked for); defaults are filled by `planMonteCarlo`. */
  monteCarlo: NonNullable<DesignOptions['monteCarlo']> | null;
  /** Robust design options. */
  robust: { oneWellOut: boolean; conductivityFactor: number | null };
  /** JSON pointers the control points and spacing came from (for messages). */
  controlPointsPath: string;
  controlSpacingPath: string;
}

/**
 * Defaults. Values marked common practice have no single published source.
 * - capacity utilisation: 1 (the whole Sichardt capacity) keeps earlier designs unchanged; common
 *   practice is 0.8 (`COMMON_CAPACITY_UTILISATION`), and the cautions say so while it is 1.
 * - air entry: off by default for the same reason; the cautions list well points drawn below their screen top.
 * - suction lift 5.5 m: common practice (suction well points work to about 5–6 m below the header).
 * - initial rate factor 1.3: UFC 3-220-05 (2004) suggests initial rates about 30 % above the
 *   computed steady rate while storage is drained.
 * - efficiency 0.6, friction 2 m, safety factor 1.25, standby ratio 0.5: common practice.
 * - prices and costs: placeholders, to be replaced by the bidder's own rates.
 */
/** The utilisation factor common practice applies below Sichardt's capacity (common practice, no single source). */
export const COMMON_CAPACITY_UTILISATION = 0.8;

/** Sensitivity factors on K and S by default: ÷3, ÷2, ×1, ×2, ×3. */
export const DEFAULT_SENSITIVITY_FACTORS: readonly number[] = [1 / 3, 1 / 2, 1, 2, 3];

export const DESIGN_OPTION_DEFAULTS = {
  mode: 'optimal' as DesignMode,
  suctionLiftLimit_m: 5.5,
  capacityUtilisationFactor: 1,
  airEntryCheck: false,
  pumpEfficiency: 0.6,
  dischargeHead_m: 3,
  frictionAllowance_m: 2,
  safetyFactor: 1.25,
  initialRateFactor: 1.3,
  initialPeriod_s: 14 * DAY_S,
  pumpCapacity_m3_s: 0.02,
  standbyRatio: 0.5,
  energyPrice_per_kWh: 0.2,
  wellCost: 5000,
  pumpedVolumeCost_per_m3: 0.1,
  duration_s: 90 * DAY_S,
  layoutTimeLimit_s: 20,
  /** Ejector systems: from memory, roughly 10–30 % overall (Powrie & Roberts 1990; CIRIA C750, 2016) — check the source. */
  ejectorEfficiency: 0.2,
  /** ISO 4217 "no currency": the prices are placeholders until the bidder sets them. */
  currency: 'XXX',
} as const;

function schemaIssues(value: unknown, prefix: string): FieldIssue[] {
  return structuralIssuesOf(DesignOptionsSchema, value, { prefix, unknownField: 'is not a design option (check spelling and units in the name)' });
}

/**
 * Checks a design options object; `prefix` is the JSON pointer it sits at
 * (`/designOptions` in a scenario, `/options` in an API body).
 */
export function validateDesignOptions(value: unknown, prefix: string): FieldIssue[] {
  if (value === undefined) return [];
  if (typeof value !== 'object' || value === null || Array.isArray(value)) return [{ path: prefix, message: 'must be an object' }];
  const issues = schemaIssues(value, prefix);
  // TypeBox accepts NaN and Infinity from JS callers; JSON cannot carry them, so say so here.
  for (const [key, v] of Object.entries(value as Record<string, unknown>)) {
    if (typeof v === 'number' && !Number.isFinite(v)) issues.push({ path: `${prefix}/${key}`, message: 'must be a finite number' });
  }
  return issues;
}

export interface ResolveDesignOptionsOptions {
  scenario: Scenario;
  /** Overrides (CLI flags, API `options`), field by field. */
  overrides?: unknown;
  /** JSON pointer of `overrides` for messages. Default '/options'. */
  overridesPath?: string;
}

/**
 * Reads `scenario.designOptions`, applies `overrides` and the defaults, and checks the result
 * against the scenario (stage and out-of-service wells exist, control points have a target).
 * Throws `DrydigError` (DRYDIG_ERR_INVALID_SCENARIO or DRYDIG_ERR_INVALID_REQUEST) naming the field.
 */
export function resolveDesignOptions({ scenario, overrides, overridesPath = '/options' }: ResolveDesignOptionsOptions): ResolvedDesignOptions {
  const stored = (scenario as Record<string, unknown>).designOptions;
  const storedIssues = validateDesignOptions(stored, '/designOptions');
  if (storedIssues.length > 0) throw new DrydigError('DRYDIG_ERR_INVALID_SCENARIO', summariseIssues(storedIssues), storedIssues);
  const overrideIssues = validateDesignOptions(overrides, overridesPath);
  if (overrideIssues.length > 0) throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', summariseIssues(overrideIssues), overrideIssues);
  const merged: DesignOptions = { ...((stored as DesignOptions | undefined) ?? {}), ...((overrides as DesignOptions | undefined) ?? {}) };
  const origin = (key: keyof DesignOptions) =>
    overrides !== undefined && (overrides as Record<string, unknown>)[key] !== undefined ? overridesPath : '/designOptions';

  const d = DESIGN_OPTION_DEFAULTS;
  const resolved: ResolvedDesignOptions = {
    mode: merged.mode ?? d.mode,
    controlSpacing_m: merged.controlSpacing_m ?? null,
    controlPoints: merged.controlPoints ?? [],
    suctionLiftLimit_m: merged.suctionLiftLimit_m ?? d.suctionLiftLimit_m,
    capacityUtilisationFactor: merged.capacityUtilisationFactor ?? d.capacityUtilisationFactor,
    airEntryCheck: merged.airEntryCheck ?? d.airEntryCheck,
    headerLevel_m: merged.headerLevel_m ?? scenario.groundLevel_m,
    pumpEfficiency: merged.pumpEfficiency ?? d.pumpEfficiency,
    dischargeHead_m: merged.dischargeHead_m ?? d.dischargeHead_m,
    frictionAllowance_m: merged.frictionAllowance_m ?? d.frictionAllowance_m,
    safetyFactor: merged.safetyFactor ?? d.safetyFactor,
    initialRateFactor: merged.initialRateFactor ?? d.initialRateFactor,
    initialPeriod_s: merged.initialPeriod_s ?? d.initialPeriod_s,
    pumpCapacity_m3_s: merged.pumpCapacity_m3_s ?? d.pumpCapacity_m3_s,
    standbyRatio: merged.standbyRatio ?? d.standbyRatio,
    energyPrice_per_kWh: merged.energyPrice_per_kWh ?? d.energyPrice_per_kWh,
    wellCost: merged.wellCost ?? d.wellCost,
    pumpedVolumeCost_per_m3: merged.pumpedVolumeCost_per_m3 ?? d.pumpedVolumeCost_per_m3,
    duration_s: merged.duration_s ?? d.duration_s,
    stages: merged.stages ?? [],
    layoutTimeLimit_s: merged.layoutTimeLimit_s ?? d.layoutTimeLimit_s,
    outOfServiceWell: merged.outOfServiceWell ?? null,
    floor: resolveFloorOptions(merged.floor),
    efficiencyByKind: {
      wellpoint: merged.efficiencyByKind?.wellpoint ?? merged.pumpEfficiency ?? d.pumpEfficiency,
      deep: merged.efficiencyByKind?.deep ?? merged.pumpEfficiency ?? d.pumpEfficiency,
      ejector: merged.efficiencyByKind?.ejector ?? d.ejectorEfficiency,
    },
    wellCostByKind: {
      wellpoint: merged.wellCostByKind?.wellpoint ?? merged.wellCost ?? d.wellCost,
      deep: merged.wellCostByKind?.deep ?? merged.wellCost ?? d.wellCost,
      ejector: merged.wellCostByKind?.ejector ?? merged.wellCost ?? d.wellCost,
    },
    currency: merged.currency ?? d.currency,
    minimumRate_m3_s: merged.minimumRate_m3_s ?? 0,
    rateStep_m3_s: merged.rateStep_m3_s ?? 0,
    sensitivity: merged.sensitivity
      ? { factors: merged.sensitivity.factors ?? [...DEFAULT_SENSITIVITY_FACTORS], parameters: merged.sensitivity.parameters ?? ['conductivity', 'storage'] }
      : null,
    monteCarlo: merged.monteCarlo ?? null,
    robust: { oneWellOut: merged.robust?.oneWellOut ?? false, conductivityFactor: merged.robust?.conductivityFactor ?? null },
    controlPointsPath: `${origin('controlPoints')}/controlPoints`,
    controlSpacingPath: `${origin('controlSpacing_m')}/controlSpacing_m`,
  };

  const issues: FieldIssue[] = [];
  const wellIds = new Set(scenario.wells.map((w) => w.id));
  const staged = new Set<string>();
  resolved.stages.forEach((stage, i) => {
    stage.wellIds.forEach((id, k) => {
      const path = `${origin('stages')}/stages/${i}/wellIds/${k}`;
      if (!wellIds.has(id)) issues.push({ path, message: `no well has id "${id}"` });
      else if (staged.has(id)) issues.push({ path, message: `well "${id}" is in more than one stage` });
      staged.add(id);
    });
    const designTime = scenario.design.time_s;
    if (designTime !== null && stage.start_s >= designTime)
      issues.push({ path: `${origin('stages')}/stages/${i}/start_s`, message: `starts at or after the design time (${designTime} s): these wells could not help reach the target` });
    if (designTime === null && stage.start_s > 0)
      issues.push({ path: `${origin('stages')}/stages/${i}/start_s`, message: 'a steady-state design has no start times; set design.time_s to stage the start' });
  });
  if (resolved.outOfServiceWell !== null && !wellIds.has(resolved.outOfServiceWell))
    issues.push({ path: `${origin('outOfServiceWell')}/outOfServiceWell`, message: `no well has id "${resolved.outOfServiceWell}"` });
  if (resolved.headerLevel_m > scenario.groundLevel_m + 5)
    issues.push({ path: `${origin('headerLevel_m')}/headerLevel_m`, message: `header level (${resolved.headerLevel_m} m) is more than 5 m above ground level (${scenario.groundLevel_m} m)` });
  if (issues.length > 0) {
    const code = issues.every((i) => i.path.startsWith('/designOptions')) ? 'DRYDIG_ERR_INVALID_SCENARIO' : 'DRYDIG_ERR_INVALID_REQUEST';
    throw new DrydigError(code, summariseIssues(issues), issues);
  }
  return resolved;
}
