import { type MimeBundle } from '../../lib/index.js';

/**
 * A MIME bundle as JSON carries it — the one rule for outputs, applied by the session so that a
 * cell's output is the same in the live kernel, in `sagitta run` and in the executed notebook.
 * Each representation is copied through JSON: a BigInt becomes its decimal text, NaN and ±∞
 * become null and undefined members vanish (JSON's own rules); a representation JSON cannot
 * hold at all (a cycle, a throwing toJSON) is replaced by its text form (`String(value)`).
 * @example jsonSafeBundle({ 'application/json': { n: 10n, x: NaN } }) // { 'application/json': { n: '10', x: null } }
 */
export function jsonSafeBundle(bundle: MimeBundle): MimeBundle {
  const out: MimeBundle = {};
  for (const [mime, value] of Object.entries(bundle)) {
    if (value === undefined) continue;
    try {
      out[mime] = JSON.parse(JSON.stringify(value, bigintAsText)) as unknown;
    } catch {
      out[mime] = String(value);
    }
  }
  return out;
}

function bigintAsText(_key: string, value: unknown): unknown {
  return typeof value === 'bigint' ? value.toString() : value;
}
