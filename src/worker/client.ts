// Main-thread bridge to the peak-simulation worker. The worker starts lazily on the first call; every call takes
// an AbortSignal, and aborting TERMINATES the worker (an engine loop cannot be interrupted any other way); the
// next call starts a fresh one. Progress arrives through a callback.
import { InputRangeError } from '../engine/index';
import type { SimKind, SimKinds, SimRequest, SimResponse } from './simProtocol';

/** The part of the Worker interface the client uses (a fake stands in for it in tests). */
export interface WorkerLike {
  postMessage(message: unknown): void;
  terminate(): void;
  onmessage: ((event: { data: SimResponse }) => void) | null;
  onerror: ((event: { message?: string }) => void) | null;
}

export interface RunOptions<R = unknown> {
  signal?: AbortSignal;
  onProgress?: (fraction: number) => void;
  /** A complete but coarse result ahead of the final one (peakProfile: error bound ≤ 1 % of the peak height). */
  onPartial?: (result: R) => void;
}

interface Pending {
  resolve: (value: unknown) => void;
  reject: (reason: unknown) => void;
  onProgress?: (fraction: number) => void;
  onPartial?: (result: unknown) => void;
  cleanup: () => void;
}

function abortError(): Error {
  return typeof DOMException !== 'undefined'
    ? new DOMException('The simulation was cancelled', 'AbortError')
    : Object.assign(new Error('The simulation was cancelled'), { name: 'AbortError' });
}

export function isAbortError(error: unknown): boolean {
  return typeof error === 'object' && error !== null && (error as { name?: string }).name === 'AbortError';
}

const defaultFactory = (): WorkerLike =>
  new Worker(new URL('./sim.worker.ts', import.meta.url), { type: 'module' }) as unknown as WorkerLike;

export class SimClient {
  private worker: WorkerLike | null = null;
  private nextId = 1;
  private readonly pending = new Map<number, Pending>();

  constructor(private readonly createWorker: () => WorkerLike = defaultFactory) {}

  /** True while a worker is running (it starts on the first call). */
  get started(): boolean {
    return this.worker !== null;
  }

  run<K extends SimKind>(kind: K, params: SimKinds[K]['params'], options: RunOptions<SimKinds[K]['result']> = {}): Promise<SimKinds[K]['result']> {
    const { signal, onProgress, onPartial } = options;
    if (signal?.aborted) return Promise.reject(abortError());
    const worker = this.ensureWorker();
    const id = this.nextId++;
    return new Promise((resolve, reject) => {
      const onAbort = (): void => {
        // Stop the computation now: terminate the worker; other calls on it fail as cancelled too.
        this.restart(abortError());
      };
      signal?.addEventListener('abort', onAbort, { once: true });
      this.pending.set(id, {
        resolve: resolve as (value: unknown) => void,
        reject,
        onProgress,
        onPartial: onPartial as ((result: unknown) => void) | undefined,
        cleanup: () => signal?.removeEventListener('abort', onAbort),
      });
      const request: SimRequest<K> = { id, kind, params };
      worker.postMessage(request);
    });
  }

  /** Terminate the worker and fail every pending call (e.g. when the screen closes). */
  dispose(): void {
    this.restart(abortError());
  }

  private ensureWorker(): WorkerLike {
    if (this.worker) return this.worker;
    const worker = this.createWorker();
    worker.onmessage = (event) => this.receive(event.data);
    worker.onerror = (event) => this.restart(new Error(`The simulation worker failed${event?.message ? `: ${event.message}` : ''}`));
    this.worker = worker;
    return worker;
  }

  private restart(reason: unknown): void {
    const worker = this.worker;
    this.worker = null;
    if (worker) {
      worker.onmessage = null;
      worker.onerror = null;
      worker.terminate();
    }
    const calls = [...this.pending.values()];
    this.pending.clear();
    for (const call of calls) {
      call.cleanup();
      call.reject(reason);
    }
  }

  private receive(message: SimResponse): void {
    const call = this.pending.get(message.id);
    if (!call) return;
    if (message.type === 'progress') {
      call.onProgress?.(message.fraction);
      return;
    }
    if (message.type === 'partial') {
      call.onPartial?.(message.result);
      return;
    }
    this.pending.delete(message.id);
    call.cleanup();
    if (message.type === 'result') call.resolve(message.result);
    else {
      const { error } = message;
      if (error.field !== undefined && error.range !== undefined) {
        const e = new InputRangeError(error.field, error.value, error.range);
        e.message = error.message;
        call.reject(e);
      } else call.reject(Object.assign(new Error(error.message), { name: error.name }));
    }
  }
}

let shared: SimClient | null = null;
/** One client for the app (one worker at a time). */
export function simClient(): SimClient {
  shared ??= new SimClient();
  return shared;
}
