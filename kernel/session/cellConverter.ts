import type { Converter } from 'tslab/dist/converter.js';
import { compiledCellOf, type CellCompiler } from './compiledCell.js';
import { expandShorthandProperties } from './expandShorthand.js';
import { requireFromPackage } from '../packageMode.js';
import { addCompilerRoot, tslabTs } from './moduleRoot.js';

type ConverterModule = typeof import('tslab/dist/converter.js');

/**
 * tslab's converter for cells run in `workDir` (the process's working directory when it is
 * created, which the compiler reads then): "sagitta-tracks" visible to it (moduleRoot.ts), and no
 * file or folder watchers.
 *
 * No watchers: a watcher that fires between two cells (any process touching a watched file: an
 * edited module next to the notebook, a library file) leaves the converter with a pending rebuild
 * that it then refuses for every later cell ("Unexpected pending rebuildTimer") — a kernel that no
 * cell can run in any more. Without watchers a cell is compiled against the sources as first
 * read, as imported modules stay loaded until a restart.
 */
export function createCellConverter(workDir: string): Converter {
  addCompilerRoot(workDir);
  const noWatcher = () => ({ close() {} });
  tslabTs.sys.watchFile = noWatcher;
  tslabTs.sys.watchDirectory = noWatcher;
  const { createConverter } = requireFromPackage('tslab/dist/converter.js') as ConverterModule;
  return createConverter();
}

/** Compiles cells with `converter` in this thread (shorthand properties expanded first). */
export function converterCompiler(converter: Converter): CellCompiler {
  return {
    compile: (prevDecl, code) => compiledCellOf(converter.convert(prevDecl, expandShorthandProperties(code))),
    close: () => converter.close(),
  };
}

