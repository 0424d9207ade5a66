// The Lighthouse bench's browser flags (bench/lighthouse.bench.ts): Chromium keeps its own RenderDocument, every
// other feature chrome-launcher switches off stays off, and the launcher's list can be kept as it is to compare.
import { describe, expect, it } from 'vitest';
import { Launcher } from 'chrome-launcher';
import { chromeFlags } from '../../../bench/lighthouse.bench';

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
