/** The fair queue: round-robin between clients, views first, long jobs capped, queue limits. */
import { describe, expect, it } from 'vitest';
import { FairQueue, type ComputeLane } from '../../../server/compute';

/** A queue whose jobs only record that they started; `finish(label)` ends one. */
function harness(slots: number, maxQueued = 32, maxQueuedPerClient = 8, quickSlots = 0) {
  const queue = new FairQueue({ slots, maxQueued, maxQueuedPerClient, quickSlots });
  const started: string[] = [];
  const running = new Map<string, () => void>();
  const add = (label: string, client: string, lane: ComputeLane = 'normal') =>
    queue.enqueue({ client, lane, start: (done) => { started.push(label); running.set(label, done); } });
  const finish = (label: string) => running.get(label)!();
  return { queue, started, add, finish };
}

describe('FairQueue', () => {
  it('takes clients in turn, so one client’s backlog does not stand before another’s single job', () => {
    const h = harness(1);
    h.add('a1', 'A'); h.add('a2', 'A'); h.add('a3', 'A'); h.add('b1', 'B');
    h.finish('a1');
    expect(h.started).toEqual(['a1', 'b1']);
    h.finish('b1');
    expect(h.started).toEqual(['a1', 'b1', 'a2']);
  });

  it('keeps a thread free of layout searches: a small design of another client starts beside a long one', () => {
    const h = harness(2);
    h.add('layout1', 'A', 'long'); h.add('layout2', 'C', 'long'); h.add('small', 'B');
    expect(h.started).toEqual(['layout1', 'small']);
  });

  it('lets one client hold at most slots − 1 threads while others may come', () => {
    const h = harness(2);
    h.add('a1', 'A'); h.add('a2', 'A');
    expect(h.started).toEqual(['a1']);
    h.add('b1', 'B');
    expect(h.started).toEqual(['a1', 'b1']);
  });

  it('keeps a slot for quick jobs: a small evaluate starts at once beside heavy ones, the others wait for an ordinary slot', () => {
    const h = harness(2, 32, 8, 1);
    h.add('heavy1', 'A'); h.add('heavy2', 'B'); h.add('heavy3', 'C'); h.add('view', 'D', 'view');
    expect(h.started).toEqual(['heavy1', 'heavy2']);
    h.add('small', 'E', 'quick');
    expect(h.started).toEqual(['heavy1', 'heavy2', 'small']);
    // The kept slot is taken: a second quick job waits, and goes first into the next free slot's turn.
    h.add('small2', 'E', 'quick');
    expect(h.started).toHaveLength(3);
    h.finish('small');
    expect(h.started.at(-1)).toBe('small2');
    // An ordinary slot frees: the view goes first, never into the kept slot.
    h.finish('heavy1');
    expect(h.started.at(-1)).toBe('view');
    expect(h.queue.running).toBe(3);
  });

  it('starts the first view of a share link before anything waiting', () => {
    const h = harness(1);
    h.add('a1', 'A'); h.add('a2', 'A'); h.add('b1', 'B'); h.add('view', 'C', 'view');
    h.finish('a1');
    expect(h.started).toEqual(['a1', 'view']);
  });

  it('refuses past the total and the per-client queue limits', () => {
    const h = harness(1, 3, 2);
    expect(h.add('a1', 'A')).toBeNull();
    expect(h.add('a2', 'A')).toBeNull();
    expect(h.add('a3', 'A')).toBeNull();
    expect(h.add('a4', 'A')).toBe('client-queue-full');
    expect(h.add('b1', 'B')).toBeNull();
    expect(h.add('c1', 'C')).toBe('queue-full');
  });

  it('withdraws a job that has not started', () => {
    const h = harness(1);
    h.add('a1', 'A');
    const job = { client: 'B', lane: 'normal' as const, start: () => { h.started.push('b1'); } };
    h.queue.enqueue(job);
    expect(h.queue.withdraw(job)).toBe(true);
    h.finish('a1');
    expect(h.started).toEqual(['a1']);
    expect(h.queue.queued).toBe(0);
  });
});
