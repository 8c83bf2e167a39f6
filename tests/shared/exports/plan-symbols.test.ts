/**
 * The one plan symbol set: the report's plan draws wells and piezometers with the same markup the
 * site plan and the designer map's key use, and every symbol has a key swatch and words.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  PLAN_SYMBOL_LABELS, excavationShortfalls, piezometerSymbolSvg, planSymbolKeys, planSymbolSwatchSvg, receptorColour, receptorPointSymbolSvg, receptorVerdicts,
  renderPlanSvg, wellSymbol, wellSymbolSvg, type PlanSymbolKey,
} from '../../../shared/exports';
import { planExtent } from '../../../shared/exports/plan-results';
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

  it('draws receptors with the shared receptor symbols, coloured by the design verdict, inside the plan extent', () => {
    const neighbours = JSON.parse(readFileSync(new URL('../../../fixtures/demo-neighbours-confined.json', import.meta.url), 'utf8')) as Scenario;
    const verdicts = receptorVerdicts({ receptors: [{ id: 'terrace', status: 'exceeds' }, { id: 'pond', status: 'ok' }] });
    expect(verdicts).toEqual({ terrace: 'exceeds', pond: 'ok' });
    const svg = renderPlanSvg({ scenario: neighbours, receptorVerdicts: verdicts });
    // One group per receptor; the two lines are dashed with a square per point, the pond is a diamond.
    expect(svg.match(/<g data-receptor="/g)).toHaveLength(3);
    expect(svg.match(/class="dd-receptor-line"/g)).toHaveLength(2);
    expect(svg.match(/class="dd-receptor-diamond"/g)).toHaveLength(1);
    const terrace = svg.slice(svg.indexOf('data-receptor="terrace"'), svg.indexOf('data-receptor="main"'));
    expect(terrace).toContain(`stroke="${receptorColour('exceeds')}"`);
    const main = svg.slice(svg.indexOf('data-receptor="main"'), svg.indexOf('data-receptor="pond"'));
    expect(main).toContain(`stroke="${receptorColour(null)}"`);
    expect(receptorColour('ok')).toBe('#009e73');
    expect(receptorPointSymbolSvg(9, 9, '#000')).toContain('M9 1.5L16.5 9L9 16.5L1.5 9Z');
    // Every receptor point lies within the drawn extent.
    const { min, max } = planExtent(neighbours);
    const pts = (neighbours as Scenario & { receptors: Array<{ geometry: { type: string; coordinates: unknown } }> }).receptors
      .flatMap((r) => (r.geometry.type === 'Point' ? [r.geometry.coordinates] : r.geometry.coordinates) as Array<[number, number]>);
    for (const [x, y] of pts) expect(x >= min[0] && x <= max[0] && y >= min[1] && y <= max[1]).toBe(true);
    const keys = planSymbolKeys({ wells: neighbours.wells, piezometerCount: 0, excavationCount: 1, boundaryKinds: [], shortfallKinds: [], receptorTypes: ['LineString', 'Point'] });
    expect(keys).toContain('receptor-point');
    expect(keys).toContain('receptor-line');
  });

  it.each(Object.keys(PLAN_SYMBOL_LABELS) as PlanSymbolKey[])('has a key swatch for %s', (key) => {
    expect(planSymbolSwatchSvg(key)).toMatch(/^<svg [^>]*viewBox="0 0 22 14"[^]*<\/svg>$/);
  });
});
