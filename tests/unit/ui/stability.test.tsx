// @vitest-environment happy-dom
import { afterEach, describe, expect, it } from 'vitest';
import { act } from 'preact/test-utils';
import { constantWidthScanLine, operatingPoint, passBandDetail, scanPoint } from '../../../src/engine';
import { StabilityDiagram } from '../../../src/ui/stability/StabilityDiagram';
import { formatNumber } from '../../../src/ui/format';
import { demo, mount, openDisclosure, texts, typeInto, waitFor, type Harness } from './appHarness';

let h: Harness | null = null;
afterEach(async () => {
  await h?.unmount();
  h = null;
});

describe('Stability · diagram (Kestrel)', () => {
  it('pass band and operating points at the constant-width line through m/z 69 match the engine', async () => {
    const k = demo('kestrel');
    h = await mount(<StabilityDiagram />, k);
    const g = { r0: k.rodFieldRadius, frequency: k.rfFrequency };
    const line = constantWidthScanLine({ width: 1, referenceMz: 219, ...g });
    const sp = scanPoint({ line, mz: 69, ...g })!;
    const band = passBandDetail({ dc: sp.dc, rf: sp.rf, ...g })!;
    expect(texts(h.root, '[data-testid="band-interval"]')[0]).toBe(`m/z ${formatNumber(band.low, 6)} – ${formatNumber(band.high, 6)} passes`);
    await openDisclosure(h.root, 'Edges, width and U/V');
    expect(texts(h.root, '[data-testid="band-low"] .result-value')[0]).toBe(`${formatNumber(band.low, 6)} u`);
    expect(texts(h.root, '[data-testid="band-high"] .result-value')[0]).toBe(`${formatNumber(band.high, 6)} u`);
    expect(texts(h.root, '[data-testid="band-ratio"] .result-value')[0]).toBe(formatNumber(sp.dc / sp.rf, 6));
    // 100 V on the rods is hazardous live: a one-line caution sits beside the values, its full card (with the
    // deferral) one tap away.
    await openDisclosure(h.root, 'hv-short');
    expect(h.root.querySelector('[data-testid="hv-short"] [data-testid="hv-caution"]')?.textContent).toMatch(/maker's procedures/);
    // The band is centred on the set m/z and is 1 u wide at the reference m/z 219 (constant-width line).
    expect(Math.abs((band.low + band.high) / 2 - 69)).toBeLessThan(1e-6);
    const list = texts(h.root, '[data-testid="op-list"] li');
    expect(list[0]).toBe('m/z 69 (set): ✓ passes');
    for (const mz of [68, 70, 219]) {
      const op = operatingPoint({ mz, ...g, dc: sp.dc, rf: sp.rf });
      expect(op.firstRegion).toBe(false);
      expect(list).toContain(`m/z ${mz}: ✗ does not pass — ${op.cutSide}`);
    }
  });

  it('choosing a point from the list opens its panel with a, q, β and the nearest edge from the engine', async () => {
    const k = demo('kestrel');
    h = await mount(<StabilityDiagram />, k);
    const g = { r0: k.rodFieldRadius, frequency: k.rfFrequency };
    const line = constantWidthScanLine({ width: 1, referenceMz: 219, ...g });
    const sp = scanPoint({ line, mz: 69, ...g })!;
    const op = operatingPoint({ mz: 69, ...g, dc: sp.dc, rf: sp.rf });
    const button = [...h.root.querySelectorAll<HTMLButtonElement>('[data-testid="op-list"] button')][0];
    await act(async () => button.click());
    const panel = await waitFor(() => h!.root.querySelector('[data-testid="point-panel"]'), 'the point panel');
    expect(texts(panel, '[data-testid="panel-a"] .result-value')[0]).toBe(formatNumber(op.a, 6));
    expect(texts(panel, '[data-testid="panel-q"] .result-value')[0]).toBe(formatNumber(op.q, 6));
    expect(texts(panel, '[data-testid="panel-bx"] .result-value')[0]).toBe(formatNumber(op.betaX!, 5));
    expect(texts(panel, '[data-testid="panel-by"] .result-value')[0]).toBe(formatNumber(op.betaY!, 5));
    const nearest = Math.abs(op.marginX) <= Math.abs(op.marginY) ? /x edge b₁/ : /y edge −a₀/;
    expect(texts(panel, '[data-testid="panel-edge"] .result-value')[0]).toMatch(nearest);
  });

  it('measured read-backs: U/V above the apex passes nothing, said in words', async () => {
    h = await mount(<StabilityDiagram />, demo('kestrel'));
    await typeInto(h.root, 'stab-source', 'measured');
    await typeInto(h.root, 'stab-u', '17.2');
    await typeInto(h.root, 'stab-v', '100.9');
    expect(h.root.querySelector('[data-testid="band-interval"]')?.textContent).toMatch(/✗ nothing passes/);
    await typeInto(h.root, 'stab-u', 'x');
    expect(h.root.querySelector('#stab-u-error')?.textContent).toMatch(/Measured U: “x” is not a number/);
  });
});

describe('Resolution · scan-law columns', () => {
  it('U/V on the constant-Δm line at each sampled m/z agrees with the engine’s forward scan point there', async () => {
    const { lawColumns } = await import('../../../src/ui/stability/ScanLawChart');
    const { constantResolutionScanLine, massRangeTop, apexRatio } = await import('../../../src/engine');
    const k = demo('kestrel');
    const g = { r0: k.rodFieldRadius, frequency: k.rfFrequency };
    const width = constantWidthScanLine({ width: 1, referenceMz: 219, ...g });
    const res = constantResolutionScanLine(500);
    const top = massRangeTop({ maxRf: k.maxRfAmplitude, ...g });
    const [mz, widthRatio, resRatio, apex] = lawColumns(width, res, k.maxRfAmplitude, top, g.r0, g.frequency);
    expect(mz.length).toBeGreaterThan(40);
    for (let i = 0; i < mz.length; i += 7) {
      const p = scanPoint({ line: width, mz: mz[i]!, ...g })!;
      expect(Math.abs(p.dc / p.rf - widthRatio[i]!)).toBeLessThan(1e-9);
      expect(resRatio[i]).toBe(res.slope);
      expect(apex[i]).toBe(apexRatio());
    }
    // m/z rises along the samples and ends near the top of the mass range.
    for (let i = 1; i < mz.length; i++) expect(mz[i]!).toBeGreaterThan(mz[i - 1]!);
    expect(Math.abs(mz[mz.length - 1]! - top) / top).toBeLessThan(0.01);
  });
});

describe('extreme input never breaks a screen or shows NaN', () => {
  it('m/z far beyond any supply on the Bench, Stability and Resolution screens', async () => {
    const { Voltages } = await import('../../../src/ui/bench/Voltages');
    const { ResolutionPlanner } = await import('../../../src/ui/stability/ResolutionPlanner');
    h = await mount(<Voltages />, demo('kestrel'));
    await typeInto(h.root, 'bench-mz', '69, 5000, 9e6');
    expect(h.root.querySelector('[data-mz="5000"] [data-testid="beyond-supply"]')?.textContent).toMatch(/Above this supply's largest RF/);
    expect(h.root.textContent).toMatch(/tens of megavolts/);
    expect(h.root.textContent).not.toMatch(/NaN|undefined/);
    await h.unmount();
    h = await mount(<StabilityDiagram />, demo('kestrel'));
    await typeInto(h.root, 'stab-set', '9e6');
    await typeInto(h.root, 'stab-list', '1e7');
    expect(h.root.textContent).not.toMatch(/NaN|undefined/);
    expect(h.root.querySelector('.field-error')).not.toBeNull();
    await h.unmount();
    h = await mount(<ResolutionPlanner />, demo('kestrel'));
    await typeInto(h.root, 'res-mz', '9e6');
    expect(h.root.textContent).not.toMatch(/NaN|undefined/);
  });
});
