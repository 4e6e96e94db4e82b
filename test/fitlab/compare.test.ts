import { describe, expect, it } from 'vitest';
import { BUILT_IN_FIT_METHODS, defineFitMethod, fitCircle } from '../../lib/fit/index.js';
import { compareFitters, fitLabSample, meritFigure, pullFigure, pValueFigure } from '../../lib/fitlab/index.js';
import { chamberMedium } from '../../lib/matter/index.js';
import { glucksternCurvatureSigma } from '../../lib/track/resolution.js';

describe('the fit lab on simulated truth', () => {
  it('fitLabSample: the true curvature sign follows lib/fit (κ > 0 counter-clockwise; q > 0 turns clockwise in B along +z)', () => {
    const s = fitLabSample({ tracks: 20, momentumGeV: [1, 1], lengthsM: [1], hitsPerTrack: 30, sigmaM: 1e-7, fieldT: 1.5, seed: 2 });
    for (let k = 0; k < s.count; k++) {
      const f = fitCircle(s.x.subarray(s.offsets[k], s.offsets[k + 1]), s.y.subarray(s.offsets[k], s.offsets[k + 1]), { sigma: 1e-7 });
      expect(Math.sign(f.kappa)).toBe(-Math.sign(s.charge[k]));
      expect(Math.abs(f.kappa / s.kappaTrue[k] - 1)).toBeLessThan(1e-5);
    }
  });

  it('without scattering: geometric pulls have mean 0 ± 0.06 and width 1 ± 0.04; χ²/ndf 1 ± 0.015; 5 ± 1.2 % of p-values below 0.05', () => {
    // Bands are about three statistical errors for 3000 tracks of 40 hits: mean 0.018, width 1/√6000 = 0.013,
    // χ²/ndf √(2/38)/√3000 = 0.004, fraction √(0.05·0.95/3000) = 0.004 (seed 3 gives 0.024, 0.996, 0.992, 0.049).
    const s = fitLabSample({ tracks: 3000, momentumGeV: [0.3, 10], lengthsM: [0.3, 0.6, 1], hitsPerTrack: 40, sigmaM: 3e-4, fieldT: 1.5, seed: 3 });
    const r = compareFitters(BUILT_IN_FIT_METHODS, s);
    const g = r.summary.find((x) => x.fitter === 'geometric')!;
    expect(g.failureRate).toBe(0);
    expect(Math.abs(g.pullMean)).toBeLessThan(0.06);
    expect(Math.abs(g.pullWidth - 1)).toBeLessThan(0.04);
    expect(Math.abs(g.chi2PerNdf - 1)).toBeLessThan(0.015);
    expect(Math.abs(g.pValueBelow5Percent - 0.05)).toBeLessThan(0.012);
    expect(g.tracksPerSecond).toBeGreaterThan(0);
  });

  it('curvature resolution follows Gluckstern (NIM 24 (1963) 381: σ(κ) = (ε/L²)√(720/(N+4))) within 4 % for 1 m tracks of 40 hits (seed 4: +0.5 %; statistical error 1.3 %)', () => {
    const s = fitLabSample({ tracks: 3000, momentumGeV: [2, 10], lengthsM: [1], hitsPerTrack: 40, sigmaM: 3e-4, fieldT: 1.5, seed: 4 });
    const g = compareFitters(['geometric'], s).summary[0];
    // The hits span 39/40 of the length (first hit one spacing after the start).
    const expected = glucksternCurvatureSigma({ nPoints: 40, sigmaM: 3e-4, lengthM: 0.975 });
    expect(Math.abs(g.kappaResolution / expected - 1)).toBeLessThan(0.04);
  });

  it('with multiple scattering in liquid hydrogen: geometric pulls at high momentum (5–20 GeV/c) at their documented 1.08 ± 0.07 (scattering still adds there), wider at low momentum', () => {
    // Seed 5: widths 6.4, 1.9, 1.08 in the three bins; the fit ignores scattering, so the top bin
    // sits 8 % above 1 (statistical error 2.3 % for ~970 tracks): asserted at that value, so a fix or a regression shows.
    const s = fitLabSample({ tracks: 3000, momentumGeV: [0.3, 20], lengthsM: [0.5, 1], hitsPerTrack: 40, sigmaM: 3e-4, fieldT: 1.5, seed: 5, medium: chamberMedium('liquid hydrogen') });
    const r = compareFitters(['geometric'], s, { momentumEdgesGeV: [0.3, 1, 5, 20] });
    const [low, , high] = r.byMomentum;
    expect(high.tracks).toBeGreaterThan(500);
    expect(Math.abs(high.pullWidth - 1.08)).toBeLessThan(0.07);
    expect(low.pullWidth).toBeGreaterThan(1.5);
  });

  it('on dipped tracks (tan λ ∈ [−1, 1]) every method is run as a helix fit: κ and tan λ pulls have width 1 ± 0.05, p unbiased within 0.2 %', () => {
    // 2000 tracks: width statistical error 1.6 % (seed 12: 0.991 and 0.999; bias 0.02 %).
    const s = fitLabSample({ tracks: 2000, momentumGeV: [0.5, 5], lengthsM: [0.6, 1], hitsPerTrack: 40, sigmaM: 3e-4, sigmaZM: 1e-3, tanLambda: [-1, 1], fieldT: 1.5, seed: 12 });
    const [geo] = compareFitters(['geometric'], s).summary;
    expect(Math.abs(geo.pullWidth - 1)).toBeLessThan(0.05);
    expect(Math.abs(geo.tanLambdaPullWidth - 1)).toBeLessThan(0.05);
    expect(Math.abs(geo.momentumBias)).toBeLessThan(0.002);
  });

  it('curvature error grows as L⁻² (fact of the trade): halving the length roughly quadruples σ(κ) at fixed hit count', () => {
    const s = fitLabSample({ tracks: 4000, momentumGeV: [3, 10], lengthsM: [0.5, 1], hitsPerTrack: 40, sigmaM: 3e-4, fieldT: 1.5, seed: 6 });
    const [short, long] = compareFitters(['geometric'], s).byLength;
    // 4 ± 0.35: about three statistical errors of the ratio for 2000 tracks per length (seed 6: 4.17).
    expect(short.kappaResolution / long.kappaResolution).toBeGreaterThan(3.65);
    expect(short.kappaResolution / long.kappaResolution).toBeLessThan(4.35);
  });

  it('a method written by a user (three-point sagitta) is compared beside the built-ins; a throwing method counts as failures', () => {
    const threePoint = defineFitMethod({
      name: 'three-point',
      fitTrack({ x, y }) {
        const n = x.length, a = 0, b = n >> 1, c = n - 1;
        // Signed curvature through three points: 2·cross / (|AB||BC||CA|).
        const cross = (x[b] - x[a]) * (y[c] - y[a]) - (y[b] - y[a]) * (x[c] - x[a]);
        const d = Math.hypot(x[b] - x[a], y[b] - y[a]) * Math.hypot(x[c] - x[b], y[c] - y[b]) * Math.hypot(x[a] - x[c], y[a] - y[c]);
        return { kappa: (2 * cross) / d };
      },
    });
    const broken = defineFitMethod({ name: 'broken', fitTrack: () => { throw new Error('nope'); } });
    const s = fitLabSample({ tracks: 500, momentumGeV: [0.5, 2], lengthsM: [1], hitsPerTrack: 30, sigmaM: 3e-4, fieldT: 1.5, seed: 7 });
    const r = compareFitters(['geometric', threePoint, broken], s);
    const [geo, tp, br] = r.summary;
    expect(tp.failureRate).toBe(0);
    expect(tp.pullWidth).toBeNaN();
    expect(tp.kappaResolution).toBeGreaterThan(geo.kappaResolution);
    expect(br.failureRate).toBe(1);
    expect(() => compareFitters(['geometric', 'geometric'], s)).toThrow(/distinct names/);
  });

  it('figures are plain plotly JSON: one trace per fitter plus the reference curve', () => {
    const s = fitLabSample({ tracks: 300, momentumGeV: [0.5, 5], lengthsM: [0.5, 1], hitsPerTrack: 20, sigmaM: 3e-4, fieldT: 1.5, seed: 8 });
    const r = compareFitters(BUILT_IN_FIT_METHODS, s);
    const pulls = pullFigure(r);
    expect(pulls.data.length).toBe(4);
    expect(JSON.parse(JSON.stringify(pulls)).data[0].y.reduce((a: number, b: number) => a + b, 0)).toBeGreaterThan(250);
    expect(pValueFigure(r).data.length).toBe(4);
    const res = meritFigure(r, 'momentum', 'momentumResolution');
    expect(res.data.map((t) => t.name)).toEqual(['geometric', 'taubin', 'kasa']);
    expect((res.layout.xaxis as { type: string }).type).toBe('log');
  });
});

describe('the fit lab on a full chamber run', () => {
  it('fitLabSampleFromRun(brindlemoor run): truth at the first hit; pions and muons within a few per cent, stopping protons show the energy-loss bias', async () => {
    const { readFileSync } = await import('node:fs');
    const { parseScenario, simulateChamber } = await import('../../lib/simulate/index.js');
    const { fitLabSampleFromRun } = await import('../../lib/fitlab/index.js');
    const config = parseScenario(readFileSync(new URL('../../notebooks/data/brindlemoor.scenario.json', import.meta.url), 'utf8'));
    const run = simulateChamber(config, 11);
    const s = fitLabSampleFromRun(run, { fieldT: 1.5, minHits: 20, species: ['pi-', 'pi+', 'mu-', 'mu+'] });
    expect(s.count).toBeGreaterThan(150);
    for (let k = 0; k < s.count; k++) expect(Math.sign(s.kappaTrue[k])).toBe(-Math.sign(s.charge[k]));
    const r = compareFitters(['geometric'], s, { momentumEdgesGeV: [0.02, 0.2, 0.45, 1] });
    expect(r.byLength.length).toBe(6);
    const fast = r.byMomentum[2];
    expect(fast.tracks).toBeGreaterThan(50);
    // 1 m of liquid hydrogen takes ~30 MeV from a 500 MeV/c pion: the curvature changes by ~6 %
    // along the track, far more than the fit's σ(κ) from 0.35 mm hits, so the pulls are wide
    // (the circle model is the limit, not the hits) while p_T is still right within a few per cent.
    expect(Math.abs(fast.momentumBias)).toBeLessThan(0.05);
    expect(fast.momentumResolution).toBeLessThan(0.05);
    expect(fast.pullWidth).toBeGreaterThan(2);
    expect(r.summary[0].failureRate).toBeLessThan(0.05);
    // Beam protons at 500 MeV/c slow down and stop within ~0.8 m: the curvature grows along the
    // track, so a single circle overestimates the first-hit curvature (momentum biased low).
    const protons = fitLabSampleFromRun(run, { fieldT: 1.5, minHits: 20, species: ['proton'] });
    expect(protons.count).toBeGreaterThan(30);
    expect(compareFitters(['geometric'], protons).summary[0].momentumBias).toBeLessThan(-0.1);
  });
});
