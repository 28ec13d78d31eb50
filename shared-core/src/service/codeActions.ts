/**
 * Code actions, each a minimal edit of one item:
 * - write a synthesized width or length into the sheet (rounded to the manufacturing grid);
 * - move a stub out of a resonance margin, or retune a detuned resonant stub (from diagnostic data);
 * - swap an open stub for the short stub with the same reactance at f (and back).
 */
import type { Range, SheetDiagnostic, SheetEntry } from '../sheet/types.js';
import { gridLengthText, num } from './display.js';
import { entryOnLine } from './locate.js';
import type { CodeAction, EvaluatedDocument } from './types.js';

const overlaps = (a: Range, b: Range) => !(a.end.line < b.start.line || b.end.line < a.start.line);
const lineRange = (line: number, start: number, end: number): Range => ({ start: { line, character: start }, end: { line, character: end } });

export function getCodeActions(doc: EvaluatedDocument, range: Range, diagnostics: SheetDiagnostic[] = []): CodeAction[] {
  const actions: CodeAction[] = [];
  for (const d of doc.result.diagnostics) {
    if (!overlaps(d.range, range) || d.data?.lengthM === undefined) continue;
    if (d.code !== 'near-resonance' && d.code !== 'detuned') continue;
    const text = gridLengthText(d.data.lengthM, doc.settings);
    actions.push({
      title: d.code === 'near-resonance' ? `Move out of the resonance margin: length ${text}` : `Retune to resonance: length ${text}`,
      kind: 'quickfix',
      diagnostics: diagnostics.filter((x) => x.code === d.code && x.range.start.line === d.range.start.line),
      edits: [{ range: d.range, newText: text }],
      isPreferred: true,
    });
  }
  for (let line = range.start.line; line <= range.end.line; line++) {
    const entry = entryOnLine(doc, line);
    if (!entry) continue;
    actions.push(...writeBack(entry, doc), ...swapKind(entry, doc));
  }
  return actions;
}

/** Replace `z0 50 ohm` with `width 2.2 mm`, or `capacitance 0.9 pF` with `length 8.12 mm`. */
function writeBack(entry: SheetEntry, doc: EvaluatedDocument): CodeAction[] {
  return entry.synthesized.map((s) => {
    const text = `${s.key} ${gridLengthText(s.valueSI, doc.settings)}`;
    const original = doc.lines[s.range.start.line]!.slice(s.range.start.character, s.range.end.character);
    return { title: `Write the synthesized ${s.key} into the sheet: replace "${original}" with "${text}"`, kind: 'refactor.rewrite', edits: [{ range: s.range, newText: text }] };
  });
}

/** The opposite kind of stub with the same reactance at f (the evaluator's `swap_length_m`, end effects included). */
function swapKind(entry: SheetEntry, doc: EvaluatedDocument): CodeAction[] {
  if (entry.kind !== 'stub') return [];
  const lineText = doc.lines[entry.line]!;
  const head = /:\s*(short|open)\b/.exec(lineText.slice(0, entry.range.end.character));
  // via and end keys belong to one kind of stub: no swap offered for those lines.
  if (!head || /(^|,)\s*(via|end)\b/.test(lineText)) return [];
  const from = head[1] as 'short' | 'open';
  const to = from === 'open' ? 'short' : 'open';
  const wordStart = head.index + head[0].length - from.length;
  const edits = [{ range: lineRange(entry.line, wordStart, wordStart + from.length), newText: to }];
  const newLength = num(entry.results, 'swap_length_m');
  const lengthItem = /(^|,)\s*(length)\s+([^,#]+?)\s*(?=,|#|$)/.exec(lineText.slice(0, entry.range.end.character));
  if (lengthItem) {
    if (newLength === null) return [];
    const valueStart = lengthItem.index + lengthItem[0].length - lengthItem[3]!.length;
    edits.push({ range: lineRange(entry.line, valueStart, valueStart + lengthItem[3]!.length), newText: gridLengthText(newLength, doc.settings) });
  } else if (!/(^|,)\s*(inductance|capacitance|reactance)\b/.test(lineText)) {
    return []; // an angle target would need its own rewrite; not offered
  }
  const suffix = newLength !== null ? `, length ${gridLengthText(newLength, doc.settings)}` : ' (length re-synthesized)';
  return [{ title: `Swap to the equivalent ${to} stub (same reactance at f)${suffix}`, kind: 'refactor.rewrite', edits }];
}
