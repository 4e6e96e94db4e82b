import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { Command } from 'commander';
import { RANGE_CAUTION, registerRange, runRange, type RangeCommandOptions } from '../../kernel/cli/commands/range.js';
import { SagittaError } from '../../lib/errors.js';

const base: RangeCommandOptions = { particle: 'proton', material: 'water', points: '25' };
const json = (o: Partial<RangeCommandOptions>) => JSON.parse(runRange({ ...base, ...o, json: true }).stdout);

describe('sagitta range', () => {
  it('--energy "100 MeV" --json gives the issue’s keys; range within 1 % of PSTAR 7.718 g/cm² (NIST PSTAR)', () => {
    const r = json({ energy: '100 MeV' });
    for (const k of ['csda_range_g_cm2', 'stopping_power_MeV_cm2_g', 'kinetic_energy_MeV', 'momentum_MeV', 'csda_range_cm', 'beta', 'gamma']) expect(r).toHaveProperty(k);
    expect(Math.abs(r.csda_range_g_cm2 / 7.718 - 1)).toBeLessThan(0.01);
    expect(Math.abs(r.stopping_power_MeV_cm2_g / 7.289 - 1)).toBeLessThan(0.01);
    expect(r.kinetic_energy_MeV).toBe(100);
    expect(r.caution).toBe(RANGE_CAUTION);
  });
  it('--range "7 cm" goes back to the energy whose range is 7 g/cm² in water, and "7 g/cm2" means the same', () => {
    const a = json({ range: '7 cm' });
    const b = json({ range: '7 g/cm2' });
    expect(a.csda_range_g_cm2).toBeCloseTo(7, 9);
    expect(a.kinetic_energy_MeV).toBeCloseTo(b.kinetic_energy_MeV, 9);
    const back = json({ energy: `${a.kinetic_energy_MeV} MeV` });
    expect(back.csda_range_g_cm2).toBeCloseTo(7, 6);
  });
  it('--momentum "444.58 MeV/c" is a 100 MeV proton', () => {
    expect(json({ momentum: '444.5834 MeV/c' }).kinetic_energy_MeV).toBeCloseTo(100, 3);
  });
  it('--table prints --points rows from --from to --to', () => {
    const t = json({ table: true, from: '1 MeV', to: '1 GeV', points: '7' });
    expect(t.rows).toHaveLength(7);
    expect(t.rows[0].kinetic_energy_MeV).toBeCloseTo(1, 9);
    expect(t.rows[6].kinetic_energy_MeV).toBeCloseTo(1000, 9);
    const text = runRange({ ...base, table: true, points: '5' }).stdout;
    expect(text).toMatch(/R \[g\/cm2\]/);
    expect(text).toMatch(/not for treatment planning/);
  });
  it('answers down to low energies for protons (0.1 MeV: PSTAR 1.607e-4 g/cm², within 1.5 %) and refuses electrons below 10 keV with OUTSIDE_VALIDITY', () => {
    expect(Math.abs(json({ energy: '0.1 MeV' }).csda_range_g_cm2 / 1.607e-4 - 1)).toBeLessThan(0.015);
    expect(() => runRange({ ...base, particle: 'electron', energy: '1 keV' })).toThrow(SagittaError);
    expect(() => runRange({ ...base, particle: 'electron', energy: '1 keV' })).toThrow(/outside the validity range 0.01/);
  });
  it('needs exactly one of --energy, --momentum, --range', () => {
    expect(() => runRange({ ...base })).toThrow(/exactly one/);
    expect(() => runRange({ ...base, energy: '1 MeV', range: '1 cm' })).toThrow(/exactly one/);
  });
  it('help carries the clinical caution', () => {
    const program = new Command('sagitta');
    registerRange(program);
    const range = program.commands.find((c) => c.name() === 'range')!;
    let after = '';
    range.configureOutput({ writeOut: (s) => { after += s; } });
    range.outputHelp();
    expect(after).toMatch(/not for treatment planning/);
    expect(after).toMatch(/licensed medical-physics practice/);
  });
  it('runs as a command: exit 0 with output, exit 2 with a one-line reason for an option value it cannot use', () => {
    const ok = spawnSync(process.execPath, ['kernel/bin/sagitta.js', 'range', '--particle', 'mu+', '--material', 'liquid-hydrogen', '--energy', '50 MeV', '--json'], { encoding: 'utf8' });
    expect(ok.status).toBe(0);
    expect(JSON.parse(ok.stdout).particle).toBe('mu+');
    const bad = spawnSync(process.execPath, ['kernel/bin/sagitta.js', 'range', '--material', 'cheese', '--energy', '50 MeV'], { encoding: 'utf8' });
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/unknown material "cheese"/);
  });
});

describe('sagitta range: regimes and user material files', () => {
  it('names the regime of every answer (JSON stopping_regime; the text shows it in words)', () => {
    expect(json({ energy: '0.05 MeV' }).stopping_regime).toBe('fit');
    expect(json({ energy: '1 MeV' }).stopping_regime).toBe('join');
    expect(json({ energy: '100 MeV' }).stopping_regime).toBe('bethe');
    expect(json({ particle: 'electron', energy: '1 MeV' }).stopping_regime).toBe('electron');
    const lead = runRange({ ...base, material: 'lead', energy: '1 MeV' });
    expect(lead.stdout).toMatch(/regime +extrapolated/);
    expect(lead.warnings.map((w) => w.code)).toContain('APPROXIMATION');
    const t = json({ table: true, from: '0.05 MeV', to: '100 MeV', points: '3' });
    expect(t.rows.map((r: { stopping_regime: string }) => r.stopping_regime)).toEqual(['fit', 'join', 'bethe']);
  });
  it('--material-file reads a mixture and a compound (Bragg additivity, marked approximate)', () => {
    const p10 = json({ materialFile: 'test/fixtures/material-files/p10.txt', energy: '5 MeV' });
    expect(p10.material).toBe('ar-ch4-90-10');
    expect(p10.density_g_cm3).toBe(1.56e-3);
    const gas = runRange({ ...base, materialFile: 'test/fixtures/material-files/propane-gas.txt', energy: '100 MeV' });
    expect(gas.stdout).toMatch(/propane-gas \(ρ = 0.001879 g\/cm³, I = 47.1 eV, approximate material\)/);
  });
  it('a bad material file is one line naming file:line and the fix, exit 1', () => {
    const bad = spawnSync(process.execPath, ['kernel/bin/sagitta.js', 'range', '--material-file', 'test/fixtures/material-files/bad-fractions.txt', '--energy', '5 MeV'], { encoding: 'utf8' });
    expect(bad.status).toBe(1);
    expect(bad.stderr.trim().split('\n')).toHaveLength(1);
    expect(bad.stderr).toMatch(/bad-fractions\.txt:3: the mass fractions of the parts sum to 0\.9, not 1/);
    expect(() => runRange({ ...base, materialFile: 'no/such/file.txt', energy: '5 MeV' })).toThrow(SagittaError);
  });
});
