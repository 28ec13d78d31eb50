/**
 * Code actions make minimal, idempotent edits (the service has no formatter; code actions and
 * rename are its only edits). On the examples and on mutated examples, every offered action:
 * - edits one line per edit, inside the declaration (never its comment), each edit covering
 *   exactly one item, its value (or the nominal part of a `±` value), or the `short`/`open` word,
 *   with new text that differs from the old and holds no line break;
 * - applied, adds no error anywhere and leaves every other line byte for byte as it was;
 * - applied, is not offered again: a quick fix removes its warning and its offer, a written-back
 *   value leaves nothing to write back on that line, and a swap swapped back returns to the
 *   original kind of stub with (nearly) the original length.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { createSheetService } from '../../shared-core/src/service/sheetService.js';
import type { CodeAction, EvaluatedDocument, ServiceSettings } from '../../shared-core/src/service/types.js';
import { splitTolerance } from '../../shared-core/src/sheet/expr/index.js';
import { parseLine } from '../../shared-core/src/sheet/parse/lineParser.js';
import { EXAMPLES, linesOf, mutatedExampleArb, runs } from '../fuzz/hostile.js';

const service = createSheetService();
let serial = 0;
const open = (text: string, settings: Partial<ServiceSettings> = {}) => service.evaluate(`file:///actions/${serial++}.rfsheet`, 1, text, settings);
const whole = { start: { line: 0, character: 0 }, end: { line: 1_000_000, character: 0 } };
const errorsOf = (doc: EvaluatedDocument) => doc.result.diagnostics.filter((d) => d.severity === 'error');

/** Applies single-line edits to text with any line endings (the line breaks are kept). */
function apply(text: string, edits: CodeAction['edits']): string {
  const parts = text.split(/(\r\n|\r|\n)/);
  const sorted = [...edits].sort((a, b) => b.range.start.line - a.range.start.line || b.range.start.character - a.range.start.character);
  for (const e of sorted) {
    const k = 2 * e.range.start.line;
    parts[k] = parts[k]!.slice(0, e.range.start.character) + e.newText + parts[k]!.slice(e.range.end.character);
  }
  return parts.join('');
}

/** Spans an edit may cover on a line: the head word, whole items, item values, nominal parts of `±` values. */
function editableSpans(line: string): { start: number; end: number; whole: boolean }[] {
  const d = parseLine(line).declaration;
  if (!d) return [];
  const spans: { start: number; end: number; whole: boolean }[] = [];
  if (d.head) spans.push({ ...d.head.word, whole: true });
  for (const item of d.items) {
    spans.push({ start: item.span.start, end: item.span.end, whole: true });
    if (item.value) {
      spans.push({ start: item.value.start, end: item.value.end, whole: false });
      const t = splitTolerance(item.value.text);
      if (t.tolerance) spans.push({ start: item.value.start + t.nominal.start, end: item.value.start + t.nominal.end, whole: false });
    }
  }
  return spans;
}

function expectMinimal(doc: EvaluatedDocument, a: CodeAction): void {
  const seen: string[] = [];
  for (const e of a.edits) {
    const { start, end } = e.range;
    expect(end.line, a.title).toBe(start.line);
    const line = doc.lines[start.line]!;
    const entry = doc.result.entries.find((x) => x.line === start.line)!;
    expect(entry, a.title).toBeDefined();
    expect(end.character, `${a.title}: inside the declaration, not its comment`).toBeLessThanOrEqual(entry.range.end.character);
    const span = editableSpans(line).find((s) => s.start === start.character && s.end === end.character);
    expect(span, `${a.title}: covers exactly one item, value or head word: "${line.slice(start.character, end.character)}"`).toBeDefined();
    expect(e.newText, a.title).not.toMatch(/[\r\n]/);
    expect(e.newText.trim().length, a.title).toBeGreaterThan(0);
    expect(e.newText, `${a.title}: a real change`).not.toBe(line.slice(start.character, end.character));
    seen.push(`${start.line}:${start.character}`);
  }
  expect(new Set(seen).size, `${a.title}: edits do not overlap`).toBe(seen.length);
}

/** Checks one action of `doc` (made from `text`); returns the document after applying it. */
function checkAction(text: string, doc: EvaluatedDocument, a: CodeAction, settings: Partial<ServiceSettings>): EvaluatedDocument {
  expectMinimal(doc, a);
  const after = apply(text, a.edits);
  const line = a.edits[0]!.range.start.line;
  const before = linesOf(text);
  linesOf(after).forEach((l, i) => {
    if (i !== line) expect(l, `${a.title}: line ${i + 1} untouched`).toBe(before[i]);
  });
  const fixed = open(after, settings);
  expect(errorsOf(fixed).map((d) => `${d.range.start.line + 1}: ${d.message}`), `${a.title}: no new error`).toEqual(errorsOf(doc).map((d) => `${d.range.start.line + 1}: ${d.message}`));
  const again = service.getCodeActions(fixed, { start: { line, character: 0 }, end: { line, character: 0 } }, fixed.result.diagnostics);
  if (a.kind === 'quickfix') {
    const code = a.diagnostics?.[0]?.code ?? doc.result.diagnostics.find((d) => d.range.start.line === line && d.data?.lengthM !== undefined)!.code;
    expect(fixed.result.diagnostics.filter((d) => d.range.start.line === line && d.code === code), `${a.title}: warning gone`).toEqual([]);
    expect(again.filter((x) => x.kind === 'quickfix'), `${a.title}: not offered again`).toEqual([]);
  } else if (a.title.startsWith('Write the synthesized')) {
    const key = /synthesized (\w+)/.exec(a.title)![1]!;
    expect(again.some((x) => x.title.startsWith(`Write the synthesized ${key}`)), `${a.title}: not offered again`).toBe(false);
  } else if (a.title.startsWith('Swap')) {
    const back = again.find((x) => x.title.startsWith('Swap'));
    expect(back, `${a.title}: the swap back is offered`).toBeDefined();
    const twice = open(apply(after, back!.edits), settings);
    const original = doc.result.entries.find((e) => e.line === line)!;
    const returned = twice.result.entries.find((e) => e.line === line)!;
    expect(twice.lines[line]!.match(/:\s*(short|open)/)?.[1]).toBe(doc.lines[line]!.match(/:\s*(short|open)/)?.[1]);
    const [l0, l1] = [original.results.length_m, returned.results.length_m] as number[];
    // each swap rounds the written length to the grid (default 0.01 mm): back within a few steps
    if (/\blength\b/.test(doc.lines[line]!)) expect(Math.abs(l1! - l0!), `${a.title}: swapped back to the length`).toBeLessThanOrEqual(4 * (settings.gridM ?? 10e-6));
  }
  return fixed;
}

const SETTINGS: Partial<ServiceSettings>[] = [{}, { lengthUnit: 'mil' }, { gridM: 0.1e-3, marginPct: 5 }];

describe('code actions: minimal and idempotent', () => {
  it.each([...EXAMPLES.keys()].flatMap((n) => SETTINGS.map((s) => [n, s] as const)))('%s with %j: every action', (name, settings) => {
    const text = EXAMPLES.get(name)!;
    const doc = open(text, settings);
    const actions = service.getCodeActions(doc, whole, doc.result.diagnostics);
    if (name !== 'power-check.rfsheet') expect(actions.length).toBeGreaterThan(0);
    for (const a of actions) checkAction(text, doc, a, settings);
  });

  it('every action on mutated examples', () => {
    fc.assert(fc.property(mutatedExampleArb, fc.constantFrom(...SETTINGS), ({ text }, settings) => {
      const doc = open(text, settings);
      if (text.length > 200_000) return;
      for (const a of service.getCodeActions(doc, whole, doc.result.diagnostics)) checkAction(text, doc, a, settings);
    }), runs(0.2));
  });
});
