/**
 * Hostile sheets for the fuzz tests: the example sheets mutated (truncated, huge numbers,
 * unbalanced parentheses, unicode, very long lines, CRLF/CR endings, NUL bytes, attack
 * expressions) and random sheets built from the sheet grammar. Shared by the evaluator, service,
 * CLI and server fuzz tests. Test-only.
 *
 * Sizes: `FUZZ_LARGE=1` (set by `npm run fuzz`) allows very long lines (up to 120 000 characters)
 * and longer sheets; the CI run keeps them to a few thousand characters.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import fc from 'fast-check';
import { ATTACK_EXPRESSIONS } from '../sandbox/attacks.js';

/** True under `npm run fuzz`: bigger inputs and more runs. */
export const LARGE = process.env.FUZZ_LARGE === '1';

const EXAMPLES_DIR = fileURLToPath(new URL('../../examples/', import.meta.url));

/** The example sheets, by file name. */
export const EXAMPLES: ReadonlyMap<string, string> = new Map(
  readdirSync(EXAMPLES_DIR)
    .filter((f) => f.endsWith('.rfsheet'))
    .sort()
    .map((f) => [f, readFileSync(EXAMPLES_DIR + f, 'utf8')]),
);

/**
 * Runs for one property: a share of the global run count (FC_RUNS, default 100), at least `min`.
 * Cold evaluations of whole sheets cost milliseconds each, so CI runs a share of the count.
 */
export function runs(share: number, min = 5): { numRuns: number } {
  const total = fc.readConfigureGlobal().numRuns ?? 100;
  return { numRuns: Math.max(min, Math.round(total * share)) };
}

const HUGE_NUMBERS = [
  '1e308', '1e309', '-1e308', '1e-400', '9'.repeat(400), `0.${'0'.repeat(400)}1`, '1e999999', '0', '-0', '1e-324',
  '4.9e-324', '1.7976931348623157e308', 'NaN', 'Infinity', '-Infinity', '0x1F', '1_000', '1,000.5', '2.', '1e6', '1e9', '1e12',
];
const PARENS = ['(', ')', '((', '))', '((((', '))))', '('.repeat(45), ')'.repeat(45), '()', ')(', '(,)', 'sqrt(', 'max(1,'];
const UNICODE = [
  'Ω', 'µ', 'μ', '°', '±', '…', '²', '·', '\u00a0', '\u200b', '\u200d', '\ufeff', '\u202e', '\u0301', '\ud800',
  '\udc00', '\udbff\udfff', '\u{1F600}', '\u{10FFFF}', 'é', 'ß', 'ﬁ', 'Ａ', '١٢٣', '𝟙', '\u2028', '\u2029', '\u0085',
  '\t', '\v', '\f', '\x1b[31m', '\u0000', '\u0000\u0000', '\x7f',
];
const SYNTAX = ['#', ',', ',,', ':', '=', '..', ' .. ', '±', '+/-', '%', ' % ', ' on ', ' on on ', '\\', '"', "'", '`', '$', '@', '{', '}', '[', ']', ';'];
const WORDS = [
  'let', 'substrate', 'line', 'stub', 'short', 'open', 'microstrip', 'stripline', 'cpw', 'gcpw', 'ideal', 'coax',
  'length', 'width', 'z0', 'dk', 'er', 'df', 'height', 'copper', 'at', 'band', 'resonant', 'solution', 'via', 'end',
  'power', 'angle', 'capacitance', 'inductance', 'reactance', 'gap', 'inner', 'outer', 'velocity', 'roughness',
  'conductivity', 'f0', 'board', 'feed', 'thin', 'mm', 'mil', 'um', 'GHz', 'MHz', 'pF', 'nH', 'ohm', 'deg', 'oz',
  'pi', 'e', 'constructor', '__proto__', 'prototype', 'toString', 'valueOf', 'hasOwnProperty', 'undefined', 'null',
];

/** Fragments inserted by mutations. */
export const FRAGMENTS: readonly string[] = [
  ...HUGE_NUMBERS.map((n) => ` ${n}`), ...PARENS, ...UNICODE, ...SYNTAX, ...WORDS.map((w) => ` ${w} `),
  ...ATTACK_EXPRESSIONS.filter((a) => a.length <= 200),
];

/** One edit of a sheet's text. Positions are fractions of the text length, so shrinking stays meaningful. */
export type Mutation =
  | { kind: 'truncate'; at: number }
  | { kind: 'insert'; at: number; text: string }
  | { kind: 'replaceWord'; at: number; text: string }
  | { kind: 'delete'; at: number; count: number }
  | { kind: 'longLine'; at: number; repeat: number; joiner: string }
  | { kind: 'endings'; eol: '\r\n' | '\r' | 'mixed'; seed: number }
  | { kind: 'dropLine'; at: number }
  | { kind: 'duplicateLine'; at: number }
  | { kind: 'swapLines'; a: number; b: number }
  | { kind: 'nul'; at: number };

const frac = fc.double({ min: 0, max: 1, noNaN: true });
const maxLong = LARGE ? 120_000 : 6_000;

/** A mutation of any kind. */
export const mutationArb: fc.Arbitrary<Mutation> = fc.oneof(
  { arbitrary: fc.record({ kind: fc.constant('truncate' as const), at: frac }), weight: 1 },
  { arbitrary: fc.record({ kind: fc.constant('insert' as const), at: frac, text: fc.constantFrom(...FRAGMENTS) }), weight: 5 },
  { arbitrary: fc.record({ kind: fc.constant('insert' as const), at: frac, text: fc.string({ unit: 'binary', maxLength: 8 }) }), weight: 2 },
  { arbitrary: fc.record({ kind: fc.constant('replaceWord' as const), at: frac, text: fc.constantFrom(...FRAGMENTS, '') }), weight: 4 },
  { arbitrary: fc.record({ kind: fc.constant('delete' as const), at: frac, count: fc.integer({ min: 1, max: 40 }) }), weight: 2 },
  {
    arbitrary: fc.record({
      kind: fc.constant('longLine' as const), at: frac,
      repeat: fc.integer({ min: 2, max: maxLong }), joiner: fc.constantFrom('', ' ', ', ', '+', '*', '(', ' mm, ', '#'),
    }),
    weight: 1,
  },
  { arbitrary: fc.record({ kind: fc.constant('endings' as const), eol: fc.constantFrom('\r\n' as const, '\r' as const, 'mixed' as const), seed: fc.nat() }), weight: 1 },
  { arbitrary: fc.record({ kind: fc.constant('dropLine' as const), at: frac }), weight: 1 },
  { arbitrary: fc.record({ kind: fc.constant('duplicateLine' as const), at: frac }), weight: 1 },
  { arbitrary: fc.record({ kind: fc.constant('swapLines' as const), a: frac, b: frac }), weight: 1 },
  { arbitrary: fc.record({ kind: fc.constant('nul' as const), at: frac }), weight: 1 },
);

const pos = (length: number, at: number) => Math.min(length, Math.floor(at * (length + 1)));
const SPLIT = /\r\n|\r|\n/;

/** Applies one mutation (pure). */
export function mutate(text: string, m: Mutation): string {
  switch (m.kind) {
    case 'truncate':
      return text.slice(0, pos(text.length, m.at));
    case 'insert': {
      const i = pos(text.length, m.at);
      return text.slice(0, i) + m.text + text.slice(i);
    }
    case 'nul': {
      const i = pos(text.length, m.at);
      return `${text.slice(0, i)}\u0000${text.slice(i)}`;
    }
    case 'delete': {
      const i = pos(text.length, m.at);
      return text.slice(0, i) + text.slice(i + m.count);
    }
    case 'replaceWord': {
      const words = [...text.matchAll(/[A-Za-z_0-9.]+/g)];
      if (words.length === 0) return text + m.text;
      const w = words[Math.min(words.length - 1, Math.floor(m.at * words.length))]!;
      return text.slice(0, w.index) + m.text + text.slice(w.index + w[0].length);
    }
    case 'longLine': {
      const lines = text.split('\n');
      const i = Math.min(lines.length - 1, Math.floor(m.at * lines.length));
      const base = lines[i]!.trim() === '' ? 'let x = 1 mm' : lines[i]!;
      const unit = base.length > 40 ? base.slice(0, 40) : base;
      // Repeat until the line is about `repeat` characters long (bounded by maxLong).
      const count = Math.max(2, Math.ceil(m.repeat / (unit.length + m.joiner.length)));
      lines[i] = Array.from({ length: count }, () => unit).join(m.joiner);
      return lines.join('\n');
    }
    case 'endings': {
      if (m.eol !== 'mixed') return text.replace(/\r\n|\r|\n/g, m.eol);
      let k = m.seed;
      return text.replace(/\r\n|\r|\n/g, () => ['\n', '\r\n', '\r'][(k = (k * 1103515245 + 12345) >>> 0) % 3]!);
    }
    case 'dropLine': {
      const lines = text.split(SPLIT);
      lines.splice(Math.min(lines.length - 1, Math.floor(m.at * lines.length)), 1);
      return lines.join('\n');
    }
    case 'duplicateLine': {
      const lines = text.split(SPLIT);
      const i = Math.min(lines.length - 1, Math.floor(m.at * lines.length));
      lines.splice(i, 0, lines[i]!);
      return lines.join('\n');
    }
    case 'swapLines': {
      const lines = text.split(SPLIT);
      const a = Math.min(lines.length - 1, Math.floor(m.a * lines.length));
      const b = Math.min(lines.length - 1, Math.floor(m.b * lines.length));
      [lines[a], lines[b]] = [lines[b]!, lines[a]!];
      return lines.join('\n');
    }
  }
}

/** An example sheet with 1–6 mutations; the name and mutations travel along for failure reports. */
export const mutatedExampleArb = fc
  .tuple(fc.constantFrom(...EXAMPLES.keys()), fc.array(mutationArb, { minLength: 1, maxLength: 6 }))
  .map(([name, mutations]) => ({ name, mutations, text: mutations.reduce(mutate, EXAMPLES.get(name)!) }));

// --- random sheets from the grammar -------------------------------------------------------------

const NAMES = ['a', 'b', 'f0', 'band', 'board', 'core', 'feed', 'thin', 'choke', 'x1', 'end', 'pi', 'mm', 'H', 'constructor', '__proto__', 'toString'];
const UNITS = ['', ' mm', ' um', ' µm', ' mil', ' in', ' GHz', ' MHz', ' Hz', ' pF', ' nH', ' ohm', ' Ω', ' deg', ' °', ' oz', ' W', ' mW', ' S/m', ' %', ' m'];

const numberArb = fc.oneof(
  fc.constantFrom(...HUGE_NUMBERS),
  fc.double({ noNaN: false }).map((x) => String(x)),
  fc.integer({ min: -1000, max: 1000 }).map(String),
  fc.double({ min: 0.001, max: 100, noNaN: true }).map((x) => x.toPrecision(3)),
);

/** A value expression: numbers, units, names, operators, functions, sometimes broken. */
export const exprArb: fc.Arbitrary<string> = fc.letrec<{ expr: string }>((tie) => ({
  expr: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    fc.tuple(numberArb, fc.constantFrom(...UNITS)).map(([n, u]) => n + u),
    fc.constantFrom(...NAMES),
    fc.tuple(tie('expr'), fc.constantFrom(' + ', ' - ', '*', ' / ', '^', ' .. ', ' ± ', ' to ', ' ', ','), tie('expr')).map(([a, op, b]) => a + op + b),
    tie('expr').map((e) => `(${e})`),
    fc.tuple(fc.constantFrom('sqrt', 'sin', 'max', 'log', 'f', 'import', 'evaluate', 'zeros', 'constructor'), tie('expr')).map(([f, e]) => `${f}(${e})`),
    fc.constantFrom(...ATTACK_EXPRESSIONS.filter((a) => a.length <= 80)),
  ),
})).expr;

const itemArb = fc.oneof(
  fc.tuple(fc.constantFrom(...WORDS.slice(6, 40)), exprArb).map(([k, v]) => `${k} ${v}`),
  fc.constantFrom('resonant', 'end ideal', 'solution 2', 'solution 0', 'solution 1e9', 'copper 1 oz', 'band band'),
  fc.string({ maxLength: 10 }),
);
const items = fc.array(itemArb, { maxLength: 6 }).map((xs) => xs.join(', '));

/** One random line of a sheet. */
export const grammarLineArb: fc.Arbitrary<string> = fc.oneof(
  fc.tuple(fc.constantFrom(...NAMES), exprArb).map(([n, e]) => `let ${n} = ${e}`),
  fc.tuple(fc.constantFrom(...NAMES), items).map(([n, i]) => `substrate ${n}: ${i}`),
  fc.tuple(fc.constantFrom(...NAMES), fc.constantFrom('microstrip', 'stripline', 'cpw', 'gcpw', 'ideal', 'coax', 'wire', ''), fc.constantFrom(...NAMES), items)
    .map(([n, t, on, i]) => `line ${n}: ${t} on ${on}${i ? `, ${i}` : ''}`),
  fc.tuple(fc.constantFrom(...NAMES), fc.constantFrom('short', 'open', 'shorted', ''), fc.constantFrom(...NAMES), items)
    .map(([n, k, on, i]) => `stub ${n}: ${k} on ${on}${i ? `, ${i}` : ''}`),
  fc.string({ maxLength: 30 }).map((s) => `# ${s}`),
  fc.constant(''),
  fc.string({ unit: 'binary', maxLength: 30 }),
);

/** A random sheet of up to 25 lines with mixed line endings. */
export const grammarSheetArb: fc.Arbitrary<string> = fc
  .array(fc.tuple(grammarLineArb, fc.constantFrom('\n', '\r\n', '\r')), { minLength: 1, maxLength: LARGE ? 60 : 25 })
  .map((parts) => parts.map(([l, eol]) => l + eol).join(''));

/** Either kind of hostile sheet, as text. */
export const hostileSheetArb: fc.Arbitrary<string> = fc.oneof(
  { arbitrary: mutatedExampleArb.map((m) => m.text), weight: 3 },
  { arbitrary: grammarSheetArb, weight: 2 },
);

/** Lines as the evaluator and LSP split them. */
export const linesOf = (text: string): string[] => text.split(SPLIT);
