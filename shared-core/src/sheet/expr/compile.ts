/**
 * `compileExpression`: text → checked, compiled, located.
 *
 * Steps: length cap → spelling map (µm → um, Ω → ohm, ° → deg… with a position map) → lexer gate
 * (forbidden tokens, bracket depth, sign runs) → mathjs parse → AST allowlist and node cap →
 * name ranges → compile. Every error range points at the original text. Never throws.
 */
import { checkTree, type Anchor } from './allowlist.js';
import { makeEvaluator } from './evaluate.js';
import { lex, type Token } from './lex.js';
import type { SafeMath } from './mathInstance.js';
import { collectRefs } from './names.js';
import { normalizeSpelling, toOriginal, type PosMap } from './normalize.js';
import type { CompileLimits, CompileResult, ExprError, ExprErrorCode, NameRef } from './types.js';

/** Defaults for `CompileLimits`. */
export const DEFAULT_LIMITS: Required<CompileLimits> = Object.freeze({ maxLength: 2000, maxDepth: 40, maxNodes: 500 });

/**
 * Checks and compiles one value expression such as `2.45 GHz`, `2*f0` or `1/(2 pi f0 0.9 pF)`.
 * The result depends only on `text`, the `SafeMath` instance and `limits`, so it can be cached per
 * text for the life of the instance. Errors carry 0-based UTF-16 offsets into `text`.
 */
export function compileExpression(text: string, math: SafeMath, limits: CompileLimits = {}): CompileResult {
  try {
    return compileChecked(text, math, {
      maxLength: limits.maxLength ?? DEFAULT_LIMITS.maxLength,
      maxDepth: limits.maxDepth ?? DEFAULT_LIMITS.maxDepth,
      maxNodes: limits.maxNodes ?? DEFAULT_LIMITS.maxNodes,
    });
  } catch (e) {
    const code: ExprErrorCode = e instanceof RangeError ? 'limit' : 'syntax';
    return failure(code, code === 'limit' ? 'expression is too complex' : 'could not read this expression', 0, text.length);
  }
}

function compileChecked(text: string, math: SafeMath, limits: Required<CompileLimits>): CompileResult {
  if (text.length > limits.maxLength) {
    return failure('limit', `expression longer than ${limits.maxLength} characters`, limits.maxLength, text.length);
  }
  if (text.trim() === '') return failure('syntax', 'empty value: write a number or an expression', 0, text.length);
  const mapped = normalizeSpelling(text, math.isUnitName);
  const at = (code: ExprErrorCode, message: string, start: number, end: number) => {
    const r = toOriginal(mapped.map, start, end);
    return failure(code, message, r.start, r.end);
  };
  const lexed = lex(mapped.text, limits.maxDepth);
  if (!lexed.ok) return at(lexed.error.code, lexed.error.message, lexed.error.start, lexed.error.end);
  const tokens = lexed.tokens;

  let root;
  try {
    root = math.parse(mapped.text);
  } catch (e) {
    if (e instanceof RangeError) return failure('limit', 'expression is too complex', 0, text.length);
    const r = syntaxRange(e, tokens, mapped.text.length);
    return at('syntax', cleanMessage(e), r.start, r.end);
  }

  const walk = checkTree(root, limits.maxNodes, math.fallbackOf);
  if (!walk.ok) {
    const r = anchorRange(walk.anchor, tokens, mapped.text);
    return at(walk.code, walk.message, r.start, r.end);
  }
  const refs = collectRefs(tokens, walk.symbols, walk.calls, math.fallbackOf, mapped.text.length);
  const names = refs.names.map((n) => relocate(n, mapped.map));
  const functions = refs.functions.map((n) => relocate(n, mapped.map));
  const code = root.compile();
  const w = wholeRange(tokens, mapped.text.length);
  const whole = toOriginal(mapped.map, w.start, w.end);
  return { ok: true, names, functions, nodeCount: walk.count, evaluate: makeEvaluator(code, names, functions, whole) };
}

function failure(code: ExprErrorCode, message: string, start: number, end: number): { ok: false; error: ExprError } {
  return { ok: false, error: { code, message, start, end } };
}

function relocate(ref: NameRef, map: PosMap | null): NameRef {
  if (map === null) return ref;
  const r = toOriginal(map, ref.start, ref.end);
  return { name: ref.name, start: r.start, end: r.end, fallback: ref.fallback };
}

/** mathjs syntax errors carry `char`, the 1-based start of the token it stopped at. */
function syntaxRange(e: unknown, tokens: readonly Token[], length: number): { start: number; end: number } {
  const char = (e as { char?: unknown } | null)?.char;
  const last = tokens[tokens.length - 1];
  if (typeof char !== 'number' || char - 1 >= length) {
    return last ? { start: last.start, end: last.end } : wholeRange(tokens, length);
  }
  const offset = Math.max(0, char - 1);
  const hit = tokens.find((t) => t.start <= offset && offset < t.end);
  return hit ? { start: hit.start, end: hit.end } : { start: offset, end: Math.min(length, offset + 1) };
}

function cleanMessage(e: unknown): string {
  const raw = e instanceof Error ? e.message : String(e);
  const text = raw.replace(/\s*\(char \d+\)\s*$/, '');
  return /^Unexpected end of expression/.test(text) ? 'incomplete expression: something is missing after this' : text;
}

function anchorRange(anchor: Anchor, tokens: readonly Token[], text: string): { start: number; end: number } {
  if ('call' in anchor) {
    const t = tokens.find((tok, k) => tok.kind === 'ident' && tok.text === anchor.call && tokens[k + 1]?.kind === 'open');
    if (t) return { start: t.start, end: t.end };
  } else if ('op' in anchor) {
    const t = tokens.find((tok) => tok.text === anchor.op);
    if (t) return { start: t.start, end: t.end };
    const at = text.indexOf(anchor.op);
    if (at >= 0) return { start: at, end: at + anchor.op.length };
  }
  return wholeRange(tokens, text.length);
}

/** From the first token to the last (the text without surrounding spaces). */
function wholeRange(tokens: readonly Token[], length: number): { start: number; end: number } {
  const first = tokens[0];
  const last = tokens[tokens.length - 1];
  return first && last ? { start: first.start, end: last.end } : { start: 0, end: length };
}
