import { msg } from '../errors.js';
import { metresPerUnit } from '../units.js';

/**
 * The columns a hit file may carry, shared by the CSV and JSON Lines readers.
 * A header name may carry a length unit in brackets: `x[cm]`, `sigma [um]`.
 */
export const HIT_COLUMNS = ['event', 'track', 'x', 'y', 'z', 'sigma', 'sigma_x', 'sigma_y', 'sigma_z', 'hit_order'] as const;
export type HitColumn = (typeof HIT_COLUMNS)[number];

export const REQUIRED_HIT_COLUMNS: readonly HitColumn[] = ['event', 'track', 'x', 'y'];
const LENGTH_COLUMNS: ReadonlySet<HitColumn> = new Set(['x', 'y', 'z', 'sigma', 'sigma_x', 'sigma_y', 'sigma_z']);

export interface HeaderField {
  /** Name as written, trimmed. */
  readonly raw: string;
  /** The Sagitta column it maps to, or undefined for a column we ignore. */
  readonly column: HitColumn | undefined;
  /** Unit written in the header, if any. */
  readonly unit: string | undefined;
  /** Factor converting the file's value to metres (1 for event/track). */
  readonly scale: number;
}

const NAME_WITH_UNIT = /^([^[\]()]+?)\s*(?:\[\s*([^\]]*?)\s*\]|\(\s*([^)]*?)\s*\))?$/;

/** The hit column a header name maps to ("X [cm]" → x), or undefined for a column Sagitta ignores. */
export function columnOf(name: string): HitColumn | undefined {
  const raw = name.trim().replace(/^"(.*)"$/, '$1');
  const m = NAME_WITH_UNIT.exec(raw);
  const base = (m ? m[1] : raw).trim().toLowerCase();
  return (HIT_COLUMNS as readonly string[]).includes(base) ? (base as HitColumn) : undefined;
}

/**
 * Reads a header into fields, checks duplicates and required columns, and resolves units
 * (header unit, else `defaultLengthUnit`). `trackOptional`: a header without `track` is
 * accepted (for hits not yet sorted into tracks; the reader then marks every row −1).
 */
export function parseHeader(names: readonly string[], file: string, defaultLengthUnit: string, line = 1, trackOptional = false): HeaderField[] {
  const defaultScale = metresPerUnit(defaultLengthUnit, { file });
  const seen = new Set<string>();
  const fields = names.map((name): HeaderField => {
    const raw = name.trim().replace(/^"(.*)"$/, '$1');
    const m = NAME_WITH_UNIT.exec(raw);
    const base = (m ? m[1] : raw).trim().toLowerCase();
    const unit = m ? (m[2] ?? m[3]) : undefined;
    const column = (HIT_COLUMNS as readonly string[]).includes(base) ? (base as HitColumn) : undefined;
    const key = column ?? raw;
    if (seen.has(key)) throw msg.duplicateColumn(file, raw, line);
    seen.add(key);
    let scale = 1;
    if (column !== undefined && LENGTH_COLUMNS.has(column)) {
      scale = unit ? metresPerUnit(unit, { file, line, column: raw }) : defaultScale;
    }
    return { raw, column, unit, scale };
  });
  const present = new Set(fields.map((f) => f.column));
  for (const required of REQUIRED_HIT_COLUMNS) {
    if (!present.has(required) && !(trackOptional && required === 'track')) throw msg.missingColumn(file, required, fields.map((f) => f.raw), line);
  }
  if (present.has('sigma') && (present.has('sigma_x') || present.has('sigma_y'))) {
    throw msg.badRow(file, line, "give either 'sigma' or 'sigma_x'/'sigma_y', not both");
  }
  if (present.has('sigma_x') !== present.has('sigma_y')) {
    throw msg.badRow(file, line, "'sigma_x' and 'sigma_y' go together; give both, or one 'sigma' column");
  }
  return fields;
}

/** The unit each length column was read in, for summaries. */
export function unitsOf(fields: readonly HeaderField[], defaultLengthUnit: string): Record<string, string> {
  const units: Record<string, string> = {};
  for (const f of fields) {
    if (f.column !== undefined && LENGTH_COLUMNS.has(f.column)) units[f.column] = f.unit ?? defaultLengthUnit;
  }
  return units;
}
