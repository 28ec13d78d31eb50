import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compileExpression } from './compile.js';
import { createSafeMath } from './mathInstance.js';
import type { ExprError, Value } from './types.js';

const math = createSafeMath();
const scope = new Map<string, Value>([['f0', math.unit(2.45, 'GHz')], ['h', math.unit(0.8, 'mm')], ['x', 2]]);

const PIECES = [
  '1', '2.45', '.5', '1e3', '0x1F', ' ', '  ', '+', '-', '*', '/', '^', '(', ')', ',', '=', '.', '..', ':', ';',
  '[', ']', '{', '}', '"', "'", '!', '%', '#', '?', '<', '>', '&', '|', '~', '\n', '±',
  'mm', 'GHz', 'h', 'L', 'f0', 'x', 'pi', 'e', 'to', 'in', 'mod', 'and', 'true', 'constructor', '__proto__',
  'sqrt', 'sin', 'max', 'zeros', 'evaluate', 'import', 'parse', 'µm', 'μ', 'Ω', 'kΩ', '°', '×', '−', '²', '\u00a0',
];

/** Text made of sheet-like pieces: exercises the parser far more than uniform random strings. */
const sheetish = fc.array(fc.constantFrom(...PIECES), { maxLength: 30 }).map((parts) => parts.join(''));

function checkLocated(e: ExprError, text: string): void {
  expect(e.start).toBeGreaterThanOrEqual(0);
  expect(e.start).toBeLessThanOrEqual(e.end);
  expect(e.end).toBeLessThanOrEqual(text.length);
}

function neverThrows(text: string): void {
  const c = compileExpression(text, math);
  if (!c.ok) return checkLocated(c.error, text);
  for (const n of [...c.names, ...c.functions]) checkLocated({ ...n, code: 'syntax', message: '' }, text);
  const r = c.evaluate(scope);
  if (!r.ok) checkLocated(r.error, text);
}

describe('compileExpression never throws', () => {
  it('on arbitrary Unicode strings', () => {
    fc.assert(fc.property(fc.string({ unit: 'binary', maxLength: 60 }), neverThrows), { numRuns: 3000 });
  });

  it('on sheet-like token soup', () => {
    fc.assert(fc.property(sheetish, neverThrows), { numRuns: 5000 });
  });

  it('points names at their exact source text in ASCII expressions', () => {
    const ascii = fc.array(fc.constantFrom('1', '2.5', ' ', '+', '*', '(', ')', 'mm', 'f0', 'x', 'h', 'sqrt('), { maxLength: 20 })
      .map((p) => p.join(''));
    fc.assert(
      fc.property(ascii, (text) => {
        const c = compileExpression(text, math);
        if (!c.ok) return;
        for (const n of c.names) expect(text.slice(n.start, n.end)).toBe(n.name);
      }),
      { numRuns: 3000 },
    );
  });
});
