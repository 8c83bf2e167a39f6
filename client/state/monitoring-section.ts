/**
 * Edits of the scenario's optional `monitoring` section (piezometers, pumping start) on a store
 * draft. Every edit is checked with `validateMonitoring` before it is kept, so the store never
 * holds a monitoring plan the server would refuse; the first issue names its JSON pointer.
 */
import { validateMonitoring, type FieldIssue, type Monitoring, type Piezometer, type Scenario } from '../../shared/schema';

/** Most piezometers the schema allows. */
export const MAX_PIEZOMETERS = 500;

/** The monitoring section of a scenario, or undefined when it has none. */
export function getMonitoringSection(scenario: Scenario): Monitoring | undefined {
  const m = (scenario as Scenario & { monitoring?: unknown }).monitoring;
  return m && typeof m === 'object' && Array.isArray((m as Monitoring).piezometers) ? (m as Monitoring) : undefined;
}

/** The piezometers of a scenario (none when it has no monitoring section). */
export function getPiezometers(scenario: Scenario): Piezometer[] {
  return getMonitoringSection(scenario)?.piezometers ?? [];
}

/**
 * The next id for a new piezometer: PZ1, PZ2 … one past the highest PZn in use. A deleted
 * number is not reused, so readings taken at an old PZ3 never attach to a new one.
 */
export function nextPiezometerId(piezometers: readonly Pick<Piezometer, 'id'>[]): string {
  let highest = 0;
  for (const p of piezometers) {
    const m = /^PZ(\d+)$/.exec(p.id);
    if (m) highest = Math.max(highest, Number(m[1]));
  }
  const taken = new Set(piezometers.map((p) => p.id));
  let k = highest + 1;
  while (taken.has(`PZ${k}`)) k++;
  return `PZ${k}`;
}

/** The monitoring section of a draft, created empty when missing. */
export function ensureMonitoring(draft: Scenario): Monitoring {
  const record = draft as Scenario & { monitoring?: Monitoring };
  if (!getMonitoringSection(draft)) record.monitoring = { piezometers: [] };
  return record.monitoring!;
}

/** Adds a piezometer at (x, y) m on a draft; returns its id. */
export function placePiezometer(draft: Scenario, x: number, y: number): string {
  const m = ensureMonitoring(draft);
  const id = nextPiezometerId(m.piezometers);
  m.piezometers.push({ id, x, y });
  return id;
}

/** Removes a piezometer from a draft (the section stays, with its pumping start). */
export function deletePiezometer(draft: Scenario, id: string): void {
  const m = getMonitoringSection(draft);
  if (m) m.piezometers = m.piezometers.filter((p) => p.id !== id);
}

/** Problems with a draft's monitoring section (empty when it is sound or absent). */
export function monitoringIssues(draft: Scenario): FieldIssue[] {
  return validateMonitoring(draft);
}
