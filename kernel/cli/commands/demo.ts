import { Command } from 'commander';
import { cpSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { basename, join, resolve } from 'node:path';
import { FROM_SOURCE, packageRoot } from '../../packageMode.js';
import { msg } from '../../../lib/internal.js';
import { runCommand } from './run.js';

/** The package's example notebooks folder (next to kernel/ and lib/). */
const NOTEBOOKS = join(packageRoot, 'notebooks');

/** The first example notebook, notebooks/01-*.ipynb. */
export function firstExampleNotebook(): string {
  const name = readdirSync(NOTEBOOKS).filter((f) => /^01-.*\.ipynb$/.test(f)).sort()[0];
  if (name === undefined) throw msg.fileNotFound(join(NOTEBOOKS, '01-*.ipynb'));
  return join(NOTEBOOKS, name);
}

/**
 * An installed package's notebooks sit inside node_modules, where the cell compiler would take
 * the notebook's own folder for a package: the demo runs a temporary copy instead (removed after).
 */
function copyOfNotebooks(): string {
  const dir = mkdtempSync(join(tmpdir(), 'sagitta-demo-'));
  cpSync(NOTEBOOKS, dir, { recursive: true });
  return dir;
}

/**
 * `sagitta demo` (`npm run demo`): runs the first example notebook on the bundled invented data
 * headlessly and writes `report.html` in the current folder.
 */
export function registerDemo(program: Command): void {
  program
    .command('demo')
    .description('run the first example notebook on the bundled invented data and write report.html here')
    .option('--out <file>', 'where to write the report', 'report.html')
    .option('--cell-timeout <duration>', 'longest one cell may run', '300s')
    .action(async (options: { out: string; cellTimeout: string }) => {
      // `npm run demo` runs in the package folder; INIT_CWD is the folder the user typed it in.
      const out = resolve(process.env.INIT_CWD ?? process.cwd(), options.out);
      const copy = FROM_SOURCE ? undefined : copyOfNotebooks();
      const notebook = copy ? join(copy, basename(firstExampleNotebook())) : firstExampleNotebook();
      process.stderr.write(`running ${FROM_SOURCE ? notebook : `a copy of ${firstExampleNotebook()}`} …\n`);
      const result = await runCommand(notebook, { html: out, executed: false, cellTimeout: options.cellTimeout, set: [] }).finally(() => {
        if (copy) rmSync(copy, { recursive: true, force: true });
      });
      process.stderr.write(`${result.summary}\n`);
      if (result.exitCode !== 0) {
        process.stderr.write(`sagitta: ${result.reason}\n`);
        process.exitCode = result.exitCode;
      }
      process.stdout.write(`Report written to ${out} — one self-contained file; open it in any browser, no network needed.\n`);
    });
}
