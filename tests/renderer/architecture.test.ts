// The renderer's layering (design.md §2, style.md habits 10 and 12): views
// render view-models and raise intents; numbers come only from core. These
// checks read the source with the TypeScript compiler's own parser.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';

const root = fileURLToPath(new URL('../..', import.meta.url));
const rendererDir = join(root, 'renderer');

function filesUnder(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return filesUnder(path);
    return /\.(ts|tsx)$/.test(name) ? [path] : [];
  });
}

const parse = (path: string) => ts.createSourceFile(path, readFileSync(path, 'utf8'), ts.ScriptTarget.Latest, true, path.endsWith('.tsx') ? ts.ScriptKind.TSX : ts.ScriptKind.TS);

function walk(node: ts.Node, visit: (node: ts.Node) => void): void {
  visit(node);
  node.forEachChild((child) => walk(child, visit));
}

const arithmeticOperators = new Set([
  ts.SyntaxKind.AsteriskToken,
  ts.SyntaxKind.SlashToken,
  ts.SyntaxKind.MinusToken,
  ts.SyntaxKind.PercentToken,
  ts.SyntaxKind.AsteriskAsteriskToken,
  ts.SyntaxKind.PlusToken,
  ts.SyntaxKind.AsteriskEqualsToken,
  ts.SyntaxKind.SlashEqualsToken,
  ts.SyntaxKind.MinusEqualsToken,
  ts.SyntaxKind.PlusEqualsToken,
]);

/**
 * Arithmetic a view may do: moving between table rows (`rowIndex + 1`,
 * `rows.length`), which is a position on screen, not a domain value.
 */
function isScreenPosition(node: ts.BinaryExpression): boolean {
  const isPositionName = (expression: ts.Expression) => /(^|\.)(rowIndex|index|length)$/.test(expression.getText());
  const isOne = (expression: ts.Expression) => ts.isNumericLiteral(expression) && expression.text === '1';
  return (
    (node.operatorToken.kind === ts.SyntaxKind.PlusToken || node.operatorToken.kind === ts.SyntaxKind.MinusToken) &&
    isPositionName(node.left) &&
    isOne(node.right)
  );
}

const isStringy = (expression: ts.Expression) => ts.isStringLiteral(expression) || ts.isTemplateExpression(expression) || ts.isNoSubstitutionTemplateLiteral(expression);

describe('renderer views hold no arithmetic', () => {
  const views = filesUnder(join(rendererDir, 'views'));

  it('finds the view files it checks', () => {
    expect(views.length).toBeGreaterThanOrEqual(10);
  });

  it.each(views.map((path) => [relative(root, path), path]))('%s: no arithmetic operator on values, no Math, no number parsing', (_name, path) => {
    const problems: string[] = [];
    walk(parse(path), (node) => {
      const where = () => `${relative(root, path)}:${node.getSourceFile().getLineAndCharacterOfPosition(node.getStart()).line + 1}: ${node.getText()}`;
      if (ts.isBinaryExpression(node) && arithmeticOperators.has(node.operatorToken.kind)) {
        if (isScreenPosition(node)) return;
        if (node.operatorToken.kind === ts.SyntaxKind.PlusToken && (isStringy(node.left) || isStringy(node.right))) return;
        problems.push(where());
      }
      if (ts.isPrefixUnaryExpression(node) && node.operator === ts.SyntaxKind.MinusToken && !ts.isNumericLiteral(node.operand)) problems.push(where());
      if (ts.isPropertyAccessExpression(node) && node.expression.getText() === 'Math') problems.push(where());
      if (ts.isCallExpression(node) && ['Number', 'parseFloat', 'parseInt'].includes(node.expression.getText())) problems.push(where());
      if (ts.isCallExpression(node) && /\.(toFixed|toPrecision|reduce)$/.test(node.expression.getText())) problems.push(where());
    });
    expect(problems).toEqual([]);
  });

  it('the check catches arithmetic on a value (a hand-made sample)', () => {
    const sample = ts.createSourceFile('sample.tsx', 'const shown = <td>{dose * weightKg}</td>;', ts.ScriptTarget.Latest, true, ts.ScriptKind.TSX);
    const found: string[] = [];
    walk(sample, (node) => {
      if (ts.isBinaryExpression(node) && arithmeticOperators.has(node.operatorToken.kind) && !isScreenPosition(node)) found.push(node.getText());
    });
    expect(found).toEqual(['dose * weightKg']);
  });
});

describe('renderer imports point toward core', () => {
  const files = filesUnder(rendererDir);
  const importsOf = (path: string): string[] => {
    const specifiers: string[] = [];
    walk(parse(path), (node) => {
      if ((ts.isImportDeclaration(node) || ts.isExportDeclaration(node)) && node.moduleSpecifier && ts.isStringLiteral(node.moduleSpecifier)) specifiers.push(node.moduleSpecifier.text);
    });
    return specifiers;
  };

  it.each(files.map((path) => [relative(root, path), path]))('%s imports neither app/ nor electron', (_name, path) => {
    const bad = importsOf(path).filter((specifier) => specifier === 'electron' || /(^|\/)app\//.test(specifier) || specifier.startsWith('node:') && !path.endsWith('vite.config.ts'));
    expect(bad).toEqual([]);
  });

  it('views compute nothing themselves: they reach core\'s computing areas only through view-models and hooks', () => {
    const computing = /\/core\/(ledger|iron|chelators|chemistry|patient|units|dosing|monitoring|formulas\/(?!derivation))/;
    const offenders = filesUnder(join(rendererDir, 'views')).flatMap((path) =>
      importsOf(path).filter((specifier) => computing.test(specifier)).map((specifier) => `${relative(root, path)} imports ${specifier}`),
    );
    expect(offenders).toEqual([]);
  });

  it('zustand, the state library, is used by the state module alone', () => {
    const users = files.filter((path) => importsOf(path).some((specifier) => specifier.startsWith('zustand'))).map((path) => relative(root, path));
    expect(users).toEqual(['renderer/state/store.ts']);
  });
});

describe('one table of words for choice ids', () => {
  it('no renderer module reads ids as words itself (core/words owns that table)', () => {
    const offenders = filesUnder(rendererDir).filter((path) => /\.replace\(\/-\/g,\s*' '\)/.test(readFileSync(path, 'utf8'))).map((path) => relative(root, path));
    expect(offenders).toEqual([]);
  });
});
