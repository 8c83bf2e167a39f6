/**
 * Who runs next on the compute pool. Jobs wait per client and are taken round-robin across
 * clients, so one client's many (or long) jobs never stand in front of another client's small one.
 * Three lanes: `view` (the first view of a share link — taken before anything waiting), `normal`,
 * and `long` (layout searches, which may run for their whole time limit): long jobs hold at most
 * `longSlots` threads at once, so at least one thread stays free for everything else. One client
 * holds at most `perClientSlots` threads at once. A fourth lane, `quick`, is for small jobs (a
 * health-check-sized evaluate): besides the ordinary slots there are `quickSlots` kept for it alone,
 * so a small request never waits for a heavy one to finish, however busy the pool.
 */

export type ComputeLane = 'view' | 'normal' | 'long' | 'quick';

export interface FairQueueLimits {
  /** Jobs that may run at once (the pool's threads). */
  slots: number;
  /** Long-lane jobs that may run at once (default slots − 1, at least 1). */
  longSlots?: number;
  /** Jobs one client may run at once (default slots − 1, at least 1). */
  perClientSlots?: number;
  /** Slots kept for quick-lane jobs, beyond `slots` (default 0). */
  quickSlots?: number;
  /** Jobs that may wait in all; more are refused. */
  maxQueued: number;
  /** Jobs one client may have waiting; more are refused. */
  maxQueuedPerClient: number;
}

export interface FairJob {
  client: string;
  lane: ComputeLane;
  /** Called once when the job is given a slot; `done()` must be called when it ends. */
  start: (done: () => void) => void;
}

export type EnqueueRefusal = 'queue-full' | 'client-queue-full';

export class FairQueue {
  readonly #limits: Required<FairQueueLimits>;
  readonly #waiting = new Map<string, FairJob[]>();
  readonly #runningByClient = new Map<string, number>();
  /** Clients with waiting or running work, in order of arrival. */
  #order: string[] = [];
  /** When each client last got a thread (a running count); a client never served comes first. */
  readonly #lastServed = new Map<string, number>();
  #serveCount = 0;
  #running = 0;
  #runningLong = 0;
  /** Jobs running in the ordinary slots (a quick job may run in either). */
  #runningOrdinary = 0;
  #queued = 0;

  constructor(limits: FairQueueLimits) {
    const spare = Math.max(1, limits.slots - 1);
    this.#limits = { longSlots: spare, perClientSlots: spare, quickSlots: 0, ...limits };
  }

  get running(): number {
    return this.#running;
  }

  get queued(): number {
    return this.#queued;
  }

  /** Queues a job (it may start at once); a refusal says which limit was hit. */
  enqueue(job: FairJob): EnqueueRefusal | null {
    const mine = this.#waiting.get(job.client) ?? [];
    if (this.#queued >= this.#limits.maxQueued) return 'queue-full';
    if (mine.length >= this.#limits.maxQueuedPerClient) return 'client-queue-full';
    if (mine.length === 0) {
      this.#waiting.set(job.client, mine);
      if (!this.#order.includes(job.client)) this.#order.push(job.client);
    }
    mine.push(job);
    this.#queued++;
    this.#dispatch();
    return null;
  }

  /** Takes a job that has not started out of the queue (its request went away). True if it was waiting. */
  withdraw(job: FairJob): boolean {
    const mine = this.#waiting.get(job.client);
    const at = mine?.indexOf(job) ?? -1;
    if (!mine || at < 0) return false;
    mine.splice(at, 1);
    this.#queued--;
    this.#forgetIfIdle(job.client);
    return true;
  }

  #forgetIfIdle(client: string): void {
    if ((this.#waiting.get(client)?.length ?? 0) > 0 || (this.#runningByClient.get(client) ?? 0) > 0) return;
    this.#waiting.delete(client);
    const at = this.#order.indexOf(client);
    if (at >= 0) this.#order.splice(at, 1);
    this.#lastServed.delete(client);
    this.#runningByClient.delete(client);
  }

  /** The client just got a thread: it goes behind every other client. */
  #served(client: string): void {
    this.#lastServed.set(client, ++this.#serveCount);
  }

  #eligible(job: FairJob): boolean {
    // A quick job may always take a free slot (it is small by definition); the others only an ordinary one.
    if (job.lane === 'quick') return true;
    if (this.#runningOrdinary >= this.#limits.slots) return false;
    if (job.lane === 'view') return true;
    if (job.lane === 'long' && this.#runningLong >= this.#limits.longSlots) return false;
    return (this.#runningByClient.get(job.client) ?? 0) < this.#limits.perClientSlots;
  }

  /** The next job to start: a waiting view first, then the least recently served client's first eligible job. */
  #pick(): FairJob | undefined {
    for (const client of this.#order) {
      const view = this.#waiting.get(client)?.find((j) => j.lane === 'view');
      if (view && this.#eligible(view)) return view;
    }
    const byTurn = [...this.#order].sort((a, b) => (this.#lastServed.get(a) ?? 0) - (this.#lastServed.get(b) ?? 0));
    for (const client of byTurn) {
      const job = this.#waiting.get(client)?.find((j) => this.#eligible(j));
      if (job) return job;
    }
    return undefined;
  }

  #dispatch(): void {
    while (this.#running < this.#limits.slots + this.#limits.quickSlots) {
      const job = this.#pick();
      if (!job) return;
      this.withdraw(job);
      this.#served(job.client);
      this.#running++;
      // A quick job uses an ordinary slot while one is free, else a kept one.
      const ordinary = job.lane !== 'quick' || this.#runningOrdinary < this.#limits.slots;
      if (ordinary) this.#runningOrdinary++;
      if (job.lane === 'long') this.#runningLong++;
      this.#runningByClient.set(job.client, (this.#runningByClient.get(job.client) ?? 0) + 1);
      let finished = false;
      const done = () => {
        if (finished) return;
        finished = true;
        this.#running--;
        if (ordinary) this.#runningOrdinary--;
        if (job.lane === 'long') this.#runningLong--;
        this.#runningByClient.set(job.client, (this.#runningByClient.get(job.client) ?? 1) - 1);
        this.#forgetIfIdle(job.client);
        this.#dispatch();
      };
      job.start(done);
    }
  }
}
