import { createHash } from 'node:crypto';
import type { Cell, CodeCell, Notebook, Output } from './types.js';

/** The minor version Sagitta writes. */
export const WRITTEN_MINOR = 5;

/**
 * Brings a notebook of any nbformat 4 minor version to 4.5: every cell gets an id (4.5 requires
 * them), code cells get `outputs` and `execution_count`, and keys that 4.5 does not allow on a
 * cell are dropped. Returns a new notebook; the input is not changed.
 *
 * Ids made here are derived from the cell's position and source (a short SHA-256 prefix), so
 * upgrading the same file twice gives the same ids.
 */
export function upgradeNotebook(nb: Notebook): Notebook {
  const used = new Set<string>();
  for (const c of nb.cells) if (c.id !== undefined) used.add(c.id);
  const cells = nb.cells.map((cell, i) => upgradeCell(cell, i, used));
  return { nbformat: 4, nbformat_minor: Math.max(WRITTEN_MINOR, nb.nbformat_minor), metadata: structuredClone(nb.metadata), cells };
}

function upgradeCell(cell: Cell, index: number, used: Set<string>): Cell {
  const id = cell.id ?? freshId(index, cell, used);
  const metadata = structuredClone(cell.metadata ?? {});
  const source = structuredClone(cell.source);
  if (cell.cell_type === 'code') {
    const code: CodeCell = {
      id,
      cell_type: 'code',
      metadata,
      source,
      outputs: structuredClone(cell.outputs ?? []).map(upgradeOutput),
      execution_count: cell.execution_count ?? null,
    };
    return code;
  }
  const out = { id, cell_type: cell.cell_type, metadata, source } as Cell & { attachments?: Record<string, Record<string, string>> };
  if (cell.attachments !== undefined) out.attachments = structuredClone(cell.attachments);
  return out;
}

function upgradeOutput(o: Output): Output {
  if (o.output_type === 'display_data' || o.output_type === 'execute_result') {
    o.metadata = o.metadata ?? {};
    if (o.output_type === 'execute_result') o.execution_count = o.execution_count ?? null;
  }
  return o;
}

function freshId(index: number, cell: Cell, used: Set<string>): string {
  const text = Array.isArray(cell.source) ? cell.source.join('') : cell.source;
  const base = createHash('sha256').update(`${index}\u0000${cell.cell_type}\u0000${text}`).digest('hex').slice(0, 12);
  let id = base;
  for (let k = 1; used.has(id); k++) id = `${base}-${k}`;
  used.add(id);
  return id;
}
