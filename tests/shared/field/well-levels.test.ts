import { describe, expect, it } from 'vitest';
import { theisDrawdown, wellLevels } from '../../../shared/field';
import { confinedAquifer, expectClose, scenarioWith, unconfinedAquifer, well } from './field-test-helpers';

describe('wellLevels', () => {
  const T = 5e-3;
  const S = 2e-4;
  const t = 86400;
  const scenario = scenarioWith({
    aquifer: confinedAquifer(),
    wells: [well('A', 0, 0, { rate_m3_s: 0.01, radius_m: 0.15, wellLoss_s2_m5: 2000 }), well('B', 40, 0, { rate_m3_s: 0.005, radius_m: 0.1 }), well('C', 0, 30, { active: false })],
    time_s: t,
  });
  const s = (q: number, r: number) => theisDrawdown({ rate_m3_s: q, transmissivity_m2_s: T, storativity: S, distance_m: r, time_s: t });

  it('wellLevels gives the aquifer level at r_w with every other well superposed, then subtracts C·Q²', () => {
    const [a, b, c] = wellLevels({ scenario });
    // Own well at r_w, the other at its centre distance (Theis superposition, design.md section 5).
    expectClose(a!.aquiferLevel_m, 8 - s(0.01, 0.15) - s(0.005, 40), { rel: 1e-13 });
    expectClose(a!.wellLoss_m, 2000 * 0.01 * 0.01, { rel: 1e-15 }); // C·Q² = 0.2 m
    expectClose(a!.pumpingLevel_m, a!.aquiferLevel_m - 0.2, { rel: 1e-15 });
    expect(a!.flags).toEqual([]); // its own radius is expected, not flagged
    expectClose(b!.aquiferLevel_m, 8 - s(0.005, 0.1) - s(0.01, 40), { rel: 1e-13 });
    expect(b!.wellLoss_m).toBe(0);
    expect(c).toMatchObject({ id: 'C', rate_m3_s: 0, wellLoss_m: 0 });
    expectClose(c!.aquiferLevel_m, 8 - s(0.01, 30) - s(0.005, 50), { rel: 1e-13 });
  });

  it('wellLevels at t = 0 shows the static level and no pumping', () => {
    for (const w of wellLevels({ scenario, time_s: 0 })) expect(w).toMatchObject({ rate_m3_s: 0, aquiferLevel_m: 8, wellLoss_m: 0, pumpingLevel_m: 8 });
  });

  it('wellLevels flags a well whose well loss takes the pumping level below the base, without clamping it', () => {
    // Unconfined, H = 20 m: the face stands about 0.8 m down; C·Q² = 1.5e6 · 0.004² = 24 m takes the well below the base.
    const lossy = scenarioWith({ aquifer: unconfinedAquifer(), wells: [well('A', 0, 0, { rate_m3_s: 0.004, wellLoss_s2_m5: 1.5e6 })] });
    const [a] = wellLevels({ scenario: lossy });
    expect(a!.aquiferLevel_m).toBeGreaterThan(5);
    expectClose(a!.wellLoss_m, 24, { rel: 1e-14 });
    expectClose(a!.pumpingLevel_m, a!.aquiferLevel_m - 24, { rel: 1e-15 });
    expect(a!.pumpingLevel_m).toBeLessThan(-10);
    expect(a!.flags).toEqual(['dewatered']);
    // Confined, top 0 m: the face stays confined (about 6.7 m), C·Q² = 5e5 · 0.004² = 8 m puts the well level below the top.
    const confined = scenarioWith({ aquifer: confinedAquifer(), wells: [well('A', 0, 0, { rate_m3_s: 0.004, wellLoss_s2_m5: 5e5 })] });
    const [b] = wellLevels({ scenario: confined });
    expect(b!.aquiferLevel_m).toBeGreaterThan(0);
    expect(b!.pumpingLevel_m).toBeLessThan(0);
    expect(b!.flags).toEqual(['confined-to-unconfined']);
  });

  it('wellLevels flags a well drawn to the base of an unconfined aquifer', () => {
    const dry = scenarioWith({ aquifer: unconfinedAquifer(), wells: [well('A', 0, 0, { rate_m3_s: 0.2 })] });
    const [a] = wellLevels({ scenario: dry });
    expect(a!.flags).toContain('dewatered');
    expect(a!.aquiferLevel_m).toBe(-10);
  });
});
