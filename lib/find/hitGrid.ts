/**
 * A uniform grid over one event's hits in the bending plane (cell lists): the hits of cell
 * (i, j) are `hits[start[c]] … hits[start[c + 1] − 1]` with c = j·nx + i. Built by a counting
 * sort in two passes, so a query looks only at the cells a search box overlaps (common practice
 * for neighbour searches in pattern recognition).
 *
 * The arrays are scratch owned by the caller and grown on demand (`fillHitGrid`); nothing is
 * allocated per event once they are large enough.
 */
export interface HitGrid {
  cellM: number;
  x0: number;
  y0: number;
  nx: number;
  ny: number;
  start: Int32Array;
  hits: Int32Array;
  /** Cell index of each hit (scratch for the sort). */
  cellOf: Int32Array;
}

/** Largest number of cells along one side; a wider event gets larger cells. */
const MAX_CELLS_PER_SIDE = 2048;

export function createHitGrid(): HitGrid {
  return { cellM: 1, x0: 0, y0: 0, nx: 1, ny: 1, start: new Int32Array(2), hits: new Int32Array(16), cellOf: new Int32Array(16) };
}

/**
 * Sorts hits 0…n−1 with coordinates x, y [m] into cells of about `cellM` [m] (larger when the
 * event is too wide for MAX_CELLS_PER_SIDE cells). Non-finite coordinates are left out.
 */
export function fillHitGrid(grid: HitGrid, x: Float64Array, y: Float64Array, n: number, cellM: number): void {
  let xMin = Infinity, xMax = -Infinity, yMin = Infinity, yMax = -Infinity;
  for (let i = 0; i < n; i++) {
    const a = x[i], b = y[i];
    if (a < xMin) xMin = a;
    if (a > xMax) xMax = a;
    if (b < yMin) yMin = b;
    if (b > yMax) yMax = b;
  }
  if (!(xMax >= xMin) || !(yMax >= yMin)) { xMin = xMax = yMin = yMax = 0; }
  const cell = Math.max(cellM, (xMax - xMin) / (MAX_CELLS_PER_SIDE - 1), (yMax - yMin) / (MAX_CELLS_PER_SIDE - 1), 1e-12);
  const nx = Math.floor((xMax - xMin) / cell) + 1;
  const ny = Math.floor((yMax - yMin) / cell) + 1;
  const cells = nx * ny;
  if (grid.start.length < cells + 1) grid.start = new Int32Array(Math.max(cells + 1, 2 * grid.start.length));
  if (grid.hits.length < n) { grid.hits = new Int32Array(2 * n); grid.cellOf = new Int32Array(2 * n); }
  const start = grid.start, cellOf = grid.cellOf, hits = grid.hits;
  start.fill(0, 0, cells + 1);
  const inv = 1 / cell;
  for (let i = 0; i < n; i++) {
    const a = x[i], b = y[i];
    if (!(a === a && b === b) || a === Infinity || a === -Infinity || b === Infinity || b === -Infinity) { cellOf[i] = -1; continue; }
    const c = Math.floor((b - yMin) * inv) * nx + Math.floor((a - xMin) * inv);
    cellOf[i] = c;
    start[c + 1]++;
  }
  for (let c = 0; c < cells; c++) start[c + 1] += start[c];
  // start[c + 1] is now the end of cell c. Filling each cell from its end, hits keep their order
  // within a cell and start[c + 1] ends at the first slot of cell c; one shift puts it in start[c].
  const placed = start[cells];
  for (let i = n - 1; i >= 0; i--) {
    const c = cellOf[i];
    if (c >= 0) hits[--start[c + 1]] = i;
  }
  for (let c = 0; c < cells; c++) start[c] = start[c + 1];
  start[cells] = placed;
  grid.cellM = cell; grid.x0 = xMin; grid.y0 = yMin; grid.nx = nx; grid.ny = ny;
}
