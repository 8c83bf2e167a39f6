/**
 * Power failure from the design state (issue 12 items 1 and 8; issue 8 item 5 for steady designs).
 *
 * Outside check: one well in a steady cone with a given radius of influence (Thiem 1906; Dupuit–
 * Thiem when unconfined) stopped at the steady state, recovering by superposition of an injection
 * of the same rate (Theis 1935): s′ = Q/(2πT)·ln(R/r) − Q/(4πT)·E1(r²S/(4Tt′)). Rates, times and
 * levels computed with mpmath by scripts/reference/steady-recovery.py
 * (fixtures/reference/steady-recovery.json).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { designResultToCsv, RECOVERY_NOTES, runDesign } from '../../../shared/design';
import { steadyRecovery } from '../../../shared/field';
import type { Scenario } from '../../../shared/schema';
import reference from '../../../fixtures/reference/steady-recovery.json';
import { expectClose, singleWellScenario } from './design-test-helpers';

const fixture = (name: string): Scenario => JSON.parse(readFileSync(new URL(`../../../fixtures/${name}.json`, import.meta.url), 'utf8'));
const steady = (s: Scenario): Scenario => ({ ...s, design: { ...s.design, time_s: null } });

function steadySingleWell(kind: 'confined' | 'unconfined'): Scenario {
  const s = singleWellScenario();
  const aquifer =
    kind === 'confined'
      ? { ...s.aquifer, influenceRadius_m: reference.confined.influenceRadius_m }
      : { kind: 'unconfined' as const, conductivity_m_s: 1e-4, base_m: -20, staticLevel_m: 5, specificYield: 0.1, influenceRadius_m: reference.unconfined.influenceRadius_m };
  return { ...s, aquifer, design: { time_s: null } } as Scenario;
}

describe('power failure of a steady design (recovery from the steady state)', () => {
  it.each(['confined', 'unconfined'] as const)('matches the steady-cone recovery equation for one %s well', async (kind) => {
    const ref = reference[kind];
    const result = await runDesign({ scenario: steadySingleWell(kind), mode: 'uniform' });
    expect(result.feasible).toBe(true);
    expectClose(result.totalRate_m3_s, ref.rate_m3_s, { rel: 1e-6 }, 'steady rate (Thiem / Dupuit–Thiem)');
    const ex = result.excavations[0]!;
    expectClose(Math.hypot(ex.critical.x, ex.critical.y), ref.criticalDistance_m, { rel: 1e-9 }, 'critical point');
    expectClose(ex.recoveryToFormation_s!, ref.recoveryToFormation_s, { rel: 1e-4 }, 'time back at formation');
    expect(ex.recoveryNote).toBeNull();
    // The recovery curve starts at the design state (target − 1 mm at the critical point), not below it.
    const series = result.timeSeries!;
    expect(series.stop_s).toBeNull();
    expectClose(series.recovery[0]!.level_m, ref.designLevel_m, { abs: 1e-6 }, 'level at the stop');
  });

  it.each(['confined', 'unconfined'] as const)('gives the recovery levels of the equation at times after the stop (%s)', (kind) => {
    const ref = reference[kind];
    const s = steadySingleWell(kind);
    const scenario = { ...s, wells: [{ ...s.wells[0]!, rate_m3_s: ref.rate_m3_s }] } as Scenario;
    const recover = steadyRecovery(scenario);
    const point = [[11, 1]] as const;
    for (const { sinceStop_s, level_m } of ref.levelAt) expectClose(recover(point, sinceStop_s)[0]!.level_m, level_m, { abs: 1e-9 }, `t′ = ${sinceStop_s} s`);
  });

  it('brings the steady well-point demo back at formation in under an hour from its design state', async () => {
    // Before: the pumps stopped after the 90-day transient run, 2.99 m at the critical point, and
    // recovery took about 45 h. From the steady design state (6.5 m) it is well under an hour.
    const result = await runDesign({ scenario: steady(fixture('demo-wellpoints-unconfined')), mode: 'uniform' });
    const ex = result.excavations[0]!;
    expect(result.feasible).toBe(true);
    expect(ex.recoveryToFormation_s).not.toBeNull();
    expect(ex.recoveryToFormation_s!).toBeLessThan(3600);
    expect(ex.recoveryToFormation_s!).toBeGreaterThan(60);
    expectClose(result.timeSeries!.recovery[0]!.level_m, ex.critical.level_m, { abs: 1e-6 }, 'recovery starts at the design state');
    expect(result.cautions.some((c) => c.startsWith('Power failure in a steady design'))).toBe(true);
  });
});

describe('one power-failure figure, at the critical point, only where it applies', () => {
  it('gives one figure with its label and no second, differently defined one', async () => {
    const result = await runDesign({ scenario: fixture('demo-wellpoints-unconfined'), mode: 'uniform' });
    const ex = result.excavations[0]!;
    expect(Object.keys(ex)).not.toContain('criticalRecoveryToFormation_s');
    expect(ex.recoveryToFormation_s).toBeGreaterThan(0);
    const csv = designResultToCsv(result);
    expect(csv).toMatch(/recoveryToFormation \(s\),recoveryNote,/);
    expect(csv).toContain(',at the critical point,');
  });

  it('gives no figure, with the reason, for an infeasible design whose target is not met', async () => {
    // Before: "back at formation level after 0 s … standby must take over".
    const result = await runDesign({ scenario: fixture('demo-wellpoints-unconfined'), mode: 'uniform', options: { suctionLiftLimit_m: 2 } });
    expect(result.feasible).toBe(false);
    const ex = result.excavations[0]!;
    expect(ex.met).toBe(false);
    expect(ex.recoveryToFormation_s).toBeNull();
    expect(ex.recoveryNote).toBe(RECOVERY_NOTES.notMet);
    expect(designResultToCsv(result)).toContain(RECOVERY_NOTES.notMet);
  });

  it('gives no figure where the design holds the head above formation (uplift governs), and times the floor instead', async () => {
    const result = await runDesign({ scenario: fixture('demo-clay-plug-confined'), mode: 'uniform' });
    const ex = result.excavations[0]!;
    expect(ex.floor!.governing).toBe('uplift');
    expect(ex.critical.level_m).toBeGreaterThan(ex.formationLevel_m);
    expect(ex.recoveryToFormation_s).toBeNull();
    expect(ex.recoveryNote).toBe(RECOVERY_NOTES.aboveFormation);
    expect(ex.floor!.timeToUnsafe_s).not.toBeNull();
  });
});

describe('pit floor of a steady design', () => {
  it('gives one safe-dig step at the steady state (time null) and a time to unsafe from the design state', async () => {
    const result = await runDesign({ scenario: steady(fixture('demo-clay-plug-confined')), mode: 'uniform' });
    const floor = result.excavations[0]!.floor!;
    // Before: an empty table for steady designs.
    expect(floor.safeDig).toHaveLength(1);
    expect(floor.safeDig[0]!.time_s).toBeNull();
    expectClose(floor.safeDig[0]!.safeFormationLevel_m, 7, { abs: 1e-3 }, 'dig to formation at the steady state');
    expect(floor.timeToUnsafe_s).not.toBeNull();
    expect(designResultToCsv(result)).toMatch(/\r\nbasement,steady,7\r\n/);
  });
});
