/** Finding what sits at a position: the declaration of a line, or a name (declaration or reference). */
import type { Position, Range, SheetEntry, SheetSymbol } from '../sheet/types.js';
import type { EvaluatedDocument } from './types.js';

export const contains = (r: Range, p: Position): boolean =>
  p.line >= r.start.line && p.line <= r.end.line &&
  (p.line !== r.start.line || p.character >= r.start.character) &&
  (p.line !== r.end.line || p.character <= r.end.character);

/** Index of the first item whose line is ≥ `line` in a list sorted by line (binary search). */
function firstAtOrAfter<T>(items: readonly T[], line: number, lineOf: (item: T) => number): number {
  let lo = 0;
  let hi = items.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (lineOf(items[mid]!) < line) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Index of the first entry on or after `line` (entries are sorted by line). */
export function firstEntryAtOrAfter(doc: EvaluatedDocument, line: number): number {
  return firstAtOrAfter(doc.result.entries, line, (e) => e.line);
}

/** The declaration on a line, if that line declares something (entries are sorted by line). */
export function entryOnLine(doc: EvaluatedDocument, line: number): SheetEntry | undefined {
  const entries = doc.result.entries;
  const entry = entries[firstAtOrAfter(entries, line, (e) => e.line)];
  return entry?.line === line ? entry : undefined;
}

/** Declared names are identifiers; a reference's range is the name's own text. */
const IDENTIFIER = /[A-Za-z_][A-Za-z0-9_]*/g;

/**
 * The symbol whose declaration or one of whose references covers the position. Only names
 * written on that line can cover it, so their symbols are looked up and their references on that
 * line found by binary search (references are sorted by line): the cost follows the line, not the
 * sheet.
 */
export function symbolAt(doc: EvaluatedDocument, p: Position): { symbol: SheetSymbol; range: Range } | undefined {
  const text = doc.lines[p.line];
  if (text === undefined) return undefined;
  for (const m of text.matchAll(IDENTIFIER)) {
    if (p.character < m.index || p.character > m.index + m[0].length) continue;
    const symbol = doc.result.symbols.get(m[0]);
    if (!symbol) continue;
    if (contains(symbol.declaration, p)) return { symbol, range: symbol.declaration };
    const refs = symbol.references;
    for (let i = firstAtOrAfter(refs, p.line, (r) => r.start.line); i < refs.length && refs[i]!.start.line <= p.line; i++) {
      if (contains(refs[i]!, p)) return { symbol, range: refs[i]! };
    }
  }
  return undefined;
}
