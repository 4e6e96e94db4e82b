import type { Command } from 'commander';

/**
 * Every sub-command, one file each. Add a command by writing `commands/<name>.ts` exporting
 * `register<Name>(program)` and listing it here.
 */
export function registerCommands(program: Command): void {
  void program;
}
