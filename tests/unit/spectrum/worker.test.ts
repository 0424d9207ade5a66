// The verdict fit as a worker call (src/worker/simProtocol.ts 'peakFit', src/worker/client.ts) with a fake Worker
// that runs the real protocol: progress, a transferred result, refusals with field names, cancellation by termination.
import { beforeAll, describe, expect, it } from 'vitest';
import { SimClient, isAbortError, type WorkerLike } from '../../../src/worker/client';
import { runRequest, type SimRequest, type SimResponse } from '../../../src/worker/simProtocol';
import type { PeakFitRequest, PeakFitResult } from '../../../src/spectrum/index';
import { INSTRUMENT, cleanPeak, measured, type CleanPeak } from './synthetic';

class FakeWorker implements WorkerLike {
  onmessage: ((event: { data: SimResponse }) => void) | null = null;
  onerror: ((event: { message?: string }) => void) | null = null;
  terminated = false;
  transfers: ArrayBuffer[][] = [];
  postMessage(message: unknown): void {
    setTimeout(() => {
      if (this.terminated) return;
      runRequest(message as SimRequest, (response, transfer) => {
        if (transfer) this.transfers.push(transfer);
        if (!this.terminated) this.onmessage?.({ data: response });
      });
    }, 0);
  }
  terminate(): void {
    this.terminated = true;
  }
}

let peak: CleanPeak;
let request: PeakFitRequest;
beforeAll(() => {
  peak = cleanPeak({ ionMz: 68.995, bandResolution: 300, axialVoltage: 4, points: 121 });
  request = { scan: measured(peak, { height: 1e4, baseline: 200, noise: 40, seed: 21 }), peakMz: 69, instrument: INSTRUMENT, axialVoltage: 4 };
}, 120_000);

describe('peakFit in the worker', () => {
  it('reports rising progress, then the result with its curves in the transfer list', async () => {
    const worker = new FakeWorker();
    const client = new SimClient(() => worker);
    const progress: number[] = [];
    const result: PeakFitResult = await client.run('peakFit', request, { onProgress: (f) => progress.push(f) });
    expect(progress.length).toBeGreaterThan(3);
    for (let i = 1; i < progress.length; i++) expect(progress[i]).toBeGreaterThanOrEqual(progress[i - 1]);
    expect(progress[progress.length - 1]).toBe(1);
    expect(result.verdict.explained).toBe(true);
    const transferred = worker.transfers[worker.transfers.length - 1];
    for (const key of ['mz', 'measured', 'fitted', 'residual', 'pointNoise'] as const) expect(transferred).toContain(result[key].buffer);
  }, 120_000);

  it('passes a refusal back with its message', async () => {
    const client = new SimClient(() => new FakeWorker());
    await expect(client.run('peakFit', { ...request, instrument: { ...INSTRUMENT, rodLength: -1 } })).rejects.toThrow(/rodLength = -1 is out of range/);
  });

  it('abort terminates the worker and rejects with AbortError', async () => {
    const worker = new FakeWorker();
    const client = new SimClient(() => worker);
    const controller = new AbortController();
    const run = client.run('peakFit', request, { signal: controller.signal });
    controller.abort();
    const error = await run.catch((e: unknown) => e);
    expect(isAbortError(error)).toBe(true);
    expect(worker.terminated).toBe(true);
    expect(client.started).toBe(false);
  });
});
