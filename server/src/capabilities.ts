/** What the client supports (read once at `initialize`) and what the server offers in return. */
import {
  CodeActionKind,
  TextDocumentSyncKind,
  type ClientCapabilities,
  type ServerCapabilities,
} from 'vscode-languageserver';

/** The client capabilities the server's behaviour depends on. */
export interface ClientSupport {
  /** `textDocument/diagnostic`: pull diagnostics; otherwise push `publishDiagnostics`. */
  pullDiagnostics: boolean;
  diagnosticRefresh: boolean;
  inlayHintRefresh: boolean;
  /** `workspace/codeLens/refresh` (the plot lenses follow `stubwright.plotCodeLens`, which the client applies). */
  codeLensRefresh: boolean;
  /** `workspace/configuration`. */
  configuration: boolean;
  didChangeConfigurationRegistration: boolean;
  snippets: boolean;
  hierarchicalSymbols: boolean;
  codeActionLiterals: boolean;
  prepareRename: boolean;
}

/** Reads the client capabilities. */
export function clientSupport(c: ClientCapabilities): ClientSupport {
  const td = c.textDocument;
  return {
    pullDiagnostics: td?.diagnostic !== undefined,
    diagnosticRefresh: c.workspace?.diagnostics?.refreshSupport === true,
    inlayHintRefresh: c.workspace?.inlayHint?.refreshSupport === true,
    codeLensRefresh: c.workspace?.codeLens?.refreshSupport === true,
    configuration: c.workspace?.configuration === true,
    didChangeConfigurationRegistration: c.workspace?.didChangeConfiguration?.dynamicRegistration === true,
    snippets: td?.completion?.completionItem?.snippetSupport === true,
    hierarchicalSymbols: td?.documentSymbol?.hierarchicalDocumentSymbolSupport === true,
    codeActionLiterals: td?.codeAction?.codeActionLiteralSupport !== undefined,
    prepareRename: td?.rename?.prepareSupport === true,
  };
}

/** Characters after which a completion list is useful without typing a letter first. */
export const COMPLETION_TRIGGERS = [':', ',', ' '];

/** The server's capabilities for this client. */
export function serverCapabilities(s: ClientSupport): ServerCapabilities {
  return {
    positionEncoding: 'utf-16',
    textDocumentSync: { openClose: true, change: TextDocumentSyncKind.Incremental },
    hoverProvider: true,
    inlayHintProvider: { resolveProvider: false },
    codeActionProvider: s.codeActionLiterals ? { codeActionKinds: [CodeActionKind.QuickFix, CodeActionKind.RefactorRewrite] } : true,
    completionProvider: { triggerCharacters: COMPLETION_TRIGGERS, resolveProvider: false },
    documentSymbolProvider: { label: 'Stubwright' },
    definitionProvider: true,
    referencesProvider: true,
    renameProvider: s.prepareRename ? { prepareProvider: true } : true,
    codeLensProvider: { resolveProvider: false },
    ...(s.pullDiagnostics
      ? { diagnosticProvider: { identifier: 'stubwright', interFileDependencies: false, workspaceDiagnostics: false } }
      : {}),
  };
}
