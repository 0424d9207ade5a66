// Operating point and pass band of the mass filter (convention of Dawson 1976: rod pair x at +(U + V cos Ωt)). β_x = β(a, q), β_y = β(−a, −q).
// Along a fixed U/V line, ions lighter than the band have larger q and leave through the x edge b1(q)
// (right of the apex): the x pair acts as a high-pass filter and cuts the LOW-mass side. Heavier ions
// have smaller q and cross the y edge −a0(q) (left of the apex): the y pair cuts the HIGH-mass side.
// (P. E. Miller & M. B. Denton, J. Chem. Educ. 63 (1986) 617; Dawson 1976 — from memory.)
import { a0Unchecked, b1Unchecked } from './characteristicValues';
import { exponentUnchecked, MAX_ABS_A_EXPONENT, MAX_ABS_Q_EXPONENT } from './characteristicExponent';
import { LIMITS, mathieuParameters, qMassPerVolt } from './mathieuScale';
import { brentRoot } from './rootFinding';
import { apexRatio, firstRegionApex, firstRegionMargin, rfOnlyEdgeQ } from './stabilityRegions';
import { checkNumber, InputRangeError } from './validate';

export type FilterDirection = 'x' | 'y';

/** Within this of the apex ratio the band is narrower than rounding (R > 1e12): treated as closed. */
const APEX_GUARD = 1e-13;

export interface OperatingPoint {
  a: number;
  q: number;
  /** β in the x direction (β(a, q)), null when x is unstable. */
  betaX: number | null;
  /** β in the y direction (β(−a, −q)), null when y is unstable. */
  betaY: number | null;
  /** Both directions stable (in any zone). */
  stable: boolean;
  /** Inside the first stability region (both zones 0). */
  firstRegion: boolean;
  /** U/V (dc/rf); ±Number.MAX_VALUE (sign of dc) when rf = 0 and dc ≠ 0. */
  dcToRfRatio: number;
  /** Secular frequencies β·f/2 in Hz (0 where unstable). */
  secularFrequencyX: number;
  secularFrequencyY: number;
  /** |Floquet multiplier| per RF period in each direction (1 when stable). */
  growthPerPeriodX: number;
  growthPerPeriodY: number;
  /** ln of those growth factors (finite even where they overflow). */
  logGrowthPerPeriodX: number;
  logGrowthPerPeriodY: number;
  /** Signed distance in a to the first-region edges of each direction (> 0 inside, < 0 outside). */
  marginX: number;
  marginY: number;
  /** Directions in which the ion is lost (empty when stable). */
  cut: FilterDirection[];
  /** Which side of the pass band the ion lies on when lost: q above the apex q → lighter than the band. */
  cutSide: 'low-mass side' | 'high-mass side' | null;
}

/**
 * Operating point of an ion of m/z (u) at field radius r0 (m), frequency f (Hz), DC U = dc (V, per rod to
 * ground, either sign) and RF V = rf (V zero-to-peak per rod, ≥ 0).
 */
export function operatingPoint(p: { mz: number; r0: number; frequency: number; dc: number; rf: number }): OperatingPoint {
  const { a, q } = mathieuParameters(p);
  const mz = p.mz;
  const frequency = p.frequency;
  const dc = p.dc;
  const rf = p.rf;
  if (Math.abs(a) > MAX_ABS_A_EXPONENT || Math.abs(q) > MAX_ABS_Q_EXPONENT) {
    throw new InputRangeError(
      'mz',
      mz,
      `a value giving |a| ≤ ${MAX_ABS_A_EXPONENT} and |q| ≤ ${MAX_ABS_Q_EXPONENT} with these voltages (here a = ${a.toPrecision(4)}, q = ${q.toPrecision(4)})`,
    );
  }
  const x = exponentUnchecked(a, q);
  const y = exponentUnchecked(-a, -q);
  const cut: FilterDirection[] = [];
  if (!x.stable) cut.push('x');
  if (!y.stable) cut.push('y');
  const stable = cut.length === 0;
  return {
    a,
    q,
    betaX: x.beta,
    betaY: y.beta,
    stable,
    firstRegion: stable && x.zone === 0 && y.zone === 0,
    dcToRfRatio: rf > 0 ? dc / rf : dc === 0 ? 0 : Math.sign(dc) * Number.MAX_VALUE,
    secularFrequencyX: ((x.beta ?? 0) * frequency) / 2,
    secularFrequencyY: ((y.beta ?? 0) * frequency) / 2,
    growthPerPeriodX: x.growthPerPeriod,
    growthPerPeriodY: y.growthPerPeriod,
    logGrowthPerPeriodX: x.logGrowthPerPeriod,
    logGrowthPerPeriodY: y.logGrowthPerPeriod,
    marginX: firstRegionMargin(a, q),
    marginY: firstRegionMargin(-a, q),
    cut,
    cutSide: stable ? null : Math.abs(q) > firstRegionApex().q ? 'low-mass side' : 'high-mass side',
  };
}

/** q where the scan line a = 2λq crosses each first-region edge (λ = |U|/V < apex ratio). */
export function edgeCrossings(ratio: number): { qHighMassEdge: number; qLowMassEdge: number } {
  const apex = firstRegionApex();
  const qEnd = rfOnlyEdgeQ();
  if (ratio === 0) return { qHighMassEdge: 0, qLowMassEdge: qEnd };
  // y edge: −a0(q) = 2λq; divided by q so that the trivial root q = 0 drops out (−a0(q)/q → q/2).
  const yEdge = (q: number) => (q === 0 ? -2 * ratio : -a0Unchecked(q) / q - 2 * ratio);
  const xEdge = (q: number) => b1Unchecked(q) - 2 * ratio * q;
  // For a vanishing ratio b1(qEnd) (≈ 1e-17, rounding) can exceed 2λ·qEnd: the crossing is then qEnd itself.
  return {
    qHighMassEdge: brentRoot(yEdge, 0, apex.q, 1e-17),
    qLowMassEdge: xEdge(qEnd) >= 0 ? qEnd : brentRoot(xEdge, apex.q, qEnd, 1e-17),
  };
}

export interface PassBandDetail {
  /** Lowest transmitted m/z (u), at the x edge. */
  low: number;
  /** Highest transmitted m/z (u), at the y edge; Infinity when U = 0 (RF-only: everything above low). */
  high: number;
  /** (low + high)/2, u (Infinity when U = 0). */
  centre: number;
  /** high − low, u (Infinity when U = 0). */
  width: number;
  /** Ideal-field resolution centre/width (infinite RF cycles); 0.5 when U = 0. */
  resolution: number;
  /** q of the two edge crossings. */
  qLowMassEdge: number;
  qHighMassEdge: number;
}

function checkBandInput(p: { dc: number; rf: number; r0: number; frequency: number }) {
  const dc = checkNumber('dc', p?.dc, LIMITS.dc);
  const rf = checkNumber('rf', p?.rf, LIMITS.rfPositive);
  const r0 = checkNumber('r0', p?.r0, LIMITS.r0);
  const frequency = checkNumber('frequency', p?.frequency, LIMITS.frequency);
  return { dc, rf, r0, frequency };
}

/** Pass band with centre, width and ideal resolution; null when |U|/V ≥ the apex ratio (nothing passes). */
export function passBandDetail(p: { dc: number; rf: number; r0: number; frequency: number }): PassBandDetail | null {
  const { dc, rf, r0, frequency } = checkBandInput(p);
  const ratio = Math.abs(dc) / rf; // the diagram is symmetric in a: −U swaps the roles of x and y
  if (ratio >= apexRatio() - APEX_GUARD) return null;
  const { qHighMassEdge, qLowMassEdge } = edgeCrossings(ratio);
  const massTimesQ = qMassPerVolt(r0, frequency) * rf;
  const low = massTimesQ / qLowMassEdge;
  if (qHighMassEdge === 0) {
    return { low, high: Infinity, centre: Infinity, width: Infinity, resolution: 0.5, qLowMassEdge, qHighMassEdge };
  }
  const high = massTimesQ / qHighMassEdge;
  return {
    low,
    high,
    centre: (low + high) / 2,
    width: high - low,
    resolution: (qLowMassEdge + qHighMassEdge) / (2 * (qLowMassEdge - qHighMassEdge)),
    qLowMassEdge,
    qHighMassEdge,
  };
}

/**
 * The m/z interval (u) transmitted by an ideal filter at DC U = dc, RF V = rf (V, per rod, zero-to-peak),
 * field radius r0 (m), frequency f (Hz): both x and y stable in the first region. null when |U|/V is at or
 * above the apex ratio ≈ 0.16784; high = Infinity for RF-only (U = 0).
 */
export function passBand(p: { dc: number; rf: number; r0: number; frequency: number }): { low: number; high: number } | null {
  const detail = passBandDetail(p);
  return detail ? { low: detail.low, high: detail.high } : null;
}

/** Ideal-field resolution m/Δm (centre/width) at U/V = ratio, from the exact region edges; null at/above the apex. */
export function exactResolutionAtRatio(ratio: number): number | null {
  checkNumber('ratio', ratio, { min: 0, max: 10 });
  if (ratio >= apexRatio() - APEX_GUARD) return null;
  const { qHighMassEdge, qLowMassEdge } = edgeCrossings(ratio);
  return (qLowMassEdge + qHighMassEdge) / (2 * (qLowMassEdge - qHighMassEdge));
}

/** U/V giving an ideal-field resolution (centre/width) R ≥ 0.5 exactly, from the region edges. */
export function ratioForExactResolution(resolution: number): number {
  checkNumber('resolution', resolution, { min: 0.5, max: 1e9 });
  // R ≤ 1e9 keeps t = apex − λ ≥ ~1e-10, far above APEX_GUARD.
  const apex = apexRatio();
  if (resolution === 0.5) return 0;
  // 1/R(λ) falls from 2 at λ = 0 to 0 at the apex; solve in t = apex − λ for accuracy near the apex.
  const inverse = (t: number) => {
    if (t <= APEX_GUARD) return -1 / resolution;
    const { qHighMassEdge, qLowMassEdge } = edgeCrossings(apex - t);
    return (2 * (qLowMassEdge - qHighMassEdge)) / (qLowMassEdge + qHighMassEdge) - 1 / resolution;
  };
  const t = brentRoot(inverse, 0, apex, 1e-18);
  return apex - t;
}
