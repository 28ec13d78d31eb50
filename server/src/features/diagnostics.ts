/**
 * Diagnostics, pulled or pushed as the client prefers (chosen at `initialize`).
 *
 * Pull: `textDocument/diagnostic` answers a full report with a result id made of the open
 * document's serial, the number of changes it has seen (not the client's version, which a faulty
 * client may repeat) and the settings generation, or `unchanged` when the client
 * already holds that id. Push: `publishDiagnostics` debounced per document and tagged with the
 * version it was computed for; a result whose document moved on meanwhile is dropped, never sent.
 */
import { DocumentDiagnosticReportKind, type DocumentDiagnosticReport } from 'vscode-languageserver';
import type { ServerContext } from '../context.js';
import { toDiagnostic } from '../convert.js';
import { checkParams } from '../params.js';

/** Re-publishes (push) or asks the client to re-pull (pull) every open document's diagnostics. */
export type RefreshDiagnostics = () => void;

/** Installs both modes; the client's capabilities decide which one acts. */
export function registerDiagnostics(ctx: ServerContext): RefreshDiagnostics {
  const { connection, documents, service, settings } = ctx;
  const serials = new Map<string, number>();
  // Changes seen per document: the client's version numbers are not trusted to increase.
  const changes = new Map<string, number>();
  let nextSerial = 1;
  documents.open.onDidOpen((e) => serials.set(e.document.uri, nextSerial++));
  documents.open.onDidChangeContent((e) => changes.set(e.document.uri, (changes.get(e.document.uri) ?? 0) + 1));

  const resultId = (uri: string, generation: number) => `${serials.get(uri) ?? 0}.${changes.get(uri) ?? 0}.${generation}`;
  const empty: DocumentDiagnosticReport = { kind: DocumentDiagnosticReportKind.Full, items: [] };

  connection.languages.diagnostics.on((params, token) =>
    ctx.runSafe(token, empty, async (): Promise<DocumentDiagnosticReport> => {
      checkParams(params);
      const uri = params.textDocument.uri;
      const open = documents.open.get(uri);
      if (!open) return empty;
      const generation = settings.generation;
      const current = resultId(uri, generation);
      if (params.previousResultId === current) return { kind: DocumentDiagnosticReportKind.Unchanged, resultId: current };
      const ev = await documents.evaluated(uri);
      if (!ev) return empty;
      return {
        kind: DocumentDiagnosticReportKind.Full,
        resultId: resultId(uri, generation),
        items: service.getDiagnostics(ev.doc).map((d) => toDiagnostic(d, uri)),
      };
    }, 'textDocument/diagnostic'),
  );

  const timers = new Map<string, unknown>();
  const publish = async (uri: string) => {
    timers.delete(uri);
    try {
      const ev = await documents.evaluated(uri);
      if (!ev || documents.open.get(uri)?.version !== ev.text.version || timers.has(uri)) return; // stale: a newer run is due
      const diagnostics = service.getDiagnostics(ev.doc).map((d) => toDiagnostic(d, uri));
      await connection.sendDiagnostics({ uri, version: ev.text.version, diagnostics });
    } catch (e) {
      connection.console.error(`publishing diagnostics for ${uri} failed: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}`);
    }
  };
  const schedule = (uri: string) => {
    if (ctx.client.pullDiagnostics) return;
    const pending = timers.get(uri);
    if (pending !== undefined) ctx.timers.clearTimeout(pending);
    timers.set(uri, ctx.timers.setTimeout(() => void publish(uri), ctx.pushDebounceMs));
  };
  documents.open.onDidChangeContent((e) => schedule(e.document.uri));
  documents.open.onDidClose((e) => {
    serials.delete(e.document.uri);
    changes.delete(e.document.uri);
    const pending = timers.get(e.document.uri);
    if (pending !== undefined) ctx.timers.clearTimeout(pending);
    timers.delete(e.document.uri);
    if (!ctx.client.pullDiagnostics) void connection.sendDiagnostics({ uri: e.document.uri, diagnostics: [] });
  });

  return () => {
    if (!ctx.client.pullDiagnostics) {
      for (const doc of documents.open.all()) schedule(doc.uri);
    } else if (ctx.client.diagnosticRefresh) {
      connection.languages.diagnostics.refresh().catch((e: unknown) => connection.console.error(`diagnostic refresh failed: ${String(e)}`));
    }
  };
}
