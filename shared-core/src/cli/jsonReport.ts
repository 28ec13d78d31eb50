/**
 * The pinned JSON report (other tools read it: keys are only ever added, never renamed). Pure.
 * Lines and columns are 1-based; columns count UTF-16 code units; `endColumn` is exclusive.
 */
import type {
  DiagnosticCode, EntryKind, ResultValue, SheetDiagnostic, SheetResult, Severity,
} from '../sheet/types.js';

/** A related location of a diagnostic (present only when the diagnostic has some). */
export interface JsonRelated {
  line: number;
  column: number;
  endLine: number;
  endColumn: number;
  message: string;
}

/** One diagnostic, 1-based. */
export interface JsonDiagnostic {
  line: number;
  column: number;
  endLine: number;
  endColumn: number;
  severity: Severity;
  code: DiagnosticCode;
  message: string;
  related?: JsonRelated[];
}

/** One declaration with its SI results (null where not defined or not finite). */
export interface JsonEntry {
  line: number;
  kind: EntryKind;
  name: string;
  results: Record<string, ResultValue>;
}

/** The report of one sheet. */
export interface JsonSheetReport {
  file: string;
  entries: JsonEntry[];
  diagnostics: JsonDiagnostic[];
}

/** Diagnostics in reading order (line, then column), stable for equal positions. */
export function sortDiagnostics(diagnostics: readonly SheetDiagnostic[]): SheetDiagnostic[] {
  return [...diagnostics].sort(
    (a, b) => a.range.start.line - b.range.start.line || a.range.start.character - b.range.start.character,
  );
}

function finiteOrNull(value: ResultValue): ResultValue {
  return typeof value === 'number' && !Number.isFinite(value) ? null : value;
}

function toJsonDiagnostic(d: SheetDiagnostic): JsonDiagnostic {
  const out: JsonDiagnostic = {
    line: d.range.start.line + 1,
    column: d.range.start.character + 1,
    endLine: d.range.end.line + 1,
    endColumn: d.range.end.character + 1,
    severity: d.severity,
    code: d.code,
    message: d.message,
  };
  if (d.related && d.related.length > 0) {
    out.related = d.related.map((r) => ({
      line: r.range.start.line + 1,
      column: r.range.start.character + 1,
      endLine: r.range.end.line + 1,
      endColumn: r.range.end.character + 1,
      message: r.message,
    }));
  }
  return out;
}

/** Builds the JSON report of one evaluated sheet; `file` is the path as the user gave it. */
export function toJsonReport(file: string, result: SheetResult): JsonSheetReport {
  const entries = [...result.entries]
    .sort((a, b) => a.line - b.line)
    .map((e) => ({
      line: e.line + 1,
      kind: e.kind,
      name: e.name,
      results: Object.fromEntries(Object.entries(e.results).map(([k, v]) => [k, finiteOrNull(v)])),
    }));
  return { file, entries, diagnostics: sortDiagnostics(result.diagnostics).map(toJsonDiagnostic) };
}

/**
 * Serializes reports: the object itself when the user named one file (`single`), else an array in
 * the order the files were given. Two-space indentation, trailing newline.
 */
export function renderJson(reports: readonly JsonSheetReport[], single: boolean): string {
  const value = single && reports.length === 1 ? reports[0] : reports;
  return `${JSON.stringify(value, null, 2)}\n`;
}
