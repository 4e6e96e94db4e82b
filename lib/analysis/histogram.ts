import { msg } from '../errors.js';

/** How to bin: `bins` equal bins over `range`, or explicit increasing `edges` (variable widths). */
export interface HistogramBinning {
  readonly bins?: number;
  /** [low, high] in the values' unit; bins are [low + k·w, low + (k+1)·w). */
  readonly range?: readonly [number, number];
  /** Strictly increasing bin edges (one more than the number of bins); overrides bins and range. */
  readonly edges?: ArrayLike<number>;
}

/**
 * A one-dimensional histogram of weighted entries: per bin the sum of weights Σw and the sum of
 * squared weights Σw², plus underflow and overflow (sums of weights below the first and at or
 * above the last edge) and a count of non-finite values or weights, which are never binned.
 * Bins are half-open, [eₖ, eₖ₊₁). Unweighted counts are exact integers (to 2⁵³), so histograms
 * filled from shards add up exactly (`addHistograms`). Fill from typed arrays with `fill`.
 * @example const h = new Histogram({ bins: 10, range: [0, 1] }).fill(values)
 */
export class Histogram {
  readonly edges: Float64Array;
  /** Σw per bin. */
  readonly sumW: Float64Array;
  private w2: Float64Array | undefined;
  private under = 0;
  private over = 0;
  private bad = 0;
  private inRange = 0;
  /** The common weight of every entry (1 for counts; s after scaling counts by s), NaN once weights differ. */
  private unit = 1;
  private readonly lo: number;
  private readonly hi: number;
  private readonly invWidth: number;
  private readonly uniform: boolean;
  /** Variable bins: per cell of an equal grid over the range, the bin holding the cell's start (see locate). */
  private readonly guide: Int32Array | undefined;
  private readonly guideScale: number;

  constructor(binning: HistogramBinning) {
    if (binning.edges !== undefined) {
      const e = Float64Array.from(binning.edges);
      if (e.length < 2 || !e.every(Number.isFinite) || e.some((v, i) => i > 0 && !(v > e[i - 1]))) {
        throw msg.badArgument('edges', Array.from(binning.edges), 'at least two finite, strictly increasing bin edges');
      }
      this.edges = e;
    } else {
      const n = binning.bins ?? 0;
      if (!Number.isInteger(n) || n < 1) throw msg.badArgument('bins', binning.bins, 'a whole number ≥ 1 (with range), or edges');
      const r = binning.range;
      if (!r || !Number.isFinite(r[0]) || !Number.isFinite(r[1]) || !(r[1] > r[0])) throw msg.badArgument('range', r, 'finite [low, high] with low < high, in the values\' unit');
      this.edges = new Float64Array(n + 1);
      for (let k = 0; k <= n; k++) this.edges[k] = r[0] + ((r[1] - r[0]) * k) / n;
      this.edges[n] = r[1];
    }
    const n = this.edges.length - 1;
    this.sumW = new Float64Array(n);
    this.lo = this.edges[0];
    this.hi = this.edges[n];
    this.invWidth = n / (this.hi - this.lo);
    this.uniform = binning.edges === undefined || this.edges.every((v, k) => Math.abs(v - (this.lo + (k * (this.hi - this.lo)) / n)) <= 1e-12 * (this.hi - this.lo));
    // Variable bins: an equal grid of cells about as wide as the narrowest bin (at most 16 per
    // bin, 2¹⁶ in all) maps a value to its bin in one multiplication and a step or two.
    let narrowest = Infinity;
    for (let k = 0; k < n; k++) narrowest = Math.min(narrowest, this.edges[k + 1] - this.edges[k]);
    const cells = this.uniform ? 0 : Math.min(1 << 16, 16 * n, Math.max(n, Math.ceil((this.hi - this.lo) / narrowest)));
    this.guideScale = cells / (this.hi - this.lo);
    if (cells > 0) {
      const guide = new Int32Array(cells);
      for (let g = 0, k = 0; g < cells; g++) {
        const start = this.lo + g / this.guideScale;
        while (k + 1 < n && this.edges[k + 1] <= start) k++;
        guide[g] = k;
      }
      this.guide = guide;
    }
  }

  /** Number of bins. */
  get bins(): number { return this.sumW.length; }
  /** Σw² per bin (for unweighted counts the same numbers as sumW, scaled by the unit weight). */
  get sumW2(): Float64Array {
    if (this.w2) return this.w2;
    const u = this.unit;
    return u === 1 ? this.sumW : this.sumW.map((v) => v * u);
  }
  /** Sum of weights below the first edge. */
  get underflow(): number { return this.under; }
  /** Sum of weights at or above the last edge. */
  get overflow(): number { return this.over; }
  /** Values or weights that were NaN or ±Infinity (not binned, not in under/overflow). */
  get nonFinite(): number { return this.bad; }
  /** Number of values that fell into a bin. */
  get entries(): number { return this.inRange; }
  /** The weight every entry carries (1 for plain counts), or NaN when weights differ. */
  get unitWeight(): number { return this.unit; }
  /** True when every entry has the same weight (Poisson intervals then apply to sumW / unitWeight). */
  get isCounts(): boolean { return !Number.isNaN(this.unit); }

  /** Bin centres. */
  centres(): Float64Array { return this.sumW.map((_, k) => 0.5 * (this.edges[k] + this.edges[k + 1])); }
  /** Bin widths. */
  widths(): Float64Array { return this.sumW.map((_, k) => this.edges[k + 1] - this.edges[k]); }
  /** Σw over the bins (under- and overflow excluded). */
  total(): number { let t = 0; for (let k = 0; k < this.sumW.length; k++) t += this.sumW[k]; return t; }

  /** The bin holding x: −1 below the range, `bins` at or above it, NaN for a non-finite x. */
  binOf(x: number): number {
    if (!Number.isFinite(x)) return NaN;
    if (x < this.lo) return -1;
    if (x >= this.hi) return this.bins;
    return this.locate(x);
  }

  /**
   * Adds `values`, each with weight 1, with the matching entry of `weights`, or with one common
   * weight. Typed arrays fill at memory speed: ≥ 100 M values/s per core for equal bins, about
   * as fast for variable bins through the look-up grid (test/bench/analysis.ts). Returns this histogram.
   */
  fill(values: ArrayLike<number>, weights?: ArrayLike<number> | number): this {
    const common = weights === undefined ? 1 : weights;
    if (common === this.unit) return this.fillUnit(values); // every entry keeps the common weight: Σw² = unit · Σw
    weights = common;
    if (typeof weights !== 'number' && weights.length !== values.length) throw msg.badArgument('weights', `${weights.length} weights`, `one weight per value (${values.length})`);
    const w2 = (this.w2 ??= Float64Array.from(this.sumW2));
    const sw = this.sumW;
    for (let i = 0; i < values.length; i++) {
      const v = values[i];
      const w = typeof weights === 'number' ? weights : weights[i];
      if (!Number.isFinite(v) || !Number.isFinite(w)) { this.bad++; continue; }
      if (v < this.lo) { this.under += w; continue; }
      if (v >= this.hi) { this.over += w; continue; }
      const k = this.locate(v);
      sw[k] += w;
      w2[k] += w * w;
      this.inRange++;
    }
    this.unit = NaN;
    return this;
  }

  private fillUnit(values: ArrayLike<number>): this {
    const sw = this.sumW, lo = this.lo, hi = this.hi, inv = this.invWidth, n = sw.length, u = this.unit;
    let under = 0, over = 0, bad = 0, inside = 0;
    if (this.uniform) {
      for (let i = 0; i < values.length; i++) {
        const v = values[i];
        if (v >= lo && v < hi) {
          let k = ((v - lo) * inv) | 0;
          if (k >= n) k = n - 1; // v just below hi, rounded up
          sw[k] += u;
          inside++;
        } else if (v < lo) { if (v === -Infinity) bad++; else under += u; }
        else if (v >= hi) { if (v === Infinity) bad++; else over += u; }
        else bad++;
      }
    } else {
      for (let i = 0; i < values.length; i++) {
        const v = values[i];
        if (v >= lo && v < hi) { sw[this.locate(v)] += u; inside++; }
        else if (v < lo) { if (v === -Infinity) bad++; else under += u; }
        else if (v >= hi) { if (v === Infinity) bad++; else over += u; }
        else bad++;
      }
    }
    this.under += under; this.over += over; this.bad += bad; this.inRange += inside;
    return this;
  }

  private locate(v: number): number {
    if (this.uniform) {
      const k = ((v - this.lo) * this.invWidth) | 0;
      return k >= this.sumW.length ? this.sumW.length - 1 : k;
    }
    // lo ≤ v < hi here. The bins of v's cell run from the one holding its start to the one
    // holding the next cell's start; rounding of (v − lo)·scale across a cell edge is put right
    // by a step, and a cell holding many narrow bins is searched by bisection.
    const e = this.edges, guide = this.guide!, cells = guide.length;
    let g = ((v - this.lo) * this.guideScale) | 0;
    if (g >= cells) g = cells - 1;
    let a = guide[g];
    while (a > 0 && e[a] > v) a--;
    let b = g + 1 < cells ? guide[g + 1] + 1 : this.sumW.length;
    while (b < this.sumW.length && e[b] <= v) b++;
    while (b - a > 1) { const c = (a + b) >> 1; if (e[c] <= v) a = c; else b = c; } // e[a] ≤ v < e[b]
    return a;
  }

  /** @internal Builds a histogram from parts (used by addHistograms and scaleHistogram). */
  static fromParts(parts: { edges: Float64Array; sumW: Float64Array; sumW2?: Float64Array; underflow: number; overflow: number; nonFinite: number; entries: number; unitWeight: number }): Histogram {
    const h = new Histogram({ edges: parts.edges });
    h.sumW.set(parts.sumW);
    h.w2 = parts.sumW2 ? Float64Array.from(parts.sumW2) : undefined;
    h.under = parts.underflow; h.over = parts.overflow; h.bad = parts.nonFinite; h.inRange = parts.entries;
    h.unit = parts.unitWeight;
    return h;
  }
}
