// @vitest-environment happy-dom
// The Scan area on the real store: masses, the mass-axis check, and a measured scan with its peaks, isotope
// ratios and the verdict fit (run through the real request runner of the worker, in this thread).
import { afterEach, describe, expect, it } from 'vitest';
import { act } from 'preact/test-utils';
import { DEMO_SCAN_TEXT } from '../../../src/spectrum';
import { Masses } from '../../../src/ui/scan/Masses';
import { MassAxisCheck } from '../../../src/ui/scan/MassAxisCheck';
import { ScanPanel } from '../../../src/ui/scan/ScanPanel';
import { routeFor } from '../../../src/ui/routes';
import { NotFoundScreen } from '../../../src/ui/screens/NotFoundScreen';
import { massAxisTree } from '../../../src/diagnose/trees/massAxis';
import { SimClient, type WorkerLike } from '../../../src/worker/client';
import { runRequest, type SimRequest, type SimResponse } from '../../../src/worker/simProtocol';
import { demo, mount, openDisclosure, texts, typeInto, waitFor, type Harness } from './appHarness';

let h: Harness | null = null;
afterEach(async () => {
  await h?.unmount();
  h = null;
});

// Reference masses: ¹²C = 12 u exactly (definition of the unified atomic mass unit); ¹⁹F = 18.998403163 u
// (M. Wang et al., "The AME2016 atomic mass evaluation (II)", Chinese Physics C 41, 030003, 2017);
// electron 5.48579909065e-4 u (CODATA 2018, E. Tiesinga et al., Rev. Mod. Phys. 93, 025010, 2021).
const F19 = 18.998403163;
const E = 5.48579909065e-4;
const C4F9_ION = 4 * 12 + 9 * F19 - E; // 218.98507989
const CF3_ION = 12 + 3 * F19 - E;
// C9F20N: ¹⁴N = 14.003074004 u (AME2016).
const C9F20N_ION = 9 * 12 + 20 * F19 + 14.003074004 - E;

function click(el: Element | null | undefined): Promise<void> {
  if (!el) throw new Error('nothing to click');
  return act(async () => (el as HTMLElement).click());
}

/** A worker stand-in that runs the real request runner in this thread (terminate drops later messages). */
class InThreadWorker implements WorkerLike {
  onmessage: ((event: { data: SimResponse }) => void) | null = null;
  onerror: ((event: { message?: string }) => void) | null = null;
  private dead = false;
  postMessage(message: unknown): void {
    setTimeout(() => {
      if (this.dead) return;
      runRequest(message as SimRequest, (m) => !this.dead && this.onmessage?.({ data: m }));
    }, 0);
  }
  terminate(): void {
    this.dead = true;
  }
}

describe('Scan · masses', () => {
  it('C4F9 with charge +1: ion m/z and mass from the tabulated isotope masses, M+1 from the ¹³C abundance', async () => {
    h = await mount(<Masses />, demo('kestrel'));
    await typeInto(h.root, 'masses-formula', 'C4F9');
    await typeInto(h.root, 'masses-charge', '1');
    const mz = await waitFor(() => texts(h!.root, '[data-testid="masses-mz"] .result-value')[0], 'the ion m/z');
    expect(mz).toBe(C4F9_ION.toFixed(5));
    expect(texts(h.root, '[data-testid="masses-mass"] .result-value')[0]).toBe(`${(C4F9_ION + E).toFixed(5)} u`);
    // ¹³C 1.07 %, ¹²C 98.93 % (IUPAC representative isotopic composition, as tabulated by NIST): M+1/M = 4·0.0107/0.9893.
    const rows = texts(h.root, '[data-testid="isotope-table"] tbody tr');
    expect(rows[0]).toBe(`${C4F9_ION.toFixed(4)}100.00 %`);
    const m1 = Number(/^([\d.]+) %$/.exec(texts(h.root, '[data-testid="isotope-table"] tbody tr:nth-child(2) td')[1])![1]);
    expect(m1).toBeCloseTo((100 * 4 * 0.0107) / 0.9893, 1);
    expect(h.root.textContent).not.toMatch(/NaN/);
    // Kept per instrument.
    await h.setting<{ formula: string }>(`inputs:masses:${demo('kestrel').id}`, (v) => v?.formula === 'C4F9');
    // Note this: the value goes into the instrument's current visit.
    await click(h.root.querySelector('[data-testid="masses-mz"] button'));
    await waitFor(() => h!.messages.some((m) => m.startsWith('Noted in')), 'the note to be kept');
    expect((h.notes[0] as { value: number }).value).toBeCloseTo(C4F9_ION, 8);
  });

  it('a bad formula is named with its position and reason; a zero charge with the accepted range', async () => {
    h = await mount(<Masses />, demo('kestrel'));
    await typeInto(h.root, 'masses-formula', 'C4Qq9');
    const msg = await waitFor(() => h!.root.querySelector('[data-testid="masses-problem"]')?.textContent, 'the formula message');
    expect(msg).toMatch(/position 3/);
    expect(h.root.querySelector('#masses-formula')?.getAttribute('aria-invalid')).toBe('true');
    await typeInto(h.root, 'masses-formula', 'C4F9');
    await typeInto(h.root, 'masses-charge', '0');
    await waitFor(() => /Charge: 0 is out of range; enter a non-zero whole number from −100 to 100/.test(h!.root.textContent ?? ''), 'the charge message');
    expect(h.root.textContent).not.toMatch(/NaN/);
  });
});

describe('Scan · mass-axis check', () => {
  async function enter(rows: [string, string][]) {
    for (let i = 3; i < rows.length; i++) await click([...h!.root.querySelectorAll('button')].find((b) => b.textContent === 'Add an ion'));
    for (let i = 0; i < rows.length; i++) {
      await typeInto(h!.root, `axis-ref-${i}`, rows[i][0]);
      await typeInto(h!.root, `axis-obs-${i}`, rows[i][1]);
    }
  }

  it('a scale-and-offset error: the line fit takes it out, the largest error is judged against ±0.1 u and noted', async () => {
    h = await mount(<MassAxisCheck />, demo('kestrel'));
    const refs = [CF3_ION, C4F9_ION, C9F20N_ION];
    const observed = refs.map((r) => r * 1.0001 + 0.02);
    await enter([['CF3', observed[0].toFixed(5)], ['C4F9', observed[1].toFixed(5)], [C9F20N_ION.toFixed(5), observed[2].toFixed(5)]]);
    const verdict = await waitFor(() => h!.root.querySelector('[data-testid="axis-verdict"]')?.textContent, 'the verdict');
    const largest = Math.abs(Number(observed[2].toFixed(5)) - Number(C9F20N_ION.toFixed(5)));
    expect(verdict).toBe(`Within tolerance: the largest error is ${largest.toFixed(4)} u, inside ±0.1 u.`);
    // An exact line through three points: residuals are rounding only (5 decimals typed).
    const rms = Number(/([\d.]+) ppm/.exec(texts(h.root, '[data-testid="axis-rms"] .result-value')[0])![1]);
    expect(rms).toBeLessThan(0.05);
    expect(h.root.querySelector('[data-testid="axis-coefficients"]')?.textContent).toMatch(/\+0\.99990\d+ × observed/);
    await typeInto(h.root, 'axis-tolerance', '0.05');
    await waitFor(() => /^Outside tolerance/.test(h!.root.querySelector('[data-testid="axis-verdict"]')?.textContent ?? ''), 'the verdict to turn');
    await h.setting<{ tolerance: string }>(`inputs:mass-axis:${demo('kestrel').id}`, (v) => v?.tolerance === '0.05');
    await click(h.root.querySelector('[data-testid="axis-largest"] button'));
    await waitFor(() => h!.messages.some((m) => m.startsWith('Noted in')), 'the note');
    expect((h.notes[0] as { value: number; unit: string }).unit).toBe('u');
    expect(h.root.textContent).not.toMatch(/NaN/);
  });

  it('refusals in plain words: too few ions for the order, a repeated observed m/z, a bad observed value', async () => {
    h = await mount(<MassAxisCheck />, demo('kestrel'));
    await enter([['CF3', '69.01'], ['C4F9', '219.02'], ['', '']]);
    await waitFor(() => /needs at least 3 ions with both values \(you have 2\)/.test(h!.root.querySelector('[data-testid="axis-refusal"]')?.textContent ?? ''), 'the too-few refusal');
    await typeInto(h.root, 'axis-ref-2', 'C9F20N');
    await typeInto(h.root, 'axis-obs-2', '219.02');
    await waitFor(() => /Observed m\/z 219.02 appears twice/.test(h!.root.querySelector('[data-testid="axis-refusal"]')?.textContent ?? ''), 'the repeated refusal');
    await typeInto(h.root, 'axis-obs-2', 'abc');
    await waitFor(() => /Observed m\/z: “abc” is not a number/.test(h!.root.textContent ?? ''), 'the field message');
    expect(h.root.querySelector('[data-testid="axis-chart"]')).toBeNull();
    expect(h.root.textContent).not.toMatch(/NaN/);
  });

  it('the mass-axis tree links its mass-error step to this screen, and the path is a real route', () => {
    const step = massAxisTree.nodes.find((n) => n.id === 'MA1');
    const link = step && 'measure' in step ? step.measure?.toolLink : undefined;
    expect(link?.path).toBe('/scan/mass-axis');
    expect(routeFor(link!.path)).not.toBe(NotFoundScreen);
  });
});

describe('Scan · measured scan and verdict', () => {
  it('the demo scan: peaks, C4F9 isotope ratios, then the verdict fit in the worker runner, noted into a visit', async () => {
    const client = new SimClient(() => new InThreadWorker());
    h = await mount(<ScanPanel client={client} />, demo('kestrel'));
    await typeInto(h.root, 'scan-text', DEMO_SCAN_TEXT);
    await typeInto(h.root, 'scan-formula', 'C4F9');
    const first = await waitFor(() => h!.root.querySelector('[data-testid="peak-choose"]'), 'the peak list');
    const centroids = texts(h.root, '[data-testid="peak-choose"]').map(Number);
    // The monoisotopic C4F9⁺ peak is found within 0.05 u of its exact m/z (the demo was made with no axis error).
    expect(centroids.some((c) => Math.abs(c - C4F9_ION) < 0.05)).toBe(true);
    const ratio = await waitFor(() => h!.root.querySelector('[data-testid="ratio-table"]')?.textContent, 'the isotope ratios');
    expect(ratio).toMatch(/expected 4\.3 %/);
    expect(first).toBeTruthy();
    const main = [...h.root.querySelectorAll('[data-testid="peak-choose"]')].find((b) => Math.abs(Number(b.textContent) - C4F9_ION) < 0.05);
    await click(main);
    await waitFor(() => h!.root.querySelector('[data-testid="chosen-fwhm"]'), 'the chosen peak');
    await click(h.root.querySelector('[data-testid="fit-run"]'));
    const verdict = await waitFor(() => h!.root.querySelector('[data-testid="fit-verdict"]')?.textContent, 'the verdict', 120_000);
    expect(verdict).toMatch(/^(Explained by the operating point|Not explained by the operating point): \S/);
    await openDisclosure(h.root, 'What the model leaves out');
    expect(h.root.querySelector('[data-testid="fit-limits"]')?.textContent).toMatch(/no fringe fields/);
    expect(h.root.textContent).not.toMatch(/NaN/);
    await click(h.root.querySelector('[data-testid="fit-offset"] button'));
    await waitFor(() => h!.messages.some((m) => m.startsWith('Noted in')), 'the note');
    const visits = await h.store.listVisits(demo('kestrel').id);
    expect(visits.length).toBeGreaterThan(0);
  }, 180_000);

  it('a bad line is named with its number; lines out of order are sorted and said so', async () => {
    h = await mount(<ScanPanel client={new SimClient(() => new InThreadWorker())} />, demo('kestrel'));
    await typeInto(h.root, 'scan-text', 'm/z,intensity\n216.0,1\n216.1,2\n216.2,x3\n');
    const msg = await waitFor(() => h!.root.querySelector('[data-testid="scan-problem"]')?.textContent, 'the scan message');
    expect(msg).toMatch(/^Scan line 4: /);
    const lines = DEMO_SCAN_TEXT.trim().split('\n');
    await typeInto(h.root, 'scan-text', [...lines.slice(0, 2), ...lines.slice(2).reverse()].join('\n'));
    await waitFor(() => h!.root.querySelector('[data-testid="scan-sorted"]'), 'the sorted note');
  });

  it('Cancel ends a running fit: the worker is stopped and the screen says so', async () => {
    let stopped = false;
    // A worker still computing: it never answers until stopped.
    const silent: WorkerLike = { onmessage: null, onerror: null, postMessage: () => undefined, terminate: () => void (stopped = true) };
    h = await mount(<ScanPanel client={new SimClient(() => silent)} />, demo('kestrel'));
    await click(h.root.querySelector('[data-testid="load-demo"]'));
    const peak = await waitFor(() => h!.root.querySelector('[data-testid="peak-choose"]'), 'the peak list');
    await click(peak);
    await click(await waitFor(() => h!.root.querySelector('[data-testid="fit-run"]'), 'the fit button'));
    await click(await waitFor(() => h!.root.querySelector('[data-testid="fit-cancel"]'), 'the Cancel button'));
    await waitFor(() => h!.root.querySelector('[data-testid="fit-cancelled"]'), 'the cancelled note');
    expect(stopped).toBe(true);
    expect(h.root.querySelector('[data-testid="fit-running"]')).toBeNull();
  });
});
