/**
 * Stage 1 of a design run: the validated scenario and options, the design wells and the context
 * every later stage shares, and the control and check points.
 */
import { DrydigError, parseScenario, type DesignMode } from '../schema';
import { generateControlPoints, type ControlPoint } from './control-points';
import { resolveDesignOptions } from './design-options';
import { variableConversions, type DesignContext } from './design-context';
import { buildDesignWells } from './well-limits';
import { excavationFloor } from '../floor';
import type { RealisationChunkRunner } from './monte-carlo';
import type { DesignBasis } from './scaled-design';

/**
 * Largest unit-response matrix one design may build (check points × design wells): 5 million
 * entries is 40 MB of Float64 and a few seconds of well-function evaluations.
 */
export const MAX_RESPONSE_ENTRIES = 5_000_000;

export interface RunDesignOptions {
  /** The scenario (validated here; bad fields are named with `scenarioPath` in front). */
  scenario: unknown;
  /** Solve mode; default the scenario's designOptions.mode, else 'optimal'. */
  mode?: DesignMode;
  /** Option overrides (CLI flags, API options), field by field over scenario.designOptions. */
  options?: unknown;
  /** JSON pointer of the scenario in the request for messages. Default ''. */
  scenarioPath?: string;
  /** JSON pointer of the options for messages. Default '/options'. */
  optionsPath?: string;
  /** Progress callback (stage name, fraction 0–1) for long runs. */
  onProgress?: (stage: string, fraction: number) => void;
  /**
   * Monte Carlo realisations (designOptions.monteCarlo): where the chunks run (default in process,
   * one after another), and how many at once. `defer: true` leaves them out of this run: the caller
   * runs them (a service on its pool) from the basis given to `onBasis`.
   */
  monteCarlo?: { runChunk?: RealisationChunkRunner; concurrency?: number; workers?: number; defer?: boolean; signal?: AbortSignal };
  /** Receives the basis of re-solves (plain data) once the ordinary design is known. */
  onBasis?: (basis: DesignBasis) => void;
}

/** The context of one design run. */
export interface DesignSetup {
  ctx: DesignContext;
  /** End of pumping, s: the later of the design time and the pumping duration (null: steady). */
  endTime_s: number | null;
}

/** Validates the input and builds the context: design wells (layout mode: every candidate), times. */
export function prepareDesign(input: RunDesignOptions): DesignSetup {
  const scenario = parseScenario(input.scenario, input.scenarioPath ?? '');
  const options = resolveDesignOptions({ scenario, overrides: input.options, overridesPath: input.optionsPath ?? '/options' });
  const mode: DesignMode = input.mode ?? options.mode;

  const startOf = new Map<string, number>();
  for (const stage of options.stages) for (const id of stage.wellIds) startOf.set(id, stage.start_s);
  const indices = scenario.wells.map((w, i) => ({ w, i })).filter(({ w }) => mode === 'layout' || w.active !== false).map(({ i }) => i);
  const wells = buildDesignWells({ scenario, indices, startOf, headerLevel_m: options.headerLevel_m, suctionLiftLimit_m: options.suctionLiftLimit_m, capacityFactor: options.capacityUtilisationFactor, airEntryCheck: options.airEntryCheck });
  if (options.outOfServiceWell !== null && !wells.some((w) => w.id === options.outOfServiceWell)) {
    const path = `${input.options !== undefined && (input.options as Record<string, unknown>).outOfServiceWell !== undefined ? (input.optionsPath ?? '/options') : '/designOptions'}/outOfServiceWell`;
    throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `${path}: well "${options.outOfServiceWell}" is not one of the design wells (inactive wells are not pumped)`, [
      { path, message: `well "${options.outOfServiceWell}" is not one of the design wells (inactive wells are not pumped)` },
    ]);
  }
  const designTime_s = scenario.design.time_s;
  // Well limits hold in the design state (design time). Constant rates kept on beyond it draw the
  // wells lower still; that is checked at the end of pumping and reported as a caution.
  const limitTime_s = designTime_s;
  const endTime_s = designTime_s === null ? null : Math.max(designTime_s, options.duration_s);
  const floors = new Map(scenario.excavations.map((e) => [e.id, excavationFloor(scenario, e, options.floor)] as const));
  const ctx: DesignContext = {
    floors,
    targetOf: (e) => floors.get(e.id)?.target.targetLevel_m ?? e.formationLevel_m - e.margin_m,
    scenario,
    options,
    mode,
    wells,
    matrixScenario: { ...scenario, wells: scenario.wells.map((w) => ({ ...w, active: false })) },
    designTime_s,
    limitTime_s,
    ...variableConversions(scenario),
  };
  return { ctx, endTime_s };
}

/** Design points (the LP's first rows) and check points (twice as dense, the verification set). */
export interface DesignPoints {
  designPoints: ControlPoint[];
  checkPoints: ControlPoint[];
}

/** Control points at the option's spacing and the check grid; refuses a response matrix too large to build. */
export function placeDesignPoints(ctx: DesignContext): DesignPoints {
  const { options } = ctx;
  const pointOptions = {
    excavations: ctx.scenario.excavations,
    spacing_m: options.controlSpacing_m,
    userPoints: options.controlPoints,
    userPointsPath: options.controlPointsPath,
    spacingPath: options.controlSpacingPath,
    targetOf: ctx.targetOf,
  };
  const designPoints = generateControlPoints(pointOptions);
  const checkPoints = generateControlPoints({ ...pointOptions, densify: 2 });
  const nW = ctx.wells.length;
  if (checkPoints.length * nW > MAX_RESPONSE_ENTRIES) {
    const path = options.controlSpacingPath;
    throw new DrydigError(
      'DRYDIG_ERR_INVALID_REQUEST',
      `${path}: ${checkPoints.length} check points × ${nW} wells is more than the ${MAX_RESPONSE_ENTRIES} unit responses one design may use; give a coarser control spacing or fewer candidate wells`,
      [{ path, message: `gives ${checkPoints.length} check points for ${nW} wells; use a coarser spacing or fewer candidate wells` }],
    );
  }
  return { designPoints, checkPoints };
}
