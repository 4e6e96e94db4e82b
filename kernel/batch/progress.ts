/**
 * A progress bar on standard error (cli-progress, loaded only when a bar is shown). Callers show
 * one only on a terminal and without --quiet; it is cleared when the work ends, so the summary
 * that follows stands alone.
 */
import { createRequire } from 'node:module';

type Bar = { start(total: number, value: number): void; update(value: number): void; stop(): void };

export class Progress {
  private bar: Bar | undefined;
  private last = 0;

  constructor(label: string, private readonly total: number, unit = 'MB') {
    const { SingleBar } = createRequire(import.meta.url)('cli-progress') as typeof import('cli-progress');
    const scale = unit === 'MB' ? 1 / 2 ** 20 : 1;
    this.bar = new SingleBar({
      format: `${label} [{bar}] {percentage}% · {value}/{total} ${unit} · {eta_formatted} left`,
      stream: process.stderr,
      clearOnComplete: true,
      hideCursor: true,
      barsize: 30,
      formatValue: (v: number, _o: unknown, type: string) => (type === 'value' || type === 'total' ? (v * scale).toFixed(unit === 'MB' ? 0 : 0) : String(v)),
    }) as unknown as Bar;
    this.bar.start(total, 0);
  }

  update(done: number): void {
    if (this.bar === undefined || done - this.last < this.total / 200) return;
    this.last = done;
    this.bar.update(Math.min(done, this.total));
  }

  stop(): void {
    this.bar?.stop();
    this.bar = undefined;
  }
}

/** Whether to draw bars: standard error is a terminal and the user did not ask for quiet. */
export function wantProgress(quiet: boolean | undefined): boolean {
  return !quiet && process.stderr.isTTY === true && process.env.CI === undefined;
}
