import { spawn, spawnSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { Notebook } from '../../kernel/notebook/types.js';
import { joinSource } from '../../kernel/notebook/source.js';
import { checkSuppliedKnobs, findKnobs, longTimer, parseDuration, parseSetArguments } from '../../kernel/runner/index.js';
import { SagittaError } from '../../lib/errors.js';
import { runCommand } from '../../kernel/cli/commands/run.js';
import { nbformatValidator } from './nbSchema.js';

const BIN = resolve(import.meta.dirname, '..', '..', 'kernel', 'bin', 'sagitta.js');
const validate = nbformatValidator();

function code(source: string, tags: string[] = []): Record<string, unknown> {
  return { cell_type: 'code', metadata: tags.length ? { tags } : {}, execution_count: null, outputs: [], source };
}

/** Writes a notebook (nbformat 4.4, no ids: the runner upgrades it) into a fresh folder. */
function notebookFile(cells: Record<string, unknown>[]): { dir: string; file: string; bytes: Buffer } {
  const dir = mkdtempSync(join(tmpdir(), 'sagitta-run-'));
  const file = join(dir, 'nb.ipynb');
  writeFileSync(file, JSON.stringify({ nbformat: 4, nbformat_minor: 4, metadata: {}, cells: [{ cell_type: 'markdown', metadata: {}, source: '# Fault drill' }, ...cells] }, null, 1));
  return { dir, file, bytes: readFileSync(file) };
}

function readJson(file: string): Notebook {
  return JSON.parse(readFileSync(file, 'utf8')) as Notebook;
}

function outcomes(nb: Notebook): (string | undefined)[] {
  return nb.cells.filter((c) => c.cell_type === 'code').map((c) => (c.metadata.sagitta as { outcome?: string }).outcome);
}

/** The catalogue code of what `f` throws (tests compare codes, not message text). */
function codeOf(f: () => unknown): string | undefined {
  try {
    f();
  } catch (err) {
    return err instanceof SagittaError ? err.code : `not a SagittaError: ${String(err)}`;
  }
  return undefined;
}

function cli(args: string[], cwd: string) {
  return spawnSync(process.execPath, [BIN, ...args], { cwd, encoding: 'utf8', timeout: 120_000 });
}

describe('runner helpers', () => {
  it('parseDuration("2s") = 2000 ms, "1.5min" = 90000, "1000h" = 3.6e9 (no overflow), "0" = no limit; "soon" is a bad call', () => {
    expect(parseDuration('2s')).toBe(2000);
    expect(parseDuration('1.5min')).toBe(90_000);
    expect(parseDuration('250ms')).toBe(250);
    expect(parseDuration('1000h')).toBe(3.6e9);
    expect(parseDuration('0')).toBe(Infinity);
    expect(codeOf(() => parseDuration('soon'))).toBe('BAD_ARGUMENT');
  });

  it('longTimer waits past the 24.8-day setTimeout limit instead of firing at once, and cancels', async () => {
    let fired = 0;
    const cancel = longTimer(() => fired++, 3.6e9);
    const soon = longTimer(() => fired++, 5);
    await new Promise((r) => setTimeout(r, 60));
    cancel();
    soon();
    expect(fired).toBe(1);
  });

  it('parseSetArguments keeps values as text in a Map; __proto__ and non-names are bad calls', () => {
    const set = parseSetArguments(['field=1.2 T', 'window=[0,2]', 'label=a=b']);
    expect([...set]).toEqual([['field', '1.2 T'], ['window', '[0,2]'], ['label', 'a=b']]);
    expect(Object.getPrototypeOf(parseSetArguments([]))).toBe(Map.prototype);
    for (const bad of ['__proto__=5', '1x=2', 'noequals', 'constructor=1']) expect(codeOf(() => parseSetArguments([bad]))).toBe('BAD_ARGUMENT');
  });

  it('findKnobs reads knob(name, literal) calls with the parser; checkSuppliedKnobs checks type, unit, length and names', () => {
    const knobs = findKnobs([
      { index: 1, code: 'import { knob } from "sagitta-tracks";\nconst fieldT = knob("field", "1.5 T"); // knob("ignored", 1) in a comment\nconst n = knob("shown", -3);' },
      { index: 4, code: 'const w = sagitta.knob("window", [0, 2] as const);\nconst f = knob("file", path());' },
    ]);
    expect(knobs).toEqual([
      { name: 'field', defaultValue: '1.5 T', cell: 1 },
      { name: 'shown', defaultValue: -3, cell: 1 },
      { name: 'window', defaultValue: [0, 2], cell: 4 },
      { name: 'file', cell: 4 },
    ]);
    expect(checkSuppliedKnobs(knobs, new Map([['field', '12 kG'], ['shown', '7'], ['window', '[1, 5]'], ['file', 'x.csv']]))).toEqual([]);
    const problems = checkSuppliedKnobs(knobs, new Map([['field', '1.2'], ['shown', '1.2 T'], ['window', '[1, 2, 3]'], ['fieldT', '1']]));
    expect(problems).toHaveLength(4);
    expect(problems[0]).toMatch(/^knob "field": "1\.2" is not a field with a unit/);
    expect(problems[3]).toMatch(/^knob "fieldT": --set names a knob the notebook does not declare \(it declares field, shown, window, file\)/);
  });
});

describe('sagitta run (child process per run)', { timeout: 180_000 }, () => {
  it('a throwing cell: error output, later steps not run, exit 1, report and executed notebook written, source unchanged; knobs take --set values', async () => {
    const { dir, file, bytes } = notebookFile([
      code('import { knob } from "sagitta-tracks";\nconst fieldT = knob("field", "1.5 T");\nconst label = knob("label", "default");'),
      code('import { present, refresh } from "sagitta-tracks";\nconsole.log("B =", fieldT, label);\npresent("step 1", { id: "progress" });\nrefresh("progress", "step 2");\nfieldT * 2'),
      code('throw new RangeError("field out of range")'),
      code('console.log("after")'),
    ]);
    const executed = join(dir, 'out.ipynb');
    const html = join(dir, 'report.html');
    const r = await runCommand(file, { cellTimeout: '60s', set: ['field=5 kG', 'label=set <here>'], executed, html });
    expect(r.exitCode).toBe(1);
    expect(r.reason).toBe('step 3 failed: RangeError: field out of range; the steps after it were not run (use --keep-going to run them anyway)');
    expect(readFileSync(file)).toEqual(bytes);
    const nb = readJson(executed);
    expect(validate(nb).errors).toEqual([]);
    expect(nb.nbformat_minor).toBe(5);
    expect(outcomes(nb)).toEqual(['done', 'done', 'failed', 'not-run']);
    const cells = nb.cells.filter((c) => c.cell_type === 'code');
    expect(cells.map((c) => c.execution_count)).toEqual([1, 2, 3, null]);
    const outs = (cells[1] as unknown as { outputs: Array<Record<string, unknown>> }).outputs;
    expect(outs[0]).toEqual({ output_type: 'stream', name: 'stdout', text: 'B = 0.5 set <here>\n' });
    expect((outs[1].data as Record<string, unknown>)['text/plain']).toBe('step 2'); // refresh replaced the display
    expect(outs[2]).toMatchObject({ output_type: 'execute_result', execution_count: 2, data: { 'text/plain': '1' } });
    expect((cells[2] as { outputs: unknown[] }).outputs[0]).toMatchObject({ output_type: 'error', ename: 'RangeError', evalue: 'field out of range' });
    for (const c of cells.slice(0, 3)) expect((c.metadata.sagitta as { wallMs: number }).wallMs).toBeGreaterThan(0);
    const page = readFileSync(html, 'utf8');
    expect(page).toContain('set &lt;here&gt;');
    expect(page).toContain('<td>field</td><td class="sg-hash">5 kG <span class="sg-muted">(used in T)</span></td><td class="sg-hash">1.5 T</td><td>this run (--set)</td>');
    expect(page).toContain('field out of range');
    expect(page).not.toContain(dir);
  }, 180_000);

  it('knob values of the wrong type or unit, or for no declared knob, are refused (BAD_KNOB) before any cell runs; a list keeps its length and types', async () => {
    const { dir, file } = notebookFile([
      code('import { writeFileSync } from "node:fs";\nwriteFileSync("ran.txt", "yes");'),
      code('import { knob } from "sagitta-tracks";\nconst fieldT = knob("field", "1.5 T");\nconst window = knob("window", [0, 2]);\nconst [lo, hi]: readonly [number, number] = window;\nconsole.log(fieldT, lo + hi);'),
    ]);
    // One refused run names every problem (the kinds are covered one by one in test/knob.test.ts).
    const refused = await runCommand(file, { cellTimeout: '60s', set: ['field=1.2', 'window=[0,1,2]', 'fieldT=1.2 T'], executed: false }).catch((e: SagittaError) => e);
    expect((refused as SagittaError).code).toBe('BAD_KNOB');
    expect((refused as SagittaError).message.split('; knob ')).toHaveLength(3);
    expect(existsSync(join(dir, 'ran.txt'))).toBe(false);
    await expect(runCommand(file, { cellTimeout: '60s', set: ['__proto__=5'], executed: false }).catch((e: SagittaError) => e.code)).resolves.toBe('BAD_ARGUMENT');
    const r = await runCommand(file, { cellTimeout: '1000h', set: ['window=[1, 5]', 'field=0.5 T'], executed: join(dir, 'o.ipynb') });
    expect(r.reason).toBeUndefined();
    const out = (readJson(join(dir, 'o.ipynb')).cells[2] as { outputs: Array<{ text?: string }> }).outputs;
    expect(out[0].text).toBe('0.5 6\n');
  }, 180_000);

  it('SIGTERM to sagitta run alone stops the notebook process and still writes the report and the executed notebook', async () => {
    const { dir, file } = notebookFile([code('import { writeFileSync } from "node:fs";\nwriteFileSync("pid.txt", String(process.pid));\nwhile (true) {}')]);
    const child = spawn(process.execPath, [BIN, 'run', file, '--executed', join(dir, 'o.ipynb'), '--html', join(dir, 'r.html')], { cwd: dir, stdio: ['ignore', 'pipe', 'pipe'] });
    let stderr = '';
    child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
    const exited = new Promise<number | null>((resolve) => child.once('exit', (c) => resolve(c)));
    for (let i = 0; i < 600 && !existsSync(join(dir, 'pid.txt')); i++) await new Promise((r) => setTimeout(r, 200));
    const notebookPid = Number(readFileSync(join(dir, 'pid.txt'), 'utf8'));
    child.kill('SIGTERM');
    expect(await exited).toBe(1);
    expect(stderr.trim().split('\n').at(-1)).toBe('sagitta: the run was stopped (SIGTERM) during step 1; the steps after it were not run');
    expect(() => process.kill(notebookPid, 0)).toThrow(/ESRCH/);
    expect(readFileSync(join(dir, 'r.html'), 'utf8')).toContain('RunStopped');
    expect(outcomes(readJson(join(dir, 'o.ipynb')))).toEqual(['failed']);
  }, 180_000);

  it('--keep-going runs the cells after a failure and still exits 1; --write-back replaces the source only when asked', async () => {
    const { file } = notebookFile([code('throw new Error("first")'), code('console.log("second ran")')]);
    await expect(runCommand(file, { cellTimeout: '60s', set: [], executed: file })).rejects.toThrow(/^--executed = .*(use --write-back to replace the source on purpose)/);
    const r = await runCommand(file, { cellTimeout: '60s', set: [], keepGoing: true, writeBack: true });
    expect(r.exitCode).toBe(1);
    expect(r.reason).toBe('step 1 failed: Error: first (all steps ran: --keep-going)');
    expect(r.executedPath).toBe(file);
    const nb = readJson(file);
    expect(validate(nb).errors).toEqual([]);
    expect(outcomes(nb)).toEqual(['failed', 'done']);
  }, 180_000);

  it('an endless cell under --cell-timeout 2s: CellTimeout output, rest not run, exit 1 with one line, source unchanged', () => {
    const { dir, file, bytes } = notebookFile([code('let n = 0;'), code('while (true) { n++; }'), code('n')]);
    const res = cli(['run', file, '--cell-timeout', '2s', '--executed', join(dir, 'o.ipynb'), '--html', join(dir, 'r.html')], dir);
    expect(res.status).toBe(1);
    const lastLine = res.stderr.trim().split('\n').at(-1);
    expect(lastLine).toBe('sagitta: step 2 ran longer than the 2 s limit and was stopped; the steps after it were not run');
    expect(readFileSync(file)).toEqual(bytes);
    const nb = readJson(join(dir, 'o.ipynb'));
    expect(validate(nb).errors).toEqual([]);
    expect(outcomes(nb)).toEqual(['done', 'failed', 'not-run']);
    const loop = nb.cells[2] as unknown as { outputs: Array<{ ename?: string }>; metadata: { sagitta: { wallMs: number } } };
    expect(loop.outputs[0].ename).toBe('CellTimeout');
    // The budget is a libuv timer (whole milliseconds on its own loop clock): against
    // performance.now it may fire up to 1 ms early (seen once: 1999.9 ms).
    expect(loop.metadata.sagitta.wallMs).toBeGreaterThanOrEqual(1999);
    expect(existsSync(join(dir, 'r.html'))).toBe(true);
  }, 180_000);

  it('process.exit(1) in a cell: ProcessExit output, rest not run, exit 1', () => {
    const { dir, file, bytes } = notebookFile([code('console.log("before")'), code('process.exit(1)'), code('console.log("after")')]);
    const res = cli(['run', file, '--executed', join(dir, 'o.ipynb')], dir);
    expect(res.status).toBe(1);
    expect(res.stderr.trim().split('\n').at(-1)).toBe('sagitta: step 2 ended the notebook process (exit code 1); the steps after it were not run');
    expect(readFileSync(file)).toEqual(bytes);
    const nb = readJson(join(dir, 'o.ipynb'));
    expect(validate(nb).errors).toEqual([]);
    expect(outcomes(nb)).toEqual(['done', 'failed', 'not-run']);
    expect((nb.cells[2] as { outputs: Array<{ ename?: string }> }).outputs.at(-1)?.ename).toBe('ProcessExit');
  }, 180_000);

  it('a notebook written for another language is refused before anything runs', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'sagitta-run-'));
    const file = join(dir, 'py.ipynb');
    writeFileSync(file, JSON.stringify({ nbformat: 4, nbformat_minor: 5, metadata: { kernelspec: { name: 'x', display_name: 'X', language: 'python' } }, cells: [] }));
    await expect(runCommand(file, { cellTimeout: '60s', set: [] })).rejects.toThrow(/py\.ipynb: is written for python; sagitta runs TypeScript notebooks/);
    await expect(runCommand(file, { cellTimeout: '60s', set: [], html: join(dir, 'missing', 'r.html') })).rejects.toThrow(/r.html: cannot write here \(the folder .*missing does not exist\)/);
  });

  it('a truncated .ipynb: exit 1 naming the file and the JSON problem; nothing written, source unchanged', () => {
    const dir = mkdtempSync(join(tmpdir(), 'sagitta-run-'));
    const file = join(dir, 'cut.ipynb');
    copyFileSync(join(import.meta.dirname, '..', 'fixtures', 'nbformat', 'minor2-no-ids.ipynb'), file);
    const whole = readFileSync(file);
    writeFileSync(file, whole.subarray(0, Math.floor(whole.length / 2)));
    const bytes = readFileSync(file);
    const res = cli(['run', file, '--html', join(dir, 'r.html')], dir);
    expect(res.status).toBe(1);
    expect(res.stderr.trim()).toMatch(/^sagitta: .*cut\.ipynb: is not valid JSON near line \d+ .*truncated/);
    expect(res.stderr.trim().split('\n')).toHaveLength(1);
    expect(readFileSync(file)).toEqual(bytes);
    expect(existsSync(join(dir, 'r.html'))).toBe(false);
    expect(existsSync(join(dir, 'cut.executed.ipynb'))).toBe(false);
  }, 120_000);
});
