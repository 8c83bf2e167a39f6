/**
 * The flat list of point sources an evaluation superposes: every rate step of every pumping
 * well and of each of its image wells, with the per-source constants precomputed so the inner
 * loops (points, grid nodes) do only arithmetic and one well-function call.
 */
import type { Scenario } from '../schema';
import { besselK0, theisWellFunction } from '../wells';
import type { FieldModel } from './field-model';
import { getImageWells, type BoundaryGeometry } from './image-wells';
import { getWellRateSteps, getWellRateAt, type RateStep } from './rate-steps';

/**
 * Sources with u = r²S/(4T·Δt) above this add nothing: W(50) = E1(50) ≈ 3.78e-24 (A&S 5.1.19
 * bounds E1(x) < e^(−x)/x), far below any drawdown that matters, so they are skipped.
 */
export const THEIS_U_CUTOFF = 50;

/** Leaky sources beyond r/B above this add nothing: W(u, β) ≤ 2·K0(β) and K0(60) ≈ 1.6e-27 (A&S 9.7.2). */
export const LEAKY_BETA_CUTOFF = 60;

/** How a source's contribution is computed; one loop per kind keeps the inner loops branch-free. */
export type SourceKind = 'theis' | 'thiem' | 'hantush' | 'de-glee';

/** Structure-of-arrays source list. Contribution of source k at squared distance r² (r² ≥ r2min[k]):
 * - theis:   amp·W(r²·coef)
 * - thiem:   amp·ln(r2cut/r²)/2 for r² < r2cut, else 0 (R² = r2cut)
 * - hantush: amp·W(r²·coef, sqrt(r²)·invB)
 * - de-glee: amp·K0(sqrt(r²)·invB)
 */
export interface SourceSet {
  kind: SourceKind;
  count: number;
  x: Float64Array;
  y: Float64Array;
  /** ΔQ·sign/(4πT) transient, Q·sign/(2πT) steady, m. */
  amp: Float64Array;
  /** Transient: S/(4T·Δt), 1/m² (u = r²·coef). */
  coef: Float64Array;
  /** Squared well radius of the parent well, m²: nearer points are evaluated at r_w. */
  r2min: Float64Array;
  /** Squared distance beyond which the source adds 0 (R² steady, the underflow cutoff otherwise), m². */
  r2cut: Float64Array;
  /** Index of the parent well in scenario.wells. */
  well: Int32Array;
  /** 1 for a real well, 0 for an image. */
  real: Uint8Array;
  /** Leaky: 1/B, 1/m. */
  invB: number;
}

/** Options of {@link buildSourceSet}. */
export interface BuildSourceSetOptions {
  scenario: Scenario;
  model: FieldModel;
  geometry: BoundaryGeometry;
  /** Parallel boundaries: image terms N per side. */
  terms: number;
  /**
   * Rate steps of well i. Default: its schedule / constant rate ({@link getWellRateSteps});
   * steady runs use only the final rate.
   */
  stepsOf?: (wellIndex: number) => RateStep[];
}

/** Rate steps of each well for a model: transient → the schedule; steady → one step of the final rate. */
export function getModelRateSteps(scenario: Scenario, model: FieldModel, wellIndex: number): RateStep[] {
  const w = scenario.wells[wellIndex]!;
  if (model.time_s === null) {
    const q = getWellRateAt(w, null);
    return q === 0 ? [] : [{ from_s: 0, deltaRate_m3_s: q }];
  }
  return getWellRateSteps(w);
}

/** The inner-loop kind of a model's method (unconfined methods superpose like their confined forms). */
export function getSourceKind(model: FieldModel): SourceKind {
  switch (model.method) {
    case 'theis':
    case 'theis-unconfined':
      return 'theis';
    case 'thiem':
    case 'dupuit-thiem':
      return 'thiem';
    case 'hantush-jacob':
      return 'hantush';
    case 'de-glee':
      return 'de-glee';
  }
}

/**
 * Builds the sources for the model's time. A step that has not started by then (Δt ≤ 0) is left
 * out, so at t ≤ 0 nothing pumps.
 */
export function buildSourceSet({ scenario, model, geometry, terms, stepsOf }: BuildSourceSetOptions): SourceSet {
  const kind = getSourceKind(model);
  const T = model.transmissivity_m2_s;
  const S = model.storativity;
  const t = model.time_s;
  const R = model.influenceRadius_m ?? 0;
  const B = model.leakageFactor_m ?? 1;
  const steps = stepsOf ?? ((i: number) => getModelRateSteps(scenario, model, i));

  type Raw = { x: number; y: number; amp: number; coef: number; r2min: number; r2cut: number; well: number; real: number };
  const raw: Raw[] = [];
  scenario.wells.forEach((w, i) => {
    const ws = steps(i);
    if (ws.length === 0) return;
    const images = getImageWells(geometry, w.x, w.y, terms);
    const r2min = w.radius_m * w.radius_m;
    for (const step of ws) {
      let amp: number;
      let coef = 0;
      let r2cut: number;
      if (kind === 'thiem' || kind === 'de-glee') {
        amp = step.deltaRate_m3_s / (2 * Math.PI * T);
        r2cut = kind === 'thiem' ? R * R : (LEAKY_BETA_CUTOFF * B) ** 2;
      } else {
        const dt = (t ?? 0) - step.from_s;
        if (!(dt > 0)) continue;
        amp = step.deltaRate_m3_s / (4 * Math.PI * T);
        coef = S / (4 * T * dt);
        r2cut = THEIS_U_CUTOFF / coef;
        if (kind === 'hantush') r2cut = Math.min(r2cut, (LEAKY_BETA_CUTOFF * B) ** 2);
      }
      if (amp === 0) continue;
      raw.push({ x: w.x, y: w.y, amp, coef, r2min, r2cut, well: i, real: 1 });
      for (const im of images) raw.push({ x: im.x, y: im.y, amp: amp * im.sign, coef, r2min, r2cut, well: i, real: 0 });
    }
  });

  const n = raw.length;
  const set: SourceSet = {
    kind,
    count: n,
    x: new Float64Array(n),
    y: new Float64Array(n),
    amp: new Float64Array(n),
    coef: new Float64Array(n),
    r2min: new Float64Array(n),
    r2cut: new Float64Array(n),
    well: new Int32Array(n),
    real: new Uint8Array(n),
    invB: 1 / B,
  };
  raw.forEach((r, k) => {
    set.x[k] = r.x;
    set.y[k] = r.y;
    set.amp[k] = r.amp;
    set.coef[k] = r.coef;
    set.r2min[k] = r.r2min;
    set.r2cut[k] = r.r2cut;
    set.well[k] = r.well;
    set.real[k] = r.real;
  });
  return set;
}

/**
 * Largest response per 1 m³/s of one source at distance r over the run (for truncation bounds):
 * the response at the longest elapsed time, since every well function grows with time.
 */
export function getMaxUnitResponse(model: FieldModel): (distance_m: number) => number {
  const T = model.transmissivity_m2_s;
  const kind = getSourceKind(model);
  if (kind === 'thiem') {
    const R = model.influenceRadius_m ?? 0;
    return (r) => (r < R ? Math.log(R / r) / (2 * Math.PI * T) : 0);
  }
  const B = model.leakageFactor_m ?? 1;
  if (kind === 'de-glee') return (r) => besselK0(r / B) / (2 * Math.PI * T);
  const t = model.time_s ?? 0;
  if (!(t > 0)) return () => 0;
  const S = model.storativity;
  // Hantush: W(u, β) ≤ min(W(u), 2·K0(β)) since the leakage term only removes drawdown (Hantush 1956).
  return (r) => {
    const w = theisWellFunction((r * r * S) / (4 * T * t));
    const bound = kind === 'hantush' ? Math.min(w, 2 * besselK0(r / B)) : w;
    return bound / (4 * Math.PI * T);
  };
}
