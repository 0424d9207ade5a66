// @vitest-environment happy-dom
// Peak screen: inputs → engine parameters, results shown as the engine computes them, a moved slider cancels the
// stale worker run, bad input named beside its field, assumptions stated on screen.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { act } from 'preact/test-utils';
import { passBand, peakProfile, ratioForExactResolution, rfForMass } from '../../../src/engine';
import { PeakSimulation } from '../../../src/ui/peak/PeakSimulation';
import { buildPeakRun, peakDefaults } from '../../../src/ui/peak/peakInputs';
import { SimClient, type WorkerLike } from '../../../src/worker/client';
import { runRequest, type SimRequest, type SimResponse } from '../../../src/worker/simProtocol';
import { formatNumber } from '../../../src/ui/format';
import { demo, mount, openDisclosure, texts, typeInto, waitFor, type Harness } from '../ui/appHarness';

// uPlot needs a real canvas; the chart wrapper has its own tests upstream. Here a stand-in records the data.
vi.mock('../../../src/ui/components/Chart', () => ({
  // A chart whose data is still computed (null) shows no points.
  Chart: (props: { data: number[][] | null; testId?: string; label: string }) => (
    <figure data-testid={props.testId} data-points={props.data?.[0].length ?? 0} aria-label={props.label} aria-busy={props.data ? undefined : 'true'} />
  ),
}));

class ManualWorker implements WorkerLike {
  onmessage: ((event: { data: SimResponse }) => void) | null = null;
  onerror: ((event: { message?: string }) => void) | null = null;
  terminated = false;
  queue: SimRequest[] = [];
  postMessage(message: unknown): void {
    this.queue.push(message as SimRequest);
  }
  terminate(): void {
    this.terminated = true;
  }
  /** Run everything queued, as the real worker would. */
  flush(): void {
    for (const request of this.queue.splice(0)) {
      runRequest(request, (response) => {
        if (!this.terminated) this.onmessage?.({ data: response });
      });
    }
  }
}

let h: Harness | null = null;
afterEach(async () => {
  await h?.unmount();
  h = null;
});

const fieldValue = (id: string) => h!.root.querySelector<HTMLInputElement>(`#${id}`)?.value;
/** The one live worker holding a run request (the screen starts a run once its inputs stop changing). */
const pendingRun = (workers: ManualWorker[], what: string) =>
  waitFor(() => workers.find((w) => !w.terminated && w.queue.length > 0), what);

describe('peakInputs.buildPeakRun', () => {
  it('sets U/V from the exact edges (engine ratioForExactResolution), V at the apex for the m/z, window around the passBand', () => {
    const k = demo('kestrel');
    const errors = {};
    const run = buildPeakRun({ ...peakDefaults(k), mz: '219', resolution: '1000' }, k, errors)!;
    expect(errors).toEqual({});
    const rf = rfForMass({ mz: 219, r0: k.rodFieldRadius, frequency: k.rfFrequency });
    expect(run.rf).toBeCloseTo(rf, 9);
    expect(run.ratio).toBeCloseTo(ratioForExactResolution(1000), 12);
    const band = passBand({ dc: run.dc, rf, r0: k.rodFieldRadius, frequency: k.rfFrequency })!;
    expect(run.params.mzFrom).toBeLessThan(band.low);
    expect(run.params.mzTo).toBeGreaterThan(band.high);
    expect(run.params.points).toBe(101);
  });

  it('files bad values under their fields', () => {
    const k = demo('kestrel');
    const errors: Record<string, string> = {};
    expect(buildPeakRun({ ...peakDefaults(k), beamRadiusMm: '9', transverseEnergy: 'abc', resolution: '1' }, k, errors)).toBeNull();
    expect(errors.beamRadiusMm).toMatch(/field radius/);
    expect(errors.transverseEnergy).toMatch(/not a number/);
    expect(errors.resolution).toMatch(/2 to 100 000/);
    const engineErrors: Record<string, string> = {};
    expect(buildPeakRun({ ...peakDefaults(k), transverseEnergy: '-1' }, k, engineErrors)).toBeNull();
    // The engine's field name stays off the screen: the label and the limit in eV.
    expect(engineErrors.transverseEnergy).toMatch(/^Transverse energy /);
    expect(engineErrors.transverseEnergy).not.toMatch(/transverseEnergy/);
  });
});

describe('PeakSimulation', () => {
  it('shows the engine peak, R50/R10 and peak transmission; a slider move terminates the stale run', async () => {
    const workers: ManualWorker[] = [];
    const client = new SimClient(() => {
      const w = new ManualWorker();
      workers.push(w);
      return w;
    });
    const unusedCurve = new SimClient(() => new ManualWorker());
    const k = demo('kestrel');
    // A short, fast case: low resolution, high ion energy.
    h = await mount(<PeakSimulation client={client} curveClient={unusedCurve} />, k, { [`inputs:peak:${k.id}`]: { mz: '100', resolution: '200', axialVoltage: '20' } });
    await waitFor(() => fieldValue('peak-mz') === '100' && fieldValue('peak-resolution') === '200', 'the kept inputs on screen');
    const first = await pendingRun(workers, 'the first peak run to reach its worker');
    expect(workers.filter((w) => !w.terminated)).toEqual([first]);
    expect(h.root.querySelector('progress')).not.toBeNull();
    // Move the beam-radius slider while the first run is still pending: the first worker is terminated.
    const slider = h.root.querySelector<HTMLInputElement>('#peak-beam-slider')!;
    await act(async () => {
      slider.value = '0.3';
      slider.dispatchEvent(new Event('input', { bubbles: true }));
    });
    expect(first.terminated).toBe(true);
    const second = await pendingRun(workers, 'the run for the moved slider');
    expect(workers.filter((w) => !w.terminated)).toEqual([second]);
    await act(async () => second.flush());
    const run = buildPeakRun({ ...peakDefaults(k), mz: '100', resolution: '200', axialVoltage: '20', beamRadiusMm: '0.3' }, k, {})!;
    const expected = peakProfile(run.params);
    const value = (id: string) => texts(h!.root, `[data-testid="${id}"] .result-value`)[0];
    await waitFor(() => value('peak-r50') !== undefined, 'the peak results');
    expect(value('peak-r50')).toBe(formatNumber(expected.resolution50, 4));
    expect(value('peak-r10')).toBe(formatNumber(expected.resolution10, 4));
    expect(value('peak-transmission')).toContain(`${formatNumber(100 * expected.peakTransmission, 3)} %`);
    expect(h.root.querySelector('[data-testid="peak-chart"]')?.getAttribute('data-points')).toBe('101');
    // A newer run computing keeps the last peak on the chart (the result card is marked busy meanwhile).
    await act(async () => {
      slider.value = '0.4';
      slider.dispatchEvent(new Event('input', { bubbles: true }));
    });
    await waitFor(() => h!.root.querySelector('[data-testid="peak-result"][aria-busy="true"]'), 'the result card marked busy');
    expect(h.root.querySelector('[data-testid="peak-chart"]')?.getAttribute('data-points')).toBe('101');
    // The model's assumptions are one tap away.
    await openDisclosure(h.root, 'Model and its assumptions');
    expect(h.root.textContent).toMatch(/no fringe fields/);
    expect(h.root.textContent).toMatch(/random RF phase/);
  });

  it('computes the transmission-against-resolution curve on request, in the worker', async () => {
    const workers: ManualWorker[] = [];
    const client = new SimClient(() => {
      const w = new ManualWorker();
      workers.push(w);
      return w;
    });
    const k = demo('kestrel');
    const curveWorkers: ManualWorker[] = [];
    const curveClient = new SimClient(() => {
      const w = new ManualWorker();
      curveWorkers.push(w);
      return w;
    });
    h = await mount(<PeakSimulation client={client} curveClient={curveClient} />, k, { [`inputs:peak:${k.id}`]: { mz: '100', resolution: '200', axialVoltage: '20' } });
    await waitFor(() => fieldValue('peak-mz') === '100', 'the kept inputs on screen');
    const first = await pendingRun(workers, 'the first peak run to reach its worker');
    await act(async () => first.flush());
    await openDisclosure(h.root, 'Transmission against resolution');
    const button = await waitFor(() => [...h!.root.querySelectorAll('button')].find((b) => b.textContent === 'Compute the curve'), 'the “Compute the curve” button');
    await act(async () => button.click());
    expect(h.root.querySelector('[data-testid="peak-curve"] progress')).not.toBeNull();
    // The curve has its own worker: changing the resolution restarts the peak worker, not the curve's.
    await typeInto(h.root, 'peak-resolution', '300');
    const pending = await pendingRun(workers, 'a peak run for resolution 300'); // a peak run is now pending in the peak worker …
    await typeInto(h.root, 'peak-resolution', '400'); // … and is cancelled by the next edit
    expect(pending.terminated).toBe(true);
    expect(curveWorkers[0].terminated).toBe(false);
    await act(async () => curveWorkers[0].flush());
    const chart = await waitFor(() => h!.root.querySelector('[data-testid="peak-curve-chart"]'), 'the curve chart');
    expect(chart).not.toBeNull();
    expect(Number(chart!.getAttribute('data-points'))).toBeGreaterThanOrEqual(8);
  });

  it('a bad value shows its message beside the field and starts no run', async () => {
    const workers: ManualWorker[] = [];
    const client = new SimClient(() => {
      const w = new ManualWorker();
      workers.push(w);
      return w;
    });
    h = await mount(<PeakSimulation client={client} />, demo('kestrel'));
    // "No run starts" is about time passing: the timers are faked (the store's callbacks still run).
    vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout'] });
    try {
      await typeInto(h.root, 'peak-transverse', 'lots');
      await act(async () => { vi.advanceTimersByTime(60_000); });
      const before = workers.filter((w) => w.queue.length > 0 && !w.terminated).length;
      expect(before).toBe(0);
      expect(texts(h.root, '.field-error').join(' ')).toMatch(/Transverse energy/);
      await typeInto(h.root, 'peak-axial', '0');
      await act(async () => { vi.advanceTimersByTime(60_000); });
      expect(workers.filter((w) => w.queue.length > 0 && !w.terminated)).toHaveLength(0);
      // A good value again: once the inputs rest, the run starts.
      await typeInto(h.root, 'peak-transverse', '0.5');
      await typeInto(h.root, 'peak-axial', '20');
      await act(async () => { vi.advanceTimersByTime(60_000); });
      expect(workers.filter((w) => w.queue.length > 0 && !w.terminated)).toHaveLength(1);
    } finally {
      vi.useRealTimers();
    }
  });
});
