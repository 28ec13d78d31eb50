import { describe, expect, it } from 'vitest';
import { compileExpression } from './compile.js';
import { buildLockedInstance, createSafeMath } from './mathInstance.js';
import type { Value } from './types.js';

const math = createSafeMath();

const CORPUS: readonly string[] = [
  'constructor', '__proto__', 'prototype', 'toString', 'hasOwnProperty', '2 constructor',
  'sqrt.constructor', 'sqrt.constructor("return process")()', '[].map.constructor("x")()',
  'unit.prototype', 'a["constructor"]', 'a.__proto__', '{}.constructor', 'f = sqrt.constructor',
  'import({x: 1}, {override: true})', 'import("fs")', 'createUnit("foo")', 'createUnit({x: "1 m"})',
  'evaluate("1+1")', 'evaluate(x)', 'parse("1")', 'parse(x)', 'compile("1")', 'simplify("x")',
  'derivative("x^2", "x")', 'resolve(x)', 'reviver(x)', 'help(sqrt)', 'chain(1)', 'typed(x)',
  'config({number: "BigNumber"})', 'f(x) = x', 'f(x) = f(x)', 'x = 1', 'x = x + 1',
  'zeros(1e9)', 'ones(1e9, 1e9)', 'identity(1e6)', 'matrix(x)', 'range(1, 1e9)', '1:1e9', '1:1:1e9',
  'concat(x, x)', 'sqrt(zeros(1e9))', 'x[1e9]', 'size(x)', '"a" + "b"', '\'a\'', 'x ? 1 : 2',
  '('.repeat(300) + '1' + ')'.repeat(300), '('.repeat(5000), ')'.repeat(5000),
  '-'.repeat(3000) + '1', '2^'.repeat(999) + '2', 'sqrt('.repeat(200) + '1' + ')'.repeat(200),
  '1+'.repeat(5000) + '1', 'x'.repeat(100_000), 'a'.repeat(1999), '1'.repeat(1999),
  '1e308^1e308', '10^1e9 mm', 'mm^1e9', '2^-1e9', '0x' + 'f'.repeat(500),
  '\u0000', '\uFEFF1', '\uD800', '1\u2028 2', 'µ', 'Ω', '°', '±', '..', '…', '',
];

describe('attack corpus', () => {
  it.each(CORPUS.map((t) => [t.length > 40 ? `${t.slice(0, 40)}… (${t.length} chars)` : t, t]))(
    '%j yields a located error or a bounded value, never a throw',
    (_label, text) => {
      const c = compileExpression(text, math);
      let evaluated = false;
      if (c.ok) {
        const r = c.evaluate(new Map<string, Value>([['x', 1], ['a', 2]]));
        evaluated = r.ok;
        if (!r.ok) expectLocated(r.error, text);
      } else {
        expectLocated(c.error, text);
      }
      // Only plain arithmetic on numbers and bare units may come through.
      if (evaluated) expect(['1e308^1e308', '2^-1e9', 'mm^1e9', 'Ω', '°']).toContain(text);
    },
    10_000, // a hang guard, not a timing check: each case takes milliseconds (bench and fuzz print figures)
  );
});

function expectLocated(e: { code: string; start: number; end: number; message: string }, text: string): void {
  expect(['limit', 'syntax', 'unknown-name', 'eval']).toContain(e.code);
  expect(e.start).toBeGreaterThanOrEqual(0);
  expect(e.end).toBeLessThanOrEqual(text.length);
  expect(e.start).toBeLessThanOrEqual(e.end);
  expect(e.message.length).toBeGreaterThan(0);
  expect(e.message.length).toBeLessThan(300);
}

describe('locked instance', () => {
  it('disables the functions the mathjs security guidance names, and more', () => {
    const { math: instance } = buildLockedInstance();
    const ns = instance as unknown as Record<string, (...args: unknown[]) => unknown>;
    for (const name of ['import', 'createUnit', 'reviver', 'evaluate', 'parse', 'compile', 'simplify', 'derivative', 'resolve']) {
      expect(() => ns[name]?.('1'), name).toThrow(/disabled/);
    }
  });

  it('still parses and compiles through the captured parser', () => {
    const { parse } = buildLockedInstance();
    expect(parse('2 + 3').compile().evaluate(new Map())).toBe(5);
  });

  it('gives independent instances (no shared mutable state)', () => {
    const a = createSafeMath();
    const b = createSafeMath();
    expect(a.parse).not.toBe(b.parse);
    expect(Object.isFrozen(a)).toBe(true);
  });
});
