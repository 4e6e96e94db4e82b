import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';

/** The house rules of DEVELOPERS.md, checked on the source text. */
const root = fileURLToPath(new URL('..', import.meta.url));

function tsFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = join(dir, name);
    return statSync(p).isDirectory() ? tsFiles(p) : name.endsWith('.ts') ? [p] : [];
  });
}

const libFiles = tsFiles(join(root, 'lib')).map((p) => ({ path: relative(root, p), text: readFileSync(p, 'utf8') }));
const kernelFiles = tsFiles(join(root, 'kernel')).map((p) => ({ path: relative(root, p), text: readFileSync(p, 'utf8') }));

describe('architecture', () => {
  it('lib/ never imports kernel/', () => {
    const offenders = libFiles.filter((f) => /from\s+['"][./]*kernel\//.test(f.text) || /import\(['"][./]*kernel\//.test(f.text));
    expect(offenders.map((f) => f.path)).toEqual([]);
  });
  it('lib/ uses no global random numbers (seeded streams only)', () => {
    expect(libFiles.filter((f) => /Math\.random\s*\(/.test(f.text)).map((f) => f.path)).toEqual([]);
  });
  it('lib/ touches no DOM and no network', () => {
    const pattern = /\b(document|window)\.[a-zA-Z]|\bfetch\s*\(|from\s+['"]node:(http|https|net|dgram)['"]/;
    expect(libFiles.filter((f) => pattern.test(f.text.replace(/\/\*[\s\S]*?\*\/|\/\/.*$/gm, ''))).map((f) => f.path)).toEqual([]);
  });
  it('lib/index.ts only re-exports', () => {
    const lines = readFileSync(join(root, 'lib/index.ts'), 'utf8').split('\n').filter((l) => l.trim() && !l.trim().startsWith('//'));
    expect(lines.filter((l) => !/^export (\{[^}]*\}|type \{[^}]*\}) from '/.test(l.trim()))).toEqual([]);
  });
  it('lib/simulate imports from lib/vertex only its dependency-free kinematics leaves', () => {
    const allowed = new Set(['twoBodyMomentum', 'fourVector', 'lorentzBoost']);
    const offenders = libFiles.filter((f) => f.path.startsWith('lib/simulate/')).flatMap((f) =>
      [...f.text.matchAll(/from\s+['"]\.\.\/vertex\/([\w]+)\.js['"]/g)].map((m) => m[1]).filter((name) => !allowed.has(name)).map((name) => `${f.path} → vertex/${name}`));
    expect(offenders).toEqual([]);
  });
  it('lib/simulate imports from lib/vertex only its dependency-free kinematics leaves', () => {
    const allowed = new Set(['twoBodyMomentum', 'fourVector', 'lorentzBoost']);
    const offenders = libFiles.filter((f) => f.path.startsWith('lib/simulate/')).flatMap((f) =>
      [...f.text.matchAll(/from\s+['"]\.\.\/vertex\/(\w+)\.js['"]/g)].map((m) => m[1]).filter((name) => !allowed.has(name)).map((name) => `${f.path} → vertex/${name}`));
    expect(offenders).toEqual([]);
    for (const name of allowed) {
      const leaf = libFiles.find((f) => f.path === `lib/vertex/${name}.ts`);
      expect(leaf, name).toBeDefined();
      expect(leaf!.text.match(/from\s+['"][^'"]+['"]/g) ?? []).toEqual((leaf!.text.match(/from\s+['"]\.\/(fourVector|twoBodyMomentum)\.js['"]/g) ?? []));
    }
  });
  it('nothing in the project reads the shared planning folder at run time', () => {
    const all = [...libFiles, ...tsFiles(join(root, 'kernel')).map((p) => ({ path: relative(root, p), text: readFileSync(p, 'utf8') }))];
    expect(all.filter((f) => f.text.includes('../shared')).map((f) => f.path)).toEqual([]);
  });
  it('index files name what they export: no export *', () => {
    const indexes = [...libFiles, ...kernelFiles].filter((f) => f.path.endsWith('index.ts') || f.path === 'lib/internal.ts');
    expect(indexes.filter((f) => /^export \*/m.test(f.text)).map((f) => f.path)).toEqual([]);
  });
  it('the kernel reaches the library only through lib/index.ts and lib/internal.ts', () => {
    const offenders = kernelFiles.flatMap((f) =>
      [...f.text.matchAll(/from\s+['"]((?:\.\.\/)+lib\/[^'"]+)['"]/g)].map((m) => m[1]).filter((spec) => !/\/lib\/(index|internal)\.js$/.test(spec)).map((spec) => `${f.path} → ${spec}`));
    expect(offenders).toEqual([]);
  });
  it('rooms import each other downhill, in the order the data flows (io → fit → track/matter → analysis → plot, table)', () => {
    // Which rooms each room may import (ARCHITECTURE: the rooms table). core = the files at lib/'s top.
    const allowed: Record<string, string[]> = {
      core: [], io: ['core'], matter: ['core'], analysis: ['core'], fit: ['core', 'io', 'matter', 'analysis'], find: ['core', 'io'],
      table: ['core', 'io', 'track', 'display'], display: ['core'],
      track: ['core', 'fit', 'io', 'matter', 'analysis', 'table'], vertex: ['core', 'fit', 'io', 'matter', 'track', 'analysis'], beam: ['core', 'analysis'],
      simulate: ['core', 'io', 'matter', 'vertex'], plot: ['core', 'analysis', 'io', 'track', 'display'],
      fitlab: ['core', 'analysis', 'find', 'fit', 'io', 'matter', 'plot', 'simulate', 'track', 'display', 'table'],
    };
    // lib/display.ts is the end of the flow (the display channel shows tables and figures), not core.
    const roomOf = (path: string) => (/^lib\/display\.[jt]s$/.test(path) ? 'display' : path.split('/').length > 2 ? path.split('/')[1] : 'core');
    const offenders = libFiles.filter((f) => f.path !== 'lib/index.ts' && f.path !== 'lib/internal.ts').flatMap((f) =>
      [...f.text.matchAll(/from\s+['"](\.[^'"]+)['"]/g)].map((m) => join(dirname(f.path), m[1])).filter((target) => {
        const from = roomOf(f.path), to = roomOf(target);
        return from !== to && !(allowed[from] ?? []).includes(to);
      }).map((target) => `${f.path} → ${target}`));
    expect(offenders).toEqual([]);
  });
});
