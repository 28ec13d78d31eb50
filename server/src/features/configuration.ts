/**
 * `workspace/didChangeConfiguration`: drop every cached setting, then have the client re-pull
 * diagnostics, inlay hints and code lenses (or re-push diagnostics for push clients).
 */
import { CodeLensRefreshRequest, DidChangeConfigurationNotification } from 'vscode-languageserver';
import type { ServerContext } from '../context.js';
import type { RefreshDiagnostics } from './diagnostics.js';

/** Installs the configuration-change handler; returns what to run once the client sent `initialized`. */
export function registerConfiguration(ctx: ServerContext, refreshDiagnostics: RefreshDiagnostics): () => void {
  const { connection } = ctx;
  connection.onDidChangeConfiguration((params) => {
    ctx.settings.clear(params.settings);
    refreshDiagnostics();
    if (ctx.client.inlayHintRefresh) {
      connection.languages.inlayHint.refresh().catch((e: unknown) => connection.console.error(`inlay hint refresh failed: ${String(e)}`));
    }
    if (ctx.client.codeLensRefresh) {
      connection.sendRequest(CodeLensRefreshRequest.type).catch((e: unknown) => connection.console.error(`code lens refresh failed: ${String(e)}`));
    }
  });
  return () => {
    if (ctx.client.didChangeConfigurationRegistration) {
      connection.client.register(DidChangeConfigurationNotification.type, { section: 'stubwright' })
        .catch((e: unknown) => connection.console.error(`registering for configuration changes failed: ${String(e)}`));
    }
  };
}
