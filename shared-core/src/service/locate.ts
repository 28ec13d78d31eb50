/** Finding what sits at a position: the declaration of a line, or a name (declaration or reference). */
import type { Position, Range, SheetEntry, SheetSymbol } from '../sheet/types.js';
import type { EvaluatedDocument } from './types.js';

export const contains = (r: Range, p: Position): boolean =>
  p.line >= r.start.line && p.line <= r.end.line &&
  (p.line !== r.start.line || p.character >= r.start.character) &&
  (p.line !== r.end.line || p.character <= r.end.character);

/** The declaration on a line, if that line declares something. */
export function entryOnLine(doc: EvaluatedDocument, line: number): SheetEntry | undefined {
  return doc.result.entries.find((e) => e.line === line);
}

/** The symbol whose declaration or one of whose references covers the position. */
export function symbolAt(doc: EvaluatedDocument, p: Position): { symbol: SheetSymbol; range: Range } | undefined {
  for (const symbol of doc.result.symbols.values()) {
    if (contains(symbol.declaration, p)) return { symbol, range: symbol.declaration };
    const ref = symbol.references.find((r) => contains(r, p));
    if (ref) return { symbol, range: ref };
  }
  return undefined;
}
