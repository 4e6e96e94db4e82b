import { SagittaError } from '../../lib/index.js';

/**
 * The command line's one convention for exit codes (kernel/cli/main.ts):
 * 0 done; 1 an input could not be used or the work failed; 2 the command line itself is wrong.
 * A command reads and checks its options inside `usage(…)`: any catalogue error raised there —
 * a bad quantity, an unknown material, an output that would overwrite an input — is a usage
 * error and exits with 2; errors raised later (reading the input, running) exit with 1.
 */
export class UsageError extends Error {
  constructor(readonly cause: SagittaError) {
    super(cause.message);
    this.name = 'UsageError';
  }
}

export function usage<T>(check: () => T): T {
  try {
    return check();
  } catch (err) {
    if (err instanceof SagittaError) throw new UsageError(err);
    throw err;
  }
}

export async function usageAsync<T>(check: () => Promise<T>): Promise<T> {
  try {
    return await check();
  } catch (err) {
    if (err instanceof SagittaError) throw new UsageError(err);
    throw err;
  }
}

export const EXIT = Object.freeze({ ok: 0, failed: 1, usage: 2 });
