import { type IdLabels, idText, msg } from '../../lib/internal.js';

/** The K-th of N slices of an input (1 ≤ K ≤ N), as given by `--shard K/N`. */
export interface Shard {
  readonly index: number;
  readonly count: number;
}

/** Reads "K/N" (for example "3/8"); throws a usage error naming the flag otherwise. */
export function parseShard(text: string, flag = '--shard'): Shard {
  const m = /^\s*(\d{1,6})\s*\/\s*(\d{1,6})\s*$/.exec(text);
  const k = m ? Number(m[1]) : NaN, n = m ? Number(m[2]) : NaN;
  if (!(n >= 1 && k >= 1 && k <= n)) throw msg.badArgument(flag, text, 'K/N with 1 ≤ K ≤ N, e.g. 3/8 (the third of eight slices)');
  return { index: k, count: n };
}

/**
 * Which slice (1…N) an event belongs to: FNV-1a (32-bit) of the event id's exact decimal text,
 * modulo N. It depends on the id alone — not on the file's order, the thread count or the
 * format — so N jobs given K = 1…N together cover every event exactly once.
 */
export function shardOfEvent(eventId: number, labels: IdLabels | undefined, count: number): number {
  if (count === 1) return 1;
  const text = idText(eventId, labels);
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return (h % count) + 1;
}
