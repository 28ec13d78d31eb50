/**
 * A scripted LSP client for tests: spawns the bundled server (`node server/dist/server.js --stdio`),
 * talks JSON-RPC to it over the child's pipes with vscode-languageserver-protocol, and answers the
 * server's requests the way an editor would (workspace/configuration from `settings`,
 * client/registerCapability, the refresh requests (diagnostics, inlay hints, code lenses),
 * window/workDoneProgress/create).
 * Every server→client message is recorded in `events`; `waitFor` resolves on the first matching
 * one (already received or yet to come) and fails after a timeout, so tests never sleep.
 */
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import {
  CodeLensRefreshRequest,
  ConfigurationRequest,
  DiagnosticRefreshRequest,
  DidChangeTextDocumentNotification,
  DidCloseTextDocumentNotification,
  DidOpenTextDocumentNotification,
  ExitNotification,
  InitializedNotification,
  InitializeRequest,
  InlayHintRefreshRequest,
  LogMessageNotification,
  PublishDiagnosticsNotification,
  RegistrationRequest,
  ShowMessageNotification,
  ShutdownRequest,
  StreamMessageReader,
  StreamMessageWriter,
  WorkDoneProgressCreateRequest,
  createProtocolConnection,
  type ClientCapabilities,
  type InitializeResult,
  type ProtocolConnection,
  type TextDocumentContentChangeEvent,
} from 'vscode-languageserver-protocol/node';

/** The bundle under test. */
export const SERVER_BUNDLE = fileURLToPath(new URL('../../server/dist/server.js', import.meta.url));
const BUILD_SCRIPT = fileURLToPath(new URL('../../server/build.mjs', import.meta.url));

/** Builds the bundle (esbuild, about 2 s; safe to run from parallel test files). */
export function buildServer(): void {
  execFileSync(process.execPath, [BUILD_SCRIPT], { stdio: ['ignore', 'inherit', 'inherit'] });
}

/** What an editor with pull diagnostics (VS Code 1.9x) announces, trimmed to what the server reads. */
export const PULL_CAPABILITIES: ClientCapabilities = {
  workspace: {
    configuration: true,
    didChangeConfiguration: { dynamicRegistration: true },
    diagnostics: { refreshSupport: true },
    inlayHint: { refreshSupport: true },
    codeLens: { refreshSupport: true },
    workspaceEdit: { documentChanges: true },
  },
  textDocument: {
    synchronization: { dynamicRegistration: false, didSave: false },
    diagnostic: { dynamicRegistration: false, relatedDocumentSupport: false },
    publishDiagnostics: { relatedInformation: true, versionSupport: true },
    hover: { contentFormat: ['markdown', 'plaintext'] },
    completion: { completionItem: { snippetSupport: true, documentationFormat: ['markdown', 'plaintext'] } },
    documentSymbol: { hierarchicalDocumentSymbolSupport: true },
    codeAction: { codeActionLiteralSupport: { codeActionKind: { valueSet: ['quickfix', 'refactor', 'refactor.rewrite'] } }, isPreferredSupport: true },
    rename: { prepareSupport: true },
    inlayHint: { dynamicRegistration: false },
    codeLens: { dynamicRegistration: false },
    definition: {},
    references: {},
  },
  window: { workDoneProgress: true },
};

/** The same editor without pull diagnostics: the server must push. */
export const PUSH_CAPABILITIES: ClientCapabilities = {
  ...PULL_CAPABILITIES,
  workspace: { ...PULL_CAPABILITIES.workspace, diagnostics: { refreshSupport: false } },
  textDocument: (({ diagnostic: _dropped, ...rest }) => rest)(PULL_CAPABILITIES.textDocument ?? {}),
};

/** One message the server sent to the client. */
export interface ServerEvent {
  method: string;
  params: unknown;
}

/** A running server and the client talking to it. */
export interface LspClient {
  connection: ProtocolConnection;
  child: ChildProcess;
  initializeResult: InitializeResult;
  /** The `stubwright` section answered to workspace/configuration; mutate it, then notify a change. */
  settings: Record<string, unknown>;
  events: ServerEvent[];
  stderr(): string;
  /**
   * First event with `method` satisfying `match`, already received (from index `after` on) or yet
   * to come; rejects after `timeoutMs` (default 5000) with the last events and the server's stderr.
   */
  waitFor<P>(method: string, match?: (params: P) => boolean, options?: { after?: number; timeoutMs?: number }): Promise<P>;
  /** Holds workspace/configuration answers until `release()`; `requested` resolves when one arrives. */
  holdConfiguration(): { requested: Promise<void>; release(): void };
  open(uri: string, text: string, version?: number): Promise<void>;
  change(uri: string, version: number, changes: TextDocumentContentChangeEvent[]): Promise<void>;
  close(uri: string): Promise<void>;
  /** shutdown + exit; resolves with the process exit code. */
  shutdown(): Promise<number | null>;
}

/** Options of `startClient`. */
export interface StartOptions {
  capabilities?: ClientCapabilities;
  settings?: Record<string, unknown>;
  /** Node options placed before the bundle (e.g. the permission model's flags). */
  nodeArgs?: string[];
}

/** Spawns the bundled server and completes initialize/initialized. */
export async function startClient(options: StartOptions = {}): Promise<LspClient> {
  const child = spawn(process.execPath, [...(options.nodeArgs ?? []), SERVER_BUNDLE, '--stdio'], { stdio: ['pipe', 'pipe', 'pipe'] });
  let stderr = '';
  child.stderr!.setEncoding('utf8').on('data', (s: string) => (stderr += s));
  const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
  const connection = createProtocolConnection(new StreamMessageReader(child.stdout!), new StreamMessageWriter(child.stdin!));

  const events: ServerEvent[] = [];
  const waiters: { method: string; match: (p: unknown) => boolean; resolve: (p: unknown) => void }[] = [];
  const record = (method: string, params: unknown) => {
    events.push({ method, params });
    for (const w of [...waiters]) {
      if (w.method === method && w.match(params)) {
        waiters.splice(waiters.indexOf(w), 1);
        w.resolve(params);
      }
    }
  };
  const settings: Record<string, unknown> = { ...options.settings };
  let hold: Promise<void> | undefined;
  let onConfigRequest: (() => void) | undefined;

  connection.onRequest(ConfigurationRequest.type, async (params) => {
    record(ConfigurationRequest.method, params);
    onConfigRequest?.();
    if (hold) await hold;
    return params.items.map((item) => (item.section === 'stubwright' ? { ...settings } : null));
  });
  connection.onRequest(RegistrationRequest.type, (params) => void record(RegistrationRequest.method, params));
  connection.onRequest(DiagnosticRefreshRequest.type, () => void record(DiagnosticRefreshRequest.method, null));
  connection.onRequest(InlayHintRefreshRequest.type, () => void record(InlayHintRefreshRequest.method, null));
  connection.onRequest(CodeLensRefreshRequest.type, () => void record(CodeLensRefreshRequest.method, null));
  connection.onRequest(WorkDoneProgressCreateRequest.type, (params) => void record(WorkDoneProgressCreateRequest.method, params));
  connection.onNotification(PublishDiagnosticsNotification.type, (params) => record(PublishDiagnosticsNotification.method, params));
  connection.onNotification(LogMessageNotification.type, (params) => record(LogMessageNotification.method, params));
  connection.onNotification(ShowMessageNotification.type, (params) => record(ShowMessageNotification.method, params));
  connection.listen();

  const initializeResult = await connection.sendRequest(InitializeRequest.type, {
    processId: process.pid,
    rootUri: null,
    capabilities: options.capabilities ?? PULL_CAPABILITIES,
    clientInfo: { name: 'stubwright-test-client' },
  });
  await connection.sendNotification(InitializedNotification.type, {});

  return {
    connection,
    child,
    initializeResult,
    settings,
    events,
    stderr: () => stderr,
    waitFor<P>(method: string, match: (params: P) => boolean = () => true, { after = 0, timeoutMs = 5000 } = {}): Promise<P> {
      const seen = events.slice(after).find((e) => e.method === method && match(e.params as P));
      if (seen) return Promise.resolve(seen.params as P);
      return new Promise<P>((resolve, reject) => {
        const waiter = { method, match: match as (p: unknown) => boolean, resolve: (p: unknown) => (clearTimeout(timer), resolve(p as P)) };
        const timer = setTimeout(() => {
          waiters.splice(waiters.indexOf(waiter), 1);
          const recent = events.slice(-5).map((e) => `${e.method} ${JSON.stringify(e.params).slice(0, 200)}`);
          reject(new Error(`no ${method} matching within ${timeoutMs} ms; last events:\n${recent.join('\n')}\nserver stderr:\n${stderr}`));
        }, timeoutMs);
        waiters.push(waiter);
      });
    },
    holdConfiguration() {
      let release!: () => void;
      hold = new Promise<void>((r) => (release = r));
      const requested = new Promise<void>((r) => (onConfigRequest = r));
      return {
        requested,
        release: () => {
          hold = undefined;
          onConfigRequest = undefined;
          release();
        },
      };
    },
    open: (uri, text, version = 1) =>
      connection.sendNotification(DidOpenTextDocumentNotification.type, { textDocument: { uri, languageId: 'rfsheet', version, text } }),
    change: (uri, version, contentChanges) =>
      connection.sendNotification(DidChangeTextDocumentNotification.type, { textDocument: { uri, version }, contentChanges }),
    close: (uri) => connection.sendNotification(DidCloseTextDocumentNotification.type, { textDocument: { uri } }),
    async shutdown() {
      await connection.sendRequest(ShutdownRequest.type);
      await connection.sendNotification(ExitNotification.type);
      const code = await exited;
      connection.dispose();
      return code;
    },
  };
}

/** Applies LSP text edits (non-overlapping, any order) to a text: what an editor does with a WorkspaceEdit. */
export function applyEdits(text: string, edits: { range: { start: Pos; end: Pos }; newText: string }[]): string {
  const lines = text.split('\n');
  const offset = (p: Pos) => lines.slice(0, p.line).reduce((n, l) => n + l.length + 1, 0) + p.character;
  return [...edits]
    .sort((a, b) => offset(b.range.start) - offset(a.range.start))
    .reduce((t, e) => t.slice(0, offset(e.range.start)) + e.newText + t.slice(offset(e.range.end)), text);
}

interface Pos {
  line: number;
  character: number;
}
