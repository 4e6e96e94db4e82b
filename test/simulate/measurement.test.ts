import { describe, expect, it } from 'vitest';
import { PION_MINUS } from '../../lib/particles.js';
import { chamber, simulateChamber, type MeasurementModel, type SimulationConfig } from '../../lib/simulate/index.js';
import { VACUUM } from '../../lib/matter/index.js';

const box = chamber({ sizeM: [1.2, 0.8, 0.5], medium: VACUUM, fieldT: [0, 0, 1.5] });
const transport = { energyLoss: 'off' as const, scattering: false, maxStepM: 0.01, maxPathM: 5, deltaRayMinMeV: 0 };
const beam = { kind: 'beam' as const, events: 400, species: [{ particle: PION_MINUS, weight: 1 }], momentumGeV: 2, momentumSpread: 0, originM: [-0.59, 0, 0] as [number, number, number], direction: [1, 0, 0] as [number, number, number], spotSigmaM: 0, divergenceRad: 0 };
const run = (m: Partial<MeasurementModel>, seed = 1) => simulateChamber({
  name: 'm', chamber: box, transport,
  measurement: { sampling: { kind: 'spacing', spacingM: 0.01 }, sigmaXM: 0, sigmaYM: 0, sigmaZM: 0, efficiency: 1, noiseHitsPerEvent: 0, ...m },
  sources: [beam],
} as SimulationConfig, seed);

describe('measurement model', () => {
  it('Gaussian smearing per coordinate: residuals have the σ asked for (x 0.3 mm, y 0.5 mm, z 2 mm) within 2 %', () => {
    const r = run({ sigmaXM: 3e-4, sigmaYM: 5e-4, sigmaZM: 2e-3 });
    const sd = (a: Float64Array, b: Float64Array) => Math.sqrt(a.reduce((s, v, i) => s + (v - b[i]) ** 2, 0) / a.length);
    expect(r.hits.length).toBeGreaterThan(40000);
    expect(Math.abs(sd(r.hits.x, r.hitTruth.x) / 3e-4 - 1)).toBeLessThan(0.02);
    expect(Math.abs(sd(r.hits.y, r.hitTruth.y) / 5e-4 - 1)).toBeLessThan(0.02);
    expect(Math.abs(sd(r.hits.z!, r.hitTruth.z) / 2e-3 - 1)).toBeLessThan(0.02);
    expect(r.hits.sigmaY![0]).toBe(5e-4);
  });

  it('efficiency 0.8 keeps 80 % of the hits (within 1 %); the truth table counts the recorded hits', () => {
    const all = run({}).hits.length;
    const r = run({ efficiency: 0.8 }, 2);
    expect(Math.abs(r.hits.length / all - 0.8)).toBeLessThan(0.01);
    expect(r.truth.hits.reduce((a, b) => a + b, 0)).toBe(r.hits.length);
  });

  it('noise hits: Poisson with the mean asked for, track −1, first in their event, uniform inside the chamber', () => {
    const r = run({ noiseHitsPerEvent: 4 }, 3);
    let noise = 0;
    for (let i = 0; i < r.hits.length; i++) {
      if (r.hits.track[i] !== -1) continue;
      noise++;
      expect(i === 0 || r.hits.event[i - 1] < r.hits.event[i] || r.hits.track[i - 1] === -1).toBe(true);
      expect(Math.abs(r.hits.x[i])).toBeLessThanOrEqual(0.6);
      expect(Number.isNaN(r.hitTruth.x[i])).toBe(true);
    }
    // 400 events × 4: σ = √1600 = 40.
    expect(Math.abs(noise - 1600)).toBeLessThan(160);
  });

  it('cosmic muons enter through the top face going down, cos θ_zenith mean 0.8 (cos³ rate through a flat face), μ⁺/μ⁻ ≈ 1.27', () => {
    const r = simulateChamber({
      name: 'c', chamber: box, transport,
      measurement: { sampling: { kind: 'spacing', spacingM: 0.05 }, sigmaXM: 0, sigmaYM: 0, sigmaZM: 0, efficiency: 1, noiseHitsPerEvent: 0 },
      sources: [{ kind: 'cosmic', events: 4000, momentumMinGeV: 0.5, momentumMaxGeV: 50, spectralIndex: 2.7, chargeRatio: 1.27 }],
    }, 4);
    const t = r.truth;
    let cosSum = 0, plus = 0;
    for (let i = 0; i < t.length; i++) {
      expect(t.vy[i]).toBeCloseTo(0.4, 6);
      const p = Math.hypot(t.px[i], t.py[i], t.pz[i]);
      expect(p).toBeGreaterThanOrEqual(0.5);
      expect(p).toBeLessThanOrEqual(50);
      cosSum += -t.py[i] / p;
      if (t.species[i] === 'mu+') plus++;
    }
    expect(Math.abs(cosSum / t.length - 0.8)).toBeLessThan(0.01);
    expect(Math.abs(plus / (t.length - plus) - 1.27)).toBeLessThan(0.12);
  });
});

describe('truthToDataFrame', () => {
  it('gives one row per particle with the CSV columns in mm and MeV/c', async () => {
    const { truthToDataFrame } = await import('../../lib/simulate/index.js');
    const r = run({}, 5);
    const df = truthToDataFrame(r.truth);
    expect(df.shape).toEqual([r.truth.length, 19]);
    expect(df.column('p_MeV').values[0]).toBeCloseTo(2000, 6);
    expect(df.column('species').values[0]).toBe('pi-');
  });
});
