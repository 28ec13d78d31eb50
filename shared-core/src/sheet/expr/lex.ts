/**
 * Pre-parse scan of the (spelling-mapped) text: tokens with exact ranges, and a gate that refuses
 * everything outside the sheet grammar before mathjs sees it. Ranges here are in mapped text.
 *
 * Allowed: numbers, names, `+ - * / ^ ( ) ,`, spaces. Refused with the exact token: quotes, `=`,
 * comparisons, `[ ] { } ; ? : ! % & | ~ #`, `.` outside a number, logical keywords, `true`/`null`…,
 * parenthesis depth over the limit, long runs of signs (they nest in the parser), any other character.
 */
import { isDigit, isIdentPart, isIdentStart, isSpace, scanNumber } from './chars.js';
import { quoteName } from './names.js';
import type { ExprErrorCode } from './types.js';

export type TokenKind = 'ident' | 'number' | 'op' | 'open' | 'close' | 'comma';

/** One token; `text` is the exact source slice. */
export interface Token {
  readonly kind: TokenKind;
  readonly text: string;
  readonly start: number;
  readonly end: number;
}

/** A lexer refusal, in mapped-text coordinates. */
export interface LexError {
  readonly code: ExprErrorCode;
  readonly message: string;
  readonly start: number;
  readonly end: number;
}

/** Consecutive `+`/`-` signs allowed (each nests one level in the mathjs parser). */
export const MAX_SIGN_RUN = 16;


const KEYWORDS: ReadonlyMap<string, string> = new Map(Object.entries({
  and: 'logical operators are not allowed in a value',
  or: 'logical operators are not allowed in a value',
  xor: 'logical operators are not allowed in a value',
  not: 'logical operators are not allowed in a value',
  mod: '`mod` is not allowed in a value',
  true: '`true` is not a number',
  false: '`false` is not a number',
  null: '`null` is not a number',
  undefined: '`undefined` is not a number',
}));

const PUNCT: ReadonlyMap<string, string> = new Map(Object.entries({
  '=': 'assignments are not allowed in a value; define a name on its own line: let name = …',
  '<': 'comparisons are not allowed in a value',
  '>': 'comparisons are not allowed in a value',
  '!': '`!` (factorial, not-equal) is not allowed in a value',
  '[': 'matrices and indexing are not allowed in a value',
  ']': 'matrices and indexing are not allowed in a value',
  '{': 'objects are not allowed in a value',
  '}': 'objects are not allowed in a value',
  ';': 'only one expression is allowed per value',
  '\n': 'only one expression is allowed per value',
  '\r': 'only one expression is allowed per value',
  '?': 'conditional expressions are not allowed in a value',
  ':': 'ranges a:b are not allowed; a band is written A .. B where a key takes one',
  '%': '`%` is not allowed here; write 0.05 or 5/100 (a tolerance goes after ±)',
  '&': 'bitwise operators are not allowed in a value',
  '|': 'bitwise operators are not allowed in a value',
  '~': 'bitwise operators are not allowed in a value',
  '#': 'comments are not allowed inside a value',
  '"': 'text strings are not allowed in a value',
  "'": 'quotes are not allowed in a value (no text strings or transposes)',
}));

/** Scans `text`; returns the tokens or the first refusal in text order. */
export function lex(text: string, maxDepth: number): { ok: true; tokens: Token[] } | { ok: false; error: LexError } {
  const tokens: Token[] = [];
  const fail = (code: ExprErrorCode, message: string, start: number, end: number) =>
    ({ ok: false as const, error: { code, message, start, end } });
  let depth = 0;
  let signRun = 0;
  let signStart = 0;
  let i = 0;
  while (i < text.length) {
    const c = text.charCodeAt(i);
    const ch = text.charAt(i);
    if (isSpace(c)) { i++; continue; }
    if (ch !== '+' && ch !== '-') signRun = 0;
    if (isDigit(c) || (ch === '.' && isDigit(text.charCodeAt(i + 1)))) {
      const end = scanNumber(text, i);
      tokens.push({ kind: 'number', text: text.slice(i, end), start: i, end });
      i = end;
    } else if (isIdentStart(c)) {
      let j = i + 1;
      while (j < text.length && isIdentPart(text.charCodeAt(j))) j++;
      const word = text.slice(i, j);
      const refusal = KEYWORDS.get(word);
      if (refusal !== undefined) return fail('syntax', refusal, i, j);
      if (word.includes('\u00b5')) {
        return fail('syntax', `"${quoteName(word)}" is not a unit: µ only works as the prefix of a unit (µm, µH, µs)`, i, j);
      }
      tokens.push({ kind: 'ident', text: word, start: i, end: j });
      i = j;
    } else if (ch === '+' || ch === '-' || ch === '*' || ch === '/' || ch === '^') {
      if (ch === '+' || ch === '-') {
        if (signRun === 0) signStart = i;
        if (++signRun > MAX_SIGN_RUN) return fail('limit', `more than ${MAX_SIGN_RUN} signs in a row`, signStart, i + 1);
      }
      tokens.push({ kind: 'op', text: ch, start: i, end: i + 1 });
      i++;
    } else if (ch === '(') {
      if (++depth > maxDepth) return fail('limit', `brackets nested deeper than ${maxDepth}`, i, i + 1);
      tokens.push({ kind: 'open', text: ch, start: i, end: i + 1 });
      i++;
    } else if (ch === ')' || ch === ',') {
      if (ch === ')') depth = Math.max(0, depth - 1);
      tokens.push({ kind: ch === ')' ? 'close' : 'comma', text: ch, start: i, end: i + 1 });
      i++;
    } else {
      return refuse(text, i, fail);
    }
  }
  return { ok: true, tokens };
}

const INVISIBLE = /[\p{C}\p{Z}]/u;

function refuse<T>(text: string, i: number, fail: (code: ExprErrorCode, m: string, s: number, e: number) => T): T {
  const ch = text.charAt(i);
  if (ch === '.') {
    if (text.charAt(i + 1) === '.') return fail('syntax', 'a range A .. B is only allowed where a key takes a band', i, i + 2);
    return fail('syntax', '`.` is only allowed inside a number (no property access or element-wise operators)', i, i + 1);
  }
  if (ch === '"' || ch === "'") {
    const close = text.indexOf(ch, i + 1);
    return fail('syntax', PUNCT.get(ch) ?? '', i, close > i ? close + 1 : i + 1);
  }
  const pair = (ch === '=' || ch === '<' || ch === '>' || ch === '!') && text.charAt(i + 1) === '=' ? 2 : 1;
  const known = PUNCT.get(ch);
  if (known !== undefined) return fail('syntax', known, i, i + pair);
  const cp = text.codePointAt(i) ?? 0;
  const width = cp > 0xffff ? 2 : 1;
  const char = text.slice(i, i + width);
  const shown = INVISIBLE.test(char) ? `U+${cp.toString(16).toUpperCase().padStart(4, '0')}` : `"${char}"`;
  return fail('syntax', `unexpected character ${shown}`, i, i + width);
}
