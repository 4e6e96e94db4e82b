// lib/matter: materials, stopping powers, range, straggling (re-exports only).
export * from './kinematics';
export * from './densityEffect';
export * from './radiationLength';
export * from './elements';
export * from './materials';
export * from './bethe';
export * from './electronLoss';
export * from './stoppingPower';
export * from './range';
export * from './mostProbableLoss';
export * from './rangeTableFrame';
