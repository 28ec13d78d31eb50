/**
 * Line parser of the sheet language: one declaration per line, syntax only (no evaluation).
 *
 *   # prose                                   comment or free text of the note
 *   let NAME = VALUE                          a named value, range (A .. B) or toleranced value (A ± T)
 *   substrate NAME: key value, key value…     a laminate
 *   line NAME: TYPE [on SUBSTRATE], key value…
 *   stub NAME: short|open on LINE, key value…
 *   sweep NAME: of STUB_OR_LINE, key value…     a frequency sweep (for plots and export)
 *
 * Items are split at top-level commas (commas inside parentheses belong to function calls).
 * All offsets are 0-based UTF-16 columns in the line, `end` exclusive.
 */
import { RESERVED_NAMES } from '../expr/index.js';
import type { DiagnosticCode } from '../types.js';

export interface Span {
  text: string;
  start: number;
  end: number;
}

/** A diagnostic located inside one line (columns only); the evaluator adds the line number. */
export interface LocalDiagnostic {
  start: number;
  end: number;
  severity: 'error' | 'warning' | 'info';
  code: DiagnosticCode;
  message: string;
  /** Names of other declarations involved (shown as related information). */
  related?: { name: string; message: string }[];
  /** Fix data for code actions (see SheetDiagnostic.data). */
  data?: { lengthM?: number };
}

export interface Item {
  key: Span;
  /** Value text after the key; null for a bare flag such as `resonant`. */
  value: Span | null;
  /** The whole item. */
  span: Span;
}

export type DeclKind = 'let' | 'substrate' | 'line' | 'stub' | 'sweep';

export interface ParsedDeclaration {
  kind: DeclKind;
  name: Span;
  /** `let`: the value after `=`. */
  value: Span | null;
  /** `line`/`stub`: first item (line type, or short/open) and its `on NAME` target. */
  head: { word: Span; on: Span | null } | null;
  items: Item[];
  /** The declaration without trailing comment and whitespace. */
  span: Span;
}

export interface ParsedLine {
  declaration: ParsedDeclaration | null;
  errors: LocalDiagnostic[];
}

export const DECLARATION_KEYWORDS: readonly DeclKind[] = ['let', 'substrate', 'line', 'stub', 'sweep'];
const IDENT = /[A-Za-z_][A-Za-z0-9_]*/y;
/** Longest line the parser looks at; longer lines get a `limit` diagnostic. */
export const MAX_LINE_LENGTH = 4000;

const err = (start: number, end: number, code: DiagnosticCode, message: string): LocalDiagnostic => ({
  start, end: Math.max(end, start + 1), severity: 'error', code, message,
});

/** Trimmed span of text[from, to). */
export function spanOf(text: string, from: number, to: number): Span {
  let s = from;
  let e = to;
  while (s < e && /\s/.test(text.charAt(s))) s++;
  while (e > s && /\s/.test(text.charAt(e - 1))) e--;
  return { text: text.slice(s, e), start: s, end: e };
}

function identAt(text: string, at: number): Span | null {
  IDENT.lastIndex = at;
  const m = IDENT.exec(text);
  return m ? { text: m[0], start: at, end: at + m[0].length } : null;
}

const skipSpace = (text: string, at: number): number => {
  while (at < text.length && /\s/.test(text.charAt(at))) at++;
  return at;
};

/** Parses one line of a sheet. Never throws. */
export function parseLine(text: string): ParsedLine {
  if (text.length > MAX_LINE_LENGTH) {
    return { declaration: null, errors: [err(MAX_LINE_LENGTH, text.length, 'limit', `line longer than ${MAX_LINE_LENGTH} characters: split it or shorten it`)] };
  }
  const hash = text.indexOf('#');
  const code = hash >= 0 ? text.slice(0, hash) : text;
  const start = skipSpace(code, 0);
  if (start >= code.trimEnd().length) return { declaration: null, errors: [] };
  const keyword = identAt(code, start);
  if (!keyword || !(DECLARATION_KEYWORDS as readonly string[]).includes(keyword.text)) {
    const end = keyword ? keyword.end : spanOf(code, start, code.length).end;
    return {
      declaration: null,
      errors: [err(start, end, 'syntax', 'a line starts with let, substrate, line, stub or sweep; start free text with #')],
    };
  }
  const kind = keyword.text as DeclKind;
  const nameAt = skipSpace(code, keyword.end);
  const name = identAt(code, nameAt);
  if (!name || nameAt === keyword.end) {
    return { declaration: null, errors: [err(nameAt, spanOf(code, nameAt, code.length).end, 'syntax', `${kind} needs a name: ${kind} NAME${kind === 'let' ? ' = value' : ': …'}`)] };
  }
  if (RESERVED_NAMES.has(name.text)) {
    return { declaration: null, errors: [err(name.start, name.end, 'syntax', `"${name.text}" is a reserved word: choose another name`)] };
  }
  const span = spanOf(code, start, code.length);
  const sepAt = skipSpace(code, name.end);
  const sep = kind === 'let' ? '=' : ':';
  if (code.charAt(sepAt) !== sep) {
    const what = code.charAt(sepAt) ? `found "${code.charAt(sepAt)}"` : 'the line ends';
    return { declaration: null, errors: [err(sepAt, sepAt + 1, 'syntax', `expected "${sep}" after the name ${name.text}, ${what}`)] };
  }
  if (kind === 'let') {
    const value = spanOf(code, sepAt + 1, code.length);
    const errors = value.text === '' ? [err(sepAt, sepAt + 1, 'syntax', `let ${name.text} needs a value after "="`)] : [];
    return { declaration: { kind, name, value, head: null, items: [], span }, errors };
  }
  const { items, errors } = splitItems(code, sepAt + 1);
  let head: ParsedDeclaration['head'] = null;
  if ((kind === 'line' || kind === 'stub') && items.length > 0) {
    const first = items.shift()!;
    if (first.key.text === 'on') {
      const what = kind === 'line' ? 'the line type' : 'short or open';
      const example = kind === 'line' ? 'microstrip on' : 'short on';
      errors.push(err(first.key.start, first.key.end, 'missing', `${what} goes before "on": ${example} ${first.value?.text || 'NAME'}`));
    } else head = parseHead(first, errors);
  } else if ((kind !== 'substrate' && kind !== 'sweep') || items.length === 0) {
    const what = kind === 'substrate' ? 'dk …, height …' : kind === 'line' ? 'a line type (microstrip, ideal, coax)' : kind === 'sweep' ? '"of STUB" (or "of LINE, length L")' : 'short or open on LINE';
    errors.push(err(sepAt, sepAt + 1, 'missing', `${kind} ${name.text} needs ${what} after ":"`));
  }
  return { declaration: { kind, name, value: null, head, items, span }, errors };
}

function parseHead(first: Item, errors: LocalDiagnostic[]): { word: Span; on: Span | null } {
  const v = first.value;
  if (!v) return { word: first.key, on: null };
  const on = identAt(v.text, 0);
  if (!on || on.text !== 'on') {
    errors.push(err(v.start, v.end, 'syntax', `put a comma after ${first.key.text}, or write "${first.key.text} on NAME"`));
    return { word: first.key, on: null };
  }
  const target = spanOf(v.text, on.end, v.text.length);
  const id = identAt(target.text, 0);
  if (!id || id.end !== target.text.length) {
    errors.push(err(v.start + (target.text ? target.start : on.start), v.end, 'syntax', '"on" needs one name, e.g. "on core"'));
    return { word: first.key, on: null };
  }
  return { word: first.key, on: { text: id.text, start: v.start + target.start, end: v.start + target.end } };
}

/** Splits `key value, key value, flag` at top-level commas. */
function splitItems(code: string, from: number): { items: Item[]; errors: LocalDiagnostic[] } {
  const items: Item[] = [];
  const errors: LocalDiagnostic[] = [];
  let depth = 0;
  let begin = from;
  for (let i = from; i <= code.length; i++) {
    const ch = code.charAt(i);
    if (ch === '(') depth++;
    else if (ch === ')') depth = Math.max(0, depth - 1);
    if (i < code.length && !(ch === ',' && depth === 0)) continue;
    const span = spanOf(code, begin, i);
    begin = i + 1;
    if (span.text === '') {
      if (i < code.length || items.length > 0) errors.push(err(i, i + 1, 'syntax', 'empty item: remove the extra comma'));
      continue;
    }
    const key = identAt(code, span.start);
    if (!key) {
      errors.push(err(span.start, span.end, 'syntax', 'each item starts with a key word, e.g. "height 0.8 mm"'));
      continue;
    }
    const value = key.end < span.end ? spanOf(code, key.end, span.end) : null;
    if (value && key.end === value.start) {
      errors.push(err(key.start, span.end, 'syntax', `put a space between the key and its value`));
      continue;
    }
    items.push({ key, value, span });
  }
  return { items, errors };
}
