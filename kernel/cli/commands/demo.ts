import { Command } from 'commander';
import { readdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { msg } from '../../../lib/errors.js';
import { runCommand } from './run.js';

/** The package's example notebooks folder (next to kernel/ and lib/). */
const NOTEBOOKS = fileURLToPath(new URL('../../../notebooks/', import.meta.url));

/** The first example notebook, notebooks/01-*.ipynb. */
export function firstExampleNotebook(): string {
  const name = readdirSync(NOTEBOOKS).filter((f) => /^01-.*\.ipynb$/.test(f)).sort()[0];
  if (name === undefined) throw msg.fileNotFound(join(NOTEBOOKS, '01-*.ipynb'));
  return join(NOTEBOOKS, name);
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
      const notebook = firstExampleNotebook();
      // `npm run demo` runs in the package folder; INIT_CWD is the folder the user typed it in.
      const out = resolve(process.env.INIT_CWD ?? process.cwd(), options.out);
      process.stderr.write(`running ${notebook} …\n`);
      const result = await runCommand(notebook, { html: out, executed: false, cellTimeout: options.cellTimeout, set: [] });
      process.stderr.write(`${result.summary}\n`);
      if (result.exitCode !== 0) {
        process.stderr.write(`sagitta: ${result.reason}\n`);
        process.exitCode = result.exitCode;
      }
      process.stdout.write(`Report written to ${out} — one self-contained file; open it in any browser, no network needed.\n`);
    });
}
