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

export type RunHandle = Cancellable<RunRecord>;

/** Thrown into `result` when the user cancelled. */
export class RunCancelled extends Error {
  constructor() {
    super('cancelled');
    this.name = 'RunCancelled';
  }
}

/** A computation in the worker that the user can stop, with its result. */
export interface Cancellable<T> {
  result: Promise<T>;
  cancel(): void;
}

/**
 * Start work in the worker that can be cancelled. A synchronous computation
 * cannot poll for a message, so cancel terminates the worker: the page stays
 * responsive and nothing half-written reaches the store (results are saved
 * only at the end).
 */
function cancellable<T>(start: (api: Remote) => Promise<T>): Cancellable<T> {
  let cancel!: () => void;
  const cancelled = new Promise<never>((_, reject) => {
    cancel = () => {
      resetEngine();
      reject(new RunCancelled());
    };
  });
  return { result: Promise.race([start(engine()), cancelled]), cancel };
}

/** Start a run in the worker; cancel stops it. */
export function startRun(modelId: string, settings: RunSettings, onProgress: (p: Progress) => void): RunHandle {
  return cancellable((api) => api.run(modelId, settings, Comlink.proxy(onProgress)));
}

/** A mesh kit computation that can be stopped the same way as a run. */
export function meshThroughWorker(name: string, data: string | Blob, settings: MeshSettings, onProgress: (p: Progress) => void): Cancellable<KitOutcome<MeshResult>> {
  return cancellable<KitOutcome<MeshResult>>((api) => api.meshTopology(name, data, Comlink.proxy(onProgress), settings));
}

/** Import through the worker with progress, so a large file never blocks the page. */
export function importThroughWorker(projectId: string, file: File, onProgress: (p: Progress) => void) {
  return engine().importFile(projectId, file.name, file, Comlink.proxy(onProgress));
}

/** Check a saved readings file against its model in the worker; cancel stops it as for a run (nothing is saved either way). */
export function checkReadingsThroughWorker(modelId: string, readingsId: string, onProgress: (p: Progress) => void): Cancellable<ReadingsCheckOutcome> {
  return cancellable<ReadingsCheckOutcome>((api) => api.checkReadings(modelId, readingsId, Comlink.proxy(onProgress)));
}
