import { spawnSync } from 'node:child_process';
import { chmodSync, cpSync, existsSync, mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = resolve(import.meta.dirname, '..', '..');
const BIN = join(ROOT, 'kernel', 'bin', 'sagitta.js');

/** The example lines of a command's --help, as a user would copy them. */
function helpExamples(command: string): string[] {
  const help = spawnSync(process.execPath, [BIN, command, '--help'], { encoding: 'utf8' }).stdout;
  const lines = help.split('\n');
  const start = lines.findIndex((l) => /^Examples?\b/.test(l));
  if (start < 0) return [];
  const out: string[] = [];
  for (const l of lines.slice(start + 1)) {
    if (!/^ {2}\S/.test(l)) break;
    out.push(l.trim());
  }
  return out;
}

/**
 * A folder laid out like the package folder for the examples (a copy of its notebooks/, 7 MB,
 * and an empty out/), with `sagitta` on the PATH, so every example runs exactly as printed and
 * writes nothing into the checkout. A copy, not a link: a notebook reached through a symbolic
 * link does not see the package as "sagitta" today.
 */
function packageLikeFolder(): { cwd: string; env: NodeJS.ProcessEnv } {
  const cwd = mkdtempSync(join(tmpdir(), 'sagitta-help-'));
  cpSync(join(ROOT, 'notebooks'), join(cwd, 'notebooks'), { recursive: true });
  mkdirSync(join(cwd, 'out'));
  const bin = join(cwd, '.bin');
  mkdirSync(bin);
  writeFileSync(join(bin, 'sagitta'), `#!/bin/sh\nexec "${process.execPath}" "${BIN}" "$@"\n`);
  chmodSync(join(bin, 'sagitta'), 0o755);
  return { cwd, env: { ...process.env, PATH: `${bin}:${process.env.PATH ?? ''}` } };
}

function runExample(line: string, where: { cwd: string; env: NodeJS.ProcessEnv }): { status: number | null; stderr: string } {
  const r = spawnSync('/bin/sh', ['-c', line], { cwd: where.cwd, env: where.env, encoding: 'utf8', timeout: 240_000 });
  return { status: r.status, stderr: r.stderr };
}

// Commands in an order where each example finds what an earlier one wrote (merge needs the fit shards).
const COMMANDS = ['fit', 'find', 'vertices', 'merge', 'simulate', 'range', 'run'] as const;

describe('every example in every help text runs as written (from a folder laid out like the package folder)', () => {
  const where = packageLikeFolder();
  it('each command with options shows at least one example', () => {
    for (const c of COMMANDS) expect(helpExamples(c).length, `sagitta ${c} --help`).toBeGreaterThan(0);
  });
  for (const command of COMMANDS) {
    it(`sagitta ${command} --help: its examples exit 0`, () => {
      const examples = helpExamples(command);
      if (command === 'merge') {
        // merge's help names the four shard outputs of "sagitta fit --help"'s shard example: make the other three the same way.
        const shard = helpExamples('fit').find((l) => l.includes('--shard 2/4'))!;
        for (const k of [1, 3, 4]) expect(runExample(shard.replace('2/4', `${k}/4`).replace('part-2', `part-${k}`), where).status).toBe(0);
      }
      for (const line of examples) {
        const r = runExample(line, where);
        expect(r.status, `${line}\n${r.stderr}`).toBe(0);
      }
      if (command === 'fit') expect(existsSync(join(where.cwd, 'out', 'tracks.csv'))).toBe(true);
    }, 600_000);
  }
});
