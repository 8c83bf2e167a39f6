/**
 * Durability: the service is killed with SIGKILL in the middle of a burst of saves; after a
 * restart on the same data folder every acknowledged revision is present, intact (checksum and
 * content) and the history has no gaps. Bounded: at most ~2 s of saves, 4 clients, loopback only.
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import type { Scenario } from '../../shared/schema';
import { request, startServer, stopServer, type ServerProcess } from './reliability-harness';

const dir = mkdtempSync(join(tmpdir(), 'drydig-kill-'));
const servers: ServerProcess[] = [];
afterAll(async () => {
  for (const s of servers) await stopServer(s, 'SIGKILL');
  rmSync(dir, { recursive: true, force: true });
});

const base = JSON.parse(readFileSync('fixtures/demo-deepwells-confined.json', 'utf8')) as Scenario;

interface Ack { scenarioId: string; revision: number; sha256: string; name: string; rate: number }

describe('kill -9 during a burst of saves', () => {
  it('keeps every acknowledged revision, intact, after a restart', async () => {
    const first = await startServer(dir);
    servers.push(first);
    const created = await request(first.origin, 'POST', '/api/v1/scenarios', { scenario: base, savedBy: 'burst' });
    expect(created.status).toBe(201);
    const scenarioIds: string[] = [created.json.scenarioId];
    const acks: Ack[] = [{ scenarioId: created.json.scenarioId, revision: 1, sha256: created.json.sha256, name: base.name, rate: base.wells[0]!.rate_m3_s! }];

    let stop = false;
    let counter = 0;
    const client = async (k: number) => {
      let known = 1;
      while (!stop) {
        const n = ++counter;
        const scenario = structuredClone(base);
        scenario.name = `burst save ${n} by client ${k}`;
        scenario.wells[0]!.rate_m3_s = 0.001 + n * 1e-6;
        try {
          if (n % 10 === 0) {
            const made = await request(first.origin, 'POST', '/api/v1/scenarios', { scenario }, 3000);
            if (made.status === 201) {
              scenarioIds.push(made.json.scenarioId);
              acks.push({ scenarioId: made.json.scenarioId, revision: 1, sha256: made.json.sha256, name: scenario.name, rate: scenario.wells[0]!.rate_m3_s! });
            }
            continue;
          }
          const res = await request(first.origin, 'PUT', `/api/v1/scenarios/${scenarioIds[0]}`, { scenario, baseRevision: known }, 3000);
          if (res.status === 201) {
            acks.push({ scenarioId: scenarioIds[0]!, revision: res.json.revision, sha256: res.json.sha256, name: scenario.name, rate: scenario.wells[0]!.rate_m3_s! });
            known = res.json.revision;
          } else if (res.status === 409) {
            known = res.json.latest.revision;
          }
        } catch {
          return; // the server died mid-request: that save was never acknowledged
        }
      }
    };
    const clients = [0, 1, 2, 3].map(client);
    const started = Date.now();
    while (acks.length < 60 && Date.now() - started < 8000) await new Promise((r) => setTimeout(r, 20));
    first.child.kill('SIGKILL');
    stop = true;
    const burst_ms = Date.now() - started;
    await Promise.all(clients);
    await stopServer(first, 'SIGKILL');
    expect(first.child.signalCode).toBe('SIGKILL');
    expect(acks.length).toBeGreaterThanOrEqual(30);

    const second = await startServer(dir);
    servers.push(second);
    for (const ack of acks) {
      const res = await request(second.origin, 'GET', `/api/v1/scenarios/${ack.scenarioId}/revisions/${ack.revision}`);
      expect(res.status, `revision ${ack.revision} of ${ack.scenarioId}`).toBe(200);
      expect(res.json.sha256).toBe(ack.sha256);
      expect(res.json.scenario.name).toBe(ack.name);
      expect(res.json.scenario.wells[0].rate_m3_s).toBe(ack.rate);
    }
    const history = await request(second.origin, 'GET', `/api/v1/scenarios/${scenarioIds[0]}/revisions`);
    const numbers = (history.json.revisions as Array<{ revision: number }>).map((r) => r.revision).reverse();
    expect(numbers).toEqual(numbers.map((_, i) => i + 1));
    const maxAcked = Math.max(...acks.filter((a) => a.scenarioId === scenarioIds[0]).map((a) => a.revision));
    expect(numbers.length).toBeGreaterThanOrEqual(maxAcked);
    // And the restarted service takes saves again.
    const again = await request(second.origin, 'PUT', `/api/v1/scenarios/${scenarioIds[0]}`, { scenario: base, baseRevision: numbers.length });
    expect(again.status).toBe(201);
    await stopServer(second);
    // One line for the durability note in the report.
    console.info(`kill -9 test: ${acks.length} acknowledged saves in ${burst_ms} ms, all ${acks.length} present and intact after restart`);
  });
});
