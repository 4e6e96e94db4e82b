import { Command, CommanderError } from 'commander';
import { SagittaError } from '../../lib/index.js';
import { sagittaVersion } from '../version.js';
import { registerCommands } from './commands/index.js';
import { EXIT, UsageError } from './usage.js';
import { OutputClosed } from '../batch/resultSink.js';
import { removeAllTemps } from '../batch/tempFiles.js';

/**
 * Builds the `sagitta` command tree. Each sub-command lives in its own file under
 * `kernel/cli/commands/` and registers itself; this file only wires them and maps errors to exit
 * codes — one convention for every command:
 *   0  done (a track that could not be fitted is a row with a status, not a failure);
 *   1  an input could not be used, or the work failed: a missing, unreadable or malformed file,
 *      a notebook cell that failed, a full disk — one line on stderr naming file:line, column;
 *   2  the command line is wrong: an unknown command or option, a missing or malformed value,
 *      a value the option does not accept, an output that would overwrite an input or another
 *      output, an output folder that does not exist — one line naming the flag;
 *   129/130/143  stopped by SIGHUP/SIGINT/SIGTERM (temporary files removed, nothing written).
 * A reader that closes standard output early (`| head`) ends the command quietly with 0.
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
    return typeof process.exitCode === 'number' ? process.exitCode : EXIT.ok;
  } catch (err) {
    removeAllTemps();
    if (err instanceof CommanderError) {
      // --help and --version arrive here with exit code 0.
      return err.exitCode === 0 ? EXIT.ok : EXIT.usage;
    }
    if (err instanceof OutputClosed) return EXIT.ok;
    if (err instanceof UsageError) {
      process.stderr.write(`sagitta: ${err.message}\n`);
      return EXIT.usage;
    }
    if (err instanceof SagittaError) {
      process.stderr.write(`sagitta: ${err.message}\n`);
      return EXIT.failed;
    }
    const described = describeSystemError(err);
    if (described) {
      process.stderr.write(`sagitta: ${described}\n`);
      return EXIT.failed;
    }
    throw err;
  }
}

/** A Node system error (ENOENT, EACCES, EISDIR …) as one line instead of a stack trace. */
function describeSystemError(err: unknown): string | undefined {
  const e = err as { code?: string; path?: string; syscall?: string; message?: string };
  if (typeof e?.code !== 'string' || !/^E[A-Z]+$/.test(e.code)) return undefined;
  const what: Record<string, string> = {
    ENOENT: 'no such file or folder', EACCES: 'permission denied', EPERM: 'permission denied', EISDIR: 'it is a folder',
    ENOTDIR: 'a part of the path is not a folder', ENOSPC: 'the disk is full', EROFS: 'read-only file system', EIO: 'input/output error',
    EMFILE: 'too many open files', EEXIST: 'it already exists',
  };
  return `${e.path ?? e.syscall ?? 'system'}: ${what[e.code] ?? e.code} (${e.code})`;
}
