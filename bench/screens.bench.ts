// Bench and Stability screens: the engine work each screen does on the main thread per change of input.
// Targets (our own): each under 50 ms on a desktop core, so a phone (about 5× slower) stays under ~250 ms.
// Figures only, no asserts.
import {
  constantWidthScanLine, dcForMass, firstRegionBoundary, hazardousLive, operatingPoint, passBandDetail, rfForMass, scanPoint,
  constantResolutionScanLine, resolutionAtRatio, ratioForResolution, cycleLimitedResolution, massForScanRf, isoBetaCurve,
} from '../src/engine/index';
import { medianMs, report } from './timing';

const g = { r0: 4.5e-3, frequency: 1e6 };

export function run(): void {
  console.log('\nBench and Stability screens (main-thread work per input change)');
  report('Bench: apex U, V and hazard check for 6 m/z', medianMs(() => {
    for (const mz of [2, 18, 28, 32, 40, 44]) hazardousLive({ dc: dcForMass({ mz, ...g }), rf: rfForMass({ mz, ...g }) });
  }), 'ms', '< 50 ms');
  report('Bench: constant-width line + 3 scan points', medianMs(() => {
    const line = constantWidthScanLine({ width: 1, referenceMz: 219, ...g });
    for (const mz of [69, 219, 502]) scanPoint({ line, mz, ...g });
  }), 'ms', '< 50 ms');
  report('Stability: boundary (400 points, once per session)', medianMs(() => firstRegionBoundary(400)), 'ms', '< 50 ms');
  report('Stability: iso-β lines, 6 × 52 points (once, when shown)', medianMs(() => {
    const qs = Array.from(firstRegionBoundary(400).q).filter((_, i) => i % 8 === 0);
    for (const beta of [0.25, 0.5, 0.75]) for (const direction of ['x', 'y'] as const) isoBetaCurve({ beta, direction, q: qs });
  }, 3, 1), 'ms', '< 50 ms');
  report('Stability: 5 operating points + pass band', medianMs(() => {
    for (const mz of [68, 69, 70, 219, 502]) operatingPoint({ mz, ...g, dc: 16.67, rf: 100.42 });
    passBandDetail({ dc: 16.67, rf: 100.42, ...g });
  }), 'ms', '< 50 ms');
  report('Resolution: forward + reverse figures', medianMs(() => {
    resolutionAtRatio(0.1675);
    ratioForResolution(1000);
    cycleLimitedResolution({ mz: 219, rodLength: 0.15, frequency: 1e6, axialEnergy: 5 });
    scanPoint({ line: constantResolutionScanLine(1000), mz: 219, ...g });
  }), 'ms', '< 50 ms');
  report('Resolution: scan-law chart (64 inverse band solutions)', medianMs(() => {
    const w = constantWidthScanLine({ width: 1, referenceMz: 219, ...g });
    for (let i = 1; i <= 64; i++) massForScanRf({ line: w, rf: (1600 * i) / 64, ...g });
  }), 'ms', '< 50 ms');
}
