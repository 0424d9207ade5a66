// Spectrum module speed: isotope patterns (C100H200, Xe2), reading a 2,000-point scan and finding its peaks, and the
// verdict fit on the invented Kestrel demo scan (profile evaluations counted).
import { performance } from 'node:perf_hooks';
import { seededRandom } from '../src/engine/index';
import { DEMO_SCAN_INFO, DEMO_SCAN_TEXT, findPeaks, fitPeak, isotopePattern, readScan } from '../src/spectrum/index';
import { medianMs, report } from './timing';

function scanText(points: number): string {
  const random = seededRandom(42);
  const lines = ['m/z,intensity'];
  for (let i = 0; i < points; i++) {
    const m = 50 + (450 * i) / (points - 1);
    let y = 100;
    for (const [c, h] of [[69, 1e5], [131, 4e4], [219, 8e4], [264, 1e4], [414, 2e4], [502, 8e3]]) y += h * Math.exp(-0.5 * ((m - c) / 0.25) ** 2);
    lines.push(`${m.toFixed(4)},${(y + 10 * random.normal()).toFixed(1)}`);
  }
  return lines.join('\n');
}

export function run(): void {
  report('isotopePattern C100H200', medianMs(() => isotopePattern('C100H200'), 21, 3), 'ms', '< 50 ms');
  report('isotopePattern Xe2', medianMs(() => isotopePattern('Xe2'), 21, 3), 'ms', '< 50 ms');
  report('isotopePattern C9F20N (calibrant ion)', medianMs(() => isotopePattern('C9F20N'), 21, 3), 'ms');
  const text = scanText(2000);
  const peaks = findPeaks(readScan(text)).length;
  report(`readScan + findPeaks, 2,000 points (${peaks} peaks)`, medianMs(() => findPeaks(readScan(text)), 21, 3), 'ms', '< 50 ms');

  const scan = readScan(DEMO_SCAN_TEXT);
  const request = { scan, peakMz: 219, instrument: DEMO_SCAN_INFO.settings, axialVoltage: 3, wantedResolution: 1000 };
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  const result = fitPeak(request);
  const wall = performance.now() - t0;
  const cpu = process.cpuUsage(cpu0);
  report(`fitPeak, demo scan m/z 219 (${result.profiles} profiles; wall)`, wall, 'ms', '< 3000 ms');
  report('fitPeak, demo scan m/z 219 (CPU time)', (cpu.user + cpu.system) / 1000, 'ms');
  console.log(
    `fit: U/V ${result.ratio.value.toFixed(6)} ± ${result.ratio.sigma.toExponential(1)} (made at ${DEMO_SCAN_INFO.truth.ratio.toFixed(6)}), ` +
      `ion energy ${result.axialVoltage.value.toFixed(3)} ± ${result.axialVoltage.sigma.toFixed(3)} eV (made at ${DEMO_SCAN_INFO.truth.axialVoltage}); ` +
      `${result.verdict.explained ? 'explained' : `not explained: ${result.verdict.findings.join(', ')}`}`,
  );
}
