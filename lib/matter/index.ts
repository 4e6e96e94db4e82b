// lib/matter: materials, stopping powers, range, straggling (re-exports only).
export * from './kinematics.js';
export * from './densityEffect.js';
export * from './radiationLength.js';
export * from './elements.js';
export * from './materials.js';
export * from './bethe.js';
export * from './electronLoss.js';
export * from './stoppingPower.js';
export * from './range.js';
export * from './mostProbableLoss.js';
export * from './rangeTableFrame.js';
export * from './highland.js';
export * from './bohrStraggling.js';
export * from './medium.js';
export * from './chamberMedium.js';
