// The engine is pure TypeScript: nothing from the DOM, React, Electron, React Flow, zustand or
// Node built-ins. Every file under engine/ is parsed with the TypeScript compiler (so comments
// and strings such as "the results document" cannot trip the check) and its imports, requires
// and references to the `window`, `document` and `process` globals are reported.

import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const ENGINE = join(ROOT, 'engine');

const FORBIDDEN_EXACT = new Set(['react', 'react-dom', 'electron', 'zustand', 'fs', 'path', 'child_process', 'os']);

function forbiddenModule(spec: string): boolean {
  if (spec.startsWith('node:')) return true;
  if (spec.startsWith('@xyflow/')) return true;
  const head = spec.split('/')[0] ?? spec;
  return FORBIDDEN_EXACT.has(head);
}

const GLOBALS = new Set(['window', 'document']);

function isDeclarationName(node: ts.Identifier): boolean {
  const p = node.parent;
  return (
    (ts.isPropertyAccessExpression(p) && p.name === node) ||
    (ts.isQualifiedName(p) && p.right === node) ||
    ((ts.isPropertyAssignment(p) ||
      ts.isPropertySignature(p) ||
      ts.isPropertyDeclaration(p) ||
      ts.isMethodDeclaration(p) ||
      ts.isMethodSignature(p) ||
      ts.isVariableDeclaration(p) ||
      ts.isParameter(p) ||
      ts.isBindingElement(p) ||
      ts.isFunctionDeclaration(p) ||
      ts.isEnumMember(p)) &&
      p.name === node)
  );
}

/** Every boundary violation in one source text, as `line: what`. */
function violations(fileName: string, text: string): string[] {
  const source = ts.createSourceFile(fileName, text, ts.ScriptTarget.Latest, true, ts.ScriptKind.TSX);
  const found: string[] = [];
  const at = (node: ts.Node, what: string) => {
    const { line } = source.getLineAndCharacterOfPosition(node.getStart(source));
    found.push(`${line + 1}: ${what}`);
  };
  const visit = (node: ts.Node): void => {
    if ((ts.isImportDeclaration(node) || ts.isExportDeclaration(node)) && node.moduleSpecifier) {
      const spec = ts.isStringLiteral(node.moduleSpecifier) ? node.moduleSpecifier.text : '';
      if (forbiddenModule(spec)) at(node, `imports ${spec}`);
    }
    if (ts.isImportEqualsDeclaration(node) && ts.isExternalModuleReference(node.moduleReference)) {
      const e = node.moduleReference.expression;
      if (ts.isStringLiteral(e) && forbiddenModule(e.text)) at(node, `imports ${e.text}`);
    }
    if (ts.isCallExpression(node)) {
      const callee = node.expression;
      const isImport = callee.kind === ts.SyntaxKind.ImportKeyword;
      const isRequire = ts.isIdentifier(callee) && callee.text === 'require';
      const arg = node.arguments[0];
      if ((isImport || isRequire) && arg && ts.isStringLiteralLike(arg) && forbiddenModule(arg.text)) {
        at(node, `${isImport ? 'import()' : 'require'} of ${arg.text}`);
      }
    }
    if (ts.isImportTypeNode(node)) {
      const lit = ts.isLiteralTypeNode(node.argument) ? node.argument.literal : undefined;
      if (lit && ts.isStringLiteral(lit) && forbiddenModule(lit.text)) at(node, `import type of ${lit.text}`);
    }
    if (ts.isIdentifier(node) && !isDeclarationName(node)) {
      if (GLOBALS.has(node.text)) at(node, `uses the ${node.text} global`);
      if (node.text === 'process' && ts.isPropertyAccessExpression(node.parent) && node.parent.expression === node) {
        at(node, 'uses process.');
      }
    }
    if (ts.isPropertyAccessExpression(node) && ts.isIdentifier(node.expression) && node.expression.text === 'globalThis') {
      const name = node.name.text;
      if (GLOBALS.has(name) || name === 'process') at(node, `uses globalThis.${name}`);
    }
    ts.forEachChild(node, visit);
  };
  visit(source);
  return found;
}

function filesUnder(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = join(dir, name);
    return statSync(full).isDirectory() ? filesUnder(full) : [full];
  });
}

describe('the checker itself', () => {
  it('catches each kind of forbidden import and global', () => {
    const bad = [
      "import React from 'react';",
      "import { createRoot } from 'react-dom/client';",
      "import { ipcRenderer } from 'electron';",
      "import { ReactFlow } from '@xyflow/react';",
      "import { create } from 'zustand';",
      "import { readFileSync } from 'node:fs';",
      "import * as fs from 'fs';",
      "import { readFile } from 'fs/promises';",
      "import { join } from 'path';",
      "import { spawn } from 'child_process';",
      "import os from 'os';",
      "export { x } from 'react';",
      "import 'electron';",
      "const m = await import('node:path');",
      "const f = require('fs');",
      "import fs = require('fs');",
      "type T = import('react').FC;",
      'const w = window.innerWidth;',
      'document.title = "x";',
      'const e = process.env.HOME;',
      'const g = globalThis.document;',
      'if (typeof window !== "undefined") {}',
    ];
    for (const line of bad) expect(violations('sample.ts', line), line).not.toEqual([]);
  });

  it('leaves comments, strings, property names and allowed imports alone', () => {
    const good = [
      '// the results document, shown in a window of the app; process.env is not read',
      "const s = 'window document process.env';",
      'const r = { document: 1, window: 2 };',
      'const t = results.document + view.window;',
      'interface A { document: string; process(): void }',
      "import { analyse } from './analysis/analyse.js';",
      "import type { Job } from '../model/types.js';",
      'const processed = 1; const processing = processed + 1;',
      'const x = `the ${"results"} document`;',
    ];
    for (const line of good) expect(violations('sample.ts', line), line).toEqual([]);
  });
});

describe('engine/ boundary', () => {
  const files = filesUnder(ENGINE).filter((f) => /\.(ts|tsx|mts|cts|js|mjs|cjs|jsx)$/.test(f));

  it('has source files to check', () => {
    expect(files.length).toBeGreaterThan(5);
    expect(files.some((f) => f.endsWith(join('engine', 'index.ts')))).toBe(true);
  });

  it('no file imports the DOM, React, Electron, React Flow, zustand or Node built-ins', () => {
    const report = files.flatMap((f) => violations(f, readFileSync(f, 'utf8')).map((v) => `${relative(ROOT, f)}:${v}`));
    expect(report).toEqual([]);
  });
});
