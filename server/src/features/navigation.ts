/** `textDocument/definition` and `textDocument/references` within one sheet. */
import type { Location } from 'vscode-languageserver';
import type { ServerContext } from '../context.js';
import { clampPosition } from '../convert.js';
import { checkParams } from '../params.js';

/** Installs the definition and references handlers. */
export function registerNavigation(ctx: ServerContext): void {
  ctx.connection.onDefinition((params, token) =>
    ctx.runSafe(token, null, async (): Promise<Location | null> => {
      checkParams(params, { position: true });
      const uri = params.textDocument.uri;
      const ev = await ctx.documents.evaluated(uri);
      if (!ev) return null;
      const hit = ctx.service.getDefinition(ev.doc, clampPosition(ev.text, params.position));
      return hit ? { uri, range: hit.range } : null;
    }, 'textDocument/definition'),
  );
  ctx.connection.onReferences((params, token) =>
    ctx.runSafe(token, [], async (): Promise<Location[]> => {
      checkParams(params, { position: true, context: 'includeDeclaration' });
      const uri = params.textDocument.uri;
      const ev = await ctx.documents.evaluated(uri);
      if (!ev) return [];
      return ctx.service
        .getReferences(ev.doc, clampPosition(ev.text, params.position), params.context.includeDeclaration)
        .map((l) => ({ uri, range: l.range }));
    }, 'textDocument/references'),
  );
}
