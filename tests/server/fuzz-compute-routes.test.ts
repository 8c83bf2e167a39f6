/**
 * Property-based fuzz of the compute routes (issue 14 item 3): evaluate, design (and design jobs),
 * validate, section and pumping test get schema-shaped but hostile bodies (see helpers/fuzz-values.ts). No answer is
 * a 5xx; every 4xx is a JSON error with a known code and a message; a refused request changes no
 * stored data. Fixed seeds (FUZZ_SEED), printed on failure.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fuzzRoute, startFuzzApp, type FuzzApp } from './helpers/fuzz-harness';
import { ROUTE_CASES } from './helpers/fuzz-routes';

let fuzz: FuzzApp;
beforeAll(async () => {
  fuzz = await startFuzzApp();
}, 60_000);
afterAll(() => fuzz.close());

describe('hostile requests to the compute routes', () => {
  for (const c of ROUTE_CASES.filter((r) => r.group === 'compute')) {
    it(`${c.method} ${c.route} never answers 5xx and refuses with a coded JSON error (${c.numRuns} requests)`, async () => {
      const statuses = await fuzzRoute(fuzz, `${c.method} ${c.route}`, c.requests(fuzz.world), c.numRuns, c.after);
      // The fuzz reaches past the checks too: some requests are answered, not all refused.
      expect([...statuses.keys()].some((s) => s < 300), [...statuses].join(' ')).toBe(true);
    }, 120_000);
  }
});
