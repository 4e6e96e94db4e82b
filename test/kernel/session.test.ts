/**
 * The in-process execution session (kernel/session) on tslab's converter and executor, driven
 * directly: results as MIME bundles, captured output, errors, interrupts, completion and
 * inspection with code-point cursors (messaging protocol 5.2+ counts cursor positions in Unicode
 * code points), and `import … from "sagitta-tracks"` from a folder outside this repository.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createSession } from '../../kernel/session/session.js';
import type { MimeBundle } from '../../lib/display.js';
import type { CellHooks, Session } from '../../kernel/session/types.js';

const startDir = process.cwd();
const notebookDir = mkdtempSync(path.join(tmpdir(), 'sagitta-session-'));
let session: Session;

interface Recorded {
  streams: Array<{ name: string; text: string }>;
  displays: Array<{ bundle: MimeBundle; options: { displayId?: string; update?: boolean } }>;
  cleared: boolean[];
  hooks: CellHooks;
}

function recorder(): Recorded {
  const r: Recorded = {
    streams: [],
    displays: [],
    cleared: [],
    hooks: {
      stream: (name, text) => r.streams.push({ name, text }),
      display: (bundle, options) => r.displays.push({ bundle, options }),
      clear: (wait) => r.cleared.push(wait),
      ask: (prompt) => Promise.resolve(`answer to ${prompt}`),
    },
  };
  return r;
}

beforeAll(() => {
  writeFileSync(path.join(notebookDir, 'beam.ts'), 'export const BEAM_MOMENTUM_GEV = 1.2;\n');
  session = createSession({ workDir: notebookDir });
});

afterAll(() => {
  session.close();
  process.chdir(startDir);
  rmSync(notebookDir, { recursive: true, force: true });
});

describe('createSession({ workDir }) outside the repository', { timeout: 120_000 }, () => {
  it('shows a cell\'s warnings under that cell and does not carry them into the next', async () => {
    const first = recorder();
    await session.execute('import { highlandTheta0 } from "sagitta-tracks";\nhighlandTheta0({ momentumGeV: 1, beta: 1, charge: 1, thicknessOverX0: 1e-6 })', first.hooks);
    const shown = first.streams.filter((s) => s.name === 'stderr').map((s) => s.text).join('');
    expect(shown).toMatch(/^warning \[OUTSIDE_VALIDITY\]: highlandTheta0: x\/X₀ = 0.000001 is outside/);
    const second = recorder();
    await session.execute('1 + 1', second.hooks);
    expect(second.streams.filter((s) => s.name === 'stderr')).toEqual([]);
  });

  it('imports "sagitta-tracks" and a local .ts module next to the notebook; returns the last value as text/plain', async () => {
    const r = recorder();
    const out = await session.execute('import { PROTON } from "sagitta-tracks";\nimport { BEAM_MOMENTUM_GEV } from "./beam";\n[PROTON.massMeV, BEAM_MOMENTUM_GEV]', r.hooks);
    expect(out.status).toBe('ok');
    // Proton mass 938.27208816 MeV/c² (CODATA 2018).
    expect(out.result?.['text/plain']).toBe('[ 938.27208816, 1.2 ]');
  }, 120_000);

  it('keeps variables between cells and runs top-level await', async () => {
    const r = recorder();
    expect((await session.execute('let turns = 3;', r.hooks)).status).toBe('ok');
    const out = await session.execute('await new Promise((resolve) => setTimeout(resolve, 5));\nturns * 2', r.hooks);
    expect(out.result).toEqual({ 'text/plain': '6' });
  });

  it('a shorthand property may name a variable of an earlier cell', async () => {
    const r = recorder();
    expect((await session.execute('const fieldT = 1.5;\nconst chamber = "LH2";', r.hooks)).status).toBe('ok');
    const out = await session.execute('const run = { fieldT, chamber };\nconst { fieldT: f } = run;\n[run.fieldT, run.chamber, f]', r.hooks);
    expect(out.status).toBe('ok');
    expect(out.result?.['text/plain']).toBe("[ 1.5, 'LH2', 1.5 ]");
  });

  it('sends console and process.stdout/stderr writes to the running cell\'s stream hook', async () => {
    const r = recorder();
    await session.execute('console.log("a", 1);\nprocess.stdout.write("b\\n");\nconsole.error("c");', r.hooks);
    expect(r.streams).toEqual([
      { name: 'stdout', text: 'a 1\n' },
      { name: 'stdout', text: 'b\n' },
      { name: 'stderr', text: 'c\n' },
    ]);
  });

  it('output a cell\'s timer makes after the cell ended goes to the hooks of the cell that ran last', async () => {
    const first = recorder();
    await session.execute('setTimeout(() => console.log("late"), 50);', first.hooks);
    expect(first.streams).toEqual([]);
    await new Promise((resolve) => setTimeout(resolve, 300));
    expect(first.streams).toEqual([{ name: 'stdout', text: 'late\n' }]);
  });

  it('present / refresh reach the display hook with the display id and the update flag', async () => {
    const r = recorder();
    await session.execute('import { present, refresh } from "sagitta-tracks";\npresent("step 1", { id: "fit" });\nrefresh("fit", "step 2");', r.hooks);
    expect(r.displays).toEqual([
      { bundle: { 'text/plain': 'step 1' }, options: { displayId: 'fit' } },
      { bundle: { 'text/plain': 'step 2' }, options: { displayId: 'fit', update: true } },
    ]);
  });

  it('a cell with a type error is not run and comes back as CompileError with line:column', async () => {
    const r = recorder();
    const out = await session.execute('console.log("ran");\nconst charge: number = "plus";', r.hooks);
    expect(out.status).toBe('error');
    expect(out.error?.ename).toBe('CompileError');
    expect(out.error?.evalue).toMatch(/^2:7 - Type 'string' is not assignable to type 'number'/);
    expect(r.streams).toEqual([]);
  });

  it('a thrown Error gives its name, message and a traceback that starts with them', async () => {
    const out = await session.execute('throw new TypeError("no hits on track 7")', recorder().hooks);
    expect(out.error?.ename).toBe('TypeError');
    expect(out.error?.evalue).toBe('no hits on track 7');
    expect(out.error?.traceback[0]).toBe('TypeError: no hits on track 7');
    const thrownString = await session.execute('throw "plain string"', recorder().hooks);
    expect(thrownString.error?.ename).toBe('Thrown');
  });

  it('a cell that throws part-way keeps the imports and declarations made before the throw; names after it are gone', async () => {
    const failed = await session.execute('import { PROTON as P } from "sagitta-tracks";\nconst before = 2;\nfunction twice(x: number) { return before * x; }\nthrow new Error("half way");\nconst after = 3;', recorder().hooks);
    expect(failed.error?.evalue).toBe('half way');
    const later = await session.execute('[twice(P.charge), before]', recorder().hooks);
    expect(later.status).toBe('ok');
    expect(later.result?.['text/plain']).toBe('[ 2, 2 ]');
    const missing = await session.execute('after', recorder().hooks);
    expect(missing.error?.ename).toBe('CompileError');
    expect(missing.error?.evalue).toMatch(/Cannot find name 'after'/);
  });

  it('an earlier value survives a later cell that fails before redeclaring it', async () => {
    await session.execute('let seedRun = 7;', recorder().hooks);
    await session.execute('throw new Error("stop");\nlet seedRun = 8;', recorder().hooks);
    expect((await session.execute('seedRun', recorder().hooks)).result?.['text/plain']).toBe('7');
  });

  it('a run-time error names the cell, line and column of each frame in the cell', async () => {
    const out = await session.execute('interface Hit { x: number }\nfunction deep(h: Hit): never {\n  throw new RangeError(`no field at x = ${h.x}`);\n}\ndeep({ x: 0.5 });', recorder().hooks, { label: 'cell 9' });
    expect(out.error?.traceback.slice(0, 3)).toEqual([
      'RangeError: no field at x = 0.5',
      '    at deep (cell 9, line 3, column 9)',
      '    at cell 9, line 5, column 1',
    ]);
  });

  it('clearOutput and ask reach the cell hooks', async () => {
    const r = recorder();
    const out = await session.execute('import { ask, clearOutput } from "sagitta-tracks";\nclearOutput({ wait: true });\nclearOutput();\nawait ask("Run label: ")', r.hooks);
    expect(r.cleared).toEqual([true, false]);
    expect(out.result?.['text/plain']).toBe('answer to Run label: ');
  });

  it('interrupt() stops a cell waiting on an await', async () => {
    const running = session.execute('await new Promise((resolve) => setTimeout(resolve, 600_000));', recorder().hooks);
    await new Promise((resolve) => setTimeout(resolve, 200));
    session.interrupt();
    const out = await running;
    expect(out.status).toBe('error');
    expect(out.error?.ename).toBe('Interrupted');
  });

  it('complete() counts cursor positions in code points', async () => {
    const code = 'const 𝛽 = 0.9;\nMath.sq';
    const cursor = [...code].length;
    const reply = await session.complete(code, cursor);
    expect(reply.matches).toContain('sqrt');
    expect(reply.cursorEnd).toBe(cursor);
    expect(reply.cursorStart).toBe(cursor - 2);
  });

  it('inspect() gives the signature and doc comment as text/plain and text/markdown', async () => {
    const code = 'import { particle } from "sagitta-tracks";\nparticle';
    const bundle = await session.inspect(code, [...code].length, 0);
    expect(bundle?.['text/plain']).toMatch(/function particle\(name: string\): Particle/);
    expect(bundle?.['text/markdown']).toMatch(/^```typescript\n/);
    expect(await session.inspect('   ', 1, 0)).toBeUndefined();
  });

  it('isComplete() tells complete, incomplete and invalid code apart', async () => {
    expect(await session.isComplete('const r = 2.5;')).toBe('complete');
    expect(await session.isComplete('function f(x: number) {')).toBe('incomplete');
    expect(await session.isComplete('const = = 1;')).toBe('invalid');
    expect(await session.isComplete('')).toBe('complete');
  });
});
