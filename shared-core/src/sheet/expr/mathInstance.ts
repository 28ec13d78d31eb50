/**
 * A lean, locked-down mathjs instance for untrusted sheet expressions.
 *
 * Follows the mathjs security guidance: build the instance, capture `parse`, then replace the
 * functions that change the instance or parse text at run time (`import`, `createUnit`, `reviver`,
 * `evaluate`, `parse`, `compile`, `simplify`, `derivative`, `resolve`…) with throwing stubs.
 * The instance still holds helpers pulled in as dependencies (`zeros`, `matrix`…); what keeps
 * expressions safe is the AST allowlist in `allowlist.ts`, which only lets through the
 * functions of `SHEET_FUNCTIONS`.
 */
import {
  type MathJsInstance, type MathNode, type Unit, create,
  absDependencies, acosDependencies, addDependencies, asinDependencies, atan2Dependencies, atanDependencies,
  cbrtDependencies, ceilDependencies, cosDependencies, coshDependencies, divideDependencies, eDependencies,
  expDependencies, floorDependencies, log10Dependencies, log2Dependencies, logDependencies, maxDependencies,
  minDependencies, multiplyDependencies, parseDependencies, piDependencies, powDependencies, roundDependencies,
  sinDependencies, sinhDependencies, sqrtDependencies, subtractDependencies, tanDependencies, tanhDependencies,
  toDependencies, unaryMinusDependencies, unaryPlusDependencies, unitDependencies,
} from 'mathjs';
import type { NameFallback } from './types.js';

/** Functions an expression may call. Each one is bounded work on scalars and quantities. */
export const SHEET_FUNCTIONS: ReadonlySet<string> = new Set([
  'sqrt', 'cbrt', 'abs', 'sin', 'cos', 'tan', 'asin', 'acos', 'atan', 'atan2', 'sinh', 'cosh', 'tanh',
  'log', 'log10', 'log2', 'exp', 'min', 'max', 'round', 'floor', 'ceil',
]);

/**
 * Names mathjs refuses in any scope (its evaluation throws when the scope holds one). The line parser
 * should refuse them where a name is defined; `evaluate` reports them as an `eval` error.
 */
export const RESERVED_NAMES: ReadonlySet<string> = new Set(['end']);

/** Constants a bare name may fall back to. */
export const SHEET_CONSTANTS: ReadonlySet<string> = new Set(['pi', 'e']);

/** Namespace entries replaced by throwing stubs after `parse` is captured. */
const DISABLED = [
  'import', 'createUnit', 'reviver', 'replacer', 'evaluate', 'parse', 'compile', 'parser', 'simplify',
  'simplifyConstant', 'simplifyCore', 'rationalize', 'derivative', 'resolve', 'leafCount', 'symbolicEqual',
  'chain', 'help',
] as const;

/** The sheet's view of its mathjs instance. Hands out no reference to the instance itself. */
export interface SafeMath {
  /** The instance's parser, captured before `parse` was disabled in the namespace. */
  readonly parse: (text: string) => MathNode;
  /** What a bare name resolves to when the sheet does not define it (mirrors mathjs SymbolNode). */
  readonly fallbackOf: (name: string) => NameFallback;
  /** Whether `name` is a unit of this instance, prefixes included (`um`, `kohm`, `GHz`). */
  readonly isUnitName: (name: string) => boolean;
  /** Host-side constructor for quantities, e.g. `unit(35, 'um')` for scope values and tests. */
  readonly unit: (value: number, unitName: string) => Unit;
}

/**
 * Builds the locked-down instance. Exported for the security tests only; sheet code uses
 * `createSafeMath`, which never exposes the instance.
 */
export function buildLockedInstance(): { math: MathJsInstance; parse: (text: string) => MathNode } {
  const factories = [
    parseDependencies, unitDependencies, toDependencies, addDependencies, subtractDependencies,
    multiplyDependencies, divideDependencies, powDependencies, unaryMinusDependencies, unaryPlusDependencies,
    sqrtDependencies, cbrtDependencies, absDependencies, sinDependencies, cosDependencies, tanDependencies,
    asinDependencies, acosDependencies, atanDependencies, atan2Dependencies, sinhDependencies,
    coshDependencies, tanhDependencies, logDependencies, log10Dependencies, log2Dependencies, expDependencies,
    minDependencies, maxDependencies, roundDependencies, floorDependencies, ceilDependencies, piDependencies,
    eDependencies,
  ];
  const math = create(
    Object.assign({}, ...factories),
    // predictable: sqrt(-1) and log(-1) give NaN (reported as an error), never a complex number.
    { number: 'number', predictable: true },
  );
  const parse = math.parse;
  const parseOne = (text: string): MathNode => parse(text);
  const stubs: Record<string, () => never> = {};
  for (const name of DISABLED) {
    stubs[name] = () => {
      throw new Error(`Function ${name} is disabled`);
    };
  }
  math.import(stubs, { override: true });
  return { math, parse: parseOne };
}

/** Creates one locked-down mathjs instance for a sheet service (one per service is enough). */
export function createSafeMath(): SafeMath {
  const { math, parse } = buildLockedInstance();
  const UnitClass = math.Unit;
  const isUnitName = (name: string): boolean => UnitClass.isValuelessUnit(name);
  return Object.freeze({
    parse,
    isUnitName,
    fallbackOf(name: string): NameFallback {
      if (SHEET_CONSTANTS.has(name)) return 'constant';
      // mathjs resolves any namespace entry (functions, classes, Object.prototype members) before units.
      if (name in math) return 'none';
      return isUnitName(name) ? 'unit' : 'none';
    },
    unit: (value: number, unitName: string): Unit => math.unit(value, unitName),
  });
}
