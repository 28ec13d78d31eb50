/** Test helpers for the service: open an example, apply edits. */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { Range } from '../sheet/types.js';
import { createSheetService } from './sheetService.js';
import type { ServiceSettings, TextEdit } from './types.js';

export const example = (name: string): string =>
  readFileSync(fileURLToPath(new URL(`../../../examples/${name}.rfsheet`, import.meta.url)), 'utf8');

/** A frozen fixture of ../sheet/fixtures/ (tests that count declarations use it, not the growing demo). */
export const fixture = (name: 'two-layer-node'): string =>
  readFileSync(fileURLToPath(new URL(`../sheet/fixtures/${name}.rfsheet`, import.meta.url)), 'utf8');

export function open(text: string, settings: Partial<ServiceSettings> = {}) {
  const service = createSheetService();
  return { service, doc: service.evaluate('file:///t.rfsheet', 1, text, settings) };
}

/** Applies non-overlapping single-line edits (as LSP clients do) and returns the new text. */
export function applyEdits(text: string, edits: TextEdit[]): string {
  const lines = text.split('\n');
  const sorted = [...edits].sort((a, b) => b.range.start.line - a.range.start.line || b.range.start.character - a.range.start.character);
  for (const e of sorted) {
    const line = lines[e.range.start.line]!;
    lines[e.range.start.line] = line.slice(0, e.range.start.character) + e.newText + line.slice(e.range.end.character);
  }
  return lines.join('\n');
}

export const lineRange = (line: number): Range => ({ start: { line, character: 0 }, end: { line, character: 0 } });

/** 0-based line index of the first line containing `needle`. */
export const lineOf = (text: string, needle: string): number => text.split('\n').findIndex((l) => l.includes(needle));
