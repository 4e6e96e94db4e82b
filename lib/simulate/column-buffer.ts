/**
 * Growable Float64Array columns, filled row by row by the simulator and frozen into exact-length
 * arrays at the end (no arrays of objects in the hot loop, ARCHITECTURE.md). Columns are kept in
 * one array indexed by position so that `push` is a tight loop.
 */
export class ColumnBuffer<K extends string> {
  private capacity: number;
  private size = 0;
  private cols: Float64Array[];
  private readonly names: readonly K[];

  constructor(names: readonly K[], capacity = 4096) {
    this.names = names;
    this.capacity = Math.max(16, capacity);
    this.cols = names.map(() => new Float64Array(this.capacity));
  }

  get rows(): number {
    return this.size;
  }

  /** Appends one row; values in the order of the column names. */
  push(...values: number[]): void {
    if (this.size === this.capacity) this.grow();
    const i = this.size++;
    const cols = this.cols;
    for (let k = 0; k < cols.length; k++) cols[k][i] = values[k];
  }

  private grow(): void {
    this.capacity *= 2;
    this.cols = this.cols.map((c) => {
      const next = new Float64Array(this.capacity);
      next.set(c);
      return next;
    });
  }

  /** Exact-length copies of every column. */
  finish(): Record<K, Float64Array> {
    const out = {} as Record<K, Float64Array>;
    this.names.forEach((n, k) => { out[n] = this.cols[k].slice(0, this.size); });
    return out;
  }
}
