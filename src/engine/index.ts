// Public face of the engine: a plain list of re-exports.
export * from './constants';
export * from './validate';
export { mathieuA, mathieuB } from './characteristicValues';
export {
  stabilityExponent,
  characteristicExponent,
  exponentGrid,
  massFilterGrid,
  MAX_ABS_A_EXPONENT,
  MAX_ABS_Q_EXPONENT,
  type ExponentResult,
  type ExponentGrid,
  type MassFilterGrid,
} from './characteristicExponent';
export {
  firstRegionApex,
  apexRatio,
  rfOnlyEdgeQ,
  firstRegionBoundary,
  firstRegionBoundarySteps,
  characteristicCurves,
  type FirstRegionBoundary,
  type CharacteristicCurves,
} from './stabilityRegions';
export { mathieuParameters, type MathieuParameters } from './mathieuScale';
export {
  operatingPoint,
  passBand,
  passBandDetail,
  exactResolutionAtRatio,
  ratioForExactResolution,
  type OperatingPoint,
  type PassBandDetail,
  type FilterDirection,
} from './operatingPoint';
export * from './scanLaw';
export * from './voltageConventions';
export * from './resolution';
export * from './secularFrequency';
export * from './vacuum';
export * from './ionGauge';
export * from './rods';
export * from './massDrift';
export { transmission, type TransmissionResult, type FastTransmissionOptions } from './transmission';
export {
  peakProfile,
  peakProfileProgressive,
  profileWithin,
  COARSE_PROFILE_OPTIONS,
  peakWidths,
  transmissionVsResolution,
  stableInterval,
  PeakCancelledError,
  type PeakProfile,
  type PeakProfileParams,
  type PeakProfileOptions,
  type ProgressiveProfileOptions,
  type RunControl,
  type TransmissionVsResolution,
  type TransmissionVsResolutionParams,
} from './peakProfile';
export { monteCarloTransmission, integrateIon, sampleIons, type MonteCarloResult, type IonFate, type EntryState } from './trajectoryDirect';
export { flightModel, type BeamSettings, type TransmissionParams, type FlightModel } from './peakInput';
export { seededRandom, type SeededRandom } from './peakRandom';
export * from './leak';
export * from './scanPlanning';
export * from './proportionality';
export * from './hazardousLive';
export * from './isoBeta';
export { leastSquares, type LinearFit } from './linearFit';
