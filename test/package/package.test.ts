/**
 * The package as a user gets it: `npm pack` (which builds dist/ through `prepack`), the tarball
 * installed into an empty folder, then the command through `npx sagitta fit` and the library from
 * plain Node — no TypeScript loader. The install is offline, from the npm cache the checkout's
 * own `npm ci` filled, with a lockfile derived from ours (see consumerLockfile.ts).
 */
import { describe, expect, it } from 'vitest';
import { execFileSync, spawnSync } from 'node:child_process';
import { cpSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { consumerLockfile, type Lockfile } from './consumerLockfile.js';

const repo = resolve(import.meta.dirname, '../..');
const ours = JSON.parse(readFileSync(join(repo, 'package.json'), 'utf8')) as { name: string; version: string; overrides: unknown; allowScripts: unknown };
const npm = (args: string[], cwd: string) => execFileSync('npm', args, { cwd, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'], env: { ...process.env, npm_config_update_notifier: 'false' } });

describe('the installable package', () => {
  const work = mkdtempSync(join(tmpdir(), 'sagitta-package-'));
  const app = join(work, 'app');
  let tarball = '';

  it('npm pack builds dist/ and packs the build, the notebooks and the README — no TypeScript sources', () => {
    // Packed from a copy, so the checkout gets no dist/ and no tarball as a side effect.
    const src = join(work, 'src');
    mkdirSync(src);
    for (const item of ['lib', 'kernel', 'notebooks', 'package.json', 'package-lock.json', 'README.md', 'tsconfig.json', 'tsconfig.build.json']) {
      cpSync(join(repo, item), join(src, item), { recursive: true });
    }
    symlinkSync(join(repo, 'node_modules'), join(src, 'node_modules'), 'dir');
    const out = npm(['pack', '--json', '--pack-destination', work], src);
    const packed = JSON.parse(out.slice(out.indexOf('['))) as { filename: string; files: { path: string }[] }[];
    tarball = join(work, packed[0].filename);
    const files = packed[0].files.map((f) => f.path);
    expect(files).toContain('dist/lib/index.js');
    expect(files).toContain('dist/lib/index.d.ts');
    expect(files).toContain('dist/kernel/entry/sagitta.js');
    expect(files.some((f) => f.startsWith('notebooks/') && f.endsWith('.ipynb'))).toBe(true);
    expect(files.filter((f) => f.endsWith('.ts') && !f.endsWith('.d.ts') && !f.startsWith('notebooks/'))).toEqual([]);
    expect(files.filter((f) => f.startsWith('test/'))).toEqual([]);
  }, 300_000);

  it('installs into an empty folder offline; `npx sagitta fit` fits a hits file there', () => {
    mkdirSync(app);
    const spec = `file:../${tarball.split('/').pop()}`;
    writeFileSync(join(app, 'package.json'), JSON.stringify({ name: 'track-study', private: true, type: 'module', dependencies: { [ours.name]: spec }, overrides: ours.overrides, allowScripts: ours.allowScripts }, null, 2));
    const lock = consumerLockfile(JSON.parse(readFileSync(join(repo, 'package-lock.json'), 'utf8')) as Lockfile, 'track-study', spec);
    writeFileSync(join(app, 'package-lock.json'), JSON.stringify(lock, null, 2));
    npm(['ci', '--offline', '--no-audit', '--no-fund'], app);
    expect(readdirSync(join(app, 'node_modules', ours.name))).toContain('dist');
    // One track: R = 2 m at 1.5 T → pT = 0.3·1.5·2 = 0.899 GeV/c (common practice: pT = 0.3 B R).
    const lines = ['event,track,x[m],y[m],sigma[um]'];
    for (let i = 0; i < 25; i++) {
      const a = Math.PI / 2 - (0.5 * i) / 24;
      lines.push(`1,1,${2 * Math.cos(a)},${-2 + 2 * Math.sin(a)},150`);
    }
    writeFileSync(join(app, 'hits.csv'), lines.join('\n') + '\n');
    const run = spawnSync('npx', ['--offline', 'sagitta', 'fit', 'hits.csv', '--field', '1.5 T', '--out', 'tracks.csv'], { cwd: app, encoding: 'utf8' });
    expect(run.status, run.stderr).toBe(0);
    expect(run.stderr).toMatch(/^sagitta fit: hits\.csv: 25 hits on 1 tracks/);
    const [header, row] = readFileSync(join(app, 'tracks.csv'), 'utf8').trim().split('\n');
    const pt = Number(row.split(',')[header.split(',').indexOf('pt_GeV_c')]);
    expect(Math.abs(pt / (0.299792458 * 1.5 * 2) - 1)).toBeLessThan(1e-6);
  }, 300_000);

  it('imports from plain Node (no TypeScript loader) and measures the same track', () => {
    const script = `import { readHits, measureTracks, PROTON } from '${ours.name}';
const t = measureTracks(readHits('hits.csv'), { fieldT: 1.5 });
console.log(JSON.stringify({ pt: t.momentum.ptGeV[0], proton: PROTON.massMeV, entry: import.meta.resolve('${ours.name}'), loaders: process.execArgv.filter((a) => /^--(import|loader|require|experimental-loader)/.test(a)) }));`;
    const out = execFileSync(process.execPath, ['--input-type=module', '-e', script], { cwd: app, encoding: 'utf8', env: { ...process.env, NODE_OPTIONS: '' } });
    const r = JSON.parse(out) as { pt: number; proton: number; entry: string; loaders: string[] };
    expect(Math.abs(r.pt / (0.299792458 * 1.5 * 2) - 1)).toBeLessThan(1e-6);
    expect(r.proton).toBe(938.27208816); // CODATA 2018 proton mass 938.272 088 16(29) MeV (as the PDG RPP lists it)
    expect(r.entry).toMatch(/node_modules\/sagitta-tracks\/dist\/lib\/index\.js$/);
    expect(r.loaders).toEqual([]);
  }, 120_000);

  it('`npx sagitta demo` runs the bundled example notebook from the installed build and writes report.html there', () => {
    const run = spawnSync('npx', ['--offline', 'sagitta', 'demo'], { cwd: app, encoding: 'utf8' });
    expect(run.status, run.stderr).toBe(0);
    expect(run.stderr).toMatch(/ran (\d+) of \1 steps/); // every step of the demo notebook ran
    const html = readFileSync(join(app, 'report.html'), 'utf8');
    expect(html).toContain('Brindlemoor');
    expect(html).not.toMatch(/node_modules\/sagitta-tracks\/notebooks/); // the run used a copy, and paths are relative
  }, 300_000);
});
