/** `textDocument/documentSymbol`: one outline entry per declaration (flat `SymbolInformation` for old clients). */
import type { DocumentSymbol, SymbolInformation } from 'vscode-languageserver';
import type { ServerContext } from '../context.js';
import { toDocumentSymbol, toSymbolInformation } from '../convert.js';
import { checkParams } from '../params.js';

/** Installs the document-symbol handler. */
export function registerSymbols(ctx: ServerContext): void {
  ctx.connection.onDocumentSymbol((params, token) =>
    ctx.runSafe(token, [], async (): Promise<DocumentSymbol[] | SymbolInformation[]> => {
      checkParams(params);
      const uri = params.textDocument.uri;
      const ev = await ctx.documents.evaluated(uri);
      if (!ev) return [];
      const symbols = ctx.service.getSymbols(ev.doc);
      return ctx.client.hierarchicalSymbols ? symbols.map(toDocumentSymbol) : symbols.map((s) => toSymbolInformation(s, uri));
    }, 'textDocument/documentSymbol'),
  );
}
