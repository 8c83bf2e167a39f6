/**
 * API errors told to a person: the field's label instead of its JSON pointer, no pointers to API
 * documents, and the message otherwise as the API wrote it.
 */
import { describe, expect, it } from 'vitest';
import { describeErrorPlainly, describeIssuePlainly, fieldLabelFromPointer } from '../../../shared/schema/plain-error';
import { ERROR_TABLE } from '../../../shared/schema';

describe('fieldLabelFromPointer(pointer)', () => {
  it.each([
    ['/level_m', 'level'],
    ['/wells/3/rate_m3_s', 'well 4, rate'],
    ['/excavations/0/outline/2', 'excavation 1, corner 3'],
    ['/designOptions/capacityUtilisationFactor', 'design options, capacity utilisation factor'],
    ['/monitoring/piezometers/1/alertOffset_m', 'monitoring, piezometer 2, alert offset'],
  ])('names %s as "%s"', (pointer, label) => expect(fieldLabelFromPointer(pointer)).toBe(label));
});

describe('describeErrorPlainly(error, labels)', () => {
  const invalid = { code: 'DRYDIG_ERR_INVALID_REQUEST', fix: ERROR_TABLE.DRYDIG_ERR_INVALID_REQUEST.fix };

  it('names the field by the form’s label and drops the pointer and the API document', () => {
    const text = describeErrorPlainly({ ...invalid, message: '/level_m: must be <= 20000', issues: [{ path: '/level_m', message: 'must be <= 20000' }] }, { '/level_m': 'Level' });
    expect(text).toMatch(/^Level: must be at most 20000\./);
    expect(text).not.toContain('/level_m');
    expect(text).not.toContain('openapi');
  });

  it('names a field without a label from its pointer, when the message starts with it', () => {
    const text = describeErrorPlainly({ ...invalid, message: '/wells/0/x: must be a number' });
    expect(text).toMatch(/^Well 1, x: must be a number\./);
    expect(text).not.toContain('/wells/0/x');
  });

  it('keeps a message that names no field as the API wrote it', () => {
    expect(describeErrorPlainly({ code: 'DRYDIG_ERR_NOT_FOUND', message: 'no share link matches this address', fix: 'Ask for a new link.', issues: [{ path: '/token', message: 'unknown link' }] }))
      .toBe('no share link matches this address. Ask for a new link.');
  });

  it('leaves no API document in any fix line of the error table', () => {
    for (const [code, row] of Object.entries(ERROR_TABLE)) {
      const text = describeErrorPlainly({ code, message: 'x', fix: row.fix });
      expect(text, code).not.toMatch(/\/api\/v1\//);
    }
  });
});

describe('describeIssuePlainly(issue)', () => {
  it('names a receptor field by its label and drops a repeated pointer from the message', () => {
    expect(describeIssuePlainly({ path: '/receptors/0/compressibleLayer/mv_m2_kN', message: '/receptors/0/compressibleLayer/mv_m2_kN: must be <= 0.01' }))
      .toBe('Receptor 1, compressible layer, coefficient of volume compressibility m_v: must be at most 0.01');
    expect(describeIssuePlainly({ path: '/wells/2/rate_m3_s', message: 'must be a finite number' })).toBe('Well 3, rate: must be a finite number');
  });
});
