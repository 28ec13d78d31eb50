/**
 * What must hold for any sheet, however hostile: checked by every fuzz test. Test-only.
 *
 * - every diagnostic (and related location, entry and name range) lies on one existing line,
 *   inside it, with a stable code, a severity and a short, non-empty message;
 * - every line that holds something other than blanks and a comment gets results or a located
 *   diagnostic on that line (or stands on a failed declaration whose line has one: errors are
 *   reported once, at their source); blank and comment-only lines get no diagnostic (unless longer than
 *   the parser's line limit, which refuses any line);
 * - results are JSON-safe (finite numbers, strings, booleans or null).
 */
import { expect } from 'vitest';
import { MAX_SHEET_LENGTH } from '../../shared-core/src/sheet/evaluate.js';
import type { SafeMath } from '../../shared-core/src/sheet/expr/index.js';
import { MAX_LINE_LENGTH } from '../../shared-core/src/sheet/parse/lineParser.js';
import type { SheetResult } from '../../shared-core/src/sheet/types.js';
import { linesOf } from './hostile.js';

export const CODES = [
  'syntax', 'unknown-name', 'duplicate-name', 'unit', 'missing', 'conflict', 'range', 'model-validity',
  'near-resonance', 'resonance-in-band', 'detuned', 'cycle', 'limit', 'power',
];

/** Longest diagnostic message accepted, besides the text of its own line that it may quote. */
export const MAX_MESSAGE = 400;

interface LineRange {
  start: { line: number; character: number };
  end: { line: number; character: number };
}

/** Asserts that `r` lies on one existing line of `lines`, inside it. */
export function expectOnLine(lines: readonly string[], r: LineRange, what: string): void {
  const line = lines[r.start.line];
  expect(line, `${what}: line ${r.start.line} exists`).toBeDefined();
  expect(r.end.line, `${what}: one line`).toBe(r.start.line);
  expect(r.start.character, what).toBeGreaterThanOrEqual(0);
  expect(r.start.character, what).toBeLessThanOrEqual(r.end.character);
  expect(r.end.character, what).toBeLessThanOrEqual(line!.length);
}

/** The code part of a line (before the first `#`), as the parser sees it. */
export const codeOf = (line: string): string => {
  const hash = line.indexOf('#');
  return hash >= 0 ? line.slice(0, hash) : line;
};

/** Asserts every invariant of the module comment. */
export function expectSound(text: string, result: SheetResult): void {
  const lines = linesOf(text);
  if (text.length > MAX_SHEET_LENGTH) {
    // Too long to evaluate at all: one `limit` diagnostic on the first line stands for every line.
    expect(result.diagnostics.map((d) => [d.code, d.range.start.line])).toEqual([['limit', 0]]);
    expect(result.entries).toEqual([]);
    return;
  }
  const diagnosed = new Set<number>();
  for (const d of result.diagnostics) {
    const what = `${d.code} "${d.message.slice(0, 80)}"`;
    expectOnLine(lines, d.range, what);
    if (lines[d.range.start.line]!.length > 0) expect(d.range.end.character, `${what} covers at least one character`).toBeGreaterThan(d.range.start.character);
    expect(CODES, what).toContain(d.code);
    expect(['error', 'warning', 'info'], what).toContain(d.severity);
    expect(d.message.trim().length, what).toBeGreaterThan(0);
    expect(d.message.length, what).toBeLessThanOrEqual(MAX_MESSAGE + lines[d.range.start.line]!.length);
    for (const r of d.related ?? []) expectOnLine(lines, r.range, `related of ${what}`);
    diagnosed.add(d.range.start.line);
  }
  const withResults = new Set<number>();
  for (const e of result.entries) {
    expectOnLine(lines, e.range, `entry ${e.name}`);
    expectOnLine(lines, e.nameRange, `name of ${e.name}`);
    expect(lines[e.line]!.slice(e.nameRange.start.character, e.nameRange.end.character)).toBe(e.name);
    for (const s of e.synthesized) expectOnLine(lines, s.range, `synthesized ${s.key} of ${e.name}`);
    for (const [k, v] of Object.entries(e.results)) {
      const ok = v === null || typeof v === 'string' || typeof v === 'boolean' || (typeof v === 'number' && Number.isFinite(v));
      expect(ok, `${e.name}.${k} = ${String(v)} is JSON-safe`).toBe(true);
    }
    if (Object.keys(e.results).length > 0) withResults.add(e.line);
  }
  // Errors are reported once, at their source: a declaration that stands on a failed one (a let
  // that reads a broken let) stays silent, so a silent line must reference a failed declaration
  // whose own line is explained, and so on back to a line that carries the diagnostic.
  const referencedBy = new Map<number, number[]>();
  for (const s of result.symbols.values()) {
    for (const r of s.references) {
      const list = referencedBy.get(r.start.line) ?? [];
      list.push(s.declaration.start.line);
      referencedBy.set(r.start.line, list);
    }
  }
  const isExplained = (i: number, seen: Set<number>): boolean => {
    if (withResults.has(i) || diagnosed.has(i)) return true;
    if (seen.has(i)) return false;
    seen.add(i);
    return (referencedBy.get(i) ?? []).some((j) => j !== i && !withResults.has(j) && isExplained(j, seen));
  };
  lines.forEach((line, i) => {
    // Lines over the parser's limit are refused as a whole, comments included (a `limit` diagnostic).
    const blank = line.length <= MAX_LINE_LENGTH && codeOf(line).trim() === '';
    if (blank) {
      expect(diagnosed.has(i), `blank or comment line ${i + 1} has no diagnostic: ${JSON.stringify(line.slice(0, 80))}`).toBe(false);
    } else {
      expect(isExplained(i, new Set()), `line ${i + 1} gets results or a diagnostic: ${JSON.stringify(line.slice(0, 120))}`).toBe(true);
    }
  });
}

/** Counts the work the expression parser is given (calls and characters). */
export interface ParseMeter {
  math: SafeMath;
  calls: number;
  chars: number;
  longest: number;
  reset(): void;
}

/** Wraps a SafeMath so that every `parse` is counted. */
export function meter(inner: SafeMath): ParseMeter {
  const m: ParseMeter = {
    calls: 0, chars: 0, longest: 0,
    math: Object.freeze({
      ...inner,
      parse: (t: string) => {
        m.calls++;
        m.chars += t.length;
        m.longest = Math.max(m.longest, t.length);
        return inner.parse(t);
      },
    }),
    reset() {
      m.calls = 0;
      m.chars = 0;
      m.longest = 0;
    },
  };
  return m;
}

/**
 * Upper bound on the parser's work for a cold evaluation of `text`: each line of at most 4 000
 * characters is split into items at commas; each item value into at most 3 parts (a range or a
 * tolerance), each spelled with at most 3 times as many characters (`Ω` → `ohm`), each parsed once.
 */
export function parseBudget(text: string): { calls: number; chars: number } {
  let calls = 0;
  let chars = 0;
  for (const line of linesOf(text)) {
    if (line.length > MAX_LINE_LENGTH) continue;
    const code = codeOf(line);
    if (code.trim() === '') continue;
    calls += 3 * (code.split(',').length + 1);
    chars += 9 * code.length;
  }
  return { calls, chars };
}
