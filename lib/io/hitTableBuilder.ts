import type { HitColumn, HeaderField } from './hitColumns.js';
import type { HitTable } from './hitTable.js';
import { msg } from '../errors.js';

/**
 * Growable typed-array columns that the readers fill row by row, then freeze into a HitTable.
 * Values arrive already converted to metres.
 */
export class HitTableBuilder {
  private capacity: number;
  private size = 0;
  private readonly present: ReadonlySet<HitColumn>;
  private cols: Record<HitColumn, Float64Array>;
  private lines: Int32Array;

  constructor(fields: readonly HeaderField[], expectedRows = 1024) {
    this.capacity = Math.max(16, expectedRows);
    this.present = new Set(fields.flatMap((f) => (f.column ? [f.column] : [])));
    this.cols = {} as Record<HitColumn, Float64Array>;
    for (const c of this.present) this.cols[c] = new Float64Array(this.capacity);
    this.lines = new Int32Array(this.capacity);
  }

  get rows(): number {
    return this.size;
  }

  /** Starts a new row and returns its index; its values are then written into `column(name)[row]`. */
  addRow(line: number): number {
    if (this.size === this.capacity) this.grow();
    this.lines[this.size] = line;
    return this.size++;
  }

  column(name: HitColumn): Float64Array {
    return this.cols[name];
  }

  /** The current storage of each field's column (null for ignored fields); stale after a grow. */
  fieldArrays(fields: readonly HeaderField[]): (Float64Array | null)[] {
    return fields.map((f) => (f.column ? this.cols[f.column] : null));
  }

  /**
   * For hot loops that write columns directly: makes room for row `row`, records its line, and
   * returns true when the columns moved (call fieldArrays again).
   */
  reserve(row: number, line: number): boolean {
    let grown = false;
    if (row === this.capacity) {
      this.grow();
      grown = true;
    }
    this.lines[row] = line;
    this.size = row + 1;
    return grown;
  }

  private grow(): void {
    this.capacity = Math.ceil(this.capacity * 1.6);
    for (const c of this.present) {
      const next = new Float64Array(this.capacity);
      next.set(this.cols[c]);
      this.cols[c] = next;
    }
    const lines = new Int32Array(this.capacity);
    lines.set(this.lines);
    this.lines = lines;
  }

  finish(file: string, units: Record<string, string>, ignoredColumns: readonly string[]): HitTable {
    const n = this.size;
    if (n === 0) throw msg.emptyFile(file, 'at least one data row after the header');
    // A view when the spare room is small (no copy), a trimmed copy when it is not.
    const trim = this.capacity <= 1.25 * n;
    const take = (c: HitColumn): Float64Array | undefined =>
      this.present.has(c) ? (trim ? this.cols[c].subarray(0, n) : this.cols[c].slice(0, n)) : undefined;
    const sigma = take('sigma');
    return {
      length: n,
      event: take('event')!,
      track: take('track')!,
      x: take('x')!,
      y: take('y')!,
      z: take('z'),
      sigmaX: sigma ?? take('sigma_x'),
      sigmaY: sigma ?? take('sigma_y'),
      sigmaZ: take('sigma_z'),
      source: { file, units, line: trim ? this.lines.subarray(0, n) : this.lines.slice(0, n), ignoredColumns },
    };
  }
}
