/** `textDocument/hover`: the service's Markdown summary of a declaration or a name. */
import type { Hover } from 'vscode-languageserver';
import type { ServerContext } from '../context.js';
import { clampPosition, toHover } from '../convert.js';
import { checkParams } from '../params.js';

/** Installs the hover handler. */
export function registerHover(ctx: ServerContext): void {
  ctx.connection.onHover((params, token) =>
    ctx.runSafe(token, null, async (): Promise<Hover | null> => {
      checkParams(params, { position: true });
      const ev = await ctx.documents.evaluated(params.textDocument.uri);
      if (!ev) return null;
      const hover = ctx.service.getHover(ev.doc, clampPosition(ev.text, params.position));
      return hover ? toHover(hover) : null;
    }, 'textDocument/hover'),
  );
}
