import { msg } from '../errors.js';
import { Histogram } from './histogram.js';

/** Binning of each axis of a 2-D histogram, as for `Histogram`. */
export interface Histogram2DBinning {
  readonly x: { readonly bins?: number; readonly range?: readonly [number, number]; readonly edges?: ArrayLike<number> };
  readonly y: { readonly bins?: number; readonly range?: readonly [number, number]; readonly edges?: ArrayLike<number> };
}

/**
 * A two-dimensional histogram of weighted entries: Σw and Σw² per cell, row-major by y
 * (cell (i, j) = x bin i, y bin j at index j·nx + i), with the sum of weights of finite pairs
 * outside the grid and a count of non-finite pairs. Cells are half-open in both axes.
 * @example new Histogram2D({ x: { bins: 50, range: [-60, 60] }, y: { bins: 40, range: [-40, 40] } }).fill(xCm, yCm)
 */
export class Histogram2D {
  readonly xEdges: Float64Array;
  readonly yEdges: Float64Array;
  readonly sumW: Float64Array;
  readonly sumW2: Float64Array;
  private out = 0;
  private bad = 0;
  private inside = 0;
  private readonly xAxis: Histogram;
  private readonly yAxis: Histogram;

  constructor(binning: Histogram2DBinning) {
    // One-dimensional histograms do the validation and the bin look-up of each axis.
    this.xAxis = new Histogram(binning.x);
    this.yAxis = new Histogram(binning.y);
    this.xEdges = this.xAxis.edges;
    this.yEdges = this.yAxis.edges;
    this.sumW = new Float64Array(this.xAxis.bins * this.yAxis.bins);
    this.sumW2 = new Float64Array(this.sumW.length);
  }

  get xBins(): number { return this.xAxis.bins; }
  get yBins(): number { return this.yAxis.bins; }
  /** Sum of weights of finite pairs outside the grid. */
  get outside(): number { return this.out; }
  /** Pairs with a non-finite coordinate or weight (never binned). */
  get nonFinite(): number { return this.bad; }
  /** Pairs that fell into a cell. */
  get entries(): number { return this.inside; }

  /** Σw of cell (ix, iy). */
  at(ix: number, iy: number): number { return this.sumW[iy * this.xAxis.bins + ix]; }

  /** Adds the pairs (x[i], y[i]) with weight 1, weights[i], or one common weight. */
  fill(x: ArrayLike<number>, y: ArrayLike<number>, weights?: ArrayLike<number> | number): this {
    if (x.length !== y.length) throw msg.badArgument('y', `${y.length} values`, `as many values as x (${x.length})`);
    if (weights !== undefined && typeof weights !== 'number' && weights.length !== x.length) throw msg.badArgument('weights', `${weights.length} weights`, `one weight per pair (${x.length})`);
    const nx = this.xAxis.bins, ny = this.yAxis.bins;
    for (let i = 0; i < x.length; i++) {
      const w = weights === undefined ? 1 : typeof weights === 'number' ? weights : weights[i];
      const ix = this.xAxis.binOf(x[i]), iy = this.yAxis.binOf(y[i]);
      if (Number.isNaN(ix) || Number.isNaN(iy) || !Number.isFinite(w)) { this.bad++; continue; }
      if (ix < 0 || ix >= nx || iy < 0 || iy >= ny) { this.out += w; continue; }
      const k = iy * nx + ix;
      this.sumW[k] += w;
      this.sumW2[k] += w * w;
      this.inside++;
    }
    return this;
  }
}
