/**
 * The evaluation core (DEVELOPERS.md, "The evaluation core"): the one path from conditions (a
 * brief's, a lab test's, the bench's), lines, chemistry, calibrations and parameters to the model
 * run, its figures against a brief and the hazard inputs.
 */
export * from './components';
export * from './chemistry-cache';
export * from './evaluate';
export * from './heat-exchange';
export * from './verify';
export * from './hazards';
export { evaluateMixture } from './evaluate-mixture';
export * from './resolve-mixture';
export * from './load';
