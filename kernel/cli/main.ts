import { Command, CommanderError } from 'commander';
import { SagittaError } from '../../lib/errors.js';
import { sagittaVersion } from '../version.js';
import { registerCommands } from './commands/index.js';

/**
 * Builds the `sagitta` command tree. Each sub-command lives in its own file under
 * `kernel/cli/commands/` and registers itself; this file only wires them and maps errors to exit
 * codes: 0 success, 1 unusable input or failed run (one-line reason on stderr), 2 bad usage.
 */
export async function buildProgram(argv: readonly string[] = []): Promise<Command> {
  const program = new Command('sagitta')
    .description('Charged-particle track analysis: fits, momenta, energy loss, range, notebooks and reports.')
    .version(sagittaVersion(), '-V, --version')
    .showHelpAfterError('(run with --help for usage)')
    .exitOverride();
  await registerCommands(program, argv);
  return program;
}

export async function main(argv: readonly string[]): Promise<number> {
  const program = await buildProgram(argv);
  try {
    await program.parseAsync(argv as string[]);
    return typeof process.exitCode === 'number' ? process.exitCode : 0;
  } catch (err) {
    if (err instanceof CommanderError) {
      // --help and --version arrive here with exit code 0.
      return err.exitCode === 0 ? 0 : 2;
    }
    if (err instanceof SagittaError) {
      process.stderr.write(`sagitta: ${err.message}\n`);
      return 1;
    }
    throw err;
  }
}
