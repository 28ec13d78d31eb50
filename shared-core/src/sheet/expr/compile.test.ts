import { describe, expect, it } from 'vitest';
import { compileExpression } from './compile.js';
import { toSI } from './dimension.js';
import { createSafeMath } from './mathInstance.js';
import { compiled, refused, valueOf } from './testUtil.js';
import type { Value } from './types.js';

const math = createSafeMath();
const si = (text: string, kind: Parameters<typeof toSI>[1], scope?: Map<string, Value>) =>
  toSI(valueOf(text, math, scope), kind);

describe('compileExpression: values', () => {
  it('evaluates unit-bearing expressions in SI', () => {
    expect(si('2.45 GHz', 'frequency')).toBeCloseTo(2.45e9, 0);
    expect(si('2.45GHz', 'frequency')).toBeCloseTo(2.45e9, 0);
    expect(si('0.8 mm', 'length')).toBeCloseTo(8e-4, 12);
    expect(si('35 um', 'length')).toBeCloseTo(35e-6, 12);
    expect(si('10 mil', 'length')).toBeCloseTo(254e-6, 12);
    expect(si('1 / (2 pi 2.45 GHz 0.9 pF)', 'impedance')).toBeCloseTo(72.18, 2);
    expect(si('sqrt(4 mm^2)', 'length')).toBeCloseTo(2e-3, 12);
    expect(si('5 mm to mil', 'length')).toBeCloseTo(5e-3, 12);
    expect(si('max(1 mm, 2 mil)', 'length')).toBeCloseTo(1e-3, 12);
    expect(si('-(3 nH)', 'inductance')).toBeCloseTo(-3e-9, 18);
    expect(si('2.55', 'dimensionless')).toBe(2.55);
    expect(si('1/2 GHz', 'frequency')).toBeCloseTo(0.5e9, 0); // mathjs: implicit multiplication binds tighter
  });

  it('uses sheet names from the scope', () => {
    const scope = new Map<string, Value>([['f0', math.unit(2.45, 'GHz')]]);
    expect(si('2*f0', 'frequency', scope)).toBeCloseTo(4.9e9, 0);
  });

  it('lists names in source order with exact ranges and fallbacks', () => {
    const c = compiled('2*f0 + 3 GHz - pi*x', math);
    expect(c.names).toEqual([
      { name: 'f0', start: 2, end: 4, fallback: 'none' },
      { name: 'GHz', start: 9, end: 12, fallback: 'unit' },
      { name: 'pi', start: 15, end: 17, fallback: 'constant' },
      { name: 'x', start: 18, end: 19, fallback: 'none' },
    ]);
    expect(compiled('sqrt(a) + max(a, b)', math).functions.map((f) => [f.name, f.start, f.end])).toEqual([
      ['sqrt', 0, 4],
      ['max', 10, 13],
    ]);
  });

  it('reports an unknown name at its exact range with a fix', () => {
    const text = 'w + 2*gap_width';
    const r = compiled(text, math).evaluate(new Map([['w', 1]]));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.code).toBe('unknown-name');
    expect(text.slice(r.error.start, r.error.end)).toBe('gap_width');
    expect(r.error.message).toContain('let gap_width =');
  });

  it('suggests the unit for a miscased unit and the call for a function name', () => {
    const r = compiled('2.45 Ghz', math).evaluate(new Map());
    expect(!r.ok && r.error.message).toContain('GHz');
    const f = compiled('sqrt', math).evaluate(new Map());
    expect(!f.ok && f.error.message).toContain('sqrt(…)');
  });

  it('refuses a call of a sheet name that hides a function', () => {
    const r = compiled('sqrt(4)', math).evaluate(new Map([['sqrt', 2]]));
    expect(!r.ok && [r.error.code, r.error.start, r.error.end]).toEqual(['eval', 0, 4]);
  });

  it('reports a reserved name in the scope instead of failing inside mathjs', () => {
    const c = compiled('2 mm', math);
    const r = c.evaluate(new Map([['end', 1]]));
    expect(!r.ok && r.error.message).toContain('"end", a reserved word');
    expect(c.evaluate(new Map()).ok).toBe(true);
  });

  it('reports evaluation failures as located eval errors, never throws', () => {
    for (const text of ['1/0', 'sqrt(-1)', 'log(-1)', '1 mm + 1 GHz', 'exp(1 mm)', 'sin(1 mm)', 'round(1.5 mm, 2)']) {
      const r = compiled(text, math).evaluate(new Map());
      expect(r.ok, text).toBe(false);
      if (!r.ok) expect(r.error.code).toBe('eval');
    }
    const r = compiled('  1 mm + 1 GHz ', math).evaluate(new Map());
    expect(!r.ok && [r.error.start, r.error.end]).toEqual([2, 14]);
  });
});

describe('compileExpression: names against single-letter units', () => {
  it('sheet names win over units (h, L, S, C, W, m, H)', () => {
    for (const letter of ['h', 'L', 'S', 'C', 'W', 'm', 'H']) {
      const scope = new Map<string, Value>([[letter, math.unit(0.8, 'mm')]]);
      expect(si(`2 * ${letter}`, 'length', scope), letter).toBeCloseTo(1.6e-3, 12);
      const r = compiled(`2 * ${letter}`, math).evaluate(scope);
      expect(r.ok && r.letterUnits).toEqual([]);
    }
  });

  it('sheet names win over constants', () => {
    expect(valueOf('2*e', math, new Map([['e', 4]]))).toBe(8);
    expect(valueOf('pi', math, new Map([['pi', 3]]))).toBe(3);
  });

  it('reports a single letter that fell back to a unit', () => {
    const r = compiled('2*h + 1', math).evaluate(new Map());
    expect(r.ok).toBe(false); // 2 hours + 1: units do not match
    const ok = compiled('2*h', math).evaluate(new Map());
    expect(ok.ok && ok.letterUnits.map((n) => [n.name, n.start, n.end])).toEqual([['h', 2, 3]]);
    const none = compiled('2 mm', math).evaluate(new Map());
    expect(none.ok && none.letterUnits.length).toBe(0);
  });
});

describe('compileExpression: folding of scope-free expressions', () => {
  it('computes a literal once and recomputes when the scope shadows one of its names', () => {
    const c = compiled('2*h', math);
    const first = c.evaluate(new Map());
    expect(c.evaluate(new Map())).toBe(first);
    const shadowed = c.evaluate(new Map([['h', math.unit(0.8, 'mm')]]));
    expect(shadowed.ok && toSI(shadowed.value, 'length')).toBeCloseTo(1.6e-3, 12);
    expect(c.evaluate(new Map())).toBe(first);
    const s = compiled('2 * sqrt(4)', math);
    expect(s.evaluate(new Map([['sqrt', 1]])).ok).toBe(false);
    expect(s.evaluate(new Map())).toMatchObject({ ok: true, value: 4 });
  });
});

describe('compileExpression: limits', () => {
  it('caps the length before anything else', () => {
    const e = refused('1+'.repeat(1200) + '1', math);
    expect([e.code, e.start, e.end]).toEqual(['limit', 2000, 2401]);
    const custom = compileExpression('1 + 2', math, { maxLength: 3 });
    expect(!custom.ok && custom.error.code).toBe('limit');
  });

  it('caps bracket depth at the first bracket too deep', () => {
    const text = '('.repeat(41) + '1' + ')'.repeat(41);
    expect(refused(text, math)).toMatchObject({ code: 'limit', start: 40, end: 41 });
    expect(compiled('('.repeat(40) + '1' + ')'.repeat(40), math).nodeCount).toBe(41);
  });

  it('caps runs of signs and the node count', () => {
    expect(refused('1 ' + '- '.repeat(30) + '1', math)).toMatchObject({ code: 'limit', start: 2 });
    const many = Array.from({ length: 300 }, (_, i) => `a${i}`).join('+');
    expect(refused(many, math)).toMatchObject({ code: 'limit', start: 0, end: many.length });
  });

  it('refuses empty text', () => {
    expect(refused('   ', math)).toMatchObject({ code: 'syntax', start: 0, end: 3 });
  });
});

describe('compileExpression: parse errors', () => {
  it.each([
    ['2 +* 3', '*'],
    ['(1', '1'],
    ['1 +', '+'],
    ['2 @ 3', '@'],
    ['sqrt(1,)', ')'],
    ['1 2', '2'],
    ['1 ,', ','],
    ['f0 )', ')'],
  ])('%s points at %s', (text, slice) => {
    const e = refused(text, math);
    expect(e.code).toBe('syntax');
    expect(e.slice).toBe(slice);
    expect(e.message).not.toMatch(/char \d+/);
  });
});
