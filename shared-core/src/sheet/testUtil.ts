/** Test helpers for the sheet evaluator (imported by tests only). */
import { readFileSync } from 'node:fs';
import { expect } from 'vitest';
import { evaluateSheet } from './evaluate.js';
import type { DiagnosticCode, SheetDiagnostic, SheetEntry, SheetOptions, SheetResult } from './types.js';

/** The lines of a sheet as the evaluator splits them. */
export const linesOf = (text: string): string[] => text.split(/\r\n|\r|\n/);

/** A diagnostic with the exact source slice it points at. */
export interface Located {
  code: DiagnosticCode;
  severity: SheetDiagnostic['severity'];
  line: number;
  start: number;
  end: number;
  slice: string;
  message: string;
  related: SheetDiagnostic['related'];
}

/** Every diagnostic of `result` with the text it covers (ranges never span lines in a sheet). */
export function located(text: string, result: SheetResult): Located[] {
  const lines = linesOf(text);
  return result.diagnostics.map((d) => {
    expect(d.range.start.line, 'a diagnostic stays on one line').toBe(d.range.end.line);
    const line = lines[d.range.start.line] ?? '';
    return {
      code: d.code, severity: d.severity, line: d.range.start.line,
      start: d.range.start.character, end: d.range.end.character,
      slice: line.slice(d.range.start.character, d.range.end.character),
      message: d.message, related: d.related,
    };
  });
}

/** Evaluates `text` cold and returns its only diagnostic (asserting there is exactly one). */
export function only(text: string, options?: SheetOptions): Located {
  const all = located(text, evaluateSheet(text, undefined, options));
  expect(all.map((d) => `${d.code}: ${d.message}`), text).toHaveLength(1);
  return all[0]!;
}

/** Evaluates `text` cold and returns the diagnostics with `code`. */
export function withCode(text: string, code: DiagnosticCode, options?: SheetOptions): Located[] {
  return located(text, evaluateSheet(text, undefined, options)).filter((d) => d.code === code);
}

/** The entry named `name` (asserting it exists). */
export function entry(result: SheetResult, name: string): SheetEntry {
  const e = result.entries.find((x) => x.name === name);
  if (!e) throw new Error(`no entry named ${name}`);
  return e;
}

/** A numeric result (asserting it is a number). */
export function num(result: SheetResult, name: string, key: string): number {
  const v = entry(result, name).results[key];
  if (typeof v !== 'number') throw new Error(`${name}.${key} is ${JSON.stringify(v)}, not a number`);
  return v;
}

/** What a cold and an incremental evaluation must agree on (the cache and stats may differ). */
export function observable(result: SheetResult): unknown {
  return {
    entries: result.entries,
    diagnostics: result.diagnostics,
    symbols: [...result.symbols.values()],
  };
}

/** An example sheet from the repository's `examples/` folder. */
export function example(name: 'sensor-node' | 'warnings-tour' | 'power-check'): string {
  return readFileSync(new URL(`../../../examples/${name}.rfsheet`, import.meta.url), 'utf8');
}

/**
 * A frozen test fixture from `shared-core/src/sheet/fixtures/` (the demo sheet may grow; tests that
 * count declarations or edit at fixed places use a fixture instead).
 */
export function fixture(name: 'two-layer-node'): string {
  return readFileSync(new URL(`./fixtures/${name}.rfsheet`, import.meta.url), 'utf8');
}

/** Asserts that every diagnostic range (and related range) lies inside `text`. */
export function expectRangesInside(text: string, result: SheetResult): void {
  const lines = linesOf(text);
  const inside = (r: SheetDiagnostic['range'], what: string) => {
    const line = lines[r.start.line];
    expect(line, `${what}: line ${r.start.line} exists`).toBeDefined();
    expect(r.end.line, what).toBe(r.start.line);
    expect(r.start.character, what).toBeGreaterThanOrEqual(0);
    expect(r.start.character, what).toBeLessThanOrEqual(r.end.character);
    expect(r.end.character, what).toBeLessThanOrEqual(line!.length);
  };
  for (const d of result.diagnostics) {
    inside(d.range, `${d.code} "${d.message}"`);
    for (const r of d.related ?? []) inside(r.range, `related of ${d.code}`);
  }
  for (const e of result.entries) {
    inside(e.range, `entry ${e.name}`);
    inside(e.nameRange, `name of ${e.name}`);
  }
}
