/**
 * Heavy compute requests for the pool tests and the bench: a demo site with many wells on a ring
 * around its pit, evaluated on a fine grid (invented numbers). Cost grows with wells × nodes.
 */
import type { Scenario } from '../../../shared/schema';
import { loadFixture } from './demo-fixtures';

/** The confined demo with `wells` wells on a 60 m ring around its first well. */
export function manyWellScenario(wells: number): Scenario {
  const base = loadFixture('confined');
  const [first] = base.wells;
  const cx = first!.x;
  const cy = first!.y;
  return {
    ...base,
    wells: Array.from({ length: wells }, (_, k) => ({
      id: `R${k}`, kind: 'deep' as const, radius_m: 0.15, rate_m3_s: 0.0005,
      x: cx + 60 * Math.cos((2 * Math.PI * k) / wells), y: cy + 60 * Math.sin((2 * Math.PI * k) / wells),
    })),
  };
}

/** An evaluate body of wells × n × n grid nodes at the design time. */
export function heavyEvaluateBody(wells: number, n: number) {
  const scenario = manyWellScenario(wells);
  const [first] = scenario.wells;
  return { scenario, grid: { origin: [first!.x - 200, first!.y - 200], spacing_m: [400 / n, 400 / n], counts: [n, n] } };
}

/** A small evaluate body: the confined demo at two points. */
export function smallEvaluateBody() {
  const scenario = loadFixture('confined');
  const [first] = scenario.wells;
  return { scenario, points: [[first!.x + 10, first!.y], [first!.x + 20, first!.y]] };
}
