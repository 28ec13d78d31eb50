import { describe, expect, it } from 'vitest';
import { evaluateSheet } from '../sheet/evaluate.js';
import { createSafeMath } from '../sheet/expr/index.js';
import { observable } from '../sheet/testUtil.js';
import { sharedEvaluator } from './evaluator.js';

describe('sharedEvaluator', () => {
  it('builds one expression instance on the first call and reuses it for every later file', () => {
    let built = 0;
    const evaluate = sharedEvaluator(() => (built++, createSafeMath()));
    expect(built).toBe(0);
    const sheets = ['let f0 = 2.45 GHz\n', 'let a = 1 mm\nlet b = 2*a\n', 'let x = (\n'];
    const results = sheets.map((t) => evaluate(t, { marginPct: 5 }));
    expect(built).toBe(1);
    sheets.forEach((t, i) => expect(observable(results[i]!)).toEqual(observable(evaluateSheet(t, undefined, { marginPct: 5 }))));
  });
});
