// lib/beam: everything this room offers the other rooms, by name (the public subset is in lib/index.ts).
export { chargeToMassFromOrbit, type ChargeToMassResult, type OrbitMeasurement } from './chargeToMass.js';
export { cyclotronFrequencyHz } from './cyclotronFrequency.js';
export { completeEllipticE, completeEllipticIntegrals, completeEllipticK } from './ellipticIntegrals.js';
export { fitChargeToMass, type ChargeToMassFit, type ChargeToMassFitOptions, type ChargeToMassPoint } from './fitChargeToMass.js';
export { helmholtzCentreFieldT, helmholtzField, orbitFieldUniformity, type CoilPair, type OrbitFieldUniformity } from './helmholtzField.js';
export { ELECTRON_MASS_U, ISOTOPES, identifyIsotope, isotope, type Isotope, type IsotopeMatch } from './isotopes.js';
export { ATOMIC_MASS_CONSTANT_KG, massToChargeFromSector, massToChargeInU, sectorRadiusM } from './magneticSector.js';
export { plateDeflection, type PlateDeflection } from './plateDeflection.js';
export { magneticRigidityTm, rigidityFromKineticTm } from './rigidity.js';
export { selectedSpeedMPerS } from './velocitySelector.js';
