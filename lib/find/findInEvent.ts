import { followRoad } from './followRoad.js';
import { fillHitGrid } from './hitGrid.js';
import type { RoadContext } from './roadContext.js';
import { orderSeeds, seedTriplet } from './seedTriplet.js';
import { trimAtKinks } from './trimAtKinks.js';

/**
 * Finds the tracks of one event whose hits are loaded in ctx (x, y, z, n). Seeds are tried in
 * the order of `orderSeeds` (cleanest first); each seed triplet a–b–c is followed forwards from
 * c and backwards from a (`followRoad`), so a seed anywhere on a track gives the whole track,
 * turns of a spiral included. A candidate is kept when it holds at least `minHits` hits of its
 * own and no more than `maxSharedFraction` of its hits are held by earlier tracks; its free
 * hits become its own, the others are counted as shared (a hit belongs to one track only).
 * Results go to ctx.trackCount / trackHits / trackStart / trackShared; ctx.owner holds the
 * track index of each hit (−1: none).
 */
export function findInEvent(ctx: RoadContext): number {
  const { n, owner, settings: o } = ctx;
  fillHitGrid(ctx.grid, ctx.x, ctx.y, n, o.seedRadiusM);
  owner.fill(-1, 0, n);
  ctx.mark.fill(0, 0, n);
  ctx.stamp = 0;
  ctx.trackCount = 0;
  ctx.trackStart[0] = 0;
  const seeds = orderSeeds(ctx);
  const chain = ctx.chain, mid = n + 1, pair = ctx.seedPair;
  let stored = 0;
  for (let q = 0; q < seeds; q++) {
    const b = ctx.seedOrder[q];
    if (owner[b] >= 0) continue;
    const stamp = ++ctx.stamp;
    if (!seedTriplet(ctx, b, pair)) continue;
    chain[mid - 1] = pair[0]; chain[mid] = b; chain[mid + 1] = pair[1];
    const chainS = ctx.chainS;
    chainS[mid] = 0;
    chainS[mid - 1] = -Math.hypot(ctx.x[pair[0]] - ctx.x[b], ctx.y[pair[0]] - ctx.y[b]);
    chainS[mid + 1] = Math.hypot(ctx.x[pair[1]] - ctx.x[b], ctx.y[pair[1]] - ctx.y[b]);
    ctx.mark[pair[0]] = stamp; ctx.mark[b] = stamp; ctx.mark[pair[1]] = stamp;
    const grownTail = followRoad(ctx, mid - 1, mid + 1, 1);
    const grownHead = followRoad(ctx, mid - 1, grownTail, -1);
    const trimmed = trimAtKinks(ctx, grownHead, grownTail, mid, ctx, ctx.seedPair);
    const head = trimmed[0], tail = trimmed[1];
    let own = 0, shared = 0;
    for (let i = head; i <= tail; i++) {
      if (owner[chain[i]] >= 0) shared++;
      else own++;
    }
    if (own < o.minHits || shared > o.maxSharedFraction * (own + shared)) continue;
    const k = ctx.trackCount++;
    for (let i = head; i <= tail; i++) {
      const h = chain[i];
      if (owner[h] >= 0) continue;
      owner[h] = k;
      ctx.trackHits[stored++] = h;
    }
    ctx.trackStart[k + 1] = stored;
    ctx.trackShared[k] = shared;
  }
  return ctx.trackCount;
}
