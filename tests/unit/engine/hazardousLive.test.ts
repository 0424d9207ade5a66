import { describe, expect, it } from 'vitest';
import { exceedsHazardousLevel, hazardousLive } from '../../../src/engine/index';

// Behaviour against the figures of IEC 61010-1:2010 (3rd ed.) cl. 6.3.1 a) (normal condition, dry location:
// 33 V rms, 46.7 V peak, 70 V d.c.) and 6.3.2 (wet location: 16 V rms, 22.6 V peak, 35 V d.c.) — from memory.
// A sinusoid's peak is √2 × its rms: 33 V rms is 46.7 V peak, so the two a.c. limits agree for a pure sine.
describe('hazardous-live levels (IEC 61010-1:2010, 3rd ed., 6.3.1 a), from memory)', () => {
  it('d.c.: 69 V is not hazardous, 71 V is (70 V d.c. limit)', () => {
    expect(exceedsHazardousLevel({ volts: 69, kind: 'dc' })).toBe(false);
    expect(exceedsHazardousLevel({ volts: 71, kind: 'dc' })).toBe(true);
    expect(exceedsHazardousLevel({ volts: -71, kind: 'dc' })).toBe(true);
  });
  it('peak: 46 V peak is not hazardous, 47 V peak is (46.7 V peak limit)', () => {
    expect(exceedsHazardousLevel({ volts: 46, kind: 'peak' })).toBe(false);
    expect(exceedsHazardousLevel({ volts: 47, kind: 'peak' })).toBe(true);
  });
  it('rms: 32.5 V rms is not hazardous, 33.5 V rms is (33 V rms limit)', () => {
    expect(exceedsHazardousLevel({ volts: 32.5, kind: 'rms' })).toBe(false);
    expect(exceedsHazardousLevel({ volts: 33.5, kind: 'rms' })).toBe(true);
    // A value judged against its own kind: 34 V is above the rms limit but below the peak limit.
    expect(exceedsHazardousLevel({ volts: 34, kind: 'peak' })).toBe(false);
  });
  it('a sine on one rod: 46 V zero-to-peak (32.5 V rms) is below both a.c. limits per rod; 47 V is above the peak limit', () => {
    const below = hazardousLive({ rf: 46 });
    expect(below.perRod.peak).toBe(46);
    expect(below.perRod.rms).toBeCloseTo(46 / Math.SQRT2, 10);
    expect(below.perRod.hazardous).toBe(false);
    const above = hazardousLive({ rf: 47 });
    expect(above.perRod.hazardous).toBe(true);
    expect(above.exceeded).toContain('46.7 V peak (one rod to ground)');
    // 47 V zero-to-peak is 33.23 V rms: just above 33 V rms as well, as √2 × 33 = 46.67 predicts.
    expect(above.exceeded).toContain('33 V rms (one rod to ground)');
  });
  it('between the rod pairs the voltage doubles: 20 V zero-to-peak per rod is 40 V peak between them, below 46.7 V', () => {
    const low = hazardousLive({ rf: 20 });
    expect(low.betweenPairs.peak).toBe(40);
    expect(low.hazardous).toBe(false);
    const higher = hazardousLive({ rf: 24 });
    expect(higher.perRod.hazardous).toBe(false);
    expect(higher.betweenPairs.hazardous).toBe(true); // 48 V peak between the pairs
  });
  it('DC per rod: 30 V (60 V between pairs) is not hazardous, 36 V (72 V between pairs) is', () => {
    const thirty = hazardousLive({ dc: 30 });
    expect(thirty.perRod.hazardous).toBe(false);
    expect(thirty.betweenPairs.hazardous).toBe(false);
    const thirtySix = hazardousLive({ dc: 36 });
    expect(thirtySix.perRod.hazardous).toBe(false);
    expect(thirtySix.betweenPairs.hazardous).toBe(true);
  });
  it('DC with RF: peak |U| + V and rms √(U² + V²/2); m/z 69 on a 4.5 mm, 1 MHz analyser (U 16.94 V, V 100.91 V) is hazardous', () => {
    const r = hazardousLive({ dc: 16.94, rf: 100.91 });
    expect(r.perRod.peak).toBeCloseTo(117.85, 2);
    expect(r.perRod.rms).toBeCloseTo(Math.sqrt(16.94 ** 2 + 100.91 ** 2 / 2), 10);
    expect(r.hazardous).toBe(true);
  });
  it('wet location (6.3.2): 22 V peak is not hazardous, 23 V is; 34 V d.c. is not, 36 V is', () => {
    expect(exceedsHazardousLevel({ volts: 22, kind: 'peak', location: 'wet' })).toBe(false);
    expect(exceedsHazardousLevel({ volts: 23, kind: 'peak', location: 'wet' })).toBe(true);
    expect(exceedsHazardousLevel({ volts: 34, kind: 'dc', location: 'wet' })).toBe(false);
    expect(exceedsHazardousLevel({ volts: 36, kind: 'dc', location: 'wet' })).toBe(true);
    expect(hazardousLive({ rf: 20 }).hazardous).toBe(false);
    expect(hazardousLive({ rf: 20, location: 'wet' }).hazardous).toBe(true);
  });
  it('the result names its source with the edition', () => {
    expect(hazardousLive({ dc: 1 }).source).toMatch(/IEC 61010-1:2010 \(3rd ed\.\)/);
  });
});
