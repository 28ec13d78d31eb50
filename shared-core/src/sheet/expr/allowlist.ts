/**
 * AST allowlist: the only check that makes a mathjs expression safe to evaluate.
 *
 * Allowed: number constants, symbols, parentheses, `+ - * / ^`, unary `-`/`+`, implicit
 * multiplication (`2.45 GHz`), unit conversion `x to unit` (right side made of units only), and calls
 * of `SHEET_FUNCTIONS` by plain name. Everything else is refused, and the walk stops after `maxNodes`.
 */
import type { MathNode } from 'mathjs';
import { SHEET_FUNCTIONS } from './mathInstance.js';
import { quoteName } from './names.js';
import type { NameFallback } from './types.js';

const OPERATORS: ReadonlySet<string> = new Set([
  'add', 'subtract', 'multiply', 'divide', 'pow', 'unaryMinus', 'unaryPlus', 'to',
]);

const REFUSED: ReadonlyMap<string, string> = new Map(Object.entries({
  AssignmentNode: 'assignments are not allowed in a value',
  FunctionAssignmentNode: 'function definitions are not allowed in a value',
  AccessorNode: 'property access is not allowed in a value',
  IndexNode: 'indexing is not allowed in a value',
  ArrayNode: 'matrices are not allowed in a value',
  ObjectNode: 'objects are not allowed in a value',
  RangeNode: 'ranges a:b are not allowed in a value',
  BlockNode: 'only one expression is allowed per value',
  ConditionalNode: 'conditional expressions are not allowed in a value',
  RelationalNode: 'comparisons are not allowed in a value',
}));

/** Where a refusal points: a function name, an operator spelling, or the whole expression. */
export type Anchor = { readonly call: string } | { readonly op: string } | { readonly whole: true };

/** What the walk found, or why it refused. */
export type WalkResult =
  | { ok: true; symbols: Set<string>; calls: Set<string>; count: number }
  | { ok: false; code: 'syntax' | 'limit'; message: string; anchor: Anchor };

interface Loose { type: string; [field: string]: unknown }

/** Walks `root` and checks every node against the allowlist. */
export function checkTree(root: MathNode, maxNodes: number, fallbackOf: (name: string) => NameFallback): WalkResult {
  const symbols = new Set<string>();
  const calls = new Set<string>();
  let count = 0;
  let refusal: WalkResult | null = null;
  const refuse = (message: string, anchor: Anchor, code: 'syntax' | 'limit' = 'syntax'): false => {
    refusal ??= { ok: false, code, message, anchor };
    return false;
  };
  const visit = (node: Loose): boolean => {
    if (++count > maxNodes) return refuse(`expression has more than ${maxNodes} parts`, { whole: true }, 'limit');
    switch (node.type) {
      case 'ConstantNode':
        return typeof node['value'] === 'number' || refuse('only numbers are allowed as constants', { whole: true });
      case 'SymbolNode':
        symbols.add(String(node['name']));
        return true;
      case 'ParenthesisNode':
        return visit(node['content'] as Loose);
      case 'OperatorNode': {
        const fn = String(node['fn']);
        if (!OPERATORS.has(fn)) return refuse(`operator ${String(node['op'])} is not allowed in a value`, { op: String(node['op']) });
        const args = node['args'] as Loose[];
        if (fn === 'to' && !isUnitExpression(args[1], fallbackOf)) {
          return refuse('the right side of `to` must be a unit, e.g. `to mil`', { op: String(node['op']) });
        }
        return args.every(visit);
      }
      case 'FunctionNode': {
        const fn = node['fn'] as Loose;
        const name = fn.type === 'SymbolNode' ? String(fn['name']) : '';
        if (!SHEET_FUNCTIONS.has(name)) {
          const q = quoteName(name);
          const hint = name === '' ? '' : `; to multiply, write ${q} * (…)`;
          return refuse(`${q || 'this'}(…) is not an allowed function${hint}`, name ? { call: name } : { whole: true });
        }
        calls.add(name);
        return (node['args'] as Loose[]).every(visit);
      }
      default:
        return refuse(REFUSED.get(node.type) ?? `${node.type} is not allowed in a value`, { whole: true });
    }
  };
  visit(root as unknown as Loose);
  return refusal ?? { ok: true, symbols, calls, count };
}

function isUnitExpression(node: Loose | undefined, fallbackOf: (name: string) => NameFallback): boolean {
  if (node === undefined) return false;
  switch (node.type) {
    case 'SymbolNode':
      return fallbackOf(String(node['name'])) === 'unit';
    case 'ConstantNode':
      return typeof node['value'] === 'number';
    case 'ParenthesisNode':
      return isUnitExpression(node['content'] as Loose, fallbackOf);
    case 'OperatorNode': {
      const fn = String(node['fn']);
      if (fn !== 'multiply' && fn !== 'divide' && fn !== 'pow') return false;
      return (node['args'] as Loose[]).every((a) => isUnitExpression(a, fallbackOf));
    }
    default:
      return false;
  }
}
