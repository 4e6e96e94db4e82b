import { msg } from '../errors.js';

/** A fitted mass peak. Masses [MeV]. */
export interface MassPeakFit {
  readonly meanMeV: number;
  readonly sigmaMeanMeV: number;
  /** Gaussian width of the peak and its error. */
  readonly widthMeV: number;
  readonly sigmaWidthMeV: number;
  /**
   * Fitted number of signal candidates (fraction × candidates in the window) and its error,
   * which adds the Poisson fluctuation of the window's count to the fraction's error
   * (σ² = n²σ_f² + f²n, as an extended likelihood would give).
   */
  readonly signal: number;
  readonly sigmaSignal: number;
  /** Candidates inside the window. */
  readonly inWindow: number;
  readonly iterations: number;
  readonly status: 'ok' | 'not-converged' | 'too-few';
}

/**
 * Mass peak fitted to candidate masses by an unbinned likelihood: a Gaussian signal on a flat
 * background inside the window [lo, hi],
 *   L = Πᵢ [ f·N(mᵢ; μ, σ) + (1 − f)/(hi − lo) ],
 * maximised by expectation–maximisation (each step raises L; Dempster, Laird & Rubin, JRSS B 39
 * (1977) 1), errors from the inverse of the observed information (the numerical Hessian of
 * −ln L in (f, μ, σ)). Valid when the peak lies at least 3σ inside the window (the Gaussian's
 * tails outside it are neglected). The project's general fitting layer (histograms, other
 * shapes) is the place for anything beyond this one model.
 * @example fitMassPeak(candidates.massPiPiMeV, [470, 530]).meanMeV // ≈ 497.6 for K⁰_S
 */
export function fitMassPeak(massesMeV: ArrayLike<number>, window: readonly [number, number], start: { readonly meanMeV?: number; readonly widthMeV?: number } = {}): MassPeakFit {
  const [lo, hi] = window;
  if (!(hi > lo)) throw msg.badArgument('window', window, 'a mass window [low, high] with high > low, in MeV');
  const m: number[] = [];
  for (let i = 0; i < massesMeV.length; i++) { const v = massesMeV[i]; if (v >= lo && v <= hi) m.push(v); }
  const n = m.length;
  const fail = (status: MassPeakFit['status'], it = 0): MassPeakFit => ({ meanMeV: NaN, sigmaMeanMeV: NaN, widthMeV: NaN, sigmaWidthMeV: NaN, signal: NaN, sigmaSignal: NaN, inWindow: n, iterations: it, status });
  if (n < 5) return fail('too-few');
  const bkg = 1 / (hi - lo);
  let mu = start.meanMeV ?? median(m), sigma = start.widthMeV ?? (hi - lo) / 20, f = 0.5;
  const r = new Float64Array(n);
  let it = 0, converged = false;
  for (; it < 500 && !converged; it++) {
    let sr = 0, srm = 0;
    for (let i = 0; i < n; i++) {
      const g = f * gauss(m[i], mu, sigma);
      r[i] = g / (g + (1 - f) * bkg);
      sr += r[i]; srm += r[i] * m[i];
    }
    const muNew = srm / sr;
    let srv = 0;
    for (let i = 0; i < n; i++) srv += r[i] * (m[i] - muNew) ** 2;
    const sigmaNew = Math.sqrt(srv / sr);
    const fNew = sr / n;
    converged = Math.abs(muNew - mu) < 1e-9 * (hi - lo) && Math.abs(sigmaNew - sigma) < 1e-9 * (hi - lo) && Math.abs(fNew - f) < 1e-10;
    mu = muNew; sigma = sigmaNew; f = Math.min(1, fNew);
    if (!(sigma > 0)) return fail('not-converged', it);
  }
  const nll = (p: readonly number[]) => {
    let s = 0;
    for (let i = 0; i < n; i++) s -= Math.log(p[0] * gauss(m[i], p[1], p[2]) + (1 - p[0]) * bkg);
    return s;
  };
  const p = [Math.min(f, 1 - 1e-9), mu, sigma];
  const h = [Math.max(1e-5, 1e-3 * Math.min(p[0], 1 - p[0])), 1e-3 * sigma, 1e-3 * sigma];
  const H = hessian(nll, p, h);
  const C = invert3(H);
  return {
    meanMeV: mu, sigmaMeanMeV: Math.sqrt(C[4]), widthMeV: sigma, sigmaWidthMeV: Math.sqrt(C[8]),
    signal: f * n, sigmaSignal: Math.sqrt(n * n * C[0] + f * f * n), inWindow: n, iterations: it, status: converged ? 'ok' : 'not-converged',
  };
}

function gauss(x: number, mu: number, sigma: number): number {
  const z = (x - mu) / sigma;
  return Math.exp(-0.5 * z * z) / (sigma * Math.sqrt(2 * Math.PI));
}

function median(a: readonly number[]): number {
  const s = [...a].sort((x, y) => x - y);
  return s[s.length >> 1];
}

function hessian(f: (p: readonly number[]) => number, p: readonly number[], h: readonly number[]): number[] {
  const H = new Array<number>(9).fill(0);
  const at = (di: number, dj: number, i: number, j: number) => { const q = [...p]; q[i] += di; q[j] += dj; return f(q); };
  for (let i = 0; i < 3; i++) for (let j = i; j < 3; j++) {
    const v = i === j
      ? (at(h[i], 0, i, i) - 2 * f(p) + at(-h[i], 0, i, i)) / (h[i] * h[i])
      : (at(h[i], h[j], i, j) - at(h[i], -h[j], i, j) - at(-h[i], h[j], i, j) + at(-h[i], -h[j], i, j)) / (4 * h[i] * h[j]);
    H[3 * i + j] = H[3 * j + i] = v;
  }
  return H;
}

function invert3(m: readonly number[]): number[] {
  const [a, b, c, d, e, f, g, h, i] = m;
  const A = e * i - f * h, B = -(d * i - f * g), C = d * h - e * g;
  const det = a * A + b * B + c * C;
  return [A / det, -(b * i - c * h) / det, (b * f - c * e) / det, B / det, (a * i - c * g) / det, -(a * f - c * d) / det, C / det, -(a * h - b * g) / det, (a * e - b * d) / det];
}
