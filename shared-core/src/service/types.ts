/**
 * The sheet language service's editor-facing API. Editor-neutral shapes (positions are 0-based
 * line / UTF-16 character, as LSP uses) so the server maps them onto LSP with no logic of its own.
 */
import type { Position, Range, SheetDiagnostic, SheetResult } from '../sheet/types.js';

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
  kind: 'let' | 'substrate' | 'line' | 'stub';
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
