// The invented demo scan (src/spectrum/demoScan.ts) reads cleanly and shows the calibrant cluster it was made from.
import { describe, expect, it } from 'vitest';
import { DEMO_SCAN_INFO, DEMO_SCAN_TEXT, findPeaks, isotopePattern, readScan } from '../../../src/spectrum/index';

describe('demo scan', () => {
  it('is an invented Kestrel scan of C4F9+ with the M and M+1 peaks where the isotope pattern puts them', () => {
    expect(DEMO_SCAN_INFO.instrument).toBe('Kestrel');
    expect(DEMO_SCAN_TEXT.split('\n')[0]).toMatch(/invented/);
    const scan = readScan(DEMO_SCAN_TEXT);
    expect(scan.mz.length).toBe(801);
    const peaks = findPeaks(scan);
    const pattern = isotopePattern(DEMO_SCAN_INFO.formula);
    expect(peaks.length).toBeGreaterThanOrEqual(2);
    // Centroids within a tenth of the FWHM of the pattern's m/z; M+1/M height ratio as in the pattern (±10 %).
    for (let i = 0; i < 2; i++) expect(Math.abs(peaks[i].centroid - pattern[i].mz)).toBeLessThan(0.1 * peaks[i].fwhm);
    expect(peaks[1].height / peaks[0].height).toBeGreaterThan(0.9 * pattern[1].abundance);
    expect(peaks[1].height / peaks[0].height).toBeLessThan(1.1 * pattern[1].abundance);
  });
});
