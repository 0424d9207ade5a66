/**
 * Direct trajectory integration of single ions: the reference that validates the fast ensemble method.
 *
 * Same model as transmission.ts (ideal field, disc beam, Gaussian transverse velocities, uniform entry phase).
 * Each ion's (x, x', y, y') is integrated in ξ with the classical fourth-order Runge–Kutta method at a fixed
 * number of steps per RF period (default 256) — independent of the Magnus tables used by the fast method.
 * "Any instant": after each step the cubic Hermite interpolant through (x, x') at both ends is maximised in
 * closed form; its error is ≤ h⁴/384·max|x''''| (< 1e-8 r0 at 256 steps per period, G ≈ 1.7). The RK4 global
 * error near the band edges is larger (≈3e-5 r0 at 96 steps over 40 cycles, ≈1.5e-6 at 256): the tests check
 * 256 against 1024 steps (directReference.test.ts).
 * The Monte Carlo ensemble draws ions from a seeded xoshiro128** stream: same seed → same ions → same numbers.
 */
import { seededRandom } from './peakRandom';
import { flightModel, requireFinite, requireInteger, type FlightModel, type TransmissionParams } from './peakInput';
import { InputRangeError } from './validate';

/** One ion at the entrance, lengths in units of r0, slopes dx/dξ in units of r0. */
export interface EntryState {
  phase: number;
  x: number;
  slopeX: number;
  y: number;
  slopeY: number;
}

export interface IonFate {
  survived: boolean;
  /** Largest |x|/r0 and |y|/r0 reached (up to the loss, if lost). */
  maxX: number;
  maxY: number;
  /** ξ travelled when lost (the full flight nπ if it survived). */
  flight: number;
}

/** Draw `count` entry states (uniform phase, uniform disc, Gaussian slopes) from a seeded stream. */
export function sampleIons(model: FlightModel, count: number, seed: number): EntryState[] {
  if (model === null || typeof model !== 'object') throw new InputRangeError('model', model, 'a flight model from flightModel()');
  requireFinite('beamRadius', model.beamRadius, 0, 1e3);
  requireFinite('slopeSigma', model.slopeSigma, 0, 1e6, 'none');
  requireInteger('count', count, 0, 1e8);
  requireInteger('seed', seed, -(2 ** 31), 2 ** 32 - 1);
  const random = seededRandom(seed);
  const ions: EntryState[] = [];
  for (let i = 0; i < count; i++) {
    const phase = Math.PI * random.uniform();
    const radius = model.beamRadius * Math.sqrt(random.uniform());
    const angle = 2 * Math.PI * random.uniform();
    const slopeX = model.slopeSigma * random.normal();
    const slopeY = model.slopeSigma * random.normal();
    ions.push({ phase, x: radius * Math.cos(angle), slopeX, y: radius * Math.sin(angle), slopeY });
  }
  return ions;
}

/** Largest |H(t)| on [0, h] of the cubic Hermite interpolant with values p0, p1 and slopes d0, d1. */
function hermiteMax(p0: number, d0: number, p1: number, d1: number, h: number): number {
  let best = Math.max(Math.abs(p0), Math.abs(p1));
  // H(t) = p0 + d0 t + c2 t² + c3 t³
  const c2 = (3 * (p1 - p0)) / (h * h) - (2 * d0 + d1) / h;
  const c3 = (2 * (p0 - p1)) / (h * h * h) + (d0 + d1) / (h * h);
  // H'(t) = d0 + 2c2 t + 3c3 t² = 0
  const A = 3 * c3;
  const B = 2 * c2;
  const C = d0;
  const check = (t: number): void => {
    if (t > 0 && t < h) best = Math.max(best, Math.abs(p0 + t * (d0 + t * (c2 + t * c3))));
  };
  if (Math.abs(A) < 1e-300) {
    if (B !== 0) check(-C / B);
  } else {
    const disc = B * B - 4 * A * C;
    if (disc >= 0) {
      const root = Math.sqrt(disc);
      check((-B + root) / (2 * A));
      check((-B - root) / (2 * A));
    }
  }
  return best;
}

/**
 * Integrate one ion through the whole flight (n·π in ξ) or until |x| ≥ 1 or |y| ≥ 1 (units of r0).
 * x'' = −(a − 2q cos 2ξ)x, y'' = +(a − 2q cos 2ξ)y.
 */
export function integrateIon(a: number, q: number, cycles: number, ion: EntryState, stepsPerPeriod = 256): IonFate {
  requireFinite('a', a, -1e3, 1e3, 'none');
  requireFinite('q', q, -1e3, 1e3, 'none');
  requireFinite('cycles', cycles, 0, 1e6);
  requireInteger('stepsPerPeriod', stepsPerPeriod, 8, 1 << 16);
  if (ion === null || typeof ion !== 'object') throw new InputRangeError('ion', ion, 'an entry state {phase, x, slopeX, y, slopeY}');
  for (const key of ['phase', 'x', 'slopeX', 'y', 'slopeY'] as const) requireFinite(key, ion[key], -1e6, 1e6, 'none');
  const total = cycles * Math.PI;
  const steps = Math.max(1, Math.ceil(cycles * stepsPerPeriod));
  const h = total / steps;
  let x = ion.x;
  let vx = ion.slopeX;
  let y = ion.y;
  let vy = ion.slopeY;
  let maxX = Math.abs(x);
  let maxY = Math.abs(y);
  if (maxX >= 1 || maxY >= 1) return { survived: false, maxX, maxY, flight: 0 };
  let xi = ion.phase;
  const g = (t: number): number => a - 2 * q * Math.cos(2 * t);
  for (let i = 0; i < steps; i++) {
    const g1 = g(xi);
    const g2 = g(xi + 0.5 * h);
    const g4 = g(xi + h);
    // RK4 on (x, vx) with x' = vx, vx' = −g x; and (y, vy) with vy' = +g y.
    const k1x = vx;
    const k1v = -g1 * x;
    const k2x = vx + 0.5 * h * k1v;
    const k2v = -g2 * (x + 0.5 * h * k1x);
    const k3x = vx + 0.5 * h * k2v;
    const k3v = -g2 * (x + 0.5 * h * k2x);
    const k4x = vx + h * k3v;
    const k4v = -g4 * (x + h * k3x);
    const nx = x + (h / 6) * (k1x + 2 * k2x + 2 * k3x + k4x);
    const nvx = vx + (h / 6) * (k1v + 2 * k2v + 2 * k3v + k4v);
    const l1x = vy;
    const l1v = g1 * y;
    const l2x = vy + 0.5 * h * l1v;
    const l2v = g2 * (y + 0.5 * h * l1x);
    const l3x = vy + 0.5 * h * l2v;
    const l3v = g2 * (y + 0.5 * h * l2x);
    const l4x = vy + h * l3v;
    const l4v = g4 * (y + h * l3x);
    const ny = y + (h / 6) * (l1x + 2 * l2x + 2 * l3x + l4x);
    const nvy = vy + (h / 6) * (l1v + 2 * l2v + 2 * l3v + l4v);
    const peakX = hermiteMax(x, vx, nx, nvx, h);
    const peakY = hermiteMax(y, vy, ny, nvy, h);
    if (peakX > maxX) maxX = peakX;
    if (peakY > maxY) maxY = peakY;
    x = nx;
    vx = nvx;
    y = ny;
    vy = nvy;
    xi += h;
    if (maxX >= 1 || maxY >= 1) return { survived: false, maxX, maxY, flight: (i + 1) * h };
  }
  return { survived: true, maxX, maxY, flight: total };
}

export interface MonteCarloOptions {
  ions?: number;
  seed?: number;
  stepsPerPeriod?: number;
}

export interface MonteCarloResult {
  transmission: number;
  /** 1σ binomial uncertainty √(T(1 − T)/N). */
  uncertainty: number;
  ions: number;
  transmitted: number;
}

/** Seeded Monte Carlo transmission by direct integration of every ion (slow; the reference). */
export function monteCarloTransmission(p: TransmissionParams, options: MonteCarloOptions = {}): MonteCarloResult {
  const model = flightModel(p);
  const count = requireInteger('ions', options.ions ?? 2000, 1, 1e8);
  const seed = requireInteger('seed', options.seed ?? 1, -(2 ** 31), 2 ** 32 - 1);
  const steps = requireInteger('stepsPerPeriod', options.stepsPerPeriod ?? 256, 8, 1 << 16);
  const ions = sampleIons(model, count, seed);
  let transmitted = 0;
  for (const ion of ions) if (integrateIon(model.a, model.q, model.cycles, ion, steps).survived) transmitted++;
  const t = transmitted / count;
  return { transmission: t, uncertainty: Math.sqrt((t * (1 - t)) / count), ions: count, transmitted };
}
