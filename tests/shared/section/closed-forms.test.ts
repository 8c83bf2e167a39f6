/**
 * The section solver against published closed forms and exact identities:
 * - Harr (1962) ch. 5: single sheet pile in a layer of finite depth, q/(kH) = K(k′)/(2K(k)),
 *   k = sin(πd/2T) — values from scripts/reference/section-seepage.py (mpmath, scipy check);
 * - the infinite-depth exit gradient beside a sheet pile, i(x) = H/(π·√(x² + d²)), i = H/(πd) at
 *   the wall (conformal mapping; Harr 1962 ch. 5);
 * - uplift head under a flat impervious floor of width b on a deep layer, h(x) = (H/π)·arccos(2x/b)
 *   (Harr 1962 ch. 4), whose resultant is γw·H·b/2;
 * - Thiem (1906) between two radii in the axisymmetric solver, layered: Q = 2π Σ(K b)·Δh/ln(r2/r1);
 * - a linear head field reproduced to round-off;
 * - anisotropy: kh, kv equal an isotropic k = √(kh·kv) on the section with x scaled by √(kv/kh)
 *   (Harr 1962 ch. 2).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { solveSectionDocument, UNIT_WEIGHT_WATER_KN_M3 } from '../../../shared/section';
import type { SectionDocument } from '../../../shared/schema';
import { flatFloorSection, sheetPileSection } from './sheet-pile-section';

const reference = JSON.parse(readFileSync(new URL('../../../fixtures/reference/section-seepage.json', import.meta.url), 'utf8')) as {
  sheetPile: Array<{ dOverT: string; qOverKH: string }>;
};
const harr = (dOverT: number) => Number(reference.sheetPile.find((r) => Number(r.dOverT) === dOverT)!.qOverKH);

describe('solveSectionDocument against closed forms', () => {
  it.each([
    { dOverT: 0.2, tolerance: 0.005 },
    { dOverT: 0.5, tolerance: 0.005 },
    { dOverT: 0.8, tolerance: 0.005 },
  ])('reproduces Harr’s sheet pile in a finite layer, d/T = $dOverT, q/(kH) within $tolerance relative', ({ dOverT, tolerance }) => {
    const k = 1e-4;
    const r = solveSectionDocument(sheetPileSection({ thickness_m: 10, depth_m: 10 * dOverT, head_m: 3, halfWidth_m: 60, kh_m_s: k, kv_m_s: k }), { flowNet: false });
    const shape = r.flow_m3_s_per_m! / (k * 3);
    expect(Math.abs(shape / harr(dOverT) - 1)).toBeLessThan(tolerance);
    // All of it passes under the toe.
    expect(r.split.underWalls[0]!.flow).toBeCloseTo(r.flow_m3_s_per_m!, 12);
    expect(r.solver.balanceError).toBeLessThan(1e-8);
  });

  it('gives the infinite-depth exit gradient H/(πd) at the wall within 2 % (layer 40 d deep)', () => {
    const r = solveSectionDocument(sheetPileSection({ thickness_m: 40, depth_m: 1, head_m: 1, halfWidth_m: 80, mesh: { minSize_m: 0.01 } }), { flowNet: false });
    expect(r.exitGradient.max * Math.PI).toBeGreaterThan(0.98);
    expect(r.exitGradient.max * Math.PI).toBeLessThan(1.005);
    expect(r.exitGradient.x_m!).toBeLessThan(0.02);
    // Along the floor near the wall: i(x) = H/(π√(x² + d²)).
    for (const p of r.floor.filter((f) => f.x_m < 3)) expect(Math.abs(p.gradient - 1 / (Math.PI * Math.hypot(p.x_m, 1)))).toBeLessThan(0.01);
    // Critical gradient (20 − 9.81)/9.81 with the assumed unit weight, FS = i_c / i.
    expect(r.exitGradient.criticalGradient).toBeCloseTo((20 - 9.81) / 9.81, 12);
    expect(r.exitGradient.fs!).toBeCloseTo(r.exitGradient.criticalGradient / r.exitGradient.max, 12);
  });

  it('gives the uplift head under a flat impervious floor, h = (H/π) arccos(2x/b), within 1 % of H', () => {
    const r = solveSectionDocument(flatFloorSection({ width_m: 2, thickness_m: 40, head_m: 1, halfWidth_m: 80, mesh: { minSize_m: 0.01 } }), { flowNet: false });
    for (const p of r.floor.filter((f) => Math.abs(f.x_m) < 0.9)) expect(Math.abs(p.head_m - Math.acos(p.x_m) / Math.PI)).toBeLessThan(0.01);
    // Resultant γw·H·b/2 (kN per m): exact by antisymmetry about the centre.
    expect(r.uplift!.force / (UNIT_WEIGHT_WATER_KN_M3 * 1 * 2 / 2)).toBeCloseTo(1, 6);
    expect(r.uplift!.fs!).toBeCloseTo((0.5 * 24 * 2) / r.uplift!.force, 12);
  });

  it('reproduces Thiem between two radii in a layered axisymmetric section to round-off', () => {
    const [r1, r2, h1, h2] = [0.15, 40, 2, 7];
    const doc: SectionDocument = {
      format: 'drydig.section',
      version: 1,
      geometry: 'axisymmetric',
      extent: { x0_m: r1, x1_m: r2 },
      layers: [
        { top_m: 10, bottom_m: 4, kh_m_s: 2e-4, kv_m_s: 5e-5 },
        { top_m: 4, bottom_m: 0, kh_m_s: 6e-4, kv_m_s: 6e-4 },
      ],
      surface: [{ x0_m: r1, x1_m: r2, level_m: 10, head_m: null }],
      wells: [
        { x_m: r1, screenTop_m: 10, screenBottom_m: 0, head_m: h1 },
        { x_m: r2, screenTop_m: 10, screenBottom_m: 0, head_m: h2 },
      ],
      mesh: { tolerance: 1e-14 },
    };
    const r = solveSectionDocument(doc, { flowNet: false, keepFields: true });
    const T = 2e-4 * 6 + 6e-4 * 4;
    const q = (2 * Math.PI * T * (h2 - h1)) / Math.log(r2 / r1);
    expect(Math.abs(r.flow_m3_s! / q - 1)).toBeLessThan(1e-10);
    const { mesh, fields } = r.internal!;
    let worst = 0;
    for (let k = 0; k < mesh.nx * mesh.nz; k++) {
      const i = k % mesh.nx;
      const rc = 0.5 * (mesh.x[i]! + mesh.x[i + 1]!);
      worst = Math.max(worst, Math.abs(fields.head_m[k]! - (h1 + ((h2 - h1) * Math.log(rc / r1)) / Math.log(r2 / r1))));
    }
    expect(worst).toBeLessThan(1e-10);
  });

  it('reproduces a linear head field across layers and a graded mesh to round-off', () => {
    const doc: SectionDocument = {
      format: 'drydig.section',
      version: 1,
      geometry: 'plane',
      extent: { x0_m: -20, x1_m: 35 },
      layers: [
        { top_m: 5, bottom_m: 1, kh_m_s: 3e-5, kv_m_s: 1e-6 },
        { top_m: 1, bottom_m: -2, kh_m_s: 1e-3, kv_m_s: 2e-4 },
        { top_m: -2, bottom_m: -9, kh_m_s: 7e-5, kv_m_s: 7e-5 },
      ],
      surface: [{ x0_m: -20, x1_m: 35, level_m: 5, head_m: null }],
      wells: [
        { x_m: -20, screenTop_m: 5, screenBottom_m: -9, head_m: 12.5 },
        { x_m: 35, screenTop_m: 5, screenBottom_m: -9, head_m: 3.25 },
        // A well on the field's own head takes nothing: it refines the mesh and changes no head.
        { x_m: 4, screenTop_m: 0, screenBottom_m: -5, head_m: 12.5 + ((3.25 - 12.5) * 24) / 55 },
      ],
      mesh: { tolerance: 1e-15, minSize_m: 0.05 },
    };
    const r = solveSectionDocument(doc, { flowNet: false, keepFields: true });
    const { mesh, fields } = r.internal!;
    let worst = 0;
    for (let k = 0; k < mesh.nx * mesh.nz; k++) {
      const xc = 0.5 * (mesh.x[k % mesh.nx]! + mesh.x[(k % mesh.nx) + 1]!);
      worst = Math.max(worst, Math.abs(fields.head_m[k]! - (12.5 + ((3.25 - 12.5) * (xc + 20)) / 55)));
    }
    expect(worst).toBeLessThan(1e-11);
    const q = ((3e-5 * 4 + 1e-3 * 3 + 7e-5 * 7) * (12.5 - 3.25)) / 55;
    expect(Math.abs(r.flow_m3_s_per_m! / q - 1)).toBeLessThan(1e-11);
    expect(Math.abs(r.split.wells[2]!.flow)).toBeLessThan(1e-12 * q);
  });

  it('gives the anisotropic sheet pile the flow of the isotropic one on the transformed section', () => {
    const [kh, kv] = [4e-5, 1e-5];
    // x' = x·√(kv/kh) = x/2, k' = √(kh·kv) = 2e-5; the mesh is scaled with it.
    const aniso = solveSectionDocument(sheetPileSection({ thickness_m: 10, depth_m: 6, head_m: 2, halfWidth_m: 120, kh_m_s: kh, kv_m_s: kv, mesh: { maxSize_m: 0.5, minSize_m: 0.04 } }), { flowNet: false });
    const iso = solveSectionDocument(sheetPileSection({ thickness_m: 10, depth_m: 6, head_m: 2, halfWidth_m: 60, kh_m_s: 2e-5, kv_m_s: 2e-5, mesh: { maxSize_m: 0.5, minSize_m: 0.04 } }), { flowNet: false });
    expect(Math.abs(aniso.flow_m3_s_per_m! / iso.flow_m3_s_per_m! - 1)).toBeLessThan(2e-3);
    expect(Math.abs(aniso.flow_m3_s_per_m! / (2e-5 * 2 * harr(0.6)) - 1)).toBeLessThan(5e-3);
  });

  it('draws a flow net whose tubes each carry the same share of the flow', () => {
    const r = solveSectionDocument(sheetPileSection({ thickness_m: 10, depth_m: 5, head_m: 3, halfWidth_m: 60 }));
    const net = r.flowNet!;
    expect(net.tubes * net.flowPerTube).toBeCloseTo(r.flow_m3_s_per_m!, 10);
    // Near-square fields: N_f/N_d ≈ q/(kH) = 0.5.
    expect(net.tubes).toBe(6);
    expect(net.equipotentials).toHaveLength(11);
    for (const line of [...net.equipotentials, ...net.flowLines]) expect(line.segments.length).toBeGreaterThan(4);
  });
});
