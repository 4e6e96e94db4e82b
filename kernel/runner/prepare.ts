import { msg } from '../../lib/internal.js';
import { readNotebook, type LoadedNotebook } from '../notebook/read.js';
import { joinSource } from '../notebook/source.js';
import type { Notebook } from '../notebook/types.js';
import { upgradeNotebook } from '../notebook/upgrade.js';

/** A notebook ready to run: read and checked, upgraded to nbformat 4.5, its old outputs and run metadata cleared. */
export interface PreparedNotebook {
  readonly loaded: LoadedNotebook;
  readonly notebook: Notebook;
  /** The code cells' indices and sources, in order. */
  readonly code: Array<{ index: number; code: string }>;
}

/** Reads `path` (never writing it) and prepares a fresh copy to run. Throws BAD_NOTEBOOK / FILE_NOT_FOUND. */
export function prepareNotebook(path: string): PreparedNotebook {
  const loaded = readNotebook(path);
  checkLanguage(loaded.notebook, path);
  const notebook = upgradeNotebook(loaded.notebook);
  const code: Array<{ index: number; code: string }> = [];
  notebook.cells.forEach((cell, index) => {
    if (cell.cell_type !== 'code') return;
    cell.outputs = [];
    cell.execution_count = null;
    cell.metadata.sagitta = {};
    delete cell.metadata.execution;
    code.push({ index, code: joinSource(cell.source) });
  });
  return { loaded, notebook, code };
}

/** A notebook written for another language (its kernelspec or language_info says so) is refused before anything runs. */
function checkLanguage(nb: Notebook, path: string): void {
  const meta = nb.metadata as { kernelspec?: { language?: unknown }; language_info?: { name?: unknown } };
  const language = meta.kernelspec?.language ?? meta.language_info?.name;
  if (typeof language === 'string' && !/^(typescript|javascript|ts|js)$/i.test(language)) {
    throw msg.badNotebook(path, `is written for ${language}; sagitta runs TypeScript notebooks (metadata.kernelspec.language "typescript")`);
  }
}
