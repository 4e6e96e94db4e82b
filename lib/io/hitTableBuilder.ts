import type { HitColumn, HeaderField } from './hitColumns.js';
import type { HitTable, HitTableSource } from './hitTable.js';
import { encodeWideIds, type IdLabels } from './hitIds.js';
import { msg } from '../errors.js';

/** Error columns: every value must be a positive length (a zero or negative error is a typo). */
const ERROR_COLUMNS: readonly HitColumn[] = ['sigma', 'sigma_x', 'sigma_y', 'sigma_z'];

/**
 * Growable typed-array columns that the readers fill row by row, then freeze into a HitTable.
 * Values arrive already converted to metres; ids too large for a double arrive as text
 * (`wideId`) and are turned into order codes at the end (see hitIds.ts).
 */
export class HitTableBuilder {
  private capacity: number;
  private size = 0;
  private readonly present: ReadonlySet<HitColumn>;
  private cols: Record<HitColumn, Float64Array>;
  private lines: Int32Array;
  private positions: Float64Array | undefined;
  private wide: { event?: Map<number, string>; track?: Map<number, string> } = {};
  /** Error columns present, with their header field (for messages in the file's own unit). */
  private readonly errorFields: ReadonlyMap<HitColumn, HeaderField>;

  /** `withPositions`: also keep each row's position in the input (byte offset or row number). */
  constructor(fields: readonly HeaderField[], expectedRows = 1024, withPositions = false) {
    this.capacity = Math.max(16, expectedRows);
    this.present = new Set(fields.flatMap((f) => (f.column ? [f.column] : [])));
    this.cols = {} as Record<HitColumn, Float64Array>;
    for (const c of this.present) this.cols[c] = new Float64Array(this.capacity);
    this.lines = new Int32Array(this.capacity);
    if (withPositions) this.positions = new Float64Array(this.capacity);
    this.errorFields = new Map(fields.flatMap((f) => (f.column && ERROR_COLUMNS.includes(f.column) ? [[f.column, f] as const] : [])));
  }

  get rows(): number {
    return this.size;
  }

  /** Starts a new row and returns its index; its values are then written into `column(name)[row]`. */
  addRow(line: number, position = 0): number {
    if (this.size === this.capacity) this.grow();
    this.lines[this.size] = line;
    if (this.positions) this.positions[this.size] = position;
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
   * For hot loops that write columns directly: makes room for row `row`, records its line (and
   * position), and returns true when the columns moved (call fieldArrays again).
   */
  reserve(row: number, line: number, position = 0): boolean {
    let grown = false;
    if (row === this.capacity) {
      this.grow();
      grown = true;
    }
    this.lines[row] = line;
    if (this.positions) this.positions[row] = position;
    this.size = row + 1;
    return grown;
  }

  /** Records an id beyond 2⁵³ − 1 (exact decimal text) for `row`; the column holds NaN there. */
  wideId(column: 'event' | 'track', row: number, text: string): void {
    (this.wide[column] ??= new Map()).set(row, text);
    this.cols[column][row] = NaN;
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
    if (this.positions) {
      const p = new Float64Array(this.capacity);
      p.set(this.positions);
      this.positions = p;
    }
  }

  /**
   * The finished table. Checks that every error column is positive (naming the first bad line),
   * and turns wide ids into codes. `allowEmpty`: a table of no rows is fine (a chunk of a stream).
   */
  finish(file: string, units: Record<string, string>, ignoredColumns: readonly string[], allowEmpty = false): HitTable {
    const n = this.size;
    if (n === 0 && !allowEmpty) throw msg.emptyFile(file, 'at least one data row after the header');
    for (const [c, f] of this.errorFields) {
      const col = this.cols[c];
      for (let i = 0; i < n; i++) {
        if (!(col[i] > 0)) {
          throw msg.badRow(file, this.lines[i], `column '${f.raw}': ${Number((col[i] / f.scale).toPrecision(12))} is not a positive error; hit errors must be greater than zero (or leave the column out to estimate them from the residuals)`);
        }
      }
    }
    // A view when the spare room is small (no copy), a trimmed copy when it is not.
    const trim = this.capacity <= 1.25 * n;
    const cut = <T extends Float64Array | Int32Array>(a: T): T => (trim ? a.subarray(0, n) : a.slice(0, n)) as T;
    const take = (c: HitColumn): Float64Array | undefined => (this.present.has(c) ? cut(this.cols[c]) : undefined);
    const event = take('event')!;
    // A file read without a track column: every row on no track (−1), said in the source.
    const track = take('track') ?? new Float64Array(n).fill(-1);
    let idLabels: { event?: IdLabels; track?: IdLabels } | undefined;
    if (this.wide.event) (idLabels ??= {}).event = encodeWideIds(event, this.wide.event);
    if (this.wide.track) (idLabels ??= {}).track = encodeWideIds(track, this.wide.track);
    const sigma = take('sigma');
    const source: HitTableSource = {
      file, units, line: cut(this.lines), ignoredColumns,
      ...(this.positions ? { position: cut(this.positions) } : {}),
      ...(idLabels ? { idLabels } : {}),
      ...(this.present.has('track') ? {} : { absentColumns: ['track'] }),
    };
    return {
      length: n, event, track,
      x: take('x')!, y: take('y')!, z: take('z'),
      sigmaX: sigma ?? take('sigma_x'), sigmaY: sigma ?? take('sigma_y'), sigmaZ: take('sigma_z'),
      ...(this.present.has('hit_order') ? { hitOrder: take('hit_order') } : {}),
      source,
    };
  }

}
