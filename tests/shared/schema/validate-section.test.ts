/** validateSection names the JSON pointer of each bad field of a section document. */
import { describe, expect, it } from 'vitest';
import { DrydigError, parseSection, validateSection, type SectionDocument } from '../../../shared/schema';
import { sheetPileSection } from '../section/sheet-pile-section';

const good = (): SectionDocument => sheetPileSection({ thickness_m: 10, depth_m: 4, head_m: 2, halfWidth_m: 30 });
/** Sets a field to a value its type does not allow (the point of these tests). */
const put = (target: object, key: string, value: unknown) => void ((target as Record<string, unknown>)[key] = value);

describe('validateSection', () => {
  it('accepts the sheet-pile section', () => {
    expect(validateSection(good()).ok).toBe(true);
  });

  it.each([
    ['a wrong format', (d: SectionDocument) => put(d, 'format', 'drydig.scenario'), '/format', 'must be "drydig.section"'],
    ['a text where a number belongs', (d: SectionDocument) => put(d.layers[0]!, 'kh_m_s', '1e-4'), '/layers/0/kh_m_s', 'must be a number'],
    ['a conductivity out of range', (d: SectionDocument) => (d.layers[0]!.kv_m_s = 5), '/layers/0/kv_m_s', ''],
    ['an unknown field', (d: SectionDocument) => put(d.walls![0]!, 'depth_m', 3), '/walls/0/depth_m', 'is not a field'],
    ['a gap between layers', (d: SectionDocument) => d.layers.push({ top_m: -11, bottom_m: -20, kh_m_s: 1e-5, kv_m_s: 1e-5 }), '/layers/1/top_m', 'without gaps'],
    ['a gap between surface segments', (d: SectionDocument) => (d.surface[1]!.x0_m = 1), '/surface/1/x0_m', 'without gaps'],
    ['a surface not reaching the right edge', (d: SectionDocument) => (d.surface[1]!.x1_m = 20), '/surface/1/x1_m', 'right edge'],
    ['a wall on the edge', (d: SectionDocument) => (d.walls![0]!.x_m = 30), '/walls/0/x_m', 'inside the extent'],
    ['a wall toe below the base', (d: SectionDocument) => (d.walls![0]!.toe_m = -12), '/walls/0/toe_m', 'below the impermeable base'],
    ['a well with a head and a rate', (d: SectionDocument) => (d.wells = [{ x_m: 5, screenTop_m: -1, screenBottom_m: -5, head_m: 0, rate_m3_s_per_m: 1e-4 }]), '/wells/0/head_m', 'exactly one'],
    ['a plane well given in m³/s', (d: SectionDocument) => (d.wells = [{ x_m: 5, screenTop_m: -1, screenBottom_m: -5, rate_m3_s: 1e-4 }]), '/wells/0/rate_m3_s', 'rate_m3_s_per_m'],
    ['a screen above the ground', (d: SectionDocument) => (d.wells = [{ x_m: 5, screenTop_m: 1, screenBottom_m: -5, head_m: 0 }]), '/wells/0/screenTop_m', 'above the ground'],
    ['no fixed head at all', (d: SectionDocument) => d.surface.forEach((s) => (s.head_m = null)), '/surface', 'at least one fixed head'],
    ['a drain above the ground', (d: SectionDocument) => (d.drains = [{ x_m: 5, level_m: 2, head_m: 0 }]), '/drains/0/level_m', 'in the soil'],
    ['a mesh with min above max', (d: SectionDocument) => (d.mesh = { minSize_m: 2, maxSize_m: 1 }), '/mesh/minSize_m', 'must not exceed'],
  ])('names the field for %s', (_what, spoil, path, words) => {
    const doc = good();
    spoil(doc);
    const result = validateSection(doc);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues[0]!.path).toBe(path);
    expect(result.issues[0]!.message).toContain(words);
  });

  it('parseSection throws DRYDIG_ERR_INVALID_SECTION with the prefix on the pointer', () => {
    const doc = good();
    doc.extent.x1_m = -40;
    try {
      parseSection(doc, '/section');
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(DrydigError);
      expect((error as DrydigError).code).toBe('DRYDIG_ERR_INVALID_SECTION');
      expect((error as DrydigError).message).toMatch(/^\/section\/extent\/x1_m: /);
    }
  });
});
