/**
 * The sheet language service's editor-facing API. Editor-neutral shapes (positions are 0-based
 * line / UTF-16 character, as LSP uses) so the server maps them onto LSP with no logic of its own.
 */
import type { EntryKind, Position, Range, SheetDiagnostic, SheetResult } from '../sheet/types.js';

export interface ServiceSettings {
  /** Resonance margin, percent (default 10). */
  marginPct: number;
  /** Manufacturing grid for written-back lengths and widths, metres (default 0.01 mm). */
  gridM: number;
  /** Unit for displayed lengths. */
  lengthUnit: 'mm' | 'mil';
  /** Show inlay hints. */
  inlayHints: boolean;
}

export const DEFAULT_SETTINGS: ServiceSettings = { marginPct: 10, gridM: 10e-6, lengthUnit: 'mm', inlayHints: true };

export interface TextEdit {
  range: Range;
  newText: string;
}

export interface Hover {
  /** Markdown. */
  contents: string;
  range: Range;
}

export interface InlayHint {
  position: Position;
  label: string;
  tooltip?: string;
}

export interface CodeAction {
  title: string;
  kind: 'quickfix' | 'refactor.rewrite';
  /** Diagnostics this action fixes (by identity from getDiagnostics). */
  diagnostics?: SheetDiagnostic[];
  edits: TextEdit[];
  isPreferred?: boolean;
}

export type CompletionKind = 'keyword' | 'property' | 'reference' | 'unit' | 'snippet';

export interface CompletionItem {
  label: string;
  kind: CompletionKind;
  detail?: string;
  documentation?: string;
  /** Text to insert (defaults to label); may use snippet syntax when `snippet` is true. */
  insertText?: string;
  snippet?: boolean;
}

export interface DocumentSymbol {
  name: string;
  kind: EntryKind;
  detail: string;
  range: Range;
  selectionRange: Range;
}

export interface Location {
  range: Range;
}

/**
 * One open document as the service sees it: its text and its evaluation (computed once per version
 * by `SheetDocuments`, passed to every feature).
 */
export interface EvaluatedDocument {
  text: string;
  lines: string[];
  result: SheetResult;
  /** Settings the document was evaluated and is displayed with. */
  settings: ServiceSettings;
}

/** Plot views: over frequency (the drawn length fixed), or over drawn length (at the stub's `at`). */
export type PlotView = 'frequency' | 'length';

export interface PlotOptions {
  view?: PlotView;
  /** Frequency range and number of points; default: the sweep's range, or a span around `at`. */
  fromHz?: number;
  toHz?: number;
  points?: number;
  /** Drawn-length range of the length view, m. */
  fromM?: number;
  toM?: number;
  /** Unit of lengths on the plot (default: the document's setting). */
  lengthUnit?: 'mm' | 'mil';
}

export interface PlotMarker {
  kind: 'resonance' | 'operating';
  /** Hz in the frequency view, m in the length view. */
  x: number;
  label: string;
  resonanceType?: 'series' | 'parallel';
}

export interface PlotResult {
  name: string;
  /** What is plotted: a stub (also for a sweep of a stub) or a line (also a line section). */
  entryKind: 'stub' | 'line';
  view: PlotView;
  title: string;
  /** Self-contained SVG, the bytes `stubwright plot --svg` writes. */
  svg: string;
  markers: PlotMarker[];
  /** The stub's band, Hz, when it has one. */
  band?: [number, number];
}

export interface PlotTarget {
  name: string;
  kind: 'stub' | 'line';
  /** The declaration (without its trailing comment). */
  range: Range;
  /** For a sweep: the stub or line it sweeps. */
  sweepOf?: string;
}

export interface ExportOptions {
  fromHz?: number;
  toHz?: number;
  points?: number;
  /** Touchstone of a stub: 1 (default, `.s1p`: the stub from a node to ground) or 2 (`.s2p`: the stub in shunt). */
  ports?: 1 | 2;
  /** Reference impedance, Ω (default: the sweep's `ref`, else 50). */
  referenceOhm?: number;
  /** Name of the sheet for the file's comment header (e.g. its file name). */
  source?: string;
}

export interface ExportResult {
  text: string;
  /** Suggested file name, e.g. `trap.s1p`, `feedsec.s2p`, `trap.csv`. */
  fileName: string;
}
