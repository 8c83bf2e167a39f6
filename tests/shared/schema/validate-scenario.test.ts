import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { validateScenario, parseScenario, DrydigError, type Scenario } from '../../../shared/schema';

const demoUnconfined = JSON.parse(readFileSync('fixtures/demo-wellpoints-unconfined.json', 'utf8')) as Scenario;
const demoConfined = JSON.parse(readFileSync('fixtures/demo-deepwells-confined.json', 'utf8')) as Scenario;

/** A loosely typed scenario document, so a test can break any field the way a user file might. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- deliberately untyped: the point is to write invalid documents
type LooseDocument = Record<string, any>;

/** A deep copy of a demo with one change applied. */
function variant(base: Scenario, change: (s: LooseDocument) => void): unknown {
  const copy = structuredClone(base) as LooseDocument;
  change(copy);
  return copy;
}

function firstIssue(input: unknown): { path: string; message: string } {
  const result = validateScenario(input);
  if (result.ok) throw new Error('expected the scenario to be rejected');
  return result.issues[0]!;
}

describe('validateScenario', () => {
  it('accepts both demo scenarios', () => {
    expect(validateScenario(demoUnconfined).ok).toBe(true);
    expect(validateScenario(demoConfined).ok).toBe(true);
  });

  it.each([
    ['a non-object', 42, ''],
    ['a wrong format tag', variant(demoUnconfined, (s) => { s.format = 'other'; }), '/format'],
    ['a wrong version', variant(demoUnconfined, (s) => { s.version = 2; }), '/version'],
    ['a missing aquifer kind', variant(demoUnconfined, (s) => { delete s.aquifer.kind; }), '/aquifer/kind'],
    ['an unknown aquifer kind', variant(demoUnconfined, (s) => { s.aquifer.kind = 'perched'; }), '/aquifer/kind'],
    ['K given as a string', variant(demoUnconfined, (s) => { s.aquifer.conductivity_m_s = '2e-4'; }), '/aquifer/conductivity_m_s'],
    ['zero K', variant(demoUnconfined, (s) => { s.aquifer.conductivity_m_s = 0; }), '/aquifer/conductivity_m_s'],
    ['a misspelt aquifer field', variant(demoUnconfined, (s) => { s.aquifer.conductivity = 1e-4; }), '/aquifer/conductivity'],
    ['a well without x', variant(demoUnconfined, (s) => { delete s.wells[3].x; }), '/wells/3/x'],
    ['a negative well radius', variant(demoUnconfined, (s) => { s.wells[0].radius_m = -0.1; }), '/wells/0/radius_m'],
    ['an outline of two points', variant(demoUnconfined, (s) => { s.excavations[0].outline = [[0, 0], [1, 1]]; }), '/excavations/0/outline'],
    ['a design time of zero', variant(demoUnconfined, (s) => { s.design.time_s = 0; }), '/design/time_s'],
  ])('rejects %s and names the field', (_label, input, path) => {
    expect(firstIssue(input).path).toBe(path);
  });

  it.each([
    ['a confined aquifer without top', variant(demoConfined, (s) => { delete s.aquifer.top_m; }), '/aquifer/top_m'],
    ['a confined aquifer without storativity', variant(demoConfined, (s) => { delete s.aquifer.storativity; }), '/aquifer/storativity'],
    ['a confined piezometric level below the aquifer top', variant(demoConfined, (s) => { s.aquifer.staticLevel_m = 4; }), '/aquifer/staticLevel_m'],
    ['an unconfined aquifer without specific yield', variant(demoUnconfined, (s) => { delete s.aquifer.specificYield; }), '/aquifer/specificYield'],
    ['a leaky aquifer without leakage factor', variant(demoConfined, (s) => { s.aquifer.kind = 'leaky'; }), '/aquifer/leakageFactor_m'],
    ['a static level below the base', variant(demoUnconfined, (s) => { s.aquifer.staticLevel_m = -9; }), '/aquifer/staticLevel_m'],
    ['a base above ground', variant(demoUnconfined, (s) => { s.aquifer.base_m = 13; s.aquifer.staticLevel_m = 14; }), '/aquifer/base_m'],
    ['duplicate well ids', variant(demoUnconfined, (s) => { s.wells[1].id = s.wells[0].id; }), '/wells/1/id'],
    ['a rate and a schedule together', variant(demoUnconfined, (s) => { s.wells[2].schedule = [{ from_s: 0, rate_m3_s: 0.001 }]; }), '/wells/2/schedule'],
    ['a schedule out of order', variant(demoUnconfined, (s) => { delete s.wells[2].rate_m3_s; s.wells[2].schedule = [{ from_s: 100, rate_m3_s: 0.001 }, { from_s: 50, rate_m3_s: 0 }]; }), '/wells/2/schedule/1/from_s'],
    ['a self-crossing outline', variant(demoUnconfined, (s) => { s.excavations[0].outline = [[0, 0], [10, 10], [10, 0], [0, 10]]; }), '/excavations/0/outline'],
    ['a boundary of one point', variant(demoConfined, (s) => { s.boundaries[0].to = s.boundaries[0].from; }), '/boundaries/0/to'],
    ['a steady run with no way to estimate R', variant(demoUnconfined, (s) => { s.design.time_s = null; s.excavations = []; }), '/aquifer/influenceRadius_m'],
  ])('rejects %s and names the field', (_label, input, path) => {
    expect(firstIssue(input).path).toBe(path);
  });

  it('rejects non-finite numbers passed from JavaScript', () => {
    expect(firstIssue(variant(demoUnconfined, (s) => { s.wells[0].x = Number.NaN; })).path).toBe('/wells/0/x');
    expect(firstIssue(variant(demoUnconfined, (s) => { s.aquifer.base_m = Number.POSITIVE_INFINITY; })).path).toBe('/aquifer/base_m');
  });
});

describe('parseScenario', () => {
  it('throws a DrydigError whose message starts with the prefixed JSON pointer', () => {
    const bad = variant(demoConfined, (s) => { delete s.aquifer.storativity; });
    try {
      parseScenario(bad, '/scenario');
      throw new Error('expected a throw');
    } catch (error) {
      expect(error).toBeInstanceOf(DrydigError);
      const e = error as DrydigError;
      expect(e.code).toBe('DRYDIG_ERR_INVALID_SCENARIO');
      expect(e.status).toBe(400);
      expect(e.message).toMatch(/^\/scenario\/aquifer\/storativity: /);
      expect(e.issues[0]?.path).toBe('/scenario/aquifer/storativity');
    }
  });
});

describe('validateScenario on unknown fields', () => {
  it('says a misspelt field is not a field of its object', () => {
    const issue = firstIssue(variant(demoUnconfined, (s) => { s.aquifer.conductivity = 1e-4; }));
    expect(issue).toEqual({ path: '/aquifer/conductivity', message: expect.stringMatching(/^is not a field of this object/) });
  });
});
