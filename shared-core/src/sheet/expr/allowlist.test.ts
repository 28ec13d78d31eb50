import { describe, expect, it } from 'vitest';
import { checkTree } from './allowlist.js';
import { buildLockedInstance, createSafeMath } from './mathInstance.js';
import { compileExpression } from './compile.js';
import { compiled, refused } from './testUtil.js';

const math = createSafeMath();

describe('gate before parsing: each refusal points at its token', () => {
  it.each([
    ['assignment', 'a = 1', '='],
    ['function definition', 'f(x) = x', '='],
    ['comparison ==', '1 == 1', '=='],
    ['comparison <=', '1 <= 2', '<='],
    ['comparison >', '1 mm > 2 mm', '>'],
    ['not-equal', '1 != 2', '!='],
    ['factorial', '5!', '!'],
    ['property access', 'w.value', '.'],
    ['element-wise', '2 .* 3', '.'],
    ['range operator', '1:10', ':'],
    ['band outside a band key', '2 GHz .. 3 GHz', '..'],
    ['index', 'a[1]', '['],
    ['matrix', '[1, 2]', '['],
    ['object', '{a: 1}', '{'],
    ['double-quoted string', 'x + "abc"', '"abc"'],
    ['single-quoted string', "'abc'", "'abc'"],
    ['transpose', "x'", "'"],
    ['block with ;', '1; 2', ';'],
    ['block with newline', '1\n2', '\n'],
    ['conditional', 'a ? 1 : 2', '?'],
    ['percent', '5%', '%'],
    ['mod keyword', '7 mod 2', 'mod'],
    ['logical and', 'a and b', 'and'],
    ['logical not', 'not a', 'not'],
    ['bitwise', '1 & 2', '&'],
    ['bitwise or', '1 | 2', '|'],
    ['bitwise not', '~1', '~'],
    ['boolean', 'true + 1', 'true'],
    ['null', '1 + null', 'null'],
    ['comment', '2 mm # note', '#'],
    ['stray character', '2 mm \\ 3', '\\'],
    ['astral character', '2 \u{1D465}', '\u{1D465}'],
    ['micro sign on a non-unit', '3 µx', 'µx'],
  ])('%s: %j → %j', (_label, text, slice) => {
    const e = refused(text, math);
    expect(e.code).toBe('syntax');
    expect(e.slice).toBe(slice);
  });
});

describe('AST allowlist', () => {
  it.each([
    ['zeros(1e9)', 'zeros'],
    ['import(x)', 'import'],
    ['createUnit(x)', 'createUnit'],
    ['evaluate(x)', 'evaluate'],
    ['parse(x)', 'parse'],
    ['compile(x)', 'compile'],
    ['simplify(x)', 'simplify'],
    ['derivative(x, y)', 'derivative'],
    ['resolve(x)', 'resolve'],
    ['reviver(x)', 'reviver'],
    ['2 * matrix(3)', 'matrix'],
    ['f0 (1 + x)', 'f0'],
    ['2 mm (3)', 'mm'],
  ])('refuses the call %s at the function name', (text, slice) => {
    const e = refused(text, math);
    expect([e.code, e.slice]).toEqual(['syntax', slice]);
  });

  it('refuses a conversion to something that is not a unit, at `to`', () => {
    expect(refused('5 mm to f0', math)).toMatchObject({ code: 'syntax', start: 5, end: 7 });
    expect(compiled('5 mm to mil', math).names.map((n) => n.name)).toEqual(['mm', 'mil']);
    expect(compiled('2 GHz in MHz', math).names.map((n) => n.name)).toEqual(['GHz', 'MHz']);
  });

  it('allows exactly the sheet grammar', () => {
    for (const text of ['-x', '+x', '2^-3', '(a + b) / 2', '2.45 GHz', 'atan2(1, 2) rad', 'log(100, 10)', '2 mm^2 / mm']) {
      expect(compileExpression(text, math).ok, text).toBe(true);
    }
  });

  // Defence in depth: the AST walk refuses every node kind even if the gate were bypassed.
  const { parse } = buildLockedInstance();
  it.each([
    ['a = 1', 'AssignmentNode'],
    ['f(x) = x', 'FunctionAssignmentNode'],
    ['a.b', 'AccessorNode'],
    ['a[1]', 'AccessorNode'],
    ['[1, 2]', 'ArrayNode'],
    ['{a: 1}', 'ObjectNode'],
    ['1:3', 'RangeNode'],
    ['1; 2', 'BlockNode'],
    ['a ? 1 : 2', 'ConditionalNode'],
    ['1 < 2 < 3', 'RelationalNode'],
    ['"s"', 'string constant'],
    ['true', 'boolean constant'],
    ['5 mod 2', 'mod'],
    ['1 == 2', 'comparison'],
    ['2 .* 3', 'dotMultiply'],
    ['5!', 'factorial'],
    ['zeros(3)', 'function'],
  ])('checkTree refuses %s (%s)', (text) => {
    const r = checkTree(parse(text), 500, math.fallbackOf);
    expect(r.ok).toBe(false);
  });

  it('checkTree stops counting after maxNodes', () => {
    const r = checkTree(parse('1+2+3+4'), 5, math.fallbackOf);
    expect(r.ok === false && r.code).toBe('limit');
  });
});
