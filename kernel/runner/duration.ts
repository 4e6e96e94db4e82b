import { msg } from '../../lib/internal.js';

const UNITS: Readonly<Record<string, number>> = Object.freeze({ ms: 1, s: 1000, m: 60_000, min: 60_000, h: 3_600_000 });

/**
 * Reads a duration like "120s", "2 min", "1500ms" or "1h" (a bare number is seconds) into
 * milliseconds. "0" means no limit (Infinity).
 * @example parseDuration('2s') // 2000
 */
export function parseDuration(text: string, what = '--cell-timeout'): number {
  const m = /^\s*(\d+(?:\.\d+)?)\s*(ms|s|min|m|h)?\s*$/i.exec(text);
  if (!m) throw msg.badArgument(what, text, 'a duration such as "120s", "2min", "500ms" or "0" for no limit');
  const value = Number(m[1]) * UNITS[(m[2] ?? 's').toLowerCase()];
  return value === 0 ? Infinity : value;
}
