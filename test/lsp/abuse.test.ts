/**
 * Editor abuse over a real JSON-RPC connection to the bundled server (`server.js --stdio`):
 * rapid and out-of-order edits, edits of unopened documents, positions past the end (and
 * negative or fractional), requests for closed and never-opened documents, cancellations in
 * bulk, unknown methods and bad parameters, a 5 MB document and a 100 000-character line.
 * After each, the server has answered every request with a result or a protocol error, and a
 * later hover on a normal document still answers. Assertions are on responses, never on sleeps.
 */
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  CancellationTokenSource,
  CodeActionRequest,
  CompletionRequest,
  DefinitionRequest,
  DocumentDiagnosticReportKind,
  DocumentDiagnosticRequest,
  DocumentSymbolRequest,
  ErrorCodes,
  HoverRequest,
  InlayHintRequest,
  LSPErrorCodes,
  ParameterStructures,
  PrepareRenameRequest,
  ReferencesRequest,
  RenameRequest,
  RequestType,
  ResponseError,
  type Diagnostic,
  type DocumentDiagnosticReport,
  type LogMessageParams,
  type MarkupContent,
  type Position,
  type Range,
  type TextDocumentContentChangeEvent,
} from 'vscode-languageserver-protocol/node';
import { TextDocument } from 'vscode-languageserver-textdocument';
import { evaluateSheet } from '../../shared-core/src/sheet/evaluate.js';
import { createSafeMath } from '../../shared-core/src/sheet/expr/index.js';
import { buildServer, startClient, type LspClient } from './lspClient.js';

const SENSOR = readFileSync(new URL('../../examples/sensor-node.rfsheet', import.meta.url), 'utf8');
const TOUR = readFileSync(new URL('../../examples/warnings-tour.rfsheet', import.meta.url), 'utf8');
const TUNE_LINE = SENSOR.split('\n').findIndex((l) => l.startsWith('stub tune'));
const NORMAL_URI = 'file:///abuse/normal.rfsheet';
const math = createSafeMath();
const ALL: Range = { start: { line: 0, character: 0 }, end: { line: 1_000_000, character: 0 } };

let client: LspClient;
/** Indexes of `client.events` during the malformed-request test (its failures are logged on purpose). */
let malformedLogs: [number, number] = [0, 0];
const isErrorLog = (e: { method: string; params: unknown }) => e.method === 'window/logMessage' && (e.params as LogMessageParams).type === 1;
/** Sends `method` with `params` by name (as every LSP request is) and resolves with the result or the protocol error. */
const req = <R>(method: string, params: unknown, token?: CancellationTokenSource): Promise<R | ResponseError<unknown>> =>
  (client.connection.sendRequest(new RequestType<unknown, R, unknown>(method, ParameterStructures.byName), params, token?.token) as Promise<R>)
    .catch((e: unknown) => {
      if (e instanceof ResponseError) return e;
      throw e;
    });
const pull = (uri: string) => client.connection.sendRequest(DocumentDiagnosticRequest.type, { textDocument: { uri } });
const items = (r: DocumentDiagnosticReport): Diagnostic[] => (r.kind === DocumentDiagnosticReportKind.Full ? r.items : []);
const summary = (ds: { code?: unknown; range: Range; message: unknown }[]) =>
  ds.map((d) => `${d.range.start.line}:${d.range.start.character}-${d.range.end.line}:${d.range.end.character} ${String(d.code)} ${JSON.stringify(d.message)}`).sort();

/** The server still answers a hover on a normal document with the right declaration. */
async function stillServing(): Promise<void> {
  const hover = await client.connection.sendRequest(HoverRequest.type, { textDocument: { uri: NORMAL_URI }, position: { line: TUNE_LINE, character: 6 } });
  expect((hover?.contents as MarkupContent).value).toContain('**tune**');
}

/** Every feature request for `uri` at `p`; each answers with a result or a protocol error. */
function everyRequest(uri: string, p: Position): Promise<unknown>[] {
  const doc = { textDocument: { uri } };
  return [
    req(HoverRequest.method, { ...doc, position: p }),
    req(CompletionRequest.method, { ...doc, position: p }),
    req(DefinitionRequest.method, { ...doc, position: p }),
    req(ReferencesRequest.method, { ...doc, position: p, context: { includeDeclaration: true } }),
    req(PrepareRenameRequest.method, { ...doc, position: p }),
    req(RenameRequest.method, { ...doc, position: p, newName: 'renamed' }),
    req(CodeActionRequest.method, { ...doc, range: { start: p, end: p }, context: { diagnostics: [] } }),
    req(InlayHintRequest.method, { ...doc, range: { start: p, end: { line: p.line + 10, character: 0 } } }),
    req(DocumentSymbolRequest.method, doc),
    req(DocumentDiagnosticRequest.method, doc),
  ];
}

/** A result, or a protocol error other than "invalid parameters" (the requests here are well-formed). */
const isAnswer = (r: unknown) => !(r instanceof ResponseError) || (typeof r.code === 'number' && r.code !== ErrorCodes.InvalidParams);

beforeAll(async () => {
  buildServer();
  client = await startClient();
  await client.open(NORMAL_URI, SENSOR);
}, 120_000);

afterAll(() => {
  if (client?.child.exitCode === null) client.child.kill();
});

describe('editor abuse over stdio', () => {
  it('rapid incremental edits (300, requests in flight between them) end in exactly the diagnostics of the final text', async () => {
    const uri = 'file:///abuse/rapid.rfsheet';
    const edits = fc.sample(
      fc.record({
        at: fc.double({ min: 0, max: 1, noNaN: true }), del: fc.integer({ min: 0, max: 12 }),
        text: fc.constantFrom('', '1', 'mm', ' ', '\n', '\r\n', '(', ')', ', at f0', 'µ', 'Ω', '±', '\u{1F600}', '#', 'stub s: short on feed, length 5 mm, at f0\n'),
      }),
      { numRuns: 300, seed: 7 },
    );
    let model = TextDocument.create(uri, 'rfsheet', 1, TOUR);
    await client.open(uri, TOUR);
    const inFlight: Promise<unknown>[] = [];
    for (const [k, e] of edits.entries()) {
      const text = model.getText();
      const start = Math.floor(e.at * (text.length + 1));
      const range = { start: model.positionAt(start), end: model.positionAt(start + e.del) };
      const change: TextDocumentContentChangeEvent = { range, text: e.text };
      model = TextDocument.update(model, [change], model.version + 1);
      void client.change(uri, model.version, [change]);
      if (k % 10 === 0) inFlight.push(req(HoverRequest.method, { textDocument: { uri }, position: range.start }), pull(uri));
    }
    const answers = await Promise.all(inFlight);
    expect(answers.every(isAnswer)).toBe(true);
    const final = evaluateSheet(model.getText(), undefined, { math });
    expect(summary(items(await pull(uri)))).toEqual(summary(final.diagnostics));
    await stillServing();
  });

  it('out-of-order versions and edits of unopened documents: the text follows the edits as sent, the diagnostics follow the text', async () => {
    const uri = 'file:///abuse/versions.rfsheet';
    await client.open(uri, 'let a = 1 mm\n', 10);
    const first = await pull(uri);
    // version goes backwards, repeats, then jumps; each edit replaces the value
    const values = ['2 mm', '3 mm', 'oops(', '4 mm'];
    for (const [k, v] of values.entries()) {
      await client.change(uri, [5, 5, 10, 1_000_000][k]!, [{ range: { start: { line: 0, character: 8 }, end: { line: 0, character: 100 } }, text: v }]);
    }
    await client.change('file:///abuse/never-opened.rfsheet', 2, [{ text: 'let x = (' }]);
    const last = await pull(uri);
    expect(last.kind).toBe(DocumentDiagnosticReportKind.Full);
    expect(items(last)).toEqual([]);
    const hover = (await client.connection.sendRequest(HoverRequest.type, { textDocument: { uri }, position: { line: 0, character: 5 } }))!;
    expect((hover.contents as MarkupContent).value).toContain('4 mm');
    // A result id issued for an older text is never answered "unchanged" for a different one.
    const resultId = first.kind === DocumentDiagnosticReportKind.Full ? first.resultId : undefined;
    await client.change(uri, 10, [{ range: { start: { line: 0, character: 8 }, end: { line: 0, character: 100 } }, text: '(' }]);
    const stale = await client.connection.sendRequest(DocumentDiagnosticRequest.type, { textDocument: { uri }, ...(resultId ? { previousResultId: resultId } : {}) });
    expect(stale.kind).toBe(DocumentDiagnosticReportKind.Full);
    expect(items(stale).map((d) => d.code)).toEqual(['syntax']);
    expect(items(await pull('file:///abuse/never-opened.rfsheet'))).toEqual([]);
    await stillServing();
  });

  it('positions past the end, negative and fractional: every request answers or errors, none hangs', async () => {
    const uri = 'file:///abuse/positions.rfsheet';
    await client.open(uri, TOUR);
    const positions: Position[] = [
      { line: 0, character: 0 }, { line: 10_000, character: 0 }, { line: 3, character: 10_000 }, { line: 2 ** 31 - 1, character: 2 ** 31 - 1 },
      { line: -1, character: 0 }, { line: 0, character: -5 }, { line: -3, character: -3 }, { line: 1.5, character: 2.5 },
    ];
    const answers = await Promise.all(positions.flatMap((p) => everyRequest(uri, p)));
    expect(answers.every(isAnswer)).toBe(true);
    const inverted = await req(CodeActionRequest.method, { textDocument: { uri }, range: { start: { line: 9, character: 0 }, end: { line: 2, character: 0 } }, context: { diagnostics: [] } });
    expect(isAnswer(inverted)).toBe(true);
    await stillServing();
  });

  it('closed, never-opened, twice-opened and twice-closed documents, and odd URIs', async () => {
    const uri = 'file:///abuse/lifecycle.rfsheet';
    await client.open(uri, TOUR);
    await client.open(uri, SENSOR, 2); // opened again: the new text wins
    expect(items(await pull(uri))).toEqual([]);
    await client.close(uri);
    await client.close(uri);
    for (const u of [uri, 'file:///abuse/never.rfsheet', 'not a uri', '', `file:///${'x'.repeat(10_000)}.rfsheet`, 'untitled:Untitled-1']) {
      const answers = await Promise.all(everyRequest(u, { line: 3, character: 3 }));
      expect(answers.every(isAnswer), u).toBe(true);
      const r = (await pull(u)) as DocumentDiagnosticReport;
      expect(items(r), u).toEqual([]);
    }
    await stillServing();
  });

  it('cancellations in bulk: each request is answered or cancelled per protocol; unknown ids are ignored', async () => {
    const uri = 'file:///abuse/cancel.rfsheet';
    await client.open(uri, TOUR);
    const sources = Array.from({ length: 60 }, () => new CancellationTokenSource());
    const pending = sources.map((s, k) => req(k % 2 ? HoverRequest.method : DocumentDiagnosticRequest.method, { textDocument: { uri }, position: { line: 14, character: 6 } }, s));
    sources.forEach((s, k) => k % 3 !== 2 && s.cancel());
    for (const id of [999_999, -1, 'nope', null]) await client.connection.sendNotification('$/cancelRequest', { id });
    const answers = await Promise.all(pending);
    for (const [k, a] of answers.entries()) {
      if (a instanceof ResponseError) expect(a.code, `request ${k}`).toBe(LSPErrorCodes.RequestCancelled);
      else if (k % 3 !== 2) expect(a === null || typeof a === 'object', `request ${k}`).toBe(true);
    }
    // the ones never cancelled got real answers
    expect(answers.filter((a, k) => k % 3 === 2 && !(a instanceof ResponseError))).toHaveLength(20);
    // a cancellation after the answer changes nothing
    const s = new CancellationTokenSource();
    const done = await req<unknown>(HoverRequest.method, { textDocument: { uri }, position: { line: 14, character: 6 } }, s);
    s.cancel();
    expect(done).not.toBeInstanceOf(ResponseError);
    await stillServing();
  });

  it('unknown methods get MethodNotFound; malformed parameters get InvalidParams (nothing logged) and serving goes on', async () => {
    const unknown = await req('stubwright/doesNotExist', {});
    expect(unknown).toBeInstanceOf(ResponseError);
    expect((unknown as ResponseError<unknown>).code).toBe(ErrorCodes.MethodNotFound);
    await client.connection.sendNotification('stubwright/unknownNotification', { x: 1 });
    const from = client.events.length;
    const malformed = [
      [HoverRequest.method, {}], [HoverRequest.method, { textDocument: { uri: NORMAL_URI } }], [CompletionRequest.method, { textDocument: null }],
      [DocumentDiagnosticRequest.method, { textDocument: {} }], [InlayHintRequest.method, { textDocument: { uri: NORMAL_URI } }],
      [CodeActionRequest.method, { textDocument: { uri: NORMAL_URI }, range: ALL }], [RenameRequest.method, { textDocument: { uri: NORMAL_URI }, position: { line: 1, character: 1 } }],
      [HoverRequest.method, { textDocument: { uri: 42 }, position: { line: 'x', character: {} } }],
    ] as const;
    for (const [method, params] of malformed) {
      const answer = await req(method, params);
      expect(answer, method).toBeInstanceOf(ResponseError);
      expect((answer as ResponseError<unknown>).code, method).toBe(ErrorCodes.InvalidParams);
      expect((answer as ResponseError<unknown>).message, method).toMatch(/must be/);
    }
    await stillServing();
    malformedLogs = [from, client.events.length];
    // Parameters are checked before a handler reads them: no handler failed, nothing was logged.
    expect(client.events.slice(from).filter(isErrorLog)).toEqual([]);
  });

  it('a 5 MB document gets one limit diagnostic, answers every request, and can be edited back to a sheet', async () => {
    const uri = 'file:///abuse/five-mb.rfsheet';
    const copy = (k: number) => SENSOR.replace(/\b(f0|board|feed|thin|choke|trap|tune|lbias)\b/g, `$1_${k}`);
    let big = '';
    for (let k = 0; big.length < 5 * 1024 * 1024; k++) big += copy(k);
    await client.open(uri, big);
    const report = items(await pull(uri));
    expect(report.map((d) => [d.code, d.range.start.line])).toEqual([['limit', 0]]);
    expect(report[0]!.message).toMatch(/^sheet longer than 1048576 characters \(\d+\): nothing was evaluated/);
    const answers = await Promise.all([...everyRequest(uri, { line: 20, character: 6 }), ...everyRequest(uri, { line: 200_000, character: 0 })]);
    expect(answers.every(isAnswer)).toBe(true);
    await stillServing();
    // delete all but the first copy: evaluated again
    const model = TextDocument.create(uri, 'rfsheet', 1, big);
    await client.change(uri, 2, [{ range: { start: model.positionAt(copy(0).length), end: model.positionAt(big.length) }, text: '' }]);
    const after = items(await pull(uri));
    expect(after.filter((d) => d.severity === 1)).toEqual([]);
    const hover = await client.connection.sendRequest(HoverRequest.type, { textDocument: { uri }, position: { line: TUNE_LINE, character: 6 } });
    expect((hover?.contents as MarkupContent).value).toContain('**tune_0**');
    await client.close(uri);
  });

  it('a 100 000-character line gets a limit diagnostic of its own; the rest of the sheet is evaluated and every request answers', async () => {
    const uri = 'file:///abuse/long-line.rfsheet';
    const lines = SENSOR.split('\n');
    const longAt = 9;
    lines.splice(longAt, 0, `let long = ${'1+'.repeat(50_000)}1`);
    const text = lines.join('\n');
    await client.open(uri, text);
    const report = items(await pull(uri));
    expect(report.map((d) => [d.code, d.range.start.line, d.range.start.character])).toEqual([['limit', longAt, 4000]]);
    const answers = await Promise.all([
      ...everyRequest(uri, { line: longAt, character: 99_999 }),
      ...everyRequest(uri, { line: longAt, character: 50 }),
    ]);
    expect(answers.every(isAnswer)).toBe(true);
    const hover = await client.connection.sendRequest(HoverRequest.type, { textDocument: { uri }, position: { line: TUNE_LINE + 1, character: 6 } });
    expect((hover?.contents as MarkupContent).value).toContain('**tune**');
    // typing on the long line, one character at a time at its end
    for (let k = 0; k < 20; k++) await client.change(uri, 2 + k, [{ range: { start: { line: longAt, character: 100_011 + k }, end: { line: longAt, character: 100_011 + k } }, text: '1' }]);
    expect(items(await pull(uri)).map((d) => d.code)).toEqual(['limit']);
    await stillServing();
  });

  it('logged no internal error through all of it (malformed requests aside), then shuts down and exits with code 0', async () => {
    const errors = client.events
      .filter((e, k) => isErrorLog(e) && !(k >= malformedLogs[0] && k < malformedLogs[1]))
      .map((e) => (e.params as LogMessageParams).message);
    expect(errors).toEqual([]);
    expect(await client.shutdown()).toBe(0);
  });
});
