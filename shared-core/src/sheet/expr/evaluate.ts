/**
 * Evaluation of a compiled expression against the sheet scope: name checks first (located errors),
 * then the mathjs closure, then a check that the result is a finite number or quantity.
 */
import { type EvalFunction, isUnit } from 'mathjs';
import type { EvalResult, ExprError, NameRef, Value } from './types.js';
import { RESERVED_NAMES } from './mathInstance.js';
import { unknownNameMessage } from './names.js';

const NO_REFS: readonly NameRef[] = Object.freeze([]);

/**
 * Builds `evaluate(scope)` for a checked expression. Never throws. Values are shared, not copied
 * (a scope value or a folded constant may be returned as is): treat them as immutable, as mathjs does.
 */
export function makeEvaluator(
  code: EvalFunction, names: readonly NameRef[], functions: readonly NameRef[],
  whole: { readonly start: number; readonly end: number },
): (scope: Map<string, Value>) => EvalResult {
  const required = names.filter((n) => n.fallback === 'none');
  const letters = names.filter((n) => n.fallback === 'unit' && n.name.length === 1);
  // Without sheet names, and with no unit or constant shadowed by the scope, the result depends on the
  // text alone: compute it once (literal lines such as `2.45 GHz` then cost a few Map lookups).
  let folded: EvalResult | undefined;
  const foldable = required.length === 0;
  return (scope) => {
    for (const name of RESERVED_NAMES) {
      if (scope.has(name)) return fail('eval', `the sheet defines "${name}", a reserved word: rename it`, whole);
    }
    const fresh = !foldable || names.some((n) => scope.has(n.name)) || functions.some((f) => scope.has(f.name));
    if (!fresh && folded !== undefined) return folded;
    const result = run(scope);
    if (!fresh) folded = result;
    return result;
  };

  function run(scope: Map<string, Value>): EvalResult {
    for (const ref of required) {
      if (!scope.has(ref.name)) return fail('unknown-name', unknownNameMessage(ref.name), ref);
    }
    for (const ref of functions) {
      if (scope.has(ref.name)) {
        return fail('eval', `"${ref.name}" is a sheet name here, so it cannot be called; rename the sheet value`, ref);
      }
    }
    let value: unknown;
    try {
      value = code.evaluate(scope);
    } catch (e) {
      return fail('eval', evalMessage(e), whole);
    }
    const problem = checkValue(value);
    if (problem !== null) return fail('eval', problem, whole);
    const read = letters.length === 0 ? NO_REFS : letters.filter((n) => !scope.has(n.name));
    return { ok: true, value: value as Value, letterUnits: read.length === 0 ? NO_REFS : read };
  }
}

function fail(code: ExprError['code'], message: string, at: { start: number; end: number }): EvalResult {
  return { ok: false, error: { code, message, start: at.start, end: at.end } };
}

function checkValue(value: unknown): string | null {
  if (typeof value === 'number') {
    return Number.isFinite(value) ? null : 'result is not a finite number (division by zero, or a root or log of a negative?)';
  }
  if (isUnit(value)) {
    const v = (value as { value: number | null }).value;
    return v === null || Number.isFinite(v) ? null : 'result is not a finite quantity (division by zero?)';
  }
  return 'result is not a number or a quantity';
}

function evalMessage(e: unknown): string {
  const raw = e instanceof Error ? e.message : String(e);
  const typed = /^Unexpected type of argument in function (\w+) \(expected: .*?actual: (\w+)/.exec(raw);
  if (typed) {
    const [, fn, actual] = typed;
    return actual === 'Unit' ? `${fn} cannot take a value with a unit here` : `${fn} cannot take a ${actual} here`;
  }
  if (/^Units do not match/.test(raw)) return 'units do not match (e.g. adding a length to a frequency)';
  if (/contains a unit with undefined value/.test(raw)) return 'a unit on its own has no value here: put a number before it (2 mm + 1 mm, not 2 mm + mm)';
  return raw.split('\n')[0] ?? raw;
}
