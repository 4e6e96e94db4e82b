import type { RoadContext } from './roadContext.js';

/**
 * Counts, for every hit of the event, the hits within `seedRadiusM` of it (3-D when z is
 * measured, else in the bending plane) into ctx.neighbours, and orders the hits for seeding in
 * ctx.seedOrder: hits with exactly two neighbours first (a clean piece of one track: one hit
 * before, one after), then three, four, …; hits with fewer than two cannot seed. Returns how
 * many hits are in the order.
 */
export function orderSeeds(ctx: RoadContext): number {
  const { n, x, y, z, hasZ, grid, neighbours, seedOrder } = ctx;
  const r = ctx.settings.seedRadiusM, r2 = r * r;
  const { start, hits, nx, ny } = grid;
  const bucket = ctx.buckets;
  const BUCKETS = bucket.length - 1;
  bucket.fill(0);
  neighbours.fill(0, 0, n);
  // Each pair once: a cell against itself and its four "forward" neighbours (cells are at least
  // the seed radius wide, so no pair is farther apart than adjacent cells).
  for (let cj = 0; cj < ny; cj++) {
    for (let ci = 0; ci < nx; ci++) {
      const cell = cj * nx + ci;
      const a0 = start[cell], a1 = start[cell + 1];
      if (a0 === a1) continue;
      for (let p = a0; p < a1; p++) {
        const i = hits[p];
        const xi = x[i], yi = y[i], zi = z[i];
        let count = 0;
        for (let q = p + 1; q < a1; q++) {
          const h = hits[q];
          const dx = x[h] - xi, dy = y[h] - yi, dz = hasZ ? z[h] - zi : 0;
          if (dx * dx + dy * dy + dz * dz <= r2) { count++; neighbours[h]++; }
        }
        for (let k = 0; k < 4; k++) {
          const ni = ci + (k === 0 ? 1 : k - 2), nj = cj + (k === 0 ? 0 : 1);
          if (ni < 0 || ni >= nx || nj >= ny) continue;
          const other = nj * nx + ni;
          for (let q = start[other], qEnd = start[other + 1]; q < qEnd; q++) {
            const h = hits[q];
            const dx = x[h] - xi, dy = y[h] - yi, dz = hasZ ? z[h] - zi : 0;
            if (dx * dx + dy * dy + dz * dz <= r2) { count++; neighbours[h]++; }
          }
        }
        neighbours[i] += count;
      }
    }
  }
  for (let i = 0; i < n; i++) {
    const count = neighbours[i];
    if (count >= 2) bucket[Math.min(count, BUCKETS) - 1]++;
  }
  // Counting sort by neighbour count (2, 3, …, ≥ BUCKETS), stable in hit order.
  let total = 0;
  for (let b = 1; b <= BUCKETS; b++) { const c = bucket[b - 1]; bucket[b - 1] = total; total += c; }
  for (let i = 0; i < n; i++) {
    const count = neighbours[i];
    if (count >= 2) seedOrder[bucket[Math.min(count, BUCKETS) - 1]++] = i;
  }
  return total;
}

/**
 * A seed around hit `b`: the two free, unmarked neighbours a, c within the seed radius that make
 * the straightest triplet a–b–c (smallest cos of the angle at b, which must be below
 * `seedCosMax`, i.e. the triplet bends by less than acos(−seedCosMax)). Writes them to
 * out[0] = a, out[1] = c and returns true, or returns false.
 */
export function seedTriplet(ctx: RoadContext, b: number, out: Int32Array): boolean {
  const { x, y, z, hasZ, grid, owner, mark, stamp } = ctx;
  const r = ctx.settings.seedRadiusM, r2 = r * r;
  const { start, hits, nx, ny, x0, y0 } = grid;
  const inv = 1 / grid.cellM;
  const xb = x[b], yb = y[b], zb = z[b];
  const i0 = Math.max(0, Math.floor((xb - r - x0) * inv)), i1 = Math.min(nx - 1, Math.floor((xb + r - x0) * inv));
  const j0 = Math.max(0, Math.floor((yb - r - y0) * inv)), j1 = Math.min(ny - 1, Math.floor((yb + r - y0) * inv));
  // Neighbours are few (a handful): collect them, then try every pair.
  const near = ctx.near;
  let k = 0;
  for (let j = j0; j <= j1 && k < near.length; j++) {
    for (let cell = j * nx + i0, last = j * nx + i1; cell <= last && k < near.length; cell++) {
      for (let q = start[cell], qEnd = start[cell + 1]; q < qEnd && k < near.length; q++) {
        const h = hits[q];
        if (h === b || owner[h] >= 0 || mark[h] === stamp) continue;
        const dx = x[h] - xb, dy = y[h] - yb, dz = hasZ ? z[h] - zb : 0;
        if (dx * dx + dy * dy + dz * dz <= r2) near[k++] = h;
      }
    }
  }
  let bestCos = ctx.settings.seedCosMax, found = false;
  for (let p = 0; p < k; p++) {
    const a = near[p];
    const ax = x[a] - xb, ay = y[a] - yb, az = hasZ ? z[a] - zb : 0;
    const la = Math.sqrt(ax * ax + ay * ay + az * az);
    for (let q = p + 1; q < k; q++) {
      const c = near[q];
      const cx = x[c] - xb, cy = y[c] - yb, cz = hasZ ? z[c] - zb : 0;
      const cos = (ax * cx + ay * cy + az * cz) / (la * Math.sqrt(cx * cx + cy * cy + cz * cz));
      if (cos < bestCos) { bestCos = cos; out[0] = a; out[1] = c; found = true; }
    }
  }
  return found;
}
