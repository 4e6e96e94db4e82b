import { tslabTs } from './moduleRoot.js';

/**
 * Rewrites shorthand properties `{ a }` as `{ a: a }` before a cell is compiled.
 *
 * tslab's converter renames the variables of earlier cells so they live across cells, but it
 * does not rename a name used as a shorthand property, so `({ a })` after `const a = 1` in an
 * earlier cell fails with "a is not defined". The long form is the same JavaScript and is
 * renamed correctly. Destructuring patterns (`const { a } = o`) are binding elements, not
 * shorthand properties, and are left alone; `({ a } = o)` and `{ a = 1 }` stay equivalent.
 * Only columns after the insertion move on that line (diagnostics keep their line numbers).
 */
export function expandShorthandProperties(code: string): string {
  if (!code.includes('{')) return code;
  const ts = tslabTs;
  const file = ts.createSourceFile('cell.ts', code, ts.ScriptTarget.Latest, true, ts.ScriptKind.TS);
  const inserts: { at: number; text: string }[] = [];
  const visit = (node: import('@tslab/typescript-for-tslab').Node): void => {
    if (ts.isShorthandPropertyAssignment(node)) inserts.push({ at: node.name.end, text: `: ${node.name.text}` });
    ts.forEachChild(node, visit);
  };
  visit(file);
  if (inserts.length === 0) return code;
  let out = code;
  for (const { at, text } of inserts.sort((p, q) => q.at - p.at)) out = out.slice(0, at) + text + out.slice(at);
  return out;
}
