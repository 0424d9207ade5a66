/** Public face of Diagnose: trees as data, their structural check, the pure walker, safety cards. */
export { trees, treeById } from './trees/index';
export { treeProblems } from './check';
export { SAFETY_CARDS, HAZARD_CARD, DEFERRAL, cardProblems } from './safety';
export { EXPECTATION_INFO, expectations, makeRegistry } from './expectations';
export type { EngineFace, ExpectedValue, ExpectationFn } from './expectations';
export { judge, describeLimits } from './judge';
export * from './walker';
export * from './types';
