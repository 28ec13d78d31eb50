/**
 * Top-level splitting of value texts that the line parser hands over whole:
 * `2.55 ± 0.04`, `50 ohm +/- 5%` (tolerances) and `2.40 GHz .. 2.50 GHz` (ranges).
 * Markers inside parentheses are ignored. Offsets are 0-based UTF-16 offsets into `text`.
 */

/** A trimmed piece of the text with its exact range. */
export interface Span {
  readonly text: string;
  readonly start: number;
  readonly end: number;
}

/** Nominal part and optional tolerance; `percent` when the tolerance ends in `%` (excluded from its span). */
export interface ToleranceSplit {
  readonly nominal: Span;
  readonly tolerance: (Span & { readonly percent: boolean }) | null;
}

/** Splits at the first top-level `±` or `+/-`. */
export function splitTolerance(text: string): ToleranceSplit {
  const at = findTopLevel(text, ['\u00b1', '+/-']);
  if (at === null) return { nominal: span(text, 0, text.length), tolerance: null };
  const tol = span(text, at.end, text.length);
  const percent = tol.text.endsWith('%');
  const tolerance = percent ? span(text, tol.start, tol.end - 1) : tol;
  return { nominal: span(text, 0, at.start), tolerance: { ...tolerance, percent } };
}

/** Splits `low .. high` (or `low … high`) at the first top-level marker; `null` when there is none. */
export function splitRange(text: string): { readonly low: Span; readonly high: Span } | null {
  const at = findTopLevel(text, ['..', '\u2026']);
  if (at === null) return null;
  return { low: span(text, 0, at.start), high: span(text, at.end, text.length) };
}

function findTopLevel(text: string, markers: readonly string[]): { start: number; end: number } | null {
  let depth = 0;
  for (let i = 0; i < text.length; i++) {
    const ch = text.charAt(i);
    if (ch === '(') depth++;
    else if (ch === ')') depth = Math.max(0, depth - 1);
    else if (depth === 0) {
      for (const m of markers) if (text.startsWith(m, i)) return { start: i, end: i + m.length };
    }
  }
  return null;
}

function span(text: string, from: number, to: number): Span {
  let s = from;
  let e = to;
  while (s < e && /\s/.test(text.charAt(s))) s++;
  while (e > s && /\s/.test(text.charAt(e - 1))) e--;
  return { text: text.slice(s, e), start: s, end: e };
}
