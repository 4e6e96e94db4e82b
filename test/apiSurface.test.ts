/**
 * The public API as a list: every name lib/index.ts exports, with its kind and the room it comes
 * from, compared with test/api-surface.txt. A change to the surface is then a visible diff in
 * review (regenerate with SAGITTA_UPDATE_GOLDEN=1 after a deliberate change).
 */
import { describe, expect, it } from 'vitest';
import { join, relative, resolve } from 'node:path';
import ts from 'typescript';
import { expectGolden } from './expectGolden.js';

const root = resolve(import.meta.dirname, '..');

function surface(): string[] {
  const entry = join(root, 'lib', 'index.ts');
  const program = ts.createProgram([entry], { module: ts.ModuleKind.NodeNext, moduleResolution: ts.ModuleResolutionKind.NodeNext, target: ts.ScriptTarget.ES2022, strict: true, skipLibCheck: true, noEmit: true, types: ['node'] });
  const checker = program.getTypeChecker();
  const moduleSymbol = checker.getSymbolAtLocation(program.getSourceFile(entry)!)!;
  return checker.getExportsOfModule(moduleSymbol).map((exported) => {
    const target = exported.flags & ts.SymbolFlags.Alias ? checker.getAliasedSymbol(exported) : exported;
    const file = target.declarations?.[0]?.getSourceFile().fileName ?? '?';
    const room = relative(join(root, 'lib'), file).split('/').slice(0, -1).join('/') || 'core';
    return `${room}\t${exported.name}\t${target.flags & ts.SymbolFlags.Value ? 'value' : 'type'}`;
  }).sort();
}

describe('the public API (lib/index.ts)', () => {
  const names = surface();
  it('is the list in test/api-surface.txt', () => {
    expectGolden(join(root, 'test', 'api-surface.txt'), `# room\tname\tkind — ${names.length} names\n${names.join('\n')}\n`);
  });
  it('keeps plumbing out: catalogue factories, atomic writes, display sinks, scratch allocators', () => {
    const plain = new Set(names.map((line) => line.split('\t')[1]));
    for (const internal of ['msg', 'warn', 'writeFileAtomic', 'loadDanfo', 'escapeHtml', 'setDisplaySink', 'helixStep', 'newVertexScratch', 'preparePlaneHits']) expect(plain.has(internal), internal).toBe(false);
    for (const user of ['readHits', 'measureTracks', 'fitModel', 'fitHistogram', 'findV0s', 'knob', 'present', 'simulateChamber', 'csdaRange']) expect(plain.has(user), user).toBe(true);
  });
});
