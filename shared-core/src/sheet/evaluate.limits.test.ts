/**
 * The evaluator's size limit: a text longer than MAX_SHEET_LENGTH is not evaluated at all and gets
 * one located `limit` diagnostic (a stray multi-megabyte file opened as a sheet must not stall the
 * language server); a text of exactly the limit is evaluated as usual.
 */
import { describe, expect, it } from 'vitest';
import { evaluateSheet, MAX_SHEET_LENGTH } from './evaluate.js';
import { createSafeMath } from './expr/index.js';

const math = createSafeMath();
const SHEET = 'let f0 = 2.45 GHz\nlet f1 = 2*f0\n';
/** `SHEET` padded with comment lines to exactly `length` characters. */
function padded(length: number, eol = '\n'): string {
  const line = `# ${'x'.repeat(60)}${eol}`;
  let text = SHEET + line.repeat(Math.floor((length - SHEET.length) / line.length));
  text += `#${'y'.repeat(length - text.length - 1)}`;
  return text;
}

describe('sheet size limit', () => {
  it(`evaluates a sheet of exactly ${MAX_SHEET_LENGTH} characters`, () => {
    const text = padded(MAX_SHEET_LENGTH);
    expect(text.length).toBe(MAX_SHEET_LENGTH);
    const r = evaluateSheet(text, undefined, { math });
    expect(r.diagnostics).toEqual([]);
    expect(r.entries.map((e) => [e.name, e.results.value_si])).toEqual([['f0', 2.45e9], ['f1', 4.9e9]]);
  });

  it('refuses one character more with a single limit diagnostic on the first line, evaluating nothing', () => {
    const text = padded(MAX_SHEET_LENGTH + 1, '\r\n');
    const r = evaluateSheet(text, undefined, { math });
    expect(r.entries).toEqual([]);
    expect(r.symbols.size).toBe(0);
    expect(r.stats).toEqual({ evaluated: 0, reused: 0 });
    expect(r.diagnostics).toEqual([{
      range: { start: { line: 0, character: 0 }, end: { line: 0, character: 1 } }, severity: 'error', code: 'limit',
      message: `sheet longer than ${MAX_SHEET_LENGTH} characters (${MAX_SHEET_LENGTH + 1}): nothing was evaluated; split it into smaller sheets`,
    }]);
  });

  it('an empty first line still gets a range inside it', () => {
    const r = evaluateSheet(`\n${'#'.repeat(MAX_SHEET_LENGTH)}`, undefined, { math });
    expect(r.diagnostics.map((d) => d.range)).toEqual([{ start: { line: 0, character: 0 }, end: { line: 0, character: 0 } }]);
  });

  it('evaluates incrementally again once the text shrinks back under the limit', () => {
    const small = evaluateSheet(SHEET, undefined, { math });
    const big = evaluateSheet(padded(MAX_SHEET_LENGTH + 10), small, { math });
    expect(big.diagnostics.map((d) => d.code)).toEqual(['limit']);
    const again = evaluateSheet(SHEET, big, { math });
    expect(again.diagnostics).toEqual([]);
    expect(again.entries.map((e) => e.name)).toEqual(['f0', 'f1']);
    expect(again.stats).toEqual({ evaluated: 0, reused: 2 });
  });
});
