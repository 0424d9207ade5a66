// The verdict fit: is one measured peak the ideal peak of this instrument at some operating point?
//
// Model. The scan sets U and V for each m/z along a constant-ratio line U = λ·V, so an ion of m/z M is seen at
// set m/z m with a, q ∝ m/M. The engine's peakProfile gives transmission T(m′) for ions m′ at fixed U, V, where
// a, q ∝ 1/m′; the two agree for m′ = M²/m (the flight length differs by √(m′/M), ≈ 5e-4 across a peak of
// R = 1000, neglected). So the model is  y(m) = h·T(M²/(m − δ)) + b  with U, V centred on M by the engine's
// scanPoint. Free: δ (offset), h (height), b (baseline) — cheap, solved for every profile — and λ = U/V and the
// axial voltage V_z (ion energy per charge), which need new profiles. λ and V_z are searched in
// g = ln(λ_apex − λ) and e = ln V_z: a small grid, then Levenberg–Marquardt (K. Levenberg 1944; D. W. Marquardt,
// J. SIAM 11 (1963) 431) on the projected residual (variable projection: G. H. Golub, V. Pereyra, SIAM J. Numer.
// Anal. 10 (1973) 413), with profiles at a coarse point count and tolerance during the search (the engine's coarse-stage
// settings, COARSE_PROFILE_OPTIONS, whose bound is the same 1 % of the peak). Uncertainty: 1σ
// from s²(JᵀJ)⁻¹ over all five parameters, s² = SSR/(N − 5).
//
// Limits: the engine's model — ideal hyperbolic field, no fringe fields, no space charge, no collisions,
// a round uniformly filled entrance beam.
import {
  COARSE_PROFILE_OPTIONS,
  apexRatio,
  exactResolutionAtRatio,
  peakProfile,
  ratioForResolution,
  scanPoint,
  type RunControl,
} from '../engine/index';
import { baselineAndNoise, findPeaks, type ScanPeak } from './scan';

/** The diagnosis tree that deals with peak width and shape (its id in the diagnosis module). */
export const PEAK_SHAPE_TREE_ID = 'peak-shape';

export interface PeakFitInstrument {
  /** Field radius, m. */
  r0: number;
  /** RF frequency, Hz. */
  frequency: number;
  /** Rod length, m. */
  rodLength: number;
  /** Entrance beam radius, m. */
  beamRadius: number;
  /** Mean transverse energy, eV. */
  transverseEnergy: number;
  /** Charge number (default 1). */
  charge?: number;
}

export interface PeakFitRequest {
  scan: { mz: ArrayLike<number>; intensity: ArrayLike<number> };
  /** m/z near the peak to fit (the nearest found peak is taken). */
  peakMz: number;
  instrument: PeakFitInstrument;
  /** Starting axial voltage V_z (ion energy per charge, eV); default 5. */
  axialVoltage?: number;
  /** Resolution m/Δm wanted: the verdict says which U/V gives it. */
  wantedResolution?: number;
  /** Noise σ of the intensity when known; default: from the scan's baseline (clipped median/MAD). */
  noise?: number;
}

export interface FittedValue {
  value: number;
  /** 1σ from the Jacobian and the residual noise. */
  sigma: number;
}

export type Finding = 'tailing-high' | 'tailing-low' | 'shoulder-high' | 'shoulder-low' | 'split' | 'extra-width' | 'shape';

export interface PeakVerdict {
  explained: boolean;
  /** One-paragraph statement for the screen. */
  summary: string;
  findings: Finding[];
  /** Plain sentences, one per finding or check. */
  details: string[];
  /** Diagnosis tree to open when not explained (null when explained). */
  treeId: string | null;
  /** Usual hardware causes (common practice), when not explained. */
  usualCauses: string[];
  /** What the model leaves out. */
  limits: string;
  /** U/V for the wanted resolution, when one was asked for. */
  forWantedResolution?: { resolution: number; ratio: number; ratioRule: number; note: string };
}

export interface PeakFitResult {
  /** The measured peak the fit used (findPeaks on the whole scan). */
  peak: ScanPeak;
  ratio: FittedValue;
  axialVoltage: FittedValue;
  offset: FittedValue;
  height: FittedValue;
  baseline: FittedValue;
  /** Ideal-field band resolution (centre/width) at the fitted U/V. */
  bandResolution: number;
  /** U and V (per rod, V zero-to-peak) that centre the fitted band on the peak. */
  dc: number;
  rf: number;
  /** Columnar curves over the fitted window: measured, fitted, residual. */
  mz: Float64Array;
  measured: Float64Array;
  fitted: Float64Array;
  residual: Float64Array;
  /** √(SSR/(N − 5)): the residual noise of the fit. */
  residualNoise: number;
  /** Baseline noise σ₀ (from the scan, or as given). */
  noise: number;
  /** Noise σ per point of the window: σ₀, counting noise growing with the signal, and the model's own allowance. */
  pointNoise: Float64Array;
  /** Σ(rᵢ/σᵢ)²/(N − 5): about 1 when the ideal peak explains the data. */
  reducedChiSquare: number;
  /** Lag-1 autocorrelation of rᵢ/σᵢ: about 0 (± 1/√N) for noise, large for a shape the model misses. */
  autocorrelation: number;
  /** FWHM of the measured peak and of the fitted ideal peak, u, and the noise-driven 1σ of the measured one. */
  fwhmMeasured: number;
  fwhmModel: number;
  fwhmSigma: number;
  asymmetryMeasured: number;
  asymmetryModel: number;
  /** Profile evaluations spent. */
  profiles: number;
  verdict: PeakVerdict;
}

const SEARCH_POINTS = 33;
const SEARCH_TOLERANCE = 1e-2;
const FINAL_POINTS = 101;
const FINAL_TOLERANCE = 3e-3;
const MODEL_LIMITS =
  'Ideal hyperbolic field along the whole rod (no fringe fields), no space charge or collisions, a round uniformly filled entrance beam, one ion species; the scan is taken as a constant U/V line.';
const USUAL_CAUSES = [
  'contaminated rods or pre-filter (charging films distort the field)',
  'a damaged or misaligned rod',
  'an ion source or lens fault (wrong focus, energy spread or a charging lens)',
  'space charge at high ion current',
];

function fail(message: string): never {
  throw new Error(message);
}

function checkPositive(field: string, value: unknown, max: number, unit: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || !(value > 0) || value > max) {
    fail(`${field} = ${String(value)} is out of range; accepted: a number > 0 and ≤ ${max} ${unit}`.trim());
  }
  return value;
}

/** Cubic Hermite (Catmull–Rom) interpolation on a uniform grid; 0 outside it. */
function interpolator(x0: number, dx: number, t: Float64Array): (x: number) => number {
  const n = t.length;
  const at = (i: number): number => t[Math.min(n - 1, Math.max(0, i))];
  return (x: number) => {
    const u = (x - x0) / dx;
    if (u < 0 || u > n - 1) return 0;
    const i = Math.min(n - 2, Math.floor(u));
    const f = u - i;
    const p0 = at(i - 1), p1 = at(i), p2 = at(i + 1), p3 = at(i + 2);
    const m1 = 0.5 * (p2 - p0), m2 = 0.5 * (p3 - p1);
    const f2 = f * f, f3 = f2 * f;
    const v = (2 * f3 - 3 * f2 + 1) * p1 + (f3 - 2 * f2 + f) * m1 + (-2 * f3 + 3 * f2) * p2 + (f3 - f2) * m2;
    return v > 0 ? v : 0;
  };
}

interface Linear {
  h: number;
  b: number;
  ssr: number;
}

/** Least squares y ≈ h·t + b. */
function solveLinear(y: Float64Array, t: Float64Array): Linear {
  const n = y.length;
  let st = 0, sy = 0, stt = 0, sty = 0;
  for (let i = 0; i < n; i++) {
    st += t[i]; sy += y[i]; stt += t[i] * t[i]; sty += t[i] * y[i];
  }
  const det = n * stt - st * st;
  const h = det > 0 ? (n * sty - st * sy) / det : 0;
  const b = (sy - h * st) / n;
  let ssr = 0;
  for (let i = 0; i < n; i++) {
    const r = y[i] - h * t[i] - b;
    ssr += r * r;
  }
  return { h, b, ssr };
}

/** 5 × 5 (or smaller) symmetric positive matrix inverse by Gauss–Jordan; null when singular. */
function invert(a: number[][]): number[][] | null {
  const n = a.length;
  const m = a.map((row, i) => [...row, ...Array.from({ length: n }, (_, j) => (i === j ? 1 : 0))]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(m[r][c]) > Math.abs(m[p][c])) p = r;
    if (!(Math.abs(m[p][c]) > 1e-300)) return null;
    [m[c], m[p]] = [m[p], m[c]];
    const d = m[c][c];
    for (let j = 0; j < 2 * n; j++) m[c][j] /= d;
    for (let r = 0; r < n; r++) {
      if (r === c) continue;
      const f = m[r][c];
      if (f !== 0) for (let j = 0; j < 2 * n; j++) m[r][j] -= f * m[c][j];
    }
  }
  return m.map((row) => row.slice(n));
}

/** Fits the engine's ideal peak to one measured peak and judges whether the operating point explains it. */
export function fitPeak(request: PeakFitRequest, control: RunControl = {}): PeakFitResult {
  if (!request || typeof request !== 'object') fail('request: expected { scan, peakMz, instrument }');
  const { scan, instrument } = request;
  if (!scan || !scan.mz || !scan.intensity || scan.mz.length !== scan.intensity.length) {
    fail('scan: expected { mz, intensity } of the same length (use readScan)');
  }
  const peakMz = checkPositive('peakMz', request.peakMz, 1e7, 'u');
  const startVoltage = checkPositive('axialVoltage', request.axialVoltage ?? 5, 1000, 'V');
  if (!instrument || typeof instrument !== 'object') fail('instrument: expected { r0, frequency, rodLength, beamRadius, transverseEnergy }');
  checkPositive('r0', instrument.r0, 0.1, 'm');
  checkPositive('frequency', instrument.frequency, 1e9, 'Hz');
  checkPositive('rodLength', instrument.rodLength, 10, 'm');
  checkPositive('beamRadius', instrument.beamRadius, 0.1, 'm');
  if (instrument.beamRadius >= instrument.r0) fail(`beamRadius = ${instrument.beamRadius} is out of range; accepted: less than r0 (${instrument.r0} m)`);
  if (typeof instrument.transverseEnergy !== 'number' || !(instrument.transverseEnergy >= 0) || instrument.transverseEnergy > 1e4) {
    fail(`transverseEnergy = ${String(instrument.transverseEnergy)} is out of range; accepted: a number ≥ 0 and ≤ 10000 eV`);
  }
  const report = (f: number): void => control.onProgress?.(Math.min(1, Math.max(0, f)));
  const x = Float64Array.from(scan.mz);
  const yAll = Float64Array.from(scan.intensity);
  const peaks = findPeaks({ mz: x, intensity: yAll });
  if (peaks.length === 0) fail('scan: no peak stands above the noise (6σ); nothing to fit');
  let peak = peaks[0];
  for (const p of peaks) if (Math.abs(p.apex - peakMz) < Math.abs(peak.apex - peakMz)) peak = p;
  if (!(peak.fwhm > 0)) fail(`peak at m/z ${peak.apex.toFixed(3)}: its half height is not reached on either side; no width to fit`);
  if (Math.abs(peak.apex - peakMz) > 3 * peak.fwhm) {
    fail(`peakMz = ${peakMz}: no peak within 3 FWHM of it (nearest apex at m/z ${peak.apex.toFixed(3)})`);
  }
  // Window: ±2.5 FWHM around the centroid, cut halfway to any neighbouring peak.
  const centre = peak.centroid;
  let lo = centre - 2.5 * peak.fwhm;
  let hi = centre + 2.5 * peak.fwhm;
  for (const p of peaks) {
    if (p === peak) continue;
    if (p.apex < centre && p.apex > lo - peak.fwhm) lo = Math.max(lo, 0.5 * (p.apex + centre));
    if (p.apex > centre && p.apex < hi + peak.fwhm) hi = Math.min(hi, 0.5 * (p.apex + centre));
  }
  const inside: number[] = [];
  for (let i = 0; i < x.length; i++) if (x[i] >= lo && x[i] <= hi) inside.push(i);
  if (inside.length < 15) fail(`peak at m/z ${peak.apex.toFixed(3)}: ${inside.length} scan points across it; at least 15 are needed (scan with a finer step)`);
  const mz = Float64Array.from(inside, (i) => x[i]);
  const y = Float64Array.from(inside, (i) => yAll[i]);
  const n = mz.length;
  const noise = request.noise === undefined ? baselineAndNoise(yAll).noise : checkPositive('noise', request.noise, Infinity, '');

  const M = centre;
  // Offsets searched: centre ± half; wide during the search, narrow (and the profile window with it) at the end.
  let shiftCentre = 0;
  let shiftHalf = 0.75 * peak.fwhm;
  const apex = apexRatio();
  const gMax = Math.log(apex - 0.1);
  const gMin = Math.log(1e-7);
  const eMin = Math.log(0.05);
  const eMax = Math.log(500);
  const charge = instrument.charge ?? 1;
  const clampG = (g: number): number => Math.min(gMax, Math.max(gMin, g));
  const clampE = (e: number): number => Math.min(eMax, Math.max(eMin, e));

  let profiles = 0;
  const cache = new Map<string, { curve: (m: number) => number; dc: number; rf: number }>();
  const profile = (g: number, e: number, points: number, tolerance: number) => {
    const key = `${g}|${e}|${points}|${tolerance}|${shiftCentre}|${shiftHalf}`;
    const mirrorLo = (M * M) / (mz[n - 1] - shiftCentre + shiftHalf);
    const mirrorHi = (M * M) / (mz[0] - shiftCentre - shiftHalf);
    const hit = cache.get(key);
    if (hit) return hit;
    const ratio = apex - Math.exp(g);
    const point = scanPoint({ line: { slope: ratio, offset: 0 }, mz: M, r0: instrument.r0, frequency: instrument.frequency });
    if (!point) fail(`U/V = ${ratio} passes nothing at m/z ${M.toFixed(3)}`);
    const p = peakProfile(
      {
        r0: instrument.r0,
        frequency: instrument.frequency,
        rodLength: instrument.rodLength,
        beamRadius: instrument.beamRadius,
        transverseEnergy: instrument.transverseEnergy,
        charge,
        dc: point.dc,
        rf: point.rf,
        axialVoltage: Math.exp(e),
        mzFrom: mirrorLo,
        mzTo: mirrorHi,
        points,
      },
      // The search runs on the engine's coarse stage settings (its bound ≤ 1 % of the peak, as SEARCH_TOLERANCE
      // asks); the final stage on the full settings.
      points === SEARCH_POINTS
        ? { ...COARSE_PROFILE_OPTIONS, relativeTolerance: tolerance, signal: control.signal, shouldStop: control.shouldStop }
        : { relativeTolerance: tolerance, signal: control.signal, shouldStop: control.shouldStop },
    );
    profiles++;
    const t = interpolator(mirrorLo, (mirrorHi - mirrorLo) / (points - 1), p.transmission);
    const entry = { curve: (m: number) => t((M * M) / m), dc: point.dc, rf: point.rf };
    cache.set(key, entry);
    return entry;
  };

  const sampled = (curve: (m: number) => number, delta: number): Float64Array => Float64Array.from(mz, (m) => curve(m - delta));
  /** Best δ, h, b for one profile: a grid over the offsets searched, then golden-section refinement. */
  const project = (curve: (m: number) => number) => {
    const low = shiftCentre - shiftHalf;
    const high = shiftCentre + shiftHalf;
    const span = high - low;
    const cost = (delta: number) => solveLinear(y, sampled(curve, delta)).ssr;
    let best = 0;
    let bestCost = Infinity;
    const steps = 30;
    for (let k = 0; k <= steps; k++) {
      const d = low + (span * k) / steps;
      const c = cost(d);
      if (c < bestCost) { bestCost = c; best = d; }
    }
    let a = Math.max(low, best - span / steps);
    let b = Math.min(high, best + span / steps);
    const phi = (Math.sqrt(5) - 1) / 2;
    let c1 = b - phi * (b - a), c2 = a + phi * (b - a);
    let f1 = cost(c1), f2 = cost(c2);
    for (let it = 0; it < 40 && b - a > 1e-7 * peak.fwhm; it++) {
      if (f1 < f2) { b = c2; c2 = c1; f2 = f1; c1 = b - phi * (b - a); f1 = cost(c1); }
      else { a = c1; c1 = c2; f1 = f2; c2 = a + phi * (b - a); f2 = cost(c2); }
    }
    const delta = f1 < f2 ? c1 : c2;
    const t = sampled(curve, delta);
    const lin = solveLinear(y, t);
    return { delta, ...lin, t };
  };
  const residualOf = (g: number, e: number, points: number, tolerance: number) => {
    const pr = profile(g, e, points, tolerance);
    const fit = project(pr.curve);
    const r = new Float64Array(n);
    for (let i = 0; i < n; i++) r[i] = y[i] - fit.h * fit.t[i] - fit.b;
    return { r, fit, pr };
  };

  // Start: U/V for the measured FWHM resolution; three ion energies (÷3, ×1, ×3 the given one).
  const measuredR = Math.max(peak.resolution, 1);
  const g0 = clampG(Math.log(apex - ratioForResolution(Math.min(Math.max(measuredR, 1), 1e6)).exact));
  const e0 = clampE(Math.log(startVoltage));
  const grid: [number, number][] = [];
  for (const [dg, de] of [[0, 0], [0, -1.1], [0, 1.1]]) grid.push([clampG(g0 + dg), clampE(e0 + de)]);
  let g = g0, e = e0, best = Infinity;
  const totalSteps = grid.length + 3 * 6 + 3;
  let step = 0;
  for (const [gg, ee] of grid) {
    let ssr = Infinity;
    try {
      ssr = residualOf(gg, ee, SEARCH_POINTS, SEARCH_TOLERANCE).fit.ssr;
    } catch (error) {
      if (error instanceof Error && error.name === 'PeakCancelledError') throw error;
      // cycles out of the engine's range at this energy: skip the grid point
    }
    if (ssr < best) { best = ssr; g = gg; e = ee; }
    report(++step / totalSteps);
  }
  if (!Number.isFinite(best)) fail('No ideal peak could be computed near this width; check the instrument settings (r0, frequency, rod length).');

  // Levenberg–Marquardt on (g, e), forward differences.
  const levenberg = (points: number, tolerance: number, iterations: number) => {
    let lambda = 1e-2;
    let current = residualOf(g, e, points, tolerance);
    let ssr = current.fit.ssr;
    for (let it = 0; it < iterations; it++) {
      const hG = 0.04, hE = 0.08;
      const safe = (gg: number, ee: number) => {
        try {
          return residualOf(gg, ee, points, tolerance).r;
        } catch (error) {
          if (error instanceof Error && error.name === 'PeakCancelledError') throw error;
          return null;
        }
      };
      const gStep = g + hG <= gMax ? hG : -hG;
      const eStep = e + hE <= eMax ? hE : -hE;
      const rg = safe(g + gStep, e);
      const re = safe(g, e + eStep);
      report(++step / totalSteps);
      report(++step / totalSteps);
      if (!rg || !re) break;
      const jg = Float64Array.from(rg, (v, i) => (v - current.r[i]) / gStep);
      const je = Float64Array.from(re, (v, i) => (v - current.r[i]) / eStep);
      let a11 = 0, a12 = 0, a22 = 0, b1 = 0, b2 = 0;
      for (let i = 0; i < n; i++) {
        a11 += jg[i] * jg[i]; a12 += jg[i] * je[i]; a22 += je[i] * je[i];
        b1 -= jg[i] * current.r[i]; b2 -= je[i] * current.r[i];
      }
      let improved = false;
      for (let tries = 0; tries < 4 && !improved; tries++) {
        const d11 = a11 * (1 + lambda), d22 = a22 * (1 + lambda);
        const det = d11 * d22 - a12 * a12;
        if (!(det > 0)) { lambda *= 10; continue; }
        const dg = Math.max(-1, Math.min(1, (b1 * d22 - b2 * a12) / det));
        const de = Math.max(-1.5, Math.min(1.5, (d11 * b2 - a12 * b1) / det));
        const ng = clampG(g + dg), ne = clampE(e + de);
        let trial: ReturnType<typeof residualOf> | null = null;
        try {
          trial = residualOf(ng, ne, points, tolerance);
        } catch (error) {
          if (error instanceof Error && error.name === 'PeakCancelledError') throw error;
        }
        if (trial && trial.fit.ssr < ssr) {
          const gain = (ssr - trial.fit.ssr) / ssr;
          g = ng; e = ne; current = trial; ssr = trial.fit.ssr; improved = true;
          lambda = Math.max(lambda / 10, 1e-6);
          if (gain < 1e-4 || (Math.abs(dg) < 2e-3 && Math.abs(de) < 4e-3)) return current;
        } else lambda *= 10;
      }
      report(++step / totalSteps);
      if (!improved) break;
    }
    return current;
  };
  const searched = levenberg(SEARCH_POINTS, SEARCH_TOLERANCE, 6);
  shiftCentre = searched.fit.delta;
  shiftHalf = 0.1 * peak.fwhm;

  // Final stage at the finer profile: Jacobian over (δ, h, b, g, e) with δ/h/b held for the g/e columns, one
  // Gauss–Newton step on (g, e) from it (kept when it lowers the residual), the same Jacobian for the uncertainty.
  const jacobianAt = (gg: number, ee: number) => {
    const centre = residualOf(gg, ee, FINAL_POINTS, FINAL_TOLERANCE);
    const { fit: f, pr: p } = centre;
    const dd = 1e-3 * peak.fwhm;
    const tPlus = sampled(p.curve, f.delta + dd), tMinus = sampled(p.curve, f.delta - dd);
    const columns: Float64Array[] = [
      Float64Array.from(tPlus, (v, i) => (f.h * (v - tMinus[i])) / (2 * dd)),
      Float64Array.from(f.t),
      new Float64Array(n).fill(1),
    ];
    const column = (g2: number, e2: number, h: number) => {
      const t = sampled(profile(g2, e2, FINAL_POINTS, FINAL_TOLERANCE).curve, f.delta);
      return Float64Array.from(t, (v, i) => (f.h * (v - f.t[i])) / h);
    };
    const hG = gg + 0.04 <= gMax ? 0.04 : -0.04;
    const hE = ee + 0.08 <= eMax ? 0.08 : -0.08;
    try {
      columns.push(column(gg + hG, ee, hG), column(gg, ee + hE, hE));
    } catch (error) {
      if (error instanceof Error && error.name === 'PeakCancelledError') throw error;
    }
    return { centre, columns };
  };
  let final = jacobianAt(g, e);
  report((totalSteps - 2) / totalSteps);
  if (final.columns.length === 5) {
    const normalMatrix = (cols: Float64Array[]) =>
      cols.map((a) => cols.map((b) => { let s = 0; for (let i = 0; i < n; i++) s += a[i] * b[i]; return s; }));
    const inv = invert(normalMatrix(final.columns));
    if (inv) {
      const grad = final.columns.map((c) => { let s = 0; for (let i = 0; i < n; i++) s += c[i] * final.centre.r[i]; return s; });
      const dg = inv[3].reduce((s, v, j) => s + v * grad[j], 0);
      const de = inv[4].reduce((s, v, j) => s + v * grad[j], 0);
      if (Math.abs(dg) > 1e-4 || Math.abs(de) > 1e-4) {
        const ng = clampG(g + Math.max(-0.5, Math.min(0.5, dg)));
        const ne = clampE(e + Math.max(-0.5, Math.min(0.5, de)));
        try {
          const trial = residualOf(ng, ne, FINAL_POINTS, FINAL_TOLERANCE);
          if (trial.fit.ssr < final.centre.fit.ssr) {
            g = ng;
            e = ne;
            final = { centre: trial, columns: final.columns };
            // Jacobian of the step's start: the step is small, so it stands for the end point too (no more profiles).
            final.columns[0] = (() => {
              const dd = 1e-3 * peak.fwhm;
              const a = sampled(trial.pr.curve, trial.fit.delta + dd), b = sampled(trial.pr.curve, trial.fit.delta - dd);
              return Float64Array.from(a, (v, i) => (trial.fit.h * (v - b[i])) / (2 * dd));
            })();
            final.columns[1] = Float64Array.from(trial.fit.t);
          }
        } catch (error) {
          if (error instanceof Error && error.name === 'PeakCancelledError') throw error;
        }
      }
    }
  }
  report((totalSteps - 1) / totalSteps);
  const { fit, pr } = final.centre;
  const jac = final.columns;
  const k = jac.length;
  const dof = Math.max(1, n - 5);
  const s2 = fit.ssr / dof;
  const normal = Array.from({ length: k }, (_, a) => Array.from({ length: k }, (_, b) => {
    let s = 0;
    for (let i = 0; i < n; i++) s += jac[a][i] * jac[b][i];
    return s;
  }));
  const cov = invert(normal);
  const sd = (i: number): number => (cov && i < k && cov[i][i] > 0 ? Math.sqrt(s2 * cov[i][i]) : Infinity);
  const ratio = apex - Math.exp(g);
  const axialVoltage = Math.exp(e);

  const fitted = Float64Array.from(fit.t, (v) => fit.h * v + fit.b);
  const residual = Float64Array.from(y, (v, i) => v - fitted[i]);
  const residualNoise = Math.sqrt(s2);
  // Noise per point: σᵢ² = σ₀² + k·(signal above baseline) + (model allowance)². σ₀ from the baseline; counting
  // noise grows with the signal (k below); the model allowance is half the profile tolerance times the height.
  let top = 0;
  for (const v of fitted) top = Math.max(top, v - fit.b);
  const allowance = 0.5 * FINAL_TOLERANCE * top;
  // k: the value at which the median of rᵢ²/σᵢ² over the upper half of the peak is 0.455 (bisection; the median
  // of χ² with one degree of freedom), so a local misfit barely moves it.
  const upperIdx: number[] = [];
  for (let i = 0; i < n; i++) if (fitted[i] - fit.b > 0.5 * top) upperIdx.push(i);
  const medianRatio = (k: number): number => {
    const v = upperIdx.map((i) => (residual[i] * residual[i]) / (noise * noise + allowance * allowance + k * (fitted[i] - fit.b))).sort((a, b) => a - b);
    return v[v.length >> 1];
  };
  let gain = 0;
  if (upperIdx.length >= 5 && request.noise === undefined && medianRatio(0) > 0.455) {
    let kLo = 0;
    let kHi = 1;
    while (medianRatio(kHi) > 0.455 && kHi < 1e12) kHi *= 4;
    for (let it = 0; it < 60; it++) {
      const mid = 0.5 * (kLo + kHi);
      if (medianRatio(mid) > 0.455) kLo = mid;
      else kHi = mid;
    }
    gain = 0.5 * (kLo + kHi);
  }
  const pointNoise = Float64Array.from(fitted, (v) => Math.sqrt(noise * noise + gain * Math.max(0, v - fit.b) + allowance * allowance));
  let chi = 0, lag = 0;
  for (let i = 0; i < n; i++) {
    const z = residual[i] / pointNoise[i];
    chi += z * z;
    if (i + 1 < n) lag += z * (residual[i + 1] / pointNoise[i + 1]);
  }
  const reducedChiSquare = chi / dof;
  const autocorrelation = chi > 0 ? lag / chi : 0;

  // Model peak measured the same way as the scan.
  const modelPeaks = findPeaks({ mz, intensity: fitted }, { baseline: fit.b, noise: Math.max(noise, 1e-12 * Math.abs(fit.h)), smooth: 0 });
  const modelPeak = modelPeaks.reduce<ScanPeak | null>((a, p) => (!a || p.height > a.height ? p : a), null);
  const fwhmModel = modelPeak?.fwhm ?? 0;
  const asymmetryModel = modelPeak?.asymmetry ?? 0;
  const windowPeaks = findPeaks({ mz, intensity: y }, { baseline: fit.b, noise });
  const measuredInWindow = windowPeaks.reduce<ScanPeak | null>((a, p) => (!a || p.height > a.height ? p : a), null) ?? peak;
  // 1σ of a FWHM from noise at the two half-height crossings: √2·σ/|slope| (slope of the model there).
  let slope = 0;
  {
    const half = fit.b + 0.5 * fit.h * (modelPeak ? modelPeak.height / fit.h : 1);
    for (let i = 1; i < n; i++) {
      if ((fitted[i - 1] - half) * (fitted[i] - half) <= 0 && mz[i] > mz[i - 1]) {
        slope = Math.max(slope, Math.abs((fitted[i] - fitted[i - 1]) / (mz[i] - mz[i - 1])));
      }
    }
  }
  const halfNoise = Math.sqrt(noise * noise + gain * 0.5 * top + allowance * allowance);
  const fwhmSigma = slope > 0 ? (Math.SQRT2 * halfNoise) / slope : Infinity;

  const result: Omit<PeakFitResult, 'verdict'> = {
    peak,
    ratio: { value: ratio, sigma: sd(3) * Math.exp(g) },
    axialVoltage: { value: axialVoltage, sigma: sd(4) * axialVoltage },
    offset: { value: fit.delta, sigma: sd(0) },
    height: { value: fit.h, sigma: sd(1) },
    baseline: { value: fit.b, sigma: sd(2) },
    bandResolution: exactResolutionAtRatio(ratio) ?? 0,
    dc: pr.dc,
    rf: pr.rf,
    mz,
    measured: y,
    fitted,
    residual,
    residualNoise,
    noise,
    pointNoise,
    reducedChiSquare,
    autocorrelation,
    fwhmMeasured: measuredInWindow.fwhm,
    fwhmModel,
    fwhmSigma,
    asymmetryMeasured: measuredInWindow.asymmetry,
    asymmetryModel,
    profiles,
  };
  const verdict = judge(result, windowPeaks, request.wantedResolution, { g, gMin, gMax, e, eMin, eMax });
  report(1);
  return { ...result, verdict };
}

function judge(
  r: Omit<PeakFitResult, 'verdict'>,
  windowPeaks: ScanPeak[],
  wanted: number | undefined,
  bounds: { g: number; gMin: number; gMax: number; e: number; eMin: number; eMax: number },
): PeakVerdict {
  const findings: Finding[] = [];
  const details: string[] = [];
  const h = r.height.value;
  const main = r.fwhmMeasured;
  // Split: a second maximum of at least 10 % of the height inside the window.
  const big = windowPeaks.filter((p) => p.height >= 0.1 * h);
  if (big.length >= 2) {
    findings.push('split');
    details.push(`The peak is split: ${big.length} maxima within ±2.5 FWHM (at m/z ${big.map((p) => p.apex.toFixed(3)).join(', ')}).`);
  }
  // Shoulder: a run of same-sign residuals over ≥ ¼ FWHM whose mean is ≥ 4σ/√k and ≥ 3 % of the height.
  const res = r.residual;
  const sigmaOf = r.pointNoise;
  let runStart = 0;
  let strongest: { sum: number; from: number; to: number } | null = null;
  for (let i = 1; i <= res.length; i++) {
    if (i === res.length || Math.sign(res[i]) !== Math.sign(res[runStart])) {
      let sum = 0;
      let variance = 0;
      for (let k = runStart; k < i; k++) {
        sum += res[k];
        variance += sigmaOf[k] * sigmaOf[k];
      }
      const width = r.mz[i - 1] - r.mz[runStart];
      const count = i - runStart;
      const significant = sum > 0 && sum > 5 * Math.sqrt(variance) && sum / count > 0.02 * h && width >= 0.15 * main;
      if (significant && (!strongest || sum > strongest.sum)) strongest = { sum, from: runStart, to: i - 1 };
      runStart = i;
    }
  }
  const apex = r.peak.apex;
  const tailRatio = r.asymmetryModel > 0 && r.asymmetryMeasured > 0 ? r.asymmetryMeasured / r.asymmetryModel : 1;
  if (!findings.includes('split') && strongest) {
    const at = 0.5 * (r.mz[strongest.from] + r.mz[strongest.to]);
    const distance = Math.abs(at - apex) / Math.max(main, 1e-12);
    const side = at > apex ? 'high' : 'low';
    if (distance > 1.2 || (side === 'high' ? tailRatio > 1.25 : tailRatio < 0.8)) {
      findings.push(side === 'high' ? 'tailing-high' : 'tailing-low');
      details.push(
        `The peak tails to ${side} m/z: 10 % asymmetry ${r.asymmetryMeasured.toFixed(2)} measured against ${r.asymmetryModel.toFixed(2)} for the ideal peak; extra signal from m/z ${r.mz[strongest.from].toFixed(3)} to ${r.mz[strongest.to].toFixed(3)}.`,
      );
    } else {
      findings.push(side === 'high' ? 'shoulder-high' : 'shoulder-low');
      details.push(`A shoulder on the ${side} m/z side near m/z ${at.toFixed(3)} that no ideal operating point gives.`);
    }
  } else if (!findings.includes('split') && (tailRatio > 1.5 || tailRatio < 1 / 1.5)) {
    const side = tailRatio > 1 ? 'high' : 'low';
    findings.push(side === 'high' ? 'tailing-high' : 'tailing-low');
    details.push(`The peak tails to ${side} m/z: 10 % asymmetry ${r.asymmetryMeasured.toFixed(2)} against ${r.asymmetryModel.toFixed(2)} for the ideal peak.`);
  }
  const widthGap = Math.abs(r.fwhmMeasured - r.fwhmModel);
  const widthOk = widthGap <= 3 * r.fwhmSigma + 0.01 * r.fwhmModel;
  const pinned = bounds.g <= bounds.gMin + 1e-9 || bounds.g >= bounds.gMax - 1e-9 || bounds.e <= bounds.eMin + 1e-9 || bounds.e >= bounds.eMax - 1e-9;
  if (findings.length === 0 && (!widthOk || pinned)) {
    findings.push('extra-width');
    details.push(
      `Width not matched: FWHM ${r.fwhmMeasured.toPrecision(4)} u measured, ${r.fwhmModel.toPrecision(4)} u for the best ideal peak (noise allows ±${(3 * r.fwhmSigma).toPrecision(2)} u)${pinned ? '; the fit ran to the edge of the allowed U/V or ion energy' : ''}.`,
    );
  }
  const lagLimit = Math.max(0.35, 4 / Math.sqrt(r.mz.length));
  const structured = r.reducedChiSquare > 2 || r.autocorrelation > lagLimit;
  if (findings.length === 0 && structured) {
    const why = `the residuals are ${Math.sqrt(r.reducedChiSquare).toFixed(1)} times the noise and run together (lag-1 correlation ${r.autocorrelation.toFixed(2)}, limit ${lagLimit.toFixed(2)})`;
    // Name the misfit: the asymmetry against the ideal peak's, else where the largest excess lies.
    let excess: { sum: number; at: number } | null = null;
    let start = 0;
    for (let i = 1; i <= res.length; i++) {
      if (i === res.length || Math.sign(res[i]) !== Math.sign(res[start])) {
        let sum = 0;
        let weighted = 0;
        for (let k = start; k < i; k++) {
          sum += res[k];
          weighted += res[k] * r.mz[k];
        }
        if (sum > 0 && (!excess || sum > excess.sum)) excess = { sum, at: weighted / sum };
        start = i;
      }
    }
    if (tailRatio > 1.2 || tailRatio < 1 / 1.2) {
      const side = tailRatio > 1 ? 'high' : 'low';
      findings.push(side === 'high' ? 'tailing-high' : 'tailing-low');
      details.push(
        `The peak tails to ${side} m/z: 10 % asymmetry ${r.asymmetryMeasured.toFixed(2)} measured against ${r.asymmetryModel.toFixed(2)} for the best ideal peak; ${why}.`,
      );
    } else if (excess && Math.abs(excess.at - apex) > 0.3 * main) {
      const side = excess.at > apex ? 'high' : 'low';
      findings.push(side === 'high' ? 'shoulder-high' : 'shoulder-low');
      details.push(`Extra signal on the ${side} m/z side near m/z ${excess.at.toFixed(3)} (a shoulder) that no ideal operating point gives; ${why}.`);
    } else {
      findings.push('shape');
      details.push(`The shape differs from every ideal peak tried: ${why}.`);
    }
  }
  details.push(
    `Fit: U/V = ${r.ratio.value.toFixed(6)} ± ${r.ratio.sigma.toPrecision(2)}, ion energy ${r.axialVoltage.value.toPrecision(3)} ± ${r.axialVoltage.sigma.toPrecision(2)} eV per charge, offset ${r.offset.value.toPrecision(3)} u; residual ${r.residualNoise.toPrecision(3)} against baseline noise ${r.noise.toPrecision(3)}; reduced χ² ${r.reducedChiSquare.toFixed(2)}.`,
  );
  const explained = findings.length === 0;
  let forWantedResolution: PeakVerdict['forWantedResolution'];
  if (wanted !== undefined) {
    if (typeof wanted !== 'number' || !Number.isFinite(wanted) || wanted < 1 || wanted > 1e6) {
      throw new Error(`wantedResolution = ${String(wanted)} is out of range; accepted: a number from 1 to 1e6`);
    }
    // The ideal band resolution needed, scaled by how the fitted peak's FWHM resolution compares with its band.
    const modelR = r.fwhmModel > 0 ? r.peak.centroid / r.fwhmModel : r.bandResolution;
    const scale = r.bandResolution > 0 && modelR > 0 ? r.bandResolution / modelR : 1;
    const inverse = ratioForResolution(Math.max(0.5, wanted * scale));
    forWantedResolution = {
      resolution: wanted,
      ratio: inverse.exact,
      ratioRule: ratioForResolution(wanted).rule,
      note: `U/V for an ideal band of m/Δm = ${(wanted * scale).toFixed(0)} (the wanted FWHM resolution × ${scale.toFixed(3)}, the band-to-FWHM ratio of the fitted peak), at the fitted ion energy.`,
    };
  }
  const summary = explained
    ? `Explained by the operating point: an ideal peak at U/V = ${r.ratio.value.toFixed(5)} and ${r.axialVoltage.value.toPrecision(3)} eV ion energy matches the measured width (FWHM ${r.fwhmMeasured.toPrecision(4)} u against ${r.fwhmModel.toPrecision(4)} u) and shape within the noise.${forWantedResolution ? ` For m/Δm = ${forWantedResolution.resolution} set U/V ≈ ${forWantedResolution.ratio.toFixed(5)}.` : ''}`
    : `Not explained by the operating point: ${details[0]} Work through the peak shape tree.`;
  return {
    explained,
    summary,
    findings,
    details,
    treeId: explained ? null : PEAK_SHAPE_TREE_ID,
    usualCauses: explained ? [] : USUAL_CAUSES,
    limits: MODEL_LIMITS,
    forWantedResolution,
  };
}
