/**
 * Validates a scenario document: structure against the v1 schema, then the meaning of the fields
 * together (levels in order, parameters the aquifer kind needs, unique ids, sound outlines).
 * Every issue names the JSON pointer of the field at fault.
 */
import { ScenarioSchema, type Scenario } from './scenario-schema';
import { DrydigError, summariseIssues, type FieldIssue } from './error-table';
import { findSelfIntersection, getPolygonArea } from '../geometry/polygon';
import { validatePumpingTestRecord } from './pumping-test-record-schema';
import { validateImportRecords } from './import-record-schema';
import { groundProfileIssues } from './ground-schema';
import { describeStructuralError, structuralIssuesOf } from './structural-issues';

export type ScenarioValidation = { ok: true; scenario: Scenario } | { ok: false; issues: FieldIssue[] };

/** Words a TypeBox structural error (kept here for callers that imported it from this file). */
export { describeStructuralError };

function structuralIssues(input: unknown): FieldIssue[] {
  return structuralIssuesOf(ScenarioSchema, input);
}

function semanticIssues(s: Scenario): FieldIssue[] {
  const issues: FieldIssue[] = [];
  const add = (path: string, message: string) => issues.push({ path, message });
  const a = s.aquifer;

  if (a.base_m >= s.groundLevel_m) add('/aquifer/base_m', `aquifer base (${a.base_m} m) must lie below ground level (${s.groundLevel_m} m)`);
  if (a.staticLevel_m <= a.base_m) add('/aquifer/staticLevel_m', `static level (${a.staticLevel_m} m) must stand above the aquifer base (${a.base_m} m)`);

  if (a.kind === 'confined' || a.kind === 'leaky') {
    if (a.top_m === undefined) add('/aquifer/top_m', `is required for a ${a.kind} aquifer`);
    else {
      if (a.top_m <= a.base_m) add('/aquifer/top_m', `aquifer top (${a.top_m} m) must lie above its base (${a.base_m} m)`);
      if (a.staticLevel_m < a.top_m)
        add('/aquifer/staticLevel_m', `piezometric level (${a.staticLevel_m} m) is below the aquifer top (${a.top_m} m): at rest the aquifer is unconfined; use kind "unconfined"`);
    }
    if (a.storativity === undefined) add('/aquifer/storativity', `is required for a ${a.kind} aquifer`);
  }
  if (a.kind === 'unconfined' && a.specificYield === undefined) add('/aquifer/specificYield', 'is required for an unconfined aquifer');
  if (a.kind === 'leaky' && a.leakageFactor_m === undefined) add('/aquifer/leakageFactor_m', 'is required for a leaky aquifer');

  s.boundaries?.forEach((b, i) => {
    if (b.from[0] === b.to[0] && b.from[1] === b.to[1]) add(`/boundaries/${i}/to`, 'must differ from "from": a boundary needs two distinct points');
  });

  const excavationIds = new Set<string>();
  s.excavations.forEach((e, i) => {
    if (excavationIds.has(e.id)) add(`/excavations/${i}/id`, `duplicate excavation id "${e.id}"`);
    excavationIds.add(e.id);
    if (getPolygonArea(e.outline) <= 1e-9) add(`/excavations/${i}/outline`, 'outline encloses no area');
    const crossing = findSelfIntersection(e.outline);
    if (crossing) add(`/excavations/${i}/outline`, `outline crosses itself (edges ${crossing[0]} and ${crossing[1]})`);
    if (e.formationLevel_m > s.groundLevel_m) add(`/excavations/${i}/formationLevel_m`, `formation level (${e.formationLevel_m} m) is above ground level (${s.groundLevel_m} m)`);
    if (e.ground) issues.push(...groundProfileIssues(e.ground, `/excavations/${i}/ground`, a, s.groundLevel_m));
    if (e.margin_m < 0) {
      const profile = e.ground ?? s.ground;
      const atFormation = profile?.layers.find((l) => l.top_m >= e.formationLevel_m && l.bottom_m < e.formationLevel_m);
      if (atFormation?.kind !== 'plug')
        add(`/excavations/${i}/margin_m`, 'a negative margin puts water above formation; that is only safe in a low-permeability plug — give a ground profile whose layer at formation is a plug (the uplift check then sets the target)');
    }
  });
  if (s.ground) issues.push(...groundProfileIssues(s.ground, '/ground', a, s.groundLevel_m));

  const wellIds = new Set<string>();
  s.wells.forEach((w, i) => {
    if (wellIds.has(w.id)) add(`/wells/${i}/id`, `duplicate well id "${w.id}"`);
    wellIds.add(w.id);
    if (w.rate_m3_s !== undefined && w.schedule !== undefined)
      add(`/wells/${i}/schedule`, 'give either rate_m3_s or schedule, not both');
    w.schedule?.forEach((step, k) => {
      const prev = w.schedule?.[k - 1];
      if (prev && step.from_s <= prev.from_s) add(`/wells/${i}/schedule/${k}/from_s`, `must be later than the step before (${prev.from_s} s)`);
    });
    if (w.screenTop_m !== undefined && w.screenBottom_m !== undefined && w.screenTop_m <= w.screenBottom_m)
      add(`/wells/${i}/screenTop_m`, 'screen top must lie above screen bottom');
    if (w.screenBottom_m !== undefined && w.screenBottom_m < a.base_m - 1e-9)
      add(`/wells/${i}/screenBottom_m`, `screen bottom (${w.screenBottom_m} m) is below the aquifer base (${a.base_m} m)`);
  });

  if (s.design.time_s === null && a.kind !== 'leaky' && a.influenceRadius_m === undefined) {
    const drawdowns = s.excavations.map((e) => a.staticLevel_m - (e.formationLevel_m - e.margin_m));
    if (!drawdowns.some((d) => d > 0))
      add('/aquifer/influenceRadius_m', 'a steady run needs a radius of influence: give influenceRadius_m, or an excavation whose target is below the static level so Sichardt\u2019s estimate can be made');
  }
  return issues;
}

/** Checks a parsed JSON value against scenario format v1; never throws. */
export function validateScenario(input: unknown): ScenarioValidation {
  const structural = [...structuralIssues(input), ...validatePumpingTestRecord(input), ...validateImportRecords(input)];
  if (structural.length > 0) return { ok: false, issues: structural };
  const scenario = input as Scenario;
  const semantic = semanticIssues(scenario);
  if (semantic.length > 0) return { ok: false, issues: semantic };
  return { ok: true, scenario };
}

/** Like validateScenario, but throws a DrydigError (DRYDIG_ERR_INVALID_SCENARIO) naming the field. */
export function parseScenario(input: unknown, pathPrefix = ''): Scenario {
  const result = validateScenario(input);
  if (!result.ok) {
    const issues = result.issues.map((i) => ({ ...i, path: `${pathPrefix}${i.path}` }));
    throw new DrydigError('DRYDIG_ERR_INVALID_SCENARIO', summariseIssues(issues), issues);
  }
  return result.scenario;
}
