/**
 * A half-section across an excavation built from a scenario: from the excavation's centre line
 * (a no-flow symmetry line at x = 0) through the wall at its half-width and out to a distance
 * where the outside water level is held on the ground. Layers come from the ground profile
 * (`ground.layers` of the excavation, else of the site; design.md §8) when present, else one layer
 * of the aquifer's K from ground to its base. Every choice the scenario does not fix is listed in
 * `assumptions`.
 */
import type { Scenario, SectionDocument, SectionLayer } from '../schema';
import { getPolygonPerimeter } from '../geometry';

export interface SectionFromScenarioOptions {
  scenario: Scenario;
  /** Excavation id. Default the first. */
  excavationId?: string;
  /** Wall toe, m. Default: formation level − max(2 m, outside level − formation level), not below the base. */
  toe_m?: number;
  /** Outside water level, m: the plan model's head at the excavation edge, or by default the static level. */
  outsideHead_m?: number;
  /** Water level held on the floor, m. Default the formation level (water kept at the floor by sumps). */
  insideHead_m?: number;
  /** Distance from the wall to the section's outer edge, m. Default max(30 m, 3 × depth to the base). */
  outsideDistance_m?: number;
}

export interface SectionFromScenario {
  section: SectionDocument;
  /** Excavation perimeter, m: flow per metre × perimeter estimates the excavation's total. */
  perimeter_m: number;
  /** Half-width used, m. */
  halfWidth_m: number;
  excavationId: string;
  assumptions: string[];
}

interface PlainGroundLayer {
  top_m?: unknown;
  bottom_m?: unknown;
  conductivity_m_s?: unknown;
  kind?: unknown;
  unitWeightSat_kN_m3?: unknown;
  id?: unknown;
}

/** The ground profile's layers read as plain fields (the excavation's own profile first). */
function groundLayers(scenario: Scenario, excavationIndex: number): PlainGroundLayer[] | undefined {
  const own = (scenario.excavations[excavationIndex] as unknown as { ground?: { layers?: unknown } }).ground?.layers;
  const site = (scenario as unknown as { ground?: { layers?: unknown } }).ground?.layers;
  const layers = Array.isArray(own) ? own : Array.isArray(site) ? site : undefined;
  return layers as PlainGroundLayer[] | undefined;
}

const num = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

function buildLayers(scenario: Scenario, excavationIndex: number, assumptions: string[]): SectionLayer[] {
  const ground = scenario.groundLevel_m;
  const base = scenario.aquifer.base_m;
  const K = scenario.aquifer.conductivity_m_s;
  const profile = groundLayers(scenario, excavationIndex)?.filter((l) => num(l.top_m) && num(l.bottom_m) && num(l.conductivity_m_s) && (l.top_m as number) > (l.bottom_m as number));
  if (!profile || profile.length === 0) {
    assumptions.push(`one layer from ground (${ground} m) to the aquifer base (${base} m) with the aquifer’s K = ${K} m/s, isotropic (no ground profile in the scenario)`);
    return [{ top_m: ground, bottom_m: base, kh_m_s: K, kv_m_s: K }];
  }
  const layers: SectionLayer[] = [];
  for (const l of profile) {
    const top = Math.min(l.top_m as number, ground);
    const bottom = Math.max(l.bottom_m as number, base);
    if (top <= bottom) continue;
    const k = Math.min(Math.max(l.conductivity_m_s as number, 1e-14), 1);
    layers.push({
      ...(typeof l.id === 'string' ? { id: l.id.slice(0, 64) } : {}),
      top_m: layers.length === 0 ? ground : layers[layers.length - 1]!.bottom_m,
      bottom_m: bottom,
      kh_m_s: k,
      kv_m_s: k,
      ...(l.kind === 'plug' || l.kind === 'granular' ? { kind: l.kind } : {}),
      ...(num(l.unitWeightSat_kN_m3) && l.unitWeightSat_kN_m3 >= 12 && l.unitWeightSat_kN_m3 <= 26 ? { unitWeightSat_kN_m3: l.unitWeightSat_kN_m3 } : {}),
    });
  }
  if (layers.length === 0) return [{ top_m: ground, bottom_m: base, kh_m_s: K, kv_m_s: K }];
  const last = layers[layers.length - 1]!;
  if (last.bottom_m > base + 1e-9) {
    layers.push({ top_m: last.bottom_m, bottom_m: base, kh_m_s: K, kv_m_s: K });
    assumptions.push(`below the ground profile, the aquifer’s K = ${K} m/s down to its base (${base} m)`);
  }
  assumptions.push('each ground-profile layer isotropic (kh = kv = its conductivity); edit kv in the section for anisotropy');
  return layers;
}

/** Half of the shorter side of the outline's bounding box, m. */
function halfWidth(outline: ReadonlyArray<readonly [number, number]>): number {
  const xs = outline.map((p) => p[0]);
  const ys = outline.map((p) => p[1]);
  return Math.min(Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys)) / 2;
}

/** Builds the half-section across one excavation of a validated scenario. */
export function buildSectionFromScenario(options: SectionFromScenarioOptions): SectionFromScenario {
  const { scenario } = options;
  const index = Math.max(0, options.excavationId === undefined ? 0 : scenario.excavations.findIndex((e) => e.id === options.excavationId));
  const e = scenario.excavations[index];
  if (!e) throw new RangeError('the scenario has no excavation to build a section from');
  const assumptions: string[] = [];
  const ground = scenario.groundLevel_m;
  const base = scenario.aquifer.base_m;
  const floor = e.formationLevel_m;
  const b = Math.round(halfWidth(e.outline) * 1000) / 1000;
  assumptions.push(`plane half-section across the narrow width: half-width ${b} m (half the outline’s shorter bounding-box side), centre line a no-flow symmetry line`);
  const outside = options.outsideHead_m ?? scenario.aquifer.staticLevel_m;
  if (options.outsideHead_m === undefined) assumptions.push(`outside water level = the static level (${outside} m), held on the ground outside the wall`);
  const inside = options.insideHead_m ?? floor;
  if (options.insideHead_m === undefined) assumptions.push(`water held at the floor (${floor} m) inside by sump pumping`);
  const retained = Math.max(0, outside - floor);
  const toe = options.toe_m ?? Math.max(base, floor - Math.max(2, retained));
  if (options.toe_m === undefined) assumptions.push(`wall toe ${toe} m (embedment max(2 m, retained head) below the floor; a placeholder until the wall is designed)`);
  const far = options.outsideDistance_m ?? Math.max(30, 3 * (ground - base));
  const layers = buildLayers(scenario, index, assumptions);
  if (scenario.aquifer.kind === 'unconfined') assumptions.push('the section is saturated to the ground (confined flow): the free surface outside the wall is not traced, which overstates the flow somewhat');
  const section: SectionDocument = {
    format: 'drydig.section',
    version: 1,
    name: `${scenario.name} — ${e.id}`.slice(0, 200),
    geometry: 'plane',
    extent: { x0_m: 0, x1_m: b + far },
    layers,
    surface: [
      { x0_m: 0, x1_m: b, level_m: floor, head_m: inside },
      { x0_m: b, x1_m: b + far, level_m: ground, head_m: outside },
    ],
    walls: [{ x_m: b, top_m: ground + 0.5, toe_m: toe }],
    floor: { x0_m: 0, x1_m: b },
  };
  return { section, perimeter_m: getPolygonPerimeter(e.outline), halfWidth_m: b, excavationId: e.id, assumptions };
}
