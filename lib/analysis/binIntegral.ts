import { isShape, type Model } from './shapes/shape.js';

// Gauss–Legendre nodes and weights on [−1, 1] (Abramowitz & Stegun, Table 25.4).
const NODES_3 = [-Math.sqrt(0.6), 0, Math.sqrt(0.6)];
const WEIGHTS_3 = [5 / 9, 8 / 9, 5 / 9];

/**
 * ∫ₐᵇ model(x, p) dx for one bin: the shape's exact integral when it has one, otherwise
 * 3-point Gauss–Legendre quadrature (exact for polynomials to degree 5; for a Gaussian of σ
 * equal to the bin width the error is ~1e-3 of the bin content, falling as (width/σ)⁶).
 * Returns a function (a, b, p) => integral.
 */
export function binIntegrator(model: Model): (a: number, b: number, p: Float64Array) => number {
  if (isShape(model)) {
    if (model.integral) { const integral = model.integral.bind(model); return (a, b, p) => integral(a, b, p, 0); }
    const value = model.value.bind(model);
    return (a, b, p) => gauss3((x) => value(x, p, 0), a, b);
  }
  return (a, b, p) => gauss3((x) => model(x, p), a, b);
}

function gauss3(f: (x: number) => number, a: number, b: number): number {
  const c = 0.5 * (a + b), h = 0.5 * (b - a);
  return h * (WEIGHTS_3[0] * f(c + h * NODES_3[0]) + WEIGHTS_3[1] * f(c) + WEIGHTS_3[2] * f(c + h * NODES_3[2]));
}

// 20-point Gauss–Legendre on [−1, 1] (nodes and weights by Newton iteration on P₂₀, once).
let nodes20: { x: Float64Array; w: Float64Array } | undefined;
function gaussLegendre20(): { x: Float64Array; w: Float64Array } {
  if (nodes20) return nodes20;
  const n = 20, x = new Float64Array(n), w = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let z = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5)), dp = 0;
    for (let it = 0; it < 100; it++) {
      let p0 = 1, p1 = 0;
      for (let k = 1; k <= n; k++) { const p2 = p1; p1 = p0; p0 = ((2 * k - 1) * z * p1 - (k - 1) * p2) / k; }
      dp = (n * (z * p0 - p1)) / (z * z - 1);
      const dz = p0 / dp;
      z -= dz;
      if (Math.abs(dz) < 1e-16) break;
    }
    x[i] = z;
    w[i] = 2 / ((1 - z * z) * dp * dp);
  }
  return (nodes20 = { x, w });
}

/**
 * ∫ₐᵇ model(x, p) dx over a whole fit range: the exact integral when the shape has one, else
 * adaptive 20-point Gauss–Legendre: `pieces` equal panels (default 32), each halved until the
 * panel and its two halves agree to 1e-13 of the running total (at most 30 halvings). A
 * feature narrower than the panels that no node touches is missed, as by any quadrature:
 * give such a model its integral (a Shape).
 */
export function rangeIntegrator(model: Model, pieces = 32): (a: number, b: number, p: Float64Array) => number {
  if (isShape(model) && model.integral) { const integral = model.integral.bind(model); return (a, b, p) => integral(a, b, p, 0); }
  const f = isShape(model) ? (x: number, p: Float64Array) => model.value(x, p, 0) : model;
  return (a, b, p) => {
    const { x, w } = gaussLegendre20();
    const panel = (lo: number, hi: number) => {
      const c = 0.5 * (lo + hi), h = 0.5 * (hi - lo);
      let s = 0;
      for (let i = 0; i < x.length; i++) s += w[i] * f(c + h * x[i], p);
      return h * s;
    };
    const width = (b - a) / pieces;
    const whole = new Float64Array(pieces);
    let total = 0;
    for (let k = 0; k < pieces; k++) { whole[k] = panel(a + k * width, a + (k + 1) * width); total += whole[k]; }
    const refine = (lo: number, hi: number, estimate: number, depth: number): number => {
      const mid = 0.5 * (lo + hi);
      const left = panel(lo, mid), right = panel(mid, hi);
      if (depth >= 30 || Math.abs(left + right - estimate) <= 1e-13 * Math.abs(total)) return left + right;
      return refine(lo, mid, left, depth + 1) + refine(mid, hi, right, depth + 1);
    };
    let sum = 0;
    for (let k = 0; k < pieces; k++) sum += refine(a + k * width, a + (k + 1) * width, whole[k], 0);
    return sum;
  };
}
