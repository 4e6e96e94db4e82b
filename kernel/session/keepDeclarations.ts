import { tslabTs as ts } from './compilerShim.js';

export interface KeepOptions {
  /** Keep the value declaration (variable, function, class, enum, import binding) named so? */
  readonly keep: (name: string) => boolean;
  /** Keep type-only statements (interfaces, type aliases, declare module …) too. */
  readonly types: boolean;
}

/**
 * The declarations text the compiler carries from cell to cell ("declare const fieldT: number;",
 * "import { readHits } from 'sagitta-tracks';", …) with some value declarations left out. Used after a
 * cell stopped part-way: what it declared before the throw stays declared for later cells, what
 * it never reached is dropped (and an earlier cell's declaration of the same name comes back).
 * @example keepDeclarations('declare const a: number;\ndeclare let b: string;', { keep: (n) => n === 'a', types: true }) // 'declare const a: number;\n'
 */
export function keepDeclarations(text: string, options: KeepOptions): string {
  const file = ts.createSourceFile('decls.d.ts', text, ts.ScriptTarget.Latest, true, ts.ScriptKind.TS);
  const printer = ts.createPrinter({ newLine: ts.NewLineKind.LineFeed });
  const print = (node: import('@tslab/typescript-for-tslab').Node) => printer.printNode(ts.EmitHint.Unspecified, node, file);
  const out: string[] = [];
  for (const st of file.statements) {
    if (ts.isVariableStatement(st)) {
      const all = st.declarationList.declarations;
      const kept = all.filter((d) => ts.isIdentifier(d.name) && options.keep(d.name.text));
      if (kept.length === all.length) out.push(st.getText(file));
      else if (kept.length > 0) out.push(print(ts.factory.updateVariableStatement(st, st.modifiers, ts.factory.updateVariableDeclarationList(st.declarationList, kept))));
    } else if (ts.isImportDeclaration(st)) {
      const kept = keptImport(st, options.keep);
      if (kept === st) out.push(st.getText(file));
      else if (kept) out.push(print(kept));
    } else if (ts.isFunctionDeclaration(st) || ts.isClassDeclaration(st) || ts.isEnumDeclaration(st)) {
      if (st.name && options.keep(st.name.text)) out.push(st.getText(file));
    } else if (options.types) {
      out.push(st.getText(file));
    }
  }
  return out.length === 0 ? '' : `${out.join('\n')}\n`;
}

type ImportDeclaration = import('@tslab/typescript-for-tslab').ImportDeclaration;

/** The import with only the bindings `keep` accepts: the same node, a narrowed one, or undefined. */
function keptImport(st: ImportDeclaration, keep: (name: string) => boolean): ImportDeclaration | undefined {
  const clause = st.importClause;
  if (!clause) return undefined;
  const name = clause.name && keep(clause.name.text) ? clause.name : undefined;
  let bindings = clause.namedBindings;
  if (bindings && ts.isNamespaceImport(bindings) && !keep(bindings.name.text)) bindings = undefined;
  if (bindings && ts.isNamedImports(bindings)) {
    const elements = bindings.elements.filter((e) => keep(e.name.text));
    bindings = elements.length === 0 ? undefined : elements.length === bindings.elements.length ? bindings : ts.factory.updateNamedImports(bindings, elements);
  }
  if (!name && !bindings) return undefined;
  if (name === clause.name && bindings === clause.namedBindings) return st;
  return ts.factory.updateImportDeclaration(st, st.modifiers, ts.factory.updateImportClause(clause, clause.isTypeOnly, name, bindings), st.moduleSpecifier, st.assertClause);
}
