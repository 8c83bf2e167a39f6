/** Helpers shared by the design tests: a tolerance check and small invented scenarios. */
import { expect } from 'vitest';
import type { Scenario, Well } from '../../../shared/schema';

/** |actual − expected| ≤ abs + rel·|expected|, with a message naming both. */
export function expectClose(actual: number, expected: number, { rel = 0, abs = 0 }: { rel?: number; abs?: number }, what = ''): void {
  const tol = abs + rel * Math.abs(expected);
  expect(Math.abs(actual - expected), `${what} ${actual} vs ${expected} (tol ${tol})`).toBeLessThanOrEqual(tol);
}

export interface RingOptions {
  kind: 'confined' | 'unconfined';
  /** Wells on the ring. */
  n: number;
  ringRadius_m: number;
  /** Excavation: regular n-gon of this circumradius, vertices midway (in angle) between the wells. */
  pitRadius_m: number;
}

/** Invented test site: n equal deep wells on a ring around a regular n-gon pit, steady state. */
export function ringScenario({ kind, n, ringRadius_m, pitRadius_m }: RingOptions): Scenario {
  const wells: Well[] = Array.from({ length: n }, (_, k) => ({
    id: `R${k + 1}`,
    x: ringRadius_m * Math.cos((2 * Math.PI * k) / n),
    y: ringRadius_m * Math.sin((2 * Math.PI * k) / n),
    radius_m: 0.2,
    kind: 'deep',
    rate_m3_s: 0.001,
  }));
  const outline = Array.from({ length: n }, (_, k) => {
    const angle = (2 * Math.PI * (k + 0.5)) / n;
    return [pitRadius_m * Math.cos(angle), pitRadius_m * Math.sin(angle)] as [number, number];
  });
  const aquifer =
    kind === 'confined'
      ? { kind, conductivity_m_s: 5e-4, base_m: -30, top_m: 0, staticLevel_m: 10, storativity: 1e-4, influenceRadius_m: 500 }
      : { kind, conductivity_m_s: 5e-4, base_m: -20, staticLevel_m: 10, specificYield: 0.15, influenceRadius_m: 500 };
  return {
    format: 'drydig.scenario',
    version: 1,
    name: `ring test (${kind}, invented)`,
    groundLevel_m: 12,
    aquifer,
    boundaries: [],
    excavations: [{ id: 'pit', outline, formationLevel_m: 4, margin_m: 0.5 }],
    wells,
    design: { time_s: null },
  } as Scenario;
}

/** Invented test site: one deep well at the origin, a 2 m square pit centred at (10, 0), Theis. */
export function singleWellScenario(): Scenario {
  return {
    format: 'drydig.scenario',
    version: 1,
    name: 'single well (invented)',
    groundLevel_m: 10,
    aquifer: { kind: 'confined', conductivity_m_s: 1e-4, base_m: -20, top_m: 0, staticLevel_m: 5, storativity: 1e-4 },
    boundaries: [],
    excavations: [{ id: 'pit', outline: [[9, -1], [11, -1], [11, 1], [9, 1]], formationLevel_m: 2.5, margin_m: 0.5 }],
    wells: [{ id: 'W1', x: 0, y: 0, radius_m: 0.3, kind: 'deep', rate_m3_s: 0.001 }],
    design: { time_s: 86400 },
  };
}

/** Points on each edge and on a fine grid inside a polygon (independent of the solver's control points). */
export function pointsInside(outline: ReadonlyArray<readonly [number, number]>, n: number, inside: (x: number, y: number) => boolean): Array<[number, number]> {
  const xs = outline.map((p) => p[0]);
  const ys = outline.map((p) => p[1]);
  const [x0, x1, y0, y1] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)];
  const out: Array<[number, number]> = [];
  outline.forEach((p, k) => {
    const q = outline[(k + 1) % outline.length]!;
    for (let i = 0; i < n; i++) out.push([p[0] + ((q[0] - p[0]) * i) / n, p[1] + ((q[1] - p[1]) * i) / n]);
  });
  for (let i = 0; i <= n; i++)
    for (let j = 0; j <= n; j++) {
      const x = x0 + ((x1 - x0) * i) / n;
      const y = y0 + ((y1 - y0) * j) / n;
      if (inside(x, y)) out.push([x, y]);
    }
  return out;
}
