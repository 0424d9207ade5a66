// Scan law: which U and V pass a given m/z, and the inverse. V = q·m·r0²Ω²/(4e), U = a·m·r0²Ω²/(8e)
// (rod pair x at +(U + V cos Ωt), per rod to ground, V zero-to-peak, as in Dawson 1976). The rounded working form
// V = 7.22·(m/z)·f[MHz]²·r0[cm]² at q = 0.706 is widely quoted (Dawson 1976; Miller & Denton 1986 — both
// from memory); the engine uses the exact CODATA form.
// Scan lines U = λ·V − δ: δ = 0 holds the resolution m/Δm constant (the band scales with V); λ at the
// apex ratio with δ > 0 holds the width Δm roughly constant (common practice; exact width drifts slightly).
import { LIMITS, qMassPerVolt } from './mathieuScale';
import { edgeCrossings, ratioForExactResolution } from './operatingPoint';
import { brentRoot } from './rootFinding';
import { apexRatio, firstRegionApex, rfOnlyEdgeQ } from './stabilityRegions';
import { checkNumber } from './validate';

const Q_RANGE = { min: 0, minExclusive: true, max: 1000 } as const;
const A_RANGE = { min: -1000, max: 1000 } as const;

/** RF amplitude V (V zero-to-peak per rod) placing m/z at the given q (default: the apex q ≈ 0.706). */
export function rfForMass(p: { mz: number; r0: number; frequency: number; q?: number }): number {
  const mz = checkNumber('mz', p?.mz, LIMITS.mz);
  const r0 = checkNumber('r0', p?.r0, LIMITS.r0);
  const frequency = checkNumber('frequency', p?.frequency, LIMITS.frequency);
  const q = p.q === undefined ? firstRegionApex().q : checkNumber('q', p.q, Q_RANGE);
  return (q * mz) / qMassPerVolt(r0, frequency);
}

/** DC U (V per rod to ground) placing m/z at the given a (default: the apex a ≈ 0.23699). */
export function dcForMass(p: { mz: number; r0: number; frequency: number; a?: number }): number {
  const mz = checkNumber('mz', p?.mz, LIMITS.mz);
  const r0 = checkNumber('r0', p?.r0, LIMITS.r0);
  const frequency = checkNumber('frequency', p?.frequency, LIMITS.frequency);
  const a = p.a === undefined ? firstRegionApex().a : checkNumber('a', p.a, A_RANGE);
  return (a * mz) / (2 * qMassPerVolt(r0, frequency));
}

/** m/z (u) that sits at the given q (default apex q) for RF amplitude V = rf (V zero-to-peak per rod). */
export function massForRf(p: { rf: number; r0: number; frequency: number; q?: number }): number {
  const rf = checkNumber('rf', p?.rf, LIMITS.rfPositive);
  const r0 = checkNumber('r0', p?.r0, LIMITS.r0);
  const frequency = checkNumber('frequency', p?.frequency, LIMITS.frequency);
  const q = p.q === undefined ? firstRegionApex().q : checkNumber('q', p.q, Q_RANGE);
  return (qMassPerVolt(r0, frequency) * rf) / q;
}

/** RF-only (U = 0) low-mass cut-off: the m/z at the a = 0 edge q ≈ 0.908 (b1(q) = 0). */
export function rfOnlyLowMassCutoff(p: { rf: number; r0: number; frequency: number }): number {
  return massForRf({ ...p, q: rfOnlyEdgeQ() });
}

/** Top of the mass range: the m/z reaching the apex q at the supply's largest RF amplitude (V zero-to-peak). */
export function massRangeTop(p: { maxRf: number; r0: number; frequency: number; q?: number }): number {
  const maxRf = checkNumber('maxRf', p?.maxRf, LIMITS.rfPositive);
  return massForRf({ rf: maxRf, r0: p.r0, frequency: p.frequency, q: p.q });
}

/** A scan line U = slope·V − offset (U, V per rod; V zero-to-peak; offset in volts). */
export interface ScanLine {
  slope: number;
  offset: number;
}

/** The line through the apex, U/V = 0.16784…: zero ideal band width (the limit every real line stays below). */
export function apexScanLine(): ScanLine {
  return { slope: apexRatio(), offset: 0 };
}

/** Constant-resolution line U = λV with λ chosen so that the ideal band has centre/width = resolution exactly. */
export function constantResolutionScanLine(resolution: number): ScanLine {
  return { slope: ratioForExactResolution(resolution), offset: 0 };
}

function checkLine(line: ScanLine): ScanLine {
  checkNumber('slope', line?.slope, { min: 0, max: 0.5 });
  checkNumber('offset', line?.offset, { min: -1e6, max: 1e6, unit: 'V' });
  return line;
}

/** Band for U/V = λ_eff at RF amplitude V: edges in u (null if no band). */
function bandAt(ratio: number, rf: number, scale: number): { low: number; high: number; centre: number } | null {
  if (!(ratio >= 0) || ratio >= apexRatio() - 1e-13) return null;
  const { qHighMassEdge, qLowMassEdge } = edgeCrossings(ratio);
  if (qHighMassEdge === 0) return null;
  const low = (scale * rf) / qLowMassEdge;
  const high = (scale * rf) / qHighMassEdge;
  return { low, high, centre: (low + high) / 2 };
}

export interface ScanPoint {
  /** RF amplitude V (V zero-to-peak per rod) centring the band on m/z. */
  rf: number;
  /** DC U = slope·V − offset (V per rod). */
  dc: number;
  /** Band edges, width and ideal resolution at that point. */
  low: number;
  high: number;
  width: number;
  resolution: number;
}

/**
 * Expected U and V for m/z on a scan line: V is the amplitude whose ideal pass band is centred on m/z
 * (solved exactly from the region edges), U = slope·V − offset. null when the line passes nothing at that
 * m/z (U/V at or above the apex, or U < 0 there).
 */
export function scanPoint(p: { line: ScanLine; mz: number; r0: number; frequency: number }): ScanPoint | null {
  const line = checkLine(p?.line);
  const mz = checkNumber('mz', p?.mz, LIMITS.mz);
  const r0 = checkNumber('r0', p?.r0, LIMITS.r0);
  const frequency = checkNumber('frequency', p?.frequency, LIMITS.frequency);
  const scale = qMassPerVolt(r0, frequency);
  const centreError = (rf: number): number => {
    const band = bandAt(line.slope - line.offset / rf, rf, scale);
    return band ? band.centre - mz : NaN;
  };
  // The band centre sits near the apex q, so V is within a factor of ~2 of the apex value.
  const vApex = (firstRegionApex().q * mz) / scale;
  let lo = 0.5 * vApex;
  let hi = 2 * vApex;
  // Shrink the bracket to where a band exists (λ_eff below the apex, above 0).
  const valid = (v: number) => Number.isFinite(centreError(v));
  if (!valid(lo) && !valid(hi)) {
    // Scan a few points for any valid V.
    let found = false;
    for (let i = 1; i < 40 && !found; i++) {
      const v = lo + ((hi - lo) * i) / 40;
      if (valid(v)) {
        found = true;
        lo = v;
      }
    }
    if (!found) return null;
  }
  if (!valid(lo)) lo = brentValidEdge(valid, lo, hi);
  if (!valid(hi)) hi = brentValidEdge(valid, hi, lo);
  const fLo = centreError(lo);
  const fHi = centreError(hi);
  if (!(fLo <= 0 && fHi >= 0)) return null;
  const rf = brentRoot(centreError, lo, hi, 1e-12 * vApex);
  const band = bandAt(line.slope - line.offset / rf, rf, scale);
  if (!band) return null;
  return {
    rf,
    dc: line.slope * rf - line.offset,
    low: band.low,
    high: band.high,
    width: band.high - band.low,
    resolution: band.centre / (band.high - band.low),
  };
}

/** Bisection for the boundary of the valid interval between an invalid and a valid V (the valid side returned). */
function brentValidEdge(valid: (v: number) => boolean, invalid: number, good: number): number {
  let bad = invalid;
  let ok = good;
  for (let i = 0; i < 80; i++) {
    const mid = 0.5 * (bad + ok);
    if (valid(mid)) ok = mid;
    else bad = mid;
  }
  return ok;
}

/** Inverse of the scan law: the m/z centred in the band at a measured RF amplitude V; null if no band. */
export function massForScanRf(p: { line: ScanLine; rf: number; r0: number; frequency: number }): number | null {
  const line = checkLine(p?.line);
  const rf = checkNumber('rf', p?.rf, LIMITS.rfPositive);
  const r0 = checkNumber('r0', p?.r0, LIMITS.r0);
  const frequency = checkNumber('frequency', p?.frequency, LIMITS.frequency);
  const band = bandAt(line.slope - line.offset / rf, rf, qMassPerVolt(r0, frequency));
  return band ? band.centre : null;
}

/**
 * Constant-width line: slope at the apex ratio and offset δ chosen so the ideal band is exactly `width` u
 * wide and centred at the reference m/z. Away from it the width stays close to `width` (first order in
 * U/V near the apex: Δm ≈ δ/(0.126·V/m)).
 */
export function constantWidthScanLine(p: { width: number; referenceMz: number; r0: number; frequency: number }): ScanLine {
  const width = checkNumber('width', p?.width, { min: 0, minExclusive: true, max: 1e6, unit: 'u' });
  const referenceMz = checkNumber('referenceMz', p?.referenceMz, LIMITS.mz);
  const r0 = checkNumber('r0', p?.r0, LIMITS.r0);
  const frequency = checkNumber('frequency', p?.frequency, LIMITS.frequency);
  checkNumber('width', width, { max: referenceMz, unit: 'u (≤ referenceMz)' });
  const ratio = ratioForExactResolution(Math.max(0.5, referenceMz / width));
  const { qHighMassEdge, qLowMassEdge } = edgeCrossings(ratio);
  // Band centre at referenceMz: referenceMz = scale·V·(1/qLow + 1/qHigh)/2.
  const rf = (2 * referenceMz) / (qMassPerVolt(r0, frequency) * (1 / qLowMassEdge + 1 / qHighMassEdge));
  const slope = apexRatio();
  return { slope, offset: (slope - ratio) * rf };
}
