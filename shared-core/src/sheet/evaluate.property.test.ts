/**
 * Property tests: random sheets built from fragments of the example sheets, mutated (truncated, with
 * unicode, huge numbers, unbalanced parentheses, NUL bytes) and joined with LF, CRLF or CR.
 * The evaluator never throws, keeps every range inside the text, keeps results JSON-safe, and
 * evaluates incrementally exactly as it does cold.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { evaluateSheet, evaluationPath } from './evaluate.js';
import { createSafeMath } from './expr/index.js';
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

describe('the line-edit path (a few lines changed, names and let dependencies kept)', () => {
  const math = createSafeMath(); // one locked mathjs instance: a fresh one per cold evaluation costs 0.2 s
  const BASE = [example('sensor-node'), example('warnings-tour').replace(/^let f0 = .*$/m, '').replace(/^let band = .*$/m, '')].join('\n');
  const lines = BASE.split('\n');
  const declLines = lines.flatMap((l, i) => (/^(let|substrate|line|stub|sweep) \w+( =|:)/.test(l) ? [i] : []));
  /** Edits after the name: replace or insert in the value part, as typing does. */
  const valueEdit = fc.record({
    line: fc.constantFrom(...declLines),
    at: fc.nat(),
    del: fc.integer({ min: 0, max: 4 }),
    insert: fc.constantFrom('', '1', '9', '0.', ' mm', ' GHz', ', resonant', ', band band', ' ± 2 %', '(', ')', '±', '*2', ' # note', 'x', ', via 0.3 mm', ', end ideal'),
  });
  const apply = (text: string[], e: { line: number; at: number; del: number; insert: string }): string[] => {
    const out = [...text];
    const l = out[e.line]!;
    const head = l.search(/[:=]/) + 1;
    const at = head + (e.at % (l.length - head + 1));
    out[e.line] = l.slice(0, at) + e.insert + l.slice(at + e.del);
    return out;
  };

  it('gives exactly the cold result, and is taken for most value edits', () => {
    let taken = 0;
    let total = 0;
    fc.assert(fc.property(fc.array(valueEdit, { minLength: 1, maxLength: 4 }), (edits) => {
      let previous = evaluateSheet(BASE, undefined, { math });
      let current = lines;
      for (const e of edits) {
        current = apply(current, e);
        const text = current.join('\n');
        const warm = evaluateSheet(text, previous, { math });
        total++;
        if (evaluationPath(warm) === 'line-edit') taken++;
        expect(observable(warm)).toEqual(observable(evaluateSheet(text, undefined, { math })));
        previous = warm;
      }
    }), runs(0.4));
    expect(taken / total).toBeGreaterThan(0.5);
  });

  it('lines added or removed where no declaration is: exactly the cold result, without re-evaluating', () => {
    const lineEdit = fc.record({
      at: fc.nat(),
      remove: fc.integer({ min: 0, max: 3 }),
      add: fc.array(fc.constantFrom('', '# note', '   ', 'let', 'stub ((', '# ±±', 'x = 1', 'line', '\u00a0'), { maxLength: 3 }),
    });
    let taken = 0;
    let total = 0;
    fc.assert(fc.property(fc.array(lineEdit, { minLength: 1, maxLength: 4 }), (edits) => {
      let previous = evaluateSheet(BASE, undefined, { math });
      let current = lines;
      for (const e of edits) {
        const at = e.at % (current.length + 1);
        current = [...current.slice(0, at), ...e.add, ...current.slice(at + e.remove)];
        const text = current.join('\n');
        const warm = evaluateSheet(text, previous, { math });
        total++;
        if (evaluationPath(warm) === 'line-edit') {
          taken++;
          expect(warm.stats.evaluated).toBe(0);
        }
        expect(observable(warm)).toEqual(observable(evaluateSheet(text, undefined, { math })));
        previous = warm;
      }
    }), runs(0.3));
    expect(taken).toBeGreaterThan(0);
    expect(taken / total).toBeGreaterThan(0.2);
  });

  it('an Enter at the end of a line, then typing a comment there, never takes the full path', () => {
    let previous = evaluateSheet(BASE, undefined, { math });
    let current = [...lines];
    const at = lines.findIndex((l) => l.startsWith('stub tune')) + 1;
    for (const text of ['', '#', '# n', '# no', '# note']) {
      if (text === '') current.splice(at, 0, '');
      else current[at] = text;
      const warm = evaluateSheet(current.join('\n'), previous, { math });
      expect(evaluationPath(warm), JSON.stringify(text)).toBe('line-edit');
      expect(warm.stats.evaluated).toBe(0);
      previous = warm;
    }
    expect(observable(previous)).toEqual(observable(evaluateSheet(current.join('\n'), undefined, { math })));
  });

  it('a let naming a stub that reads the let: the edit ends, each declaration redone at most once, and equals cold', () => {
    // Each reads the other; on the full path the let sees the stub's name before stubs are evaluated.
    const text = 'line l: ideal, z0 50 ohm\nlet x = s1\nstub s1: open on l, length x, at 1 GHz\nlet y = x';
    const edited = text.replace('at 1 GHz', 'at 2 GHz');
    const warm = evaluateSheet(edited, evaluateSheet(text, undefined, { math }), { math });
    expect(evaluationPath(warm)).toBe('line-edit');
    expect(warm.stats.evaluated).toBe(1);
    expect(observable(warm)).toEqual(observable(evaluateSheet(edited, undefined, { math })));
  });

  it('propagates through readers: a let, a substrate, a line and a stub edit re-evaluate exactly what reads them', () => {
    const edit = (from: string, to: string) => {
      const text = BASE.replace(from, to);
      expect(text).not.toBe(BASE);
      const warm = evaluateSheet(text, evaluateSheet(BASE));
      expect(evaluationPath(warm)).toBe('line-edit');
      expect(observable(warm)).toEqual(observable(evaluateSheet(text)));
      return warm.stats.evaluated;
    };
    expect(edit('stub tune: open on feed, capacitance 0.9 pF', 'stub tune: open on feed, capacitance 1.2 pF')).toBe(1);
    expect(edit('let f0 = 2.45 GHz', 'let f0 = 2.40 GHz')).toBeGreaterThan(5);
    expect(edit('line thin: microstrip on board, width 0.4 mm', 'line thin: microstrip on board, width 0.5 mm')).toBeGreaterThanOrEqual(2);
  });

  it('falls back to the full path for a rename, a new line, a new let dependency, or many changed lines', () => {
    const full = (text: string, previous = evaluateSheet(BASE)) => {
      const warm = evaluateSheet(text, previous);
      expect(evaluationPath(warm)).toBe('full');
      expect(observable(warm)).toEqual(observable(evaluateSheet(text)));
    };
    full(BASE.replace('stub tune:', 'stub tuner:'));
    full(BASE.replace('stub tune:', 'stub  tune:'));
    full(BASE.replace('let f0 = 2.45 GHz', 'let f0 = 2.45 GHz\n'));
    full(BASE.replace('let f0 = 2.45 GHz', 'let f0 = band'));
    full(BASE.replace(/ mm/g, ' mil'));
    // An older result is only a cache: patching it would lose the later edit.
    const cold = evaluateSheet(BASE);
    const first = evaluateSheet(BASE.replace('0.9 pF', '1 pF'), cold);
    expect(evaluationPath(first)).toBe('line-edit');
    full(BASE.replace('0.9 pF', '1.1 pF'), cold);
  });
});

