// @vitest-environment happy-dom
import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { eraseStore, openStore } from '../../../src/store';
import { freshName } from '../store/helpers';
import { act } from 'preact/test-utils';
import {
  constantWidthScanLine, convertRf, dcForMass, hazardousLive, massForRf, massRangeTop, rfForMass, scanPoint,
} from '../../../src/engine';
import { Voltages } from '../../../src/ui/bench/Voltages';
import { formatNumber } from '../../../src/ui/format';
import { demo, mount, openDisclosure, texts, typeInto, waitFor, type Harness } from './appHarness';

let h: Harness | null = null;
afterEach(async () => {
  await h?.unmount();
  h = null;
});

function expectWithin(actual: number, expected: number, relative: number, what: string) {
  expect(Math.abs(actual - expected) <= relative * Math.abs(expected), `${what}: shown ${actual}, expected ${expected} ± ${relative * 100} %`).toBe(true);
}

function card(root: HTMLElement, mz: number): HTMLElement {
  const el = root.querySelector<HTMLElement>(`[data-testid="expected-card"][data-mz="${mz}"]`);
  if (!el) throw new Error(`no card for m/z ${mz}`);
  return el;
}
const value = (el: HTMLElement, id: string) => texts(el, `[data-testid="${id}"] .result-value`)[0];

describe('Bench · expected voltages (Kestrel: r0 4.5 mm, 1 MHz, read-backs 0-p per rod)', () => {
  it('apex line, m/z 69, 219, 502: V and U match the engine and the apex scan law (Dawson 1976, CODATA 2018; V0p 100.91 V, U 16.94 V at m/z 69; 734.13 V at 502)', async () => {
    const k = demo('kestrel');
    h = await mount(<Voltages />, k);
    const g = { r0: k.rodFieldRadius, frequency: k.rfFrequency };
    for (const mz of [69, 219, 502]) {
      expect(value(card(h.root, mz), 'rf-readback')).toBe(`${formatNumber(rfForMass({ mz, ...g }), 5)} V 0-p`);
      expect(value(card(h.root, mz), 'dc-readback')).toBe(`${formatNumber(dcForMass({ mz, ...g }), 5)} V DC`);
    }
    // Apex scan law V0p = 0.072218·M·r0²·f² (Dawson 1976 formula with CODATA 2018 constants; computed): tolerance ±0.05 %.
    const shown = (mz: number, id: string) => parseFloat(value(card(h!.root, mz), id));
    expectWithin(shown(69, 'rf-readback'), 100.91, 5e-4, 'V0p at m/z 69');
    expectWithin(shown(69, 'dc-readback'), 16.94, 5e-4, 'U at m/z 69');
    expectWithin(shown(502, 'rf-readback'), 734.13, 5e-4, 'V0p at m/z 502');
    // 100.9 V peak on a rod is above IEC 61010-1's 46.7 V peak: the caution line, its card a tap away, and tags show.
    await openDisclosure(h.root, 'hv-short');
    expect(h.root.querySelector('[data-testid="hv-caution"]')?.textContent).toMatch(/maker's procedures/);
    expect(texts(card(h.root, 69), '.tag-hv')).toEqual(['⚠ hazardous live']);
    // Top of the mass range from the supply's 1600 V.
    expect(texts(h.root, '[data-testid="mass-range-top"] .result-value')[0]).toBe(`m/z ${formatNumber(massRangeTop({ maxRf: 1600, ...g }), 4)}`);
  });

  it('Heron reads back peak-to-peak per rod: the read-back value is 2·V0p, and every convention is listed', async () => {
    const p = demo('heron');
    h = await mount(<Voltages />, p);
    const v = rfForMass({ mz: 219, r0: p.rodFieldRadius, frequency: p.rfFrequency });
    expect(value(card(h.root, 219), 'rf-readback')).toBe(`${formatNumber(2 * v, 5)} V p-p`);
    // Every convention is one tap away, in the card's "All conventions" disclosure.
    await openDisclosure(card(h.root, 219) as HTMLElement, 'All conventions');
    const all = texts(card(h.root, 219), '.conventions .result-value');
    expect(all).toContain(`${formatNumber(convertRf(v, 'zeroToPeakPerRod', 'rmsPerRod'), 5)} V rms ⚠`);
    expect(all).toContain(`${formatNumber(4 * v, 5)} V p-p ⚠`);
    expect(all.length).toBe(8);
  });

  it('a profile reading back rms between the pairs: V shown as √2·V0p and U as 2·U (voltage conventions of Dawson 1976: rms = V0p/√2, between the pairs ×2)', async () => {
    const k = { ...demo('kestrel'), id: 'between-pairs-rms', readbackConvention: { amplitude: 'rms' as const, reference: 'between-pairs' as const } };
    h = await mount(<Voltages />, k);
    const v = rfForMass({ mz: 69, r0: k.rodFieldRadius, frequency: k.rfFrequency });
    const u = dcForMass({ mz: 69, r0: k.rodFieldRadius, frequency: k.rfFrequency });
    expect(value(card(h.root, 69), 'rf-readback')).toBe(`${formatNumber(Math.SQRT2 * v, 5)} V rms`);
    expect(value(card(h.root, 69), 'dc-readback')).toBe(`${formatNumber(2 * u, 5)} V DC`);
  });

  it('Wren (RGA) offers the residual-gas list; a low m/z like 2 stays below the hazardous levels per rod', async () => {
    const p = demo('wren');
    h = await mount(<Voltages />, p);
    expect(texts(h.root, '[data-testid="expected-card"] h3').map((t) => /m\/z ([\d.]+)/.exec(t)?.[1])).toEqual(['2', '18', '28', '32', '40', '44']);
    const v2 = rfForMass({ mz: 2, r0: p.rodFieldRadius, frequency: p.rfFrequency });
    const hz = hazardousLive({ rf: v2, dc: dcForMass({ mz: 2, r0: p.rodFieldRadius, frequency: p.rfFrequency }) });
    expect(texts(card(h.root, 2), '.tag-hv').length).toBe(hz.hazardous ? 1 : 0);
  });

  it('constant-width line: U and V come from the engine scan point, and the band width is shown', async () => {
    const k = demo('kestrel');
    h = await mount(<Voltages />, k);
    await typeInto(h.root, 'bench-mode', 'constant-width');
    await typeInto(h.root, 'bench-width', '0.7');
    await typeInto(h.root, 'bench-ref', '219');
    const line = constantWidthScanLine({ width: 0.7, referenceMz: 219, r0: k.rodFieldRadius, frequency: k.rfFrequency });
    const sp = scanPoint({ line, mz: 69, r0: k.rodFieldRadius, frequency: k.rfFrequency })!;
    expect(value(card(h.root, 69), 'rf-readback')).toBe(`${formatNumber(sp.rf, 5)} V 0-p`);
    expect(value(card(h.root, 69), 'dc-readback')).toBe(`${formatNumber(sp.dc, 5)} V DC`);
    // Inputs are kept per profile and screen.
    const kept = await h.setting<Record<string, string>>(`inputs:bench:${k.id}`, (v) => v?.width === '0.7');
    expect(kept).toMatchObject({ mode: 'constant-width', width: '0.7' });
  });

  it('bad input shows a message beside the field: not a number, and the engine’s range message', async () => {
    const k = demo('kestrel');
    h = await mount(<Voltages />, k);
    await typeInto(h.root, 'bench-mz', '69, abc');
    expect(h.root.querySelector('#bench-mz-error')?.textContent).toMatch(/“abc” is not a number/);
    await typeInto(h.root, 'bench-mz', '69, -5');
    expect(h.root.querySelector('#bench-mz-error')?.textContent).toMatch(/^m\/z must be more than 0 and at most 1e7 u; -5 u is below that\.$/);
    expect(h.root.textContent).not.toMatch(/NaN/);
  });

  it('inverse: a measured 201.82 V p-p at m/z 69 set passes m/z from the engine, with error in u and ppm', async () => {
    const k = demo('kestrel');
    h = await mount(<Voltages />, k);
    await openDisclosure(h.root, 'Which m/z does a measured RF pass?');
    // One tap on the probe convention: peak-to-peak (Kestrel reads back zero-to-peak per rod).
    const pp = [...h.root.querySelectorAll<HTMLButtonElement>('[data-testid="inv-convention"] button')].find((b) => b.textContent === 'peak-to-peak')!;
    await act(async () => { pp.click(); });
    await waitFor(() => pp.classList.contains('seg-on') || pp.getAttribute('aria-pressed') === 'true', 'peak-to-peak chosen');
    await typeInto(h.root, 'inv-rf', '201.82');
    await typeInto(h.root, 'inv-set', '69');
    const passed = massForRf({ rf: 100.91, r0: k.rodFieldRadius, frequency: k.rfFrequency });
    expect(texts(h.root, '[data-testid="inverse-mz"] .result-value')[0]).toBe(`m/z ${formatNumber(passed, 6)}`);
    const ppm = ((passed - 69) / 69) * 1e6;
    expect(texts(h.root, '[data-testid="inverse-error-ppm"] .result-value')[0]).toBe(`${ppm >= 0 ? '+' : ''}${formatNumber(ppm, 4)} ppm`);
    expect(h.root.querySelector('[data-testid="inverse-convention"]')).toBeNull();
    // The same figure read as zero-to-peak is twice the RF: m/z 138-ish instead of 69, and the slip is named.
    const zp = [...h.root.querySelectorAll<HTMLButtonElement>('[data-testid="inv-convention"] button')].find((b) => b.textContent === 'zero-to-peak')!;
    await act(async () => { zp.click(); });
    await waitFor(() => h!.root.querySelector('[data-testid="inverse-convention"]'), 'the convention flag');
    expect(h.root.querySelector('[data-testid="inverse-convention"]')?.textContent).toMatch(/⇄ check the convention.*factor of 2.*read as peak-to-peak, one rod to ground/s);
  });

  it('proportionality: read-backs 100.9, 320.3, 734.1 V at 69/219/502 give k and a ✓ within 1 %; 760 V at 502 gives ✗', async () => {
    h = await mount(<Voltages />, demo('kestrel'));
    await openDisclosure(h.root, 'Proportionality check from read-backs');
    await typeInto(h.root, 'prop-rf-1', '100.9');
    await typeInto(h.root, 'prop-rf-2', '320.3');
    await typeInto(h.root, 'prop-rf-3', '734.1');
    const out = h.root.querySelector('[data-testid="proportionality-result"]')!;
    expect(out.textContent).toMatch(/✓ proportional within ±1 %/);
    const k = (69 * 100.9 + 219 * 320.3 + 502 * 734.1) / (69 * 69 + 219 * 219 + 502 * 502);
    expect(texts(out, '[data-testid="prop-constant"] .result-value')[0]).toBe(`${formatNumber(k, 5)} V 0-p per u`);
    await typeInto(h.root, 'prop-rf-3', '760');
    expect(h.root.querySelector('[data-testid="proportionality-result"]')!.textContent).toMatch(/✗ beyond ±1 %/);
  });

  it('"Note this" hands the value to noteThis and shows where it went', async () => {
    h = await mount(<Voltages />, demo('kestrel'));
    const btn = card(h.root, 69).querySelector<HTMLButtonElement>('[data-testid="rf-readback"] button')!;
    await act(async () => btn.click());
    await waitFor(() => h!.messages.length > 0, 'the “Noted in …” message');
    expect(h.notes[0]).toMatchObject({ label: expect.stringContaining('m/z 69'), unit: 'V0p-rod', typeId: 'rf-amplitude', origin: 'calculator', context: { mz: 69 } });
    expect((h.notes[0] as { value: number }).value).toBeCloseTo(100.9055, 3);
    expect(h.messages).toEqual([expect.stringMatching(/^Noted in the visit of \d{4}-\d{2}-\d{2}\.$/)]);
    const readings = await h.store.listInstrumentReadings(demo('kestrel').id, 'rf-amplitude');
    expect(readings).toHaveLength(1);
    expect(readings[0].value).toBeCloseTo(100.9055, 3);
  });

  it('with the real store, a noted expected RF becomes a typed RF reading at m/z 69 in the current visit', async () => {
    const name = freshName();
    const store = await openStore(name);
    await store.loadDemo();
    const k = demo('kestrel');
    h = await mount(<Voltages />, k, {}, store);
    const btn = card(h.root, 69).querySelector<HTMLButtonElement>('[data-testid="dc-readback"] button')!;
    await act(async () => btn.click());
    await waitFor(() => h!.messages.length > 0, 'the “Noted in …” message');
    expect(h.messages[0]).toMatch(/^Noted in the visit of \d{4}-\d{2}-\d{2}\.$/);
    const visits = await store.listVisits(k.id);
    const readings = await store.listReadings(visits[0].id);
    const dc = readings.find((r) => r.typeId === 'dc-amplitude' && r.origin === 'calculator');
    expect(dc?.context?.mz).toBe(69);
    expect(dc!.value).toBeCloseTo(dcForMass({ mz: 69, r0: k.rodFieldRadius, frequency: k.rfFrequency }), 9);
    await h.unmount();
    h = null;
    store.close();
    await eraseStore(name);
  });

  it('restores the inputs kept for this profile', async () => {
    const k = demo('kestrel');
    h = await mount(<Voltages />, k, { [`inputs:bench:${k.id}`]: { mzList: '131' } });
    await waitFor(() => /m\/z 131/.test(texts(h!.root, '[data-testid="expected-card"] h3')[0] ?? ''), 'the kept m/z 131 card');
    expect(texts(h.root, '[data-testid="expected-card"] h3')).toHaveLength(1);
  });
});
