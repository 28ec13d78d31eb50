/**
 * Property tests: random sheets built from fragments of the example sheets, mutated (truncated, with
 * unicode, huge numbers, unbalanced parentheses, NUL bytes) and joined with LF, CRLF or CR.
 * The evaluator never throws, keeps every range inside the text, keeps results JSON-safe, and
 * evaluates incrementally exactly as it does cold.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { evaluateSheet } from './evaluate.js';
import { example, expectRangesInside, observable } from './testUtil.js';
import type { SheetOptions } from './types.js';

const FRAGMENTS: readonly string[] = [
  ...new Set(
    [...example('sensor-node').split('\n'), ...example('warnings-tour').split('\n')].filter((l) => l.trim() !== ''),
  ),
  'let h = 2 mm',
  'substrate core: dk 4.4 ± 5 %, height h ± 10 %, copper 0.5 oz, er 4',
  'line c: coax, inner 0.9 mm, outer 3 mm, dk 2.1, at f0',
  'line i: ideal, z0 75 Ω, velocity 0.66, df 0.001',
  'stub z: open on i, reactance -20 ohm, at 900 MHz, solution 2, band 850 MHz .. 950 MHz',
  'stub y: short on c, length 30 mm ± 1 mm, at 1 GHz, resonant',
  'let a = b + 1', 'let b = a', 'let x = constructor', 'let y = import("fs")', 'let w = f(x) = x', 'let v = [1,2]', 'let u = 1:1e9',
  'stub big: short on feed, length 1e300 m, at f0, band band',
  'stub wide: open on thin, length 10 mm, at f0, band 1 Hz .. 1e18 Hz',
  'line feed: microstrip on board, z0 1e9 ohm',
];

const TOKENS: readonly string[] = [
  '(', ')', '((((', '))', '±', '+/-', '..', '…', ',', ',,', ':', '=', '#', '%', '\u0000', 'µ', 'μ', 'Ω', '°', '²', '\u00a0',
  '\u{1F600}', '\uD800', '\u2028', '\uFEFF', 'é', '\t', ' 1e308', ' 1e-308', ' 9'.padEnd(400, '9'), ' -1', ' 0', ' NaN', ' Infinity',
  ' on ', ' on board', ' band ', ', resonant', ', at f0', ' mm', ' GHz', ' oz', 'constructor', '__proto__', 'end', '\r', '\n',
];

/** One line: a fragment, possibly mutated. */
const lineArb: fc.Arbitrary<string> = fc
  .tuple(
    fc.constantFrom(...FRAGMENTS),
    fc.array(
      fc.oneof(
        fc.record({ kind: fc.constant('truncate' as const), at: fc.nat() }),
        fc.record({ kind: fc.constant('insert' as const), at: fc.nat(), token: fc.constantFrom(...TOKENS) }),
        fc.record({ kind: fc.constant('delete' as const), at: fc.nat(), n: fc.integer({ min: 1, max: 8 }) }),
        fc.record({ kind: fc.constant('insert' as const), at: fc.nat(), token: fc.string({ unit: 'binary', maxLength: 6 }) }),
      ),
      { maxLength: 3 },
    ),
  )
  .map(([text, mutations]) => {
    let t = text;
    for (const m of mutations) {
      const at = t.length === 0 ? 0 : m.at % (t.length + 1);
      if (m.kind === 'truncate') t = t.slice(0, at);
      else if (m.kind === 'insert') t = t.slice(0, at) + m.token + t.slice(at);
      else t = t.slice(0, at) + t.slice(at + m.n);
    }
    return t;
  });

const EOL = fc.constantFrom('\n', '\r\n', '\r');

/** A sheet: up to 12 lines joined with mixed line endings. */
const sheetArb: fc.Arbitrary<string> = fc
  .array(fc.tuple(lineArb, EOL), { minLength: 1, maxLength: 12 })
  .map((parts) => parts.map(([line, eol]) => line + eol).join(''));

/**
 * A cold evaluation of a dozen lines costs tens of milliseconds (a fresh mathjs instance, microstrip
 * synthesis, resonance searches), so these properties run a share of the global run count
 * (FC_RUNS raises it).
 */
const runs = (share: number) => ({ numRuns: Math.max(10, Math.round((fc.readConfigureGlobal().numRuns ?? 100) * share)) });

const optionsArb: fc.Arbitrary<SheetOptions> = fc.constantFrom({}, { marginPct: 5 }, { marginPct: 10 }, { marginPct: 25 });

/** A text edit: replace `[at, at + del)` by `insert`. */
const editArb = fc.record({
  at: fc.nat(),
  del: fc.integer({ min: 0, max: 20 }),
  insert: fc.oneof(fc.constantFrom(...TOKENS, ...FRAGMENTS.map((f) => `\n${f}`), '\n', ''), lineArb),
});

function applyEdit(text: string, e: { at: number; del: number; insert: string }): string {
  const at = e.at % (text.length + 1);
  return text.slice(0, at) + e.insert + text.slice(at + e.del);
}

function expectSound(text: string, options: SheetOptions): ReturnType<typeof evaluateSheet> {
  let r: ReturnType<typeof evaluateSheet> | undefined;
  expect(() => { r = evaluateSheet(text, undefined, options); }).not.toThrow();
  expectRangesInside(text, r!);
  for (const d of r!.diagnostics) {
    expect(d.message.length).toBeGreaterThan(0);
    expect(['error', 'warning', 'info']).toContain(d.severity);
  }
  for (const e of r!.entries) {
    for (const [k, v] of Object.entries(e.results)) {
      const ok = v === null || typeof v === 'string' || typeof v === 'boolean' || (typeof v === 'number' && Number.isFinite(v));
      expect(ok, `${e.name}.${k} = ${String(v)} is JSON-safe`).toBe(true);
    }
  }
  return r!;
}

describe('random sheets from fragments of the examples', () => {
  it('the fragments themselves evaluate', () => {
    expectSound(FRAGMENTS.join('\n'), {});
  });

  it('never throw, keep every range inside the text, and give JSON-safe results', () => {
    fc.assert(fc.property(sheetArb, optionsArb, (text, options) => {
      expectSound(text, options);
    }), runs(0.6));
  });

  it('evaluate incrementally after a random edit exactly as cold', () => {
    fc.assert(fc.property(sheetArb, fc.array(editArb, { minLength: 1, maxLength: 2 }), optionsArb, (text, edits, options) => {
      let previous = evaluateSheet(text, undefined, options);
      let current = text;
      for (const e of edits) {
        current = applyEdit(current, e);
        const warm = evaluateSheet(current, previous, options);
        const cold = expectSound(current, options);
        expect(observable(warm)).toEqual(observable(cold));
        previous = warm;
      }
    }), runs(0.4));
  });

  it('evaluate incrementally after a change of margin exactly as cold', () => {
    fc.assert(fc.property(sheetArb, optionsArb, optionsArb, (text, first, second) => {
      const warm = evaluateSheet(text, evaluateSheet(text, undefined, first), second);
      expect(observable(warm)).toEqual(observable(evaluateSheet(text, undefined, second)));
    }), runs(0.2));
  });
});
