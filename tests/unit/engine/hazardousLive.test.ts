import { describe, expect, it } from 'vitest';
import { exceedsHazardousLevel, hazardousLive, HAZARDOUS_LIVE_LEVELS } from '../../../src/engine/index';

// IEC 61010-1:2010 cl. 6.3.1 levels (from memory, as quoted in domain.md F12).
describe('hazardous-live levels', () => {
  it('F12: 100 V DC in a dry location is hazardous; 60 V DC is not', () => {
    expect(hazardousLive({ dc: 100 }).hazardous).toBe(true);
    // 30 V per rod is 60 V between the pairs: below 70 V DC. 60 V per rod is 120 V between them: above.
    const thirty = hazardousLive({ dc: 30 });
    expect(thirty.perRod.hazardous).toBe(false);
    expect(thirty.betweenPairs.hazardous).toBe(false);
    expect(hazardousLive({ dc: 60 }).perRod.hazardous).toBe(false);
    expect(hazardousLive({ dc: 60 }).betweenPairs.hazardous).toBe(true);
  });
  it('levels as published: dry 33 V rms / 46.7 V peak / 70 V DC, wet 16 / 22.6 / 35', () => {
    expect(HAZARDOUS_LIVE_LEVELS.dry).toEqual({ rms: 33, peak: 46.7, dc: 70 });
    expect(HAZARDOUS_LIVE_LEVELS.wet).toEqual({ rms: 16, peak: 22.6, dc: 35 });
  });
  it('RF: 20 V zero-to-peak per rod is below every level (40 V peak between pairs); 100.9 V is far above', () => {
    const low = hazardousLive({ rf: 20 });
    expect(low.hazardous).toBe(false);
    expect(low.betweenPairs.peak).toBe(40);
    const kestrel = hazardousLive({ dc: 16.94, rf: 100.91 });
    expect(kestrel.hazardous).toBe(true);
    expect(kestrel.exceeded).toContain('46.7 V peak (one rod to ground)');
    expect(kestrel.perRod.peak).toBeCloseTo(117.85, 2);
  });
  it('wet location uses the lower levels', () => {
    expect(hazardousLive({ rf: 20 }).hazardous).toBe(false);
    expect(hazardousLive({ rf: 20, location: 'wet' }).hazardous).toBe(true);
  });
  it('single values against their own kind', () => {
    expect(exceedsHazardousLevel({ volts: 34, kind: 'rms' })).toBe(true);
    expect(exceedsHazardousLevel({ volts: 34, kind: 'peak' })).toBe(false);
    expect(exceedsHazardousLevel({ volts: -71, kind: 'dc' })).toBe(true);
  });
});
