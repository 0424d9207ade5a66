// @vitest-environment happy-dom
// Coarse → refined on the Peak screen: the worker posts a coarse complete profile (bound ≤ 1 % of the peak
// height) before the refined one; the screen shows it labelled "coarse — refining…" until the refinement lands.
// A run that is already computing is let finish its coarse profile when a slider moves; a run that is refining
// is cancelled at once.
import { isDeepStrictEqual } from 'node:util';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { act } from 'preact/test-utils';
import { COARSE_PROFILE_OPTIONS, peakProfile, profileWithin, type PeakProfile } from '../../../src/engine';
import { PeakSimulation } from '../../../src/ui/peak/PeakSimulation';
import { buildPeakRun, peakDefaults } from '../../../src/ui/peak/peakInputs';
import { SimClient, type WorkerLike } from '../../../src/worker/client';
import { runRequest, type SimRequest, type SimResponse } from '../../../src/worker/simProtocol';
import { formatNumber } from '../../../src/ui/format';
import { demo, mount, texts, type Harness } from '../ui/appHarness';
import { waitFor } from '../waitFor';

vi.mock('../../../src/ui/components/Chart', () => ({
  // A chart whose data is still computed (null) shows no points.
  Chart: (props: { data: number[][] | null; testId?: string; label: string }) => (
    <figure data-testid={props.testId} data-points={props.data?.[0].length ?? 0} data-first={props.data?.[1][50]} aria-label={props.label} aria-busy={props.data ? undefined : 'true'} />
  ),
}));

/** Computes each request with the real protocol but hands its messages over one at a time, on request. */
class SteppedWorker implements WorkerLike {
  onmessage: ((event: { data: SimResponse }) => void) | null = null;
  onerror: ((event: { message?: string }) => void) | null = null;
  terminated = false;
  outbox: SimResponse[] = [];
  requests: SimRequest[] = [];
  postMessage(message: unknown): void {
    const request = message as SimRequest;
    this.requests.push(request);
    runRequest(request, (response) => this.outbox.push(response));
  }
  terminate(): void {
    this.terminated = true;
  }
  /** Deliver messages up to and including the first of `type`. */
  deliverThrough(type: SimResponse['type']): SimResponse {
    for (;;) {
      const next = this.outbox.shift();
      if (!next) throw new Error(`no ${type} message left`);
      if (!this.terminated) this.onmessage?.({ data: next });
      if (next.type === type) return next;
    }
  }
}

let h: Harness | null = null;
afterEach(() => {
  h?.unmount();
  h = null;
});

const kept = { mz: '100', resolution: '200', axialVoltage: '20' };

/** A client whose every run gets a new stepped worker, kept in `workers` in the order they were made. */
function steppedClient(): { client: SimClient; workers: SteppedWorker[] } {
  const workers: SteppedWorker[] = [];
  const client = new SimClient(() => {
    const w = new SteppedWorker();
    workers.push(w);
    return w;
  });
  return { client, workers };
}

/**
 * The live run of `params`. The screen shows the default inputs until the kept ones are read from the store; on a
 * busy machine a run of the defaults can start first and is cancelled when the kept inputs arrive.
 */
function liveRunOf(workers: SteppedWorker[], params: unknown): SteppedWorker | null {
  return workers.find((w) => !w.terminated && w.outbox.length > 0 && isDeepStrictEqual(w.requests[0]?.params, params)) ?? null;
}

describe('worker: coarse then refined', () => {
  it('posts a partial coarse profile (bound ≤ 1 % of its peak) before the refined result', () => {
    const k = demo('kestrel');
    const run = buildPeakRun({ ...peakDefaults(k), ...kept }, k, {})!;
    const messages: SimResponse[] = [];
    runRequest({ id: 3, kind: 'peakProfile', params: run.params }, (m) => messages.push(m));
    const types = messages.filter((m) => m.type !== 'progress').map((m) => m.type);
    expect(types).toEqual(['partial', 'result']);
    const partial = messages.find((m) => m.type === 'partial') as Extract<SimResponse, { type: 'partial' }>;
    expect(partial.coarse).toBe(true);
    const coarse = partial.result as PeakProfile;
    expect(coarse.transmission).toHaveLength(101);
    expect(profileWithin(coarse, COARSE_PROFILE_OPTIONS.relativeTolerance)).toBe(true);
    const refined = (messages[messages.length - 1] as { result: PeakProfile }).result;
    expect(Array.from(refined.transmission)).toEqual(Array.from(peakProfile(run.params).transmission));
  });
});

describe('PeakSimulation: coarse → refined', () => {
  it('labels the coarse profile until the refinement lands, then shows the refined values', async () => {
    const { client, workers } = steppedClient();
    const k = demo('kestrel');
    h = await mount(<PeakSimulation client={client} curveClient={new SimClient(() => new SteppedWorker())} />, k, { [`inputs:peak:${k.id}`]: kept });
    const keptRun = buildPeakRun({ ...peakDefaults(k), ...kept }, k, {})!;
    const worker = await waitFor(() => liveRunOf(workers, keptRun.params), 'the run of the kept inputs');
    const partial = worker.deliverThrough('partial') as Extract<SimResponse, { type: 'partial' }>;
    await waitFor(() => h!.root.querySelector('[data-testid="peak-coarse"]'), 'the coarse label');
    const coarse = partial.result as PeakProfile;
    const label = h.root.querySelector('[data-testid="peak-coarse"]');
    expect(label?.textContent).toMatch(/coarse — refining…/);
    expect(h.root.querySelector('[data-testid="peak-result"]')?.getAttribute('aria-busy')).toBe('true');
    const value = (id: string) => texts(h!.root, `[data-testid="${id}"] .result-value`)[0];
    expect(value('peak-transmission')).toContain(`${formatNumber(100 * coarse.peakTransmission, 3)} %`);
    expect(h.root.querySelector('[data-testid="peak-chart"]')?.getAttribute('data-points')).toBe('101');
    expect(h.root.textContent).toMatch(/≤ 1 % of the peak height/);

    const final = worker.deliverThrough('result') as Extract<SimResponse, { type: 'result' }>;
    await waitFor(() => !h!.root.querySelector('[data-testid="peak-coarse"]'), 'the refined profile to replace the coarse one');
    const refined = final.result as PeakProfile;
    expect(h.root.querySelector('[data-testid="peak-coarse"]')).toBeNull();
    expect(h.root.querySelector('[data-testid="peak-result"]')?.getAttribute('aria-busy')).toBe('false');
    expect(value('peak-transmission')).toContain(`${formatNumber(100 * refined.peakTransmission, 3)} %`);
    expect(value('peak-r50')).toBe(formatNumber(refined.resolution50, 4));
    expect(h.root.textContent).toMatch(/≤ 0.1 % of the peak height/);
  });

  it('a slider move lets a computing run land its coarse profile, then starts the newest inputs; a refining run is cancelled', async () => {
    const { client, workers } = steppedClient();
    const k = demo('kestrel');
    // The hand-over depends on how long ago the run last reported: the test holds the clock still, so a slow
    // machine cannot make the run look stalled.
    const clock = () => 1_000_000;
    h = await mount(<PeakSimulation client={client} curveClient={new SimClient(() => new SteppedWorker())} clock={clock} />, k, { [`inputs:peak:${k.id}`]: kept });
    const keptRun = buildPeakRun({ ...peakDefaults(k), ...kept }, k, {})!;
    const first = await waitFor(() => liveRunOf(workers, keptRun.params), 'the run of the kept inputs');
    // The run has started reporting progress …
    first.deliverThrough('progress');
    await waitFor(() => h!.root.querySelector('progress[aria-label="Simulation progress"]'), 'the run’s progress on screen');
    // … so a slider move does not kill it before its coarse profile.
    const slider = h.root.querySelector<HTMLInputElement>('#peak-beam-slider')!;
    await act(async () => {
      slider.value = '0.3';
      slider.dispatchEvent(new Event('input', { bubbles: true }));
    });
    await waitFor(() => /beam 0\.3 mm/.test(h!.root.textContent ?? ''), 'the moved slider in the settings line');
    expect(first.terminated).toBe(false);
    first.deliverThrough('partial');
    await waitFor(() => first.terminated, 'the older run to end once its coarse profile landed');
    // Coarse drawn, and the newer inputs start at once (the old run's refinement is dropped).
    expect(first.terminated).toBe(true);
    expect(h.root.querySelector('[data-testid="peak-chart"]')?.getAttribute('data-points')).toBe('101');
    const run = buildPeakRun({ ...peakDefaults(k), ...kept, beamRadiusMm: '0.3' }, k, {})!;
    const newer = await waitFor(() => liveRunOf(workers, run.params), 'the newer run');
    expect(newer.requests).toHaveLength(1);
    // While refining, a move cancels at once.
    newer.deliverThrough('partial');
    await waitFor(() => h!.root.querySelector('[data-testid="peak-coarse"]'), 'the newer run’s coarse profile');
    await act(async () => {
      slider.value = '0.32';
      slider.dispatchEvent(new Event('input', { bubbles: true }));
    });
    await waitFor(() => newer.terminated, 'the refining run to be cancelled');
    expect(newer.terminated).toBe(true);
  });
});
