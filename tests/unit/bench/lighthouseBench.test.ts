// The Lighthouse bench (bench/lighthouse.bench.ts): its browser flags (Chromium keeps its own RenderDocument, every
// other feature chrome-launcher switches off stays off, the launcher's list kept as it is on request) and the
// median run it prints beside the best.
import { describe, expect, it } from 'vitest';
import { Launcher } from 'chrome-launcher';
import { chromeFlags, median } from '../../../bench/lighthouse.bench';

const prefix = '--disable-features=';
const launcherFeatures = () => Launcher.defaultFlags().find((f) => f.startsWith(prefix))!.slice(prefix.length).split(',');

describe('chromeFlags', () => {
  it("passes the launcher's switched-off features less RenderDocument, after the launcher's own flag", () => {
    const flags = chromeFlags(false);
    expect(flags.slice(0, 3)).toEqual(['--headless', '--no-sandbox', '--disable-gpu']);
    const disabled = flags.filter((f) => f.startsWith(prefix));
    expect(disabled).toHaveLength(1);
    const features = disabled[0]!.slice(prefix.length).split(',');
    expect(launcherFeatures()).toContain('RenderDocument');
    expect(features).not.toContain('RenderDocument');
    expect(features).toEqual(launcherFeatures().filter((f) => f !== 'RenderDocument'));
  });

  it("keeps the launcher's list when asked (no feature flag of its own)", () => {
    expect(chromeFlags(true)).toEqual(['--headless', '--no-sandbox', '--disable-gpu']);
  });
});

describe('median', () => {
  it('gives the middle run by score, the lower middle of an even count', () => {
    const run = (performance: number, tbtMs: number) => ({ performance, tbtMs });
    expect(median([run(0.99, 20), run(0.91, 300), run(0.96, 120)])).toBe('0.96 / 120 ms');
    expect(median([run(0.98, 40), run(0.93, 250)])).toBe('0.93 / 250 ms');
    expect(median([])).toBe('—');
  });
});
