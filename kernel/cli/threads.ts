import { msg } from '../../lib/internal.js';

/** Reads --threads: a whole number from 1 to 256. */
export function parseThreads(text: string): number {
  const n = /^\s*\d{1,3}\s*$/.test(text) ? Number(text) : NaN;
  if (!(n >= 1 && n <= 256)) throw msg.badArgument('--threads', text, 'a whole number of threads from 1 to 256, e.g. --threads 4');
  return n;
}
