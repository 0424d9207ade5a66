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
// Added with the bench screens (scan planning, proportionality check, hazardous-live levels).
export * from './scanPlanning';
export * from './proportionality';
export * from './hazardousLive';
