/**
 * Sheet expression layer: a locked-down mathjs instance, checked and located compilation of value
 * expressions, quantity kinds, and tolerance/range splitting. Pure; no editor dependency.
 */
export { createSafeMath, RESERVED_NAMES, SHEET_CONSTANTS, SHEET_FUNCTIONS, type SafeMath } from './mathInstance.js';
export { compileExpression, DEFAULT_LIMITS } from './compile.js';
export { expectKind, quantityKind, toSI, type KindCheck, type QuantityKind } from './dimension.js';
export { formatNumber, formatValue, MESSAGE_PRECISION } from './format.js';
export { splitRange, splitTolerance, type Span, type ToleranceSplit } from './split.js';
export type {
  CompiledExpression, CompileLimits, CompileResult, EvalResult, ExprError, ExprErrorCode, NameFallback, NameRef, Value,
} from './types.js';
