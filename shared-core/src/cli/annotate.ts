/**
 * A sheet printed back unchanged with each declaration's key figures appended as a trailing
 * comment at one aligned column (pure). The notes are comments, so the output is still a sheet.
 */
import type { SheetResult } from '../sheet/types.js';
import { entryNote, type NoteOptions } from './notes.js';

/** Layout options. */
export interface AnnotateOptions extends NoteOptions {
  /** Notes start at most at this column (0-based display column, default 64); longer lines get two spaces. */
  maxColumn?: number;
}

/** Line breaks as the language service counts them (LSP: CRLF, LF or CR). */
export const LINE_BREAK = /\r\n|\r|\n/;

/** Display width of a line: code points, tabs to the next multiple of 8. */
export function displayWidth(text: string): number {
  let width = 0;
  for (const ch of text) width = ch === '\t' ? width + 8 - (width % 8) : width + 1;
  return width;
}

/** The sheet text with notes appended; lines are joined with `\n` and the result ends in one. */
export function annotateSheet(text: string, result: SheetResult, opts: AnnotateOptions = {}): string {
  const lines = text.split(LINE_BREAK);
  if (lines.length > 1 && lines[lines.length - 1] === '') lines.pop();
  const notes = new Map<number, string>();
  for (const entry of result.entries) {
    const note = entryNote(entry, opts);
    const at = entry.range.end.line;
    if (note !== null && at >= 0 && at < lines.length) notes.set(at, note);
  }
  const maxColumn = opts.maxColumn ?? 64;
  let column = 0;
  for (const at of notes.keys()) {
    const width = displayWidth((lines[at] as string).trimEnd());
    if (width + 2 <= maxColumn) column = Math.max(column, width + 2);
  }
  const out = lines.map((line, i) => {
    const note = notes.get(i);
    if (note === undefined) return line;
    const body = line.trimEnd();
    const pad = Math.max(2, column - displayWidth(body));
    return `${body}${' '.repeat(pad)}${note}`;
  });
  return `${out.join('\n')}\n`;
}
