/** The page's handle on the import worker: one promise per file read. */
import type { AgsImportResult, DxfImportResult, ImportRequest, ImportResponse } from './import-protocol';

/** A file the import engine could not read, with its plain message. */
export class ImportFailed extends Error {}

type WithoutId<T> = T extends unknown ? Omit<T, 'id'> : never;

export class ImportClient {
  private worker: Worker | null = null;
  private nextId = 1;
  private readonly pending = new Map<number, (res: ImportResponse) => void>();

  /** Reads a DXF: layers, geometry in site metres, the display copy simplified to `tolerance_m`. */
  async dxf(text: string, tolerance_m: number, toMetre?: number): Promise<DxfImportResult> {
    return (await this.send({ kind: 'dxf', text, tolerance_m, ...(toMetre !== undefined ? { toMetre } : {}) })) as DxfImportResult;
  }

  /** Reads an AGS4 file's boreholes. */
  async ags(text: string): Promise<AgsImportResult> {
    return (await this.send({ kind: 'ags', text })) as AgsImportResult;
  }

  dispose(): void {
    this.worker?.terminate();
    this.worker = null;
  }

  private send(req: WithoutId<ImportRequest>): Promise<ImportResponse> {
    // Started on first use: most sessions import nothing.
    if (!this.worker) {
      this.worker = new Worker(new URL('./import-worker.ts', import.meta.url), { type: 'module', name: 'drydig-import' });
      this.worker.onmessage = (event: MessageEvent<ImportResponse>) => {
        const resolve = this.pending.get(event.data.id);
        this.pending.delete(event.data.id);
        resolve?.(event.data);
      };
      this.worker.onerror = (event) => {
        for (const [id, resolve] of this.pending) resolve({ kind: 'error', id, message: `The import worker failed: ${event.message}` });
        this.pending.clear();
      };
    }
    const id = this.nextId++;
    return new Promise<ImportResponse>((resolve) => {
      this.pending.set(id, resolve);
      this.worker!.postMessage({ ...req, id } as ImportRequest);
    }).then((res) => {
      if (res.kind === 'error') throw new ImportFailed(res.message);
      return res;
    });
  }
}
