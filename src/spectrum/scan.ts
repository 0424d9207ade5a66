// A measured profile-mode scan: read two columns of text (m/z, intensity), and find its peaks.
import { checkNumber } from '../engine/index';

export interface Scan {
  mz: Float64Array;
  intensity: Float64Array;
  /** Present (true) when the lines were not in rising m/z and were sorted on reading. */
  sorted?: true;
}

const MAX_POINTS = 1_000_000;

type Separator = 'semicolon' | 'tab' | 'comma' | 'space';

function splitLine(line: string, separator: Separator): string[] {
  switch (separator) {
    case 'semicolon':
      return line.split(';').map((s) => s.trim().replace(',', '.'));
    case 'tab':
      return line.split('\t').map((s) => s.trim());
    case 'comma':
      return line.split(',').map((s) => s.trim());
    default:
      return line.trim().split(/\s+/);
  }
}

/** A plain decimal number (optional sign, digits, point, exponent); Number('') and '0x10' are not accepted. */
const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * Reads two columns (m/z, intensity) separated by comma, tab, semicolon or spaces; with semicolons a decimal
 * comma is read. Lines before the first pair of numbers are headers; empty lines and lines starting with '#'
 * are skipped anywhere. Lines out of m/z order are sorted (the result then carries `sorted: true`). Throws an
 * Error naming the line number for any other line that is not two numbers, for m/z ≤ 0 and for a repeated m/z.
 */
export function readScan(text: string): Scan {
  if (typeof text !== 'string') throw new Error(`Scan text: expected text, got ${text === null ? 'null' : typeof text}`);
  const lines = text.split(/\r\n|\r|\n/);
  const dataLines = lines.filter((l) => l.trim() !== '' && !l.trim().startsWith('#'));
  const separator: Separator = dataLines.some((l) => l.includes(';'))
    ? 'semicolon'
    : dataLines.some((l) => l.includes('\t'))
      ? 'tab'
      : dataLines.some((l) => /\d\s*,\s*[-+.\d]/.test(l))
        ? 'comma'
        : 'space';
  const mz: number[] = [];
  const intensity: number[] = [];
  const lineOf: number[] = [];
  let started = false;
  lines.forEach((raw, index) => {
    const line = raw.trim();
    const number = index + 1;
    if (line === '' || line.startsWith('#')) return;
    const cells = splitLine(line, separator).filter((c, i, all) => !(c === '' && i === all.length - 1));
    const numeric = cells.length === 2 && NUMBER.test(cells[0]) && NUMBER.test(cells[1]);
    if (!numeric) {
      if (!started) return; // header line
      const what = separator === 'semicolon' ? 'two numbers separated by ";" (decimal comma allowed)' : `two numbers separated by ${separator === 'space' ? 'spaces' : `a ${separator}`}`;
      throw new Error(`Scan line ${number}: "${line.length > 60 ? `${line.slice(0, 60)}…` : line}" is not ${what}`);
    }
    started = true;
    const m = Number(cells[0]);
    const y = Number(cells[1]);
    if (!Number.isFinite(m) || !(m > 0) || m > 1e7) throw new Error(`Scan line ${number}: m/z = ${cells[0]} is out of range; accepted: > 0 and ≤ 1e7`);
    if (!Number.isFinite(y)) throw new Error(`Scan line ${number}: intensity = ${cells[1]} is not a finite number`);
    mz.push(m);
    intensity.push(y);
    lineOf.push(number);
  });
  if (mz.length < 3) throw new Error(`Scan: ${mz.length} data line${mz.length === 1 ? '' : 's'} found; at least 3 lines of "m/z, intensity" are needed`);
  if (mz.length > MAX_POINTS) throw new Error(`Scan: ${mz.length} data lines; at most ${MAX_POINTS} are accepted`);
  let rising = true;
  for (let i = 1; i < mz.length && rising; i++) if (!(mz[i] > mz[i - 1])) rising = false;
  const order = mz.map((_, i) => i);
  if (!rising) order.sort((a, b) => mz[a] - mz[b] || a - b);
  for (let k = 1; k < order.length; k++) {
    if (mz[order[k]] === mz[order[k - 1]]) {
      throw new Error(`Scan line ${lineOf[order[k]]}: m/z ${mz[order[k]]} repeats line ${lineOf[order[k - 1]]}; each m/z may appear once`);
    }
  }
  const scan: Scan = { mz: Float64Array.from(order, (i) => mz[i]), intensity: Float64Array.from(order, (i) => intensity[i]) };
  if (!rising) scan.sorted = true;
  return scan;
}

export interface ScanPeak {
  /** m/z of the top (parabola through the three highest smoothed points). */
  apex: number;
  /** Intensity-weighted mean m/z of the points above half height (baseline removed). */
  centroid: number;
  /** Height above the baseline at the apex. */
  height: number;
  /** Full width at half height, u, interpolated between points; 0 when a neighbour keeps both sides above half height. */
  fwhm: number;
  /** centroid / fwhm; 0 when fwhm is 0. */
  resolution: number;
  /** ∫(intensity − baseline) d(m/z) over the peak (trapezoids), intensity × u. */
  area: number;
  /**
   * Trailing over leading half-width at 10 % of height: (right₁₀ − apex)/(apex − left₁₀). > 1: tailing to high m/z;
   * < 1: tailing to low m/z (fronting). 0 when a neighbour keeps a side above 10 %.
   */
  asymmetry: number;
}

export interface FindPeaksOptions {
  /** Baseline intensity; default: median of the points left after clipping everything above 3σ (iterated). */
  baseline?: number;
  /** Noise σ of the intensity; default: from the same clipped points (1.4826 × MAD). */
  noise?: number;
  /** Smallest height above baseline and smallest prominence, in noise σ (default 6). */
  minSnr?: number;
  /** Smallest height as a fraction of the tallest peak (default 0.001). */
  minFraction?: number;
  /** Savitzky–Golay quadratic smoothing window (odd, 0 or 1 = none; default 7). */
  smooth?: number;
}

function median(values: Float64Array | number[]): number {
  const s = Float64Array.from(values).sort();
  const n = s.length;
  return n % 2 ? s[(n - 1) >> 1] : 0.5 * (s[n / 2 - 1] + s[n / 2]);
}

/** Baseline and noise from the points that are not peaks: repeated clipping at median + 3σ (σ = 1.4826 × MAD). */
export function baselineAndNoise(intensity: Float64Array): { baseline: number; noise: number } {
  let kept = Array.from(intensity);
  let base = median(kept);
  let sigma = 0;
  for (let pass = 0; pass < 20; pass++) {
    base = median(kept);
    sigma = 1.4826 * median(kept.map((v) => Math.abs(v - base)));
    const next = kept.filter((v) => v <= base + 3 * sigma);
    if (next.length === kept.length || next.length < 5) break;
    kept = next;
  }
  if (!(sigma > 0)) {
    // Noise-free or quantised data: fall back to point-to-point differences.
    const d = new Float64Array(Math.max(intensity.length - 1, 1));
    for (let i = 1; i < intensity.length; i++) d[i - 1] = Math.abs(intensity[i] - intensity[i - 1]);
    sigma = (1.4826 * median(d)) / Math.SQRT2;
  }
  return { baseline: base, noise: sigma };
}

/** Savitzky–Golay quadratic smoothing (A. Savitzky, M. J. E. Golay, Anal. Chem. 36 (1964) 1627, quadratic/cubic table). */
export function smoothScan(y: Float64Array, window: number): Float64Array {
  if (window <= 1 || y.length < window) return Float64Array.from(y);
  const m = (window - 1) / 2;
  // Weights for a quadratic fit at the centre: 3(3m² + 3m − 1 − 5k²) / ((2m − 1)(2m + 1)(2m + 3)).
  const norm = (2 * m - 1) * (2 * m + 1) * (2 * m + 3);
  const weights = Array.from({ length: window }, (_, i) => {
    const k = i - m;
    return (3 * (3 * m * m + 3 * m - 1 - 5 * k * k)) / norm;
  });
  const out = Float64Array.from(y);
  for (let i = m; i < y.length - m; i++) {
    let s = 0;
    for (let j = -m; j <= m; j++) s += weights[j + m] * y[i + j];
    out[i] = s;
  }
  return out;
}

/** Finds the peaks of a scan: noise, a baseline offset and close doublets are handled (see FindPeaksOptions). */
export function findPeaks(scan: Scan, options: FindPeaksOptions = {}): ScanPeak[] {
  if (!scan || !(scan.mz instanceof Float64Array) || !(scan.intensity instanceof Float64Array) || scan.mz.length !== scan.intensity.length) {
    throw new Error('scan: expected { mz, intensity } as two Float64Arrays of the same length (use readScan)');
  }
  const n = scan.mz.length;
  if (n < 3) throw new Error(`scan: ${n} points; at least 3 are needed`);
  for (let i = 1; i < n; i++) {
    if (!(scan.mz[i] > scan.mz[i - 1])) throw new Error(`scan.mz[${i}] = ${scan.mz[i]} does not rise above scan.mz[${i - 1}]; m/z must rise`);
  }
  const smooth = options.smooth ?? 7;
  if (!(smooth === 0 || (Number.isInteger(smooth) && smooth % 2 === 1 && smooth >= 1 && smooth <= 101))) {
    throw new Error(`smooth = ${String(smooth)} is out of range; accepted: 0, or an odd whole number from 1 to 101`);
  }
  const minSnr = options.minSnr === undefined ? 6 : checkNumber('minSnr', options.minSnr, { min: 0, max: 1e6 });
  const minFraction = options.minFraction === undefined ? 0.001 : checkNumber('minFraction', options.minFraction, { min: 0, max: 1 });
  const estimate = baselineAndNoise(scan.intensity);
  const baseline = options.baseline === undefined ? estimate.baseline : checkNumber('baseline', options.baseline, {});
  const noise = options.noise === undefined ? estimate.noise : checkNumber('noise', options.noise, { min: 0 });
  const x = scan.mz;
  const raw = scan.intensity;
  const s = smoothScan(raw, smooth);
  const y = Float64Array.from(s, (v) => v - baseline);
  let tallest = 0;
  for (const v of y) tallest = Math.max(tallest, v);
  const floor = Math.max(minSnr * noise, minFraction * tallest, Number.MIN_VALUE);

  // Local maxima (plateaus count once, at their middle) with enough height and prominence.
  const candidates: number[] = [];
  for (let i = 1; i < n - 1; i++) {
    if (y[i] > y[i - 1] && y[i] >= y[i + 1]) {
      let j = i;
      while (j + 1 < n - 1 && y[j + 1] === y[i]) j++;
      if (y[j + 1] < y[i]) candidates.push((i + j) >> 1);
      i = j;
    }
  }
  const peaks: number[] = [];
  for (const i of candidates) {
    if (y[i] < floor) continue;
    let leftMin = y[i];
    let k = i - 1;
    for (; k >= 0 && y[k] <= y[i]; k--) leftMin = Math.min(leftMin, y[k]);
    if (k < 0) leftMin = Math.min(leftMin, 0);
    let rightMin = y[i];
    k = i + 1;
    for (; k < n && y[k] <= y[i]; k++) rightMin = Math.min(rightMin, y[k]);
    if (k >= n) rightMin = Math.min(rightMin, 0);
    const prominence = y[i] - Math.max(leftMin, rightMin);
    if (prominence >= Math.max(minSnr * noise, 0.02 * y[i])) peaks.push(i);
  }

  return peaks.map((top, index) => {
    // Limits: the lowest point towards each neighbouring peak (or the scan's end).
    const lowBetween = (from: number, to: number): number => {
      let best = from;
      for (let k = Math.min(from, to); k <= Math.max(from, to); k++) if (y[k] < y[best]) best = k;
      return best;
    };
    const leftLimit = index > 0 ? lowBetween(peaks[index - 1], top) : 0;
    const rightLimit = index < peaks.length - 1 ? lowBetween(top, peaks[index + 1]) : n - 1;
    // Apex: parabola through the top three smoothed points.
    let apex = x[top];
    let height = y[top];
    if (top > 0 && top < n - 1) {
      const y0 = y[top - 1], y1 = y[top], y2 = y[top + 1];
      const denom = y0 - 2 * y1 + y2;
      const h0 = x[top] - x[top - 1], h1 = x[top + 1] - x[top];
      if (denom < 0 && Math.abs(h0 - h1) < 1e-6 * (h0 + h1)) {
        const shift = (0.5 * (y0 - y2)) / denom;
        apex = x[top] + shift * h1;
        height = y1 - 0.25 * (y0 - y2) * shift;
      }
    }
    const crossing = (level: number, direction: -1 | 1): number | null => {
      const limit = direction < 0 ? leftLimit : rightLimit;
      for (let k = top; direction < 0 ? k > limit : k < limit; k += direction) {
        const next = k + direction;
        if (y[next] < level) return x[k] + ((level - y[k]) / (y[next] - y[k])) * (x[next] - x[k]);
      }
      return null;
    };
    const halfLeft = crossing(0.5 * height, -1);
    const halfRight = crossing(0.5 * height, 1);
    let fwhm = 0;
    if (halfLeft !== null && halfRight !== null) fwhm = halfRight - halfLeft;
    else if (halfLeft !== null) fwhm = 2 * (apex - halfLeft);
    else if (halfRight !== null) fwhm = 2 * (halfRight - apex);
    // Centroid over the points above half height (baseline removed, raw intensities).
    let sw = 0, swx = 0;
    for (let k = leftLimit; k <= rightLimit; k++) {
      const inside = (halfLeft === null || x[k] >= halfLeft) && (halfRight === null || x[k] <= halfRight);
      const v = raw[k] - baseline;
      if (inside && v > 0) {
        sw += v;
        swx += v * x[k];
      }
    }
    const centroid = sw > 0 ? swx / sw : apex;
    const tenthLeft = crossing(0.1 * height, -1);
    const tenthRight = crossing(0.1 * height, 1);
    const asymmetry = tenthLeft !== null && tenthRight !== null && apex > tenthLeft ? (tenthRight - apex) / (apex - tenthLeft) : 0;
    // Area between where the smoothed signal reaches 1 % of the height (or the limits).
    const edge = (direction: -1 | 1): number => {
      const limit = direction < 0 ? leftLimit : rightLimit;
      let k = top;
      while (k !== limit && y[k] > 0.01 * height) k += direction;
      return k;
    };
    const a = edge(-1);
    const b = edge(1);
    let area = 0;
    for (let k = a; k < b; k++) area += 0.5 * (raw[k] - baseline + raw[k + 1] - baseline) * (x[k + 1] - x[k]);
    return { apex, centroid, height, fwhm, resolution: fwhm > 0 ? centroid / fwhm : 0, area, asymmetry };
  });
}
