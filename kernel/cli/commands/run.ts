import { Command } from 'commander';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { basename, dirname, join, resolve } from 'node:path';
import { msg } from '../../../lib/internal.js';
import type { RunProgress } from '../../runner/runNotebook.js';
import { planOutputs, realOf, type NamedPath, type PlannedOutput } from '../../batch/outputPlan.js';
import { OutputSet } from '../../batch/outputSet.js';
import { usage } from '../usage.js';

export interface RunCommandOptions {
  html?: string;
  pdf?: string;
  /** Path of the executed notebook; false: do not write one. */
  executed?: string | false;
  writeBack?: boolean;
  cellTimeout: string;
  keepGoing?: boolean;
  set: string[];
  hideCode?: boolean;
  /** Per-step progress lines (the command passes one when stderr is a terminal). */
  progress?: (event: RunProgress) => void;
}

/**
 * `sagitta run <notebook.ipynb>`: executes a notebook headlessly in a child process and writes
 * the executed notebook and, if asked, a self-contained HTML (and PDF) report. The report and
 * the executed notebook are written even when a cell fails.
 * Exit codes: 0 every cell ran without error; 1 a cell failed, timed out or ended the process,
 * or the notebook is unusable (one-line reason on stderr); 2 bad usage.
 */
export function registerRun(program: Command): void {
  program
    .command('run')
    .description('run a notebook headlessly and write the executed notebook and an HTML/PDF report')
    .argument('<notebook>', 'notebook file (.ipynb, nbformat 4, any minor version)')
    .option('--html <file>', 'write the report as one self-contained offline HTML file')
    .option('--pdf <file>', 'also print the report to PDF with headless Chromium')
    .option('--executed <file>', 'where to write the executed notebook (default: <name>.executed.ipynb in the current folder)')
    .option('--no-executed', 'do not write the executed notebook')
    .option('--write-back', 'write the executed notebook over the source notebook (the source is otherwise never changed)')
    .option('--cell-timeout <duration>', 'longest one cell may run, e.g. 120s, 2min, 500ms; 0 for no limit', '120s')
    .option('--keep-going', 'run the remaining cells after a cell raises an error')
    .option('--set <name=value>', 'give a knob of the notebook a value for this run, e.g. --set field="1.2 T"; repeatable', (v: string, acc: string[]) => [...acc, v], [] as string[])
    .option('--hide-code', 'start the report with code folded away')
    .addHelpText('after', `
Knobs: a notebook declares the values a run may change with the library call knob(name, default),
e.g. const fieldT = knob('field', '1.5 T'). --set field="1.2 T" gives it a value for this run; every
value is checked against its knob's type and unit (a field needs a field unit, a number a number,
a list the same length) before any cell runs. The report lists each knob with the value used.

Cells run in order in a separate Node process; while one runs, the next are type-checked on a
second thread, and a cell runs only once checked (a type error stops the run there). A cell that
raises gets an error output; with
--keep-going the later cells still run. A cell that exceeds --cell-timeout, or that ends the
process (process.exit, a crash), stops the process: that cell gets an error output saying so and
the cells after it are marked not run. The executed notebook (nbformat 4.5, with per-cell times
under metadata.sagitta) and the report are written in every case, atomically.

Exit codes: 0 every cell ran without error; 1 a cell failed, timed out or ended the process, or
the notebook could not be read; 2 bad usage.

Example:
  sagitta run notebooks/01-brindlemoor-bending.ipynb --html report.html --set field="1.2 T" --cell-timeout 60s`)
    .action(async (notebook: string, options: RunCommandOptions) => {
      const progress = process.stderr.isTTY ? terminalProgress() : undefined;
      const result = await runCommand(notebook, { ...options, progress });
      process.stderr.write(`${result.summary}\n`);
      if (result.exitCode !== 0) {
        process.stderr.write(`sagitta: ${result.reason}\n`);
        process.exitCode = result.exitCode;
      }
    });
}

export interface RunCommandResult {
  readonly exitCode: 0 | 1;
  readonly reason?: string;
  readonly summary: string;
  readonly executedPath?: string;
  readonly htmlPath?: string;
  readonly pdfPath?: string;
}

/** Runs the command (also used by `sagitta demo` and by tests). */
export async function runCommand(notebook: string, options: RunCommandOptions): Promise<RunCommandResult> {
  const [{ parseDuration }, { parseSetArguments }, { startNotebookProcess }, { adoptEarlyNotebookProcess }] = await Promise.all([
    import('../../runner/duration.js'),
    import('../../runner/setArguments.js'),
    import('../../runner/notebookProcess.js'),
    import('../../runner/earlyNotebookProcess.js'),
  ]);
  // Every option and every output checked before anything runs (usage errors, exit 2).
  const { cellTimeoutMs, knobs, outputs } = usage(() => ({
    cellTimeoutMs: parseDuration(options.cellTimeout),
    knobs: parseSetArguments(options.set ?? []),
    outputs: planRunOutputs(notebook, options),
  }));
  const executed = outputs.find((o) => o.flag === '--executed' || o.flag === '--write-back');
  const html = outputs.find((o) => o.flag === '--html' || o.flag === 'the HTML beside --pdf');
  const pdf = outputs.find((o) => o.flag === '--pdf');
  // Start the notebook process first (or take the one the command started as it began): it boots
  // (library, cell compiler) while this process loads the runner and the report modules.
  const workDir = dirname(resolve(notebook));
  const notebookProcess = adoptEarlyNotebookProcess(workDir, true) ?? startNotebookProcess(workDir, true);
  let runNotebook: typeof import('../../runner/runNotebook.js').runNotebook;
  let serializeNotebook: typeof import('../../notebook/write.js').serializeNotebook;
  try {
    [{ runNotebook }, { serializeNotebook }] = await Promise.all([import('../../runner/runNotebook.js'), import('../../notebook/write.js')]);
  } catch (err) {
    notebookProcess.child.kill('SIGKILL');
    throw err;
  }
  const running = runNotebook(notebook, { cellTimeoutMs, keepGoing: options.keepGoing, knobs, onProgress: options.progress, process: notebookProcess });
  const report = html !== undefined ? import('../../report/index.js') : undefined;
  report?.catch(() => undefined);
  const result = await running;
  const bytes = new Map<string, string | Uint8Array>();
  if (executed) bytes.set(executed.flag, serializeNotebook(result.notebook));
  if (report !== undefined && html !== undefined) {
    const { renderReport, reportPdfBytes } = await report;
    const page = renderReport({ notebook: result.notebook, run: result.run, codeOpen: !options.hideCode, imageDir: dirname(resolve(notebook)) });
    bytes.set(html.flag, page);
    if (pdf !== undefined) bytes.set(pdf.flag, await printedFromScratch(page, reportPdfBytes));
  }
  // The executed notebook, the report and its PDF appear together or not at all.
  const set = new OutputSet(outputs);
  try {
    for (const o of outputs) set.write(o.flag, bytes.get(o.flag) ?? '');
    await set.commitWhenSettled();
  } catch (err) {
    set.abandon();
    throw err;
  }
  const written: string[] = [];
  if (executed) written.push(`executed notebook: ${executed.path}`);
  if (html) written.push(`report: ${resolve(html.path)}`);
  if (pdf) written.push(`PDF: ${resolve(pdf.path)}`);
  const executedPath = executed?.path;
  const htmlPath = html?.path;
  const pdfPath = pdf?.path;
  const code = result.notebook.cells.filter((c) => c.cell_type === 'code');
  const ran = code.filter((c) => (c.metadata.sagitta as { outcome?: string } | undefined)?.outcome !== 'not-run').length;
  const startup = Number.isFinite(result.startMs) ? ` (start-up ${(result.startMs / 1000).toFixed(2)} s)` : '';
  const summary = `ran ${ran} of ${code.length} steps in ${(result.run.wallMs / 1000).toFixed(2)} s${startup}\n${written.join('\n')}`;
  return { exitCode: result.exitCode, reason: result.reason, summary, executedPath, htmlPath, pdfPath };
}

/**
 * The outputs of a run, checked: none may be the source notebook (except with --write-back, which
 * replaces it on purpose) or another output, in any spelling (relative, symbolic links, hard links).
 */
export function planRunOutputs(notebook: string, options: RunCommandOptions): PlannedOutput[] {
  if (options.writeBack && typeof options.executed === 'string') throw msg.badArgument('--executed', options.executed, 'no --executed with --write-back (the executed notebook replaces the source)');
  const wanted: NamedPath[] = [];
  const executed = options.executed ?? `${basename(notebook).replace(/\.ipynb$/i, '')}.executed.ipynb`;
  if (!options.writeBack && executed !== false && realOf(executed) === realOf(notebook)) {
    throw msg.badArgument('--executed', executed, 'a path other than the source notebook (use --write-back to replace the source on purpose)');
  }
  if (!options.writeBack && executed !== false) wanted.push({ flag: '--executed', path: executed });
  if (options.html !== undefined) wanted.push({ flag: '--html', path: options.html });
  else if (options.pdf !== undefined) wanted.push({ flag: 'the HTML beside --pdf', path: `${options.pdf.replace(/\.pdf$/i, '')}.html` });
  if (options.pdf !== undefined) wanted.push({ flag: '--pdf', path: options.pdf });
  const planned = planOutputs([{ flag: '<notebook>', path: notebook }], wanted);
  return options.writeBack ? [...planOutputs(planned, [{ flag: '--write-back', path: notebook }]), ...planned] : planned;
}

/** Prints the report to PDF from a private scratch copy of the page (the real one is not written yet). */
async function printedFromScratch(page: string, print: (htmlPath: string) => Promise<Uint8Array>): Promise<Uint8Array> {
  const scratch = mkdtempSync(join(tmpdir(), 'sagitta-report-'));
  try {
    const file = join(scratch, 'report.html');
    writeFileSync(file, page);
    return await print(file);
  } finally {
    rmSync(scratch, { recursive: true, force: true });
  }
}

/**
 * Progress on a terminal: one line per step, redrawn in place ("step 3/9 … 1.24 s"), so a long
 * start-up or a slow cell is visible. Only used when stderr is a terminal.
 */
export function terminalProgress(write: (text: string) => void = (t) => void process.stderr.write(t)): (event: RunProgress) => void {
  let started = 0;
  return (event) => {
    if (event.kind === 'started') write(`notebook process ready; running ${event.steps} steps\n`);
    else if (event.kind === 'step') {
      started = Date.now();
      write(`\r\u001b[2Kstep ${event.step}/${event.steps} …`);
    } else {
      const s = ((event.wallMs || Date.now() - started) / 1000).toFixed(2);
      write(`\r\u001b[2Kstep ${event.step}/${event.steps} ${event.outcome === 'done' ? 'done' : 'FAILED'} in ${s} s${event.step === event.steps || event.outcome !== 'done' ? '\n' : ''}`);
    }
  };
}
