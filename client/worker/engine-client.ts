/**
 * The page's handle on the engine worker. Field requests are "latest wins": a new one cancels the
 * one before it (queued or running), whose promise resolves to null. Inspect and section
 * requests simply queue.
 */
import type {
  EngineRequest, EngineResponse, FieldRequest, FieldResult, InspectRequest, InspectResult, MonitoringRequest, MonitoringResult,
  SectionRequest, SectionResult, SeepageRequest, SeepageResult,
} from './engine-protocol';

type Pending = {
  resolve: (value: EngineResponse | null) => void;
  onProgress?: (fraction: number) => void;
};

/** Distributes `Omit` over a union so each request keeps its own fields. */
type WithoutId<T> = T extends unknown ? Omit<T, 'id'> : never;

/** An error from the engine, with the scenario fields it names. */
export class EngineError extends Error {
  constructor(message: string, readonly issues: Array<{ path: string; message: string }> = []) {
    super(message);
  }
}

export class EngineClient {
  private readonly worker: Worker;
  private nextId = 1;
  private readonly pending = new Map<number, Pending>();
  private currentField: number | null = null;

  constructor(worker?: Worker) {
    this.worker = worker ?? new Worker(new URL('./engine-worker.ts', import.meta.url), { type: 'module', name: 'drydig-engine' });
    this.worker.onmessage = (event: MessageEvent<EngineResponse>) => this.receive(event.data);
    this.worker.onerror = (event) => {
      for (const [, p] of this.pending) p.resolve({ kind: 'error', id: 0, message: `The engine worker failed: ${event.message}` });
      this.pending.clear();
    };
  }

  /** Contours and shortfall; null when superseded by a newer field request. */
  async field(req: Omit<FieldRequest, 'id' | 'kind'>, onProgress?: (fraction: number) => void): Promise<FieldResult | null> {
    if (this.currentField !== null) this.cancel(this.currentField);
    const id = this.nextId++;
    this.currentField = id;
    const res = await this.send({ ...req, kind: 'field' }, id, onProgress);
    if (this.currentField === id) this.currentField = null;
    return this.unwrap<FieldResult>(res);
  }

  async inspect(req: Omit<InspectRequest, 'id' | 'kind'>): Promise<InspectResult | null> {
    return this.unwrap<InspectResult>(await this.send({ ...req, kind: 'inspect' }, this.nextId++));
  }

  async section(req: Omit<SectionRequest, 'id' | 'kind'>): Promise<SectionResult | null> {
    return this.unwrap<SectionResult>(await this.send({ ...req, kind: 'section' }, this.nextId++));
  }

  /** Expected, alert and action levels over time at one piezometer. */
  async monitoring(req: Omit<MonitoringRequest, 'id' | 'kind'>): Promise<MonitoringResult | null> {
    return this.unwrap<MonitoringResult>(await this.send({ ...req, kind: 'monitoring' }, this.nextId++));
  }

  /** Seepage in a vertical section: flow, exit gradient, heave, the flow net and the compared options. */
  async seepage(job: SeepageRequest['job']): Promise<SeepageResult | null> {
    return this.unwrap<SeepageResult>(await this.send({ kind: 'seepage', job }, this.nextId++));
  }

  dispose(): void {
    this.worker.terminate();
  }

  private cancel(id: number): void {
    this.worker.postMessage({ kind: 'cancel', id } satisfies EngineRequest);
  }

  private send(req: WithoutId<EngineRequest>, id: number, onProgress?: (fraction: number) => void): Promise<EngineResponse | null> {
    return new Promise((resolve) => {
      this.pending.set(id, { resolve, onProgress });
      this.worker.postMessage({ ...req, id } as EngineRequest);
    });
  }

  private receive(msg: EngineResponse): void {
    const p = this.pending.get(msg.id);
    if (!p) return;
    if (msg.kind === 'progress') {
      p.onProgress?.(msg.fraction);
      return;
    }
    this.pending.delete(msg.id);
    p.resolve(msg);
  }

  private unwrap<T extends EngineResponse>(res: EngineResponse | null): T | null {
    if (!res || res.kind === 'cancelled') return null;
    if (res.kind === 'error') throw new EngineError(res.message, res.issues ?? []);
    return res as T;
  }
}
