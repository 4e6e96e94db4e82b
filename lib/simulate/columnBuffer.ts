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

  /** Appends one row; values in the order of the column names (for rare rows; allocates). */
  push(...values: number[]): void {
    const i = this.addRow();
    const cols = this.cols;
    for (let k = 0; k < cols.length; k++) cols[k][i] = values[k];
  }

  /** Appends an empty row and returns its index; fill it with `set` (no allocation). */
  addRow(): number {
    if (this.size === this.capacity) this.grow();
    return this.size++;
  }

  /** Writes column number `k` (position in the names) of row `i`. */
  set(k: number, i: number, value: number): void {
    this.cols[k][i] = value;
  }

  private grow(): void {
    this.capacity *= 2;
    this.cols = this.cols.map((c) => {
      const next = new Float64Array(this.capacity);
      next.set(c);
      return next;
    });
  }

  /**
   * Exact-length columns. Views on the buffers (no copy) when at least half of each buffer is
   * used, copies otherwise, so a finished table never holds more than twice its size.
   */
  finish(): Record<K, Float64Array> {
    const out = {} as Record<K, Float64Array>;
    const view = 2 * this.size >= this.capacity;
    this.names.forEach((n, k) => { out[n] = view ? this.cols[k].subarray(0, this.size) : this.cols[k].slice(0, this.size); });
    return out;
  }
}
