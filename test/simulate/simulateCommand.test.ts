import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runSimulate, SIMULATE_CAUTION } from '../../kernel/cli/commands/simulate.js';
import { buildProgram } from '../../kernel/cli/main.js';
import { parseHitsCsv } from '../../lib/io/index.js';

const scenario = JSON.parse(readFileSync(new URL('../../notebooks/data/brindlemoor.scenario.json', import.meta.url), 'utf8'));

describe('sagitta simulate <scenario> --seed --out --truth', () => {
  const dir = mkdtempSync(join(tmpdir(), 'sagitta-simulate-'));
  const small = { ...scenario, sources: scenario.sources.map((s: Record<string, unknown>) => ({ ...s, events: 3 })) };
  const file = join(dir, 'small.json');
  writeFileSync(file, JSON.stringify(small));

  it('writes hits (readable by lib/io), truth and a run record with the seed; the same seed twice gives the same bytes', () => {
    const out = join(dir, 'hits.csv'), truth = join(dir, 'truth.csv');
    const first = runSimulate(file, { seed: '7', out, truth });
    expect(first.stdout).toMatch(/simulated 18 events, \d+ particles, \d+ hits \(scenario brindlemoor, seed 7\)/);
    expect(first.stdout).toContain(`run record (seed, scenario, counts; marks the hits as simulated for reports) → ${join(dir, 'hits.run.json')}`);
    const hits = readFileSync(out);
    expect(parseHitsCsv(hits, out).length).toBeGreaterThan(100);
    expect(readFileSync(truth, 'utf8').split('\n')[0]).toBe('event,track,parent,species,charge,process,vx[mm],vy[mm],vz[mm],px[MeV/c],py[MeV/c],pz[MeV/c],p[MeV/c],end,ex[mm],ey[mm],ez[mm],path[mm],hits');
    const record = JSON.parse(readFileSync(join(dir, 'hits.run.json'), 'utf8'));
    expect(record.seed).toBe(7);
    expect(record.files).toEqual({ hits: 'hits.csv', scenario: 'small.json', truth: 'truth.csv' });
    runSimulate(file, { seed: '7', out, truth });
    expect(readFileSync(out).equals(hits)).toBe(true);
  });

  it('--schema prints the JSON Schema; a bad seed and a non-scenario file are refused with a reason', () => {
    expect(JSON.parse(runSimulate(undefined, { seed: '1', schema: true }).stdout).title).toBe('Sagitta chamber scenario');
    expect(() => runSimulate(file, { seed: 'seven' })).toThrow(/--seed = "seven" is not valid: expected a whole number/);
    const pkg = join(dir, 'package.json');
    writeFileSync(pkg, '{"name": "x"}');
    expect(() => runSimulate(pkg, { seed: '1' })).toThrow(/not a Sagitta scenario/);
  });

  it('is registered on the sagitta command and its help carries the safety caution', async () => {
    const cmd = (await buildProgram()).commands.find((c) => c.name() === 'simulate');
    expect(cmd).toBeDefined();
    let help = '';
    cmd!.configureOutput({ writeOut: (s) => { help += s; } });
    cmd!.outputHelp();
    expect(help).toContain('--seed <n>');
    expect(help.replace(/\s+/g, ' ')).toContain(SIMULATE_CAUTION);
  });
});
