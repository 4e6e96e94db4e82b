import type { Command } from 'commander';
import { registerFit } from './fit';
import { registerKernel } from './kernel';
import { registerRun } from './run';
import { registerRange } from './range';
import { registerSimulate } from './simulate';

/**
 * Every sub-command, one file each. Add a command by writing `commands/<name>.ts` exporting
 * `register<Name>(program)` and listing it here. Commands that need heavy modules (tslab,
 * zeromq, playwright, danfojs) import them inside their action, so that `sagitta fit` does not
 * pay their start-up time.
 */
export function registerCommands(program: Command): void {
  registerFit(program);
  registerKernel(program);
  registerRun(program);
  registerRange(program);
  registerSimulate(program);
}
