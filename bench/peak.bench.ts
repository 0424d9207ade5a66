// Peak simulation speed: deterministic fast method vs direct per-ion integration at the same accuracy.
// Case (issue 4): m/z 500, r0 4 mm, 1 MHz, 20 cm rods, 5 V axial, U/V = 0.16784 − 0.126/1000 (R ≈ 1000 rule,
// Dawson 1976, from memory), 0.4 mm beam, 0.2 eV transverse energy, 101 points, error ≤ 1e-3 of peak height.
import { performance } from 'node:perf_hooks';
import { peakProfile, stableInterval } from '../src/engine/peakProfile';
import { flightModel } from '../src/engine/peakInput';
import { integrateIon, sampleIons } from '../src/engine/trajectoryDirect';
import { ATOMIC_MASS_CONSTANT, ELEMENTARY_CHARGE } from '../src/engine/constants';
import { medianMs, report } from './timing';

export function run(): void {
  const mz0 = 500;
  const r0 = 4e-3;
  const frequency = 1e6;
  const omega = 2 * Math.PI * frequency;
  const rf = (0.706 * mz0 * ATOMIC_MASS_CONSTANT * r0 * r0 * omega * omega) / (4 * ELEMENTARY_CHARGE);
  const ratio = 0.16784 - 0.126 / 1000;
  const settings = { r0, frequency, dc: ratio * rf, rf, rodLength: 0.2, axialVoltage: 5, beamRadius: 0.4e-3, transverseEnergy: 0.2 };
  const band = stableInterval(settings, mz0)!;
  const width = band.high - band.low;
  const params = { ...settings, mzFrom: band.low - 0.6 * width, mzTo: band.high + 0.6 * width, points: 101 };

  const profile = peakProfile(params, { relativeTolerance: 1e-3 });
  const worstRelative = Math.max(...profile.errorBound) / profile.peakTransmission;
  const cpu0 = process.cpuUsage();
  const runs = 5;
  const wall = medianMs(() => peakProfile(params, { relativeTolerance: 1e-3 }), runs, 1);
  const cpu = process.cpuUsage(cpu0);
  const cpuPerRun = (cpu.user + cpu.system) / 1000 / (runs + 1);

  console.log(`flight n = ${flightModel({ ...settings, mz: mz0 }).cycles.toFixed(1)} RF cycles; window ${params.mzFrom.toFixed(3)}–${params.mzTo.toFixed(3)} u`);
  console.log(`peak T = ${profile.peakTransmission.toFixed(4)}, R50 = ${profile.resolution50.toFixed(0)}, R10 = ${profile.resolution10.toFixed(0)}`);
  report('fast: worst error bound / peak height', worstRelative, '', '≤ 1e-3');
  report('fast: 101-point profile (median wall time)', wall, 'ms', '≤ 500 ms in one worker');
  report('fast: 101-point profile (CPU time per run)', cpuPerRun, 'ms');

  // Direct integrator: time a subset of ions at 11 of the 101 points, then scale by the ions each point needs for
  // a 1σ binomial error of 1e-3 × peak height: N_i = T_i(1 − T_i)/(1e-3·T_peak)².
  const sigmaTarget = 1e-3 * profile.peakTransmission;
  let directMs = 0;
  let ionsTotal = 0;
  let timedIons = 0;
  let timedMs = 0;
  const perIonAt = new Float64Array(101);
  const sampled: number[] = [];
  for (let i = 0; i <= 100; i += 10) sampled.push(i);
  for (const i of sampled) {
    const model = flightModel({ ...settings, mz: profile.mz[i] });
    const ions = sampleIons(model, 60, 1000 + i);
    const t0 = performance.now();
    for (const ion of ions) integrateIon(model.a, model.q, model.cycles, ion);
    const ms = performance.now() - t0;
    perIonAt[i] = ms / ions.length;
    timedIons += ions.length;
    timedMs += ms;
  }
  for (let i = 0; i <= 100; i++) {
    // Per-ion cost between timed points: linear interpolation.
    const lo = Math.floor(i / 10) * 10;
    const hi = Math.min(100, lo + 10);
    const w = hi === lo ? 0 : (i - lo) / (hi - lo);
    const perIon = (1 - w) * perIonAt[lo] + w * perIonAt[hi];
    const t = profile.transmission[i];
    const ions = Math.max(1, (t * (1 - t)) / (sigmaTarget * sigmaTarget));
    ionsTotal += ions;
    directMs += ions * perIon;
  }
  report('direct: timed ions (11 points × 60, RK4 256 steps/period)', timedIons, 'ions');
  report('direct: mean time per ion over the timed subset', timedMs / timedIons, 'ms');
  report('direct: ions needed for 1σ = 1e-3 × peak height', ionsTotal, 'ions');
  report('direct: estimated time for the same profile', directMs / 1000, 's');
  report('ratio direct / fast (wall)', directMs / wall, '×', '≥ 200×');
  console.log('scale reference: > 1e5 ions per mass point (Gibson & Taylor, J. Vac. Sci. Technol. A 18 (2000) 237, from memory)');
}
