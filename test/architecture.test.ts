/**
 * Dependencies point one way: engine ← sheet language service ← server; the client depends on
 * nothing of ours. These checks read every import (static, dynamic, re-export, require) of the
 * TypeScript sources and fail on an import that points the wrong way.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const ROOT = fileURLToPath(new URL('..', import.meta.url));

interface Import {
  file: string;
  specifier: string;
  /** Repository-relative target for relative specifiers; the bare specifier otherwise. */
  target: string;
}

function sources(dir: string): string[] {
  let entries;
  try {
    entries = readdirSync(join(ROOT, dir), { withFileTypes: true });
  } catch {
    return [];
  }
  return entries.flatMap((e) => {
    const path = join(dir, e.name);
    if (e.isDirectory()) return e.name === 'node_modules' || e.name === 'dist' ? [] : sources(path);
    return /\.(ts|tsx|mts|cts)$/.test(e.name) ? [path] : [];
  });
}

const IMPORT = /\b(?:import|export)\s[^'"`;]*?\bfrom\s*['"]([^'"]+)['"]|\bimport\s*\(\s*['"]([^'"]+)['"]|\bimport\s+['"]([^'"]+)['"]|\brequire\s*\(\s*['"]([^'"]+)['"]/g;

function importsOf(dir: string): Import[] {
  return sources(dir).flatMap((file) =>
    [...readFileSync(join(ROOT, file), 'utf8').matchAll(IMPORT)].map((m) => {
      const specifier = (m[1] ?? m[2] ?? m[3] ?? m[4])!;
      const target = specifier.startsWith('.') ? relative(ROOT, resolve(ROOT, dirname(file), specifier)) : specifier;
      return { file, specifier, target };
    }),
  );
}

const show = (list: Import[]) => list.map((i) => `${i.file}: ${i.specifier}`);
const isVscode = (i: Import) => /^vscode/.test(i.target);
const under = (folder: string) => (i: Import) => i.target === folder || i.target.startsWith(`${folder}/`);

describe('architecture: one direction of dependency', () => {
  const core = importsOf('shared-core/src');
  const server = importsOf('server/src');

  it('finds the sources it checks', () => {
    expect(sources('shared-core/src').length).toBeGreaterThan(20);
    expect(sources('server/src').length).toBeGreaterThan(5);
    expect(core.length).toBeGreaterThan(50);
  });

  it('shared-core imports nothing from server/, client/ or any vscode package', () => {
    const outward = (i: Import) => under('server')(i) || under('client')(i) || isVscode(i) || /^@stubwright\/(server|client)/.test(i.target);
    expect(show(core.filter(outward))).toEqual([]);
  });

  it('the sheet language service never imports vscode-languageserver', () => {
    expect(show(importsOf('shared-core/src/service').filter((i) => i.target.startsWith('vscode-languageserver')))).toEqual([]);
  });

  it('the server imports nothing from client/, and reaches shared-core only through server/src/core.ts', () => {
    expect(show(server.filter(under('client')))).toEqual([]);
    const intoCore = (i: Import) => under('shared-core')(i) || i.target.startsWith('@stubwright/shared-core');
    expect(show(server.filter((i) => intoCore(i) && i.file !== join('server', 'src', 'core.ts')))).toEqual([]);
  });

  it('the client imports nothing from shared-core/ or server/ (it talks to the server over LSP only)', () => {
    expect(show(importsOf('client/src').filter((i) => under('shared-core')(i) || under('server')(i) || i.target.startsWith('@stubwright/')))).toEqual([]);
  });
});
