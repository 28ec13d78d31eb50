/** Document outline: one symbol per declaration. */
import type { DocumentSymbol, EvaluatedDocument } from './types.js';

export function getSymbols(doc: EvaluatedDocument): DocumentSymbol[] {
  return doc.result.entries.map((e) => ({
    name: e.name,
    kind: e.kind,
    detail: e.details[0] ?? '',
    range: e.range,
    selectionRange: e.nameRange,
  }));
}
