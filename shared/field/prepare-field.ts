/**
 * Everything an evaluation needs before it touches a point: the model, the boundary geometry,
 * the image-series truncation with its bound, the flat source list and the ModelInfo to report.
 */
import { DrydigError, type Scenario } from '../schema';
import { resolveFieldModel, formatMetres, type FieldModel } from './field-model';
import { chooseParallelTerms, countImagesPerWell, resolveBoundaryGeometry, type BoundaryGeometry } from './image-wells';
import { buildSourceSet, getMaxUnitResponse, getModelRateSteps, type SourceSet } from './source-set';
import type { RateStep } from './rate-steps';
import { buildPenetrationTable, type PenetrationTable } from './partial-penetration-sum';
import type { ModelInfo } from './types';

/** A field ready to evaluate. */
export interface PreparedField {
  scenario: Scenario;
  model: FieldModel;
  geometry: BoundaryGeometry;
  /** Parallel boundaries: terms N per side. */
  terms: number;
  sources: SourceSet;
  /** Wells screened over part of the aquifer (Hantush 1961 correction); null when all penetrate fully. */
  penetration: PenetrationTable | null;
  info: ModelInfo;
}

/** Options of {@link prepareField}. */
export interface PrepareFieldOptions {
  scenario: Scenario;
  /** Undefined: the design time; null: steady state. */
  time_s?: number | null;
  /** Override of the rate steps of well i (unit responses); default: the scenario's rates. */
  stepsOf?: (wellIndex: number) => RateStep[];
  /** Rate scale for the truncation bound, m³/s; default Σ|ΔQ| of the steps used. */
  boundRate_m3_s?: number;
}

/** Prepares a field; throws DrydigError naming the field for unusable input. */
export function prepareField({ scenario, time_s, stepsOf, boundRate_m3_s }: PrepareFieldOptions): PreparedField {
  const model = resolveFieldModel({ scenario, time_s });
  const geometry = resolveBoundaryGeometry(scenario);
  refuseSteadyStrip(model, geometry);
  const steps = stepsOf ?? ((i: number) => getModelRateSteps(scenario, model, i));
  const notes = [...model.notes];

  let terms = 0;
  let bound: number | undefined;
  if (geometry.configuration === 'parallel') {
    let total = 0;
    const t = model.time_s;
    scenario.wells.forEach((_, i) => {
      for (const s of steps(i)) if (t === null || s.from_s < t) total += Math.abs(s.deltaRate_m3_s);
    });
    const choice = chooseParallelTerms({
      spacing_m: geometry.spacing_m!,
      maxUnitResponseAt: getMaxUnitResponse(model),
      totalAbsRate_m3_s: boundRate_m3_s ?? total,
    });
    terms = choice.terms;
    bound = choice.bound_m;
    const variable = model.variable === 'discharge-potential' ? 'discharge potential s_c' : 'drawdown';
    notes.push(
      `Two parallel boundaries ${formatMetres(geometry.spacing_m!)} m apart: image series of ${4 * terms} images per well; leaving out the rest changes the ${variable} by at most ${bound.toExponential(2)} m anywhere in the strip (Ferris et al. 1962 images, bound by the triangle inequality).`,
    );
    if (model.variable === 'discharge-potential') {
      notes.push('For the unconfined level the truncation error is the bound times H/(H − s): at most twice the bound where drawdown is under half the saturated thickness.');
    }
    if (bound > 0.01) notes.push('The truncation bound exceeds 1 cm: the strip is narrow for the reach of the drawdown; treat levels as rough.');
  }
  if (geometry.configuration !== 'none') {
    const kinds = geometry.lines.map((l) => `${l.kind} (/boundaries/${l.index})`).join(' and ');
    notes.push(
      `Straight boundaries by image wells (Ferris et al. 1962, USGS WSP 1536-E): ${kinds}; each line is taken as infinite and fully penetrating. Points across a line are outside the modelled aquifer (flag "beyond-boundary").`,
    );
    if (geometry.angleDeviation_deg !== undefined && geometry.angleDeviation_deg > 1e-9) {
      notes.push(`The two lines are ${geometry.angleDeviation_deg.toFixed(3)}° off exactly ${geometry.configuration}; the images treat them as exact.`);
    }
  }

  // A radius of influence inside a well would give that well a negative Thiem drawdown at its face.
  const R = model.influenceRadius_m;
  if (R !== undefined) {
    const i = scenario.wells.findIndex((w) => w.radius_m >= R);
    if (i >= 0) {
      const path = '/aquifer/influenceRadius_m';
      const how = model.influenceRadiusSource === 'sichardt' ? 'Sichardt’s estimate from the design drawdown' : 'the scenario’s value';
      throw new DrydigError('DRYDIG_ERR_INVALID_SCENARIO', `${path}: the radius of influence (${formatMetres(R)} m, ${how}) does not exceed the radius of well "${scenario.wells[i]!.id}" (${scenario.wells[i]!.radius_m} m)`, [
        { path, message: `must exceed every well radius; give a larger influenceRadius_m (${how} is ${formatMetres(R)} m)` },
      ]);
    }
  }
  const sources = buildSourceSet({ scenario, model, geometry, terms, stepsOf: steps });
  const penetration = buildPenetrationTable(scenario, model);
  if (penetration) notes.push(...describePenetration(scenario, model, penetration));
  const info: ModelInfo = {
    method: model.method,
    transmissivity_m2_s: model.transmissivity_m2_s,
    imagesPerWell: countImagesPerWell(geometry, terms),
    notes,
  };
  if (model.influenceRadius_m !== undefined) info.influenceRadius_m = model.influenceRadius_m;
  if (model.influenceRadiusSource !== undefined) info.influenceRadiusSource = model.influenceRadiusSource;
  if (bound !== undefined) info.truncationBound_m = bound;
  return { scenario, model, geometry, terms, sources, penetration, info };
}

/** Notes on the partial-penetration correction: what it does, where it matters, and its time validity. */
function describePenetration(scenario: Scenario, model: FieldModel, table: PenetrationTable): string[] {
  const ratio = table.anisotropyKhKv;
  const D = table.thickness_m;
  const partial = scenario.wells.filter((_, i) => table.screens[i] !== null).length;
  const notes = [
    `${partial} well(s) are screened over part of the aquifer: Hantush's (1961) partial-penetration correction (Kruseman & de Ridder 1994, ch. 10) is added, with Kh/Kv = ${ratio}${scenario.aquifer.anisotropyKhKv === undefined ? ' (default: isotropic; give aquifer.anisotropyKhKv)' : ''}; it matters within about 1.5·D·√(Kh/Kv) = ${formatMetres(1.5 * D * Math.sqrt(ratio))} m of such a well. Plan points are read at the top of the aquifer (the water table when unconfined), pumping levels as the mean over the well's own screen.`,
  ];
  if (model.time_s !== null) {
    const Kv = scenario.aquifer.conductivity_m_s / ratio;
    const late = (D * model.storativity) / (2 * Kv);
    if (model.time_s < late)
      notes.push(`At t = ${formatMetres(model.time_s)} s, earlier than D·S/(2·Kv) = ${formatMetres(late)} s, the late-time correction used is approximate (Kruseman & de Ridder, from memory).`);
  }
  if (model.kind === 'unconfined') notes.push('Unconfined: the correction is taken on the static saturated thickness and added to the discharge potential; the drawn-down thickness near the well is thinner, so treat pumping levels as approximate.');
  return notes;
}

/**
 * Steady pumping between two parallel no-flow lines has no solution without recharge: the
 * drawdown in the strip grows without bound (it becomes linear flow along the strip). A radius of
 * influence there would be arbitrary, so the run is refused unless the aquifer is leaky (de Glee:
 * leakage balances the pumping). A constant-head side makes the configuration one with a
 * steady state and is accepted.
 */
function refuseSteadyStrip(model: FieldModel, geometry: BoundaryGeometry): void {
  if (model.time_s !== null || model.kind === 'leaky' || geometry.configuration !== 'parallel') return;
  if (geometry.lines.some((l) => l.kind === 'constant-head')) return;
  const path = '/design/time_s';
  throw new DrydigError(
    'DRYDIG_ERR_NO_STEADY_STATE',
    `${path}: a steady state between two parallel no-flow boundaries (/boundaries/${geometry.lines[0]!.index} and /boundaries/${geometry.lines[1]!.index}) does not exist: nothing recharges the strip, so drawdown keeps growing; give a design time, make one side constant-head, or use a leaky aquifer`,
    [{ path, message: 'is null (steady state), but the strip between two parallel no-flow boundaries has no steady state without recharge' }],
  );
}
