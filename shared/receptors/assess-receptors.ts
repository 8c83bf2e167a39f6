/**
 * Receptors under a design: drawdown at their points from the field engine (design time and over
 * the pumping period), settlement by one-dimensional consolidation, angular distortion between
 * neighbouring points, each against the receptor's limits.
 */
import { evaluatePoints } from '../field';
import { DEFAULT_ALLOWABLE_ANGULAR_DISTORTION, getReceptors, type Receptor, type Scenario } from '../schema';
import { angularDistortions } from './angular-distortion';
import { consolidationSettlement, LARGE_STRAIN_LIMIT } from './consolidation-settlement';
import { receptorSamplePoints, receptorVertices } from './receptor-points';
import type { ReceptorFlag, ReceptorResult } from './receptor-result';

/** A drawdown or settlement this much over its limit counts as over it, m (rounding of the solve). */
const LIMIT_TOLERANCE_M = 1e-4;

export interface AssessReceptorsOptions {
  /** The scenario with the design rates applied. */
  scenario: Scenario;
  /** Design time, s (null: steady state). */
  designTime_s: number | null;
  /** Further times over the dig at which the largest drawdown is sought, s (none for steady state). */
  timeline_s?: readonly number[];
}

/** Times over the dig: the design time, the end of pumping and log-spaced times up to it. */
export function receptorTimeline(designTime_s: number | null, end_s: number | null): number[] {
  if (designTime_s === null || end_s === null) return [];
  const last = Math.max(designTime_s, end_s);
  const out = new Set<number>([designTime_s, last]);
  for (let k = 0; k < 8; k++) out.add(last * Math.pow(10, -2 + (2 * k) / 7));
  return [...out].sort((a, b) => a - b);
}

/** One result per receptor of the scenario (empty when it has none). */
export function assessReceptors({ scenario, designTime_s, timeline_s = [] }: AssessReceptorsOptions): ReceptorResult[] {
  const receptors = getReceptors(scenario);
  if (receptors.length === 0) return [];
  const samples = receptors.map((r) => receptorSamplePoints(r));
  const all = samples.flat();
  const atDesign = evaluatePoints({ scenario, points: all, time_s: designTime_s }).points.map((p) => p.drawdown_m);
  const worst = Float64Array.from(atDesign);
  const rises = atDesign.map((d) => d < 0);
  for (const t of timeline_s) {
    if (t === designTime_s) continue;
    evaluatePoints({ scenario, points: all, time_s: t }).points.forEach((p, i) => {
      if (p.drawdown_m > worst[i]!) worst[i] = p.drawdown_m;
      if (p.drawdown_m < 0) rises[i] = true;
    });
  }
  let offset = 0;
  return receptors.map((r, k) => {
    const n = samples[k]!.length;
    const result = assessOne(r, atDesign.slice(offset, offset + n), Array.from(worst.subarray(offset, offset + n)), rises.slice(offset, offset + n).some(Boolean));
    offset += n;
    return result;
  });
}

function assessOne(r: Receptor, designDrawdowns: number[], worstDrawdowns: number[], headRises: boolean): ReceptorResult {
  const vertices = receptorVertices(r);
  const layer = r.compressibleLayer;
  const flags: ReceptorFlag[] = [];
  const settle = (d: number) => (layer ? consolidationSettlement({ drawdown_m: d, layer }) : null);
  const points = vertices.map(([x, y], i) => ({
    x,
    y,
    drawdown_m: designDrawdowns[i]!,
    settlement_m: settle(designDrawdowns[i]!)?.settlement_m ?? null,
    maxDrawdownOverDig_m: worstDrawdowns[i]!,
    maxSettlementOverDig_m: settle(worstDrawdowns[i]!)?.settlement_m ?? null,
  }));
  const drawdown_m = Math.max(...designDrawdowns);
  const maxDrawdownOverDig_m = Math.max(...worstDrawdowns);
  let settlement_m: number | null = null;
  let differential: number | null = null;
  let beta: number | null = null;
  let critical: number | null = null;
  if (layer) {
    settlement_m = Math.max(...points.map((p) => p.maxSettlementOverDig_m!));
    if (worstDrawdowns.some((d) => Math.abs(settle(d)!.strain) > LARGE_STRAIN_LIMIT)) flags.push('large-strain');
    if (vertices.length > 1) {
      const segments = angularDistortions(vertices, points.map((p) => p.maxSettlementOverDig_m!));
      const top = segments.reduce((a, b) => (b.angularDistortion > a.angularDistortion ? b : a));
      beta = top.angularDistortion;
      critical = top.from;
      differential = Math.max(...segments.map((s) => Math.abs(s.differentialSettlement_m)));
    }
  } else flags.push('no-compressible-layer');
  if (headRises) flags.push('head-rise');
  const allowableBeta = r.allowableAngularDistortion ?? DEFAULT_ALLOWABLE_ANGULAR_DISTORTION;
  const checks: boolean[] = [];
  if (r.maxDrawdown_m !== undefined) {
    const over = maxDrawdownOverDig_m > r.maxDrawdown_m + LIMIT_TOLERANCE_M;
    if (over) flags.push('drawdown-exceeds');
    checks.push(over);
  }
  if (r.allowableSettlement_m !== undefined && settlement_m !== null) {
    const over = settlement_m > r.allowableSettlement_m + LIMIT_TOLERANCE_M;
    if (over) flags.push('settlement-exceeds');
    checks.push(over);
  }
  if (beta !== null) {
    const over = beta > allowableBeta * (1 + 1e-9);
    if (over) flags.push('angular-distortion-exceeds');
    checks.push(over);
  }
  return {
    id: r.id,
    kind: r.kind,
    label: r.label ?? '',
    drawdown_m,
    maxDrawdownOverDig_m,
    maxDrawdown_m: r.maxDrawdown_m ?? null,
    settlement_m,
    allowableSettlement_m: r.allowableSettlement_m ?? null,
    differentialSettlement_m: differential,
    maxAngularDistortion: beta,
    allowableAngularDistortion: allowableBeta,
    criticalSegment: critical,
    points,
    flags,
    status: checks.length === 0 ? 'not-checked' : checks.some(Boolean) ? 'exceeds' : 'ok',
  };
}
