/**
 * Kernelspec install / remove / list with no Python. Folder layout: the notebook ecosystem's
 * data directories (common practice, documented with Jupyter's "data files" and kernelspec
 * pages): per-user Linux ~/.local/share/jupyter/kernels, macOS ~/Library/Jupyter/kernels, Windows
 * %APPDATA%\jupyter\kernels; JUPYTER_DATA_DIR replaces the user data folder; JUPYTER_PATH folders
 * are searched first. PNG structure: PNG specification (W3C, 2nd edition, 2003).
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { inflateSync } from 'node:zlib';
import { afterAll, describe, expect, it } from 'vitest';
import { defaultInterruptMode, installKernelspec, kernelJson, listKernelspecs, removeKernelspec } from '../../kernel/kernelspec/kernelspec.js';
import { kernelsDirFor, kernelSearchPath, userDataDir, type PlatformEnv } from '../../kernel/kernelspec/paths.js';
import { SagittaError } from '../../lib/errors.js';

const root = path.resolve(__dirname, '../..');
const scratch = mkdtempSync(path.join(tmpdir(), 'sagitta-kspec-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

const linux: PlatformEnv = { platform: 'linux', env: {}, home: '/home/ada' };
const mac: PlatformEnv = { platform: 'darwin', env: {}, home: '/Users/ada' };
const windows: PlatformEnv = { platform: 'win32', env: { APPDATA: 'C:\\Users\\ada\\AppData\\Roaming', PROGRAMDATA: 'C:\\ProgramData' }, home: 'C:\\Users\\ada' };

describe('standard kernel folders per OS', () => {
  it('user scope: Linux, macOS and Windows data folders', () => {
    expect(kernelsDirFor('user', linux)).toBe('/home/ada/.local/share/jupyter/kernels');
    expect(kernelsDirFor('user', mac)).toBe('/Users/ada/Library/Jupyter/kernels');
    expect(kernelsDirFor('user', windows)).toBe('C:\\Users\\ada\\AppData\\Roaming\\jupyter\\kernels');
  });
  it('XDG_DATA_HOME and JUPYTER_DATA_DIR move the user folder', () => {
    expect(userDataDir({ ...linux, env: { XDG_DATA_HOME: '/data/ada' } })).toBe('/data/ada/jupyter');
    expect(userDataDir({ ...mac, env: { JUPYTER_DATA_DIR: '/tmp/jd' } })).toBe('/tmp/jd');
  });
  it('system scope: /usr/local/share on Unix, %PROGRAMDATA% on Windows', () => {
    expect(kernelsDirFor('system', linux)).toBe('/usr/local/share/jupyter/kernels');
    expect(kernelsDirFor('system', windows)).toBe('C:\\ProgramData\\jupyter\\kernels');
  });
  it('search order: JUPYTER_PATH entries, then the user folder, then system folders', () => {
    const pe = { ...linux, env: { JUPYTER_PATH: '/opt/a:/opt/b', JUPYTER_DATA_DIR: '/tmp/jd' } };
    expect(kernelSearchPath(pe)).toEqual(['/opt/a/kernels', '/opt/b/kernels', '/tmp/jd/kernels', '/usr/local/share/jupyter/kernels', '/usr/share/jupyter/kernels']);
  });
});

describe('installKernelspec / listKernelspecs / removeKernelspec', () => {
  it('writes kernel.json (argv with {connection_file}, language typescript, interrupt mode) and three logos', () => {
    const dir = installKernelspec({ dir: path.join(scratch, 'k1'), id: 'sagitta-a' });
    const spec = JSON.parse(readFileSync(path.join(dir, 'kernel.json'), 'utf8'));
    expect(spec).toEqual(kernelJson());
    expect(spec.argv[0]).toBe(process.execPath);
    expect(spec.argv[1]).toBe(path.join(root, 'kernel/bin/sagitta-kernel.js'));
    expect(spec.argv[2]).toBe('{connection_file}');
    expect(spec.language).toBe('typescript');
    expect(spec.interrupt_mode).toBe('signal');
    for (const f of ['logo-32x32.png', 'logo-64x64.png', 'logo-svg.svg']) expect(existsSync(path.join(dir, f))).toBe(true);
    expect(readFileSync(path.join(dir, 'logo-svg.svg'), 'utf8')).toMatch(/^<svg xmlns="http:\/\/www.w3.org\/2000\/svg"/);
  });

  it('logo PNGs are well-formed: signature, IHDR size, CRC of every chunk, inflatable data', () => {
    const png = readFileSync(path.join(scratch, 'k1', 'sagitta-a', 'logo-64x64.png'));
    expect([...png.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    expect(png.readUInt32BE(16)).toBe(64);
    expect(png.readUInt32BE(20)).toBe(64);
    let at = 8;
    const idat: Buffer[] = [];
    while (at < png.length) {
      const len = png.readUInt32BE(at);
      const type = png.toString('latin1', at + 4, at + 8);
      expect(png.readUInt32BE(at + 8 + len)).toBe(crc32(png.subarray(at + 4, at + 8 + len)));
      if (type === 'IDAT') idat.push(png.subarray(at + 8, at + 8 + len));
      at += 12 + len;
    }
    expect(inflateSync(Buffer.concat(idat)).length).toBe(64 * (1 + 64 * 4));
  });

  it('--interrupt message writes the message interrupt mode (the default on Windows)', () => {
    const dir = installKernelspec({ dir: path.join(scratch, 'k2'), id: 'sagitta-msg', interruptMode: 'message' });
    expect(JSON.parse(readFileSync(path.join(dir, 'kernel.json'), 'utf8')).interrupt_mode).toBe('message');
    expect(defaultInterruptMode('win32')).toBe('message');
    expect(defaultInterruptMode('linux')).toBe('signal');
  });

  it('lists through JUPYTER_PATH and JUPYTER_DATA_DIR; the first folder with an id wins', () => {
    const first = path.join(scratch, 'path1');
    const data = path.join(scratch, 'data');
    installKernelspec({ dir: path.join(first, 'kernels'), id: 'shared', displayName: 'from JUPYTER_PATH' });
    installKernelspec({ dir: path.join(data, 'kernels'), id: 'shared', displayName: 'from data dir' });
    installKernelspec({ dir: path.join(data, 'kernels'), id: 'sagitta-b' });
    const other = path.join(data, 'kernels', 'other-lang');
    mkdirSync(other, { recursive: true });
    writeFileSync(path.join(other, 'kernel.json'), JSON.stringify({ argv: ['other-kernel', '{connection_file}'], display_name: 'Other', language: 'other' }));
    const pe: PlatformEnv = { platform: 'linux', env: { JUPYTER_PATH: first, JUPYTER_DATA_DIR: data }, home: scratch };
    const kernels = listKernelspecs(pe);
    const byId = Object.fromEntries(kernels.map((k) => [k.id, k]));
    expect(byId.shared.displayName).toBe('from JUPYTER_PATH');
    expect(byId['sagitta-b'].sagitta).toBe(true);
    expect(byId['other-lang'].sagitta).toBe(false);
  });

  it('remove deletes a Sagitta kernel, refuses another language\'s kernel and unknown ids', () => {
    const kernels = path.join(scratch, 'data', 'kernels');
    expect(removeKernelspec({ dir: kernels, id: 'sagitta-b' })).toBe(path.join(kernels, 'sagitta-b'));
    expect(existsSync(path.join(kernels, 'sagitta-b'))).toBe(false);
    expect(() => removeKernelspec({ dir: kernels, id: 'other-lang' })).toThrow(SagittaError);
    expect(existsSync(path.join(kernels, 'other-lang', 'kernel.json'))).toBe(true);
    expect(() => removeKernelspec({ dir: kernels, id: 'nothing-here' })).toThrow(/installed kernel/);
    expect(() => installKernelspec({ dir: kernels, id: '../escape' })).toThrow(SagittaError);
  });
});

describe('installKernelspec into a folder the user may not write', () => {
  // Root may write anywhere, and CI runs as root: there the command runs as the unprivileged
  // account 'nobody' (uid/gid 65534, present on Debian) through util-linux setpriv, so the
  // permission check runs everywhere instead of being skipped.
  it('says so and how to fix it instead of failing with a raw system error', async () => {
    const { chmodSync } = await import('node:fs');
    const parent = mkdtempSync(path.join(tmpdir(), 'sagitta-kspec-locked-'));
    chmodSync(parent, 0o755);
    const locked = path.join(parent, 'locked');
    mkdirSync(locked);
    chmodSync(locked, 0o555);
    try {
      if (process.getuid?.() !== 0) {
        expect(() => installKernelspec({ dir: path.join(locked, 'kernels') })).toThrow(/cannot write here \(permission denied\)/);
        return;
      }
      const setpriv = ['/usr/bin/setpriv', '/bin/setpriv'].find((p) => existsSync(p));
      if (!setpriv) throw new Error('running as root without util-linux setpriv: cannot drop to an unprivileged user for this test (apt-get install util-linux)');
      const r = spawnSync(setpriv, ['--reuid=65534', '--regid=65534', '--clear-groups', process.execPath, path.join(root, 'kernel/bin/sagitta.js'), 'kernel', 'install', '--dir', path.join(locked, 'kernels')], { cwd: parent, env: { ...process.env, HOME: parent }, encoding: 'utf8', timeout: 60_000 });
      expect(r.stderr).toMatch(/cannot write here \(permission denied\)/);
      expect(r.stderr).toContain('--dir');
      expect(r.stderr).not.toMatch(/EACCES|    at /);
      expect(r.status).not.toBe(0);
      expect(existsSync(path.join(locked, 'kernels'))).toBe(false);
    } finally {
      chmodSync(locked, 0o700);
      rmSync(parent, { recursive: true, force: true });
    }
  }, 60_000);
});

describe('installKernelspec under /sys (not writable, even for root)', () => {
  it.skipIf(process.platform !== 'linux' || !existsSync('/sys/kernel'))('reports the folder and a fix', () => {
    expect(() => installKernelspec({ dir: '/sys/sagitta-test/kernels' })).toThrow(/^\/sys\/sagitta-test\/kernels: cannot write here .*--dir/);
  });
});

describe('sagitta kernel (command line)', () => {
  const cli = (args: string[], env: Record<string, string>) =>
    execFileSync(process.execPath, [path.join(root, 'kernel/bin/sagitta.js'), 'kernel', ...args], { cwd: root, env: { ...process.env, ...env }, encoding: 'utf8' });

  it('install (user scope under JUPYTER_DATA_DIR), list, remove', () => {
    const data = path.join(scratch, 'cli-data');
    const env = { JUPYTER_DATA_DIR: data, JUPYTER_PATH: '' };
    expect(cli(['install', '--id', 'sagitta-cli', '--label', 'Sagitta CLI test'], env)).toContain(path.join(data, 'kernels', 'sagitta-cli'));
    const listed = JSON.parse(cli(['list', '--json'], env)) as Array<{ id: string; displayName: string }>;
    expect(listed.find((k) => k.id === 'sagitta-cli')?.displayName).toBe('Sagitta CLI test');
    cli(['remove', '--id', 'sagitta-cli'], env);
    expect(existsSync(path.join(data, 'kernels', 'sagitta-cli'))).toBe(false);
  }, 60_000);
});

function crc32(bytes: Uint8Array): number {
  let c = ~0;
  for (const b of bytes) {
    c ^= b;
    for (let k = 0; k < 8; k++) c = c & 1 ? (c >>> 1) ^ 0xedb88320 : c >>> 1;
  }
  return ~c >>> 0;
}
