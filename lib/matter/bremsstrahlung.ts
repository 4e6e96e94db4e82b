import { FINE_STRUCTURE } from '../constants.js';

/**
 * Scaled radiative stopping cross section of an electron of total energy E [MeV] on an atom
 * of atomic number Z, φ_rad = (1/(α r_e² Z²)) · (1/E) ∫₀^T k dσ/dk dk (dimensionless), from the
 * Bethe–Heitler cross section with the Thomas–Fermi screening of Y.S. Tsai, Rev. Mod. Phys. 46
 * (1974) 815, eqs. 3.9 and 3.38–3.41 (as summarised in the PDG RPP, "Passage of particles
 * through matter"; fit constants recalled, (memory)):
 *
 *   dσ/dk = (α r_e²/k) { (4/3 − 4/3 y + y²) [Z²(φ₁(γ) − 4/3 ln Z − 4f) + Z(ψ₁(ε) − 8/3 ln Z)]
 *                        + (2/3)(1 − y) [Z²(φ₁ − φ₂) + Z(ψ₁ − ψ₂)] },   y = k/E,
 *   γ = 100 m_e k/(E E′ Z^{1/3}),  ε = 100 m_e k/(E E′ Z^{2/3}),  E′ = E − k,
 *   φ₁ = 20.863 − 2 ln(1 + (0.55846γ)²) − 4(1 − 0.6 e^{−0.9γ} − 0.4 e^{−1.5γ}),  φ₂ = φ₁ − (2/3)/(1 + 6.5γ + 6γ²),
 *   ψ₁ = 28.340 − 2 ln(1 + (3.621ε)²) − 4(1 − 0.7 e^{−8ε} − 0.3 e^{−29.2ε}),      ψ₂ = ψ₁ − (2/3)/(1 + 40ε + 400ε²),
 *
 * f(Z) the Coulomb correction (radiationLength.ts); for Z ≤ 4 the complete-screening limits are
 * set to Tsai's tabulated L_rad, L′_rad. This is the high-energy (E ≫ m_e c²) Born form; below a
 * few MeV it is joined to the non-relativistic Born limit φ_rad → 16/3 by taking the larger of
 * the two (the dip of the exact values to ≈ 4.6 near 0.2 MeV is not reproduced: see README).
 * Integrated over y with 24-point Gauss–Legendre in y on (0, 1).
 */
const LOW_Z: Readonly<Record<number, readonly [number, number]>> = { 1: [5.31, 6.144], 2: [4.79, 5.621], 3: [4.74, 5.805], 4: [4.71, 5.924] };

function coulombCorrection(z: number): number {
  const a2 = (FINE_STRUCTURE * z) ** 2;
  return a2 * (1 / (1 + a2) + 0.20206 - 0.0369 * a2 + 0.0083 * a2 * a2 - 0.002 * a2 * a2 * a2);
}

// 24-point Gauss–Legendre on (−1, 1), positive half (symmetric).
const GL_X = [0.0640568928626056, 0.1911188674736163, 0.3150426796961634, 0.4337935076260451, 0.5454214713888395, 0.6480936519369755, 0.7401241915785544, 0.8200019859739029, 0.8864155270044011, 0.9382745520027328, 0.9747285559713095, 0.9951872199970213];
const GL_W = [0.1279381953467522, 0.1258374563468283, 0.1216704729278034, 0.1155056680537256, 0.1074442701159656, 0.0976186521041139, 0.0861901615319533, 0.0733464814110803, 0.0592985849154368, 0.0442774388174198, 0.0285313886289337, 0.0123412297999872];

export function scaledRadiativeCrossSection(atomicNumber: number, totalEnergyMeV: number, electronMassMeV: number): number {
  const z = atomicNumber;
  const e = totalEnergyMeV;
  const t = e - electronMassMeV;
  if (!(t > 0)) return 0;
  const lnZ = Math.log(z);
  const z13 = Math.cbrt(z);
  const f = coulombCorrection(z);
  const low = LOW_Z[z];
  const phiShift = low ? 4 * low[0] + (4 / 3) * lnZ - 20.863 : 0;
  const psiShift = low ? 4 * low[1] + (8 / 3) * lnZ - 28.34 : 0;
  const yMax = t / e;
  let sum = 0;
  for (let s = -1; s <= 1; s += 2) {
    for (let j = 0; j < GL_X.length; j++) {
      const y = 0.5 * yMax * (1 + s * GL_X[j]);
      const k = y * e;
      const ep = e - k;
      const gamma = (100 * electronMassMeV * k) / (e * ep * z13);
      const eps = (100 * electronMassMeV * k) / (e * ep * z13 * z13);
      const phi1 = 20.863 - 2 * Math.log(1 + (0.55846 * gamma) ** 2) - 4 * (1 - 0.6 * Math.exp(-0.9 * gamma) - 0.4 * Math.exp(-1.5 * gamma)) + phiShift;
      const phi2 = phi1 - 2 / 3 / (1 + 6.5 * gamma + 6 * gamma * gamma);
      const psi1 = 28.34 - 2 * Math.log(1 + (3.621 * eps) ** 2) - 4 * (1 - 0.7 * Math.exp(-8 * eps) - 0.3 * Math.exp(-29.2 * eps)) + psiShift;
      const psi2 = psi1 - 2 / 3 / (1 + 40 * eps + 400 * eps * eps);
      // k dσ/dk / (α r_e²) per unit y, divided by Z².
      const main = (4 / 3 - (4 / 3) * y + y * y) * (Math.max(0, phi1 - (4 / 3) * lnZ - 4 * f) + Math.max(0, psi1 - (8 / 3) * lnZ) / z);
      const extra = (2 / 3) * (1 - y) * ((phi1 - phi2) + (psi1 - psi2) / z);
      sum += GL_W[j] * (main + extra);
    }
  }
  // ∫₀^{yMax} (…) dy  (k dσ/dk integrated over k/E).
  const relativistic = 0.5 * yMax * sum;
  return Math.max(16 / 3, relativistic);
}
