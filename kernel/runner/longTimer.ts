/** Longest delay setTimeout takes (2³¹ − 1 ms, about 24.8 days); longer ones fire at once with a warning. */
const MAX_DELAY_MS = 2_147_483_647;

/**
 * Calls `fn` after `ms` milliseconds, however long (a `--cell-timeout 1000h` waits 1000 hours,
 * in hops setTimeout can take). Infinity never fires. Returns a function that cancels it.
 * @example const cancel = longTimer(() => stop(), 3.6e9); cancel();
 */
export function longTimer(fn: () => void, ms: number): () => void {
  if (!Number.isFinite(ms)) return () => {};
  let timer: NodeJS.Timeout;
  const due = Date.now() + ms;
  const arm = () => {
    const left = due - Date.now();
    timer = left > MAX_DELAY_MS ? setTimeout(arm, MAX_DELAY_MS) : setTimeout(fn, Math.max(0, left));
  };
  arm();
  return () => clearTimeout(timer);
}
