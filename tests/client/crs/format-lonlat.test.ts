import { describe, expect, it } from 'vitest';
import { formatLonLat } from '../../../client/crs';

describe('formatLonLat(lon, lat) writes hemispheres', () => {
  it('formats to six decimals', () => {
    expect(formatLonLat(13.3674424, 52.5135792)).toBe('52.513579° N, 13.367442° E');
    expect(formatLonLat(-70.5, -33.25)).toBe('33.250000° S, 70.500000° W');
    expect(formatLonLat(Number.NaN, 0)).toBe('—');
  });
});
