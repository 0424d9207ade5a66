// Isotope pattern per nominal mass: each element's distribution over n atoms by repeated squaring of its
// single-atom distribution (binary powers, convolution on the nominal-mass axis), then the elements convolved
// together. Each cluster carries its probability and its probability-weighted exact mass, so the cluster's m/z
// is the abundance-weighted mean of the fine structure it merges. Clusters below 1e-12 of the largest are
// pruned during the convolutions (far under any shown abundance).
import { ELEMENT_ISOTOPES } from './elementData';
import { checkCharge, massToMz, monoisotopicMass, parseFormula } from './formula';

export interface IsotopePeak {
  /** Abundance-weighted mean m/z of the cluster at one nominal mass. */
  mz: number;
  /** Relative to the most abundant cluster (= 1). */
  abundance: number;
}

/** A distribution over nominal masses start, start + 1, …: probability p and probability × mean mass w. */
interface Distribution {
  start: number;
  p: Float64Array;
  w: Float64Array;
}

const PRUNE = 1e-12;

function convolve(a: Distribution, b: Distribution): Distribution {
  const n = a.p.length + b.p.length - 1;
  const p = new Float64Array(n);
  const w = new Float64Array(n);
  for (let i = 0; i < a.p.length; i++) {
    const pa = a.p[i];
    if (pa === 0) continue;
    const wa = a.w[i];
    for (let j = 0; j < b.p.length; j++) {
      const pb = b.p[j];
      if (pb === 0) continue;
      p[i + j] += pa * pb;
      // weight of the joint cluster: pa·pb·(ma + mb) = pb·wa + pa·wb
      w[i + j] += pb * wa + pa * b.w[j];
    }
  }
  return prune({ start: a.start + b.start, p, w });
}

function prune(d: Distribution): Distribution {
  let max = 0;
  for (const v of d.p) if (v > max) max = v;
  const floor = max * PRUNE;
  let lo = 0;
  let hi = d.p.length - 1;
  while (lo < hi && d.p[lo] < floor) lo++;
  while (hi > lo && d.p[hi] < floor) hi--;
  const p = d.p.slice(lo, hi + 1);
  const w = d.w.slice(lo, hi + 1);
  for (let i = 0; i < p.length; i++) {
    if (p[i] < floor) {
      p[i] = 0;
      w[i] = 0;
    }
  }
  return { start: d.start + lo, p, w };
}

function single(symbol: string): Distribution {
  const rows = ELEMENT_ISOTOPES[symbol];
  const start = rows[0][0];
  const end = rows[rows.length - 1][0];
  const p = new Float64Array(end - start + 1);
  const w = new Float64Array(end - start + 1);
  let total = 0;
  for (const [, , abundance] of rows) total += abundance;
  for (const [a, mass, abundance] of rows) {
    // Normalise: tabulated fractions may not sum to exactly 1 after rounding.
    p[a - start] += abundance / total;
    w[a - start] += (abundance / total) * mass;
  }
  return { start, p, w };
}

function power(base: Distribution, n: number): Distribution {
  let result: Distribution | null = null;
  let square = base;
  let k = n;
  while (k > 0) {
    if (k & 1) result = result ? convolve(result, square) : square;
    k >>= 1;
    if (k > 0) square = convolve(square, square);
  }
  return result as Distribution;
}

/**
 * Isotope pattern of a formula as an ion: one entry per nominal mass, ascending in m/z; abundance relative to the
 * most abundant entry; entries below minAbundance (default 1e-4) dropped.
 */
export function isotopePattern(formula: string, options: { charge?: number; minAbundance?: number } = {}): IsotopePeak[] {
  const counts = parseFormula(formula);
  const charge = checkCharge(options.charge ?? 1);
  const minAbundance = options.minAbundance ?? 1e-4;
  if (typeof minAbundance !== 'number' || !Number.isFinite(minAbundance) || minAbundance < 0 || minAbundance > 1) {
    throw new Error(`minAbundance = ${String(minAbundance)} is out of range; accepted: a number from 0 to 1`);
  }
  let total: Distribution | null = null;
  for (const symbol of Object.keys(counts)) {
    const d = power(single(symbol), counts[symbol]);
    total = total ? convolve(total, d) : d;
  }
  const d = total as Distribution;
  let max = 0;
  for (const v of d.p) if (v > max) max = v;
  const peaks: IsotopePeak[] = [];
  for (let i = 0; i < d.p.length; i++) {
    const relative = d.p[i] / max;
    if (d.p[i] > 0 && relative >= minAbundance) {
      peaks.push({ mz: massToMz(d.w[i] / d.p[i], charge), abundance: relative });
    }
  }
  return peaks;
}

/**
 * Isotope ratio M+1/M of a formula as an ion, in per cent, with M's m/z (the monoisotopic m/z, most abundant
 * isotope of each element). M+1 is the cluster one unit (1/|z| in m/z) above M. Throws, naming the formula, when
 * the pattern has no M (an element whose most abundant isotope is not the lightest can make M a minor cluster, but
 * never absent) or the formula cannot be read.
 */
export function isotopeRatioM1(formula: string, charge = 1): { mz: number; percent: number } {
  const z = checkCharge(charge);
  const mono = massToMz(monoisotopicMass(formula), z);
  const peaks = isotopePattern(formula, { charge: z, minAbundance: 0 });
  const near = (target: number) => peaks.find((p) => Math.abs(p.mz - target) < 0.3 / Math.abs(z));
  const m = near(mono);
  if (!m) throw new Error(`Formula "${formula}": no isotope cluster at its monoisotopic m/z ${mono.toFixed(4)}`);
  const m1 = near(mono + 1 / Math.abs(z));
  return { mz: mono, percent: m1 ? (100 * m1.abundance) / m.abundance : 0 };
}
