// The declarations the cell compiler of a checkout reads instead of the library's sources
// (kernel/session/libraryDeclarations.ts): where they are, what names them, what they hold.
import { existsSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { DECLARATIONS_CACHE, libraryDeclarations, libraryDeclarationsKey } from '../../kernel/session/libraryDeclarations.js';
import { createSession } from '../../kernel/session/index.js';
import { tslabTs } from '../../kernel/session/moduleRoot.js';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';

const require = createRequire(import.meta.url);
/** The package root the cache folder belongs to (<root>/node_modules/.cache/sagitta-tracks/declarations/<key>). */
const packageRootOf = (folder: string) => path.resolve(folder, '..', '..', '..', '..', '..');
const tsVersion = (JSON.parse(readFileSync(require.resolve('typescript/package.json'), 'utf8')) as { version: string }).version;

describe('library declarations for the cell compiler', () => {
  it('live in the cache folder named by the hash of the sources as they are, with lib/index.d.ts', () => {
    const folder = libraryDeclarations();
    expect(folder).toBe(path.join(DECLARATIONS_CACHE, libraryDeclarationsKey(tsVersion)));
    expect(existsSync(path.join(folder!, 'lib', 'index.d.ts'))).toBe(true);
    const made = JSON.parse(readFileSync(path.join(folder!, 'made-by.json'), 'utf8')) as { key: string; compiler: string };
    expect(made).toMatchObject({ key: path.basename(folder!), compiler: tsVersion });
  });

  it('the key is stable for the same sources and changes with the emitting compiler', () => {
    expect(libraryDeclarationsKey(tsVersion)).toBe(libraryDeclarationsKey(tsVersion));
    expect(libraryDeclarationsKey(tsVersion)).not.toBe(libraryDeclarationsKey(`${tsVersion}-other`));
  });

  it('a cell sees the library through them: types, a type error at its line and column, doc comments', async () => {
    const reads: string[] = [];
    const readFile = tslabTs.sys.readFile;
    tslabTs.sys.readFile = (p, encoding) => {
      reads.push(p.replace(/\\/g, '/'));
      return readFile(p, encoding);
    };
    const session = createSession({ workDir: mkdtempSync(path.join(tmpdir(), 'sagitta-decl-')) });
    const hooks = { stream() {}, display() {}, clear() {}, ask: () => Promise.resolve('') };
    try {
      const ok = await session.execute("import { massStoppingPower, knob } from 'sagitta-tracks';\nconst f: number = knob('f', '1.5 T');\nf", hooks);
      expect(ok.status).toBe('ok');
      const bad = await session.execute("const s: string = knob('g', '2 T');", hooks);
      expect(bad.status).toBe('error');
      expect(bad.error?.evalue).toMatch(/^1:7 - Type 'number' is not assignable to type 'string'/);
      const info = await session.inspect('massStoppingPower', 'massStoppingPower'.length, 0);
      expect(info?.['text/plain']).toMatch(/massStoppingPower\(/);
    } finally {
      tslabTs.sys.readFile = readFile;
      session.close();
    }
    // The compiler read the library's declarations, never its sources (paths as read, after forwarding).
    const folder = libraryDeclarations()!;
    expect(reads).toContain(path.join(folder, 'lib', 'index.d.ts').replace(/\\/g, '/'));
    const sources = `${path.join(packageRootOf(folder), 'lib').replace(/\\/g, '/')}/`;
    expect(reads.filter((p) => p.startsWith(sources))).toEqual([]);
  });
});
