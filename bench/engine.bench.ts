// Engine speed: characteristic values, β, the first-region boundary and a β grid. Figures only, no thresholds.
import {
  exponentGrid,
  firstRegionBoundary,
  massFilterGrid,
  mathieuA,
  mathieuB,
  operatingPoint,
  passBand,
  stabilityExponent,
} from '../src/engine/index';
import { medianMs, report } from './timing';

export function run(): void {
  const n = 2000;
  const perA = medianMs(() => {
    for (let i = 0; i < n; i++) mathieuA(i % 7, (i % 100) * 0.01 + 0.001);
  });
  report('characteristic value a_n(q), n ≤ 6, q < 1 (per value)', (perA * 1000) / n, 'µs');
  const perB = medianMs(() => {
    for (let i = 0; i < n; i++) mathieuB(1 + (i % 6), 10 + (i % 90));
  });
  report('characteristic value b_n(q), n ≤ 6, 10 ≤ q < 100 (per value)', (perB * 1000) / n, 'µs');
  const perBeta = medianMs(() => {
    for (let i = 0; i < n; i++) stabilityExponent(((i % 50) - 10) * 0.01, (i % 97) * 0.01);
  });
  report('β(a, q) in the first-region neighbourhood (per value)', (perBeta * 1000) / n, 'µs');
  const perBetaHigh = medianMs(() => {
    for (let i = 0; i < n; i++) stabilityExponent((i % 50) * 0.5, 5 + (i % 20));
  });
  report('β(a, q) at a ≤ 25, 5 ≤ q < 25 (per value)', (perBetaHigh * 1000) / n, 'µs');
  report('first-region boundary, 1000 points', medianMs(() => firstRegionBoundary(1000)), 'ms', '< 5 ms');
  report(
    'β grid 300 × 300, a ∈ [−0.1, 0.4], q ∈ [0, 1]',
    medianMs(() => exponentGrid({ aMin: -0.1, aMax: 0.4, aCount: 300, qMin: 0, qMax: 1, qCount: 300 }), 5, 1),
    'ms',
    '< 50 ms',
  );
  report(
    'mass-filter grid (β_x and β_y) 300 × 300',
    medianMs(() => massFilterGrid({ aMin: -0.3, aMax: 0.3, aCount: 300, qMin: 0, qMax: 1, qCount: 300 }), 5, 1),
    'ms',
  );
  report(
    'operating point (β_x, β_y, margins)',
    medianMs(() => {
      for (let i = 0; i < 200; i++) operatingPoint({ mz: 100 + i, r0: 4e-3, frequency: 1e6, dc: 19, rf: 115 });
    }) * 5,
    'µs',
  );
  report(
    'pass band (two edge roots)',
    medianMs(() => {
      for (let i = 0; i < 200; i++) passBand({ dc: 19 + i * 0.001, rf: 115, r0: 4e-3, frequency: 1e6 });
    }) * 5,
    'µs',
  );
}
