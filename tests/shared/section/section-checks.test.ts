/**
 * Section result stages: Terzaghi's heave prism (Terzaghi 1943: FS = W′/U over d × d/2), the
 * plug uplift (vertical equilibrium, EN 1997-1 UPL form unfactored), the flow split to drains and
 * relief wells, and exact identities (antisymmetry of the sheet pile's head; water balance).
 */
import { describe, expect, it } from 'vitest';
import { headOnLine, solveSectionDocument, UNIT_WEIGHT_WATER_KN_M3, buildSectionMesh, assembleSection, solveFivePointPcg, computeSectionFields, findIsolatedCells } from '../../../shared/section';
import { parseSection, type SectionDocument } from '../../../shared/schema';
import { sheetPileSection } from './sheet-pile-section';

describe('Terzaghi heave prism', () => {
  it('weighs the prism d × d/2 against the mean excess head at the toe: FS = γ′·d / (γw·h_a)', () => {
    const doc = sheetPileSection({ thickness_m: 12, depth_m: 4, head_m: 3, halfWidth_m: 50 });
    doc.layers[0]!.unitWeightSat_kN_m3 = 19;
    const r = solveSectionDocument(doc, { flowNet: false });
    const h = r.heave!;
    expect(h.method).toBe('Terzaghi prism');
    expect([h.depth_m, h.width_m]).toEqual([4, 2]);
    expect(h.fs!).toBeCloseTo(((19 - UNIT_WEIGHT_WATER_KN_M3) * 4) / (UNIT_WEIGHT_WATER_KN_M3 * h.excessHead_m), 12);
    // Below the toe the head is H/2 by antisymmetry; across the prism it falls away from the wall.
    expect(h.excessHead_m).toBeLessThan(1.5);
    expect(h.excessHead_m).toBeGreaterThan(0.75);
  });

  it('keeps the head on the line below the toe at H/2 (antisymmetry of the symmetric section)', () => {
    // No floor span: the refinement (and so the mesh) stays mirror-symmetric about the pile.
    const doc = parseSection({ ...sheetPileSection({ thickness_m: 12, depth_m: 4, head_m: 3, halfWidth_m: 50, mesh: { tolerance: 1e-14 } }), floor: undefined });
    const mesh = buildSectionMesh(doc);
    const system = assembleSection(doc, mesh);
    const pcg = solveFivePointPcg(system, { tolerance: 1e-14 });
    const fields = computeSectionFields(doc, mesh, system, pcg.x, findIsolatedCells(mesh, system));
    const iw = mesh.x.indexOf(0);
    for (let j = 0; mesh.z[j + 1]! <= -4; j++) {
      const left = fields.head_m[j * mesh.nx + iw - 1]!;
      const right = fields.head_m[j * mesh.nx + iw]!;
      expect(Math.abs((left + right) / 2 - 1.5)).toBeLessThan(1e-9);
    }
    const ctx = { doc, mesh, system, fields, axi: false };
    expect(Math.abs((headOnLine(ctx, iw - 1, -4) + headOnLine(ctx, iw, -4)) / 2 - 1.5)).toBeLessThan(1e-9);
  });
});

describe('plug uplift and relief', () => {
  const confined = (extra: Partial<SectionDocument> = {}): SectionDocument => ({
    format: 'drydig.section',
    version: 1,
    geometry: 'plane',
    extent: { x0_m: 0, x1_m: 60 },
    layers: [
      { top_m: 10, bottom_m: 6, kh_m_s: 1e-9, kv_m_s: 1e-9, kind: 'plug', unitWeightSat_kN_m3: 19.5 },
      { top_m: 6, bottom_m: -10, kh_m_s: 5e-4, kv_m_s: 2e-4, unitWeightSat_kN_m3: 20 },
    ],
    surface: [
      { x0_m: 0, x1_m: 15, level_m: 8, head_m: 8 },
      { x0_m: 15, x1_m: 60, level_m: 10, head_m: null },
    ],
    walls: [{ x_m: 15, top_m: 11, toe_m: 4 }],
    // The aquifer is fed at the far edge at the outside water level.
    wells: [{ x_m: 60, screenTop_m: 6, screenBottom_m: -10, head_m: 9.5 }],
    ...extra,
  });

  it('compares the total stress of the plug with the water pressure at its base (vertical equilibrium)', () => {
    const r = solveSectionDocument(confined(), { flowNet: false });
    const p = r.plug!;
    expect(p.base_m).toBe(6);
    expect(p.stress_kPa).toBeCloseTo(19.5 * 2, 9);
    // The aquifer barely loses head through the plug: pressure ≈ γw·(9.5 − 6).
    expect(p.pressure_kPa / (UNIT_WEIGHT_WATER_KN_M3 * 3.5)).toBeGreaterThan(0.99);
    expect(p.fs!).toBeCloseTo(p.stress_kPa / p.pressure_kPa, 12);
    expect(p.fs!).toBeLessThan(1.2);
  });

  it('relief wells in the floor take the flow, lower the pressure under the plug and show in the split', () => {
    const relieved = solveSectionDocument(confined({ wells: [
      { x_m: 60, screenTop_m: 6, screenBottom_m: -10, head_m: 9.5 },
      { x_m: 7.5, screenTop_m: 6, screenBottom_m: 0, head_m: 7 },
    ] }), { flowNet: false });
    const plain = solveSectionDocument(confined(), { flowNet: false });
    expect(relieved.plug!.fs!).toBeGreaterThan(plain.plug!.fs!);
    expect(relieved.split.wells[1]!.flow).toBeGreaterThan(0.95 * relieved.flow_m3_s_per_m!);
    // Nearly all of it comes from the aquifer's far edge; a trace seeps down through the plug.
    expect(Math.abs(relieved.split.wells[0]!.flow / relieved.flow_m3_s_per_m! + 1)).toBeLessThan(1e-3);
  });

  it('sends the flow to a floor drain and closes the water balance', () => {
    const doc = sheetPileSection({ thickness_m: 10, depth_m: 4, head_m: 3, halfWidth_m: 40 });
    doc.surface[1]!.head_m = null;
    doc.drains = [{ x_m: 5, level_m: -0.5, head_m: -0.5 }];
    const r = solveSectionDocument(doc, { flowNet: false });
    expect(r.split.drains[0]!.flow).toBeCloseTo(r.flow_m3_s_per_m!, 12);
    expect(r.solver.balanceError).toBeLessThan(1e-8);
    expect(r.exitGradient.max).toBe(0);
    expect(r.exitGradient.fs).toBeNull();
  });
});
