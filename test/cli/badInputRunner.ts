/**
 * Runs the bad-input catalogue (test/fixtures/bad/cases.json) through the command line's `main`
 * in one process, case after case, each in a fresh folder holding copies of its input files:
 * the exit code, stdout and stderr of every case, and whether any file of the folder was changed,
 * removed or added. Started by test/cli/badInputs.test.ts as `node --import tsx <this> <results.json>`.
 */
import { createHash } from 'node:crypto';
import { copyFileSync, linkSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { main } from '../../kernel/cli/main.js';
import { BAD_CASES_FILE, BAD_INPUTS_DIR, type BadCase, type BadCaseResult } from './badCases.js';

function snapshot(dir: string, base = dir, out = new Map<string, string>()): Map<string, string> {
  for (const name of readdirSync(dir)) {
    const p = join(dir, name);
    const st = statSync(p, { throwIfNoEntry: false });
    const rel = p.slice(base.length + 1);
    if (st === undefined) out.set(rel, 'dangling link');
    else if (st.isDirectory()) {
      out.set(rel, 'folder');
      snapshot(p, base, out);
    } else out.set(rel, createHash('sha256').update(readFileSync(p)).digest('hex'));
  }
  return out;
}

function prepare(dir: string, c: BadCase): void {
  for (const f of c.files ?? []) copyFileSync(join(BAD_INPUTS_DIR, f), join(dir, f));
  for (const step of c.setup ?? []) {
    if (step.mkdir) mkdirSync(join(dir, step.mkdir), { recursive: true });
    if (step.write) writeFileSync(join(dir, step.write.path), step.write.text);
    if (step.symlink) symlinkSync(step.symlink.target, join(dir, step.symlink.path));
    if (step.copy) copyFileSync(join(BAD_INPUTS_DIR, step.copy.from), join(dir, step.copy.to));
    if (step.hardlink) linkSync(join(dir, step.hardlink.target), join(dir, step.hardlink.path));
  }
}

async function runCase(c: BadCase): Promise<BadCaseResult> {
  const dir = mkdtempSync(join(tmpdir(), 'sagitta-bad-'));
  const home = process.cwd();
  prepare(dir, c);
  const before = snapshot(dir);
  const out: string[] = [];
  const err: string[] = [];
  const writeOut = process.stdout.write.bind(process.stdout);
  const writeErr = process.stderr.write.bind(process.stderr);
  process.stdout.write = ((chunk: string | Uint8Array) => (out.push(String(chunk)), true)) as typeof process.stdout.write;
  process.stderr.write = ((chunk: string | Uint8Array) => (err.push(String(chunk)), true)) as typeof process.stderr.write;
  let exit: number;
  try {
    process.chdir(dir);
    process.exitCode = undefined;
    exit = await main(['node', 'sagitta', ...c.args.map((a) => a.split('<dir>').join(dir))]);
  } catch (e) {
    exit = -1;
    err.push(`UNCAUGHT ${(e as Error).stack ?? String(e)}`);
  } finally {
    process.stdout.write = writeOut;
    process.stderr.write = writeErr;
    process.exitCode = undefined;
    process.chdir(home);
  }
  const after = snapshot(dir);
  const changed = [...new Set([...before.keys(), ...after.keys()])].filter((k) => before.get(k) !== after.get(k)).sort();
  rmSync(dir, { recursive: true, force: true });
  const clean = (s: string) => s.split(dir).join('<dir>').split(resolve(dir)).join('<dir>');
  return { name: c.name, exit, stdout: clean(out.join('')), stderr: clean(err.join('')), changed };
}

const cases = JSON.parse(readFileSync(BAD_CASES_FILE, 'utf8')) as BadCase[];
const only = process.argv[3];
const results: BadCaseResult[] = [];
for (const c of cases) if (only === undefined || c.name === only) results.push(await runCase(c));
writeFileSync(process.argv[2], JSON.stringify(results, null, 1));
process.exit(0);
