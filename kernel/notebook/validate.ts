import { msg } from '../../lib/internal.js';
import type { Cell, Notebook, Output } from './types.js';

/**
 * Structural check of a parsed notebook against nbformat 4 (any minor version). It enforces what
 * the runner and the report rely on and names the first problem with its cell number; the full
 * official schema is checked by the test suite on everything the runner writes.
 */
export function validateNotebook(value: unknown, file: string): Notebook {
  const fail = (detail: string) => msg.badNotebook(file, detail);
  if (!isObject(value)) throw fail('the top level is not a JSON object, so this is not a notebook');
  const { nbformat, nbformat_minor: minor, metadata, cells } = value;
  if (nbformat !== 4) {
    throw fail(`nbformat ${JSON.stringify(nbformat)} is not supported; sagitta reads nbformat 4 (any minor version). Convert the file with a notebook editor first`);
  }
  if (!Number.isInteger(minor) || (minor as number) < 0) throw fail(`nbformat_minor ${JSON.stringify(minor)} is not a non-negative integer`);
  if (!isObject(metadata)) throw fail('"metadata" is missing or not an object');
  if (!Array.isArray(cells)) throw fail('"cells" is missing or not a list');
  const ids = new Set<string>();
  cells.forEach((cell, i) => checkCell(cell, i + 1, ids, fail));
  return value as unknown as Notebook;
}

const CELL_ID = /^[a-zA-Z0-9-_]{1,64}$/;

function checkCell(cell: unknown, n: number, ids: Set<string>, fail: (d: string) => Error): void {
  const at = `cell ${n}`;
  if (!isObject(cell)) throw fail(`${at} is not an object`);
  const type = cell.cell_type;
  if (type !== 'code' && type !== 'markdown' && type !== 'raw') {
    throw fail(`${at} has cell_type ${JSON.stringify(type)}; expected "code", "markdown" or "raw"`);
  }
  if (!isMultiline(cell.source)) throw fail(`${at}: "source" must be a string or a list of strings`);
  if (cell.metadata !== undefined && !isObject(cell.metadata)) throw fail(`${at}: "metadata" must be an object`);
  if (cell.id !== undefined) {
    if (typeof cell.id !== 'string' || !CELL_ID.test(cell.id)) {
      throw fail(`${at}: id ${JSON.stringify(cell.id)} must be 1–64 characters of letters, digits, '-' or '_'`);
    }
    if (ids.has(cell.id)) throw fail(`${at}: id "${cell.id}" is used by an earlier cell; cell ids must be unique`);
    ids.add(cell.id);
  }
  if (type === 'code') {
    if (cell.outputs !== undefined && !Array.isArray(cell.outputs)) throw fail(`${at}: "outputs" must be a list`);
    const count = cell.execution_count;
    if (count !== undefined && count !== null && !Number.isInteger(count)) {
      throw fail(`${at}: execution_count ${JSON.stringify(count)} must be an integer or null`);
    }
    ((cell.outputs as unknown[] | undefined) ?? []).forEach((o, k) => checkOutput(o, `${at}, output ${k + 1}`, fail));
  }
}

function checkOutput(o: unknown, at: string, fail: (d: string) => Error): asserts o is Output {
  if (!isObject(o)) throw fail(`${at} is not an object`);
  switch (o.output_type) {
    case 'stream':
      if (typeof o.name !== 'string' || !isMultiline(o.text)) throw fail(`${at}: a stream output needs "name" and "text"`);
      return;
    case 'display_data':
    case 'execute_result':
      if (!isObject(o.data)) throw fail(`${at}: a ${o.output_type} output needs a "data" object`);
      return;
    case 'error':
      if (typeof o.ename !== 'string' || typeof o.evalue !== 'string' || !Array.isArray(o.traceback)) {
        throw fail(`${at}: an error output needs "ename", "evalue" and "traceback"`);
      }
      return;
    default:
      throw fail(`${at} has output_type ${JSON.stringify(o.output_type)}; expected stream, display_data, execute_result or error`);
  }
}

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function isMultiline(v: unknown): boolean {
  return typeof v === 'string' || (Array.isArray(v) && v.every((s) => typeof s === 'string'));
}

export type { Cell };
