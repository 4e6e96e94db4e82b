/**
 * The one catalogue of warnings (STYLE.md §13): a function that extrapolates, clamps, leans on an
 * approximation or falls outside its validity range records a warning here instead of printing.
 * A notebook cell's warnings are drained when the cell ends and shown under it; the command line
 * prints them once at the end; a test checks them by code.
 *
 * The store lives on globalThis under a registered symbol, so two copies of this module (one
 * loaded by the kernel, one by a cell importing the package) share it, as the display channel does.
 */

/** Every warning code, with what it means. Add a code here before using it. */
export const WARNING_CODES = Object.freeze({
  OUTSIDE_VALIDITY: 'an input lies outside the stated validity range of a formula; the result is NaN or flagged',
  OUTSIDE_TABLE: 'a look-up falls outside the energies or ranges a table covers; the result is NaN',
  RANGE_TABLE_CLAMPED: 'a requested table range was narrowed to where the formula holds',
  APPROXIMATION: 'a result rests on an approximation beyond its stated accuracy',
  SIM_TRACK_LIMIT: 'the simulator dropped particles beyond its per-event limit',
  HIT_ORDER: 'the hits of a track do not run one way along it, so the charge read from their order may be wrong',
  SPARSE_BINS: 'a χ² fit to a histogram uses bins with fewer than 5 entries, where it is biased; a Poisson likelihood fit is not',
} as const);

export type SagittaWarningCode = keyof typeof WARNING_CODES;

export interface SagittaWarning {
  readonly code: SagittaWarningCode;
  readonly message: string;
  /** Which function raised it. */
  readonly source: string;
  /** How many times the same (code, message) was raised since the last drain. */
  readonly count: number;
}

interface Store {
  readonly pending: { code: SagittaWarningCode; message: string; source: string; count: number }[];
  readonly seen: Map<string, number>;
}

const STORE_KEY = Symbol.for('sagitta.warnings');

function store(): Store {
  const g = globalThis as unknown as Record<symbol, Store | undefined>;
  return (g[STORE_KEY] ??= { pending: [], seen: new Map() });
}

/** Records a warning; identical (code, message) pairs are counted, not repeated. */
export function warn(code: SagittaWarningCode, message: string, source: string): void {
  const { pending, seen } = store();
  const key = `${code}\u0000${message}`;
  const at = seen.get(key);
  if (at === undefined) {
    seen.set(key, pending.length);
    pending.push({ code, message, source, count: 1 });
  } else {
    pending[at].count++;
  }
}

/** Returns and clears the warnings recorded since the last call (the kernel calls it per cell). */
export function consumeWarnings(): SagittaWarning[] {
  const { pending, seen } = store();
  const out = pending.splice(0, pending.length).map((w) => Object.freeze({ ...w }));
  seen.clear();
  return out;
}

/** One line per warning, as the command line and the notebook kernel show them. */
export function formatWarning(w: SagittaWarning): string {
  return `warning [${w.code}]: ${w.message}${w.count > 1 ? ` (×${w.count})` : ''}`;
}
