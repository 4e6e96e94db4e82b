// lib/beam: beam-tube and spectrometer measurements — e/m, Helmholtz fields, m/q, isotopes, selectors (re-exports only).
export { chargeToMassFromOrbit, type ChargeToMassResult, type OrbitMeasurement } from './chargeToMass.js';
export { fitChargeToMass, type ChargeToMassPoint, type ChargeToMassFitOptions, type ChargeToMassFit } from './fitChargeToMass.js';
export { completeEllipticIntegrals, completeEllipticK, completeEllipticE } from './ellipticIntegrals.js';
export { helmholtzCentreFieldT, helmholtzField, orbitFieldUniformity, type CoilPair, type OrbitFieldUniformity } from './helmholtzField.js';
export { massToChargeFromSector, massToChargeInU, sectorRadiusM, ATOMIC_MASS_CONSTANT_KG } from './magneticSector.js';
export { ISOTOPES, ELECTRON_MASS_U, identifyIsotope, isotope, type Isotope, type IsotopeMatch } from './isotopes.js';
export { selectedSpeedMPerS } from './velocitySelector.js';
export { magneticRigidityTm, rigidityFromKineticTm } from './rigidity.js';
export { cyclotronFrequencyHz } from './cyclotronFrequency.js';
export { plateDeflection, type PlateDeflection } from './plateDeflection.js';
