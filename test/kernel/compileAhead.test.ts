/**
 * The ahead check of a headless run (kernel/session/compileAhead.ts): cells compiled on a second
 * thread while earlier cells run must give the run a notebook compiled just in time gives — the
 * same outputs, the same type errors at the same lines — and a cell never runs before it is checked.
 */
import { existsSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { Notebook } from '../../kernel/notebook/types.js';
import { runNotebook, type NotebookRun } from '../../kernel/runner/index.js';

function notebookFile(sources: string[]): { dir: string; file: string } {
  const dir = mkdtempSync(join(tmpdir(), 'sagitta-ahead-'));
  const file = join(dir, 'nb.ipynb');
  const cells = sources.map((source) => ({ cell_type: 'code', metadata: {}, execution_count: null, outputs: [], source }));
  writeFileSync(file, JSON.stringify({ nbformat: 4, nbformat_minor: 5, metadata: {}, cells: cells.map((c, i) => ({ id: `c${i}`, ...c })) }));
  return { dir, file };
}

/** What a reader of the executed notebook sees of each code cell: outputs, number and outcome (no times). */
function seen(nb: Notebook): unknown[] {
  return nb.cells.filter((c) => c.cell_type === 'code').map((c) => ({ outputs: c.outputs, count: c.execution_count, outcome: (c.metadata.sagitta as { outcome?: string }).outcome }));
}

/** The outputs of code cell `k` (0-based among code cells). */
function outputs(run: NotebookRun, k: number): unknown[] {
  return run.notebook.cells.filter((c) => c.cell_type === 'code')[k].outputs;
}

function outcomes(run: NotebookRun): (string | undefined)[] {
  return run.notebook.cells.filter((c) => c.cell_type === 'code').map((c) => (c.metadata.sagitta as { outcome?: string }).outcome);
}

/** Runs `file` with and without the ahead check. */
async function both(file: string, keepGoing = false): Promise<{ ahead: NotebookRun; inline: NotebookRun }> {
  const ahead = await runNotebook(file, { cellTimeoutMs: 60_000, keepGoing });
  const inline = await runNotebook(file, { cellTimeoutMs: 60_000, keepGoing, compileAhead: false });
  return { ahead, inline };
}

describe('runNotebook with the ahead check', { timeout: 180_000 }, () => {
  it('a type error in cell 3: cells 1–2 run, cell 3 reports the error at its line and column as when compiled in time, nothing after it runs', async () => {
    const { dir, file } = notebookFile([
      'import { writeFileSync } from "node:fs";\nconst a = 1;\nconsole.log("one", a);',
      'writeFileSync("ran-2.txt", "2");\nconsole.log("two", a + 1);',
      '// the third cell\nconst s: string = a;\nconsole.log("three", s);',
      'writeFileSync("ran-4.txt", "4");\nconsole.log("four");',
    ]);
    const { ahead, inline } = await both(file);
    for (const run of [ahead, inline]) {
      expect(outcomes(run)).toEqual(['done', 'done', 'failed', 'not-run']);
      expect(run.reason).toMatch(/^step 3 failed: CompileError: 2:7 - Type 'number' is not assignable to type 'string'\./);
    }
    expect(outputs(ahead, 0)).toEqual([{ output_type: 'stream', name: 'stdout', text: 'one 1\n' }]);
    expect(outputs(ahead, 1)).toEqual([{ output_type: 'stream', name: 'stdout', text: 'two 2\n' }]);
    expect(outputs(ahead, 2)).toEqual([{
      output_type: 'error',
      ename: 'CompileError',
      evalue: "2:7 - Type 'number' is not assignable to type 'string'.",
      traceback: ['CompileError: the cell was not run because it does not compile', "2:7 - Type 'number' is not assignable to type 'string'."],
    }]);
    expect(outputs(ahead, 3)).toEqual([]);
    expect(existsSync(join(dir, 'ran-2.txt'))).toBe(true);
    expect(existsSync(join(dir, 'ran-4.txt'))).toBe(false); // compiled ahead, never run
    expect(seen(ahead.notebook)).toEqual(seen(inline.notebook));
  });

  it('a clean notebook gives the same outputs with and without it (library import, values, displays, a local module, await, redeclared names, shorthand)', async () => {
    const { dir, file } = notebookFile([
      'import { PROTON, histogramFigure } from "sagitta-tracks";\nimport { twice } from "./helper";\nconst n = 3;\nPROTON.massMeV',
      'const xs = Array.from({ length: 50 }, (_, i) => Math.sin(i));\nconsole.log(twice(n));\nhistogramFigure(xs, { title: "values", xTitle: "x", bins: 5 })',
      'let n2 = await Promise.resolve(n * 2);\n({ n, n2 })',
      'const n = "now a string";\nn.length',
      'function f(k: number) { return k + n.length; }\nf(1)',
    ]);
    writeFileSync(join(dir, 'helper.ts'), 'export function twice(k: number): number {\n  return 2 * k;\n}\n');
    const { ahead, inline } = await both(file);
    expect(ahead.reason).toBeUndefined();
    expect(outcomes(ahead)).toEqual(['done', 'done', 'done', 'done', 'done']);
    expect(seen(ahead.notebook)).toEqual(seen(inline.notebook));
    expect(ahead.run.modules).toEqual(inline.run.modules);
    expect(outputs(ahead, 1)[0]).toEqual({ output_type: 'stream', name: 'stdout', text: '6\n' });
  });

  it('the example notebook 04 gives the same outputs with and without it', async () => {
    const example = resolve(import.meta.dirname, '..', '..', 'notebooks', '04-ashgrove-finding.ipynb');
    const { ahead, inline } = await both(example);
    expect(ahead.exitCode).toBe(0);
    expect(seen(ahead.notebook)).toEqual(seen(inline.notebook));
  }, 300_000);

  it('a module an earlier cell writes is found (the ahead check\'s "Cannot find module" is checked again at its turn)', async () => {
    const { dir, file } = notebookFile([
      // The wait lets the ahead check reach the next cell before the module exists.
      'import { writeFileSync } from "node:fs";\nawait new Promise((r) => setTimeout(r, 1500));\nwriteFileSync("made.ts", "export const made = 41;\\n");',
      'import { made } from "./made";\nmade + 1',
    ]);
    const { ahead, inline } = await both(file);
    expect(existsSync(join(dir, 'made.ts'))).toBe(true);
    for (const run of [ahead, inline]) expect(outcomes(run)).toEqual(['done', 'done']);
    expect(seen(ahead.notebook)).toEqual(seen(inline.notebook));
  });

  it('a local module an earlier cell rewrites is compiled as it is then, as when compiled in time', async () => {
    const { dir, file } = notebookFile([
      'import { writeFileSync } from "node:fs";\nawait new Promise((r) => setTimeout(r, 1500));\nwriteFileSync("mod.ts", "export const value: number = 2;\\n");',
      'import { value } from "./mod";\nvalue * 10',
    ]);
    writeFileSync(join(dir, 'mod.ts'), 'export const value: string = "old";\n');
    const { ahead } = await both(file);
    expect(outcomes(ahead)).toEqual(['done', 'done']);
    expect(outputs(ahead, 1)).toMatchObject([{ output_type: 'execute_result', data: { 'text/plain': '20' } }]);
  });

  it('under --keep-going, a cell that throws part-way changes the declarations; later cells see what it reached, as without the ahead check', async () => {
    const { file } = notebookFile([
      'const a = 1;',
      'const b = a + 1;\nif (b > 0) throw new Error("boom");\nconst c = 3;',
      'console.log("b is", b);',
      'console.log("c is", c);',
      'const d: number = "x";',
      'console.log("last", a + b);',
    ]);
    const { ahead, inline } = await both(file, true);
    expect(outcomes(ahead)).toEqual(['done', 'failed', 'done', 'failed', 'failed', 'done']);
    expect(seen(ahead.notebook)).toEqual(seen(inline.notebook));
    expect(outputs(ahead, 3)[0]).toMatchObject({ ename: 'CompileError', evalue: expect.stringMatching(/^1:\d+ - Cannot find name 'c'\./) });
  });
});
