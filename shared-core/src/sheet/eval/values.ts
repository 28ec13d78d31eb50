/**
 * Evaluation of value texts for one declaration: expressions, tolerances (A ± T, A ± P %), ranges
 * (A .. B), whole-name references to `let` values, and unit checks against the quantity a key wants.
 * Collects the names it reads (for the dependency graph and references) and located diagnostics.
 */
import { isUnit, type Unit } from 'mathjs';
import {
  compileExpression, expectKind, formatValue, quantityKind, splitRange, splitTolerance,
  type CompileResult, type NameRef, type QuantityKind, type SafeMath, type Value,
} from '../expr/index.js';
import type { LocalDiagnostic, Span } from '../parse/lineParser.js';
import type { DiagnosticCode, EntryKind } from '../types.js';

/** What a `let` name holds. */
export type LetValue =
  | { type: 'scalar'; value: Value; tolerance: { value: Value; percent: boolean } | null }
  | { type: 'range'; low: Value; high: Value };

export interface Quantity {
  si: number;
  /** Absolute tolerance in SI (0 when none). */
  tolSI: number;
}

/** Shared, read-only view of the sheet that a declaration is evaluated against. */
export interface SheetScope {
  math: SafeMath;
  compile(text: string): CompileResult;
  /** Scalar `let` values (nominal), as the expression layer's scope. */
  scalars: Map<string, Value>;
  lets: Map<string, LetValue>;
  /** Kind of every declared name. */
  kinds: Map<string, EntryKind>;
}

/** Per-declaration evaluation state: diagnostics and the names it read. */
export class ValueReader {
  readonly diagnostics: LocalDiagnostic[] = [];
  /** Every name the declaration's values mention (declared or not), for change tracking. */
  readonly reads = new Set<string>();
  /** Declared names referenced, with their column ranges. */
  readonly references: { name: string; start: number; end: number }[] = [];
  /** Single-letter names read as units (`h` → hour) so far, for the unit-check messages. */
  private readonly letterUnits: NameRef[] = [];

  constructor(readonly scope: SheetScope) {}

  error(start: number, end: number, code: DiagnosticCode, message: string): void {
    this.diagnostics.push({ start, end: Math.max(end, start + 1), severity: 'error', code, message });
  }

  /** Evaluates an expression span to a mathjs value; null after reporting a located error. */
  expression(span: Span): Value | null {
    const compiled = this.scope.compile(span.text);
    if (!compiled.ok) {
      this.error(span.start + compiled.error.start, span.start + compiled.error.end, mapCode(compiled.error.code, compiled.error.message), compiled.error.message);
      return null;
    }
    for (const ref of compiled.names) {
      this.reads.add(ref.name);
      const kind = this.scope.kinds.get(ref.name);
      if (kind === undefined) continue;
      this.references.push({ name: ref.name, start: span.start + ref.start, end: span.start + ref.end });
      if (kind !== 'let') {
        this.error(span.start + ref.start, span.start + ref.end, 'unknown-name', `${ref.name} is a ${kind}, not a value: only let names can be used in expressions`);
        return null;
      }
      // A let that failed (or sits in a cycle) is reported on its own line; stay silent here.
      if (!this.scope.lets.has(ref.name)) return null;
      if (this.scope.lets.get(ref.name)?.type === 'range') {
        this.error(span.start + ref.start, span.start + ref.end, 'unit', `${ref.name} is a range; use it on its own (band ${ref.name}), not inside an expression`);
        return null;
      }
    }
    const result = compiled.evaluate(this.scope.scalars);
    if (!result.ok) {
      const at = result.error;
      this.error(span.start + at.start, span.start + at.end, mapCode(at.code, at.message), at.message);
      return null;
    }
    this.letterUnits.push(...result.letterUnits);
    return result.value;
  }

  /** A `let` name written on its own, returned whole (keeps ranges and tolerances). */
  private wholeLet(span: Span): LetValue | undefined {
    if (!/^[A-Za-z_][A-Za-z0-9_]*$/.test(span.text)) return undefined;
    // Read even when there is no such let (yet): the outcome changes when one appears or is fixed.
    this.reads.add(span.text);
    const value = this.scope.lets.get(span.text);
    if (value) this.references.push({ name: span.text, start: span.start, end: span.end });
    return value;
  }

  /** `let` right-hand side: range, toleranced scalar or plain scalar, no unit check. */
  letValue(span: Span): LetValue | null {
    const range = splitRange(span.text);
    if (range) {
      const low = this.expression(shift(range.low, span.start));
      const high = this.expression(shift(range.high, span.start));
      if (low === null || high === null) return null;
      if (quantityKind(low) !== quantityKind(high)) {
        this.error(span.start + range.high.start, span.start + range.high.end, 'unit', `both ends of a range need the same kind of quantity: ${formatValue(low)} .. ${formatValue(high)}`);
        return null;
      }
      return { type: 'range', low, high };
    }
    const parts = splitTolerance(span.text);
    const value = this.expression(shift(parts.nominal, span.start));
    if (value === null) return null;
    if (!parts.tolerance) return { type: 'scalar', value, tolerance: null };
    const tolSpan = shift(parts.tolerance, span.start);
    const tol = this.expression(tolSpan);
    if (tol === null) return null;
    if (!parts.tolerance.percent && quantityKind(tol) !== quantityKind(value)) {
      this.error(tolSpan.start, tolSpan.end, 'unit', `a tolerance needs the same kind of quantity as its value (${formatValue(value)}), or a percentage`);
      return null;
    }
    return { type: 'scalar', value, tolerance: { value: tol, percent: parts.tolerance.percent } };
  }

  /** A value for `key` that must be of `kind`; tolerance allowed when `tolerance` is set. */
  quantity(span: Span, kind: QuantityKind, key: string, tolerance: boolean): Quantity | null {
    const letters = this.letterUnits.length;
    const named = this.wholeLet(span);
    let value: LetValue | null;
    if (named) value = named;
    else {
      if (splitRange(span.text)) {
        this.error(span.start, span.end, 'unit', `${key} wants a single value, not a range`);
        return null;
      }
      value = this.letValue(span);
    }
    if (value === null) return null;
    if (value.type === 'range') {
      this.error(span.start, span.end, 'unit', `${key} wants a single value, but ${span.text} is a range`);
      return null;
    }
    const nominal = this.check(value.value, kind, key, span, letters);
    if (nominal === null) return null;
    if (!value.tolerance) return { si: nominal, tolSI: 0 };
    if (!tolerance) {
      this.error(span.start, span.end, 'syntax', `${key} takes no tolerance: remove the "± …" part`);
      return null;
    }
    const tolSI = value.tolerance.percent
      ? (Math.abs(nominal) * toNumber(value.tolerance.value)) / 100
      : this.check(value.tolerance.value, kind, `${key} tolerance`, span, letters);
    if (tolSI === null || !Number.isFinite(tolSI)) return null;
    if (tolSI < 0) {
      this.error(span.start, span.end, 'range', `a tolerance cannot be negative: write ± ${formatValue(value.tolerance.value).replace(/^-/, '')}`);
      return null;
    }
    return { si: nominal, tolSI };
  }

  /** A range `A .. B` (or a let name holding one) of `kind`, as [low, high] SI. */
  range(span: Span, kind: QuantityKind, key: string): [number, number] | null {
    const letters = this.letterUnits.length;
    const named = this.wholeLet(span);
    const value = named ?? (splitRange(span.text) ? this.letValue(span) : null);
    if (!named && !splitRange(span.text)) {
      this.error(span.start, span.end, 'syntax', `${key} wants a range: LOW .. HIGH, e.g. 2.4 GHz .. 2.5 GHz`);
      return null;
    }
    if (value === null) return null;
    if (value.type !== 'range') {
      this.error(span.start, span.end, 'unit', `${key} wants a range LOW .. HIGH, but ${span.text} is a single value`);
      return null;
    }
    const low = this.check(value.low, kind, key, span, letters);
    const high = this.check(value.high, kind, key, span, letters);
    if (low === null || high === null) return null;
    if (!(high > low)) {
      this.error(span.start, span.end, 'range', `${key} must go from low to high: swap the two ends`);
      return null;
    }
    return [low, high];
  }

  /** `from`: index into the letter units read by this value (see `quantity`). */
  private check(value: Value, kind: QuantityKind, key: string, span: Span, from: number): number | null {
    const r = expectKind(value, kind, key, this.letterUnits.slice(from));
    if (!r.ok) {
      this.error(span.start, span.end, 'unit', r.message);
      return null;
    }
    return r.si;
  }
}

function toNumber(v: Value): number {
  return typeof v === 'number' ? v : isUnit(v) ? ((v as Unit).value ?? Number.NaN) : Number.NaN;
}

const shift = (s: { text: string; start: number; end: number }, by: number): Span => ({ text: s.text, start: s.start + by, end: s.end + by });

function mapCode(code: 'limit' | 'syntax' | 'unknown-name' | 'eval', message: string): DiagnosticCode {
  if (code !== 'eval') return code;
  return /unit|dimension|kind/i.test(message) ? 'unit' : 'range';
}
