import { describe, expect, it } from 'vitest';
import { WELL_FUNCTION_ACCURACY } from '../../../shared/wells';
import { loadWellFunctionReference } from './reference-values';

describe('WELL_FUNCTION_ACCURACY', () => {
  it.each(Object.entries(WELL_FUNCTION_ACCURACY))(
    'documents for %s a measured accuracy within the required one',
    (_name, entry) => {
      expect(entry.maxRelativeError).toBeGreaterThan(0);
      expect(entry.maxRelativeError).toBeLessThanOrEqual(entry.requiredRelativeError);
      expect(entry.domain.length).toBeGreaterThan(0);
      expect(entry.outside.length).toBeGreaterThan(0);
    },
  );

  it('rests on a reference file that records the library versions that made it', () => {
    const reference = loadWellFunctionReference();
    expect(reference.versions['mpmath']).toMatch(/^\d+\.\d+/);
    expect(reference.versions['python']).toMatch(/^3\./);
  });
});
