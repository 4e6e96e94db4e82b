import { describe, expect, it } from 'vitest';
import { ELECTRON, KAON_SHORT, LAMBDA, PION_MINUS, PION_PLUS, POSITRON, PROTON, ANTIPROTON } from '../../lib/particles.js';
import { seededRandom } from '../../lib/simulate/rng.js';
import { twoBodyDecay } from '../../lib/simulate/twoBodyDecay.js';
import {
  armenteros, findV0s, fourMomentum, helixPoint, invariantMassMeV, newHelixParameters, v0CandidateColumns, type VertexTracks,
} from '../../lib/vertex/index.js';

// A K⁰_S decay built from exact helices (no fit, no noise): every output of findV0s is then known
// from the decay's own momenta, computed here with the kinematics functions (closure).
const FIELD_T = 1.5;
const C_M_PER_PS = 299_792_458e-12;

/** Helix of a track of charge sign q through v with momentum p [MeV/c]; its first hit `fromS` of transverse arc from v. */
function track(v: readonly number[], p: readonly number[], q: number, fromS: number) {
  const pt = Math.hypot(p[0], p[1]);
  const kappa = (-q * 299.792458 * FIELD_T) / pt; // B along +z: positive tracks turn clockwise (κ < 0)
  const phi = Math.atan2(p[1], p[0]), t = p[2] / pt;
  const h = newHelixParameters();
  Object.assign(h, { xRef: v[0], yRef: v[1], kappa, phi0: phi, d0: 0, z0: v[2], tanLambda: t });
  const ref = [0, 0, 0];
  helixPoint(h, fromS, ref);
  return { xRef: ref[0], yRef: ref[1], kappa, phi0: phi + kappa * fromS, z0: ref[2], tanLambda: t, charge: q, event: 1 };
}
type Part = ReturnType<typeof track>;

function tracksOf(parts: Part[], hasZ = true): VertexTracks {
  const n = parts.length;
  const col = (f: (k: number) => number) => Float64Array.from({ length: n }, (_, k) => f(k));
  const cov = new Float64Array(25 * n);
  for (let k = 0; k < n; k++) for (let i = 0; i < 5; i++) cov[25 * k + 6 * i] = 1e-10;
  return {
    count: n, event: col((k) => parts[k].event), track: col((k) => 10 + k), xRef: col((k) => parts[k].xRef), yRef: col((k) => parts[k].yRef),
    kappa: col((k) => parts[k].kappa), phi0: col((k) => parts[k].phi0), d0: col(() => 0), z0: col((k) => parts[k].z0),
    tanLambda: col((k) => parts[k].tanLambda), cov, charge: col((k) => parts[k].charge), usable: new Uint8Array(n).fill(1),
    lastArcM: col(() => 0.3), fieldT: FIELD_T, hasZ,
  };
}

/** A K⁰_S of momentum pK decaying 6 cm from the origin along its flight; both daughters' first hits 3 cm of arc on. */
function kaon(seed: number) {
  const rng = seededRandom(seed);
  const pK = [650, 120, -80];
  const pAbs = Math.hypot(pK[0], pK[1], pK[2]);
  const v = pK.map((x) => (0.06 * x) / pAbs);
  const d = twoBodyDecay(KAON_SHORT.massMeV, pK[0], pK[1], pK[2], PION_PLUS.massMeV, PION_MINUS.massMeV, rng);
  const pp = d.first.slice(1), pn = d.second.slice(1);
  return { pK, pAbs, v, pp, pn, pos: track(v, pp, 1, 0.03), neg: track(v, pn, -1, 0.03) };
}

describe('findV0s on an exact K⁰_S → π⁺π⁻ (helices built through the decay point)', () => {
  it('vertex, flight, momentum, pointing, proper times, the four masses and Armenteros from the decay momenta (1e-6 relative or better)', () => {
    const k = kaon(3);
    // An unrelated negative track first, in another event, and the pair's rows out of event order.
    const other = { ...track([0.3, -0.2, 0], [100, 300, 0], -1, 0.02), event: 0 };
    const { candidates: c, pairsTried, rejected } = findV0s(tracksOf([k.pos, other, k.neg]));
    expect(pairsTried).toBe(1);
    expect(rejected).toEqual({ circles: 0, closestApproach: 0, flight: 0, pointing: 0, chi2: 0 });
    expect(c.count).toBe(1);
    expect(c.status).toEqual(['ok']);
    expect([c.event[0], c.trackPos[0], c.trackNeg[0], c.rowPos[0], c.rowNeg[0]]).toEqual([1, 10, 12, 0, 2]);
    expect(Math.abs(c.xM[0] - k.v[0]) + Math.abs(c.yM[0] - k.v[1]) + Math.abs(c.zM[0] - k.v[2])).toBeLessThan(1e-9);
    expect(c.dcaM[0]).toBeLessThan(1e-9);
    expect(c.chi2[0]).toBeLessThan(1e-6);
    expect(Math.abs(c.flightM[0] - 0.06)).toBeLessThan(1e-9);
    const u = k.v.map((x) => x / 0.06), s = c.cov.subarray(0, 6);
    const varFlight = u[0] * u[0] * s[0] + u[1] * u[1] * s[3] + u[2] * u[2] * s[5] + 2 * (u[0] * u[1] * s[1] + u[0] * u[2] * s[2] + u[1] * u[2] * s[4]);
    expect(s[0]).toBeGreaterThan(0);
    expect(Math.abs(c.sigmaFlightM[0] / Math.sqrt(varFlight) - 1)).toBeLessThan(1e-9);
    expect(Math.abs(c.pMeV[0] / k.pAbs - 1)).toBeLessThan(1e-9);
    expect(c.pointingRad[0]).toBeLessThan(1e-6);
    expect(Math.abs(c.properTimeK0sPs[0] - (0.06 * KAON_SHORT.massMeV) / k.pAbs / C_M_PER_PS)).toBeLessThan(1e-9);
    expect(Math.abs(c.properTimeLambdaPs[0] - (0.06 * LAMBDA.massMeV) / k.pAbs / C_M_PER_PS)).toBeLessThan(1e-9);
    const m = (a: number, b: number) => invariantMassMeV(fourMomentum(k.pp[0], k.pp[1], k.pp[2], a), fourMomentum(k.pn[0], k.pn[1], k.pn[2], b));
    expect(Math.abs(c.massPiPiMeV[0] - KAON_SHORT.massMeV)).toBeLessThan(1e-6);
    expect(Math.abs(c.massPPiMeV[0] - m(PROTON.massMeV, PION_MINUS.massMeV))).toBeLessThan(1e-6);
    expect(Math.abs(c.massPiPMeV[0] - m(PION_PLUS.massMeV, ANTIPROTON.massMeV))).toBeLessThan(1e-6);
    expect(Math.abs(c.massEEMeV[0] - m(POSITRON.massMeV, ELECTRON.massMeV))).toBeLessThan(1e-6);
    for (const sig of [c.sigmaMassPiPiMeV, c.sigmaMassPPiMeV, c.sigmaMassPiPMeV, c.sigmaMassEEMeV]) {
      expect(sig[0]).toBeGreaterThan(0);
      expect(sig[0]).toBeLessThan(1);
    }
    const ap = armenteros(k.pp, k.pn);
    expect(Math.abs(c.armenterosAlpha[0] - ap.alpha)).toBeLessThan(1e-9);
    expect(Math.abs(c.armenterosQtMeV[0] - ap.qtMeV)).toBeLessThan(1e-6);
    const table = v0CandidateColumns(c);
    expect(table.rows).toBe(1);
    expect(table.columns.map((col) => col.name).slice(0, 8)).toEqual(['event', 'track_pos', 'track_neg', 'x_m', 'y_m', 'z_m', 'dca_m', 'flight_m']);
    const sx = table.columns.find((col) => col.name === 'sigma_z_m')!.values as Float64Array;
    expect(sx[0]).toBe(Math.sqrt(c.cov[5]));
  });

  it('the same pair with the negative track listed first, and with no z: the same vertex in x–y, z empty', () => {
    const k = kaon(4);
    const a = findV0s(tracksOf([k.neg, k.pos])).candidates;
    expect([a.trackPos[0], a.trackNeg[0], a.rowPos[0], a.rowNeg[0]]).toEqual([11, 10, 1, 0]);
    expect(Math.abs(a.xM[0] - k.v[0]) + Math.abs(a.yM[0] - k.v[1])).toBeLessThan(1e-9);
    const flat = findV0s(tracksOf([k.neg, k.pos], false)).candidates;
    expect(flat.count).toBe(1);
    expect(flat.zM[0]).toBeNaN();
  });

  it('each cut removes the pair and is counted: flight, pointing, χ², the closest approach (z offset), the circles (far apart); same-sign pairs are not tried', () => {
    const k = kaon(5);
    const tracks = tracksOf([k.pos, k.neg]);
    const none = { circles: 0, closestApproach: 0, flight: 0, pointing: 0, chi2: 0 };
    const only = (key: keyof typeof none, r: ReturnType<typeof findV0s>) => {
      expect(r.candidates.count).toBe(0);
      expect(r.pairsTried).toBe(1);
      expect(r.rejected).toEqual({ ...none, [key]: 1 });
    };
    only('flight', findV0s(tracks, { minFlightM: 0.2 }));
    // Seen from a primary 3 cm aside, the flight direction is ≈ 0.5 rad off the momentum.
    only('pointing', findV0s(tracks, { primaryM: [0, -0.03, 0] }));
    expect(findV0s(tracks, { primaryM: [0, -0.03, 0], maxPointingRad: 0.9 }).candidates.count).toBe(1);
    // 1 mm apart in z with 1e-5 m errors: χ² ≈ (1e-3)²/(2·1e-10)·(geometry) ≫ 1.
    const lifted = tracksOf([k.pos, { ...k.neg, z0: k.neg.z0 + 1e-3 }]);
    only('chi2', findV0s(lifted, { maxChi2: 1 }));
    expect(findV0s(lifted).candidates.chi2[0]).toBeGreaterThan(1e3);
    only('closestApproach', findV0s(lifted, { maxDcaM: 1e-4 }));
    const far = tracksOf([k.pos, { ...k.neg, xRef: k.neg.xRef + 3, yRef: k.neg.yRef + 3 }]);
    only('circles', findV0s(far));
    expect(findV0s(tracksOf([k.pos, { ...k.neg, charge: 1 }])).pairsTried).toBe(0);
  });

  it('refuses a negative or NaN cut with the catalogue message', () => {
    const tracks = tracksOf([kaon(6).pos]);
    expect(() => findV0s(tracks, { maxDcaM: -1 })).toThrow('maxDcaM = -1 is not valid: expected a non-negative number');
    expect(() => findV0s(tracks, { maxChi2: NaN })).toThrow('maxChi2 = NaN is not valid: expected a non-negative number');
    expect(findV0s(tracks, { maxDcaM: undefined }).pairsTried).toBe(0);
  });
});
