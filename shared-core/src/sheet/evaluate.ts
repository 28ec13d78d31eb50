/**
 * The sheet evaluator: text in, results / diagnostics / symbols out, incrementally.
 *
 * Each line is parsed once per distinct text; each expression compiled once per distinct text;
 * each declaration re-evaluated only when its text or something it read (a let, a substrate, a
 * line) changed since the previous call. Pass the previous SheetResult back as `previous`.
 * Never throws: every problem becomes a located diagnostic.
 *
 * Two paths give the same result (the incremental tests compare both with a cold evaluation):
 * - the full path walks every line: parse lookups, evaluation order, and assembly of entries,
 *   diagnostics and symbols, reusing each declaration whose text and reads are unchanged;
 * - the line-edit path (evaluateLineEdit) serves the common keystroke: the same number of lines,
 *   a few lines changed, no declaration renamed, moved or added and no let's dependencies changed.
 *   It re-evaluates the edited declarations and, transitively, their readers, and patches the
 *   previous result, so its cost follows the edit, not the sheet's length. Anything else falls
 *   back to the full path.
 */
import { compileExpression, createSafeMath, splitRange, splitTolerance, type CompileResult, type SafeMath } from './expr/index.js';
import { evalLet, evalLine, evalSubstrate } from './eval/declarations.js';
import type { Outcome } from './eval/outcome.js';
import type { EntryModel } from './eval/models.js';
import { evalStub } from './eval/stub.js';
import { evalSweep } from './eval/sweep.js';
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
  /** Its key in Cache.outcomes (declaration text, plus the margin for stubs and sweeps). */
  key: string;
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
  /** What the line-edit path needs of the last evaluation; valid only for `last.owner`. */
  last?: SheetState;
}

/** The last evaluation's working state, kept so a small edit can patch it (see the header). */
interface SheetState {
  owner: SheetResult;
  /** Which path produced `owner`. */
  path: 'full' | 'line-edit';
  marginPct: number;
  lines: string[];
  byName: Map<string, Decl>;
  kinds: Map<string, EntryKind>;
  scope: SheetScope;
  stamps: Map<string, number>;
  outcomes: Map<string, Outcome>;
  entriesOf: Map<string, CachedOutcome>;
  /** The lets in evaluation (dependency) order, and each one's position in it. */
  letOrder: string[];
  letRank: Map<string, number>;
  cyclic: Set<string>;
  /** For each name, the declarations whose evaluation read it. */
  readers: Map<string, Set<string>>;
  entries: SheetEntry[];
  entryIndex: Map<string, number>;
  diagnostics: SheetDiagnostic[];
  symbols: Map<string, SheetSymbol>;
  models: Map<string, EntryModel>;
}

/** Evaluation order of the kinds: each kind reads only the kinds before it (and lets). */
const KIND_RANK: Record<EntryKind, number> = { let: 0, substrate: 1, line: 2, stub: 3, sweep: 4 };

/** More changed lines than this in one call take the full path (a paste, a search-and-replace). */
const MAX_EDITED_LINES = 16;


interface Decl {
  line: number;
  decl: ParsedDeclaration;
  key: string;
}

const LINE_BREAK = /\r\n|\r|\n/;

/** Read stamps of names that have no evaluation (yet) in this call, by declared kind. */
const UNEVALUATED: Record<EntryKind | 'undeclared', number> = { undeclared: -1, let: -2, substrate: -3, line: -4, stub: -5, sweep: -6 };

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
  const last = cache.last;
  if (last && last.owner === previous && last.marginPct === marginPct) {
    const patched = evaluateLineEdit(cache, last, lines);
    if (patched) return patched;
  }
  return evaluateFull(cache, lines, marginPct);
}

/**
 * Which path produced a result (see the header): for tests and the benchmark. Undefined once a
 * later evaluation has taken over the result's cache.
 */
export function evaluationPath(result: SheetResult): 'full' | 'line-edit' | undefined {
  const last = (result.cache as Cache | undefined)?.last;
  return last?.owner === result ? last.path : undefined;
}

/** The evaluation of one declaration, by kind (the kinds before it are already in `outcomes`). */
function evaluator(d: Decl, scope: SheetScope, kinds: Map<string, EntryKind>, outcomes: Map<string, Outcome>, marginPct: number): { fresh: () => Outcome; extraKey: string } {
  const of = (kind: EntryKind) => (n: string) => (kinds.get(n) === kind ? outcomes.get(n) : undefined);
  const resolved = { substrate: of('substrate'), line: of('line') };
  switch (d.decl.kind) {
    case 'let': return { fresh: () => evalLet(d.decl, scope), extraKey: '' };
    case 'substrate': return { fresh: () => evalSubstrate(d.decl, scope), extraKey: '' };
    case 'line': return { fresh: () => evalLine(d.decl, scope, resolved), extraKey: '' };
    case 'stub': return { fresh: () => evalStub(d.decl, scope, resolved, marginPct), extraKey: `\u0000${marginPct}` };
    case 'sweep': return { fresh: () => evalSweep(d.decl, scope, { ...resolved, stub: of('stub') }, marginPct), extraKey: `\u0000${marginPct}` };
  }
}

/**
 * Runs (or reuses) one declaration's evaluation and records it in the state's maps. Reuse needs
 * the same text and the same stamp on every name it read.
 */
function makeRunner(cache: Cache, st: Pick<SheetState, 'stamps' | 'kinds' | 'outcomes' | 'entriesOf' | 'scope'>, nextOutcomes: Map<string, CachedOutcome>, stats: { evaluated: number; reused: number }, marginPct: number) {
  // A name not evaluated yet (declared further on in evaluation order, or a let in a cycle) stands
  // for its kind: the messages about it ("l is a line, not a value") depend on the kind alone.
  const current = (n: string) => st.stamps.get(n) ?? UNEVALUATED[st.kinds.get(n) ?? 'undeclared'];
  return (d: Decl): CachedOutcome => {
    const { fresh, extraKey } = evaluator(d, st.scope, st.kinds, st.outcomes, marginPct);
    const key = d.key + extraKey;
    const cached = cache.outcomes.get(key);
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
      entry = { outcome, key, stamp: cache.nextStamp++, readStamps: new Map([...outcome.reads].map((n) => [n, current(n)])) };
      stats.evaluated++;
    }
    nextOutcomes.set(key, entry);
    const name = d.decl.name.text;
    st.stamps.set(name, entry.stamp);
    st.outcomes.set(name, entry.outcome);
    st.entriesOf.set(name, entry);
    if (d.decl.kind === 'let') {
      const v = entry.outcome.letValue;
      if (v) st.scope.lets.set(name, v);
      else st.scope.lets.delete(name);
      if (v?.type === 'scalar') st.scope.scalars.set(name, v.value);
      else st.scope.scalars.delete(name);
    }
    return entry;
  };
}

/** The entry shown for a declaration on line `d.line`, built once per placement of its outcome. */
function viewOf(d: Decl, cached: CachedOutcome): SheetEntry {
  if (cached.view?.line !== d.line) {
    const o = cached.outcome;
    cached.view = {
      line: d.line, kind: d.decl.kind, name: d.decl.name.text,
      nameRange: rangeOf(d.line, d.decl.name.start, d.decl.name.end),
      range: rangeOf(d.line, d.decl.span.start, d.decl.span.end),
      results: o.results, details: o.details,
      synthesized: o.synthesized.map((s) => ({ key: s.key, valueSI: s.valueSI, range: rangeOf(d.line, s.start, s.end) })),
    };
  }
  return cached.view;
}

function modelOf(o: Outcome): EntryModel | undefined {
  if (o.line) return { kind: 'line', line: o.line, frequencyHz: typeof o.results.frequency_hz === 'number' ? o.results.frequency_hz : null };
  if (o.stub) return { kind: 'stub', stub: o.stub };
  if (o.sweep) return { kind: 'sweep', sweep: o.sweep };
  return undefined;
}

function addReader(readers: Map<string, Set<string>>, read: string, reader: string): void {
  let set = readers.get(read);
  if (!set) readers.set(read, (set = new Set()));
  set.add(reader);
}

const byPosition = (a: SheetDiagnostic, b: SheetDiagnostic) => a.range.start.line - b.range.start.line || a.range.start.character - b.range.start.character;

/** The full path: every line looked at, every declaration evaluated or reused. */
function evaluateFull(cache: Cache, lines: string[], marginPct: number): SheetResult {
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

  // 2. Scope shared by all declarations, filled as they evaluate. `usedExpr` becomes the cache's
  //    compiled map, so the scope's compile keeps filling it on the line-edit path.
  const usedExpr = new Map<string, CompileResult>();
  const compile = (t: string) => {
    let c = usedExpr.get(t) ?? cache.compiled.get(t);
    if (!c) c = compileExpression(t, cache.math);
    usedExpr.set(t, c);
    return c;
  };
  const kinds = new Map<string, EntryKind>(decls.map((d) => [d.decl.name.text, d.decl.kind]));
  const scope: SheetScope = { math: cache.math, compile, scalars: new Map<string, Value>(), lets: new Map<string, LetValue>(), kinds };
  const st = { stamps: new Map<string, number>(), kinds, outcomes: new Map<string, Outcome>(), entriesOf: new Map<string, CachedOutcome>(), scope };
  const nextOutcomes = new Map<string, CachedOutcome>();
  const stats = { evaluated: 0, reused: 0 };
  const run = makeRunner(cache, st, nextOutcomes, stats, marginPct);

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
  for (const d of order) run(d);
  // 4. Substrates, lines, stubs, then sweeps: each kind stands only on the kinds before it.
  for (const kind of ['substrate', 'line', 'stub', 'sweep'] as const) for (const d of decls) if (d.decl.kind === kind) run(d);

  cache.outcomes = nextOutcomes;
  cache.compiled = usedExpr;

  // 5. Assemble entries, diagnostics and symbols with absolute positions.
  const symbols = new Map<string, SheetSymbol>();
  for (const d of decls) {
    symbols.set(d.decl.name.text, { name: d.decl.name.text, kind: d.decl.kind, declaration: rangeOf(d.line, d.decl.name.start, d.decl.name.end), references: [] });
  }
  const entries: SheetEntry[] = [];
  const models = new Map<string, EntryModel>();
  const readers = new Map<string, Set<string>>();
  for (const d of decls) {
    const name = d.decl.name.text;
    const cached = st.entriesOf.get(name);
    if (!cached) {
      entries.push({ line: d.line, kind: d.decl.kind, name, nameRange: rangeOf(d.line, d.decl.name.start, d.decl.name.end), range: rangeOf(d.line, d.decl.span.start, d.decl.span.end), results: {}, details: [], synthesized: [] });
      continue;
    }
    const o = cached.outcome;
    const model = modelOf(o);
    if (model) models.set(name, model);
    for (const r of o.reads) addReader(readers, r, name);
    for (const diag of o.diagnostics) at(d.line, diag);
    for (const r of o.references) symbols.get(r.name)?.references.push(rangeOf(d.line, r.start, r.end));
    entries.push(viewOf(d, cached));
  }
  diagnostics.sort(byPosition);
  const entryIndex = new Map(entries.map((e, i) => [e.name, i]));
  const result: SheetResult = { entries, diagnostics, symbols, stats, cache, models };
  cache.last = {
    owner: result, path: 'full', marginPct, lines, byName, kinds, scope, stamps: st.stamps, outcomes: st.outcomes, entriesOf: st.entriesOf,
    letOrder: order.map((d) => d.decl.name.text), letRank: new Map(order.map((d, i) => [d.decl.name.text, i])), cyclic: new Set(cyclic.keys()), readers,
    entries, entryIndex, diagnostics, symbols, models,
  };
  return result;
}

/**
 * The line-edit path (see the header): patches the last result for a few changed lines, or
 * returns undefined, having changed nothing, when the edit needs the full path.
 */
function evaluateLineEdit(cache: Cache, st: SheetState, lines: string[]): SheetResult | undefined {
  const old = st.lines;
  if (lines.length !== old.length) return shiftLines(cache, st, lines);
  const changed: number[] = [];
  for (let i = 0; i < lines.length; i++) {
    if (lines[i] !== old[i] && changed.push(i) > MAX_EDITED_LINES) return undefined;
  }

  // Checks only, nothing changed yet: every edited line keeps its declaration's name (at the same
  // columns) and kind, is that name's first declaration, and a let keeps the names it reads.
  const edits: { line: number; entry: ParsedEntry; decl?: Decl }[] = [];
  for (const line of changed) {
    const before = (cache.parsed.get(old[line]!) ?? parseEntry(old[line]!)).parsed.declaration;
    const entry = cache.parsed.get(lines[line]!) ?? parseEntry(lines[line]!);
    const after = entry.parsed.declaration;
    if (!before !== !after) return undefined;
    if (!before || !after) {
      edits.push({ line, entry });
      continue;
    }
    const name = after.name.text;
    if (before.name.text !== name || before.kind !== after.kind || before.name.start !== after.name.start || before.name.end !== after.name.end) return undefined;
    if (st.byName.get(name)?.line !== line || st.cyclic.has(name)) return undefined;
    if (!st.entriesOf.has(name)) return undefined;
    if (after.kind === 'let') {
      const was = new Set(cache.letReads?.get(before.value?.text ?? '') ?? []);
      const d: Decl = { line, decl: after, key: entry.key };
      const now = letReads(d, st.scope.compile);
      if (now.length !== was.size || now.some((n) => !was.has(n)) || new Set(now).size !== was.size) return undefined;
      cache.letReads?.set(after.value?.text ?? '', now);
    }
    edits.push({ line, entry, decl: { line, decl: after, key: entry.key } });
  }

  // Commit: swap in the new lines and declarations, then re-evaluate them and, transitively, their readers.
  for (const e of edits) {
    cache.parsed.delete(old[e.line]!);
    cache.parsed.set(lines[e.line]!, e.entry);
    if (!e.decl) continue;
    st.byName.set(e.decl.decl.name.text, e.decl);
  }
  const replaced = edits.flatMap((e) => (e.decl ? [st.entriesOf.get(e.decl.decl.name.text)!] : []));
  st.lines = lines;
  const stats = { evaluated: 0, reused: 0 };
  const run = makeRunner(cache, st, cache.outcomes, stats, st.marginPct);
  const pending = new Set(edits.flatMap((e) => (e.decl ? [e.decl.decl.name.text] : [])));
  const redone = new Set<string>();
  /** References of each redone declaration before this call (its line's symbol references change with them). */
  const oldReferences = new Map<string, Outcome['references']>();
  const redo = (next: string) => {
    pending.delete(next);
    const before = st.entriesOf.get(next)!;
    const after = run(st.byName.get(next)!);
    redone.add(next);
    if (!oldReferences.has(next)) oldReferences.set(next, before.outcome.references);
    if (after === before) return;
    for (const r of before.outcome.reads) st.readers.get(r)?.delete(next);
    for (const r of after.outcome.reads) addReader(st.readers, r, next);
    for (const reader of st.readers.get(next) ?? []) if (st.entriesOf.has(reader) && later(reader, next)) pending.add(reader);
  };
  // Only readers later in evaluation order are redone. A reader earlier in it (a let naming a stub,
  // a line naming a stub) saw, on the full path, a name not evaluated yet, and what it says depends
  // on that name's kind alone, which an edit here never changes; redoing it could loop forever.
  const later = (reader: string, read: string) => {
    const a = KIND_RANK[st.kinds.get(reader)!];
    const b = KIND_RANK[st.kinds.get(read)!];
    return a > b || (a === 0 && b === 0 && st.letRank.get(reader)! > st.letRank.get(read)!);
  };
  // In evaluation order, in linear time: the lets by one forward pass over their dependency order,
  // then each later kind (a Set's iteration also visits what is added to it meanwhile).
  let first = st.letOrder.length;
  for (const n of pending) if (st.kinds.get(n) === 'let') first = Math.min(first, st.letRank.get(n)!);
  for (let i = first; i < st.letOrder.length; i++) if (pending.has(st.letOrder[i]!)) redo(st.letOrder[i]!);
  for (const kind of ['substrate', 'line', 'stub', 'sweep'] as const) {
    for (const n of pending) if (st.kinds.get(n) === kind) redo(n);
  }

  // The edited declarations' old texts are no longer in the sheet: drop their cached outcomes.
  for (const previous of replaced) if (!edits.some((e) => e.decl && st.entriesOf.get(e.decl.decl.name.text)!.key === previous.key) && cache.outcomes.get(previous.key) === previous) cache.outcomes.delete(previous.key);

  // Patch the previous result: entries and models of what was redone, diagnostics of the lines
  // touched, references on the edited lines.
  const entries = st.entries.slice();
  const models = new Map(st.models);
  const touched = new Set(changed);
  for (const name of redone) {
    const d = st.byName.get(name)!;
    const cached = st.entriesOf.get(name)!;
    entries[st.entryIndex.get(name)!] = viewOf(d, cached);
    const model = modelOf(cached.outcome);
    if (model) models.set(name, model);
    else models.delete(name);
    touched.add(d.line);
  }
  const declRange = (name: string) => {
    const d = st.byName.get(name);
    return d ? rangeOf(d.line, d.decl.name.start, d.decl.name.end) : undefined;
  };
  const diagnostics = st.diagnostics.filter((d) => !touched.has(d.range.start.line));
  const at = (line: number, d: LocalDiagnostic) => diagnostics.push(toSheetDiagnostic(line, clampToLine(d, lines[line]!.length), declRange));
  for (const line of touched) {
    const entry = cache.parsed.get(lines[line]!) ?? parseEntry(lines[line]!);
    for (const e of entry.parsed.errors) at(line, e);
    const name = entry.parsed.declaration?.name.text;
    if (name !== undefined && st.byName.get(name)?.line === line) for (const e of st.outcomes.get(name)?.diagnostics ?? []) at(line, e);
  }
  diagnostics.sort(byPosition);

  // References: a redone declaration may read the same text yet record other references (a let
  // that lost its value is no longer a reference), so every redone line is patched.
  let symbols = st.symbols;
  const sameRefs = (a: Outcome['references'], b: Outcome['references']) => a.length === b.length && a.every((r, i) => r.name === b[i]!.name && r.start === b[i]!.start && r.end === b[i]!.end);
  const moved = [...oldReferences].flatMap(([name, before]) => {
    const now = st.outcomes.get(name)!.references;
    return sameRefs(before, now) ? [] : [{ line: st.byName.get(name)!.line, before, now }];
  }).sort((a, b) => a.line - b.line);
  if (moved.length > 0) {
    symbols = new Map(st.symbols);
    const movedLines = new Set(moved.map((m) => m.line));
    for (const name of new Set(moved.flatMap((m) => [...m.before, ...m.now].map((r) => r.name)))) {
      const symbol = symbols.get(name);
      if (!symbol) continue;
      const references = symbol.references.filter((r) => !movedLines.has(r.start.line));
      for (const m of moved) {
        const mine = m.now.filter((r) => r.name === name).map((r) => rangeOf(m.line, r.start, r.end));
        if (mine.length === 0) continue;
        const at = references.findIndex((r) => r.start.line > m.line);
        references.splice(at < 0 ? references.length : at, 0, ...mine);
      }
      symbols.set(name, { ...symbol, references });
    }
  }

  stats.reused = st.outcomes.size - stats.evaluated;
  const result: SheetResult = { entries, diagnostics, symbols, stats, cache, models };
  Object.assign(st, { owner: result, path: 'line-edit', entries, diagnostics, symbols, models });
  return result;
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
 * The line-edit path for lines added or removed where no declaration is (Enter at the end of a
 * line, a new comment, a deleted blank line): nothing is re-evaluated; everything below the edit
 * moves by the number of lines added. Undefined (nothing changed) when a declaration is in the
 * edited block or a duplicate-name message would have to quote a moved line number.
 */
function shiftLines(cache: Cache, st: SheetState, lines: string[]): SheetResult | undefined {
  const old = st.lines;
  const common = Math.min(old.length, lines.length);
  let head = 0;
  while (head < common && lines[head] === old[head]) head++;
  let tail = 0;
  while (tail < common - head && lines[lines.length - 1 - tail] === old[old.length - 1 - tail]) tail++;
  const oldEnd = old.length - tail;
  const newEnd = lines.length - tail;
  if (oldEnd - head > MAX_EDITED_LINES || newEnd - head > MAX_EDITED_LINES) return undefined;
  const parsedAt = (text: string) => cache.parsed.get(text) ?? parseEntry(text);
  for (let i = head; i < oldEnd; i++) if (parsedAt(old[i]!).parsed.declaration) return undefined;
  const added: ParsedEntry[] = [];
  for (let i = head; i < newEnd; i++) {
    const entry = parsedAt(lines[i]!);
    if (entry.parsed.declaration) return undefined;
    added.push(entry);
  }
  // A duplicate's message quotes the line of the first declaration: that must not move.
  if (st.diagnostics.some((d) => d.code === 'duplicate-name' && d.related?.some((r) => r.range.start.line >= oldEnd))) return undefined;

  // Commit.
  const delta = newEnd - oldEnd;
  const moved = (line: number) => (line >= oldEnd ? line + delta : line);
  const movedRange = (r: Range): Range => (r.start.line >= oldEnd ? rangeOf(r.start.line + delta, r.start.character, r.end.character) : r);
  for (let i = head; i < oldEnd; i++) cache.parsed.delete(old[i]!);
  added.forEach((entry, k) => cache.parsed.set(lines[head + k]!, entry));
  st.lines = lines;
  for (const d of st.byName.values()) d.line = moved(d.line);

  const entries = st.entries.map((e) => {
    if (e.line < oldEnd) return e;
    const d = st.byName.get(e.name)!;
    const cached = st.entriesOf.get(e.name);
    return cached ? viewOf(d, cached) : { ...e, line: d.line, nameRange: movedRange(e.nameRange), range: movedRange(e.range), synthesized: e.synthesized.map((x) => ({ ...x, range: movedRange(x.range) })) };
  });
  const diagnostics: SheetDiagnostic[] = [];
  for (const d of st.diagnostics) {
    const line = d.range.start.line;
    if (line >= head && line < oldEnd) continue; // a parse error of a removed or rewritten line
    const related = d.related?.some((r) => r.range.start.line >= oldEnd);
    if (line < oldEnd && !related) {
      diagnostics.push(d);
      continue;
    }
    const out: SheetDiagnostic = { ...d, range: movedRange(d.range) };
    if (d.related) out.related = d.related.map((r) => ({ ...r, range: movedRange(r.range) }));
    diagnostics.push(out);
  }
  const declRange = (name: string) => {
    const d = st.byName.get(name);
    return d ? rangeOf(d.line, d.decl.name.start, d.decl.name.end) : undefined;
  };
  added.forEach((entry, k) => {
    for (const e of entry.parsed.errors) diagnostics.push(toSheetDiagnostic(head + k, clampToLine(e, lines[head + k]!.length), declRange));
  });
  diagnostics.sort(byPosition);
  const symbols = new Map<string, SheetSymbol>();
  for (const [name, symbol] of st.symbols) {
    const last = symbol.references.length > 0 ? symbol.references[symbol.references.length - 1]!.start.line : -1;
    symbols.set(name, symbol.declaration.start.line < oldEnd && last < oldEnd
      ? symbol
      : { ...symbol, declaration: movedRange(symbol.declaration), references: symbol.references.map(movedRange) });
  }

  const result: SheetResult = { entries, diagnostics, symbols, stats: { evaluated: 0, reused: st.outcomes.size }, cache, models: st.models };
  Object.assign(st, { owner: result, path: 'line-edit', entries, diagnostics, symbols });
  return result;
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
