/** validateScenario on the optional `receptors` field: every issue names its JSON pointer. */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { validateScenario } from '../../../shared/schema';

const base = () => JSON.parse(readFileSync(new URL('../../../fixtures/demo-deepwells-confined.json', import.meta.url), 'utf8')) as Record<string, unknown>;
const house = { id: 'house', kind: 'building', geometry: { type: 'LineString', coordinates: [[60, 0], [60, 10]] }, compressibleLayer: { thickness_m: 3, mv_m2_kN: 2e-4 }, allowableSettlement_m: 0.02 };
const paths = (receptors: unknown[]) => {
  const r = validateScenario({ ...base(), receptors });
  return r.ok ? [] : r.issues.map((i) => i.path);
};

describe('validateScenario(scenario with receptors)', () => {
  it('accepts a scenario without receptors and one with a valid receptor', () => {
    expect(validateScenario(base()).ok).toBe(true);
    expect(paths([house, { id: 'pond', kind: 'pond', geometry: { type: 'Point', coordinates: [80, 5] }, maxDrawdown_m: 0.3 }])).toEqual([]);
  });

  it.each([
    { what: 'm_v outside the physical range', receptor: { ...house, compressibleLayer: { thickness_m: 3, mv_m2_kN: 5 } }, path: '/receptors/0/compressibleLayer/mv_m2_kN' },
    { what: 'both m_v and E_oed', receptor: { ...house, compressibleLayer: { thickness_m: 3, mv_m2_kN: 2e-4, oedometerModulus_kPa: 5000 } }, path: '/receptors/0/compressibleLayer' },
    { what: 'neither m_v nor E_oed', receptor: { ...house, compressibleLayer: { thickness_m: 3 } }, path: '/receptors/0/compressibleLayer' },
    { what: 'a negative drawdown limit', receptor: { ...house, maxDrawdown_m: -1 }, path: '/receptors/0/maxDrawdown_m' },
    { what: 'an unknown kind', receptor: { ...house, kind: 'castle' }, path: '/receptors/0/kind' },
    { what: 'a repeated neighbouring point', receptor: { ...house, geometry: { type: 'LineString', coordinates: [[60, 0], [60, 0]] } }, path: '/receptors/0/geometry/coordinates/1' },
    { what: 'an allowable settlement without a layer', receptor: { id: 'x', kind: 'other', geometry: { type: 'Point', coordinates: [0, 0] }, allowableSettlement_m: 0.01 }, path: '/receptors/0/compressibleLayer' },
  ])('names the field for $what', ({ receptor, path }) => {
    expect(paths([receptor])).toContain(path);
  });

  it('names a duplicate receptor id', () => {
    expect(paths([house, house])).toContain('/receptors/1/id');
  });
});
