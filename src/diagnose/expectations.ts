/**
 * Expected values by NAME. Tree nodes refer to these names; treeProblems() checks that each name exists.
 *
 * Each entry: function(instrument, inputs) → { value, unit, low?, high?, basis }, inputs in SI.
 * The physics comes from the engine's public face (rfForMass, dcForMass, massForRf, rfOnlyLowMassCutoff, meanFreePath,
 * firstRegionApex) and from engine/leak.ts; nothing here re-derives those formulas. Voltages come back in the
 * selected instrument's read-back convention so that the number can be compared with what the engineer reads.
 */
import { expectedPressure, gasLoad, rateOfRise } from '../engine/leak';
import { rfFormOf, type RfForm } from '../engine/voltageConventions';
import { formatNumber, readbackName } from '../records';
import { engineFace } from './engineLink';
import type { DiagnoseInstrument } from './types';

/** The parts of the engine's public face the registry uses (SI; mz in u/e; V zero-to-peak per rod to ground). */
export interface EngineFace {
  rfForMass(p: { mz: number; r0: number; frequency: number; q?: number }): number;
  dcForMass(p: { mz: number; r0: number; frequency: number; a?: number }): number;
  massForRf(p: { rf: number; r0: number; frequency: number; q?: number }): number;
  rfOnlyLowMassCutoff(p: { rf: number; r0: number; frequency: number }): number;
  meanFreePath(p: { pressure: number; temperature: number; diameter: number }): number;
  scatteringAlongRods(p: { gas: 'air'; pressure: number; temperature: number; rodLength: number }): { meanFreePath: number; unscatteredFraction: number };
  apparentMassShift(p: { mz: number; frequencyChange?: number }): number;
  convertRf(value: number, from: RfForm, to: RfForm): number;
  convertDc(value: number, from: 'perRod' | 'betweenPairs', to: 'perRod' | 'betweenPairs'): number;
  /** Collision diameter of air that reproduces λ[cm] ≈ 5×10⁻³/p[Torr] (engine vacuum presets). */
  airDiameter: number;
}

export interface ExpectedValue {
  value: number;
  /** SI unit (see units.ts), or 'as-entered' for values that carry the node's own unit (set points, baselines). */
  unit: string;
  low?: number;
  high?: number;
  /** How the number was found, in words, with the source. */
  basis: string;
}

export type ExpectationFn = (instrument: DiagnoseInstrument | null, inputs: Record<string, number>) => ExpectedValue;

export interface ExpectationInfo {
  label: string;
  /** SI unit of the result, or 'as-entered'. */
  unit: string;
  /** Input keys the function reads. */
  inputs: string[];
  needsInstrument: boolean;
}

/** Static description of every registry entry: the checker reads this without running any physics. */
export const EXPECTATION_INFO: Record<string, ExpectationInfo> = {
  rfAtMass: { label: 'RF amplitude at a parked m/z', unit: 'V', inputs: ['mz'], needsInstrument: true },
  dcAtMass: { label: 'DC at a parked m/z (apex)', unit: 'V', inputs: ['mz'], needsInstrument: true },
  rfProportional: { label: 'RF scaled from a first parked m/z', unit: 'V', inputs: ['mzFirst', 'rfFirst', 'mz'], needsInstrument: false },
  rfOnlyCutoff: { label: 'RF-only low-mass cut-off', unit: 'u', inputs: ['rf'], needsInstrument: true },
  topMass: { label: 'Highest m/z the RF supply reaches', unit: 'u', inputs: [], needsInstrument: true },
  rfFrequencyNominal: { label: 'RF frequency of this instrument', unit: 'Hz', inputs: [], needsInstrument: true },
  apparentMassShift: { label: 'Apparent m/z shift from the measured frequency', unit: 'u', inputs: ['mz', 'frequency'], needsInstrument: true },
  meanFreePath: { label: 'Mean free path at the pressure read', unit: 'm', inputs: ['pressure', 'temperature', 'diameter'], needsInstrument: true },
  scatteringLoss: { label: 'Share of ions scattered along the rods', unit: '1', inputs: ['pressure', 'temperature'], needsInstrument: true },
  gaugeReadingForCarrier: { label: 'Ion-gauge reading expected from the carrier flow', unit: 'Pa', inputs: ['flow', 'pumpingSpeed', 'relativeSensitivity'], needsInstrument: false },
  truePressureFromGauge: { label: 'True pressure of the carrier gas', unit: 'Pa', inputs: ['reading', 'relativeSensitivity'], needsInstrument: false },
  throughputFromRise: { label: 'Gas throughput from a pressure rise', unit: 'Pa·m³/s', inputs: ['volume', 'interval', 'rise'], needsInstrument: false },
  setPoint: { label: 'The set point', unit: 'as-entered', inputs: ['setPoint'], needsInstrument: false },
  baseline: { label: 'The baseline for this instrument', unit: 'as-entered', inputs: ['baseline'], needsInstrument: false },
  multiplierHeadroom: { label: 'Multiplier voltage still below the end-of-life mark', unit: 'V', inputs: ['supplyMaximum'], needsInstrument: false },
  poissonRsd: { label: 'Counting-statistics limit of the RSD', unit: '1', inputs: ['counts'], needsInstrument: false },
  isotopeMPlus1: { label: 'M+1/M from carbon and nitrogen atoms', unit: '1', inputs: ['carbons', 'nitrogens'], needsInstrument: false },
};

// ---------------------------------------------------------------------------

/** A number for a sentence: the records layer's one formatter, screen style (m×10ⁿ). */
const fmt = (x: number, digits = 4): string => formatNumber(x, digits, 'screen');

function need(instrument: DiagnoseInstrument | null, name: string): DiagnoseInstrument {
  if (!instrument) throw new RangeError(`${name} needs an instrument: pick one to see the expected value`);
  return instrument;
}

function input(inputs: Record<string, number>, key: string, min: number, max: number, unit: string): number {
  const v = inputs[key];
  if (typeof v !== 'number' || !Number.isFinite(v)) throw new RangeError(`${key} must be a number between ${min} and ${max} ${unit}`);
  if (v < min || v > max) throw new RangeError(`${key} must be between ${min} and ${max} ${unit}; got ${v}`);
  return v;
}

const geometry = (i: DiagnoseInstrument) =>
  `r0 ${fmt(i.rodFieldRadius * 1e3)} mm, f ${fmt(i.rfFrequency / 1e6)} MHz`;

/** Build the registry on an engine face. */
export function makeRegistry(engine: EngineFace): Record<string, ExpectationFn> {
  return {
    rfAtMass(instrument, inputs) {
      const i = need(instrument, 'rfAtMass');
      const mz = input(inputs, 'mz', 1, 10000, 'u');
      const v0p = engine.rfForMass({ mz, r0: i.rodFieldRadius, frequency: i.rfFrequency });
      const shown = engine.convertRf(v0p, 'zeroToPeakPerRod', rfFormOf(i.readbackConvention));
      return {
        value: shown,
        unit: 'V',
        basis: `RF for m/z ${fmt(mz)} at the first-region apex (${geometry(i)}): ${fmt(v0p)} V zero-to-peak per rod${shown !== v0p ? `, shown ${readbackName(i.readbackConvention)}` : ''}. Formula q = 4eV/(m r0² Ω²), Dawson 1976.`,
      };
    },
    dcAtMass(instrument, inputs) {
      const i = need(instrument, 'dcAtMass');
      const mz = input(inputs, 'mz', 1, 10000, 'u');
      const u = engine.dcForMass({ mz, r0: i.rodFieldRadius, frequency: i.rfFrequency });
      const pairs = i.readbackConvention.reference === 'between-pairs';
      const shown = pairs ? engine.convertDc(u, 'perRod', 'betweenPairs') : u;
      return {
        value: shown,
        unit: 'V',
        basis: `DC for m/z ${fmt(mz)} at the apex (${geometry(i)}): ${fmt(u)} V per rod to ground${pairs ? `, ${fmt(shown)} V between the rod pairs` : ''}. A resolving scan line sits slightly below the apex. Formula a = 8eU/(m r0² Ω²), Dawson 1976.`,
      };
    },
    rfProportional(_instrument, inputs) {
      const m1 = input(inputs, 'mzFirst', 1, 10000, 'u');
      const v1 = input(inputs, 'rfFirst', 1e-3, 1e5, 'V');
      const m2 = input(inputs, 'mz', 1, 10000, 'u');
      return {
        value: (v1 * m2) / m1,
        unit: 'V',
        basis: `At fixed frequency, r0 and operating line the RF is proportional to m/z: ${fmt(v1)} V × ${fmt(m2)}/${fmt(m1)} (Dawson 1976). Needs no geometry.`,
      };
    },
    rfOnlyCutoff(instrument, inputs) {
      const i = need(instrument, 'rfOnlyCutoff');
      const rfRead = input(inputs, 'rf', 1e-3, 1e5, 'V');
      const v0p = engine.convertRf(rfRead, rfFormOf(i.readbackConvention), 'zeroToPeakPerRod');
      const low = engine.rfOnlyLowMassCutoff({ rf: v0p, r0: i.rodFieldRadius, frequency: i.rfFrequency });
      return {
        value: low,
        unit: 'u',
        basis: `With DC off, ions below the RF-only edge are unstable: read-back ${fmt(rfRead)} V (${readbackName(i.readbackConvention)}) is ${fmt(v0p)} V zero-to-peak per rod; lowest stable m/z ${fmt(low)} (${geometry(i)}; edge q ≈ 0.908, Dawson 1976).`,
      };
    },
    topMass(instrument) {
      const i = need(instrument, 'topMass');
      const m = engine.massForRf({ rf: i.maxRfAmplitude, r0: i.rodFieldRadius, frequency: i.rfFrequency });
      return {
        value: m,
        unit: 'u',
        basis: `The RF supply's maximum ${fmt(i.maxRfAmplitude)} V zero-to-peak per rod reaches m/z ${fmt(m)} at the apex (${geometry(i)}). Errors near the top of the range point to the RF amplifier running out of drive.`,
      };
    },
    rfFrequencyNominal(instrument) {
      const i = need(instrument, 'rfFrequencyNominal');
      return { value: i.rfFrequency, unit: 'Hz', basis: `The RF frequency stored for ${i.name}. Compare with the instrument's baseline if it has one.` };
    },
    apparentMassShift(instrument, inputs) {
      const i = need(instrument, 'apparentMassShift');
      const mz = input(inputs, 'mz', 1, 10000, 'u');
      const f = input(inputs, 'frequency', 1e3, 1e8, 'Hz');
      const change = (f - i.rfFrequency) / i.rfFrequency;
      const shift = engine.apparentMassShift({ mz, frequencyChange: change });
      return {
        value: shift,
        unit: 'u',
        basis: `A frequency change of ${fmt(change * 100, 3)} % from the stored ${fmt(i.rfFrequency / 1e6, 6)} MHz moves m/z ${fmt(mz)} by ${fmt(shift, 3)} u (δm/m ≈ 2δf/f, Dawson 1976).`,
      };
    },
    meanFreePath(instrument, inputs) {
      const i = need(instrument, 'meanFreePath');
      const p = input(inputs, 'pressure', 1e-12, 1e6, 'Pa');
      const t = inputs.temperature === undefined ? 293.15 : input(inputs, 'temperature', 1, 2000, 'K');
      const d = inputs.diameter === undefined ? engine.airDiameter : input(inputs, 'diameter', 1e-11, 1e-8, 'm');
      const lambda = engine.meanFreePath({ pressure: p, temperature: t, diameter: d });
      return {
        value: lambda,
        unit: 'm',
        low: 10 * i.rodLength,
        basis: `Kinetic-theory mean free path λ = k_B·T/(√2·π·d²·p) at ${fmt(p / 100)} mbar, ${fmt(t)} K, d ${fmt(d * 1e10, 2)} Å: ${fmt(lambda)} m, ${fmt(lambda / i.rodLength, 3)} × the rod length (${fmt(i.rodLength * 1e3)} mm). Aim for well over 10 × (common practice).`,
      };
    },
    scatteringLoss(instrument, inputs) {
      const i = need(instrument, 'scatteringLoss');
      const p = input(inputs, 'pressure', 1e-12, 1e6, 'Pa');
      const t = inputs.temperature === undefined ? 293.15 : input(inputs, 'temperature', 1, 2000, 'K');
      const r = engine.scatteringAlongRods({ gas: 'air', pressure: p, temperature: t, rodLength: i.rodLength });
      const loss = 1 - r.unscatteredFraction;
      return {
        value: loss,
        unit: '1',
        basis: `Fraction scattered over the rod length: 1 − exp(−L/λ) with L ${fmt(i.rodLength * 1e3)} mm, λ ${fmt(r.meanFreePath)} m for air (molecule-sized collision partner; large ions scatter more).`,
      };
    },
    gaugeReadingForCarrier(_instrument, inputs) {
      const flow = input(inputs, 'flow', 0, 1e-3, 'm³/s');
      const speed = input(inputs, 'pumpingSpeed', 1e-6, 100, 'm³/s');
      const s = input(inputs, 'relativeSensitivity', 0.05, 10, '');
      const q = gasLoad(flow);
      const pTrue = expectedPressure(q, speed);
      const shown = pTrue * s;
      return {
        value: shown,
        unit: 'Pa',
        low: shown / 3,
        high: shown * 3,
        basis: `Gas load ${fmt(q * 10)} mbar·L/s (flow at 0 °C, 101.325 kPa) over effective speed ${fmt(speed * 1e3)} L/s gives ${fmt(pTrue / 100)} mbar true; an N2-calibrated ion gauge shows × ${fmt(s, 3)} = ${fmt(shown / 100)} mbar (O'Hanlon 2003; CRC Bayard–Alpert sensitivities). Band × 1/3 to × 3 because effective speed is rarely known closely (common practice).`,
      };
    },
    truePressureFromGauge(_instrument, inputs) {
      const reading = input(inputs, 'reading', 0, 1e6, 'Pa');
      const s = input(inputs, 'relativeSensitivity', 0.05, 10, '');
      return {
        value: reading / s,
        unit: 'Pa',
        basis: `An N2-calibrated ion gauge reading ${fmt(reading / 100)} mbar means ${fmt(reading / s / 100)} mbar of a gas with relative sensitivity ${fmt(s, 3)} (CRC Bayard–Alpert table; gauges differ by up to ±15 %).`,
      };
    },
    throughputFromRise(_instrument, inputs) {
      const volume = input(inputs, 'volume', 1e-6, 100, 'm³');
      const interval = input(inputs, 'interval', 1e-3, 1e6, 's');
      const rise = input(inputs, 'rise', 0, 1e6, 'Pa');
      const r = rateOfRise(volume, [{ t: 0, p: 0 }, { t: interval, p: rise }]);
      return {
        value: r.throughput,
        unit: 'Pa·m³/s',
        basis: `Q = V·Δp/Δt = ${fmt(volume * 1e3)} L × ${fmt(rise / 100)} mbar / ${fmt(interval)} s = ${fmt(r.throughput * 10)} mbar·L/s (O'Hanlon 2003). Log more points to judge linear (leak) against levelling (outgassing).`,
      };
    },
    setPoint(_instrument, inputs) {
      const v = input(inputs, 'setPoint', -1e9, 1e9, '');
      return { value: v, unit: 'as-entered', basis: 'The set point you entered.' };
    },
    baseline(_instrument, inputs) {
      const v = input(inputs, 'baseline', -1e9, 1e9, '');
      return { value: v, unit: 'as-entered', basis: 'The baseline you entered (as-installed or last as-left value for this instrument).' };
    },
    multiplierHeadroom(_instrument, inputs) {
      const max = input(inputs, 'supplyMaximum', 100, 10000, 'V');
      return {
        value: 0.9 * max,
        unit: 'V',
        low: 0,
        high: 0.9 * max,
        basis: `A multiplier that needs more than about 90 % of the supply maximum (${fmt(max)} V) is near end of life (common practice).`,
      };
    },
    poissonRsd(_instrument, inputs) {
      const n = input(inputs, 'counts', 1, 1e15, 'counts');
      const rsd = 1 / Math.sqrt(n);
      return { value: rsd, unit: '1', basis: `Counting statistics: RSD = 1/√N = ${fmt(rsd * 100)} % for ${fmt(n)} counts per reading (Knoll 2010).` };
    },
    isotopeMPlus1(_instrument, inputs) {
      const c = input(inputs, 'carbons', 0, 200, 'atoms');
      const nN = input(inputs, 'nitrogens', 0, 50, 'atoms');
      // 13C/12C 0.01082 and 15N/14N 0.00365 (IUPAC isotopic compositions); small terms neglected.
      const r = c * 0.01082 + nN * 0.00365;
      return { value: r, unit: '1', basis: `M+1/M ≈ ${c} × 1.082 % + ${nN} × 0.365 % = ${fmt(r * 100)} % (IUPAC isotopic compositions).` };
    },
  };
}

/** The registry the app uses: name → function(instrument, inputs), bound to the engine's public face. */
export const expectations: Record<string, ExpectationFn> = makeRegistry(engineFace);
