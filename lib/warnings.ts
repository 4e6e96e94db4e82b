/**
 * Collected warnings (STYLE.md §13): a function that extrapolates, clamps or falls outside its
 * validity range records a warning here instead of printing. A notebook shows them with
 * `consumeWarnings()`, a test checks them, the CLI prints them once at the end.
 */

export interface SagittaWarning {
  /** Stable code, e.g. 'BELOW_VALIDITY'. */
  readonly code: string;
  readonly message: string;
  /** Which function raised it. */
  readonly source: string;
}

const pending: SagittaWarning[] = [];
const seen = new Map<string, number>();

/** Records a warning; identical (code, message) pairs are counted, not repeated. */
export function warn(code: string, message: string, source: string): void {
  const key = `${code}\u0000${message}`;
  const count = seen.get(key) ?? 0;
  seen.set(key, count + 1);
  if (count === 0) pending.push({ code, message, source });
}

/** Returns and clears the warnings recorded since the last call. */
export function consumeWarnings(): SagittaWarning[] {
  const out = pending.splice(0, pending.length);
  seen.clear();
  return out;
}

/** Warnings recorded so far, without clearing them. */
export function peekWarnings(): readonly SagittaWarning[] {
  return pending.slice();
}
