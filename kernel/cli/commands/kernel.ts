import { Command, Option } from 'commander';
import { usage } from '../usage.js';

/**
 * `sagitta kernel install|remove|list`: the notebook kernelspec, with no Python involved.
 * The kernelspec module is loaded inside each action (it is light, but keeps `sagitta fit` lean).
 */
export function registerKernel(program: Command): void {
  const kernel = program
    .command('kernel')
    .description('install, remove or list the Sagitta notebook kernel (TypeScript cells, no Python needed)');

  const scope = () => new Option('--scope <scope>', 'user: your own data folder; system: the machine-wide one (needs admin rights)').choices(['user', 'system']).default('user');

  kernel
    .command('install')
    .description('write the kernelspec (kernel.json and logos) where notebook front ends look for kernels')
    .addOption(scope())
    .option('--dir <folder>', 'write into this kernels folder instead of the standard one for the scope')
    .option('--id <name>', 'folder name of the kernel, as front ends list it', 'sagitta')
    .option('--label <text>', 'name front ends show for the kernel', 'Sagitta (TypeScript)')
    .addOption(new Option('--interrupt <mode>', 'how front ends stop a cell: signal (SIGINT) or message (interrupt_request); default signal, message on Windows').choices(['signal', 'message']))
    .addHelpText('after', `
Standard kernels folders for --scope user: Linux ~/.local/share/jupyter/kernels (or
$XDG_DATA_HOME/jupyter/kernels), macOS ~/Library/Jupyter/kernels, Windows %APPDATA%\\jupyter\\kernels;
JUPYTER_DATA_DIR replaces the data folder if set. kernel.json starts this Node.js binary with this
package's kernel entry, so reinstall after moving the package or changing Node.js.`)
    .action(async (opts: { scope: 'user' | 'system'; dir?: string; id: string; label: string; interrupt?: 'signal' | 'message' }) => {
      const { installKernelspec } = await import('../../kernelspec/kernelspec.js');
      // Refusals about --id and --dir (a bad name, a folder of another kernel, no write access) exit 2.
      const dir = usage(() => installKernelspec({ scope: opts.scope, dir: opts.dir, id: opts.id, displayName: opts.label, interruptMode: opts.interrupt }));
      process.stdout.write(`installed kernel "${opts.id}" in ${dir}\n`);
    });

  kernel
    .command('remove')
    .description('delete an installed Sagitta kernelspec (kernels of other languages are left alone)')
    .addOption(scope())
    .option('--dir <folder>', 'kernels folder it was installed into with --dir')
    .option('--id <name>', 'folder name of the kernel', 'sagitta')
    .action(async (opts: { scope: 'user' | 'system'; dir?: string; id: string }) => {
      const { removeKernelspec } = await import('../../kernelspec/kernelspec.js');
      const dir = usage(() => removeKernelspec({ scope: opts.scope, dir: opts.dir, id: opts.id }));
      process.stdout.write(`removed ${dir}\n`);
    });

  kernel
    .command('list')
    .description('list the kernels front ends can see (JUPYTER_PATH, then the user folder, then system folders)')
    .option('--dir <folder...>', 'also look in these kernels folders (first)')
    .option('--json', 'print JSON instead of a table')
    .action(async (opts: { dir?: string[]; json?: boolean }) => {
      const { listKernelspecs, checkKernelsDir } = await import('../../kernelspec/kernelspec.js');
      const { currentPlatformEnv, kernelSearchPath } = await import('../../kernelspec/paths.js');
      usage(() => (opts.dir ?? []).map((d) => checkKernelsDir(d, true)));
      const kernels = listKernelspecs(currentPlatformEnv(), opts.dir ?? []);
      if (opts.json) {
        process.stdout.write(`${JSON.stringify(kernels, null, 2)}\n`);
        return;
      }
      if (kernels.length === 0) {
        process.stdout.write(`no kernels found; looked in:\n${kernelSearchPath(currentPlatformEnv()).map((d) => `  ${d}\n`).join('')}`);
        return;
      }
      const width = Math.max(...kernels.map((k) => k.id.length));
      for (const k of kernels) {
        process.stdout.write(`${k.sagitta ? '*' : ' '} ${k.id.padEnd(width)}  ${k.dir}  (${k.displayName}, ${k.language || 'language not given'})\n`);
      }
      process.stdout.write('(* = a Sagitta kernel)\n');
    });
}
