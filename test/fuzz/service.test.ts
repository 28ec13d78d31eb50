/**
 * Fuzzing the language service (what the server answers with) on hostile sheets: every feature
 * at random positions and ranges never throws and only returns ranges inside the document; a
 * document edited version by version (random edits, in order) ends exactly where a cold
 * evaluation of its final text does.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { createSheetService } from '../../shared-core/src/service/sheetService.js';
import type { EvaluatedDocument } from '../../shared-core/src/service/types.js';
import type { Position, Range } from '../../shared-core/src/sheet/types.js';
import { observable } from '../../shared-core/src/sheet/testUtil.js';
import { FRAGMENTS, hostileSheetArb, linesOf, mutatedExampleArb, runs } from './hostile.js';
import { expectOnLine, expectSound } from './invariants.js';

const service = createSheetService();
/** A second service for cold evaluations (shares nothing with the first). */
const coldService = createSheetService();
let serial = 0;

/** A position inside the text (as the server clamps them): line and column as fractions. */
const positionArb = fc.tuple(fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }));
const toPosition = (lines: readonly string[], [l, c]: [number, number]): Position => {
  const line = Math.min(lines.length - 1, Math.floor(l * lines.length));
  return { line, character: Math.min(lines[line]!.length, Math.floor(c * (lines[line]!.length + 1))) };
};

function expectInside(lines: readonly string[], r: Range, what: string): void {
  expectOnLine(lines, r, what);
}

function exercise(doc: EvaluatedDocument, positions: Position[], newName: string): void {
  const lines = doc.lines;
  for (const d of service.getDiagnostics(doc)) expectInside(lines, d.range, `diagnostic ${d.code}`);
  const whole: Range = { start: { line: 0, character: 0 }, end: { line: lines.length, character: 0 } };
  for (const h of service.getInlayHints(doc, whole)) {
    expect(h.position.line).toBeLessThan(lines.length);
    expect(h.position.character).toBeLessThanOrEqual(lines[h.position.line]!.length);
    expect(h.label.length).toBeGreaterThan(0);
  }
  for (const a of service.getCodeActions(doc, whole, service.getDiagnostics(doc))) {
    for (const e of a.edits) {
      expectInside(lines, e.range, a.title);
      expect(e.newText).not.toMatch(/[\r\n]/);
    }
  }
  for (const s of service.getSymbols(doc)) {
    expectInside(lines, s.range, `symbol ${s.name}`);
    expectInside(lines, s.selectionRange, `symbol ${s.name}`);
  }
  for (const p of positions) {
    const hover = service.getHover(doc, p);
    if (hover) {
      expectInside(lines, hover.range, 'hover');
      expect(hover.contents.length).toBeGreaterThan(0);
    }
    for (const c of service.getCompletions(doc, p)) expect(typeof c.label).toBe('string');
    const def = service.getDefinition(doc, p);
    if (def) expectInside(lines, def.range, 'definition');
    for (const l of service.getReferences(doc, p, true)) expectInside(lines, l.range, 'reference');
    const prep = service.prepareRename(doc, p);
    if (prep) expectInside(lines, prep.range, 'prepareRename');
    const rename = service.getRename(doc, p, newName);
    if ('edits' in rename) for (const e of rename.edits) expectInside(lines, e.range, 'rename');
    else expect(rename.error.length).toBeGreaterThan(0);
    const line = { start: { line: p.line, character: 0 }, end: { line: p.line, character: lines[p.line]!.length } };
    for (const a of service.getCodeActions(doc, line)) for (const e of a.edits) expectInside(lines, e.range, a.title);
  }
}

describe('fuzz: language service features', () => {
  it('every feature at random positions: no throw, every range inside the document', () => {
    fc.assert(fc.property(
      hostileSheetArb, fc.array(positionArb, { minLength: 1, maxLength: 6 }),
      fc.oneof(fc.constantFrom('renamed', 'x', '2x', '', 'on', 'let', '__proto__', 'constructor', 'a b'), fc.string({ maxLength: 8 })),
      fc.constantFrom({}, { lengthUnit: 'mil' as const }, { marginPct: 0 }, { marginPct: 100, gridM: 1e-3 }),
      (text, rawPositions, newName, settings) => {
        const uri = `file:///fuzz/${serial++}.rfsheet`;
        const doc = service.evaluate(uri, 1, text, settings);
        expect(doc.lines).toEqual(linesOf(text));
        expectSound(text, doc.result);
        exercise(doc, rawPositions.map((p) => toPosition(doc.lines, p)), newName);
        service.close(uri);
      },
    ), runs(0.5));
  });

  it('a document edited version by version ends where a cold evaluation of its final text does', () => {
    const editArb = fc.record({
      at: fc.double({ min: 0, max: 1, noNaN: true }),
      del: fc.integer({ min: 0, max: 30 }),
      insert: fc.oneof(fc.constantFrom(...FRAGMENTS, '\n', '\r\n', '', '\nstub s: short on feed, length 5 mm, at f0'), fc.string({ unit: 'binary', maxLength: 5 })),
    });
    fc.assert(fc.property(mutatedExampleArb, fc.array(editArb, { minLength: 1, maxLength: 8 }), ({ text }, edits) => {
      const uri = `file:///fuzz/${serial++}.rfsheet`;
      let current = text;
      let version = 1;
      service.evaluate(uri, version, current);
      for (const e of edits) {
        const at = Math.floor(e.at * (current.length + 1));
        current = current.slice(0, at) + e.insert + current.slice(at + e.del);
        service.evaluate(uri, ++version, current);
      }
      const warm = service.get(uri)!;
      const cold = coldService.evaluate(uri, 1, current);
      expect(observable(warm.result)).toEqual(observable(cold.result));
      service.close(uri);
      coldService.close(uri);
    }), runs(0.2));
  });
});
