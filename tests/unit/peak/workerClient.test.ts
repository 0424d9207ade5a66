// Worker adapter (src/worker/simProtocol.ts) and main-thread client (src/worker/client.ts) with a fake Worker:
// lazy start, progress, transferred typed arrays, cancellation by termination, restart, errors with field names.
import { describe, expect, it } from 'vitest';
import { SimClient, isAbortError, type WorkerLike } from '../../../src/worker/client';
import { runRequest, transferables, type SimRequest, type SimResponse } from '../../../src/worker/simProtocol';
import { InputRangeError } from '../../../src/engine/validate';
import { settingsFor } from './helpers';

/** Runs requests with the real protocol on a later tick, like a worker would; records terminations. */
class FakeWorker implements WorkerLike {
  static created = 0;
  onmessage: ((event: { data: SimResponse }) => void) | null = null;
  onerror: ((event: { message?: string }) => void) | null = null;
  terminated = false;
  transfers: ArrayBuffer[][] = [];
  hold = false;
  held: SimRequest[] = [];
  constructor() {
    FakeWorker.created++;
  }
  postMessage(message: unknown): void {
    const request = message as SimRequest;
    if (this.hold) {
      this.held.push(request);
      return;
    }
    setTimeout(() => this.process(request), 0);
  }
  process(request: SimRequest): void {
    if (this.terminated) return;
    runRequest(request, (response, transfer) => {
      if (transfer) this.transfers.push(transfer);
      if (!this.terminated) this.onmessage?.({ data: response });
    });
  }
  terminate(): void {
    this.terminated = true;
  }
}

const profileParams = {
  ...settingsFor({ a: 0.2365, q: 0.7055, cycles: 30, beamFraction: 0.2, transverseEnergy: 0.2 }),
  mzFrom: 99.6,
  mzTo: 100.4,
  points: 11,
};

describe('simProtocol.runRequest', () => {
  it('posts progress, then the result with its Float64Array buffers in the transfer list', () => {
    const messages: SimResponse[] = [];
    let transfer: ArrayBuffer[] = [];
    const { mz: _mz, ...beam } = settingsFor({ a: 0.2365, q: 0.7055, cycles: 30 });
    runRequest({ id: 7, kind: 'peakProfile', params: { ...beam, mzFrom: 99.6, mzTo: 100.4, points: 11 } }, (m, t) => {
      messages.push(m);
      if (t) transfer = t;
    });
    const last = messages[messages.length - 1];
    expect(last.type).toBe('result');
    expect(messages.some((m) => m.type === 'progress')).toBe(true);
    const result = (last as { result: { mz: Float64Array; transmission: Float64Array } }).result;
    expect(transfer).toContain(result.mz.buffer);
    expect(transfer).toContain(result.transmission.buffer);
    expect(transferables({ a: 1, b: new Float64Array(2) }).length).toBe(1);
  });

  it('turns bad input into an error message with field and range', () => {
    const messages: SimResponse[] = [];
    runRequest({ id: 1, kind: 'transmission', params: { ...settingsFor({ a: 0.2, q: 0.7, cycles: 20 }), r0: -1 } }, (m) => messages.push(m));
    expect(messages).toHaveLength(1);
    const m = messages[0] as Extract<SimResponse, { type: 'error' }>;
    expect(m.type).toBe('error');
    expect(m.error.field).toBe('r0');
    expect(m.error.range).toMatch(/> 0/);
    expect(m.error.value).toBe(-1);
  });
});

describe('SimClient', () => {
  it('starts the worker lazily, forwards progress and resolves with the result', async () => {
    let worker: FakeWorker | null = null;
    const client = new SimClient(() => (worker = new FakeWorker()));
    expect(client.started).toBe(false);
    const progress: number[] = [];
    const result = await client.run('peakProfile', profileParams, { onProgress: (f) => progress.push(f) });
    expect(worker).not.toBeNull();
    expect(client.started).toBe(true);
    expect(result.mz).toBeInstanceOf(Float64Array);
    expect(result.transmission.length).toBe(11);
    expect(progress.length).toBeGreaterThan(0);
    expect(progress[progress.length - 1]).toBe(1);
  });

  it('aborting terminates the worker, rejects with AbortError, and the next call starts a fresh worker', async () => {
    const workers: FakeWorker[] = [];
    const client = new SimClient(() => {
      const w = new FakeWorker();
      w.hold = true; // keep the first run "busy"
      workers.push(w);
      return w;
    });
    const controller = new AbortController();
    const running = client.run('peakProfile', profileParams, { signal: controller.signal });
    controller.abort();
    await expect(running).rejects.toSatisfy(isAbortError);
    expect(workers[0].terminated).toBe(true);
    expect(client.started).toBe(false);
    const second = client.run('transmission', settingsFor({ a: 0.2, q: 0.7, cycles: 20 }));
    expect(workers.length).toBe(2);
    workers[1].process(workers[1].held[0]);
    const r = await second;
    expect(r.transmission).toBeGreaterThanOrEqual(0);
  });

  it('an already-aborted signal rejects at once without starting a worker', async () => {
    let created = 0;
    const client = new SimClient(() => {
      created++;
      return new FakeWorker();
    });
    const controller = new AbortController();
    controller.abort();
    await expect(client.run('transmission', settingsFor({ a: 0.2, q: 0.7, cycles: 20 }), { signal: controller.signal })).rejects.toSatisfy(isAbortError);
    expect(created).toBe(0);
  });

  it('rejects bad input with InputRangeError naming the field', async () => {
    const client = new SimClient(() => new FakeWorker());
    const failing = client.run('peakProfile', { ...profileParams, points: 1 });
    await expect(failing).rejects.toBeInstanceOf(InputRangeError);
    await failing.catch((e: InputRangeError) => expect(e.field).toBe('points'));
  });

  it('a worker crash rejects the pending call and the next call restarts the worker', async () => {
    const workers: FakeWorker[] = [];
    const client = new SimClient(() => {
      const w = new FakeWorker();
      w.hold = true;
      workers.push(w);
      return w;
    });
    const pending = client.run('transmission', settingsFor({ a: 0.2, q: 0.7, cycles: 20 }));
    workers[0].onerror?.({ message: 'boom' });
    await expect(pending).rejects.toThrow(/boom/);
    expect(workers[0].terminated).toBe(true);
    void client.run('transmission', settingsFor({ a: 0.2, q: 0.7, cycles: 20 })).catch(() => undefined);
    expect(workers.length).toBe(2);
    client.dispose();
  });
});
