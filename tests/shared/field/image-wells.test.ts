import { describe, expect, it } from 'vitest';
import {
  chooseParallelTerms,
  evaluatePoints,
  getImageWells,
  getMaxUnitResponse,
  prepareField,
  resolveBoundaryGeometry,
  resolveFieldModel,
} from '../../../shared/field';
import { theisWellFunction } from '../../../shared/wells';
import { DrydigError, type Boundary, type Scenario } from '../../../shared/schema';
import reference from './reference/field-reference.json';
import { confinedAquifer, expectClose, leakyAquifer, scenarioWith, unconfinedAquifer, well } from './field-test-helpers';

/** Second-order one-sided derivative of the drawdown along a direction (x, y) + h·(dx, dy), h ≥ 0. */
function oneSidedSlope(scenario: Scenario, x: number, y: number, dx: number, dy: number, h: number, time_s?: number | null): number {
  const pts: Array<[number, number]> = [0, 1, 2].map((k) => [x + k * h * dx, y + k * h * dy]);
  const [s0, s1, s2] = evaluatePoints({ scenario, points: pts, time_s }).points.map((p) => p.drawdown_m) as [number, number, number];
  return (-3 * s0 + 4 * s1 - s2) / (2 * h);
}

const errorOf = (f: () => unknown): DrydigError => {
  try {
    f();
  } catch (e) {
    if (e instanceof DrydigError) return e;
    throw e;
  }
  throw new Error('expected a DrydigError');
};

describe('one constant-head boundary', () => {
  // Ferris et al. (1962): an image of opposite sign mirrored across the line makes the drawdown on it zero.
  const river: Boundary = { kind: 'constant-head', from: [-100, -40], to: [100, -40] };
  const cases: Array<[string, Scenario, number | null]> = [
    ['confined transient (Theis)', scenarioWith({ aquifer: confinedAquifer(), wells: [well('W', 10, 0, { rate_m3_s: 0.01 })], boundaries: [river] }), 86400],
    ['confined steady (Thiem)', scenarioWith({ aquifer: confinedAquifer({ influenceRadius_m: 500 }), wells: [well('W', 10, 0, { rate_m3_s: 0.01 })], boundaries: [river] }), null],
    ['unconfined transient', scenarioWith({ aquifer: unconfinedAquifer(), wells: [well('W', 10, 0, { rate_m3_s: 0.004 })], boundaries: [river] }), 86400],
    ['leaky transient (Hantush)', scenarioWith({ aquifer: leakyAquifer(), wells: [well('W', 10, 0, { rate_m3_s: 0.01 })], boundaries: [river] }), 86400],
    ['leaky steady (de Glee)', scenarioWith({ aquifer: leakyAquifer(), wells: [well('W', 10, 0, { rate_m3_s: 0.01 })], boundaries: [river] }), null],
  ];
  it.each(cases)('evaluatePoints gives zero drawdown on a constant-head line: %s', (_name, scenario, time_s) => {
    const line: Array<[number, number]> = [-500, -60, 0, 10, 35, 250].map((x) => [x, -40]);
    const { points, model } = evaluatePoints({ scenario, points: line, time_s });
    expect(model.imagesPerWell).toBe(1);
    for (const p of points) expect(Math.abs(p.drawdown_m)).toBeLessThanOrEqual(1e-9);
    // …while the well itself draws down inside the aquifer.
    expect(evaluatePoints({ scenario, points: [[10, -20]], time_s }).points[0]!.drawdown_m).toBeGreaterThan(1e-3);
  });

  it('evaluatePoints flags points across the line as beyond-boundary at the static level', () => {
    const [, scenario] = cases[0]!;
    const p = evaluatePoints({ scenario, points: [[10, -60]] }).points[0]!;
    expect(p).toMatchObject({ drawdown_m: 0, level_m: 8, flags: ['beyond-boundary'] });
  });
});

describe('one no-flow boundary', () => {
  // Ferris et al. (1962): an image of the same sign makes the normal gradient on the line zero.
  const wall: Boundary = { kind: 'no-flow', from: [50, -100], to: [50, 100] };
  const scenario = scenarioWith({ aquifer: confinedAquifer(), wells: [well('W', 20, 5, { rate_m3_s: 0.01 })], boundaries: [wall] });
  const free = scenarioWith({ aquifer: confinedAquifer(), wells: [well('W', 20, 5, { rate_m3_s: 0.01 })] });

  it.each([-30, 0, 5, 40])('evaluatePoints has zero normal gradient on a no-flow line at y = %s m (finite difference)', (y) => {
    const h = 0.01;
    const slope = oneSidedSlope(scenario, 50, y, -1, 0, h);
    const freeSlope = oneSidedSlope(free, 50, y, -1, 0, h);
    expect(Math.abs(freeSlope)).toBeGreaterThan(1e-3); // without the wall the gradient there is real
    expect(Math.abs(slope)).toBeLessThan(1e-6);
  });

  it('evaluatePoints doubles the drawdown of a well on a no-flow line’s image position (same-sign image)', () => {
    const t = 86400;
    const r1 = Math.hypot(20 - 30, 0);
    const r2 = Math.hypot(80 - 30, 0);
    const u = (r: number) => (r * r * 2e-4) / (4 * 5e-3 * t);
    const expected = (0.01 / (4 * Math.PI * 5e-3)) * (theisWellFunction(u(r1)) + theisWellFunction(u(r2)));
    const s = scenarioWith({ aquifer: confinedAquifer(), wells: [well('W', 20, 0, { rate_m3_s: 0.01 })], boundaries: [wall] });
    expectClose(evaluatePoints({ scenario: s, points: [[30, 0]], time_s: t }).points[0]!.drawdown_m, expected, { rel: 1e-13 });
  });
});

describe('two perpendicular boundaries', () => {
  const ref = reference.corner;
  // T = 1.5e-4·20 = 3e-3 m²/s, S = 1e-4 as in the reference.
  const scenario = scenarioWith({
    aquifer: confinedAquifer({ conductivity_m_s: 1.5e-4, storativity: 1e-4 }),
    wells: [well('W', 30, 20, { rate_m3_s: ref.rate_m3_s })],
    boundaries: [
      { kind: 'constant-head', from: [-10, 0], to: [10, 0] },
      { kind: 'no-flow', from: [0, 5], to: [0, 50] },
    ],
    time_s: ref.time_s,
  });

  // Source: mpmath sum of the real well and three images written out in the reference script.
  it.each(ref.cases)('evaluatePoints in a corner at ($x, $y) matches the mpmath image sum', ({ x, y, drawdown_m }) => {
    const { points, model } = evaluatePoints({ scenario, points: [[x, y]] });
    expect(model.imagesPerWell).toBe(3);
    expectClose(points[0]!.drawdown_m, drawdown_m, { rel: 1e-12, abs: 1e-13 });
  });

  it('evaluatePoints in a corner has zero drawdown on the constant-head side and zero gradient across the no-flow side', () => {
    for (const x of [0, 5, 30, 90]) expect(Math.abs(evaluatePoints({ scenario, points: [[x, 0]] }).points[0]!.drawdown_m)).toBeLessThanOrEqual(1e-9);
    for (const y of [3, 20, 70]) expect(Math.abs(oneSidedSlope(scenario, 0, y, 1, 0, 0.01))).toBeLessThan(1e-6);
  });

  it('getImageWells of a corner puts images of the right signs at the mirrored positions', () => {
    const geometry = resolveBoundaryGeometry(scenario);
    expect(geometry.configuration).toBe('perpendicular');
    const images = getImageWells(geometry, 30, 20).map((i) => ({ x: Math.round(i.x * 1e9) / 1e9, y: Math.round(i.y * 1e9) / 1e9, sign: i.sign }));
    expect(images).toEqual(
      expect.arrayContaining([
        { x: 30, y: -20, sign: -1 },
        { x: -30, y: 20, sign: 1 },
        { x: -30, y: -20, sign: -1 },
      ]),
    );
  });
});

describe('two parallel boundaries', () => {
  const ref = reference.strip;
  // Strip rotated by 30° and shifted, to exercise the geometry: ξ across (from the no-flow line), η along.
  const theta = Math.PI / 6;
  const n: [number, number] = [Math.cos(theta), Math.sin(theta)];
  const tdir: [number, number] = [-Math.sin(theta), Math.cos(theta)];
  const O: [number, number] = [100, 50];
  const P = (xi: number, eta: number): [number, number] => [O[0] + xi * n[0] + eta * tdir[0], O[1] + xi * n[1] + eta * tdir[1]];
  const d = ref.spacing_m;
  const scenario = scenarioWith({
    aquifer: confinedAquifer({ conductivity_m_s: 1e-4, storativity: 1e-4 }), // T = 2e-3 m²/s
    wells: [well('W', ...P(ref.well_xi_m, 0), { rate_m3_s: ref.rate_m3_s })],
    boundaries: [
      { kind: 'no-flow', from: P(0, -50), to: P(0, 50) },
      { kind: 'constant-head', from: P(d, 80), to: P(d, -20) },
    ],
    time_s: ref.time_s,
  });

  // Source: mpmath image series to |n| = 400 in the reference script (Ferris et al. 1962).
  it.each(ref.cases)('evaluatePoints in a strip at ξ = $xi_m m, η = $eta_m m matches the long mpmath series within the stated bound', ({ xi_m, eta_m, drawdown_m }) => {
    const { points, model } = evaluatePoints({ scenario, points: [P(xi_m, eta_m)] });
    expect(model.truncationBound_m).toBeDefined();
    // The series is capped at 250 terms per side; for this long time the triangle-inequality bound is a few µm.
    expect(model.truncationBound_m!).toBeLessThanOrEqual(1e-5);
    expectClose(points[0]!.drawdown_m, drawdown_m, { abs: model.truncationBound_m! + 1e-12 });
  });

  it('evaluatePoints truncated with a loose tolerance stays within its stated bound of a 4000-term series', () => {
    const model = resolveFieldModel({ scenario });
    const geometry = resolveBoundaryGeometry(scenario);
    const f = getMaxUnitResponse(model);
    // Longer time than the scenario’s so that many terms matter; bound chosen loose to make N small.
    const loose = chooseParallelTerms({ spacing_m: d, maxUnitResponseAt: f, totalAbsRate_m3_s: ref.rate_m3_s, tolerance_m: 1e-3 });
    const tight = chooseParallelTerms({ spacing_m: d, maxUnitResponseAt: f, totalAbsRate_m3_s: ref.rate_m3_s });
    expect(loose.terms).toBeLessThan(tight.terms);
    expect(loose.bound_m).toBeLessThanOrEqual(1e-3);
    const T = model.transmissivity_m2_s;
    const S = model.storativity;
    const t = ref.time_s;
    const sumWith = (terms: number, x: number, y: number) => {
      const [wx, wy] = P(ref.well_xi_m, 0);
      let s = 0;
      for (const im of [{ x: wx, y: wy, sign: 1 }, ...getImageWells(geometry, wx, wy, terms)]) {
        const r2 = (x - im.x) ** 2 + (y - im.y) ** 2;
        s += im.sign * (ref.rate_m3_s / (4 * Math.PI * T)) * theisWellFunction((r2 * S) / (4 * T * t));
      }
      return s;
    };
    for (const [xi, eta] of [[0, 0], [20, 10], [39.9, -70], [1, 300]] as const) {
      const [x, y] = P(xi, eta);
      const long = sumWith(4000, x, y);
      expect(Math.abs(sumWith(loose.terms, x, y) - long)).toBeLessThanOrEqual(loose.bound_m);
      expect(Math.abs(sumWith(tight.terms, x, y) - long)).toBeLessThanOrEqual(tight.bound_m + 1e-13);
    }
  });

  it('evaluatePoints in a steady strip between two constant-head lines keeps every image within R (bound 0) and zero drawdown on both lines', () => {
    const s = scenarioWith({
      aquifer: confinedAquifer({ influenceRadius_m: 300 }),
      wells: [well('W', 0, 12, { rate_m3_s: 0.01 })],
      boundaries: [
        { kind: 'constant-head', from: [-10, 0], to: [10, 0] },
        { kind: 'constant-head', from: [10, 40], to: [-10, 40] },
      ],
      time_s: null,
    });
    const { points, model } = evaluatePoints({ scenario: s, points: [[0, 0], [50, 0], [0, 40], [-120, 40], [0, 20]] });
    expect(model.truncationBound_m).toBe(0);
    expect(model.imagesPerWell).toBe(4 * 4); // N = ceil(R/(2d)) = 4 terms per side
    for (const p of points.slice(0, 4)) expect(Math.abs(p.drawdown_m)).toBeLessThanOrEqual(1e-9);
    expect(points[4]!.drawdown_m).toBeGreaterThan(0.05);
  });

  it('prepareField states the truncation bound in ModelInfo and its notes', () => {
    const { info } = prepareField({ scenario });
    expect(info.truncationBound_m).toBeGreaterThan(0);
    expect(info.notes.join(' ')).toMatch(/parallel boundaries/);
  });
});

describe('unsupported boundary configurations', () => {
  const base = (boundaries: Boundary[], wells = [well('A', 10, 10, { rate_m3_s: 0.01 }), well('B', 20, 15, { rate_m3_s: 0.01 })]) =>
    scenarioWith({ aquifer: confinedAquifer(), wells, boundaries });
  const h = (y: number): Boundary => ({ kind: 'no-flow', from: [-100, y], to: [100, y] });
  const v = (x: number): Boundary => ({ kind: 'constant-head', from: [x, -100], to: [x, 100] });

  it.each<[string, Scenario, string]>([
    ['three lines', base([h(0), v(0), h(50)]), '/boundaries/2'],
    ['lines crossing at 45°', base([h(0), { kind: 'no-flow', from: [0, 0], to: [100, 100] }]), '/boundaries/1'],
    ['wells on both sides of a line', base([h(12)]), '/wells/0'],
    ['a well on the line', base([h(10)]), '/wells/0'],
    ['wells outside the strip of two parallel lines', base([h(0), h(5)]), '/wells/0'],
    ['coincident parallel lines', base([h(0), { kind: 'constant-head', from: [100, 0], to: [-50, 0] }]), '/boundaries/1'],
  ])('evaluatePoints rejects %s with DRYDIG_ERR_UNSUPPORTED_BOUNDARIES naming %s', (_name, scenario, path) => {
    const e = errorOf(() => evaluatePoints({ scenario, points: [[15, 30]] }));
    expect(e.code).toBe('DRYDIG_ERR_UNSUPPORTED_BOUNDARIES');
    expect(e.issues[0]!.path).toBe(path);
    expect(e.message).toContain(path);
  });

  it('resolveBoundaryGeometry accepts lines drawn within 0.1° of perpendicular and says how far off they are', () => {
    const tilt = Math.tan((0.05 * Math.PI) / 180) * 200; // the line spans 200 m in y
    const g = resolveBoundaryGeometry(base([h(0), { kind: 'constant-head', from: [0, -100], to: [tilt, 100] }]));
    expect(g.configuration).toBe('perpendicular');
    expectClose(g.angleDeviation_deg!, 0.05, { rel: 1e-6 });
  });
});
