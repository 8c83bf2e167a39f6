/** The demo scenarios (invented sites, fixtures/README.md), loaded fresh for each test. */
import { readFileSync } from 'node:fs';
import type { Scenario } from '../../../shared/schema';

export const FIXTURE_FILES = {
  unconfined: 'fixtures/demo-wellpoints-unconfined.json',
  confined: 'fixtures/demo-deepwells-confined.json',
} as const;

export function loadFixture(name: keyof typeof FIXTURE_FILES): Scenario {
  return JSON.parse(readFileSync(new URL(`../../../${FIXTURE_FILES[name]}`, import.meta.url), 'utf8')) as Scenario;
}

/** A single-well scenario for checks against closed-form solutions (invented). */
export function singleWellScenario(aquifer: Scenario['aquifer'], rate_m3_s = 0.01): Scenario {
  return {
    format: 'drydig.scenario',
    version: 1,
    name: 'single well (test)',
    groundLevel_m: 10,
    aquifer,
    boundaries: [],
    excavations: [],
    wells: [{ id: 'W1', x: 0, y: 0, radius_m: 0.1, kind: 'deep', rate_m3_s }],
    design: { time_s: 86_400 },
  };
}
