/**
 * `textDocument/prepareRename` and `textDocument/rename`. A refused name comes back as a
 * `RequestFailed` error whose message the editor shows.
 */
import { LSPErrorCodes, ResponseError, type PrepareRenameResult, type WorkspaceEdit } from 'vscode-languageserver';
import type { ServerContext } from '../context.js';
import { clampPosition, toWorkspaceEdit } from '../convert.js';
import { checkParams } from '../params.js';

/** Installs the rename handlers. */
export function registerRename(ctx: ServerContext): void {
  ctx.connection.onPrepareRename((params, token) =>
    ctx.runSafe(token, null, async (): Promise<PrepareRenameResult | null> => {
      checkParams(params, { position: true });
      const ev = await ctx.documents.evaluated(params.textDocument.uri);
      if (!ev) return null;
      return ctx.service.prepareRename(ev.doc, clampPosition(ev.text, params.position));
    }, 'textDocument/prepareRename'),
  );
  ctx.connection.onRenameRequest((params, token) =>
    ctx.runSafe(token, null, async (): Promise<WorkspaceEdit | null> => {
      checkParams(params, { position: true, newName: true });
      const uri = params.textDocument.uri;
      const ev = await ctx.documents.evaluated(uri);
      if (!ev) return null;
      const result = ctx.service.getRename(ev.doc, clampPosition(ev.text, params.position), params.newName);
      if ('error' in result) throw new ResponseError(LSPErrorCodes.RequestFailed, result.error);
      return toWorkspaceEdit(uri, result.edits);
    }, 'textDocument/rename'),
  );
}
