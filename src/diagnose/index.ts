/** Public face of Diagnose: trees as data, their structural check, the pure walker, safety cards, leak tools. */
export { trees, treeById } from './trees/index';
export { treeProblems } from './check';
export { SAFETY_CARDS, HAZARD_CARD, DEFERRAL, cardProblems } from './safety';
export { EXPECTATION_INFO, expectations, makeRegistry, rfFormOf, readbackName } from './expectations';
export type { EngineFace, ExpectedValue, ExpectationFn } from './expectations';
export { judge, describeLimits } from './judge';
export * from './walker';
export * from './types';
export { UNITS, convert } from './units';
// Leak check tools live in the engine (pure physics); screens reach them through here.
export {
  leakIndication, rateOfRise, fitOutgassing, airCompositionRatios, airSignalRatios, LEAK_BANDS, DRY_AIR_PERCENT, DRY_AIR_SOURCE,
  gasLoad, expectedPressure,
} from '../engine/leak';
export type { PeakHeights, LeakIndicationResult, RateOfRiseResult, OutgassingFit, PressureSample } from '../engine/leak';
export { ION_GAUGE_SENSITIVITY, ION_GAUGE_SOURCE, ionGaugeTruePressure, type GaugeGas } from '../engine/ionGauge';
