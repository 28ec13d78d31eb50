/**
 * Shared types of the sheet expression layer.
 *
 * All offsets are 0-based UTF-16 offsets into the text handed to `compileExpression`,
 * `end` exclusive, so they add directly to the value's offset in its line.
 */
import type { Unit } from 'mathjs';

/** A value a sheet name can hold: a plain number or a mathjs quantity with a unit. */
export type Value = number | Unit;

/**
 * Why an expression was refused.
 * - `limit`: too long, too deeply bracketed, too many signs in a row, or too many nodes.
 * - `syntax`: not an expression, or a construct outside the allowlist (assignment, strings, matrices…).
 * - `unknown-name`: a name that is neither defined in the sheet nor a unit or constant.
 * - `eval`: evaluation failed (mismatched units, a function given the wrong kind of value, a non-finite result).
 */
export type ExprErrorCode = 'limit' | 'syntax' | 'unknown-name' | 'eval';

/** A located problem in an expression. */
export interface ExprError {
  readonly code: ExprErrorCode;
  readonly message: string;
  readonly start: number;
  readonly end: number;
}

/**
 * What a bare name resolves to when the sheet does not define it:
 * a mathjs unit (`mm`, `GHz`, also single letters such as `h` = hour), a constant (`pi`, `e`),
 * or nothing (`none`: the sheet must define it).
 */
export type NameFallback = 'unit' | 'constant' | 'none';

/** One occurrence of a name in the expression text. */
export interface NameRef {
  readonly name: string;
  readonly start: number;
  readonly end: number;
  readonly fallback: NameFallback;
}

/** Outcome of evaluating a compiled expression against a scope. */
export type EvalResult =
  | {
      readonly ok: true;
      readonly value: Value;
      /**
       * Single-letter names that became units because the scope lacks them (`h` → hour,
       * `L` → litre…). Usually empty (a shared frozen array). Pass to `expectKind` for a better message.
       */
      readonly letterUnits: readonly NameRef[];
    }
  | { readonly ok: false; readonly error: ExprError };

/** A checked, compiled expression, safe to cache per text and to evaluate many times. */
export interface CompiledExpression {
  readonly ok: true;
  /** Name references (not function names) in source order, with exact ranges. */
  readonly names: readonly NameRef[];
  /** Allowlisted function calls in source order; `fallback` is always `none`. */
  readonly functions: readonly NameRef[];
  /** Number of AST nodes (bounded by `maxNodes`). */
  readonly nodeCount: number;
  /** Evaluate with sheet values; sheet names win over units and constants. Never throws. */
  evaluate(scope: Map<string, Value>): EvalResult;
}

/** `compileExpression` result. */
export type CompileResult = CompiledExpression | { readonly ok: false; readonly error: ExprError };

/** Bounds applied before and after parsing. */
export interface CompileLimits {
  /** Maximum text length in UTF-16 units (default 2000). */
  readonly maxLength?: number;
  /** Maximum parenthesis nesting (default 40; about 300 overflows the mathjs parser). */
  readonly maxDepth?: number;
  /** Maximum AST nodes (default 500). */
  readonly maxNodes?: number;
}
