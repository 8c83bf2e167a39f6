/** buildSectionFromScenario and compareSectionOptions on the demo sites (invented). */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { buildSectionFromScenario, compareSectionOptions } from '../../../shared/section';
import { parseScenario, validateSection } from '../../../shared/schema';

const demo = parseScenario(JSON.parse(readFileSync(new URL('../../../fixtures/demo-deepwells-confined.json', import.meta.url), 'utf8')));

describe('buildSectionFromScenario', () => {
  it('builds a valid half-section across the basement with its wall, floor and outside level', () => {
    const built = buildSectionFromScenario({ scenario: demo });
    expect(validateSection(built.section).ok).toBe(true);
    expect(built.halfWidth_m).toBe(15);
    expect(built.perimeter_m).toBe(120);
    expect(built.section.surface).toEqual([
      { x0_m: 0, x1_m: 15, level_m: 7, head_m: 7 },
      { x0_m: 15, x1_m: 105, level_m: 15, head_m: 13 },
    ]);
    expect(built.section.walls).toEqual([{ x_m: 15, top_m: 15.5, toe_m: 1 }]);
    expect(built.assumptions.some((a) => a.includes('static level'))).toBe(true);
  });

  it('takes the plan model’s head at the edge as the outside level and reads a ground profile’s plain fields', () => {
    const scenario = { ...demo, ground: { layers: [
      { id: 'clay', top_m: 15, bottom_m: 5, kind: 'plug', unitWeightSat_kN_m3: 19.5, unitWeight_kN_m3: 18, conductivity_m_s: 1e-8 },
      { id: 'sand', top_m: 5, bottom_m: -15, kind: 'granular', unitWeightSat_kN_m3: 20, unitWeight_kN_m3: 18, conductivity_m_s: 3e-4 },
    ] } };
    const built = buildSectionFromScenario({ scenario: scenario as typeof demo, outsideHead_m: 11.2, toe_m: -3 });
    expect(built.section.surface[1]!.head_m).toBe(11.2);
    expect(built.section.layers.map((l) => [l.top_m, l.bottom_m, l.kh_m_s, l.kind])).toEqual([[15, 5, 1e-8, 'plug'], [5, -15, 3e-4, 'granular']]);
    expect(validateSection(built.section).ok).toBe(true);
  });
});

describe('compareSectionOptions', () => {
  it('lowers the flow and raises the exit-gradient FS as the toe goes deeper, and adds relief wells and a lower level', () => {
    const built = buildSectionFromScenario({ scenario: demo });
    const c = compareSectionOptions({ ...built.section, mesh: { maxSize_m: 2, minSize_m: 0.2 } }, { toeLevels_m: [1, -4, -9] });
    expect(c.sweep.map((r) => r.toe_m)).toEqual([1, -4, -9]);
    for (let n = 1; n < c.sweep.length; n++) {
      expect(c.sweep[n]!.flow).toBeLessThan(c.sweep[n - 1]!.flow);
      expect(c.sweep[n]!.exitFS!).toBeGreaterThan(c.sweep[n - 1]!.exitFS!);
    }
    expect(c.rows.map((r) => r.kind)).toEqual(['as drawn', 'deeper toe', 'relief wells', 'lower inside level']);
    const relief = c.rows[2]!;
    expect(relief.exitFS!).toBeGreaterThan(c.rows[0]!.exitFS!);
    expect(c.rows[3]!.exitGradient).toBe(0);
  });
});
