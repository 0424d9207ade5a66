/**
 * Peak shape of an ideal quadrupole mass filter: transmission across m/z at fixed U and V, resolution at 50 %
 * and 10 % of peak height, and the transmission-against-resolution curve as U/V is stepped towards the apex.
 *
 * Model and method: see transmission.ts. Results are columnar Float64Arrays, ready to chart and to transfer.
 */
import {
  MAX_PHASES,
  evaluatePhases,
  prepareFlight,
  resolveOptions,
  summarisePhases,
  type FastTransmissionOptions,
  type FastContext,
  type PhaseValues,
} from './transmission';
import { flightModel, requireFinite, requireInteger, validateBeamSettings, type BeamSettings } from './peakInput';
import { InputRangeError } from './validate';
import { ATOMIC_MASS_CONSTANT, ELEMENTARY_CHARGE } from './constants';
import { monodromy, periodTable } from './trajectoryMathieu';

/** Progress and cancellation hooks for long runs (the worker reports progress and can stop a stale run). */
export interface RunControl {
  /** Called with the completed fraction in [0, 1]. */
  onProgress?: (fraction: number) => void;
  /** Polled between m/z points; returning true abandons the run with PeakCancelledError. */
  shouldStop?: () => boolean;
  /** An AbortSignal-like object; aborted → PeakCancelledError. */
  signal?: { readonly aborted: boolean };
}

export class PeakCancelledError extends Error {
  constructor() {
    super('Peak simulation cancelled');
    this.name = 'PeakCancelledError';
  }
}

export interface PeakProfileParams extends BeamSettings {
  mzFrom: number;
  mzTo: number;
  points: number;
}

export interface PeakProfile {
  mz: Float64Array;
  transmission: Float64Array;
  /** Error bound per point (sampling bracket + phase-rule estimate); deterministic, so no 1σ. */
  errorBound: Float64Array;
  /**
   * m/Δm at 50 % and 10 % of the highest sampled point; 0 (no width can be measured — never NaN) when the peak does not fall to that level inside the
   * range, or when there is no measurable peak (height ≤ 10 × its error bound, or ≤ 1e-9).
   */
  resolution50: number;
  resolution10: number;
  /** Highest sampled transmission and its m/z. */
  peakTransmission: number;
  peakMz: number;
}

export interface PeakProfileOptions extends FastTransmissionOptions, RunControl {
  /** Target error bound per point relative to the peak height, at least 1e-7 absolute (phases are doubled until met); default 1e-3. */
  relativeTolerance?: number;
}

function checkStop(control: RunControl): void {
  if (control.signal?.aborted || control.shouldStop?.()) throw new PeakCancelledError();
}

export function validateProfileParams(p: PeakProfileParams): void {
  validateBeamSettings(p);
  requireFinite('mzFrom', p.mzFrom, 0, 1e7);
  requireFinite('mzTo', p.mzTo, 0, 1e7);
  if (!(p.mzTo > p.mzFrom)) throw new InputRangeError('mzTo', p.mzTo, `a number greater than mzFrom (${p.mzFrom})`);
  requireInteger('points', p.points, 2, 4001);
}

/**
 * Transmission across m/z at fixed U (dc) and V (rf). Two passes: every point with the starting number of
 * phases, then points whose error estimate exceeds relativeTolerance × peak height are refined.
 */
export function peakProfile(p: PeakProfileParams, options: PeakProfileOptions = {}): PeakProfile {
  validateProfileParams(p);
  const resolved = resolveOptions(options);
  const relative = requireFinite('relativeTolerance', options.relativeTolerance ?? 1e-3, 0, 1);
  const n = p.points;
  const mz = new Float64Array(n);
  const transmission = new Float64Array(n);
  const errorBound = new Float64Array(n);
  const values: PhaseValues[] = [];
  const contexts: FastContext[] = [];
  for (let i = 0; i < n; i++) mz[i] = p.mzFrom + ((p.mzTo - p.mzFrom) * i) / (n - 1);
  const report = (fraction: number): void => options.onProgress?.(Math.min(1, Math.max(0, fraction)));
  // Pass 1: all points at the starting number of phases (about 60 % of the work).
  let peak = 0;
  for (let i = 0; i < n; i++) {
    checkStop(options);
    const ctx = prepareFlight(flightModel({ ...p, mz: mz[i] }), resolved);
    contexts.push(ctx);
    values.push(evaluatePhases(ctx, resolved.phases));
    const r = summarisePhases(values[i]);
    transmission[i] = r.transmission;
    errorBound[i] = r.errorBound;
    if (r.transmission > peak) peak = r.transmission;
    report((0.6 * (i + 1)) / n);
  }
  // Pass 2: refine where the bound is too large for the peak height. Refinement can lower the peak, and with it
  // the target, so repeat until every bound meets the target of the final peak (or the phase limit).
  // Absolute floor 1e-7: a window with no peak (T ≈ 0 everywhere) must not refine for ever.
  for (let round = 0; round < 4; round++) {
    let top = 0;
    for (let i = 0; i < n; i++) if (transmission[i] > top) top = transmission[i];
    if (round > 0 && top === peak) break;
    peak = top;
    const target = Math.max(relative * peak, 1e-7);
    const pending: number[] = [];
    for (let i = 0; i < n; i++) if (errorBound[i] > target && values[i].phases < MAX_PHASES) pending.push(i);
    if (pending.length === 0) break;
    pending.forEach((i, done) => {
      checkStop(options);
      while (errorBound[i] > target && values[i].phases < MAX_PHASES) {
        values[i] = evaluatePhases(contexts[i], values[i].phases * 2, values[i]);
        const r = summarisePhases(values[i]);
        transmission[i] = r.transmission;
        errorBound[i] = r.errorBound;
      }
      if (round === 0) report(0.6 + (0.4 * (done + 1)) / pending.length);
    });
  }
  report(1);
  const widths = peakWidths(mz, transmission);
  // A "peak" no taller than ten times its own error bound (or below 1e-9) has no measurable width.
  let worstBound = 0;
  for (let i = 0; i < n; i++) worstBound = Math.max(worstBound, errorBound[i]);
  if (!(widths.peakTransmission > 10 * worstBound && widths.peakTransmission > 1e-9)) {
    widths.resolution50 = 0;
    widths.resolution10 = 0;
  }
  return { mz, transmission, errorBound, ...widths };
}

/**
 * Settings of the coarse, quick profile that peakProfileProgressive delivers first: 64 samples per period, 8
 * starting phases, whole-period hulls thinned to δ = 1e-3, the scaled inner bracket (see transmission.ts),
 * quadrature panels cut at ±s and ±2s only; error bound ≤ 1 % of the peak height. The same rigorous bracket and phase rule as the full profile, only wider.
 */
export const COARSE_PROFILE_OPTIONS: Readonly<Required<Omit<FastTransmissionOptions, 'quadratureOrder' | 'substeps'>>> & {
  readonly relativeTolerance: number;
} = {
  samplesPerPeriod: 64,
  phases: 8,
  hullTolerance: 1e-3,
  hullKeep: 16,
  scaledInner: true,
  panelLevels: [1, 2],
  relativeTolerance: 1e-2,
};

export interface ProgressiveProfileOptions extends PeakProfileOptions {
  /**
   * Receives the coarse profile (COARSE_PROFILE_OPTIONS) before the refined one is computed — only when every
   * point's error bound is within 1 % of its peak height, as the coarse stage promises.
   */
  onCoarse?: (coarse: PeakProfile) => void;
  /** Fraction of the progress scale given to the coarse stage; default 0.35. */
  coarseShare?: number;
}

/** True when every error bound of the profile is within `relative` of its peak height. */
export function profileWithin(profile: Pick<PeakProfile, 'errorBound' | 'peakTransmission'>, relative: number): boolean {
  if (profile === null || typeof profile !== 'object' || !profile.errorBound || typeof profile.errorBound.length !== 'number') {
    throw new InputRangeError('profile', profile, 'a peak profile (errorBound per point and peakTransmission)');
  }
  requireFinite('relative', relative, 0, 1);
  requireFinite('profile.peakTransmission', profile.peakTransmission, 0, 1, 'none');
  let worst = 0;
  for (let i = 0; i < profile.errorBound.length; i++) worst = Math.max(worst, profile.errorBound[i]);
  return worst <= relative * profile.peakTransmission;
}

/**
 * The peak in two stages: a coarse complete profile (error bound ≤ 1 % of the peak height, handed to onCoarse),
 * then the refined one with `options` (default ≤ 1e-3 of the peak height), which is returned. Progress runs over
 * both stages; cancellation is polled in both.
 */
export function peakProfileProgressive(p: PeakProfileParams, options: ProgressiveProfileOptions = {}): PeakProfile {
  validateProfileParams(p);
  const share = requireFinite('coarseShare', options.coarseShare ?? 0.35, 0, 1, 'none');
  const { onCoarse, coarseShare: _share, onProgress, ...rest } = options;
  if (onCoarse) {
    const coarse = peakProfile(p, {
      ...COARSE_PROFILE_OPTIONS,
      shouldStop: options.shouldStop,
      signal: options.signal,
      onProgress: onProgress ? (f) => onProgress(share * f) : undefined,
    });
    if (profileWithin(coarse, COARSE_PROFILE_OPTIONS.relativeTolerance)) onCoarse(coarse);
  }
  const start = onCoarse ? share : 0;
  return peakProfile(p, { ...rest, onProgress: onProgress ? (f) => onProgress(start + (1 - start) * f) : undefined });
}

/**
 * Resolution m/Δm from a sampled peak: Δm between the outermost crossings of the level (linear interpolation
 * between samples) around the highest point; m = midpoint of the 50 % crossings. 0 (not measurable) when the profile does not
 * drop below the level on both sides within the range (the peak is cut off) or has no height.
 */
export function peakWidths(mz: ArrayLike<number>, t: ArrayLike<number>): {
  resolution50: number;
  resolution10: number;
  peakTransmission: number;
  peakMz: number;
} {
  if (!mz || typeof mz.length !== 'number' || mz.length < 2) throw new InputRangeError('mz', mz, 'a list of at least 2 m/z values');
  if (!t || t.length !== mz.length) throw new InputRangeError('transmission', t, `a list of ${mz.length} values (one per m/z)`);
  for (let i = 0; i < mz.length; i++) {
    if (!Number.isFinite(mz[i]) || (i > 0 && !(mz[i] > mz[i - 1]))) throw new InputRangeError(`mz[${i}]`, mz[i], 'finite, strictly increasing m/z values');
    if (!Number.isFinite(t[i]) || t[i] < 0) throw new InputRangeError(`transmission[${i}]`, t[i], 'a finite number ≥ 0');
  }
  let top = 0;
  for (let i = 1; i < t.length; i++) if (t[i] > t[top]) top = i;
  const height = t[top];
  const crossing = (level: number): [number, number] | null => {
    let left = -1;
    for (let i = top; i > 0; i--) if (t[i - 1] < level) { left = i - 1; break; }
    let right = -1;
    for (let i = top; i + 1 < t.length; i++) if (t[i + 1] < level) { right = i + 1; break; }
    if (left < 0 || right < 0) return null;
    const at = (a: number, b: number): number => mz[a] + ((level - t[a]) / (t[b] - t[a])) * (mz[b] - mz[a]);
    return [at(left, left + 1), at(right, right - 1)];
  };
  if (!(height > 0)) return { resolution50: 0, resolution10: 0, peakTransmission: 0, peakMz: mz[top] };
  const half = crossing(0.5 * height);
  const tenth = crossing(0.1 * height);
  const centre = half ? 0.5 * (half[0] + half[1]) : mz[top];
  return {
    resolution50: half ? centre / (half[1] - half[0]) : 0,
    resolution10: tenth ? centre / (tenth[1] - tenth[0]) : 0,
    peakTransmission: height,
    peakMz: mz[top],
  };
}

/**
 * The m/z interval where both x and y motions are stable (|tr M| < 2, Floquet) along the scan line of fixed U, V,
 * found by bisection from a stable starting m/z. Returns null if `inside` is not stable.
 * (For windows only; the engine's passBand gives the published band edges.)
 */
export function stableInterval(s: Pick<BeamSettings, 'r0' | 'frequency' | 'dc' | 'rf' | 'charge'>, inside: number): { low: number; high: number } | null {
  if (s === null || typeof s !== 'object') throw new InputRangeError('settings', s, 'an object with r0, frequency, dc and rf');
  requireFinite('r0', s.r0, 0, 0.1);
  requireFinite('frequency', s.frequency, 0, 1e9);
  requireFinite('dc', s.dc, -1e5, 1e5, 'none');
  requireFinite('rf', s.rf, 0, 1e5);
  requireFinite('inside', inside, 0, 1e7);
  const z = Math.abs(s.charge ?? 1);
  const omega = 2 * Math.PI * s.frequency;
  const stable = (mz: number): boolean => {
    const scale = (z * ELEMENTARY_CHARGE) / (mz * z * ATOMIC_MASS_CONSTANT * s.r0 * s.r0 * omega * omega);
    const a = 8 * scale * s.dc;
    const q = 4 * scale * s.rf;
    const tx = monodromy(periodTable(a, q, 64, 2));
    const ty = monodromy(periodTable(-a, -q, 64, 2));
    return Math.abs(tx[0] + tx[3]) < 2 && Math.abs(ty[0] + ty[3]) < 2;
  };
  if (!stable(inside)) return null;
  const edge = (direction: number): number => {
    let good = inside;
    let step = inside * 1e-4;
    let bad = inside + direction * step;
    while (stable(bad)) {
      good = bad;
      step *= 2;
      bad = inside + direction * step;
      if (bad <= 0 || step > inside * 10) return bad;
    }
    for (let i = 0; i < 60; i++) {
      const mid = 0.5 * (good + bad);
      if (stable(mid)) good = mid;
      else bad = mid;
    }
    return 0.5 * (good + bad);
  };
  return { low: edge(-1), high: edge(1) };
}

export interface TransmissionVsResolutionParams extends Omit<BeamSettings, 'dc' | 'rf'> {
  /** Nominal m/z: V is set so that q = qOperating there. */
  mz: number;
  /** q at the nominal m/z (default 0.706, near the apex). */
  qOperating?: number;
  /** U/V ratios to visit, ascending towards the apex (default: 12 steps from 0.150 to 0.1675). */
  ratios?: number[];
  /** Points per peak profile (default 61). */
  points?: number;
}

export interface TransmissionVsResolution {
  ratio: Float64Array;
  dc: Float64Array;
  rf: Float64Array;
  resolution50: Float64Array;
  resolution10: Float64Array;
  peakTransmission: Float64Array;
}

/**
 * Step U/V towards the apex at fixed V and record the highest transmission of the peak against its resolution.
 * Ratios past the apex (no stable band) give T = 0 and R = 0 (not measurable). Each peak's window is its stable band widened by
 * half its width plus the finite-flight tail m·20/n² on each side.
 */
export function transmissionVsResolution(
  p: TransmissionVsResolutionParams,
  options: PeakProfileOptions = {},
): TransmissionVsResolution {
  requireFinite('mz', p.mz, 0, 1e7);
  const qOperating = requireFinite('qOperating', p.qOperating ?? 0.706, 0, 0.908);
  const ratios = p.ratios ?? Array.from({ length: 12 }, (_, i) => 0.15 + (0.0175 * i) / 11);
  if (!Array.isArray(ratios) || ratios.length < 1) throw new InputRangeError('ratios', ratios, 'a non-empty list of U/V ratios');
  ratios.forEach((r, i) => requireFinite(`ratios[${i}]`, r, 0, 0.5, 'none'));
  const points = requireInteger('points', p.points ?? 61, 5, 1001);
  const z = Math.abs(p.charge ?? 1);
  const omega = 2 * Math.PI * p.frequency;
  const rf = (qOperating * p.mz * z * ATOMIC_MASS_CONSTANT * p.r0 * p.r0 * omega * omega) / (4 * z * ELEMENTARY_CHARGE);
  const k = ratios.length;
  const out: TransmissionVsResolution = {
    ratio: Float64Array.from(ratios),
    dc: new Float64Array(k),
    rf: new Float64Array(k).fill(rf),
    resolution50: new Float64Array(k).fill(0),
    resolution10: new Float64Array(k).fill(0),
    peakTransmission: new Float64Array(k),
  };
  // Flight length at the nominal m/z (for the window's tail allowance); validates the beam settings too.
  const cycles = flightModel({ ...p, mz: p.mz, dc: 0, rf }).cycles;
  ratios.forEach((ratio, i) => {
    checkStop(options);
    const dc = ratio * rf;
    out.dc[i] = dc;
    const settings: BeamSettings = { ...p, dc, rf };
    const band = stableInterval(settings, p.mz);
    if (band) {
      const width = band.high - band.low;
      const margin = 0.5 * width + (p.mz * 20) / (cycles * cycles);
      const profile = peakProfile(
        { ...settings, mzFrom: Math.max(band.low - margin, 1e-3), mzTo: band.high + margin, points },
        { ...options, onProgress: (f) => options.onProgress?.((i + f) / k) },
      );
      out.resolution50[i] = profile.resolution50;
      out.resolution10[i] = profile.resolution10;
      out.peakTransmission[i] = profile.peakTransmission;
    }
    options.onProgress?.((i + 1) / k);
  });
  return out;
}
