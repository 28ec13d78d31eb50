/**
 * Engineer spellings → mathjs spellings, with a position map back to the original text.
 *
 * Identifiers holding µ/μ or Ω/Ω are rewritten (µ, μ → `u`; Ω → `ohm`) only when the result is a
 * unit (`µm` → `um`, `kΩ` → `kohm`, `µH` → `uH`); anything else (`μr`, `Ωx`) is left as written, so
 * names and errors keep the engineer's spelling. Symbols such as `°`, `×`, `−` are rewritten anywhere.
 */
import { CHAR_REWRITES, isIdentPart, isIdentStart, isMicro, isOhm } from './chars.js';

/** For each mapped UTF-16 unit, the original range that produced it. */
export interface PosMap {
  readonly starts: readonly number[];
  readonly ends: readonly number[];
  readonly originalLength: number;
}

/** Mapped text and its position map (`null` when the text needed no rewriting). */
export interface Normalized {
  readonly text: string;
  readonly map: PosMap | null;
}

/** Rewrites engineer spellings; `isUnitName` decides whether a µ/Ω identifier is a unit. */
export function normalizeSpelling(text: string, isUnitName: (name: string) => boolean): Normalized {
  if (!/[^\x00-\x7f]/.test(text)) return { text, map: null };
  let out = '';
  const starts: number[] = [];
  const ends: number[] = [];
  const emit = (piece: string, from: number, to: number): void => {
    out += piece;
    for (let k = 0; k < piece.length; k++) {
      starts.push(from);
      ends.push(to);
    }
  };
  let i = 0;
  while (i < text.length) {
    const c = text.charCodeAt(i);
    if (isIdentStart(c)) {
      let j = i + 1;
      while (j < text.length && isIdentPart(text.charCodeAt(j))) j++;
      emitIdentifier(text, i, j, isUnitName, emit);
      i = j;
      continue;
    }
    const ch = text.charAt(i);
    emit(CHAR_REWRITES.get(ch) ?? ch, i, i + 1);
    i++;
  }
  starts.push(text.length);
  return { text: out, map: { starts, ends, originalLength: text.length } };
}

function emitIdentifier(
  text: string, from: number, to: number, isUnitName: (name: string) => boolean,
  emit: (piece: string, from: number, to: number) => void,
): void {
  let rewritten = '';
  let changed = false;
  for (let k = from; k < to; k++) {
    const c = text.charCodeAt(k);
    if (isMicro(c)) { rewritten += 'u'; changed = true; }
    else if (isOhm(c)) { rewritten += 'ohm'; changed = true; }
    else rewritten += text.charAt(k);
  }
  const keep = !changed || !isUnitName(rewritten);
  for (let k = from; k < to; k++) {
    const c = text.charCodeAt(k);
    const piece = keep ? text.charAt(k) : isMicro(c) ? 'u' : isOhm(c) ? 'ohm' : text.charAt(k);
    emit(piece, k, k + 1);
  }
}

/** Maps a range of the mapped text back to the original text. */
export function toOriginal(map: PosMap | null, start: number, end: number): { start: number; end: number } {
  if (map === null) return { start, end };
  const s = map.starts[start] ?? map.originalLength;
  const e = end > start ? (map.ends[end - 1] ?? map.originalLength) : s;
  return { start: s, end: e };
}
