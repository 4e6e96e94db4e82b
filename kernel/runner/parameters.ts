import { msg } from '../../lib/errors.js';
import type { Cell, CodeCell, Notebook } from '../notebook/types.js';
import { DEFAULTS_TAG, INJECTED_TAG } from '../notebook/types.js';
import { joinSource, splitLines } from '../notebook/source.js';

const IDENTIFIER = /^[A-Za-z_$][A-Za-z0-9_$]*$/;

/**
 * Reads `--set name=value` arguments. The value is parsed as JSON when it is valid JSON
 * (numbers, true/false, null, quoted strings, arrays, objects), otherwise taken as a string.
 * @example parseSetArguments(['fieldT=1.5', 'run=07']) // { fieldT: 1.5, run: 7 }  ("07" is not JSON: { run: '07' })
 */
export function parseSetArguments(items: readonly string[]): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const item of items) {
    const eq = item.indexOf('=');
    const name = eq < 0 ? item : item.slice(0, eq);
    if (eq < 0 || !IDENTIFIER.test(name)) {
      throw msg.badArgument('--set', item, 'name=value with a TypeScript identifier as the name, e.g. --set fieldT=1.5');
    }
    const text = item.slice(eq + 1);
    let value: unknown = text;
    try {
      value = JSON.parse(text);
    } catch {
      value = text;
    }
    out[name] = value;
  }
  return out;
}

function tags(cell: Cell): string[] {
  const t = (cell.metadata as { tags?: unknown }).tags;
  return Array.isArray(t) ? t.filter((x): x is string => typeof x === 'string') : [];
}

/** The TypeScript source of the injected cell: one `const` per value (a later declaration replaces the default). */
export function injectedSource(values: Readonly<Record<string, unknown>>): string {
  const lines = ['// Values set for this run (sagitta run --set); they replace the defaults above.'];
  for (const [name, value] of Object.entries(values)) lines.push(`const ${name} = ${JSON.stringify(value)};`);
  return `${lines.join('\n')}\n`;
}

/**
 * Puts the `--set` values into the notebook: removes any injected cell left by an earlier run,
 * then inserts a new one right after the cell tagged `sagitta-knobs`. A notebook without such a
 * cell cannot take values (there are no defaults to replace): that is a bad call.
 * Returns a new notebook; the input is not changed.
 */
export function injectParameters(nb: Notebook, values: Readonly<Record<string, unknown>>, file: string): Notebook {
  const cells = nb.cells.filter((c) => !tags(c).includes(INJECTED_TAG));
  if (Object.keys(values).length === 0) return { ...nb, cells };
  const at = cells.findIndex((c) => c.cell_type === 'code' && tags(c).includes(DEFAULTS_TAG));
  if (at < 0) {
    throw msg.badNotebook(file, `--set was given, but no code cell is tagged "${DEFAULTS_TAG}"; add that tag to the cell that holds the defaults`);
  }
  const declared = declaredNames(joinSource(cells[at].source));
  if (declared !== undefined) {
    const unknown = Object.keys(values).filter((name) => !declared.includes(name));
    if (unknown.length > 0) {
      throw msg.badNotebook(file, `--set ${unknown.join(', ')}: the cell tagged "${DEFAULTS_TAG}" declares no such name (it declares ${declared.join(', ') || 'nothing'}); check the spelling`);
    }
  }
  const defaultsId = cells[at].id ?? 'knobs';
  const injected: CodeCell = {
    id: `${defaultsId}-set`.slice(0, 64),
    cell_type: 'code',
    metadata: { tags: [INJECTED_TAG], sagitta: { injected: true } },
    source: splitLines(injectedSource(values)),
    outputs: [],
    execution_count: null,
  };
  return { ...nb, cells: [...cells.slice(0, at + 1), injected, ...cells.slice(at + 1)] };
}

/**
 * Names declared at the top level of a knobs cell (`const|let|var name = …`, several per
 * statement allowed), or undefined when the cell uses a form this reader does not follow
 * (destructuring), in which case --set names are not checked.
 */
export function declaredNames(source: string): string[] | undefined {
  const names: string[] = [];
  const code = source.replace(/\/\*[\s\S]*?\*\//g, '').replace(/\/\/.*$/gm, '');
  for (const m of code.matchAll(/(?:^|[;\n])\s*(?:export\s+)?(?:const|let|var)\s+([^;\n]*)/g)) {
    if (/^[{[]/.test(m[1].trim())) return undefined;
    for (const part of splitTopLevel(m[1])) {
      const name = /^\s*([A-Za-z_$][\w$]*)/.exec(part)?.[1];
      if (name) names.push(name);
    }
  }
  return names;
}

/** Splits a declaration list at commas that are not inside brackets or strings. */
function splitTopLevel(text: string): string[] {
  const parts: string[] = [];
  let depth = 0, quote = '', start = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (quote) { if (c === '\\') i++; else if (c === quote) quote = ''; continue; }
    if (c === '"' || c === "'" || c === '`') quote = c;
    else if ('([{'.includes(c)) depth++;
    else if (')]}'.includes(c)) depth--;
    else if (c === ',' && depth === 0) { parts.push(text.slice(start, i)); start = i + 1; }
  }
  parts.push(text.slice(start));
  return parts;
}
