import type { Command } from 'commander';

type Register = (program: Command) => void;

/**
 * Every sub-command, one file each, loaded on demand: `sagitta fit …` imports only the fit
 * command's modules, so it does not pay the start-up time of the kernel (tslab, zeromq), the
 * report (playwright) or the simulator (schemas). Bare `sagitta` / `sagitta --help` loads all.
 * Add a command by writing `commands/<name>.ts` exporting `register<Name>(program)` and listing
 * it here.
 */
const COMMANDS: Readonly<Record<string, () => Promise<Register>>> = {
  fit: async () => (await import('./fit.js')).registerFit,
  vertices: async () => (await import('./vertices.js')).registerVertices,
  merge: async () => (await import('./merge.js')).registerMerge,
  range: async () => (await import('./range.js')).registerRange,
  simulate: async () => (await import('./simulate.js')).registerSimulate,
  run: async () => (await import('./run.js')).registerRun,
  demo: async () => (await import('./demo.js')).registerDemo,
  kernel: async () => (await import('./kernel.js')).registerKernel,
};

/** Registers the command named in argv (node, script, name, …), or all of them. */
export async function registerCommands(program: Command, argv: readonly string[] = []): Promise<void> {
  const name = argv[2];
  const wanted = name !== undefined && name in COMMANDS ? [name] : Object.keys(COMMANDS);
  for (const n of wanted) (await COMMANDS[n]())(program);
}
