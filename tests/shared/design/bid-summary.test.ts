import { describe, expect, it } from 'vitest';
import { resolveDesignOptions, summariseDesign, type DesignWell, type DesignWellResult } from '../../../shared/design';
import { expectClose, singleWellScenario } from './design-test-helpers';

function well(id: string, kind: DesignWell['kind'], x: number): DesignWell {
  return {
    id, scenarioIndex: 0, x, y: 0, radius_m: 0.15, kind, start_s: 0, screenTop_m: 0, screenBottom_m: -12,
    wellLoss_s2_m5: 0, capacityPerMetre_m2_s: 1, fullScreenCapacity_m3_s: 1, minimumLevel_m: -12, floorKind: 'wetted-screen',
  };
}
function result(w: DesignWell, rate: number, pumpingLevel: number): DesignWellResult {
  return {
    id: w.id, kind: w.kind, x: w.x, y: w.y, rate_m3_s: rate, installed: true, start_s: 0, capacity_m3_s: 1, fullScreenCapacity_m3_s: 1,
    utilisation: rate, pumpingLevel_m: pumpingLevel, minimumPumpingLevel_m: -12, limit: null, head_m: null, flags: [], idle: !(rate > 0),
  };
}

describe('summariseDesign', () => {
  it('sizes deep-well pumps, power, energy, volume and cost as the hand calculation does', () => {
    // Two deep wells, ground 10 m, discharge head 3 m, friction 2 m (options below):
    //   W1: Q 0.01 m³/s, pumping level −4 m → H = 14 + 3 + 2 = 19 m
    //   W2: Q 0.02 m³/s, pumping level −3 m → H = 13 + 3 + 2 = 18 m
    // ρ·g·ΣQH = 1000·9.80665·(0.19 + 0.36) = 5393.6575 W; / η 0.6 = 8989.429167 W.
    // 90 days = 2160 h → 19417.167 kWh; × 0.2 = 3883.433; volume 0.03·7 776 000 = 233 280 m³ × 0.1 = 23 328;
    // wells 2 × 5000 = 10 000. Pumps: one per deep well (2), standby ⌈2·0.5⌉ = 1.
    const scenario = singleWellScenario();
    const options = resolveDesignOptions({ scenario, overrides: { dischargeHead_m: 3, frictionAllowance_m: 2, pumpEfficiency: 0.6, duration_s: 90 * 86400 } });
    const wells = [well('W1', 'deep', 0), well('W2', 'deep', 30)];
    const wellResults = [result(wells[0]!, 0.01, -4), result(wells[1]!, 0.02, -3)];
    const s = summariseDesign({ scenario, options, wells, wellResults, rates: Float64Array.from([0.01, 0.02]), installed: Uint8Array.from([1, 1]) });
    expect(wellResults.map((w) => w.head_m)).toEqual([19, 18]);
    expectClose(s.hydraulicPower_kW, 5.3936575, { rel: 1e-12 });
    expectClose(s.inputPower_kW, 8.989429167, { rel: 1e-9 });
    expectClose(s.energy_kWh, 19417.167, { rel: 1e-7 });
    expectClose(s.energyCost, 3883.4334, { rel: 1e-7 });
    expectClose(s.dischargeVolume_m3, 233280, { rel: 1e-12 });
    expectClose(s.totalCost, 3883.4334 + 23328 + 10000, { rel: 1e-7 });
    expect([s.dutyPumps, s.standbyPumps]).toEqual([2, 1]);
    expectClose(s.designFlow_m3_s, 0.03 * 1.25, { rel: 1e-12 });
    expect(s.quantities).toMatchObject({ wells: 2, screen_m: 24, header_m: 0 });
    // 0.02·1.25 = 0.025 m³/s exceeds the 0.02 m³/s default pump: W2 needs a larger pump.
    expect(s.undersizedPumpWellIds).toEqual(['W2']);
    expect(s.initialRate_m3_s).toBeNull();
  });

  it('adds the initial allowance for a steady design (UFC 3-220-05: about 30 % above steady for the first weeks)', () => {
    const scenario = { ...singleWellScenario(), design: { time_s: null } };
    const options = resolveDesignOptions({ scenario, overrides: { duration_s: 60 * 86400, initialPeriod_s: 14 * 86400 } });
    const wells = [well('W1', 'deep', 0)];
    const s = summariseDesign({ scenario, options, wells, wellResults: [result(wells[0]!, 0.01, -4)], rates: Float64Array.from([0.01]), installed: Uint8Array.from([1]) });
    expectClose(s.initialRate_m3_s!, 0.013, { rel: 1e-12 });
    // Volume: 0.01 · 60 d + 0.3 · 0.01 · 14 d = 0.01 · 86400 · (60 + 4.2) = 55 468.8 m³.
    expectClose(s.dischargeVolume_m3, 55468.8, { rel: 1e-12 });
  });

  it('sizes a well-point header pump from the lowest pumping level and the total flow', () => {
    // 3 well points at 2 m spacing, 0.001 m³/s each, lowest pumping level 5 m, header at ground 10 m:
    // H = 5 + 3 + 2 = 10 m; ρ·g·Q·H = 1000·9.80665·0.003·10 = 294.1995 W. Flow with SF 0.00375 m³/s → 1 duty, 1 standby.
    const scenario = singleWellScenario();
    const options = resolveDesignOptions({ scenario, overrides: {} });
    const wells = [well('P1', 'wellpoint', 0), well('P2', 'wellpoint', 2), well('P3', 'wellpoint', 4)];
    const wellResults = [result(wells[0]!, 0.001, 5.5), result(wells[1]!, 0.001, 5), result(wells[2]!, 0.001, 5.2)];
    const s = summariseDesign({ scenario, options, wells, wellResults, rates: Float64Array.from([0.001, 0.001, 0.001]), installed: Uint8Array.from([1, 1, 1]) });
    expect(s.headerSystemHead_m).toBe(10);
    expectClose(s.hydraulicPower_kW, 0.2941995, { rel: 1e-12 });
    expect([s.dutyPumps, s.standbyPumps]).toEqual([1, 1]);
    expect(s.quantities.header_m).toBe(4);
  });
});
