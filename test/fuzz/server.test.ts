/**
 * Fuzzing the bundled language server over stdio with hostile sheets (seeded sample of
 * hostile.ts): each is opened, pulled, hovered, completed, asked for hints, actions and symbols,
 * edited at random and pulled again. The diagnostics that come over the wire equal the in-process
 * evaluation of the same text (lone surrogates, NUL, CR and CRLF survive the transport and the
 * line counting), every request answers, nothing is logged as an internal error, and the server
 * exits cleanly.
 */
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  CodeActionRequest,
  CompletionRequest,
  DocumentDiagnosticRequest,
  DocumentSymbolRequest,
  HoverRequest,
  InlayHintRequest,
  type Diagnostic,
  type LogMessageParams,
  type Range,
} from 'vscode-languageserver-protocol/node';
import { TextDocument } from 'vscode-languageserver-textdocument';
import { evaluateSheet } from '../../shared-core/src/sheet/evaluate.js';
import { createSafeMath } from '../../shared-core/src/sheet/expr/index.js';
import { buildServer, startClient, type LspClient } from '../lsp/lspClient.js';
import { FRAGMENTS, hostileSheetArb, LARGE } from './hostile.js';

const math = createSafeMath();
const summary = (ds: { code?: unknown; range: Range; message: unknown }[]) =>
  ds.map((d) => `${d.range.start.line}:${d.range.start.character}-${d.range.end.character} ${String(d.code)} ${JSON.stringify(d.message)}`);

describe('fuzz: language server over stdio', () => {
  let client: LspClient;
  beforeAll(async () => {
    buildServer();
    client = await startClient();
  }, 120_000);
  afterAll(() => {
    if (client?.child.exitCode === null) client.child.kill();
  });

  it('hostile sheets opened, queried and edited: the wire carries exactly the in-process evaluation', async () => {
    const seed = fc.readConfigureGlobal().seed ?? 1;
    const cases = fc.sample(
      fc.tuple(hostileSheetArb, fc.double({ min: 0, max: 1, noNaN: true }), fc.constantFrom(...FRAGMENTS, '\n', '\r\n', '')),
      { numRuns: LARGE ? 400 : 25, seed },
    );
    for (const [k, [text, where, insert]] of cases.entries()) {
      const uri = `file:///fuzz/server-${k}.rfsheet`;
      await client.open(uri, text);
      const doc = { textDocument: { uri } };
      const pulled = await client.connection.sendRequest(DocumentDiagnosticRequest.type, doc);
      const items: Diagnostic[] = pulled.kind === 'full' ? pulled.items : [];
      expect(summary(items), `case ${k}`).toEqual(summary(evaluateSheet(text, undefined, { math }).diagnostics));

      let model = TextDocument.create(uri, 'rfsheet', 1, text);
      const p = model.positionAt(Math.floor(where * text.length));
      const whole = { start: { line: 0, character: 0 }, end: { line: model.lineCount, character: 0 } };
      await Promise.all([
        client.connection.sendRequest(HoverRequest.type, { ...doc, position: p }),
        client.connection.sendRequest(CompletionRequest.type, { ...doc, position: p }),
        client.connection.sendRequest(InlayHintRequest.type, { ...doc, range: whole }),
        client.connection.sendRequest(CodeActionRequest.type, { ...doc, range: whole, context: { diagnostics: items } }),
        client.connection.sendRequest(DocumentSymbolRequest.type, doc),
      ]);

      const change = { range: { start: p, end: p }, text: insert };
      model = TextDocument.update(model, [change], 2);
      await client.change(uri, 2, [change]);
      const again = await client.connection.sendRequest(DocumentDiagnosticRequest.type, doc);
      expect(summary(again.kind === 'full' ? again.items : []), `case ${k} after an edit`).toEqual(summary(evaluateSheet(model.getText(), undefined, { math }).diagnostics));
      await client.close(uri);
    }
  }, 600_000);

  it('logged no internal error, then exits with code 0', async () => {
    const errors = client.events.filter((e) => e.method === 'window/logMessage' && (e.params as LogMessageParams).type === 1);
    expect(errors).toEqual([]);
    expect(await client.shutdown()).toBe(0);
  });
});
