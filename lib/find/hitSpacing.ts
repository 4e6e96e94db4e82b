import { createHitGrid, fillHitGrid } from './hitGrid.js';

/**
 * The typical distance between neighbouring hits of a track [m], estimated as the median
 * distance from a hit to its nearest neighbour (3-D when z is given) over the events listed,
 * up to `maxHits` hits in all. Tracks sampled every d of path give ≈ d; noise hits, far from
 * everything, sit in the upper tail and do not move the median while they are a minority.
 * Two passes: the first uses cells of the mean spacing of a uniform spread, the second cells
 * of twice the first estimate. NaN when no hit has a neighbour.
 * @example estimateHitSpacing(x, y, z, eventOffsets, eventRows) // ≈ 0.01 for hits every 10 mm
 */
export function estimateHitSpacing(
  x: Float64Array, y: Float64Array, z: Float64Array | undefined,
  eventOffsets: Int32Array, eventRows: Int32Array, maxHits = 50_000,
): number {
  let guess = NaN;
  for (let pass = 0; pass < 2; pass++) {
    const found: number[] = [];
    const grid = createHitGrid();
    let lx = new Float64Array(256), ly = new Float64Array(256), lz = new Float64Array(256);
    for (let e = 0; e + 1 < eventOffsets.length && found.length < maxHits; e++) {
      const from = eventOffsets[e], n = eventOffsets[e + 1] - from;
      if (n < 2) continue;
      if (lx.length < n) { lx = new Float64Array(2 * n); ly = new Float64Array(2 * n); lz = new Float64Array(2 * n); }
      let xMin = Infinity, xMax = -Infinity, yMin = Infinity, yMax = -Infinity;
      for (let i = 0; i < n; i++) {
        const r = eventRows[from + i];
        lx[i] = x[r]; ly[i] = y[r]; lz[i] = z ? z[r] : 0;
        xMin = Math.min(xMin, lx[i]); xMax = Math.max(xMax, lx[i]); yMin = Math.min(yMin, ly[i]); yMax = Math.max(yMax, ly[i]);
      }
      const cell = pass === 0 || !(guess > 0) ? Math.max(Math.sqrt(((xMax - xMin) * (yMax - yMin)) / n), 1e-9) : 2 * guess;
      fillHitGrid(grid, lx, ly, n, cell);
      const { start, hits, nx, ny, x0, y0 } = grid;
      const inv = 1 / grid.cellM;
      for (let i = 0; i < n; i++) {
        const ci = Math.floor((lx[i] - x0) * inv), cj = Math.floor((ly[i] - y0) * inv);
        let best = Infinity;
        for (let j = Math.max(0, cj - 1); j <= Math.min(ny - 1, cj + 1); j++) {
          for (let c = j * nx + Math.max(0, ci - 1), last = j * nx + Math.min(nx - 1, ci + 1); c <= last; c++) {
            for (let q = start[c]; q < start[c + 1]; q++) {
              const h = hits[q];
              if (h === i) continue;
              const d2 = (lx[h] - lx[i]) ** 2 + (ly[h] - ly[i]) ** 2 + (lz[h] - lz[i]) ** 2;
              if (d2 < best) best = d2;
            }
          }
        }
        if (best < Infinity && best > 0) found.push(Math.sqrt(best));
      }
    }
    if (found.length === 0) return NaN;
    found.sort((a, b) => a - b);
    guess = found[found.length >> 1];
  }
  return guess;
}
