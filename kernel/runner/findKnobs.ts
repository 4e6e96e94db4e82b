import { type SagittaError } from '../../lib/index.js';
import { knobKind, msg, readKnobValue } from '../../lib/internal.js';
import { tslabTs as ts } from '../session/compilerShim.js';

/** A `knob(name, default)` call found in a notebook's code. */
export interface DeclaredKnob {
  readonly name: string;
  /** The literal default, or undefined when the default is computed (checked only when the cell runs). */
  readonly defaultValue?: number | string | boolean | readonly (number | string | boolean)[];
  /** Index of the cell in the notebook. */
  readonly cell: number;
}

type Node = import('@tslab/typescript-for-tslab').Node;
type Expression = import('@tslab/typescript-for-tslab').Expression;

/**
 * Every `knob("name", default)` call in the given cells (also `sagitta.knob(…)`), read with the
 * TypeScript parser — nothing runs. The name must be a string literal; a default that is a
 * literal (number, string, true/false, or a list of those) lets a supplied value be checked now.
 */
export function findKnobs(cells: ReadonlyArray<{ index: number; code: string }>): DeclaredKnob[] {
  const found: DeclaredKnob[] = [];
  for (const { index, code } of cells) {
    if (!code.includes('knob')) continue;
    const file = ts.createSourceFile('cell.ts', code, ts.ScriptTarget.Latest, true, ts.ScriptKind.TS);
    const visit = (node: Node): void => {
      if (ts.isCallExpression(node) && isKnobCallee(node.expression) && node.arguments.length >= 1 && ts.isStringLiteralLike(node.arguments[0])) {
        const literal = node.arguments.length >= 2 ? literalValue(node.arguments[1]) : undefined;
        found.push(literal === undefined ? { name: node.arguments[0].text, cell: index } : { name: node.arguments[0].text, defaultValue: literal.value, cell: index });
      }
      ts.forEachChild(node, visit);
    };
    visit(file);
  }
  return found;
}

function isKnobCallee(e: Expression): boolean {
  return (ts.isIdentifier(e) && e.text === 'knob') || (ts.isPropertyAccessExpression(e) && e.name.text === 'knob');
}

function literalValue(e: Expression): { value: number | string | boolean | (number | string | boolean)[] } | undefined {
  if (ts.isStringLiteralLike(e)) return { value: e.text };
  if (ts.isNumericLiteral(e)) return { value: Number(e.text) };
  if (ts.isPrefixUnaryExpression(e) && e.operator === ts.SyntaxKind.MinusToken && ts.isNumericLiteral(e.operand)) return { value: -Number(e.operand.text) };
  if (e.kind === ts.SyntaxKind.TrueKeyword) return { value: true };
  if (e.kind === ts.SyntaxKind.FalseKeyword) return { value: false };
  if (ts.isAsExpression(e) || ts.isParenthesizedExpression(e)) return literalValue(e.expression);
  if (ts.isArrayLiteralExpression(e)) {
    const items = e.elements.map((x) => literalValue(x));
    if (items.some((x) => x === undefined || Array.isArray(x.value))) return undefined;
    return { value: items.map((x) => x!.value as number | string | boolean) };
  }
  return undefined;
}

/**
 * Checks supplied values against the knobs a notebook declares: every name must be declared, and
 * each value must read as its knob's kind and unit. Returns one message per problem (empty: fine).
 */
export function checkSuppliedKnobs(declared: readonly DeclaredKnob[], supplied: ReadonlyMap<string, string>): string[] {
  const problems: string[] = [];
  const names = [...new Set(declared.map((k) => k.name))];
  for (const [name, text] of supplied) {
    const knob = declared.find((k) => k.name === name);
    if (!knob) {
      problems.push(msg.badKnob(name, `--set names a knob the notebook does not declare (it declares ${names.join(', ') || 'none'}); declare it with knob(${JSON.stringify(name)}, default) or check the spelling`).message);
      continue;
    }
    if (knob.defaultValue === undefined) continue;
    try {
      knobKind(name, knob.defaultValue);
      readKnobValue(name, knob.defaultValue, text);
    } catch (err) {
      problems.push((err as SagittaError).message);
    }
  }
  return problems;
}
