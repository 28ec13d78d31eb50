import { CompletionItemKind, DiagnosticSeverity, InsertTextFormat, SymbolKind, type Diagnostic } from 'vscode-languageserver';
import { describe, expect, it } from 'vitest';
import type { SheetDiagnostic } from './core.js';
import { matchDiagnostics, snippetToPlain, toCompletionItem, toDiagnostic, toSymbolInformation } from './convert.js';

const range = (line: number, a: number, b: number) => ({ start: { line, character: a }, end: { line, character: b } });
const near: SheetDiagnostic = {
  range: range(16, 34, 41), severity: 'warning', code: 'near-resonance', message: 'lload is 2.0 % from resonance',
  related: [{ range: range(8, 5, 9), message: 'the line feed sets Z0 and εeff' }],
};

describe('convert', () => {
  it('maps a diagnostic: severity, code, source, related information in the same document', () => {
    expect(toDiagnostic(near, 'file:///a.rfsheet')).toEqual({
      range: near.range, severity: DiagnosticSeverity.Warning, code: 'near-resonance', source: 'stubwright', message: near.message,
      relatedInformation: [{ location: { uri: 'file:///a.rfsheet', range: range(8, 5, 9) }, message: 'the line feed sets Z0 and εeff' }],
    });
  });

  it("pairs the editor's diagnostics with the service's own, ignoring other sources", () => {
    const sent: Diagnostic = toDiagnostic(near, 'file:///a');
    const foreign: Diagnostic = { ...sent, source: 'spell' };
    const pairs = matchDiagnostics([foreign, sent], [near]);
    expect([...pairs]).toEqual([[near, sent]]);
  });

  it('resolves snippet placeholders to plain text for clients without snippets', () => {
    expect(snippetToPlain('stub ${1:tune}: ${2|open,short|} on ${3:feed}$0')).toBe('stub tune: open on feed');
    const item = { label: 'let …', kind: 'snippet' as const, insertText: 'let ${1:name} = ${2:2.45 GHz}', snippet: true };
    expect(toCompletionItem(item, true)).toMatchObject({ insertTextFormat: InsertTextFormat.Snippet, kind: CompletionItemKind.Snippet });
    expect(toCompletionItem(item, false)).toEqual({ label: 'let …', kind: CompletionItemKind.Snippet, insertText: 'let name = 2.45 GHz' });
  });

  it('gives flat symbols to clients without hierarchical outlines', () => {
    const s = { name: 'feed', kind: 'line' as const, detail: 'Z0 50 Ω', range: range(8, 0, 41), selectionRange: range(8, 5, 9) };
    expect(toSymbolInformation(s, 'file:///a')).toEqual({ name: 'feed', kind: SymbolKind.Class, location: { uri: 'file:///a', range: range(8, 0, 41) } });
  });
});
