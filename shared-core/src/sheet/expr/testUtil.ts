/** Test helpers for the expression layer (imported by tests only). */
import { expect } from 'vitest';
import { compileExpression } from './compile.js';
import type { SafeMath } from './mathInstance.js';
import type { CompiledExpression, ExprError, Value } from './types.js';

/** Compiles and asserts success. */
export function compiled(text: string, math: SafeMath): CompiledExpression {
  const c = compileExpression(text, math);
  if (!c.ok) throw new Error(`expected "${text}" to compile, got ${c.error.code}: ${c.error.message}`);
  return c;
}

/** Compiles and asserts a refusal; returns the error and the exact source slice it points at. */
export function refused(text: string, math: SafeMath): ExprError & { slice: string } {
  const c = compileExpression(text, math);
  if (c.ok) throw new Error(`expected "${text}" to be refused`);
  expect(c.error.start).toBeGreaterThanOrEqual(0);
  expect(c.error.end).toBeLessThanOrEqual(text.length);
  expect(c.error.start).toBeLessThanOrEqual(c.error.end);
  return { ...c.error, slice: text.slice(c.error.start, c.error.end) };
}

/** Compiles, evaluates, and asserts success. */
export function valueOf(text: string, math: SafeMath, scope: Map<string, Value> = new Map()): Value {
  const r = compiled(text, math).evaluate(scope);
  if (!r.ok) throw new Error(`expected "${text}" to evaluate, got ${r.error.code}: ${r.error.message}`);
  return r.value;
}
