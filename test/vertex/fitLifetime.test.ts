import { describe, expect, it } from 'vitest';
import { KAON_SHORT } from '../../lib/particles.js';
import { seededRandom } from '../../lib/simulate/rng.js';
import { decayWindowInBox, fitLifetime, fitMassPeak } from '../../lib/vertex/index.js';

// PDG RPP 2022: K⁰_S mean life 0.8954(4)e-10 s, cτ = 2.6844 cm (lib/particles.ts; test/fixtures/pdg-decays).
const CTAU_M = KAON_SHORT.ctauM;

/** One toy: n K⁰_S of 0.3–1.2 GeV/c decaying in windows [2 cm, 20–60 cm] of lab flight, drawn from the truncated exponential. */
function toy(rng: ReturnType<typeof seededRandom>, n: number) {
  const t = new Float64Array(n), a = new Float64Array(n), b = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const p = 300 + 900 * rng.uniform();
    const scale = KAON_SHORT.massMeV / p;
    a[i] = 0.02 * scale;
    b[i] = (0.2 + 0.4 * rng.uniform()) * scale;
    const ea = Math.exp(-a[i] / CTAU_M), eb = Math.exp(-b[i] / CTAU_M);
    t[i] = -CTAU_M * Math.log(ea - rng.uniform() * (ea - eb));
  }
  return { t, a, b };
}

describe('fitLifetime (unbinned likelihood with acceptance windows)', () => {
  it('over 300 toy samples of 200 K⁰_S the pulls (fit − cτ)/σ have mean 0 ± 0.15 and rms 1 ± 0.12; the interval is about σ/cτ = 1/√n', () => {
    const rng = seededRandom(31);
    const pulls: number[] = [];
    let widths = 0;
    for (let s = 0; s < 300; s++) {
      const { t, a, b } = toy(rng, 200);
      const f = fitLifetime(t, a, b);
      expect(f.status).toBe('ok');
      expect(f.used).toBe(200);
      const sigma = f.ctauM > CTAU_M ? f.ctauM - f.lowerM : f.upperM - f.ctauM;
      pulls.push((f.ctauM - CTAU_M) / sigma);
      widths += f.sigmaM / f.ctauM;
    }
    const mean = pulls.reduce((x, y) => x + y, 0) / pulls.length;
    const rms = Math.sqrt(pulls.reduce((x, y) => x + (y - mean) ** 2, 0) / pulls.length);
    expect(pulls.length).toBe(300);
    expect(Math.abs(mean)).toBeLessThan(0.15);
    expect(Math.abs(rms - 1)).toBeLessThan(0.12);
    // Truncation at 2 cm of flight loses a little information: σ/cτ a few % above 1/√200 = 0.071.
    expect(widths / 300).toBeGreaterThan(0.07);
    expect(widths / 300).toBeLessThan(0.09);
  });

  it('candidates outside their window are skipped and counted; a single candidate is too few', () => {
    const f = fitLifetime([0.01, 0.02, 0.5], [0.005, 0.005, 0.005], [0.3, 0.3, 0.3]);
    expect(f.used).toBe(2);
    expect(f.skipped).toBe(1);
    expect(fitLifetime([0.01], [0], [1]).status).toBe('too-few');
  });

  it('decayWindowInBox: along +x from x = −0.55 m in a 1.2 m box the window is [min flight, 1.15 m − margin]', () => {
    const [lo, hi] = decayWindowInBox([-0.55, 0, 0], [1, 0, 0], [[-0.6, 0.6], [-0.4, 0.4], [-0.25, 0.25]], 0.02, 0.2);
    expect(lo).toBe(0.02);
    expect(hi).toBeCloseTo(0.95, 12);
  });
});

describe('fitMassPeak (Gaussian on a flat background, unbinned)', () => {
  it('over 200 toys of 150 signal (μ = 497.611, σ = 3 MeV) on 100 flat background in [470, 530] MeV (Poisson counts): pulls of the mean and of the signal count have mean 0 ± 0.15, rms 1 ± 0.12', () => {
    const rng = seededRandom(77);
    const pulls: number[] = [], signalPulls: number[] = [];
    for (let s = 0; s < 200; s++) {
      const m: number[] = [];
      // Poisson counts of signal (mean 150) and background (mean 100), as a real spectrum has them.
      const ns = rng.poisson(150), nb = rng.poisson(100);
      for (let i = 0; i < ns; i++) m.push(497.611 + 3 * rng.gaussian());
      for (let i = 0; i < nb; i++) m.push(470 + 60 * rng.uniform());
      const f = fitMassPeak(m, [470, 530]);
      expect(f.status).toBe('ok');
      pulls.push((f.meanMeV - 497.611) / f.sigmaMeanMeV);
      signalPulls.push((f.signal - 150) / f.sigmaSignal);
    }
    const stat = (a: number[]) => { const mean = a.reduce((x, y) => x + y, 0) / a.length; return { mean, rms: Math.sqrt(a.reduce((x, y) => x + (y - mean) ** 2, 0) / a.length) }; };
    const p = stat(pulls);
    expect(pulls.length).toBe(200);
    expect(Math.abs(p.mean)).toBeLessThan(0.15);
    expect(Math.abs(p.rms - 1)).toBeLessThan(0.12);
    const sp = stat(signalPulls);
    expect(Math.abs(sp.mean)).toBeLessThan(0.15);
    expect(Math.abs(sp.rms - 1)).toBeLessThan(0.12);
  });
});
