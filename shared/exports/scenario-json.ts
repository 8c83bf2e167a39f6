/**
 * Scenario JSON export: the stored document exactly, pretty-printed. It carries its own
 * `format`/`version`, so importing it back (POST /api/v1/scenarios) gives the same scenario.
 */
import type { Scenario } from '../schema';

/** The scenario as a JSON file (two-space indent, final newline). */
export function writeScenarioJson(scenario: Scenario): string {
  return `${JSON.stringify(scenario, null, 2)}\n`;
}
