/**
 * Physical constants, CODATA 2018 recommended values (Tiesinga et al., Rev. Mod. Phys. 93,
 * 025010 (2021)), as also carried by the PDG Review of Particle Physics, table "Physical
 * constants". Exact values since the 2019 SI redefinition are marked exact.
 *
 * Internal unit system of Sagitta (see DEVELOPERS.md): lengths in metres, fields in tesla,
 * momenta in GeV/c, energies in MeV for matter and range work; every public function names
 * its unit in the parameter name.
 */

/** Speed of light in vacuum [m/s]. Exact (SI definition). */
export const SPEED_OF_LIGHT_M_S = 299_792_458;

/** Elementary charge [C]. Exact (SI definition). */
export const ELEMENTARY_CHARGE_C = 1.602176634e-19;

/** Avogadro constant [1/mol]. Exact (SI definition). */
export const AVOGADRO_PER_MOL = 6.02214076e23;

/** Electron mass energy m_e c² [MeV]. CODATA 2018: 0.51099895000(15) MeV. */
export const ELECTRON_MASS_MEV = 0.51099895;

/** Electron mass [kg]. CODATA 2018: 9.1093837015(28)e-31 kg. */
export const ELECTRON_MASS_KG = 9.1093837015e-31;

/** Electron charge-to-mass ratio magnitude e/m_e [C/kg]. CODATA 2018: 1.75882001076(53)e11 C/kg. */
export const ELECTRON_CHARGE_TO_MASS_C_KG = 1.75882001076e11;

/** Reduced Planck constant times c [MeV fm]. CODATA 2018: 197.3269804 MeV fm (exact to the digits shown). */
export const HBAR_C_MEV_FM = 197.3269804;

/** Classical electron radius [cm]. CODATA 2018: 2.8179403262(13) fm. */
export const CLASSICAL_ELECTRON_RADIUS_CM = 2.8179403262e-13;

/** Fine-structure constant α. CODATA 2018: 7.2973525693(11)e-3. */
export const FINE_STRUCTURE = 7.2973525693e-3;

/** Vacuum magnetic permeability μ₀ [N/A²]. CODATA 2018: 1.25663706212(19)e-6. */
export const VACUUM_PERMEABILITY_N_A2 = 1.25663706212e-6;

/** Atomic mass constant m_u c² [MeV]. CODATA 2018: 931.49410242(28) MeV. */
export const ATOMIC_MASS_UNIT_MEV = 931.49410242;

/**
 * Momentum–curvature constant: p_T [GeV/c] = K_BR · |z| · B [T] · R [m], with K_BR = c / 1e9
 * [GeV/(c·T·m)]. Follows from F = q v × B and exact c; common practice writes 0.3 or 0.2998.
 */
export const GEV_PER_TESLA_METRE = SPEED_OF_LIGHT_M_S / 1e9;

/**
 * Bethe coefficient K = 4π N_A r_e² m_e c² [MeV mol⁻¹ cm²]. PDG RPP "Passage of particles
 * through matter", Table 34.1: 0.307075 MeV mol⁻¹ cm². Computed here from the constants above
 * (tests check the two agree).
 */
export const BETHE_K_MEV_CM2_PER_MOL =
  4 * Math.PI * AVOGADRO_PER_MOL * CLASSICAL_ELECTRON_RADIUS_CM ** 2 * ELECTRON_MASS_MEV;
