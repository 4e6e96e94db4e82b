import { msg } from '../errors.js';
import { parseHeader, unitsOf, type HeaderField } from './hitColumns.js';
import { HitTableBuilder } from './hitTableBuilder.js';
import type { HitTable } from './hitTable.js';
import { MAX_ID, parseIdText } from './hitIds.js';

/** One column as a columnar reader hands it over: numbers, 64-bit integers, or text. */
export type ColumnValues = ArrayLike<number | bigint | string | null | undefined>;

/**
 * A hit table from the columns of a columnar file (Parquet, Arrow): column names as in a CSV
 * header (units in brackets allowed), values checked as the text readers check them — finite
 * numbers, positive errors, whole-number ids exact up to 2⁶³ − 1 (64-bit integer columns keep
 * ids beyond 2⁵³ exact). Messages name the file and the 1-based row (`rowBase` + i + 1).
 * `fields` from an earlier call may be passed so that every slice of a file maps alike.
 */
export function hitTableFromColumns(names: readonly string[], columns: readonly ColumnValues[], file: string, options: {
  readonly lengthUnit: string;
  readonly rowBase: number;
  readonly positions?: boolean;
  readonly allowEmpty?: boolean;
  readonly fields?: readonly HeaderField[];
}): HitTable {
  const fields = options.fields ?? parseHeader(names, file, options.lengthUnit, 0);
  const n = columns[0]?.length ?? 0;
  const builder = new HitTableBuilder(fields, n + 1, options.positions === true);
  for (let i = 0; i < n; i++) builder.addRow(options.rowBase + i + 1, options.rowBase + i);
  fields.forEach((f, j) => {
    if (f.column === undefined) return;
    const values = columns[j];
    const isId = f.column === 'event' || f.column === 'track';
    const target = builder.column(f.column);
    for (let i = 0; i < n; i++) {
      const v = values[i];
      const row = options.rowBase + i + 1;
      if (isId) {
        if (typeof v === 'number' && Number.isSafeInteger(v)) target[i] = v === 0 ? 0 : v;
        else if (typeof v === 'bigint') {
          if (v > MAX_ID || v < -MAX_ID) throw msg.badId(file, row, f.raw, v.toString(), 'is beyond the id range ±(2^63 − 1)');
          const num = Number(v);
          if (Number.isSafeInteger(num)) target[i] = num;
          else builder.wideId(f.column as 'event' | 'track', i, v.toString());
        } else {
          const id = parseIdText(v === null || v === undefined ? '' : String(v), file, row, f.raw);
          if (typeof id === 'number') target[i] = id;
          else builder.wideId(f.column as 'event' | 'track', i, id);
        }
      } else {
        const x = typeof v === 'number' ? v : typeof v === 'bigint' ? Number(v) : NaN;
        if (!Number.isFinite(x)) throw msg.badNumber(file, row, f.raw, v === null || v === undefined ? '' : String(v));
        target[i] = x * f.scale;
      }
    }
  });
  return builder.finish(file, unitsOf(fields, options.lengthUnit), fields.filter((f) => f.column === undefined).map((f) => f.raw), options.allowEmpty === true);
}
