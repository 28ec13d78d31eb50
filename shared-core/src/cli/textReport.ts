/** Plain-text diagnostics, one line each: `FILE:LINE:COL: SEVERITY [CODE] MESSAGE` (1-based). Pure. */
import type { SheetDiagnostic, SheetResult } from '../sheet/types.js';
import { sortDiagnostics } from './jsonReport.js';

/** One diagnostic as one line (line breaks inside the message become spaces). */
export function formatDiagnosticLine(file: string, d: SheetDiagnostic): string {
  const message = d.message.replace(/\s*[\r\n]+\s*/g, ' ');
  return `${file}:${d.range.start.line + 1}:${d.range.start.character + 1}: ${d.severity} [${d.code}] ${message}`;
}

/** All diagnostics of a sheet in reading order, each line ending in a newline ('' when clean). */
export function formatDiagnostics(file: string, result: SheetResult): string {
  return sortDiagnostics(result.diagnostics).map((d) => `${formatDiagnosticLine(file, d)}\n`).join('');
}

/** Diagnostic counts by severity. */
export interface Counts {
  error: number;
  warning: number;
  info: number;
}

/** Counts diagnostics by severity over several sheets. */
export function countDiagnostics(results: readonly SheetResult[]): Counts {
  const counts: Counts = { error: 0, warning: 0, info: 0 };
  for (const r of results) for (const d of r.diagnostics) counts[d.severity]++;
  return counts;
}

const plural = (n: number, word: string): string => `${n} ${word}${n === 1 ? '' : 's'}`;

/** `3 files: 1 error, 2 warnings, 0 infos`. */
export function formatSummary(files: number, counts: Counts): string {
  return `${plural(files, 'file')}: ${plural(counts.error, 'error')}, ${plural(counts.warning, 'warning')}, ${plural(counts.info, 'info')}`;
}
