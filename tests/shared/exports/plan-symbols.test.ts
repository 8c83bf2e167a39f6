/**
 * The one plan symbol set: the report's plan draws wells and piezometers with the same markup the
 * site plan and the designer map's key use, and every symbol has a key swatch and words.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  PLAN_SYMBOL_LABELS, excavationShortfalls, piezometerSymbolSvg, planSymbolSwatchSvg, renderPlanSvg, wellSymbol, wellSymbolSvg, type PlanSymbolKey,
} from '../../../shared/exports';
import type { Scenario } from '../../../shared/schema';

const scenario = JSON.parse(readFileSync(new URL('../../../fixtures/demo-deepwells-confined.json', import.meta.url), 'utf8')) as Scenario;

describe('plan symbols', () => {
  it('renderPlanSvg draws each well with wellSymbolSvg and each piezometer with piezometerSymbolSvg', () => {
    const withPz = { ...scenario, monitoring: { piezometers: [{ id: 'PZ1', x: 389200, y: 5819400 }] } } as Scenario;
    const svg = renderPlanSvg({ scenario: withPz, width_px: 720 });
    const deep = wellSymbol('deep');
    expect(deep.fill).toBe('#1d2730');
    expect(svg.match(/<circle [^>]*fill="#1d2730" stroke="#1d2730" stroke-width="2.2"\/>/g)).toHaveLength(scenario.wells.length);
    expect(svg).toContain('class="dd-pz-ring"');
    expect(svg).not.toContain('fill="#2a2"');
    expect(wellSymbolSvg(10, 10, deep)).toBe('<circle cx="10" cy="10" r="6.5" fill="#1d2730" stroke="#1d2730" stroke-width="2.2"/>');
    expect(piezometerSymbolSvg(9, 9)).toContain('stroke="#e69f00"');
  });

  it('hatches an excavation by the kind of shortfall: floor unsafe where a floor check governs', () => {
    const short = excavationShortfalls({ excavations: [{ id: 'a', met: false, floor: { governing: 'uplift' } }, { id: 'b', met: false }, { id: 'c', met: true }] }, []);
    expect(short).toEqual({ a: 'floor-unsafe', b: 'above-target' });
    const svg = renderPlanSvg({ scenario, shortfall: { basement: 'floor-unsafe' } });
    expect(svg).toContain('data-shortfall="floor-unsafe"');
    expect(svg).toContain('id="dd-hatch-floor-unsafe"');
    expect(svg).toContain('stroke="#a2306f"');
  });

  it.each(Object.keys(PLAN_SYMBOL_LABELS) as PlanSymbolKey[])('has a key swatch for %s', (key) => {
    expect(planSymbolSwatchSvg(key)).toMatch(/^<svg [^>]*viewBox="0 0 22 14"[^]*<\/svg>$/);
  });
});
