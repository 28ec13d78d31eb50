/** `textDocument/inlayHint`: the service's end-of-declaration figures; none when `stubwright.inlayHints` is off. */
import type { ServerContext } from '../context.js';
import { toInlayHint } from '../convert.js';
import { checkParams } from '../params.js';

/** Installs the inlay-hint handler. */
export function registerInlayHints(ctx: ServerContext): void {
  ctx.connection.languages.inlayHint.on((params, token) =>
    ctx.runSafe(token, [], async () => {
      checkParams(params, { range: true });
      const ev = await ctx.documents.evaluated(params.textDocument.uri);
      if (!ev || !ev.doc.settings.inlayHints) return [];
      return ctx.service.getInlayHints(ev.doc, params.range).map(toInlayHint);
    }, 'textDocument/inlayHint'),
  );
}
