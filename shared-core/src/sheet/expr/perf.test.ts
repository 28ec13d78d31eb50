import { describe, expect, it } from 'vitest';
import { compileExpression } from './compile.js';
import { createSafeMath } from './mathInstance.js';
import type { CompiledExpression, Value } from './types.js';

const math = createSafeMath();
const TEXTS = ['2.45 GHz', '2*f0', '1 / (2 * pi * f0 * 0.9 pF)', '0.8 mm * 1.05', '35 µm', 'sqrt(h^2 + (0.2 mm)^2)'];
const scope = new Map<string, Value>([['f0', math.unit(2.45, 'GHz')], ['h', math.unit(0.8, 'mm')]]);

/** Microseconds per call: the best of 5 batches of `n` calls after a warm-up (robust to a busy machine). */
function microsPerCall(n: number, fn: () => void): number {
  for (let i = 0; i < 200; i++) fn();
  let best = Infinity;
  for (let batch = 0; batch < 5; batch++) {
    const t0 = performance.now();
    for (let i = 0; i < n; i++) fn();
    best = Math.min(best, ((performance.now() - t0) * 1000) / n);
  }
  return best;
}

describe('cost per expression (loose bounds; typical figures in the log)', () => {
  it('compiles in tens of µs and evaluates in a few µs', () => {
    const compiles = TEXTS.map((t) => microsPerCall(400, () => compileExpression(t, math)));
    const codes = TEXTS.map((t) => compileExpression(t, math) as CompiledExpression);
    const evals = codes.map((c) => microsPerCall(4000, () => c.evaluate(scope)));
    console.log(TEXTS.map((t, i) => `${t}: compile ${compiles[i]?.toFixed(1)} µs, evaluate ${evals[i]?.toFixed(2)} µs`).join('\n'));
    // Plain Node: compile 6–20 µs, evaluate 0.05 µs (literal lines are folded) to 8 µs (mathjs unit
    // arithmetic). Bounds sit ~10x above so a loaded machine does not flake.
    for (const us of compiles) expect(us).toBeLessThan(250);
    for (const us of evals) expect(us).toBeLessThan(80);
  });
});
