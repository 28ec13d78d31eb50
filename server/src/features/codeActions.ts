/**
 * `textDocument/codeAction`: quick fixes and rewrites as literal code actions carrying a
 * WorkspaceEdit for the document. The editor's diagnostics are paired back to the service's own,
 * and `context.only` filters by kind.
 */
import type { CodeAction } from 'vscode-languageserver';
import type { ServerContext } from '../context.js';
import { matchDiagnostics, toCodeAction } from '../convert.js';
import { checkParams } from '../params.js';

/** Installs the code-action handler. */
export function registerCodeActions(ctx: ServerContext): void {
  ctx.connection.onCodeAction((params, token) =>
    ctx.runSafe(token, [], async (): Promise<CodeAction[]> => {
      checkParams(params, { range: true, context: 'diagnostics' });
      const uri = params.textDocument.uri;
      const ev = await ctx.documents.evaluated(uri);
      if (!ev) return [];
      const sent = matchDiagnostics(params.context.diagnostics, ctx.service.getDiagnostics(ev.doc));
      const only = params.context.only;
      return ctx.service
        .getCodeActions(ev.doc, params.range, [...sent.keys()])
        .map((a) => toCodeAction(a, uri, sent))
        .filter((a) => !only?.length || only.some((k) => a.kind === k || a.kind?.startsWith(`${k}.`)));
    }, 'textDocument/codeAction'),
  );
}
