/**
 * `startServer`: wires one Stubwright language server onto an LSP connection. Thin adapters only:
 * every answer comes from the sheet language service; this file chooses pull or push diagnostics
 * from the client's capabilities and installs one adapter per feature.
 */
import type { Connection, InitializeResult } from 'vscode-languageserver';
import { clientSupport, serverCapabilities, type ClientSupport } from './capabilities.js';
import type { ServerContext, Timers } from './context.js';
import { createSheetService, type SheetService } from './core.js';
import { createSheetDocuments } from './documents.js';
import { registerCodeActions } from './features/codeActions.js';
import { registerCompletion } from './features/completion.js';
import { registerConfiguration } from './features/configuration.js';
import { registerDiagnostics } from './features/diagnostics.js';
import { registerHover } from './features/hover.js';
import { registerInlayHints } from './features/inlayHints.js';
import { registerNavigation } from './features/navigation.js';
import { registerPlot } from './features/plot.js';
import { registerRename } from './features/rename.js';
import { registerSymbols } from './features/symbols.js';
import { createRunSafe } from './runSafe.js';
import { createSettingsStore } from './settings.js';
import { SERVER_VERSION } from './version.js';

/** Everything the server takes from outside; all optional. */
export interface ServerDeps {
  /** The sheet language service (default: a fresh `createSheetService()`). */
  service?: SheetService;
  /** Reported in `serverInfo.version` (default: the Stubwright version). */
  version?: string;
  /** Debounce of pushed diagnostics, ms (default 150). */
  pushDebounceMs?: number;
  /** Timer functions (default: the global ones). */
  timers?: Timers;
}

const defaultTimers: Timers = {
  setTimeout: (fn, ms) => setTimeout(fn, ms),
  clearTimeout: (handle) => clearTimeout(handle as NodeJS.Timeout),
};

/** Installs every handler on `connection` and starts listening. */
export function startServer(connection: Connection, deps: ServerDeps = {}): void {
  const service = deps.service ?? createSheetService();
  let client: ClientSupport = clientSupport({}); // until `initialize` says more
  const settings = createSettingsStore({
    get pull() {
      return client.configuration;
    },
    fetch: (uri) => connection.workspace.getConfiguration({ scopeUri: uri, section: 'stubwright' }),
    warn: (message) => connection.console.warn(message),
  });
  const ctx: ServerContext = {
    connection,
    service,
    settings,
    documents: createSheetDocuments(service, settings),
    runSafe: createRunSafe((message) => connection.console.error(message)),
    get client() {
      return client;
    },
    timers: deps.timers ?? defaultTimers,
    pushDebounceMs: deps.pushDebounceMs ?? 150,
  };

  connection.onInitialize((params): InitializeResult => {
    client = clientSupport(params.capabilities);
    return { capabilities: serverCapabilities(client), serverInfo: { name: 'stubwright', version: deps.version ?? SERVER_VERSION } };
  });

  const refreshDiagnostics = registerDiagnostics(ctx);
  const afterInitialized = registerConfiguration(ctx, refreshDiagnostics);
  connection.onInitialized(afterInitialized);
  registerInlayHints(ctx);
  registerHover(ctx);
  registerCodeActions(ctx);
  registerCompletion(ctx);
  registerSymbols(ctx);
  registerNavigation(ctx);
  registerRename(ctx);
  registerPlot(ctx);

  ctx.documents.open.listen(connection);
  connection.listen();
}
