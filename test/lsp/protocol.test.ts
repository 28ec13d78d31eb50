/**
 * The bundled language server (`node server/dist/server.js --stdio`) driven over JSON-RPC by a
 * scripted client, feature by feature, on examples/warnings-tour.rfsheet. Assertions are on
 * requests and responses; pushed diagnostics are awaited as notifications with a timeout.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  CancellationTokenSource,
  CodeActionKind,
  CodeActionRequest,
  CompletionItemKind,
  CompletionRequest,
  DefinitionRequest,
  DiagnosticSeverity,
  DidChangeConfigurationNotification,
  DocumentDiagnosticReportKind,
  DocumentDiagnosticRequest,
  DocumentSymbolRequest,
  HoverRequest,
  InlayHintRequest,
  InsertTextFormat,
  LSPErrorCodes,
  PrepareRenameRequest,
  ReferencesRequest,
  RenameRequest,
  ResponseError,
  SymbolKind,
  TextDocumentSyncKind,
  type CodeAction,
  type CompletionItem,
  type Diagnostic,
  type DocumentDiagnosticReport,
  type DocumentSymbol,
  type Hover,
  type InlayHint,
  type Location,
  type LogMessageParams,
  type MarkupContent,
  type Position,
  type PublishDiagnosticsParams,
  type Range,
  type RegistrationParams,
  type ConfigurationParams,
} from 'vscode-languageserver-protocol/node';
import { version } from '../../package.json';
import { PUSH_CAPABILITIES, applyEdits, buildServer, startClient, type LspClient } from './lspClient.js';

const TOUR_PATH = fileURLToPath(new URL('../../examples/warnings-tour.rfsheet', import.meta.url));
const TOUR = readFileSync(TOUR_PATH, 'utf8');
const TOUR_URI = pathToFileURL(TOUR_PATH).href;
const LINES = TOUR.split('\n');
/** A document of our own per test (nothing needs to exist on disk). */
const docUri = (name: string) => `file:///stubwright-test/${name}.rfsheet`;

/** 0-based line of the first line starting with `prefix`. */
const lineOf = (prefix: string, lines = LINES) => {
  const i = lines.findIndex((l) => l.startsWith(prefix));
  if (i < 0) throw new Error(`no line starts with ${prefix}`);
  return i;
};
/** Range of `needle` on that line (the last occurrence when `last`). */
const rangeOn = (prefix: string, needle: string, last = false, lines = LINES): Range => {
  const line = lineOf(prefix, lines);
  const text = lines[line]!;
  const start = last ? text.lastIndexOf(needle) : text.indexOf(needle);
  if (start < 0) throw new Error(`no ${needle} on line ${line}`);
  return { start: { line, character: start }, end: { line, character: start + needle.length } };
};
const at = (prefix: string, needle: string, offset = 1, lines = LINES): Position => {
  const r = rangeOn(prefix, needle, false, lines);
  return { line: r.start.line, character: r.start.character + offset };
};
const WHOLE: Range = { start: { line: 0, character: 0 }, end: { line: LINES.length, character: 0 } };
const codes = (items: Diagnostic[]) => items.map((d) => d.code).sort();
const TOUR_CODES = ['detuned', 'model-validity', 'near-resonance', 'resonance-in-band'];

function full(report: DocumentDiagnosticReport) {
  if (report.kind !== DocumentDiagnosticReportKind.Full) throw new Error(`expected a full report, got ${report.kind}`);
  return report;
}
const markdown = (h: Hover | null) => (h?.contents as MarkupContent | undefined)?.value ?? '';

beforeAll(() => buildServer(), 120_000);

describe('language server over stdio (pull diagnostics)', () => {
  let client: LspClient;
  const pull = (uri: string, previousResultId?: string) =>
    client.connection.sendRequest(DocumentDiagnosticRequest.type, { textDocument: { uri }, ...(previousResultId ? { previousResultId } : {}) });
  const hover = (uri: string, position: Position) => client.connection.sendRequest(HoverRequest.type, { textDocument: { uri }, position });
  const actions = (uri: string, range: Range, diagnostics: Diagnostic[] = [], only?: string[]) =>
    client.connection.sendRequest(CodeActionRequest.type, { textDocument: { uri }, range, context: { diagnostics, ...(only ? { only } : {}) } }) as Promise<CodeAction[]>;

  beforeAll(async () => {
    client = await startClient();
    await client.open(TOUR_URI, TOUR);
  });
  afterAll(() => {
    if (client.child.exitCode === null) client.child.kill();
  });

  it('initialize: serverInfo, incremental sync, pull diagnostics and every feature advertised', async () => {
    const { capabilities, serverInfo } = client.initializeResult;
    expect(serverInfo).toEqual({ name: 'stubwright', version });
    expect(capabilities.textDocumentSync).toMatchObject({ openClose: true, change: TextDocumentSyncKind.Incremental });
    expect(capabilities.diagnosticProvider).toMatchObject({ interFileDependencies: false, workspaceDiagnostics: false });
    expect(capabilities.codeActionProvider).toEqual({ codeActionKinds: [CodeActionKind.QuickFix, CodeActionKind.RefactorRewrite] });
    expect(capabilities.renameProvider).toEqual({ prepareProvider: true });
    expect(capabilities.completionProvider?.triggerCharacters).toContain(':');
    for (const key of ['hoverProvider', 'inlayHintProvider', 'documentSymbolProvider', 'definitionProvider', 'referencesProvider'] as const) {
      expect(capabilities[key], key).toBeTruthy();
    }
    const registration = await client.waitFor<RegistrationParams>('client/registerCapability');
    expect(registration.registrations.map((r) => r.method)).toContain('workspace/didChangeConfiguration');
  });

  it('pulls the four warnings of the tour with their codes, ranges, severity, source and related information', async () => {
    const report = full(await pull(TOUR_URI));
    expect(report.resultId).toEqual(expect.any(String));
    expect(codes(report.items)).toEqual(TOUR_CODES);
    const byCode = new Map(report.items.map((d) => [d.code, d]));
    expect(byCode.get('model-validity')!.range).toEqual(rangeOn('line hairline', 'microstrip'));
    expect(byCode.get('detuned')!.range).toEqual(rangeOn('stub choke', '19.8 mm'));
    expect(byCode.get('near-resonance')!.range).toEqual(rangeOn('stub lload', '20.5 mm'));
    expect(byCode.get('resonance-in-band')!.range).toEqual(rangeOn('stub edge', 'band', true));
    for (const d of report.items) expect(d).toMatchObject({ severity: DiagnosticSeverity.Warning, source: 'stubwright' });
    expect(byCode.get('near-resonance')!.relatedInformation).toEqual([
      { location: { uri: TOUR_URI, range: rangeOn('line feed', 'feed') }, message: expect.stringContaining('feed') },
    ]);
    // the configuration was asked for this document, section stubwright
    const config = await client.waitFor<ConfigurationParams>('workspace/configuration');
    expect(config.items).toEqual([{ scopeUri: TOUR_URI, section: 'stubwright' }]);
  });

  it('answers "unchanged" for the same result id, and new results after an incremental edit', async () => {
    const uri = docUri('incremental');
    await client.open(uri, TOUR);
    const first = full(await pull(uri));
    expect(await pull(uri, first.resultId)).toEqual({ kind: DocumentDiagnosticReportKind.Unchanged, resultId: first.resultId });

    // lload 20.5 mm → 15 mm: clear of its quarter-wave resonance
    await client.change(uri, 2, [{ range: rangeOn('stub lload', '20.5 mm'), text: '15 mm' }]);
    const second = full(await pull(uri, first.resultId));
    expect(second.resultId).not.toEqual(first.resultId);
    expect(codes(second.items)).toEqual(['detuned', 'model-validity', 'resonance-in-band']);
    expect(markdown(await hover(uri, at('stub lload', 'lload')))).toContain('| length | 15 mm |');

    // a line inserted at the top moves every diagnostic down by one
    await client.change(uri, 3, [{ range: { start: { line: 0, character: 0 }, end: { line: 0, character: 0 } }, text: '# inserted\n' }]);
    const third = full(await pull(uri, second.resultId));
    expect(third.items.map((d) => d.range.start.line)).toEqual(second.items.map((d) => d.range.start.line + 1));
    expect(await pull(uri, third.resultId)).toMatchObject({ kind: DocumentDiagnosticReportKind.Unchanged });
  });

  it('inlay hints: figures at the end of each evaluated declaration, padded on the left', async () => {
    const hints = (await client.connection.sendRequest(InlayHintRequest.type, { textDocument: { uri: TOUR_URI }, range: WHOLE })) as InlayHint[];
    const on = (prefix: string) => hints.find((h) => h.position.line === lineOf(prefix));
    expect(on('line feed')).toMatchObject({ label: expect.stringMatching(/^w = 2\.2 mm · εeff 2\.1\d\d$/), paddingLeft: true });
    expect(on('line feed')!.position.character).toBe(LINES[lineOf('line feed')]!.length);
    expect(on('stub lload')!.label).toMatch(/nH · X \+1\.2\d kΩ · 2\.7 % to res\.$/);
    expect(on('stub lload')!.tooltip).toContain('tolerance corners');
    expect(on('let f0')).toBeUndefined();
    // a range restricts the hints to its lines
    const line = lineOf('stub edge');
    const some = (await client.connection.sendRequest(InlayHintRequest.type, {
      textDocument: { uri: TOUR_URI },
      range: { start: { line, character: 0 }, end: { line, character: 10 } },
    })) as InlayHint[];
    expect(some.map((h) => h.position.line)).toEqual([line]);
  });

  it('hover: a Markdown summary on a declaration, a one-liner on a reference, nothing on a comment', async () => {
    const decl = await hover(TOUR_URI, at('stub lload', 'lload'));
    expect(decl?.range).toEqual(rangeOn('stub lload', 'lload'));
    expect((decl?.contents as MarkupContent).kind).toBe('markdown');
    const text = markdown(decl);
    expect(text).toContain('**lload** · stub');
    expect(text).toContain('| length | 20.5 mm |');
    expect(text).toMatch(/87\.7° = 0\.243\d λg at 2\.45 GHz/);
    expect(text).toMatch(/margin to nearest \| 2\.7 %/);
    expect(markdown(await hover(TOUR_URI, at('stub lload', 'feed')))).toMatch(/^\*\*feed\*\* \(line\): Z0 50 Ω/);
    expect(await hover(TOUR_URI, { line: 0, character: 3 })).toBeNull();
  });

  it('code actions: the quick fix removes its warning and is not offered again (idempotent)', async () => {
    const near = full(await pull(TOUR_URI)).items.find((d) => d.code === 'near-resonance')!;
    const fixes = await actions(TOUR_URI, near.range, [near], [CodeActionKind.QuickFix]);
    expect(fixes).toHaveLength(1);
    const fix = fixes[0]!;
    expect(fix).toMatchObject({ kind: CodeActionKind.QuickFix, isPreferred: true, diagnostics: [near] });
    expect(fix.title).toMatch(/resonance margin: length \d+\.\d\d mm/);
    const edits = fix.edit!.changes![TOUR_URI]!;
    expect(edits).toHaveLength(1);
    expect(edits[0]!.range).toEqual(near.range);

    const fixedText = applyEdits(TOUR, edits);
    const uri = docUri('quickfix-applied');
    await client.open(uri, fixedText);
    const after = full(await pull(uri));
    expect(codes(after.items)).not.toContain('near-resonance');
    expect(await actions(uri, near.range, after.items, [CodeActionKind.QuickFix])).toEqual([]);
  });

  it('code actions: writing the synthesized width back is a refactor.rewrite, offered once', async () => {
    const range = rangeOn('line feed', 'line feed');
    const rewrites = await actions(TOUR_URI, range, [], [CodeActionKind.Refactor]);
    expect(rewrites.length).toBeGreaterThan(0);
    expect(rewrites.every((a) => a.kind === CodeActionKind.RefactorRewrite)).toBe(true);
    const writeBack = rewrites.find((a) => a.title.startsWith('Write the synthesized width'))!;
    const text = applyEdits(TOUR, writeBack.edit!.changes![TOUR_URI]!);
    expect(text.split('\n')[range.start.line]).toMatch(/^line feed: microstrip on board, width 2\.\d\d mm$/);
    const uri = docUri('rewrite-applied');
    await client.open(uri, text);
    const again = await actions(uri, range, [], [CodeActionKind.Refactor]);
    expect(again.some((a) => a.title.startsWith('Write the synthesized'))).toBe(false);
    expect(codes(full(await pull(uri)).items)).toEqual(TOUR_CODES);
  });

  it('completion: keywords and snippets at a line start, line names after "on"', async () => {
    const complete = (position: Position) =>
      client.connection.sendRequest(CompletionRequest.type, { textDocument: { uri: TOUR_URI }, position }) as Promise<CompletionItem[]>;
    const start = await complete({ line: lineOf('stub lload'), character: 0 });
    expect(start.filter((c) => c.kind === CompletionItemKind.Keyword).map((c) => c.label)).toEqual(['let', 'substrate', 'line', 'stub', 'sweep']);
    const snippet = start.find((c) => c.label.startsWith('stub ') && c.kind === CompletionItemKind.Snippet)!;
    expect(snippet).toMatchObject({ insertTextFormat: InsertTextFormat.Snippet, insertText: expect.stringContaining('${1:') });
    const lines = await complete(at('stub lload', 'on ', 3));
    expect(lines.map((c) => c.label)).toEqual(['feed', 'thin', 'hairline']);
    expect(lines.every((c) => c.kind === CompletionItemKind.Variable)).toBe(true);
  });

  it('document symbols: one hierarchical symbol per declaration with a sensible kind', async () => {
    const symbols = (await client.connection.sendRequest(DocumentSymbolRequest.type, { textDocument: { uri: TOUR_URI } })) as DocumentSymbol[];
    expect(symbols.map((s) => [s.name, s.kind])).toEqual([
      ['f0', SymbolKind.Constant],
      ['band', SymbolKind.Constant],
      ['board', SymbolKind.Module],
      ['feed', SymbolKind.Class],
      ['thin', SymbolKind.Class],
      ['hairline', SymbolKind.Class],
      ['choke', SymbolKind.Object],
      ['lload', SymbolKind.Object],
      ['edge', SymbolKind.Object],
    ]);
    const lload = symbols.find((s) => s.name === 'lload')!;
    expect(lload.selectionRange).toEqual(rangeOn('stub lload', 'lload'));
    expect(lload.range.start).toEqual({ line: lineOf('stub lload'), character: 0 });
    expect(lload.detail).toContain('20.5 mm');
  });

  it('definition and references of a line name', async () => {
    const feedDecl = rangeOn('line feed', 'feed');
    const definition = (await client.connection.sendRequest(DefinitionRequest.type, {
      textDocument: { uri: TOUR_URI }, position: at('stub edge', 'feed'),
    })) as Location;
    expect(definition).toEqual({ uri: TOUR_URI, range: feedDecl });
    const refs = (include: boolean) =>
      client.connection.sendRequest(ReferencesRequest.type, {
        textDocument: { uri: TOUR_URI }, position: at('line feed', 'feed'), context: { includeDeclaration: include },
      }) as Promise<Location[]>;
    const uses = [rangeOn('stub lload', 'feed'), rangeOn('stub edge', 'feed')];
    expect((await refs(false)).map((l) => l.range)).toEqual(uses);
    expect((await refs(true)).map((l) => l.range)).toEqual([feedDecl, ...uses]);
    expect((await refs(true)).every((l) => l.uri === TOUR_URI)).toBe(true);
  });

  it('rename: prepare, rename everywhere, and a refused name as an error', async () => {
    const uri = docUri('rename');
    await client.open(uri, TOUR);
    const prepared = await client.connection.sendRequest(PrepareRenameRequest.type, { textDocument: { uri }, position: at('stub edge', 'feed') });
    expect(prepared).toEqual({ range: rangeOn('stub edge', 'feed'), placeholder: 'feed' });
    expect(await client.connection.sendRequest(PrepareRenameRequest.type, { textDocument: { uri }, position: { line: 0, character: 2 } })).toBeNull();

    const edit = await client.connection.sendRequest(RenameRequest.type, { textDocument: { uri }, position: at('stub edge', 'feed'), newName: 'main' });
    const edits = edit!.changes![uri]!;
    expect(edits).toHaveLength(3);
    const renamed = applyEdits(TOUR, edits);
    expect(renamed).toContain('line main: microstrip');
    expect(renamed.match(/short on main/g)).toHaveLength(2);
    const uri2 = docUri('renamed');
    await client.open(uri2, renamed);
    expect(codes(full(await pull(uri2)).items)).toEqual(TOUR_CODES);

    for (const bad of ['2x', 'on', 'thin']) {
      const error = await client.connection
        .sendRequest(RenameRequest.type, { textDocument: { uri }, position: at('stub edge', 'feed'), newName: bad })
        .then(() => null, (e: unknown) => e);
      expect(error, bad).toBeInstanceOf(ResponseError);
      expect((error as ResponseError<unknown>).code).toBe(LSPErrorCodes.RequestFailed);
      expect((error as ResponseError<unknown>).message).toContain(bad);
    }
  });

  it('cancellation: a request cancelled while in flight is answered RequestCancelled; the server carries on', async () => {
    const uri = docUri('cancel');
    const held = client.holdConfiguration(); // the first request on a new document waits for its settings
    await client.open(uri, TOUR);
    const source = new CancellationTokenSource();
    const pending = client.connection
      .sendRequest(HoverRequest.type, { textDocument: { uri }, position: at('stub lload', 'lload') }, source.token)
      .then(() => null, (e: unknown) => e);
    await held.requested;
    source.cancel();
    held.release();
    const error = await pending;
    expect(error).toBeInstanceOf(ResponseError);
    expect((error as ResponseError<unknown>).code).toBe(LSPErrorCodes.RequestCancelled);
    expect(markdown(await hover(uri, at('stub lload', 'lload')))).toContain('**lload**');
  });

  it('a closed document: every request answers empty, none fails', async () => {
    const uri = docUri('closed');
    await client.open(uri, TOUR);
    expect(full(await pull(uri)).items).toHaveLength(4);
    await client.close(uri);
    const doc = { textDocument: { uri } };
    const p = at('stub lload', 'lload');
    expect(await pull(uri)).toEqual({ kind: DocumentDiagnosticReportKind.Full, items: [] });
    expect(await hover(uri, p)).toBeNull();
    expect(await client.connection.sendRequest(InlayHintRequest.type, { ...doc, range: WHOLE })).toEqual([]);
    expect(await actions(uri, WHOLE)).toEqual([]);
    expect(await client.connection.sendRequest(CompletionRequest.type, { ...doc, position: p })).toEqual([]);
    expect(await client.connection.sendRequest(DocumentSymbolRequest.type, doc)).toEqual([]);
    expect(await client.connection.sendRequest(DefinitionRequest.type, { ...doc, position: p })).toBeNull();
    expect(await client.connection.sendRequest(ReferencesRequest.type, { ...doc, position: p, context: { includeDeclaration: true } })).toEqual([]);
    expect(await client.connection.sendRequest(PrepareRenameRequest.type, { ...doc, position: p })).toBeNull();
    expect(await client.connection.sendRequest(RenameRequest.type, { ...doc, position: p, newName: 'x' })).toBeNull();
  });

  it('positions past the end of the document are clamped, never a crash', async () => {
    const far: Position = { line: LINES.length + 100, character: 5 };
    const farOnLine: Position = { line: lineOf('stub lload'), character: 500 };
    const doc = { textDocument: { uri: TOUR_URI } };
    expect(await hover(TOUR_URI, far)).toBeNull();
    expect(await client.connection.sendRequest(CompletionRequest.type, { ...doc, position: farOnLine })).toEqual(expect.any(Array));
    expect(await client.connection.sendRequest(DefinitionRequest.type, { ...doc, position: far })).toBeNull();
    expect(await client.connection.sendRequest(PrepareRenameRequest.type, { ...doc, position: far })).toBeNull();
    expect(await actions(TOUR_URI, { start: far, end: { line: far.line + 5, character: 0 } })).toEqual([]);
    expect(await client.connection.sendRequest(InlayHintRequest.type, { ...doc, range: { start: far, end: far } })).toEqual([]);
    expect(markdown(await hover(TOUR_URI, at('stub lload', 'lload')))).toContain('**lload**');
  });

  it('logged no internal error during the session, then shuts down and exits with code 0', async () => {
    const errors = client.events.filter((e) => e.method === 'window/logMessage' && (e.params as LogMessageParams).type === 1);
    expect(errors).toEqual([]);
    expect(await client.shutdown()).toBe(0);
  });
});

describe('language server over stdio (settings)', () => {
  let client: LspClient;
  const uri = docUri('settings');
  const pull = (previousResultId?: string) =>
    client.connection.sendRequest(DocumentDiagnosticRequest.type, { textDocument: { uri }, ...(previousResultId ? { previousResultId } : {}) });
  const hints = () => client.connection.sendRequest(InlayHintRequest.type, { textDocument: { uri }, range: WHOLE }) as Promise<InlayHint[]>;
  /** Changes settings as an editor does, and waits for both refresh requests that must follow. */
  const changeSettings = async (patch: Record<string, unknown>) => {
    const after = client.events.length;
    Object.assign(client.settings, patch);
    await client.connection.sendNotification(DidChangeConfigurationNotification.type, { settings: { stubwright: { ...client.settings } } });
    await client.waitFor('workspace/diagnostic/refresh', undefined, { after });
    await client.waitFor('workspace/inlayHint/refresh', undefined, { after });
  };

  beforeAll(async () => {
    client = await startClient({ settings: {} });
    await client.open(uri, TOUR);
  });
  afterAll(async () => {
    if (client.child.exitCode === null) expect(await client.shutdown()).toBe(0);
  });

  it('resonanceMargin 1 %: after the refresh the margin warnings are gone', async () => {
    const before = full(await pull());
    expect(codes(before.items)).toEqual(TOUR_CODES);
    await changeSettings({ resonanceMargin: 1 });
    const after = full(await pull(before.resultId));
    expect(codes(after.items)).toEqual(['detuned', 'model-validity']);
    expect(after.resultId).not.toEqual(before.resultId);
  });

  it('lengthUnit mil and inlayHints false take effect on the same document version', async () => {
    expect((await hints()).find((h) => h.position.line === lineOf('line feed'))!.label).toMatch(/^w = 2\.2 mm/);
    await changeSettings({ lengthUnit: 'mil' });
    expect((await hints()).find((h) => h.position.line === lineOf('line feed'))!.label).toMatch(/^w = 8\d\.\d mil/);
    await changeSettings({ inlayHints: false });
    expect(await hints()).toEqual([]);
  });

  it('an invalid setting falls back to the default with a warning in the log', async () => {
    await changeSettings({ resonanceMargin: 'lots', inlayHints: true });
    expect(codes(full(await pull()).items)).toEqual(TOUR_CODES);
    const warning = await client.waitFor<LogMessageParams>('window/logMessage', (p) => p.message.includes('resonanceMargin'));
    expect(warning.type).toBe(2);
  });
});

describe('language server over stdio (push diagnostics for clients without pull)', () => {
  let client: LspClient;
  const uri = docUri('push');
  const published = (version: number) => client.waitFor<PublishDiagnosticsParams>('textDocument/publishDiagnostics', (p) => p.uri === uri && p.version === version);

  beforeAll(async () => {
    client = await startClient({ capabilities: PUSH_CAPABILITIES });
  });
  afterAll(async () => {
    if (client.child.exitCode === null) expect(await client.shutdown()).toBe(0);
  });

  it('advertises no pull provider and publishes the opened version', async () => {
    expect(client.initializeResult.capabilities.diagnosticProvider).toBeUndefined();
    await client.open(uri, TOUR, 1);
    const first = await published(1);
    expect(codes(first.diagnostics)).toEqual(TOUR_CODES);
    expect(first.diagnostics.every((d) => d.source === 'stubwright')).toBe(true);
  });

  it('publishes each edit with its version; quick successive edits are never published stale', async () => {
    let text = TOUR;
    /** Sets lload's length with an incremental edit, as an editor would send it. */
    const setLength = (version: number, length: string) => {
      const lines = text.split('\n');
      const old = /length (\S+ mm)/.exec(lines[lineOf('stub lload', lines)]!)![1]!;
      const range = rangeOn('stub lload', old, false, lines);
      text = applyEdits(text, [{ range, newText: length }]);
      return client.change(uri, version, [{ range, text: length }]);
    };
    await setLength(2, '15 mm');
    expect(codes((await published(2)).diagnostics)).toEqual(['detuned', 'model-validity', 'resonance-in-band']);
    // three edits in a row: whatever gets published carries the version it was computed for
    await setLength(3, '20.5 mm');
    await setLength(4, '15 mm');
    await setLength(5, '20.5 mm');
    expect(codes((await published(5)).diagnostics)).toEqual(TOUR_CODES);
    const publishes = client.events
      .filter((e) => e.method === 'textDocument/publishDiagnostics')
      .map((e) => e.params as PublishDiagnosticsParams)
      .filter((p) => p.uri === uri);
    const versions = publishes.map((p) => p.version!);
    expect(versions).toEqual([...versions].sort((a, b) => a - b));
    for (const p of publishes) {
      // odd versions have lload at 20.5 mm (near resonance), even ones at 15 mm
      expect(codes(p.diagnostics).includes('near-resonance'), `version ${p.version}`).toBe(p.version! % 2 === 1);
    }
  });

  it('re-publishes after a settings change and clears diagnostics on close', async () => {
    const after = client.events.length;
    Object.assign(client.settings, { resonanceMargin: 1 });
    await client.connection.sendNotification(DidChangeConfigurationNotification.type, { settings: { stubwright: { ...client.settings } } });
    const republished = await client.waitFor<PublishDiagnosticsParams>('textDocument/publishDiagnostics', (p) => p.uri === uri, { after });
    expect(codes(republished.diagnostics)).toEqual(['detuned', 'model-validity']);
    await client.close(uri);
    const cleared = await client.waitFor<PublishDiagnosticsParams>('textDocument/publishDiagnostics', (p) => p.uri === uri && p.diagnostics.length === 0);
    expect(cleared.diagnostics).toEqual([]);
  });
});
