// Public face of the engine: a plain list of re-exports.
export * from './constants';
export * from './validate';
export { mathieuA, mathieuB } from './characteristicValues';
export * from './characteristicExponent';
