/** Go to definition, find references and rename, over the evaluator's symbol table. */
import { DECLARATION_KEYWORDS } from '../sheet/parse/lineParser.js';
import type { Position, Range } from '../sheet/types.js';
import { symbolAt } from './locate.js';
import type { EvaluatedDocument, Location, TextEdit } from './types.js';

export function getDefinition(doc: EvaluatedDocument, p: Position): Location | null {
  const hit = symbolAt(doc, p);
  return hit ? { range: hit.symbol.declaration } : null;
}

export function getReferences(doc: EvaluatedDocument, p: Position, includeDeclaration: boolean): Location[] {
  const hit = symbolAt(doc, p);
  if (!hit) return [];
  const refs = hit.symbol.references.map((range) => ({ range }));
  return includeDeclaration ? [{ range: hit.symbol.declaration }, ...refs] : refs;
}

export function prepareRename(doc: EvaluatedDocument, p: Position): { range: Range; placeholder: string } | null {
  const hit = symbolAt(doc, p);
  return hit ? { range: hit.range, placeholder: hit.symbol.name } : null;
}

const RESERVED = new Set<string>([...DECLARATION_KEYWORDS, 'on', 'short', 'open', 'end', 'pi', 'e']);

/** Edits that rename the symbol at `p` everywhere, or an error saying why the name is refused. */
export function getRename(doc: EvaluatedDocument, p: Position, newName: string): { edits: TextEdit[] } | { error: string } {
  const hit = symbolAt(doc, p);
  if (!hit) return { error: 'no sheet name here to rename' };
  if (!/^[A-Za-z_][A-Za-z0-9_]*$/.test(newName)) return { error: `"${newName}" is not a valid name: use letters, digits and _ , starting with a letter` };
  if (RESERVED.has(newName)) return { error: `"${newName}" is a reserved word of the sheet language` };
  if (newName !== hit.symbol.name && doc.result.symbols.has(newName)) return { error: `${newName} is already declared in this sheet` };
  const ranges = [hit.symbol.declaration, ...hit.symbol.references];
  return { edits: ranges.map((range) => ({ range, newText: newName })) };
}
