/**
 * Head, pressure and exit gradient along the excavation floor, and the exit-gradient check.
 *
 * The exit gradient is the upward vertical gradient at the floor surface, i = q_z / k_v, from the
 * flux through the top face of each floor cell (finite-volume flux, exact for the discrete
 * solution); it is compared with the critical gradient i_c = γ′/γw = (γsat − γw)/γw of the soil at
 * the floor (Terzaghi 1943; Harr 1962 ch. 2), FS = i_c / i.
 */
import { DEFAULT_REQUIRED_FS, UNIT_WEIGHT_WATER_KN_M3, columnMeasure, columnsIn, floorSpan, unitWeightSat, type SectionContext } from './section-context';

export interface FloorPoint {
  /** Column centre, m. */
  x_m: number;
  /** Floor level, m. */
  level_m: number;
  /** Head at the floor surface, m (the fixed head where one is held, else the head just below). */
  head_m: number;
  /** Water pressure at the floor surface, kPa. */
  pressure_kPa: number;
  /** Upward exit gradient (−); 0 under a slab or a no-flow floor, negative where water enters. */
  gradient: number;
  /** Critical gradient γ′/γw of the soil at the floor. */
  criticalGradient: number;
  /** i_c / i, or null where the gradient is not upward. */
  fs: number | null;
}

export interface ExitGradientCheck {
  method: string;
  /** Largest upward exit gradient on the floor (0 when none is upward). */
  max: number;
  /** Where, m. */
  x_m: number | null;
  criticalGradient: number;
  /** i_c / max, null when no gradient on the floor points upward. */
  fs: number | null;
  requiredFS: number;
  /** Floor stretches where FS < requiredFS, m. */
  unsafe: Array<{ x0_m: number; x1_m: number }>;
}

export const EXIT_GRADIENT_METHOD = 'exit gradient i = q_z/k_v at the floor against i_c = γ′/γw (Terzaghi 1943; Harr 1962)';

/** The floor profile, column by column, left to right. */
export function computeFloorProfile(ctx: SectionContext): FloorPoint[] {
  const { doc, mesh, system, fields } = ctx;
  const span = floorSpan(doc);
  const top = new Map<number, number>();
  system.connections.cell.forEach((k, m) => {
    if (system.connections.kind[m] === 'surface') top.set(k, m);
  });
  return columnsIn(mesh, span.x0_m, span.x1_m).map((i) => {
    const j = mesh.topRow[i]!;
    const k = j * mesh.nx + i;
    const m = top.get(k);
    const level_m = mesh.surface[i]!;
    const head_m = m !== undefined ? system.connections.head_m[m]! : fields.head_m[k]!;
    const q = m !== undefined ? fields.connectionOutflow[m]! : 0;
    const gradient = q / (mesh.kv[k]! * columnMeasure(ctx, i));
    const criticalGradient = (unitWeightSat(doc, mesh.layer[k]!).value - UNIT_WEIGHT_WATER_KN_M3) / UNIT_WEIGHT_WATER_KN_M3;
    return {
      x_m: 0.5 * (mesh.x[i]! + mesh.x[i + 1]!),
      level_m,
      head_m,
      pressure_kPa: UNIT_WEIGHT_WATER_KN_M3 * (head_m - level_m),
      gradient,
      criticalGradient,
      fs: gradient > 0 ? criticalGradient / gradient : null,
    };
  });
}

/** The governing exit gradient and the unsafe stretches of the floor. */
export function checkExitGradient(ctx: SectionContext, floor: readonly FloorPoint[]): ExitGradientCheck {
  const requiredFS = ctx.doc.requiredFS ?? DEFAULT_REQUIRED_FS;
  let worst: FloorPoint | undefined;
  for (const p of floor) if (p.gradient > 0 && (!worst || p.gradient > worst.gradient)) worst = p;
  const unsafe: Array<{ x0_m: number; x1_m: number }> = [];
  const { x } = ctx.mesh;
  const cols = columnsIn(ctx.mesh, floorSpan(ctx.doc).x0_m, floorSpan(ctx.doc).x1_m);
  floor.forEach((p, n) => {
    if (p.fs === null || p.fs >= requiredFS) return;
    const i = cols[n]!;
    const last = unsafe[unsafe.length - 1];
    if (last && Math.abs(last.x1_m - x[i]!) < 1e-9) last.x1_m = x[i + 1]!;
    else unsafe.push({ x0_m: x[i]!, x1_m: x[i + 1]! });
  });
  const criticalGradient = worst?.criticalGradient ?? floor[0]?.criticalGradient ?? 0;
  return {
    method: EXIT_GRADIENT_METHOD,
    max: worst?.gradient ?? 0,
    x_m: worst?.x_m ?? null,
    criticalGradient,
    fs: worst ? worst.criticalGradient / worst.gradient : null,
    requiredFS,
    unsafe,
  };
}
