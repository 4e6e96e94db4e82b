import { BETHE_K_MEV_CM2_PER_MOL, ELECTRON_MASS_MEV, GEV_PER_TESLA_METRE } from '../constants.js';

/** A track's hits prepared once for many hypothesis evaluations (bending-plane geometry). */
export interface FilterTrack {
  readonly n: number;
  readonly x: Float64Array;
  readonly y: Float64Array;
  /** Hit error in the bending plane [m] per hit. */
  readonly sigma: Float64Array;
  /** 3-D path [m] from the first hit at each hit. */
  readonly path3: Float64Array;
  /** Bending-plane chord length [m] of interval i (hit i → i+1). */
  readonly dxy: Float64Array;
  /** +1 when the track turns counter-clockwise seen from +z (in travel order), −1 otherwise. */
  readonly turn: number;
}

/** The medium and field a filter run needs (SI units, GeV/c). */
export interface FilterContext {
  readonly fieldT: number;
  readonly chargeMagnitude: number;
  /** Radiation length [m]. */
  readonly radiationLengthM: number;
  /** Density [g/cm³] and ⟨Z/A⟩ [mol/g], for Bohr straggling. */
  readonly densityGcm3: number;
  readonly zOverA: number;
  /** Particle mass [GeV/c²]. */
  readonly massGeV: number;
}

/** Result of one filter run. */
export interface FilterResult {
  /** Σ (r²/S + ln S) from the third hit processed on. */
  readonly m2lnL: number;
  /** Σ r²/S from the third hit processed on; ndf = hits − 2 for a fixed momentum profile. */
  readonly chi2: number;
  /** Momentum [GeV/c] at the last hit processed, the reference corrected by the filtered curvature offset, and its σ. */
  readonly pEndGeV: number;
  readonly sigmaPEndGeV: number;
}

/**
 * Prepares hits (in travel order, metres) for `bendingPlaneFilter`. `sigma`: one number or per hit.
 */
export function filterTrack(x: Float64Array, y: Float64Array, path3: Float64Array, sigma: Float64Array | number): FilterTrack {
  const n = x.length;
  const dxy = new Float64Array(Math.max(n - 1, 0));
  let turn = 0;
  for (let i = 0; i + 1 < n; i++) {
    dxy[i] = Math.hypot(x[i + 1] - x[i], y[i + 1] - y[i]);
    if (i + 2 < n) turn += (x[i + 1] - x[i]) * (y[i + 2] - y[i + 1]) - (y[i + 1] - y[i]) * (x[i + 2] - x[i + 1]);
  }
  const sig = typeof sigma === 'number' ? new Float64Array(n).fill(sigma) : sigma;
  return { n, x, y, sigma: sig, path3, dxy, turn: turn < 0 ? -1 : 1 };
}

/** Per-hit buffers of one filter run (allocate once per track with `newFilterScratch`). */
export interface FilterScratch {
  readonly rx: Float64Array;
  readonly ry: Float64Array;
  /** cos φ and sin φ of the reference direction at each hit. */
  readonly cphi: Float64Array;
  readonly sphi: Float64Array;
  /** Per interval i (hit i → i+1): projected step, MS variance, straggling variance of w. */
  readonly d: Float64Array;
  readonly q: Float64Array;
  readonly qw: Float64Array;
}

export function newFilterScratch(n: number): FilterScratch {
  const f = () => new Float64Array(Math.max(n, 1));
  return { rx: f(), ry: f(), cphi: f(), sphi: f(), d: f(), q: f(), qw: f() };
}

/**
 * Kalman filter (Kalman 1960; for tracks Frühwirth, NIM A262 (1987) 444, (memory)) of one
 * track's bending-plane hits about a reference trajectory whose momentum at hit i is `pGeV[i]`
 * (the mass hypothesis's CSDA momentum profile, built by the caller): κ = 0.2998·B·|z|/(p cos λ),
 * cos λ from each interval's chords. The reference starts at the first hit along the first chord
 * (turned back by half its bending), where the momentum is highest and scattering least.
 * State: transverse offset u, angle a and curvature offset w about the reference (forward
 * sense); a step of ±d moves (u, a) by (±a d + w d²/2, ±w d). Process noise: multiple scattering,
 * Highland θ₀ (PDG RPP; log term of the whole track) with the thick-scatterer covariance
 * θ₀²[[d²/3, ±d/2], [±d/2, 1]] (common practice); energy-loss straggling, Bohr's σ_E² =
 * 0.1569 z² (Z/A) ρx MeV² (Bohr 1915) turned into var(w) = (κ σ_E/(β p))², a random walk away
 * from where the run starts (w = 0 there: the parameter fixes the momentum at that end).
 * `backward` runs from the last hit to the first (stopping tracks: the momentum is known best
 * at the stop). The first two hits fix u and a (diffuse start); from the third on, each
 * innovation adds r²/S + ln S (prediction-error decomposition, comparable across hypotheses).
 * Linearised about the reference: valid while offsets stay well below the radius of curvature.
 */
export function bendingPlaneFilter(t: FilterTrack, pGeV: Float64Array, ctx: FilterContext, backward: boolean, sc: FilterScratch): FilterResult {
  const n = t.n;
  const c = GEV_PER_TESLA_METRE * Math.abs(ctx.fieldT) * ctx.chargeMagnitude;
  const x0 = ctx.radiationLengthM;
  const logTerm = 1 + 0.038 * Math.log(Math.max(t.path3[n - 1] / x0, 1e-3));
  const bohr = BETHE_K_MEV_CM2_PER_MOL * ELECTRON_MASS_MEV * ctx.chargeMagnitude ** 2 * ctx.zOverA * 100 * ctx.densityGcm3 * 1e-6;
  const turn = t.turn;
  // Reference trajectory, forward from the first hit.
  let cosL = Math.min(1, t.dxy[0] / Math.max(t.path3[1] - t.path3[0], 1e-12));
  const phi0 = Math.atan2(t.y[1] - t.y[0], t.x[1] - t.x[0]) - (0.5 * turn * c * t.dxy[0]) / (pGeV[0] * cosL);
  // The direction is carried as (cos φ, sin φ) and turned by each step's half angles (two sines
  // a step instead of five trigonometric calls; the same numbers to rounding).
  let cp = Math.cos(phi0), sp = Math.sin(phi0);
  let rx = t.x[0], ry = t.y[0];
  const m2 = ctx.massGeV * ctx.massGeV;
  sc.rx[0] = rx; sc.ry[0] = ry; sc.cphi[0] = cp; sc.sphi[0] = sp;
  for (let i = 0; i + 1 < n; i++) {
    const d = t.dxy[i], d3 = t.path3[i + 1] - t.path3[i];
    cosL = d3 > 0 ? Math.min(1, d / d3) : 1;
    const pm = 0.5 * (pGeV[i] + pGeV[i + 1]);
    const kap = (turn * c * ((1 / pGeV[i] + 4 / pm + 1 / pGeV[i + 1]) / 6)) / cosL;
    const dphi = kap * d;
    const sh = Math.sin(0.5 * dphi), ch = Math.cos(0.5 * dphi);
    const chordLen = Math.abs(dphi) > 1e-9 ? (2 / kap) * sh : d;
    // Direction at the middle of the step, then at its end.
    const cm = cp * ch - sp * sh, sm = sp * ch + cp * sh;
    rx += chordLen * cm;
    ry += chordLen * sm;
    cp = cm * ch - sm * sh; sp = sm * ch + cm * sh;
    sc.rx[i + 1] = rx; sc.ry[i + 1] = ry; sc.cphi[i + 1] = cp; sc.sphi[i + 1] = sp;
    const beta = pm / Math.sqrt(pm * pm + m2);
    const th = ((0.0136 / (beta * pm)) * Math.sqrt(d3 / x0) * logTerm) / cosL;
    sc.d[i] = d; sc.q[i] = th * th;
    sc.qw[i] = ((kap / pm) ** 2 * bohr * d3) / (beta * beta);
  }
  const sgn = backward ? -1 : 1;
  let u = 0, a = 0, w = 0;
  let A = 1e-2, B = 0, C = 0, D = 1, E = 0, G = 0;
  let chi2 = 0, lnS = 0, prodS = 1, inProd = 0;
  for (let j = 0; j < n; j++) {
    const i = backward ? n - 1 - j : j;
    if (j > 0) {
      const k = backward ? i : i - 1;
      const d = sgn * sc.d[k], q = sc.q[k];
      const h = 0.5 * d * d;
      u += a * d + w * h; a += w * d;
      const p00 = A + d * B + h * C, p01 = B + d * D + h * E, p02 = C + d * E + h * G;
      const p11 = D + d * E, p12 = E + d * G;
      A = p00 + d * p01 + h * p02 + (q * d * d) / 3;
      B = p01 + d * p02 + (q * d) / 2;
      C = p02;
      D = p11 + d * p12 + q;
      E = p12;
      G = G + sc.qw[k];
    }
    const r = -(t.x[i] - sc.rx[i]) * sc.sphi[i] + (t.y[i] - sc.ry[i]) * sc.cphi[i];
    const s = A + t.sigma[i] * t.sigma[i];
    const innov = r - u;
    if (j >= 2) {
      chi2 += (innov * innov) / s;
      // Σ ln S as the logarithm of products of eight (S ≈ 1e-8 m²: no underflow), one log in eight hits.
      prodS *= s;
      if (++inProd === 8) { lnS += Math.log(prodS); prodS = 1; inProd = 0; }
    }
    const k0 = A / s, k1 = B / s, k2 = C / s;
    u += k0 * innov; a += k1 * innov; w += k2 * innov;
    const a0 = A, b0 = B, c0 = C;
    A -= k0 * a0; B -= k0 * b0; C -= k0 * c0;
    D -= k1 * b0; E -= k1 * c0; G -= k2 * c0;
  }
  const iEnd = backward ? 0 : n - 1;
  const dEnd = backward ? t.dxy[0] / Math.max(t.path3[1] - t.path3[0], 1e-12) : t.dxy[n - 2] / Math.max(t.path3[n - 1] - t.path3[n - 2], 1e-12);
  const kRef = c / (pGeV[iEnd] * Math.min(1, dEnd));
  const kTot = kRef + turn * w;
  const pEnd = (pGeV[iEnd] * kRef) / kTot;
  return { m2lnL: chi2 + lnS + Math.log(prodS), chi2, pEndGeV: pEnd, sigmaPEndGeV: (pEnd * Math.sqrt(Math.max(G, 0))) / kTot };
}
