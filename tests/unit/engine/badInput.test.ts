// Every public engine function rejects bad input with an InputRangeError naming the field, its value and
// the accepted range; and none returns NaN for accepted input.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import * as engine from '../../../src/engine/index';
import { InputRangeError } from '../../../src/engine/index';

type Call = (args: Record<string, unknown>) => unknown;
interface Case {
  name: string;
  call: Call;
  valid: Record<string, unknown>;
  bad: Record<string, unknown[]>;
}

const NON_FINITE = [NaN, Infinity, -Infinity, undefined, '1', null];
const POSITIVE = [...NON_FINITE, 0, -1];
const geometry = { r0: 4e-3, frequency: 1e6 };
const line = { slope: 0.1678, offset: 0 };

const beam = { mz: 500, r0: 4e-3, frequency: 1e6, dc: 0, rf: 300, rodLength: 0.2, axialVoltage: 5, beamRadius: 4e-4, transverseEnergy: 0.2 };
const pressureSeries = [{ t: 10, p: 1e-3 }, { t: 20, p: 6e-4 }, { t: 40, p: 4e-4 }, { t: 80, p: 3e-4 }];

const cases: Case[] = [
  { name: 'mathieuA', call: (p) => engine.mathieuA(p.order as number, p.q as number), valid: { order: 2, q: 1 }, bad: { order: [...NON_FINITE, -1, 0.5, 201], q: [...NON_FINITE, 1e6, -1e6] } },
  { name: 'mathieuB', call: (p) => engine.mathieuB(p.order as number, p.q as number), valid: { order: 2, q: 1 }, bad: { order: [...NON_FINITE, 0, 1.5], q: NON_FINITE } },
  { name: 'stabilityExponent', call: (p) => engine.stabilityExponent(p.a as number, p.q as number), valid: { a: 0.1, q: 0.5 }, bad: { a: [...NON_FINITE, 2000], q: [...NON_FINITE, -2000] } },
  { name: 'characteristicExponent', call: (p) => engine.characteristicExponent(p.a as number, p.q as number), valid: { a: 0.1, q: 0.5 }, bad: { a: NON_FINITE, q: NON_FINITE } },
  {
    name: 'exponentGrid',
    call: (p) => engine.exponentGrid(p as never),
    valid: { aMin: 0, aMax: 0.3, aCount: 3, qMin: 0, qMax: 1, qCount: 3 },
    bad: { aMin: NON_FINITE, aMax: [...NON_FINITE, -1], aCount: [...NON_FINITE, 0, 2.5, 5000], qMin: NON_FINITE, qMax: [...NON_FINITE, -1], qCount: [0, 1.5] },
  },
  {
    name: 'massFilterGrid',
    call: (p) => engine.massFilterGrid(p as never),
    valid: { aMin: -0.3, aMax: 0.3, aCount: 3, qMin: 0, qMax: 1, qCount: 3 },
    bad: { aMin: NON_FINITE, aMax: [...NON_FINITE, -1], aCount: [...NON_FINITE, 0], qMin: NON_FINITE, qCount: [0, 1.5, 1e5] },
  },
  { name: 'firstRegionBoundary', call: (p) => engine.firstRegionBoundary(p.points as number), valid: { points: 10 }, bad: { points: [NaN, Infinity, 2, 10.5, -5, '10'] } },
  {
    // A generator checks its input on the first step.
    name: 'firstRegionBoundarySteps',
    call: (p) => engine.firstRegionBoundarySteps(p.points as number, p.perStep as number).next(),
    valid: { points: 10, perStep: 4 },
    bad: { points: [NaN, Infinity, 2, 10.5, -5, '10'], perStep: [NaN, 0, 1.5, -1, '4'] },
  },
  {
    name: 'characteristicCurves',
    call: (p) => engine.characteristicCurves(p as never),
    valid: { qMax: 5, points: 5, maxOrder: 2 },
    bad: { qMax: [...NON_FINITE, -1], points: [...NON_FINITE, 1, 2.5], maxOrder: [...NON_FINITE, -1, 51, 1.5], qMin: [NaN, Infinity, 2e4] },
  },
  {
    name: 'mathieuParameters',
    call: (p) => engine.mathieuParameters(p as never),
    valid: { mz: 100, ...geometry, dc: 10, rf: 100 },
    bad: { mz: POSITIVE, r0: [...POSITIVE, 5], frequency: [...POSITIVE, 1e10], dc: [...NON_FINITE, 1e7], rf: [...NON_FINITE, -1] },
  },
  {
    name: 'operatingPoint',
    call: (p) => engine.operatingPoint(p as never),
    valid: { mz: 100, ...geometry, dc: 10, rf: 100 },
    bad: { mz: [...POSITIVE, 1e-9], r0: POSITIVE, frequency: POSITIVE, dc: [...NON_FINITE, -1e7], rf: [...NON_FINITE, -5] },
  },
  {
    name: 'passBand',
    call: (p) => engine.passBand(p as never),
    valid: { dc: 10, rf: 100, ...geometry },
    bad: { dc: NON_FINITE, rf: [...POSITIVE], r0: POSITIVE, frequency: POSITIVE },
  },
  { name: 'passBandDetail', call: (p) => engine.passBandDetail(p as never), valid: { dc: 10, rf: 100, ...geometry }, bad: { dc: NON_FINITE, rf: POSITIVE } },
  { name: 'exactResolutionAtRatio', call: (p) => engine.exactResolutionAtRatio(p.ratio as number), valid: { ratio: 0.16 }, bad: { ratio: [...NON_FINITE, -0.1] } },
  { name: 'ratioForExactResolution', call: (p) => engine.ratioForExactResolution(p.resolution as number), valid: { resolution: 100 }, bad: { resolution: [...NON_FINITE, 0.4, 0, -1, 1e10] } },
  { name: 'rfForMass', call: (p) => engine.rfForMass(p as never), valid: { mz: 100, ...geometry }, bad: { mz: POSITIVE, r0: POSITIVE, frequency: POSITIVE, q: [NaN, Infinity, 0, -0.5] } },
  { name: 'dcForMass', call: (p) => engine.dcForMass(p as never), valid: { mz: 100, ...geometry }, bad: { mz: POSITIVE, r0: POSITIVE, frequency: POSITIVE, a: [NaN, Infinity, 5000] } },
  { name: 'massForRf', call: (p) => engine.massForRf(p as never), valid: { rf: 100, ...geometry }, bad: { rf: POSITIVE, r0: POSITIVE, frequency: POSITIVE, q: [NaN, 0, -1] } },
  { name: 'rfOnlyLowMassCutoff', call: (p) => engine.rfOnlyLowMassCutoff(p as never), valid: { rf: 100, ...geometry }, bad: { rf: POSITIVE, r0: POSITIVE, frequency: POSITIVE } },
  { name: 'massRangeTop', call: (p) => engine.massRangeTop(p as never), valid: { maxRf: 3000, ...geometry }, bad: { maxRf: POSITIVE, r0: POSITIVE, frequency: POSITIVE, q: [NaN, 0] } },
  { name: 'constantResolutionScanLine', call: (p) => engine.constantResolutionScanLine(p.resolution as number), valid: { resolution: 500 }, bad: { resolution: [...NON_FINITE, 0.1] } },
  {
    name: 'constantWidthScanLine',
    call: (p) => engine.constantWidthScanLine(p as never),
    valid: { width: 0.7, referenceMz: 500, ...geometry },
    bad: { width: [...POSITIVE, 600], referenceMz: POSITIVE, r0: POSITIVE, frequency: POSITIVE },
  },
  {
    name: 'scanPoint',
    call: (p) => engine.scanPoint({ line: { slope: p.slope, offset: p.offset }, mz: p.mz, r0: p.r0, frequency: p.frequency } as never),
    valid: { ...line, mz: 100, ...geometry },
    bad: { slope: [...NON_FINITE, -0.1, 1], offset: NON_FINITE, mz: POSITIVE, r0: POSITIVE, frequency: POSITIVE },
  },
  {
    name: 'massForScanRf',
    call: (p) => engine.massForScanRf({ line: { slope: p.slope, offset: p.offset }, rf: p.rf, r0: p.r0, frequency: p.frequency } as never),
    valid: { ...line, rf: 100, ...geometry },
    bad: { slope: NON_FINITE, offset: NON_FINITE, rf: POSITIVE, r0: POSITIVE, frequency: POSITIVE },
  },
  {
    name: 'convertRf',
    call: (p) => engine.convertRf(p.value as number, p.from as never, p.to as never),
    valid: { value: 100, from: 'rmsPerRod', to: 'peakToPeakBetweenPairs' },
    bad: { value: [...NON_FINITE, -1], from: ['vpp', undefined, 3], to: ['rms', null] },
  },
  {
    name: 'convertDc',
    call: (p) => engine.convertDc(p.value as number, p.from as never, p.to as never),
    valid: { value: -10, from: 'perRod', to: 'betweenPairs' },
    bad: { value: NON_FINITE, from: ['pole'], to: [undefined] },
  },
  {
    name: 'rfFormOf',
    call: (p) => engine.rfFormOf({ amplitude: p.amplitude, reference: p.reference } as never),
    valid: { amplitude: 'rms', reference: 'between-pairs' },
    bad: { amplitude: ['rms-ish', undefined, 3], reference: ['pairs', null] },
  },
  {
    name: 'dcFormOf',
    call: (p) => engine.dcFormOf({ reference: p.reference } as never),
    valid: { reference: 'per-rod' },
    bad: { reference: ['rod', undefined] },
  },
  {
    name: 'rfCycles',
    call: (p) => engine.rfCycles(p as never),
    valid: { mz: 100, rodLength: 0.2, frequency: 1e6, axialEnergy: 5 },
    bad: { mz: POSITIVE, rodLength: [...POSITIVE, 100], frequency: POSITIVE, axialEnergy: POSITIVE },
  },
  { name: 'axialSpeed', call: (p) => engine.axialSpeed(p as never), valid: { mz: 100, axialEnergy: 5 }, bad: { mz: POSITIVE, axialEnergy: POSITIVE } },
  {
    name: 'cycleLimitedResolution',
    call: (p) => engine.cycleLimitedResolution(p as never),
    valid: { mz: 100, rodLength: 0.2, frequency: 1e6, axialEnergy: 5, k: 'paul1958' },
    bad: { k: ['12.25', 12.25], mz: POSITIVE, axialEnergy: POSITIVE },
  },
  {
    name: 'maxAxialEnergy',
    call: (p) => engine.maxAxialEnergy(p as never),
    valid: { width: 1, rodLength: 0.2, frequency: 1e6 },
    bad: { width: POSITIVE, rodLength: POSITIVE, frequency: POSITIVE, k: ['other'] },
  },
  { name: 'resolutionAtRatio', call: (p) => engine.resolutionAtRatio(p.ratio as number), valid: { ratio: 0.1 }, bad: { ratio: [...NON_FINITE, -1, 11] } },
  { name: 'ratioForResolution', call: (p) => engine.ratioForResolution(p.resolution as number), valid: { resolution: 1000 }, bad: { resolution: [...NON_FINITE, 0.2] } },
  { name: 'secularFrequency', call: (p) => engine.secularFrequency(p.beta as number, p.frequency as number), valid: { beta: 0.5, frequency: 1e6 }, bad: { beta: [...NON_FINITE, -0.1], frequency: POSITIVE } },
  {
    name: 'secularFrequencies',
    call: (p) => engine.secularFrequencies(p as never),
    valid: { mz: 100, ...geometry, dc: 10, rf: 100 },
    bad: { mz: POSITIVE, r0: POSITIVE, frequency: POSITIVE, dc: NON_FINITE, rf: [...NON_FINITE, -1] },
  },
  {
    name: 'convertPressure',
    call: (p) => engine.convertPressure(p.value as number, p.from as never, p.to as never),
    valid: { value: 1e-5, from: 'mbar', to: 'Torr' },
    bad: { value: [...NON_FINITE, -1e-5], from: ['psi', 'torr'], to: ['bar'] },
  },
  {
    name: 'meanFreePath',
    call: (p) => engine.meanFreePath(p as never),
    valid: { pressure: 1e-3, temperature: 293, diameter: 3.7e-10 },
    bad: { pressure: POSITIVE, temperature: POSITIVE, diameter: [...POSITIVE, 1] },
  },
  {
    name: 'ionMeanFreePath',
    call: (p) => engine.ionMeanFreePath(p as never),
    valid: { pressure: 1e-3, temperature: 293, crossSection: 5e-19 },
    bad: { pressure: POSITIVE, temperature: POSITIVE, crossSection: [...POSITIVE, 1] },
  },
  {
    name: 'meanFreePathForGas',
    call: (p) => engine.meanFreePathForGas(p as never),
    valid: { gas: 'He', pressure: 1e-3, temperature: 293 },
    bad: { gas: ['helium', undefined], pressure: POSITIVE, temperature: POSITIVE },
  },
  { name: 'unscatteredFraction', call: (p) => engine.unscatteredFraction(p as never), valid: { pathLength: 0.2, meanFreePath: 5 }, bad: { pathLength: [...NON_FINITE, -1], meanFreePath: POSITIVE } },
  {
    name: 'scatteringAlongRods',
    call: (p) => engine.scatteringAlongRods(p as never),
    valid: { gas: 'air', pressure: 1e-3, temperature: 293, rodLength: 0.2 },
    bad: { gas: ['vacuum'], pressure: POSITIVE, temperature: POSITIVE, rodLength: POSITIVE },
  },
  { name: 'ionGaugeTruePressure', call: (p) => engine.ionGaugeTruePressure(p as never), valid: { indicated: 1e-5, gas: 'He' }, bad: { indicated: [...NON_FINITE, -1], gas: ['Xe', null] } },
  { name: 'ionGaugeIndicated', call: (p) => engine.ionGaugeIndicated(p as never), valid: { truePressure: 1e-5, gas: 'Ar' }, bad: { truePressure: [...NON_FINITE, -1], gas: ['argon'] } },
  { name: 'roundRodRadius', call: (p) => engine.roundRodRadius(p as never), valid: { r0: 4e-3, choice: 'noDodecapole' }, bad: { r0: POSITIVE, choice: ['hyperbolic', 1.13] } },
  { name: 'fieldRadiusForRods', call: (p) => engine.fieldRadiusForRods(p as never), valid: { rodRadius: 4.5e-3 }, bad: { rodRadius: POSITIVE, choice: ['x'] } },
  {
    name: 'apparentMassShift',
    call: (p) => engine.apparentMassShift(p as never),
    valid: { mz: 1000, frequencyChange: 1e-4, r0Change: 0, rfChange: 0 },
    bad: { mz: POSITIVE, frequencyChange: [NaN, Infinity, 1], r0Change: [NaN, -1], rfChange: [Infinity] },
  },
  // Bench additions: scan planning, proportionality check, hazardous-live levels.
  {
    name: 'scanPlan',
    call: (p) => engine.scanPlan(p as never),
    valid: { mzStart: 50, mzEnd: 550, step: 0.1, dwell: 0.002, scans: 4, settle: 0, countRate: 1000 },
    bad: { mzStart: POSITIVE, mzEnd: [...NON_FINITE, 10], step: POSITIVE, dwell: POSITIVE, scans: [...NON_FINITE, 0, 2.5], settle: [NaN, -1, '0'], countRate: [NaN, 0, -5] },
  },
  { name: 'scansForGain', call: (p) => engine.scansForGain(p.gain as number), valid: { gain: 3 }, bad: { gain: [...NON_FINITE, 0.5, 1e5] } },
  {
    name: 'proportionalityCheck',
    call: (p) => engine.proportionalityCheck(p.readings as never),
    valid: { readings: [{ mz: 69, rf: 100.9 }, { mz: 502, rf: 734.1 }] },
    bad: {
      readings: [null, [], [{ mz: 69, rf: 100 }], [{ mz: -1, rf: 1 }, { mz: 2, rf: 2 }], [{ mz: 69, rf: 100 }, { mz: 219, rf: NaN }], [{ mz: 69, rf: 100 }, { mz: 69, rf: 120 }]],
    },
  },
  {
    name: 'isoBetaCurve',
    call: (p) => engine.isoBetaCurve(p as never),
    valid: { beta: 0.5, direction: 'x', q: [0, 0.5] },
    bad: { beta: [...NON_FINITE, 0, 1], direction: ['z', undefined], q: [null, [], [NaN], [-0.1], [6], 'q'] },
  },
  { name: 'massError', call: (p) => engine.massError(p as never), valid: { setMz: 500, passedMz: 500.1 }, bad: { setMz: POSITIVE, passedMz: POSITIVE } },
  { name: 'hazardousLive', call: (p) => engine.hazardousLive(p as never), valid: { dc: 16.9, rf: 100.9, location: 'dry' }, bad: { dc: [NaN, Infinity, '1', null], rf: [NaN, -1, '1'], location: ['damp', 1] } },
  {
    name: 'exceedsHazardousLevel',
    call: (p) => engine.exceedsHazardousLevel(p as never),
    valid: { volts: 50, kind: 'peak', location: 'wet' },
    bad: { volts: NON_FINITE, kind: ['p-p', undefined], location: ['outdoors'] },
  },
  // Leak check tools (src/engine/leak.ts).
  { name: 'airRatio', call: (p) => engine.airRatio(p.numeratorPercent as number, p.denominatorPercent as number), valid: { numeratorPercent: 78.084, denominatorPercent: 20.946 }, bad: { numeratorPercent: [...POSITIVE, 101], denominatorPercent: [...POSITIVE, 101] } },
  { name: 'leakIndication', call: (p) => engine.leakIndication(p as never), valid: { m18: 100, m28: 400, m32: 100, m40: 6, m44: 2 }, bad: { m28: [...NON_FINITE.filter((v) => v !== undefined), -1], m32: [NaN, -1, Infinity], m18: [NaN, -1] } },
  { name: 'rateOfRise', call: (p) => engine.rateOfRise(p.volume as number, p.samples as never), valid: { volume: 0.01, samples: pressureSeries }, bad: { volume: POSITIVE, samples: [[], [pressureSeries[0]], 'x', [{ t: NaN, p: 1 }, { t: 1, p: 1 }, { t: 2, p: 1 }]] } },
  { name: 'fitOutgassing', call: (p) => engine.fitOutgassing(p.samples as never), valid: { samples: pressureSeries }, bad: { samples: [[], [pressureSeries[0]], null, [{ t: -1, p: 1 }, { t: 1, p: 1 }, { t: 2, p: 1 }]] } },
  { name: 'gasLoad', call: (p) => engine.gasLoad(p.standardFlow as number), valid: { standardFlow: 1e-6 / 60 }, bad: { standardFlow: [NaN, Infinity, -1, '1', null] } },
  { name: 'expectedPressure', call: (p) => engine.expectedPressure(p.throughput as number, p.pumpingSpeed as number), valid: { throughput: 1e-3, pumpingSpeed: 0.2 }, bad: { throughput: [NaN, -1, Infinity], pumpingSpeed: POSITIVE } },
  // Peak simulation (transmission*, peak*, trajectory*).
  { name: 'transmission', call: (p) => engine.transmission(p as never), valid: beam, bad: { mz: POSITIVE, r0: POSITIVE, frequency: POSITIVE, rf: [...NON_FINITE, -1], rodLength: POSITIVE, axialVoltage: POSITIVE, beamRadius: [NaN, -1, Infinity], transverseEnergy: [NaN, -1, Infinity] } },
  { name: 'flightModel', call: (p) => engine.flightModel(p as never), valid: beam, bad: { mz: POSITIVE, rodLength: POSITIVE, axialVoltage: POSITIVE, beamRadius: [NaN, -1] } },
  { name: 'monteCarloTransmission', call: (p) => engine.monteCarloTransmission(p as never, { ions: 20, seed: 1 } as never), valid: beam, bad: { mz: POSITIVE, r0: POSITIVE, rodLength: POSITIVE } },
  {
    name: 'peakProfile',
    call: (p) => engine.peakProfile(p as never),
    valid: { ...beam, mzFrom: 499, mzTo: 501, points: 5 },
    bad: { mzFrom: [...NON_FINITE, -1], mzTo: [NaN, 498], points: [NaN, 1, 2.5, -3], r0: POSITIVE, rodLength: POSITIVE, axialVoltage: POSITIVE },
  },
  {
    name: 'peakProfileProgressive',
    call: (p) => engine.peakProfileProgressive(p as never, { onCoarse: () => undefined }),
    valid: { ...beam, mzFrom: 499, mzTo: 501, points: 5 },
    bad: { mzFrom: [...NON_FINITE, -1], mzTo: [NaN, 498], points: [NaN, 1, 2.5, -3], r0: POSITIVE, rodLength: POSITIVE, axialVoltage: POSITIVE },
  },
  {
    name: 'profileWithin',
    call: (p) => engine.profileWithin(p.profile as never, p.relative as number),
    valid: { profile: { errorBound: [1e-4, 2e-4], peakTransmission: 0.05 }, relative: 0.01 },
    bad: { profile: [null, undefined, 3, { errorBound: null, peakTransmission: 0.05 }, { errorBound: [1e-4], peakTransmission: NaN }], relative: POSITIVE },
  },
  { name: 'leastSquares', call: (p) => engine.leastSquares(p.xs as number[], p.ys as number[]), valid: { xs: [0, 1, 2], ys: [1, 2, 4] }, bad: { xs: [null, [0, NaN, 2], [0, Infinity, 2], [0, '1', 2]], ys: [undefined, [1, NaN, 4]] } },
  { name: 'seededRandom', call: (p) => engine.seededRandom(p.seed as number), valid: { seed: 42 }, bad: { seed: [NaN, Infinity, '1', null, 1.5] } },
  { name: 'peakWidths', call: (p) => engine.peakWidths(p.mz as never, p.transmission as never), valid: { mz: [1, 2, 3], transmission: [0, 1, 0] }, bad: { mz: [[], [1], null, [1, NaN, 3], [3, 2, 1]], transmission: [[0, 1], null, [0, -1, 0], [0, NaN, 0]] } },
  { name: 'stableInterval', call: (p) => engine.stableInterval(p as never, p.inside as number), valid: { ...beam, rf: 577, dc: 96, inside: 500 }, bad: { r0: POSITIVE, frequency: POSITIVE, rf: [NaN, -1], dc: [NaN, Infinity], inside: POSITIVE } },
  { name: 'sampleIons', call: (p) => engine.sampleIons(p.model as never, p.count as number, p.seed as number), valid: { model: { a: 0.2, q: 0.7, cycles: 10, beamRadius: 0.1, slopeSigma: 0.01 }, count: 3, seed: 1 }, bad: { count: [NaN, -1, 1.5], seed: [NaN, 1.5], model: [null] } },
  { name: 'integrateIon', call: (p) => engine.integrateIon(p.a as number, p.q as number, p.cycles as number, p.ion as never), valid: { a: 0.2, q: 0.7, cycles: 5, ion: { phase: 0, x: 0.1, slopeX: 0, y: 0.1, slopeY: 0 } }, bad: { a: [NaN, Infinity], q: [NaN], cycles: POSITIVE, ion: [null] } },
  { name: 'transmissionVsResolution', call: (p) => engine.transmissionVsResolution(p as never), valid: { mz: 100, r0: 4e-3, frequency: 1e6, rodLength: 0.2, axialVoltage: 10, beamRadius: 4e-4, transverseEnergy: 0.2, ratios: [0.16], points: 5 }, bad: { mz: POSITIVE, qOperating: [NaN, -1, 2], points: [NaN, 1, 2.5], ratios: [[], [NaN]], rodLength: POSITIVE } },
];

describe('bad input: every public function', () => {
  for (const c of cases) {
    it(`${c.name}: valid input accepted, each bad field rejected with InputRangeError naming it`, () => {
      expect(() => c.call(c.valid), `${c.name} valid`).not.toThrow();
      for (const [field, values] of Object.entries(c.bad)) {
        for (const value of values) {
          let caught: unknown = null;
          try {
            c.call({ ...c.valid, [field]: value });
          } catch (error) {
            caught = error;
          }
          expect(caught, `${c.name}: ${field} = ${String(value)} should be rejected`).toBeInstanceOf(InputRangeError);
          const error = caught as InputRangeError;
          // A field may carry a description or a path after its name, e.g. "m28 (height at m/z 28)", "samples.length".
          expect(error.field.split(/[ .[]/)[0], `${c.name}: ${field} = ${String(value)}`).toBe(field);
          expect(error.range.length).toBeGreaterThan(0);
          expect(error.message).toContain(field);
        }
      }
    });
  }
  it('every exported function is covered above (or takes no input)', () => {
    const noInput = new Set(['firstRegionApex', 'apexRatio', 'rfOnlyEdgeQ', 'apexScanLine', 'apexResolutionConstant']);
    const validationHelpers = new Set(['checkNumber', 'checkPositive', 'checkChoice', 'InputRangeError', 'PeakCancelledError']);
    // Take no input of their own (fixed reference values).
    for (const n of ['airCompositionRatios', 'airSignalRatios']) noInput.add(n);
    const covered = new Set(cases.map((c) => c.name));
    const missing = Object.entries(engine)
      .filter(([name, value]) => typeof value === 'function' && !noInput.has(name) && !validationHelpers.has(name))
      .map(([name]) => name)
      .filter((name) => !covered.has(name));
    expect(missing).toEqual([]);
  });
  it('called with no argument object at all: InputRangeError, not a TypeError', () => {
    for (const fn of [engine.operatingPoint, engine.passBand, engine.rfForMass, engine.meanFreePath, engine.exponentGrid]) {
      expect(() => (fn as (x?: unknown) => unknown)()).toThrow(InputRangeError);
    }
  });
  it('the message names the field, the value and the accepted range', () => {
    expect(() => engine.meanFreePath({ pressure: -2, temperature: 293, diameter: 3e-10 })).toThrow(
      'pressure = -2 is out of range; accepted: finite number > 0 Pa and ≤ 10000000 Pa',
    );
  });
});

describe('no NaN for accepted input (fast-check over the whole accepted ranges)', () => {
  const finiteOrNull = (v: unknown): boolean =>
    v === null || v === Infinity || (typeof v === 'number' && Number.isFinite(v)) || typeof v === 'string' || typeof v === 'boolean' ||
    (Array.isArray(v) && v.every(finiteOrNull)) ||
    (typeof v === 'object' && v !== null && Object.values(v).every(finiteOrNull));
  it('operatingPoint, passBandDetail, scanPoint, massForScanRf', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.5, max: 1e4, noNaN: true }),
        fc.double({ min: 1e-3, max: 2e-2, noNaN: true }),
        fc.double({ min: 1e5, max: 1e7, noNaN: true }),
        fc.double({ min: -2000, max: 2000, noNaN: true }),
        fc.double({ min: 0.01, max: 1e4, noNaN: true }),
        fc.double({ min: 0, max: 0.3, noNaN: true }),
        fc.double({ min: -50, max: 50, noNaN: true }),
        (mz, r0, frequency, dc, rf, slope, offset) => {
          const results: unknown[] = [];
          try {
            results.push(engine.operatingPoint({ mz, r0, frequency, dc, rf }));
          } catch (error) {
            if (!(error instanceof InputRangeError)) throw error;
          }
          results.push(engine.passBandDetail({ dc, rf, r0, frequency }));
          results.push(engine.scanPoint({ line: { slope, offset }, mz, r0, frequency }));
          results.push(engine.massForScanRf({ line: { slope, offset }, rf, r0, frequency }));
          return results.every(finiteOrNull);
        },
      ),
      { numRuns: 300 },
    );
  });
});
