/**
 * Fuzzing the line parser and the evaluator with hostile sheets (mutated examples and random
 * grammar sheets, see hostile.ts): nothing throws, every line gets results or a located
 * diagnostic, and the work is bounded, counted deterministically (no clocks): the expression
 * parser sees each value text once, never more than the sheet's own characters allow, and an
 * unchanged or comment-only edit evaluates nothing again.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { evaluateSheet } from '../../shared-core/src/sheet/evaluate.js';
import { createSafeMath, DEFAULT_LIMITS } from '../../shared-core/src/sheet/expr/index.js';
import { MAX_LINE_LENGTH, parseLine } from '../../shared-core/src/sheet/parse/lineParser.js';
import { observable } from '../../shared-core/src/sheet/testUtil.js';
import { EXAMPLES, hostileSheetArb, LARGE, linesOf, mutatedExampleArb, runs } from './hostile.js';
import { expectSound, meter, parseBudget } from './invariants.js';

const parseMeter = meter(createSafeMath());

/** Prints (never asserts) how long cold evaluations took: per sheet and per line, median, 99th percentile, worst. */
function report(figures: { msPerLine: number; ms: number; lines: number; head: string }[]): void {
  const at = (xs: number[], q: number) => xs[Math.min(xs.length - 1, Math.floor(q * xs.length))]!;
  const perLine = figures.map((f) => f.msPerLine).sort((a, b) => a - b);
  const perSheet = figures.map((f) => f.ms).sort((a, b) => a - b);
  const worst = [...figures].sort((a, b) => b.ms - a.ms)[0]!;
  console.log(JSON.stringify({
    sheets: figures.length,
    ms_per_sheet: { p50: +at(perSheet, 0.5).toFixed(2), p99: +at(perSheet, 0.99).toFixed(2), max: +perSheet.at(-1)!.toFixed(2) },
    ms_per_line: { p50: +at(perLine, 0.5).toFixed(3), p99: +at(perLine, 0.99).toFixed(3), max: +perLine.at(-1)!.toFixed(3) },
    slowest: { ms: +worst.ms.toFixed(1), lines: worst.lines, head: worst.head },
  }));
}
const math = parseMeter.math;

describe('fuzz: line parser', () => {
  it('never throws; every span and error lies inside its line; names are identifiers', () => {
    fc.assert(fc.property(hostileSheetArb, (text) => {
      for (const line of linesOf(text)) {
        const p = parseLine(line);
        for (const e of p.errors) {
          expect(e.start).toBeGreaterThanOrEqual(0);
          // A problem found where the line ends is reported one column past it (the evaluator clamps it).
          expect(e.end).toBeLessThanOrEqual(line.length + 1);
          expect(e.start).toBeLessThan(e.end);
        }
        const d = p.declaration;
        if (!d) continue;
        expect(line.length).toBeLessThanOrEqual(MAX_LINE_LENGTH);
        expect(d.name.text).toMatch(/^[A-Za-z_][A-Za-z0-9_]*$/);
        for (const s of [d.name, d.span, d.value, d.head?.word, d.head?.on, ...d.items.flatMap((it) => [it.key, it.value, it.span])]) {
          if (!s) continue;
          expect(line.slice(s.start, s.end)).toBe(s.text);
        }
      }
    }), runs(1));
  });
});

describe('fuzz: evaluator', () => {
  it('the unmutated examples are sound', () => {
    for (const [name, text] of EXAMPLES) {
      const r = evaluateSheet(text, undefined, { math });
      expectSound(text, r);
      expect(r.diagnostics.filter((d) => d.severity === 'error'), name).toEqual([]);
    }
  });

  it('never throws; every line gets results or a located diagnostic; results are JSON-safe', () => {
    const figures: { msPerLine: number; ms: number; lines: number; head: string }[] = [];
    fc.assert(fc.property(hostileSheetArb, fc.constantFrom(undefined, 1, 10, 50), (text, marginPct) => {
      const t0 = performance.now();
      const r = evaluateSheet(text, undefined, { math, ...(marginPct === undefined ? {} : { marginPct }) });
      const ms = performance.now() - t0;
      const lines = linesOf(text).length;
      figures.push({ ms, lines, msPerLine: ms / lines, head: text.slice(0, 80) });
      expectSound(text, r);
    }), runs(1));
    if (LARGE) report(figures);
  });

  it('bounded work: each value text parsed once, within the length cap and the sheet\'s own size; nothing again when unchanged', () => {
    fc.assert(fc.property(hostileSheetArb, (text) => {
      parseMeter.reset();
      const first = evaluateSheet(text, undefined, { math });
      const budget = parseBudget(text);
      expect(parseMeter.calls).toBeLessThanOrEqual(budget.calls);
      expect(parseMeter.chars).toBeLessThanOrEqual(budget.chars);
      expect(parseMeter.longest).toBeLessThanOrEqual(DEFAULT_LIMITS.maxLength);
      const declarations = first.entries.length;
      expect(first.stats.evaluated + first.stats.reused).toBeLessThanOrEqual(declarations);

      parseMeter.reset();
      const again = evaluateSheet(text, first, { math });
      expect(parseMeter.calls).toBe(0);
      expect(again.stats.evaluated).toBe(0);

      // A comment appended to the end re-evaluates nothing either.
      parseMeter.reset();
      const commented = evaluateSheet(`${text}\n# note`, again, { math });
      expect(parseMeter.calls).toBe(0);
      expect(commented.stats.evaluated).toBe(0);
    }), runs(0.5));
  });

  it('evaluates a mutated example incrementally (from the example\'s own result) exactly as cold', () => {
    const previous = new Map([...EXAMPLES].map(([name, text]) => [name, evaluateSheet(text, undefined, { math })]));
    fc.assert(fc.property(mutatedExampleArb, ({ name, text }) => {
      const warm = evaluateSheet(text, previous.get(name), { math });
      const cold = evaluateSheet(text, undefined, { math });
      expect(observable(warm)).toEqual(observable(cold));
    }), runs(0.5));
  });
});
