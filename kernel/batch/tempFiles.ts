import { rmSync } from 'node:fs';

/**
 * Temporary files of this process that must not outlive it: removed when the process is
 * interrupted (SIGINT, SIGTERM, SIGHUP), exits, or a command fails. A file is registered when it
 * is created and unregistered once renamed into place.
 */
const pending = new Set<string>();
let installed = false;

/** Exit status of a process ended by a signal, as shells report it (128 + signal number). */
const SIGNAL_EXIT: Readonly<Record<string, number>> = { SIGINT: 130, SIGTERM: 143, SIGHUP: 129 };

export function registerTemp(path: string): void {
  pending.add(path);
  if (installed) return;
  installed = true;
  process.on('exit', removeAllTemps);
  for (const signal of Object.keys(SIGNAL_EXIT) as NodeJS.Signals[]) {
    process.once(signal, () => {
      // Outputs still pending are removed; ones already renamed into place (complete) are said so.
      const pendingOutputs = pending.size > 0;
      removeAllTemps();
      process.stderr.write(`\nsagitta: stopped by ${signal}; ${pendingOutputs ? 'no output was written' : 'outputs already complete were kept'}\n`);
      process.exit(SIGNAL_EXIT[signal]);
    });
  }
}

export function unregisterTemp(path: string): void {
  pending.delete(path);
}

/** Removes every registered temporary file (safe to call more than once). */
export function removeAllTemps(): void {
  for (const p of pending) rmSync(p, { force: true });
  pending.clear();
}
