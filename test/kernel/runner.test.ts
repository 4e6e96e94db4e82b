import { spawnSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { Notebook } from '../../kernel/notebook/types.js';
import { joinSource } from '../../kernel/notebook/source.js';
import { declaredNames, parseDuration, parseSetArguments, injectParameters } from '../../kernel/runner/index.js';
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

function cli(args: string[], cwd: string) {
  return spawnSync(process.execPath, [BIN, ...args], { cwd, encoding: 'utf8', timeout: 120_000 });
}

describe('runner helpers', () => {
  it('parseDuration("2s") = 2000 ms, "1.5min" = 90000, "0" = no limit; "soon" is a bad call', () => {
    expect(parseDuration('2s')).toBe(2000);
    expect(parseDuration('1.5min')).toBe(90_000);
    expect(parseDuration('250ms')).toBe(250);
    expect(parseDuration('0')).toBe(Infinity);
    expect(() => parseDuration('soon')).toThrow(/--cell-timeout = "soon" is not valid/);
  });

  it('parseSetArguments reads JSON values and falls back to text', () => {
    expect(parseSetArguments(['fieldT=1.5', 'run=07', 'tag="x"', 'on=true', 'list=[1,2]', 'name=plain text'])).toEqual({ fieldT: 1.5, run: '07', tag: 'x', on: true, list: [1, 2], name: 'plain text' });
    expect(() => parseSetArguments(['1x=2'])).toThrow(/--set/);
  });

  it('injectParameters puts one tagged cell right after the knobs cell and replaces an older one', () => {
    const nb = { nbformat: 4, nbformat_minor: 5, metadata: {}, cells: [
      { id: 'a', cell_type: 'code', metadata: { tags: ['sagitta-knobs'] }, source: 'const fieldT = 1;', outputs: [], execution_count: null },
      { id: 'old', cell_type: 'code', metadata: { tags: ['sagitta-knobs-set'] }, source: 'const fieldT = 9;', outputs: [], execution_count: null },
      { id: 'b', cell_type: 'code', metadata: {}, source: 'fieldT', outputs: [], execution_count: null },
    ] } as Notebook;
    const out = injectParameters(nb, { fieldT: 2 }, 'x.ipynb');
    expect(out.cells.map((c) => c.id)).toEqual(['a', 'a-set', 'b']);
    expect(joinSource(out.cells[1].source)).toContain('const fieldT = 2;');
    expect(() => injectParameters({ ...nb, cells: [nb.cells[2]] }, { fieldT: 2 }, 'x.ipynb')).toThrow(/no code cell is tagged "sagitta-knobs"/);
    expect(() => injectParameters(nb, { fieldt: 2 }, 'x.ipynb')).toThrow(/--set fieldt: the cell tagged "sagitta-knobs" declares no such name \(it declares fieldT\)/);
  });

  it('declaredNames reads the names a knobs cell declares', () => {
    expect(declaredNames('// B\nconst fieldT = 1.5, label = "a,b"; // c\nlet runs = [1, 2], x: number = f(1, 2);\n/* const hidden = 1 */')).toEqual(['fieldT', 'label', 'runs', 'x']);
    expect(declaredNames('const { a, b } = obj;')).toBeUndefined();
  });
});

describe('sagitta run (child process per run)', { timeout: 180_000 }, () => {
  it('a throwing cell: error output, later cells not run, exit 1, report and executed notebook written, source unchanged', async () => {
    const { dir, file, bytes } = notebookFile([
      code('const fieldT = 1.5;\nconst label = "default";', ['sagitta-knobs']),
      code('import { present, refresh } from "sagitta";\nconsole.log("B =", fieldT, label);\npresent("step 1", { id: "progress" });\nrefresh("progress", "step 2");\nfieldT * 2'),
      code('throw new RangeError("field out of range")'),
      code('console.log("after")'),
    ]);
    const executed = join(dir, 'out.ipynb');
    const html = join(dir, 'report.html');
    const r = await runCommand(file, { cellTimeout: '60s', set: ['fieldT=0.5', 'label=set <here>'], executed, html });
    expect(r.exitCode).toBe(1);
    expect(r.reason).toBe('cell 5 failed: RangeError: field out of range; the cells after it were not run (use --keep-going to run them anyway)');
    expect(readFileSync(file)).toEqual(bytes);
    const nb = readJson(executed);
    expect(validate(nb).errors).toEqual([]);
    expect(nb.nbformat_minor).toBe(5);
    expect(outcomes(nb)).toEqual(['done', 'done', 'done', 'failed', 'not-run']);
    const cells = nb.cells.filter((c) => c.cell_type === 'code');
    expect(cells[1].metadata.tags).toEqual(['sagitta-knobs-set']);
    const outs = (cells[2] as unknown as { outputs: Array<Record<string, unknown>> }).outputs;
    expect(outs[0]).toEqual({ output_type: 'stream', name: 'stdout', text: 'B = 0.5 set <here>\n' });
    expect((outs[1].data as Record<string, unknown>)['text/plain']).toBe('step 2'); // refresh replaced the display
    expect(outs[2]).toMatchObject({ output_type: 'execute_result', execution_count: 3, data: { 'text/plain': '1' } });
    expect((cells[3] as { outputs: unknown[] }).outputs[0]).toMatchObject({ output_type: 'error', ename: 'RangeError', evalue: 'field out of range' });
    expect(cells[4].execution_count).toBeNull();
    for (const c of cells.slice(0, 4)) expect((c.metadata.sagitta as { wallMs: number }).wallMs).toBeGreaterThan(0);
    const page = readFileSync(html, 'utf8');
    expect(page).toContain('set &lt;here&gt;');
    expect(page).toContain('field out of range');
  }, 180_000);

  it('--keep-going runs the cells after a failure and still exits 1; --write-back replaces the source only when asked', async () => {
    const { file } = notebookFile([code('throw new Error("first")'), code('console.log("second ran")')]);
    await expect(runCommand(file, { cellTimeout: '60s', set: [], executed: file })).rejects.toThrow(/^--executed = .*(use --write-back to replace the source on purpose)/);
    const r = await runCommand(file, { cellTimeout: '60s', set: [], keepGoing: true, writeBack: true });
    expect(r.exitCode).toBe(1);
    expect(r.reason).toBe('cell 2 failed: Error: first (all cells ran: --keep-going)');
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
    expect(lastLine).toBe('sagitta: cell 3 ran longer than the 2 s limit and was stopped; the cells after it were not run');
    expect(readFileSync(file)).toEqual(bytes);
    const nb = readJson(join(dir, 'o.ipynb'));
    expect(validate(nb).errors).toEqual([]);
    expect(outcomes(nb)).toEqual(['done', 'failed', 'not-run']);
    const loop = nb.cells[2] as unknown as { outputs: Array<{ ename?: string }>; metadata: { sagitta: { wallMs: number } } };
    expect(loop.outputs[0].ename).toBe('CellTimeout');
    expect(loop.metadata.sagitta.wallMs).toBeGreaterThanOrEqual(2000);
    expect(existsSync(join(dir, 'r.html'))).toBe(true);
  }, 180_000);

  it('process.exit(1) in a cell: ProcessExit output, rest not run, exit 1', () => {
    const { dir, file, bytes } = notebookFile([code('console.log("before")'), code('process.exit(1)'), code('console.log("after")')]);
    const res = cli(['run', file, '--executed', join(dir, 'o.ipynb')], dir);
    expect(res.status).toBe(1);
    expect(res.stderr.trim().split('\n').at(-1)).toBe('sagitta: cell 3 ended the notebook process (exit code 1); the cells after it were not run');
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
    await expect(runCommand(file, { cellTimeout: '60s', set: [], html: join(dir, 'missing', 'r.html') })).rejects.toThrow(/^--html = .* expected a file in an existing folder/);
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
