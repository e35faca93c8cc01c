/**
 * The layer rule (issue 18): imports point one way. src/ is the core and
 * knows nothing of server/; server/ uses src/ but never the CLI (src/cli/);
 * the CLI and the service are joined only by the program entry, bin/fieldgap.
 *
 * Imports are read with TypeScript's own pre-processor (static imports,
 * `export … from`, `import type`, and `import('…')` with a literal), not with
 * a hand-written pattern; a dynamic import with a computed specifier is
 * reported too, since it could hide a wrong-way import from this check.
 */
import { dirname, posix, relative, resolve, sep } from 'node:path';
import ts from 'typescript';

export interface SourceFile {
  /** Path relative to the project root, with "/" separators: "src/cli/main.ts". */
  path: string;
  text: string;
}

export interface WrongWayImport {
  from: string;
  specifier: string;
  rule: string;
}

interface LayerRule {
  /** The importing files this rule applies to (a folder prefix). */
  importer: string;
  /** The folder they must not import. */
  forbidden: string;
  rule: string;
}

export const LAYER_RULES: readonly LayerRule[] = [
  { importer: 'src/', forbidden: 'server/', rule: 'src/ must not import server/' },
  { importer: 'server/', forbidden: 'src/cli/', rule: 'server/ must not import src/cli/' },
  // The writers of every output: they take the core's results and know nothing of who shows them.
  { importer: 'src/report/', forbidden: 'src/cli/', rule: 'src/report/ must not import src/cli/' },
  { importer: 'src/report/', forbidden: 'src/library/', rule: 'src/report/ must not import src/library/' },
];

function toPosix(path: string): string {
  return path.split(sep).join(posix.sep);
}

/** The project-relative target of a relative specifier, or null for a package ("express", "node:fs"). */
export function importTarget(importer: string, specifier: string): string | null {
  if (!specifier.startsWith('.')) return null;
  const root = resolve('/project');
  return toPosix(relative(root, resolve(root, dirname(importer), specifier)));
}

function specifiersOf(text: string): string[] {
  const info = ts.preProcessFile(text, true, true);
  return info.importedFiles.map((f) => f.fileName);
}

/** `import(x)` whose argument is not a plain string literal. */
function hasComputedImport(text: string): boolean {
  const source = ts.createSourceFile('file.ts', text, ts.ScriptTarget.Latest, false);
  let found = false;
  const visit = (node: ts.Node): void => {
    if (found) return;
    if (ts.isCallExpression(node) && node.expression.kind === ts.SyntaxKind.ImportKeyword) {
      const arg = node.arguments[0];
      if (arg === undefined || !ts.isStringLiteralLike(arg)) found = true;
    }
    ts.forEachChild(node, visit);
  };
  visit(source);
  return found;
}

/** Every import in `files` that breaks a layer rule. */
export function wrongWayImports(files: readonly SourceFile[]): WrongWayImport[] {
  const found: WrongWayImport[] = [];
  for (const file of files) {
    const rules = LAYER_RULES.filter((r) => file.path.startsWith(r.importer));
    if (rules.length === 0) continue;
    for (const specifier of specifiersOf(file.text)) {
      const target = importTarget(file.path, specifier);
      if (target === null) continue;
      for (const rule of rules) {
        if (target === rule.forbidden.slice(0, -1) || target.startsWith(rule.forbidden)) found.push({ from: file.path, specifier, rule: rule.rule });
      }
    }
    if (hasComputedImport(file.text)) found.push({ from: file.path, specifier: '(computed)', rule: 'no import() with a computed specifier in src/ or server/' });
  }
  return found;
}
