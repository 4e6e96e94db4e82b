import { describe, expect, it } from 'vitest';
import { michelEndpoint } from '../../lib/analysis/michelEndpoint.js';
import { material } from '../../lib/matter/materials.js';
import { ANTIPROTON, ELECTRON, KAON_MINUS, MUON_PLUS, PION_PLUS, POSITRON, PROTON } from '../../lib/particles.js';
import { michelMaxEnergyMeV, sampleMichelFraction } from '../../lib/simulate/michel.js';
import { seededRandom } from '../../lib/simulate/rng.js';
import { chargedSpecies } from '../../lib/track/chargedSpecies.js';
import { initialMomentumFromRange } from '../../lib/track/initialMomentumFromRange.js';
import { meanHitSpacingM, pathLengthsM, residualRangesM } from '../../lib/track/pathLength.js';
import { momentumAgainstResidualRange } from '../../lib/track/profileAlongTrack.js';
import { segmentCurvatures } from '../../lib/track/segmentCurvatures.js';
import { speciesRange } from '../../lib/track/speciesRange.js';
import { stopsInside } from '../../lib/track/stopsInside.js';

/** Points every `stepM` along a circle of radius r (counter-clockwise), z rising with slope tanλ. */
function arc(n: number, r: number, stepM: number, tanLambda = 0) {
  const x = new Float64Array(n), y = new Float64Array(n), z = new Float64Array(n);
  for (let i = 0; i < n; i++) { const a = (i * stepM) / r; x[i] = r * Math.sin(a); y[i] = r * (1 - Math.cos(a)); z[i] = i * stepM * tanLambda; }
  return { x, y, z };
}

describe('path length and residual range', () => {
  it('pathLengthsM sums 3-D chords; on a 1 m circle with 5 mm steps the chord deficit is (Δ/R)²/24 (geometry)', () => {
    const { x, y, z } = arc(101, 1, 0.005, 0.5);
    const s = pathLengthsM(x, y, z);
    const arcLen = 100 * 0.005 * Math.hypot(1, 0.5);
    expect(s[100] / arcLen).toBeLessThan(1);
    expect(Math.abs(s[100] - arcLen)).toBeLessThan(arcLen * 2e-6);
    expect(meanHitSpacingM(s)).toBeCloseTo(s[100] / 100, 12);
  });
  it('residualRangesM counts from the last hit plus half a spacing by default', () => {
    const r = residualRangesM(Float64Array.of(0, 0.005, 0.01));
    expect(Array.from(r)).toEqual([0.0125, 0.0075, 0.0025].map((v) => expect.closeTo(v, 12)));
    expect(residualRangesM(Float64Array.of(0, 0.005, 0.01), 0)[0]).toBeCloseTo(0.01, 12);
  });
});

describe('segmentCurvatures', () => {
  it('exact points on a 0.4 m circle give κ = 1/0.4 in every consecutive segment (1e-9); a short rest joins the last segment', () => {
    const { x, y } = arc(43, 0.4, 0.005);
    const seg = segmentCurvatures({ x, y }, { hitsPerSegment: 8 });
    expect(seg.count).toBe(5);
    expect(seg.to[seg.count - 1]).toBe(43);
    expect(segmentCurvatures({ x: arc(45, 0.4, 0.005).x, y: arc(45, 0.4, 0.005).y }).count).toBe(6);
    for (const k of seg.kappa) expect(Math.abs(Math.abs(k) - 2.5)).toBeLessThan(1e-9);
    for (const c of seg.cosLambda) expect(c).toBeCloseTo(1, 12);
  });
  it('sliding mode moves the window one hit at a time', () => {
    const { x, y } = arc(20, 0.4, 0.005);
    expect(segmentCurvatures({ x, y }, { hitsPerSegment: 8, mode: 'sliding' }).count).toBe(13);
  });
  it('its error follows Gluckstern for even spacing: σκ = (ε/L²)√(720/(N+4)) (Gluckstern, NIM 24 (1963) 381) within 10 %', () => {
    const { x, y } = arc(12, 5, 0.01);
    const seg = segmentCurvatures({ x, y }, { hitsPerSegment: 12, hitErrorM: 2e-4 });
    const l = 0.11;
    expect(seg.sigmaKappa[0] / ((2e-4 / (l * l)) * Math.sqrt(720 / 16))).toBeCloseTo(1, 1);
  });
  it('rejects fewer than 4 hits per segment with a catalogued error', () => {
    const { x, y } = arc(20, 0.4, 0.005);
    expect(() => segmentCurvatures({ x, y }, { hitsPerSegment: 3 })).toThrow(/hitsPerSegment/);
  });
});

describe('stopsInside', () => {
  const { x, y } = arc(40, 0.4, 0.005);
  const seg = segmentCurvatures({ x, y });
  const volume = { min: [-1, -1, -1], max: [1, 1, 1] } as const;
  it('an end point 2 cm or more inside the volume stops; one 1 cm from a face does not', () => {
    expect(stopsInside(seg, [0.5, 0.2, 0], { volume }).stops).toBe(true);
    expect(stopsInside(seg, [0.99, 0.2, 0], { volume }).stops).toBe(false);
  });
  it('without a volume a constant curvature is not a stop (slope significance ≈ 0)', () => {
    const d = stopsInside(seg, [0, 0, 0]);
    expect(d.stops).toBe(false);
    expect(Math.abs(d.riseSignificance)).toBeLessThan(1e-3);
  });
});

describe('chargedSpecies', () => {
  it('gives the partner of the measured sign, in the names sagitta range --particle reads', () => {
    expect(chargedSpecies(PION_PLUS, -1).name).toBe('pi-');
    expect(chargedSpecies(PROTON, -1)).toBe(ANTIPROTON);
    expect(chargedSpecies(ELECTRON, 1)).toBe(POSITRON);
    expect(chargedSpecies(KAON_MINUS, 1).name).toBe('K+');
    expect(chargedSpecies(MUON_PLUS, NaN)).toBe(MUON_PLUS);
  });
});

describe('speciesRange and initialMomentumFromRange', () => {
  const water = material('water');
  it('proton range in water at T = 100 MeV (p = 444.58 MeV/c) is PSTAR 7.718 g/cm² (NIST PSTAR, ICRU 49) within 0.5 %', () => {
    expect(speciesRange(PROTON, water).rangeM(0.44458) * 100 / 7.718).toBeCloseTo(1, 2);
  });
  it('range straggling of 100 MeV protons in water is ≈ 1.1–1.3 % of the range (Bohr; ICRU 49 (memory)) after removing the 1 % table term', () => {
    const r = speciesRange(PROTON, water), rangeM = r.rangeM(0.44458);
    const bohr = Math.sqrt(r.rangeSigmaM(rangeM) ** 2 - (0.01 * rangeM) ** 2) / rangeM;
    expect(bohr).toBeGreaterThan(0.009);
    expect(bohr).toBeLessThan(0.014);
  });
  it('initialMomentumFromRange inverts the range: a track of R − spacing/2 gives back p', () => {
    const r = speciesRange(PROTON, water);
    const m = initialMomentumFromRange(r, r.rangeM(0.44458) - 0.0025, 0.005);
    expect(m.pGeV).toBeCloseTo(0.44458, 5);
    expect(m.sigmaPGeV / m.pGeV).toBeGreaterThan(0.002);
    expect(m.sigmaPGeV / m.pGeV).toBeLessThan(0.01);
  });
  it('momentumAgainstResidualRange turns segment curvature into p = 0.2998·B/(|κ| cos λ)', () => {
    const { x, y } = arc(24, 0.5, 0.005);
    const m = momentumAgainstResidualRange(segmentCurvatures({ x, y }), { fieldT: 2 });
    for (const p of m.pGeV) expect(p).toBeCloseTo(0.299792458 * 2 * 0.5, 9);
    expect(m.residualRangeM[0]).toBeGreaterThan(m.residualRangeM[2]);
  });
});

describe('michelEndpoint', () => {
  const w = michelMaxEnergyMeV(105.6583755);
  it('W = (m_μ² + m_e²)/(2 m_μ) = 52.830 MeV from PDG 2022 masses (PDG RPP "Muon decay parameters")', () => {
    expect(w).toBeCloseTo(52.8304, 3);
  });
  it('recovers W from 4000 sampled Michel energies within 3 σ, with and without a 10 MeV cut; σ ≈ 0.41 W/√n without a cut (median of x²(3 − 2x))', () => {
    const rng = seededRandom(99, 'michel-endpoint-test');
    const e = Array.from({ length: 4000 }, () => w * sampleMichelFraction(rng));
    for (const cut of [0, 10]) {
      const r = michelEndpoint(e, cut);
      expect(Math.abs(r.endpointMeV - w)).toBeLessThan(3 * r.sigmaMeV);
      expect(r.sigmaMeV).toBeGreaterThan(0.38 * w / Math.sqrt(r.used));
      expect(r.sigmaMeV).toBeLessThan((cut ? 0.5 : 0.44) * w / Math.sqrt(r.used));
    }
  });
});
