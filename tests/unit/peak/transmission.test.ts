// Deterministic ensemble transmission (src/engine/transmission.ts): limits, exact free flight, error bound,
// convergence and refusal of bad input.
import { describe, expect, it } from 'vitest';
import { transmission } from '../../../src/engine/transmission';
import { InputRangeError } from '../../../src/engine/validate';
import { gaussLegendre, normalCdf, psiExcess } from '../../../src/engine/transmissionMath';
import { ATOMIC_MASS_CONSTANT, ELEMENTARY_CHARGE } from '../../../src/engine/constants';
import { near, settingsFor } from './helpers';

/**
 * Free flight (U = V = 0), derived here independently of the polygon machinery.
 * With no field x(t) = x0 + v_x t is linear in t, so |x| < r0 for the whole flight iff it holds at the entrance
 * and at the exit: |x0| < r0 and |x0 + v_x τ| < r0, τ = L/v_z. With v_x ~ N(0, σ²), σ = √(e ε⊥/m), and Σ = στ:
 *   P_x(x0) = Φ((r0 − x0)/Σ) − Φ((−r0 − x0)/Σ)  for |x0| < r0 (0 otherwise), and likewise for y.
 * x and y velocities are independent, the entry point is uniform in the disc of radius b, so
 *   T = (1/πb²) ∫∫_{x²+y²<b²} P_x(x) P_y(y) dx dy = (1/πb²) ∫_{−b}^{b} P(x) G(√(b² − x²)) dx,
 * with G(Y) = ∫_{−Y}^{Y} P(y) dy in closed form from ∫Φ((c − y)/Σ) dy = −Σ·Ψ((c − y)/Σ), Ψ(t) = tΦ(t) + φ(t):
 *   G(Y) = Σ[Ψ((r0 + Y)/Σ) − Ψ((r0 − Y)/Σ)] − Σ[Ψ((Y − r0)/Σ) − Ψ((−Y − r0)/Σ)]   (b ≤ r0).
 * The last 1-D integral is done with x = b sin θ and a 400-point Gauss–Legendre rule (smooth integrand).
 * Point-source limit b → 0: T = (2Φ(r0/Σ) − 1)².
 */
function psi(t: number): number {
  return Math.max(t, 0) + psiExcess(t);
}
function freeFlightExact(r0: number, b: number, spread: number): number {
  const P = (x: number): number => normalCdf((r0 - x) / spread) - normalCdf((-r0 - x) / spread);
  const G = (Y: number): number =>
    spread * (psi((r0 + Y) / spread) - psi((r0 - Y) / spread)) - spread * (psi((Y - r0) / spread) - psi((-Y - r0) / spread));
  const { nodes, weights } = gaussLegendre(400);
  let sum = 0;
  for (let i = 0; i < nodes.length; i++) {
    const theta = (Math.PI / 2) * nodes[i];
    const x = b * Math.sin(theta);
    sum += weights[i] * P(x) * G(b * Math.cos(theta)) * b * Math.cos(theta);
  }
  return ((Math.PI / 2) * sum) / (Math.PI * b * b);
}

function freeSpread(p: { mz: number; transverseEnergy: number; rodLength: number; axialVoltage: number }): number {
  const mass = p.mz * ATOMIC_MASS_CONSTANT;
  const sigma = Math.sqrt((ELEMENTARY_CHARGE * p.transverseEnergy) / mass);
  const vz = Math.sqrt((2 * ELEMENTARY_CHARGE * p.axialVoltage) / mass);
  return (sigma * p.rodLength) / vz;
}

describe('transmission: free flight (U = V = 0) equals the exact geometric acceptance', () => {
  for (const [beamFraction, energy] of [
    [0.1, 0.1],
    [0.5, 0.01],
    [0.9, 0.001],
    [0.3, 1],
  ] as const) {
    it(`beam ${beamFraction} r0, ε⊥ = ${energy} eV`, () => {
      const p = { ...settingsFor({ a: 0, q: 0, cycles: 50, beamFraction, transverseEnergy: energy }), dc: 0, rf: 0 };
      const exact = freeFlightExact(p.r0, p.beamRadius, freeSpread(p));
      const fast = transmission(p);
      near('T free flight', fast.transmission, exact, 1e-6 + fast.errorBound);
      expect(fast.uncertainty).toBe(0);
    });
  }

  it('point-source limit: T = (2Φ(r0/Σ) − 1)² (b = 1e-4 r0)', () => {
    const p = { ...settingsFor({ a: 0, q: 0, cycles: 40, beamFraction: 1e-4, transverseEnergy: 0.05 }), dc: 0, rf: 0 };
    const spread = freeSpread(p);
    const expected = (2 * normalCdf(p.r0 / spread) - 1) ** 2;
    near('T point source', transmission(p).transmission, expected, 1e-6);
  });
});

describe('transmission: limits', () => {
  it('a tiny, cold beam deep inside the stable region is fully transmitted (T = 1)', () => {
    for (const [a, q] of [
      [0, 0.5],
      [0.1, 0.55],
      [0.02, 0.3],
    ]) {
      const p = settingsFor({ a, q, cycles: 150, beamFraction: 1e-3, transverseEnergy: 1e-6 });
      near(`T at (${a}, ${q})`, transmission(p).transmission, 1, 1e-9);
    }
  });

  it('points outside the first stability region transmit nothing (T ≤ 1e-12) after 100 cycles', () => {
    for (const [a, q] of [
      [0.3, 0.706], // above the apex
      [0, 0.95], // beyond the RF-only edge q ≈ 0.908
      [0.1, 0.3], // y unstable: −a < a0(q)
      [0.2, 0.9], // x unstable: a > b1(q)
    ]) {
      const p = settingsFor({ a, q, cycles: 100, beamFraction: 0.3, transverseEnergy: 0.5 });
      expect(transmission(p).transmission, `(${a}, ${q})`).toBeLessThanOrEqual(1e-12);
    }
  });

  it('T lies in [0, 1] and a negative ion (charge −1) gives the same T (x and y swap; round beam)', () => {
    const p = settingsFor({ a: 0.2366, q: 0.7055, cycles: 80, beamFraction: 0.2, transverseEnergy: 0.2 });
    const plus = transmission(p).transmission;
    const minus = transmission({ ...p, charge: -1 }).transmission;
    expect(plus).toBeGreaterThan(0);
    expect(plus).toBeLessThan(1);
    // Same physics; the numerical paths differ (x is the outer integral), so agreement is to quadrature accuracy.
    near('T(−1) vs T(+1)', minus, plus, 1e-6);
  });
});

describe('transmission: error bound and convergence', () => {
  const cases = [
    settingsFor({ a: 0.2365, q: 0.7055, cycles: 120, beamFraction: 0.1, transverseEnergy: 0.2 }),
    settingsFor({ a: 0.2367, q: 0.7062, cycles: 60, beamFraction: 0.3, transverseEnergy: 1 }),
    settingsFor({ a: 0.2, q: 0.75, cycles: 30, beamFraction: 0.5, transverseEnergy: 0.05 }),
  ];

  it('the true T (4× finer sampling, more phases, higher quadrature order) lies within the reported bound', () => {
    for (const p of cases) {
      const fast = transmission(p);
      const fine = transmission(p, { samplesPerPeriod: 512, phases: 128, quadratureOrder: 12, relativeTolerance: 1e-5 });
      near(`T (dc ${p.dc.toFixed(2)})`, fast.transmission, fine.transmission, fast.errorBound + fine.errorBound + 1e-7);
      expect(fast.errorBound).toBeLessThan(2e-3 * Math.max(fast.transmission, 1e-3));
    }
  });

  it('is deterministic: the same inputs give bit-identical numbers', () => {
    const a = transmission(cases[0]);
    const b = transmission(cases[0]);
    expect(a).toEqual(b);
  });
});

describe('transmission: bad input is refused with the field and the accepted range', () => {
  const good = settingsFor({ a: 0.2, q: 0.7, cycles: 50 });
  const bad: Array<[string, Record<string, unknown>]> = [
    ['mz', { mz: Number.NaN }],
    ['mz', { mz: -5 }],
    ['r0', { r0: -1e-3 }],
    ['r0', { r0: 0 }],
    ['frequency', { frequency: 0 }],
    ['rodLength', { rodLength: 0 }],
    ['axialVoltage', { axialVoltage: 0 }],
    ['axialVoltage', { axialVoltage: Number.POSITIVE_INFINITY }],
    ['beamRadius', { beamRadius: -1e-4 }],
    ['transverseEnergy', { transverseEnergy: -0.1 }],
    ['rf', { rf: -10 }],
    ['dc', { dc: Number.NaN }],
    ['charge', { charge: 0 }],
    ['charge', { charge: 1.5 }],
    ['cycles', { rodLength: 1e-9 }],
  ];
  for (const [field, change] of bad) {
    it(`${field} = ${JSON.stringify(Object.values(change)[0])}`, () => {
      let error: unknown = null;
      try {
        transmission({ ...good, ...change } as typeof good);
      } catch (e) {
        error = e;
      }
      expect(error).toBeInstanceOf(InputRangeError);
      const e = error as InputRangeError;
      expect(e.field).toBe(field);
      expect(e.message).toContain(field);
      expect(e.range.length).toBeGreaterThan(5);
    });
  }
});

describe('transmission: strongly unstable motion gives no spurious transmission', () => {
  it('a sweep outside a wide band (R ≈ 20, n ≈ 180) stays ≤ 1e-6 with a bound ≤ 1e-6; direct MC sees no survivor', async () => {
    // Regression: growth ~1e15 over the flight once made needle-shaped hulls lose their orientation digits.
    const { stableInterval } = await import('../../../src/engine/peakProfile');
    const { monteCarloTransmission } = await import('../../../src/engine/trajectoryDirect');
    const rf = 364.513;
    const s = { r0: 4e-3, frequency: 1.2e6, rodLength: 0.2, axialVoltage: 2, beamRadius: 0.4e-3, transverseEnergy: 1.2, dc: 0.16154 * rf, rf };
    const band = stableInterval(s, 220)!;
    const outside: number[] = [];
    for (let i = 0; i < 12; i++) {
      outside.push(band.low * (0.99 - 0.002 * i));
      outside.push(band.high * (1.01 + 0.002 * i));
    }
    for (const mz of outside) {
      const r = transmission({ ...s, mz });
      expect(r.transmission, `m/z ${mz}`).toBeLessThanOrEqual(1e-6);
      expect(r.errorBound, `m/z ${mz}`).toBeLessThanOrEqual(1e-6);
    }
    expect(monteCarloTransmission({ ...s, mz: 215.53 }, { ions: 200, seed: 5 }).transmitted).toBe(0);
    // And inside the band it is substantial.
    expect(transmission({ ...s, mz: 0.5 * (band.low + band.high) }).transmission).toBeGreaterThan(0.3);
  });
});
