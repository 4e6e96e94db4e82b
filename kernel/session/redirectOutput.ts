import { Console } from 'node:console';
import { Writable } from 'node:stream';
import { setCellChannel, setDisplaySink } from '../../lib/internal.js';
import { jsonSafeBundle } from './jsonSafeBundle.js';
import type { CellHooks } from './types.js';

/**
 * Sends stdout/stderr writes, console output, displays, output clearing and input requests to
 * the hooks `current()` returns (the running cell's, or the last cell's for late output) until
 * the returned function is called. Displays pass through the one JSON rule (jsonSafeBundle).
 */
export function redirectOutput(current: () => CellHooks | undefined): () => void {
  const out = process.stdout as unknown as { write: unknown };
  const err = process.stderr as unknown as { write: unknown };
  const savedOut = out.write;
  const savedErr = err.write;
  const savedConsole = globalThis.console;
  const writer = (name: 'stdout' | 'stderr') =>
    function write(chunk: unknown, encoding?: unknown, callback?: unknown): boolean {
      const text = typeof chunk === 'string' ? chunk : Buffer.from(chunk as Uint8Array).toString(typeof encoding === 'string' ? (encoding as BufferEncoding) : 'utf8');
      if (text.length > 0) current()?.stream(name, text);
      const done = typeof encoding === 'function' ? encoding : callback;
      if (typeof done === 'function') queueMicrotask(() => (done as () => void)());
      return true;
    };
  out.write = writer('stdout');
  err.write = writer('stderr');
  const sink = (name: 'stdout' | 'stderr') =>
    new Writable({
      decodeStrings: false,
      write(chunk: unknown, _encoding, done) {
        const text = typeof chunk === 'string' ? chunk : Buffer.from(chunk as Uint8Array).toString('utf8');
        if (text.length > 0) current()?.stream(name, text);
        done();
      },
    });
  globalThis.console = new Console({ stdout: sink('stdout'), stderr: sink('stderr'), colorMode: false });
  const savedSink = setDisplaySink((bundle, options) => current()?.display(jsonSafeBundle(bundle), options));
  const savedChannel = setCellChannel({
    clear: (wait) => current()?.clear(wait),
    ask: (prompt, password) => current()?.ask(prompt, password) ?? Promise.reject(new Error('no cell is running')),
  });
  return () => {
    out.write = savedOut;
    err.write = savedErr;
    globalThis.console = savedConsole;
    setDisplaySink(savedSink);
    setCellChannel(savedChannel);
  };
}
