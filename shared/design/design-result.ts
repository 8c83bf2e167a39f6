/**
 * The design result: the JSON contract of design.md section 4 (mode, feasible, totalRate_m3_s,
 * wells, excavations, reasons) plus capacities, times, checks, the pump and bid summary,
 * cautions and model notes. All SI; names carry units.
 */
import type { DesignMode } from '../schema';
import type { ControlPointKind } from './control-points';

/** Why a target cannot be met (stable codes; `message` says it in words). */
export type DesignReasonCode =
  | 'well-capacity'
  | 'wetted-screen'
  | 'suction-lift'
  | 'constant-head-boundary'
  | 'target-below-aquifer-base'
  | 'no-well-influence'
  | 'no-active-wells'
  | 'solver';

export interface DesignReason {
  code: DesignReasonCode;
  message: string;
  /** Wells whose limit binds, when the reason is a well limit. */
  wellIds?: string[];
  /** Excavation concerned, when one. */
  excavationId?: string;
}

/** Which limit caps a well's rate in the solution (null: none binding). */
export type WellLimit = 'capacity' | 'wetted-screen' | 'suction-lift' | null;

export interface DesignWellResult {
  id: string;
  kind: 'wellpoint' | 'deep' | 'ejector';
  x: number;
  y: number;
  /** Design rate, m³/s (0 for a well not used). */
  rate_m3_s: number;
  /** Layout mode: chosen for installation. Other modes: true for every design well. */
  installed: boolean;
  /** Time the well is switched on, s (staged start; 0 otherwise). */
  start_s: number;
  /** Sichardt capacity with the wetted screen at the verified pumping level, m³/s. */
  capacity_m3_s: number;
  /** Sichardt capacity with the whole screen wetted, m³/s. */
  fullScreenCapacity_m3_s: number;
  /** rate / capacity (−); null when the screen is dry but the well is given a rate. */
  utilisation: number | null;
  /** Pumping level in the well at the limit-check time (well loss included), m. */
  pumpingLevel_m: number;
  /** Lowest pumping level allowed (suction lift for well points, screen bottom otherwise), m. */
  minimumPumpingLevel_m: number;
  /** Limit binding in the solve. */
  limit: WellLimit;
  /** Total dynamic head for this well's pump (deep wells, ejectors), m. */
  head_m: number | null;
  flags: string[];
}

export interface DesignCriticalPoint {
  x: number;
  y: number;
  level_m: number;
  targetLevel_m: number;
  kind: ControlPointKind;
}

export interface DesignExcavationResult {
  id: string;
  targetLevel_m: number;
  formationLevel_m: number;
  met: boolean;
  /** Highest computed level inside the excavation minus its target, m (≤ 0 when met). */
  worstShortfall_m: number;
  /** Where that highest level is. */
  critical: DesignCriticalPoint;
  /** Time at which the whole excavation first reaches its target, s (null: not within the design time, or steady). */
  timeToTarget_s: number | null;
  /** All pumps stop at the design time: time until the first control point rises back to formation level, s. */
  recoveryToFormation_s: number | null;
  /** Same at the critical point, s. */
  criticalRecoveryToFormation_s: number | null;
  /** Control points used (design set; check points are twice as dense). */
  controlPointCount: number;
  checkPointCount: number;
}

export interface DesignControlPointResult {
  x: number;
  y: number;
  kind: ControlPointKind;
  excavationId: string | null;
  targetLevel_m: number;
  level_m: number;
  /** First time the point reaches its target, s (null: not by the design time, or steady). */
  timeToTarget_s: number | null;
  flags: string[];
}

export interface LevelTimePoint {
  time_s: number;
  level_m: number;
}

export interface DesignTimeSeries {
  x: number;
  y: number;
  excavationId: string;
  targetLevel_m: number;
  formationLevel_m: number;
  /** Pumping continues: level at the critical point, from the first minute to the end of the chart. */
  pumping: LevelTimePoint[];
  /** All pumps stop at `stop_s`: recovery at the critical point. */
  recovery: LevelTimePoint[];
  stop_s: number;
}

export interface OutOfServiceCheck {
  /** Well taken out (the chosen one, or the one whose loss hurts most). */
  wellId: string;
  chosenBy: 'option' | 'worst-case';
  /** Every target still met with the other wells at their design rates. */
  met: boolean;
  /** Highest level minus target over all excavations with that well out, m. */
  worstShortfall_m: number;
  /** Worst case over every single well out of service. */
  worstWellId: string;
  worstWellShortfall_m: number;
}

export interface PumpSummary {
  /** Computed total flow, m³/s. */
  totalRate_m3_s: number;
  /** Total × safety factor, m³/s: what the pumps and discharge are sized for. */
  designFlow_m3_s: number;
  safetyFactor: number;
  /** Steady designs: initial rate for the first weeks (× initialRateFactor), m³/s; null for transient designs. */
  initialRate_m3_s: number | null;
  initialPeriod_s: number | null;
  /** Well-point / ejector header systems: head at the header pump, m (null when none). */
  headerSystemHead_m: number | null;
  /** Largest deep-well total dynamic head, m (null when none). */
  maxWellHead_m: number | null;
  hydraulicPower_kW: number;
  inputPower_kW: number;
  /** Input power at the safety-factored flow, kW. */
  installedPower_kW: number;
  pumpCapacity_m3_s: number;
  dutyPumps: number;
  standbyPumps: number;
  /** Deep wells whose rate × safety factor exceeds the pump capacity. */
  undersizedPumpWellIds: string[];
  duration_s: number;
  energy_kWh: number;
  /** Discharge volume over the duration, m³ (for the discharge permit). */
  dischargeVolume_m3: number;
  energyCost: number;
  pumpedVolumeCost: number;
  wellCost: number;
  totalCost: number;
  quantities: {
    wells: number;
    wellsByKind: Record<'wellpoint' | 'deep' | 'ejector', number>;
    screen_m: number;
    header_m: number;
  };
}

export interface QuickCheck {
  excavationId: string;
  /** Equivalent-well estimate of the total inflow, m³/s (null when the method does not apply). */
  equivalentWellInflow_m3_s: number | null;
  /** Equivalent radius sqrt(A/π), m. */
  equivalentRadius_m: number | null;
  /** Superposition total (all design wells), m³/s. */
  superpositionTotal_m3_s: number;
  /** superposition / equivalent well (−). Far from 1 deserves a second look. */
  ratio: number | null;
  note: string;
}

export interface DesignResult {
  mode: DesignMode;
  feasible: boolean;
  totalRate_m3_s: number;
  wells: DesignWellResult[];
  excavations: DesignExcavationResult[];
  reasons: DesignReason[];
  /** Design time, s; null for steady state. */
  designTime_s: number | null;
  /** Time at which well limits were checked (the end of pumping for transient designs), s. */
  limitCheckTime_s: number | null;
  /** The design uses this many control points (after refinement) and checks this many. */
  controlPoints: DesignControlPointResult[];
  timeSeries: DesignTimeSeries | null;
  outOfService: OutOfServiceCheck | null;
  summary: PumpSummary;
  quickCheck: QuickCheck[];
  /** Layout mode: ids chosen for installation. */
  chosenWellIds?: string[];
  solver: {
    status: string;
    /** Refinement rounds (control points added where the check grid showed a higher level). */
    rounds: number;
    objective: number | null;
    /** Layout mode: how the integer search ended ('optimal' within the gap, or 'time-limit'). */
    layoutStatus?: string;
    /** Layout mode: relative gap between the chosen layout's cost and the best bound. */
    mipGap?: number;
    solveTime_ms: number;
  };
  cautions: string[];
  modelNotes: string[];
}
