import { describe, expect, it } from 'vitest';
import { sichardtCapacity, sichardtEntranceVelocity, wettedScreenLength } from '../../../shared/design';
import { expectClose } from './design-test-helpers';

describe('sichardtCapacity', () => {
  // Sichardt (1928), as given in Powers et al. (2007) and CIRIA C750 (Preene et al. 2016):
  // q_max = 2π·r_w·h_w·√K/15 (SI). Hand calculations, each step written out.
  const cases = [
    // r_w 0.15 m, h_w 18 m, K 3e-4 m/s: √K = 0.0173205081, /15 = 1.15470054e-3 m/s,
    // 2π·0.15·18 = 16.9646003 m², × v = 0.0195890331 m³/s (70.5 m³/h).
    { radius_m: 0.15, wettedLength_m: 18, conductivity_m_s: 3e-4, expected: 0.0195890331 },
    // r_w 0.05 m, h_w 3 m, K 2e-4: √K = 0.0141421356, /15 = 9.42809042e-4, 2π·0.05·3 = 0.942477796,
    // product 8.88576588e-4 m³/s (0.889 L/s).
    { radius_m: 0.05, wettedLength_m: 3, conductivity_m_s: 2e-4, expected: 8.88576588e-4 },
    // r_w 0.3 m, h_w 10 m, K 1e-3: √K = 0.0316227766, /15 = 2.10818511e-3, 2π·0.3·10 = 18.8495559,
    // product 0.0397383531 m³/s.
    { radius_m: 0.3, wettedLength_m: 10, conductivity_m_s: 1e-3, expected: 0.0397383531 },
  ];
  it.each(cases)('gives 2π·r_w·h_w·√K/15 for r_w $radius_m m, h_w $wettedLength_m m, K $conductivity_m_s m/s', (c) => {
    expectClose(sichardtCapacity(c), c.expected, { rel: 1e-8 });
  });

  it('gives no yield for a dry screen', () => {
    expect(sichardtCapacity({ radius_m: 0.1, wettedLength_m: -2, conductivity_m_s: 1e-4 })).toBe(0);
  });

  it('uses the limiting entrance velocity √K/15 m/s', () => {
    // K = 2.25e-4 m/s: √K = 0.015 m/s exactly, /15 = 0.001 m/s.
    expectClose(sichardtEntranceVelocity(2.25e-4), 0.001, { rel: 1e-14 });
  });
});

describe('wettedScreenLength', () => {
  const cases = [
    { top: 6, bottom: 3, level: 10, expected: 3, why: 'level above the screen: all of it' },
    { top: 6, bottom: 3, level: 4.5, expected: 1.5, why: 'level within the screen: the part below' },
    { top: 6, bottom: 3, level: 2, expected: 0, why: 'level below the screen: none' },
  ];
  it.each(cases)('is $expected m when $why', ({ top, bottom, level, expected }) => {
    expect(wettedScreenLength(top, bottom, level)).toBe(expected);
  });
});
