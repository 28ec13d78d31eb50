/**
 * The sheet evaluator: text in, results / diagnostics / symbols out, incrementally.
 *
 * Each line is parsed once per distinct text; each expression compiled once per distinct text;
 * each declaration re-evaluated only when its text or something it read (a let, a substrate, a
 * line) changed since the previous call. Pass the previous SheetResult back as `previous`.
 * Never throws: every problem becomes a located diagnostic.
 */
import { compileExpression, createSafeMath, splitRange, splitTolerance, type CompileResult, type SafeMath } from './expr/index.js';
import { evalLet, evalLine, evalSubstrate } from './eval/declarations.js';
import type { Outcome } from './eval/outcome.js';
import { evalStub } from './eval/stub.js';
import type { LetValue, SheetScope } from './eval/values.js';
import { parseLine, type LocalDiagnostic, type ParsedDeclaration, type ParsedLine } from './parse/lineParser.js';
import type { EntryKind, Range, SheetDiagnostic, SheetEntry, SheetOptions, SheetResult, SheetSymbol } from './types.js';
import type { Value } from './expr/index.js';

export const DEFAULT_MARGIN_PCT = 10;

/**
 * Longest sheet evaluated, in UTF-16 code units (1 Mi, the command line's byte limit). A design
 * note is kilobytes; a megabyte of declarations already takes seconds, so a larger text (a stray
 * log or data file opened in the editor) gets one `limit` diagnostic instead of stalling the server.
 */
export const MAX_SHEET_LENGTH = 1024 * 1024;

interface CachedOutcome {
  outcome: Outcome;
  stamp: number;
  /** Stamp of every name read at evaluation time (negative: not evaluated yet, see UNEVALUATED). */
  readStamps: Map<string, number>;
  /** The assembled entry for the line it last stood on (reused while it stays there). */
  view?: SheetEntry;
}

interface Cache {
  math: SafeMath;
  /** Names each let value text mentions (for the dependency order), per value text. */
  letReads?: Map<string, string[]>;
  compiled: Map<string, CompileResult>;
  parsed: Map<string, ParsedEntry>;
  outcomes: Map<string, CachedOutcome>;
  nextStamp: number;
}

interface Decl {
  line: number;
  decl: ParsedDeclaration;
  key: string;
}

const LINE_BREAK = /\r\n|\r|\n/;

/** Read stamps of names that have no evaluation (yet) in this call, by declared kind. */
const UNEVALUATED: Record<EntryKind | 'undeclared', number> = { undeclared: -1, let: -2, substrate: -3, line: -4, stub: -5 };

/** A parsed line and its evaluation-cache key (kind + text without comment), computed once per text. */
interface ParsedEntry {
  parsed: ParsedLine;
  key: string;
}

function parseEntry(lineText: string): ParsedEntry {
  const parsed = parseLine(lineText);
  return { parsed, key: parsed.declaration ? `${parsed.declaration.kind}\u0000${lineText.split('#')[0]!.trimEnd()}` : '' };
}

function newCache(math?: SafeMath): Cache {
  return { math: math ?? createSafeMath(), compiled: new Map(), parsed: new Map(), outcomes: new Map(), nextStamp: 1 };
}

/** Evaluates a whole sheet, reusing everything unchanged since `previous`. */
export function evaluateSheet(text: string, previous?: SheetResult, options: SheetOptions = {}): SheetResult {
  const marginPct = options.marginPct ?? DEFAULT_MARGIN_PCT;
  const cache = (previous?.cache as Cache | undefined) ?? newCache(options.math);
  if (text.length > MAX_SHEET_LENGTH) return tooLong(text, cache);
  const lines = text.split(LINE_BREAK);
  const diagnostics: SheetDiagnostic[] = [];
  const at = (line: number, d: LocalDiagnostic) => diagnostics.push(toSheetDiagnostic(line, clampToLine(d, lines[line]!.length), declRange));

  // 1. Parse (cached per line text) and collect declarations; the first of each name wins.
  const parsed = new Map<string, ParsedEntry>();
  const decls: Decl[] = [];
  const byName = new Map<string, Decl>();
  for (const [i, lineText] of lines.entries()) {
    const entry = parsed.get(lineText) ?? cache.parsed.get(lineText) ?? parseEntry(lineText);
    parsed.set(lineText, entry);
    const p = entry.parsed;
    for (const e of p.errors) at(i, e);
    if (!p.declaration) continue;
    const d: Decl = { line: i, decl: p.declaration, key: entry.key };
    const first = byName.get(d.decl.name.text);
    if (first) {
      at(i, {
        start: d.decl.name.start, end: d.decl.name.end, severity: 'error', code: 'duplicate-name',
        message: `${d.decl.name.text} is already declared on line ${first.line + 1}: rename one of them`,
        related: [{ name: d.decl.name.text, message: 'first declared here' }],
      });
      continue;
    }
    byName.set(d.decl.name.text, d);
    decls.push(d);
  }
  cache.parsed = parsed;
  function declRange(name: string): Range | undefined {
    const d = byName.get(name);
    return d ? rangeOf(d.line, d.decl.name.start, d.decl.name.end) : undefined;
  }

  // 2. Scope shared by all declarations, filled as they evaluate.
  const usedExpr = new Map<string, CompileResult>();
  const compile = (t: string) => {
    let c = usedExpr.get(t) ?? cache.compiled.get(t);
    if (!c) c = compileExpression(t, cache.math);
    usedExpr.set(t, c);
    return c;
  };
  const kinds = new Map<string, EntryKind>(decls.map((d) => [d.decl.name.text, d.decl.kind]));
  const scope: SheetScope = { math: cache.math, compile, scalars: new Map<string, Value>(), lets: new Map<string, LetValue>(), kinds };
  const stamps = new Map<string, number>();
  const outcomes = new Map<string, Outcome>();
  const nextOutcomes = new Map<string, CachedOutcome>();
  const stats = { evaluated: 0, reused: 0 };
  const entriesOf = new Map<string, CachedOutcome>();

  const run = (d: Decl, fresh: () => Outcome, extraKey = '') => {
    const key = d.key + extraKey;
    const cached = cache.outcomes.get(key);
    // A name not evaluated yet (declared further on in evaluation order, or a let in a cycle) stands
    // for its kind: the messages about it ("l is a line, not a value") depend on the kind alone.
    const current = (n: string) => stamps.get(n) ?? UNEVALUATED[kinds.get(n) ?? 'undeclared'];
    let entry: CachedOutcome;
    if (cached && stampsMatch(cached.readStamps, current)) {
      entry = cached;
      stats.reused++;
    } else {
      let outcome: Outcome;
      try {
        outcome = fresh();
      } catch (e) {
        outcome = internalFailure(d, e);
      }
      entry = { outcome, stamp: cache.nextStamp++, readStamps: new Map([...outcome.reads].map((n) => [n, current(n)])) };
      stats.evaluated++;
    }
    nextOutcomes.set(key, entry);
    stamps.set(d.decl.name.text, entry.stamp);
    outcomes.set(d.decl.name.text, entry.outcome);
    entriesOf.set(d.decl.name.text, entry);
    return entry.outcome;
  };

  // 3. Lets in dependency order; cycles are reported and left unevaluated.
  const lets = decls.filter((d) => d.decl.kind === 'let');
  const previousReads = cache.letReads ?? new Map<string, string[]>();
  const usedReads = new Map<string, string[]>();
  const readsOf = (d: Decl) => {
    const text = d.decl.value?.text ?? '';
    let names = usedReads.get(text) ?? previousReads.get(text);
    if (!names) names = letReads(d, compile);
    usedReads.set(text, names);
    return names;
  };
  const { order, cyclic } = orderLets(lets, readsOf);
  cache.letReads = usedReads;
  for (const [name, path] of cyclic) {
    const d = byName.get(name)!;
    at(d.line, { start: d.decl.name.start, end: d.decl.name.end, severity: 'error', code: 'cycle', message: `${name} depends on itself: ${path.join(' → ')}; break the loop with a plain value` });
  }
  for (const d of order) {
    const o = run(d, () => evalLet(d.decl, scope));
    if (o.letValue) {
      scope.lets.set(d.decl.name.text, o.letValue);
      if (o.letValue.type === 'scalar') scope.scalars.set(d.decl.name.text, o.letValue.value);
    }
  }
  // 4. Substrates, then lines, then stubs: each kind stands only on the kinds before it.
  const resolved = {
    substrate: (n: string) => (kinds.get(n) === 'substrate' ? outcomes.get(n) : undefined),
    line: (n: string) => (kinds.get(n) === 'line' ? outcomes.get(n) : undefined),
  };
  for (const d of decls) if (d.decl.kind === 'substrate') run(d, () => evalSubstrate(d.decl, scope));
  for (const d of decls) if (d.decl.kind === 'line') run(d, () => evalLine(d.decl, scope, resolved));
  for (const d of decls) if (d.decl.kind === 'stub') run(d, () => evalStub(d.decl, scope, resolved, marginPct), `\u0000${marginPct}`);

  cache.outcomes = nextOutcomes;
  cache.compiled = usedExpr;

  // 5. Assemble entries, diagnostics and symbols with absolute positions.
  const symbols = new Map<string, SheetSymbol>();
  for (const d of decls) {
    symbols.set(d.decl.name.text, { name: d.decl.name.text, kind: d.decl.kind, declaration: rangeOf(d.line, d.decl.name.start, d.decl.name.end), references: [] });
  }
  const entries: SheetEntry[] = [];
  for (const d of decls) {
    const o = outcomes.get(d.decl.name.text);
    if (!o) continue;
    for (const diag of o.diagnostics) at(d.line, diag);
    for (const r of o.references) symbols.get(r.name)?.references.push(rangeOf(d.line, r.start, r.end));
    const cached = entriesOf.get(d.decl.name.text)!;
    if (cached.view?.line !== d.line) {
      cached.view = {
        line: d.line, kind: d.decl.kind, name: d.decl.name.text,
        nameRange: rangeOf(d.line, d.decl.name.start, d.decl.name.end),
        range: rangeOf(d.line, d.decl.span.start, d.decl.span.end),
        results: o.results, details: o.details,
        synthesized: o.synthesized.map((s) => ({ key: s.key, valueSI: s.valueSI, range: rangeOf(d.line, s.start, s.end) })),
      };
    }
    entries.push(cached.view);
  }
  for (const d of decls) if (!outcomes.has(d.decl.name.text)) {
    entries.push({ line: d.line, kind: d.decl.kind, name: d.decl.name.text, nameRange: rangeOf(d.line, d.decl.name.start, d.decl.name.end), range: rangeOf(d.line, d.decl.span.start, d.decl.span.end), results: {}, details: [], synthesized: [] });
  }
  entries.sort((a, b) => a.line - b.line);
  diagnostics.sort((a, b) => a.range.start.line - b.range.start.line || a.range.start.character - b.range.start.character);
  return { entries, diagnostics, symbols, stats, cache };
}

/** The result for a text over MAX_SHEET_LENGTH: nothing evaluated, one diagnostic on the first line. */
function tooLong(text: string, cache: Cache): SheetResult {
  const first = LINE_BREAK.exec(text)?.index ?? text.length;
  const diagnostic: SheetDiagnostic = {
    range: rangeOf(0, 0, Math.min(first, 1)), severity: 'error', code: 'limit',
    message: `sheet longer than ${MAX_SHEET_LENGTH} characters (${text.length}): nothing was evaluated; split it into smaller sheets`,
  };
  return { entries: [], diagnostics: [diagnostic], symbols: new Map(), stats: { evaluated: 0, reused: 0 }, cache };
}

/**
 * Keeps a diagnostic inside its line: a problem found at the end of a line ("the line ends", an
 * empty value after "±") is reported one column past it, which is moved back onto the last character.
 */
function clampToLine(d: LocalDiagnostic, length: number): LocalDiagnostic {
  if (d.end <= length) return d;
  const end = length;
  return { ...d, start: Math.min(d.start, Math.max(0, end - 1)), end };
}

function stampsMatch(readStamps: Map<string, number>, current: (name: string) => number): boolean {
  for (const [name, stamp] of readStamps) if (current(name) !== stamp) return false;
  return true;
}

const rangeOf = (line: number, start: number, end: number): Range => ({ start: { line, character: start }, end: { line, character: end } });

function toSheetDiagnostic(line: number, d: LocalDiagnostic, declRange: (name: string) => Range | undefined): SheetDiagnostic {
  const out: SheetDiagnostic = { range: rangeOf(line, d.start, d.end), severity: d.severity, code: d.code, message: d.message };
  const related = (d.related ?? []).flatMap((r) => {
    const range = declRange(r.name);
    return range ? [{ range, message: r.message }] : [];
  });
  if (related.length > 0) out.related = related;
  if (d.data) out.data = d.data;
  return out;
}

function internalFailure(d: Decl, e: unknown): Outcome {
  const message = e instanceof Error ? e.message : String(e);
  return {
    results: {}, details: [], synthesized: [], reads: new Set(), references: [],
    diagnostics: [{ start: d.decl.name.start, end: d.decl.name.end, severity: 'error', code: 'limit', message: `could not evaluate ${d.decl.name.text}: ${message}` }],
  };
}

/** Names a let's value text mentions (all parts of a range or tolerance). */
function letReads(d: Decl, compile: (t: string) => CompileResult): string[] {
  const text = d.decl.value?.text ?? '';
  const range = splitRange(text);
  const parts = range ? [range.low.text, range.high.text] : (() => {
    const t = splitTolerance(text);
    return t.tolerance ? [t.nominal.text, t.tolerance.text] : [t.nominal.text];
  })();
  return parts.flatMap((p) => {
    const c = compile(p);
    return c.ok ? c.names.map((n) => n.name) : [];
  });
}

/** Topological order of lets (Tarjan's strongly connected components); members of cycles are split out. */
function orderLets(lets: Decl[], readsOf: (d: Decl) => string[]): { order: Decl[]; cyclic: Map<string, string[]> } {
  const byName = new Map(lets.map((d) => [d.decl.name.text, d]));
  const edges = new Map(lets.map((d) => [d.decl.name.text, readsOf(d).filter((n) => byName.has(n))]));
  const index = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const onStack = new Set<string>();
  const order: Decl[] = [];
  const cyclic = new Map<string, string[]>();
  let counter = 0;
  const visit = (v: string): void => {
    index.set(v, counter);
    low.set(v, counter++);
    stack.push(v);
    onStack.add(v);
    for (const w of edges.get(v)!) {
      if (!index.has(w)) {
        visit(w);
        low.set(v, Math.min(low.get(v)!, low.get(w)!));
      } else if (onStack.has(w)) low.set(v, Math.min(low.get(v)!, index.get(w)!));
    }
    if (low.get(v) !== index.get(v)) return;
    const component: string[] = [];
    let w: string;
    do {
      w = stack.pop()!;
      onStack.delete(w);
      component.push(w);
    } while (w !== v);
    if (component.length > 1 || edges.get(v)!.includes(v)) {
      const loop = [...component].reverse();
      for (const n of component) cyclic.set(n, [...loop.slice(loop.indexOf(n)), ...loop.slice(0, loop.indexOf(n)), n]);
    } else order.push(byName.get(v)!);
  };
  for (const d of lets) if (!index.has(d.decl.name.text)) visit(d.decl.name.text);
  return { order, cyclic };
}
