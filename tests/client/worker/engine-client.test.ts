import { describe, expect, it } from 'vitest';
import { EngineClient, EngineError } from '../../../client/worker/engine-client';
import type { EngineRequest, EngineResponse } from '../../../client/worker/engine-protocol';

/** A stand-in worker: records requests; the test answers them by hand. */
class FakeWorker {
  sent: EngineRequest[] = [];
  onmessage: ((e: MessageEvent<EngineResponse>) => void) | null = null;
  onerror: ((e: ErrorEvent) => void) | null = null;
  postMessage(msg: EngineRequest) {
    this.sent.push(msg);
  }
  terminate() {}
  reply(msg: EngineResponse) {
    this.onmessage?.({ data: msg } as MessageEvent<EngineResponse>);
  }
}

const fieldReq = { scenario: {} as never, grid: { origin: [0, 0], spacing_m: [1, 1], counts: [2, 2] } as const, time_s: null, quantity: 'drawdown' as const };

describe('EngineClient talks to the engine worker', () => {
  it('a new field request cancels the one before it, whose promise resolves to null', async () => {
    const w = new FakeWorker();
    const client = new EngineClient(w as unknown as Worker);
    const first = client.field(fieldReq);
    const second = client.field(fieldReq);
    expect(w.sent.map((m) => m.kind)).toEqual(['field', 'cancel', 'field']);
    const [f, c, s] = w.sent as [EngineRequest & { id: number }, EngineRequest & { id: number }, EngineRequest & { id: number }];
    expect(c.id).toBe(f.id);
    w.reply({ kind: 'cancelled', id: f.id });
    w.reply({ kind: 'field', id: s.id } as EngineResponse);
    expect(await first).toBeNull();
    expect((await second)?.id).toBe(s.id);
  });

  it('passes progress to the caller before the answer', async () => {
    const w = new FakeWorker();
    const client = new EngineClient(w as unknown as Worker);
    const seen: number[] = [];
    const p = client.field(fieldReq, (f) => seen.push(f));
    const id = (w.sent[0] as { id: number }).id;
    w.reply({ kind: 'progress', id, fraction: 0.5 });
    w.reply({ kind: 'field', id } as EngineResponse);
    await p;
    expect(seen).toEqual([0.5]);
  });

  it('turns an engine error into an EngineError carrying the field issues', async () => {
    const w = new FakeWorker();
    const client = new EngineClient(w as unknown as Worker);
    const p = client.inspect({ scenario: {} as never, point: [0, 0], times_s: [], time_s: null });
    const id = (w.sent[0] as { id: number }).id;
    w.reply({ kind: 'error', id, message: '/aquifer/storativity: is required', issues: [{ path: '/aquifer/storativity', message: 'is required' }] });
    await expect(p).rejects.toBeInstanceOf(EngineError);
    await expect(p).rejects.toMatchObject({ issues: [{ path: '/aquifer/storativity' }] });
  });
});
