import * as Comlink from 'comlink';
import type { ComputeService, Progress, RunRecord } from '../compute/computeService';
import type { KitOutcome, MeshResult, MeshSettings } from '../compute/kitService';
import type { ReadingsCheckOutcome } from '../compute/readingsService';
import type { RunSettings } from '../store';

type Remote = Comlink.Remote<ComputeService>;

let worker: Worker | undefined;
let remote: Remote | undefined;

/** The engine worker, started on first use. */
export function engine(): Remote {
  if (!remote) {
    worker = new Worker(new URL('./engine.worker.ts', import.meta.url), { type: 'module', name: 'gluefield-engine' });
    remote = Comlink.wrap<ComputeService>(worker);
  }
  return remote;
}

/** Stop whatever the worker is doing; the next call starts a fresh one. */
export function resetEngine(): void {
  worker?.terminate();
  worker = undefined;
  remote = undefined;
}

export interface RunHandle {
  result: Promise<RunRecord>;
  cancel(): void;
}

/** Thrown into `result` when the user cancelled. */
export class RunCancelled extends Error {
  constructor() {
    super('cancelled');
    this.name = 'RunCancelled';
  }
}

/**
 * Start a run in the worker. A synchronous computation cannot poll for a
 * message, so cancel terminates the worker: the page stays responsive and
 * nothing half-written reaches the store (the run is saved only at the end).
 */
export function startRun(modelId: string, settings: RunSettings, onProgress: (p: Progress) => void): RunHandle {
  const api = engine();
  let cancel!: () => void;
  const cancelled = new Promise<never>((_, reject) => {
    cancel = () => {
      resetEngine();
      reject(new RunCancelled());
    };
  });
  const result = Promise.race([api.run(modelId, settings, Comlink.proxy(onProgress)), cancelled]);
  return { result, cancel };
}

/** A mesh kit computation that can be stopped the same way as a run: by terminating the worker. */
export function meshThroughWorker(name: string, data: string | Blob, settings: MeshSettings, onProgress: (p: Progress) => void): { result: Promise<KitOutcome<MeshResult>>; cancel(): void } {
  const api = engine();
  let cancel!: () => void;
  const cancelled = new Promise<never>((_, reject) => {
    cancel = () => {
      resetEngine();
      reject(new RunCancelled());
    };
  });
  return { result: Promise.race([api.meshTopology(name, data, Comlink.proxy(onProgress), settings), cancelled]), cancel };
}

/** Import through the worker with progress, so a large file never blocks the page. */
export function importThroughWorker(projectId: string, file: File, onProgress: (p: Progress) => void) {
  return engine().importFile(projectId, file.name, file, Comlink.proxy(onProgress));
}

/** Check a saved readings file against its model in the worker; cancel terminates the worker, as for a run (nothing is saved either way). */
export function checkReadingsThroughWorker(modelId: string, readingsId: string, onProgress: (p: Progress) => void): { result: Promise<ReadingsCheckOutcome>; cancel(): void } {
  const api = engine();
  let cancel!: () => void;
  const cancelled = new Promise<never>((_, reject) => {
    cancel = () => {
      resetEngine();
      reject(new RunCancelled());
    };
  });
  return { result: Promise.race([api.checkReadings(modelId, readingsId, Comlink.proxy(onProgress)), cancelled]), cancel };
}
