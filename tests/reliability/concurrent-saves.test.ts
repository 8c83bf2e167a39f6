/**
 * No lost update: six clients edit one scenario at once through two service processes sharing one
 * data folder. Each adds its own wells by read-modify-write with the revision it read; a 409
 * hands back the newer revision, and the client re-applies its change on it. At the end every
 * client's every well is in the latest revision. Bounded: 6 × 8 edits, loopback only.
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import type { Scenario } from '../../shared/schema';
import { request, startServer, stopServer, type ServerProcess } from './reliability-harness';

const dir = mkdtempSync(join(tmpdir(), 'drydig-concurrent-'));
const servers: ServerProcess[] = [];
afterAll(async () => {
  for (const s of servers) await stopServer(s, 'SIGKILL');
  rmSync(dir, { recursive: true, force: true });
});

const base = JSON.parse(readFileSync('fixtures/demo-deepwells-confined.json', 'utf8')) as Scenario;
const CLIENTS = 6;
const EDITS = 8;

describe('concurrent saves from several clients', () => {
  it('lose no update: every edit ends up in the latest revision', async () => {
    const [a, b] = await Promise.all([startServer(dir), startServer(dir)]);
    servers.push(a!, b!);
    const created = await request(a!.origin, 'POST', '/api/v1/scenarios', { scenario: base });
    const id = created.json.scenarioId as string;
    let conflicts = 0;

    const client = async (k: number) => {
      const origin = (k % 2 ? b : a)!.origin;
      let current = (await request(origin, 'GET', `/api/v1/scenarios/${id}`)).json as { revision: number; scenario: Scenario };
      for (let e = 0; e < EDITS; e++) {
        for (let attempt = 0; attempt < 200; attempt++) {
          const scenario = structuredClone(current.scenario);
          const template = scenario.wells[0]!;
          scenario.wells.push({ ...template, id: `C${k}-E${e}`, x: template.x + 3 * k + 0.1 * e, y: template.y - 40 });
          const res = await request(origin, 'PUT', `/api/v1/scenarios/${id}`, { scenario, baseRevision: current.revision, savedBy: `client ${k}` });
          if (res.status === 201) {
            current = { revision: res.json.revision, scenario };
            break;
          }
          expect(res.status).toBe(409);
          conflicts++;
          current = res.json.latest;
        }
      }
    };
    await Promise.all(Array.from({ length: CLIENTS }, (_, k) => client(k)));

    const latest = (await request(b!.origin, 'GET', `/api/v1/scenarios/${id}`)).json as { revision: number; scenario: Scenario };
    expect(latest.revision).toBe(1 + CLIENTS * EDITS);
    const ids = new Set(latest.scenario.wells.map((w) => w.id));
    for (let k = 0; k < CLIENTS; k++) for (let e = 0; e < EDITS; e++) expect(ids.has(`C${k}-E${e}`), `C${k}-E${e}`).toBe(true);
    expect(latest.scenario.wells).toHaveLength(base.wells.length + CLIENTS * EDITS);
    const history = (await request(a!.origin, 'GET', `/api/v1/scenarios/${id}/revisions`)).json.revisions as Array<{ revision: number; summary: string }>;
    expect(history).toHaveLength(1 + CLIENTS * EDITS);
    for (const r of history.slice(0, -1)) expect(r.summary).toMatch(/^1 well added \(C\d-E\d\)$/);
    console.info(`concurrent saves: ${CLIENTS} clients × ${EDITS} edits through 2 processes, ${conflicts} conflicts answered 409 and re-applied, 0 lost`);
  });
});
