/** Public API of the hazards module: H/P statements, demo hazard data, mixture classification, hazard notes. */
export * from './h-statements';
export * from './hazard-class-names';
export * from './demo-hazard-data';
export * from './mixture-classification';
export * from './hazard-notes';
export * from './evaluate-candidate-hazards';
export { HAZARD_STANDING_CAUTION } from '../schemas/hazards';
export * from './optimiser-hazards';
export * from './incompatibilities';
export * from './formula-hazard-data';
