import { describe, expect, it } from 'vitest';
import { estimateHeaderLength, pumpCounts, pumpPower, totalDynamicHead } from '../../../shared/design';
import { expectClose } from './design-test-helpers';

describe('totalDynamicHead', () => {
  // Hand calculation: lift from the pumping level to the discharge level, plus discharge head, plus friction.
  const cases = [
    { dischargeLevel_m: 15, pumpingLevel_m: 4.09, dischargeHead_m: 3, frictionAllowance_m: 2, expected: 10.91 + 5 },
    { dischargeLevel_m: 12, pumpingLevel_m: 6.5, dischargeHead_m: 0, frictionAllowance_m: 1.5, expected: 7 },
  ];
  it.each(cases)('is the static lift plus discharge and friction heads ($expected m)', (c) => {
    expectClose(totalDynamicHead(c), c.expected, { abs: 1e-12 });
  });
});

describe('pumpPower', () => {
  it('gives ρ·g·Q·H and ρ·g·Q·H/η', () => {
    // Hand calculation: 1000 kg/m³ · 9.80665 m/s² · 0.02 m³/s · 20 m = 3922.66 W; / 0.6 = 6537.7667 W.
    const p = pumpPower({ rate_m3_s: 0.02, head_m: 20, efficiency: 0.6 });
    expectClose(p.hydraulic_W, 3922.66, { rel: 1e-12 });
    expectClose(p.input_W, 6537.766667, { rel: 1e-9 });
  });

  it('agrees with the US customary water-horsepower form Q[gpm]·H[ft]/3960 within its rounding', () => {
    // Pump-handbook form (common practice; its constant 3960 is rounded and assumes 62.4 lb/ft³):
    // 0.02 m³/s = 317.006 gpm (1 gal = 3.785411784 L), 20 m = 65.6168 ft, WHP = 5.25275 hp,
    // × 745.69987 W/hp = 3917.0 W; within 0.2 % of the SI value.
    const gpm = 0.02 / 3.785411784e-3 * 60;
    const ft = 20 / 0.3048;
    const watts = ((gpm * ft) / 3960) * 745.69987;
    expectClose(pumpPower({ rate_m3_s: 0.02, head_m: 20, efficiency: 1 }).hydraulic_W, watts, { rel: 2e-3 });
  });
});

describe('pumpCounts', () => {
  const cases = [
    { flow_m3_s: 0.0275, pumpCapacity_m3_s: 0.02, standbyRatio: 0.5, duty: 2, standby: 1 },
    { flow_m3_s: 0.1, pumpCapacity_m3_s: 0.02, standbyRatio: 0.5, duty: 5, standby: 3 },
    { flow_m3_s: 0.04, pumpCapacity_m3_s: 0.02, standbyRatio: 1, duty: 2, standby: 2 },
    { flow_m3_s: 0.001, pumpCapacity_m3_s: 0.02, standbyRatio: 0, duty: 1, standby: 1 },
    { flow_m3_s: 0, pumpCapacity_m3_s: 0.02, standbyRatio: 0.5, duty: 0, standby: 0 },
  ];
  it.each(cases)('needs $duty duty and $standby standby pumps for $flow_m3_s m³/s', ({ duty, standby, ...o }) => {
    expect(pumpCounts(o)).toEqual({ duty, standby });
  });
});

describe('estimateHeaderLength', () => {
  it('chains a ring of well points and closes it', () => {
    // Four corners of a 10 m square: 3 sides chained plus the closing side = 40 m.
    expectClose(estimateHeaderLength([[0, 0], [10, 0], [10, 10], [0, 10]]), 40, { abs: 1e-9 });
  });
  it('does not pipe across a gap much wider than the spacing', () => {
    // Two runs of 3 points at 2 m spacing, 50 m apart: 4 + 4 = 8 m of header.
    expectClose(estimateHeaderLength([[0, 0], [2, 0], [4, 0], [54, 0], [56, 0], [58, 0]]), 8, { abs: 1e-9 });
  });
});
