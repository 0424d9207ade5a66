// Public face of the engine: a plain list of re-exports.
export * from './constants';
export * from './validate';
export { mathieuA, mathieuB } from './characteristicValues';
export * from './characteristicExponent';
export { transmission, type TransmissionResult, type FastTransmissionOptions } from './transmission';
export {
  peakProfile,
  peakWidths,
  transmissionVsResolution,
  stableInterval,
  PeakCancelledError,
  type PeakProfile,
  type PeakProfileParams,
  type PeakProfileOptions,
  type RunControl,
  type TransmissionVsResolution,
  type TransmissionVsResolutionParams,
} from './peakProfile';
export { monteCarloTransmission, integrateIon, sampleIons, type MonteCarloResult, type IonFate, type EntryState } from './trajectoryDirect';
export { flightModel, type BeamSettings, type TransmissionParams, type FlightModel } from './peakInput';
export { seededRandom, type SeededRandom } from './peakRandom';
