import { closeSync, openSync, readSync } from 'node:fs';

/**
 * Reads a text file line by line (LF ends a line; the LF is not part of it) in bounded memory,
 * synchronously. `next()` returns undefined at the end.
 */
export class LineReader {
  private readonly fd: number;
  private buf = Buffer.alloc(0);
  private pos = 0;
  private eof = false;
  /** 1-based number of the line last returned. */
  line = 0;

  constructor(readonly path: string) {
    this.fd = openSync(path, 'r');
  }

  next(): string | undefined {
    for (;;) {
      const lf = this.buf.indexOf(10, this.pos);
      if (lf >= 0) {
        const text = this.buf.toString('utf8', this.pos, lf);
        this.pos = lf + 1;
        this.line++;
        return text;
      }
      if (this.eof) {
        if (this.pos >= this.buf.length) return undefined;
        const text = this.buf.toString('utf8', this.pos);
        this.pos = this.buf.length;
        this.line++;
        return text;
      }
      const chunk = Buffer.allocUnsafe(1 << 20);
      const got = readSync(this.fd, chunk, 0, chunk.length, null);
      if (got === 0) this.eof = true;
      this.buf = Buffer.concat([this.buf.subarray(this.pos), chunk.subarray(0, got)]);
      this.pos = 0;
    }
  }

  close(): void {
    closeSync(this.fd);
  }
}
