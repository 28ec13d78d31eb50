/** `textDocument/completion`: keywords, keys, names and units; snippets only where the client supports them. */
import type { CompletionItem } from 'vscode-languageserver';
import type { ServerContext } from '../context.js';
import { clampPosition, toCompletionItem } from '../convert.js';
import { checkParams } from '../params.js';

/** Installs the completion handler. */
export function registerCompletion(ctx: ServerContext): void {
  ctx.connection.onCompletion((params, token) =>
    ctx.runSafe(token, [], async (): Promise<CompletionItem[]> => {
      checkParams(params, { position: true });
      const ev = await ctx.documents.evaluated(params.textDocument.uri);
      if (!ev) return [];
      return ctx.service
        .getCompletions(ev.doc, clampPosition(ev.text, params.position))
        .map((c) => toCompletionItem(c, ctx.client.snippets));
    }, 'textDocument/completion'),
  );
}
