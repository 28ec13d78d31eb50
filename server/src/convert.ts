/**
 * Service ↔ LSP shapes. Positions and ranges are already LSP-shaped (0-based, UTF-16), so these
 * are field mappings only: no RF logic and no decisions beyond what the client supports.
 */
import {
  CodeActionKind,
  CompletionItemKind,
  DiagnosticSeverity,
  InsertTextFormat,
  MarkupKind,
  SymbolKind,
  type CodeAction,
  type CompletionItem,
  type Diagnostic,
  type DocumentSymbol,
  type Hover,
  type InlayHint,
  type Position,
  type SymbolInformation,
  type WorkspaceEdit,
} from 'vscode-languageserver';
import type { TextDocument } from 'vscode-languageserver-textdocument';
import type {
  SheetCodeAction,
  SheetCompletionItem,
  SheetDiagnostic,
  SheetHover,
  SheetInlayHint,
  SheetSymbol,
  SheetTextEdit,
} from './core.js';

/** Every diagnostic carries this `source`. */
export const SOURCE = 'stubwright';

const SEVERITY: Record<SheetDiagnostic['severity'], DiagnosticSeverity> = {
  error: DiagnosticSeverity.Error,
  warning: DiagnosticSeverity.Warning,
  info: DiagnosticSeverity.Information,
};

/** A sheet diagnostic as an LSP diagnostic; related ranges point into the same document. */
export function toDiagnostic(d: SheetDiagnostic, uri: string): Diagnostic {
  const out: Diagnostic = { range: d.range, severity: SEVERITY[d.severity], code: d.code, source: SOURCE, message: d.message };
  if (d.related?.length) out.relatedInformation = d.related.map((r) => ({ location: { uri, range: r.range }, message: r.message }));
  return out;
}

const sameRange = (a: Diagnostic['range'], b: Diagnostic['range']) =>
  a.start.line === b.start.line && a.start.character === b.start.character && a.end.line === b.end.line && a.end.character === b.end.character;

/**
 * Pairs the diagnostics an editor sends back in a code-action request with the service's own
 * (same code, range and message), so the service sees the objects it produced.
 */
export function matchDiagnostics(sent: Diagnostic[], ours: SheetDiagnostic[]): Map<SheetDiagnostic, Diagnostic> {
  const pairs = new Map<SheetDiagnostic, Diagnostic>();
  for (const lsp of sent) {
    if (lsp.source !== undefined && lsp.source !== SOURCE) continue;
    const hit = ours.find((d) => !pairs.has(d) && d.code === lsp.code && d.message === lsp.message && sameRange(d.range, lsp.range));
    if (hit) pairs.set(hit, lsp);
  }
  return pairs;
}

/** Edits to one document as a WorkspaceEdit. */
export const toWorkspaceEdit = (uri: string, edits: SheetTextEdit[]): WorkspaceEdit => ({
  changes: { [uri]: edits.map((e) => ({ range: e.range, newText: e.newText })) },
});

/** A service code action as an LSP code action; `sent` maps back to the editor's own diagnostics. */
export function toCodeAction(a: SheetCodeAction, uri: string, sent: Map<SheetDiagnostic, Diagnostic>): CodeAction {
  const out: CodeAction = {
    title: a.title,
    kind: a.kind === 'quickfix' ? CodeActionKind.QuickFix : CodeActionKind.RefactorRewrite,
    edit: toWorkspaceEdit(uri, a.edits),
  };
  const diagnostics = (a.diagnostics ?? []).flatMap((d) => sent.get(d) ?? []);
  if (diagnostics.length) out.diagnostics = diagnostics;
  if (a.isPreferred) out.isPreferred = true;
  return out;
}

/** Hover with Markdown contents. */
export const toHover = (h: SheetHover): Hover => ({ contents: { kind: MarkupKind.Markdown, value: h.contents }, range: h.range });

/** An end-of-line figure: padded on the left so it never touches the text. */
export function toInlayHint(h: SheetInlayHint): InlayHint {
  const out: InlayHint = { position: h.position, label: h.label, paddingLeft: true };
  if (h.tooltip) out.tooltip = h.tooltip;
  return out;
}

const COMPLETION_KIND: Record<SheetCompletionItem['kind'], CompletionItemKind> = {
  keyword: CompletionItemKind.Keyword,
  property: CompletionItemKind.Property,
  reference: CompletionItemKind.Variable,
  unit: CompletionItemKind.Unit,
  snippet: CompletionItemKind.Snippet,
};

/** Snippet text with its placeholders resolved to their defaults (first choice), for clients without snippets. */
export function snippetToPlain(snippet: string): string {
  return snippet
    .replace(/\$\{\d+\|([^,|}]*)[^}]*\}/g, '$1')
    .replace(/\$\{\d+:([^}]*)\}/g, '$1')
    .replace(/\$\{\d+\}|\$\d+/g, '');
}

/** A completion item; snippets degrade to plain text when the client has no snippet support. */
export function toCompletionItem(c: SheetCompletionItem, snippets: boolean): CompletionItem {
  const out: CompletionItem = { label: c.label, kind: COMPLETION_KIND[c.kind] };
  if (c.detail) out.detail = c.detail;
  if (c.documentation) out.documentation = { kind: MarkupKind.Markdown, value: c.documentation };
  if (c.snippet && c.insertText !== undefined) {
    if (snippets) {
      out.insertText = c.insertText;
      out.insertTextFormat = InsertTextFormat.Snippet;
    } else out.insertText = snippetToPlain(c.insertText);
  } else if (c.insertText !== undefined) out.insertText = c.insertText;
  return out;
}

/**
 * Outline kinds: lets are constants, a substrate is the module its lines live in, lines are the
 * types stubs are cut from, stubs their instances, and a sweep is a series of points.
 */
export const SYMBOL_KIND: Record<SheetSymbol['kind'], SymbolKind> = {
  let: SymbolKind.Constant,
  substrate: SymbolKind.Module,
  line: SymbolKind.Class,
  stub: SymbolKind.Object,
  sweep: SymbolKind.Array,
};

/** A hierarchical outline entry (declarations have no children). */
export const toDocumentSymbol = (s: SheetSymbol): DocumentSymbol => ({
  name: s.name,
  kind: SYMBOL_KIND[s.kind],
  detail: s.detail,
  range: s.range,
  selectionRange: s.selectionRange,
});

/** A flat outline entry, for clients without hierarchical document symbols. */
export const toSymbolInformation = (s: SheetSymbol, uri: string): SymbolInformation => ({
  name: s.name,
  kind: SYMBOL_KIND[s.kind],
  location: { uri, range: s.range },
});

/** The position clamped into the document (a client may send one past the end). */
export const clampPosition = (doc: TextDocument, p: Position): Position => doc.positionAt(doc.offsetAt(p));
