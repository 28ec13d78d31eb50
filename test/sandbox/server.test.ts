/**
 * Workspace trust: the extension declares itself safe for untrusted workspaces
 * (client/package.json `capabilities.untrustedWorkspaces`), which is honest only because a sheet
 * can never make the server reach outside. This file tests both halves:
 * - the shipped manifest declares the support, with a description that says why;
 * - the bundled server, run under Node's permission model with read access to its own bundle only
 *   (no file writes, no child processes, no workers) and with sockets, DNS and fetch trapped,
 *   evaluates the whole attack corpus planted in sheets over a real JSON-RPC connection: every
 *   attack gets a located error on its own line, no operation is refused (none was attempted),
 *   nothing is logged as an error, a normal document still answers, and the server exits cleanly.
 */
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  CodeActionRequest,
  CompletionRequest,
  DocumentDiagnosticRequest,
  DocumentSymbolRequest,
  HoverRequest,
  InlayHintRequest,
  type Diagnostic,
  type DocumentDiagnosticReport,
  type LogMessageParams,
  type MarkupContent,
} from 'vscode-languageserver-protocol/node';
import { EXAMPLES, LARGE } from '../fuzz/hostile.js';
import { buildServer, SERVER_BUNDLE, startClient, type LspClient } from '../lsp/lspClient.js';
import { ATTACK_EXPRESSIONS, ATTACK_TEMPLATES, placements, type Placement } from './attacks.js';
import { lockedDown, violations } from './permission.js';

const manifest = JSON.parse(readFileSync(new URL('../../client/package.json', import.meta.url), 'utf8'));

/** Harmless once read (see evaluator.test.ts): they may evaluate to a plain value. */
const PLAIN_ARITHMETIC = new Set(['2^-1e9', 'mm^1e9', '\uFEFF1']);

/** CI: every attack in two positions (rotating); `npm run fuzz`: every attack in every position. */
const CHOSEN: Placement[] = LARGE
  ? placements()
  : ATTACK_EXPRESSIONS.flatMap((a, i) => placements([a], [ATTACK_TEMPLATES[i % ATTACK_TEMPLATES.length]!, ATTACK_TEMPLATES[(i + 3) % ATTACK_TEMPLATES.length]!]));

describe('workspace trust: the manifest', () => {
  it('declares support for untrusted workspaces, because evaluation is sandboxed', () => {
    const trust = manifest.capabilities?.untrustedWorkspaces;
    expect(trust?.supported).toBe(true);
    expect(trust?.description).toMatch(/sandbox/i);
    // No setting points at a program, a path or a command line (what an untrusted workspace could
    // set to run code): every setting is a number, a boolean or a fixed choice of strings.
    const settings = Object.entries(manifest.contributes.configuration.properties as Record<string, { type: string; enum?: unknown[] }>);
    expect(settings.length).toBeGreaterThan(0);
    for (const [key, spec] of settings) {
      expect(key).not.toMatch(/path|command|executable|program|args|env/i);
      expect(spec.type === 'number' || spec.type === 'boolean' || (spec.type === 'string' && Array.isArray(spec.enum)), key).toBe(true);
    }
  });
});

describe('workspace trust: the lock-down itself (control)', () => {
  it.each([
    ['a file write', `require('node:fs').writeFileSync(require('node:path').join(require('node:os').tmpdir(), 'stubwright-never'), 'x')`],
    ['a child process', `require('node:child_process').execFileSync(process.execPath, ['-e', '1'])`],
    ['a socket', `require('node:net').connect(9, '127.0.0.1')`],
    ['a DNS lookup', `require('node:dns').lookup('localhost', () => {})`],
  ])('refuses %s', (_what, code) => {
    const r = spawnSync(process.execPath, [...lockedDown([]), '-e', code], { encoding: 'utf8', timeout: 30_000 });
    expect(r.status).not.toBe(0);
    expect(violations(r.stderr).length).toBeGreaterThan(0);
  });
});

describe('workspace trust: the server under the permission model evaluates the attack corpus', () => {
  let client: LspClient;
  const uriOf = (i: number) => `file:///untrusted/attack-${i}.rfsheet`;
  const full = (r: DocumentDiagnosticReport): Diagnostic[] => (r.kind === 'full' ? r.items : []);

  beforeAll(async () => {
    buildServer();
    client = await startClient({ nodeArgs: lockedDown([SERVER_BUNDLE]) });
  }, 120_000);
  afterAll(() => {
    if (client?.child.exitCode === null) client.child.kill();
  });

  it(`${CHOSEN.length} attacked sheets: a located error on the attack's line; every feature answers`, async () => {
    const failures: string[] = [];
    for (const [i, p] of CHOSEN.entries()) {
      const uri = uriOf(i);
      await client.open(uri, p.text);
      const doc = { textDocument: { uri } };
      const items = full(await client.connection.sendRequest(DocumentDiagnosticRequest.type, doc));
      const onLine = items.filter((d) => d.severity === 1 && d.range.start.line === p.line && d.range.start.character >= p.column);
      if (onLine.length === 0 && !PLAIN_ARITHMETIC.has(p.attack)) failures.push(p.label);
      const at = { line: p.line, character: p.column + 1 };
      await client.connection.sendRequest(HoverRequest.type, { ...doc, position: at });
      await client.connection.sendRequest(CompletionRequest.type, { ...doc, position: at });
      await client.connection.sendRequest(InlayHintRequest.type, { ...doc, range: { start: { line: 0, character: 0 }, end: { line: 10, character: 0 } } });
      await client.connection.sendRequest(CodeActionRequest.type, { ...doc, range: { start: at, end: at }, context: { diagnostics: items } });
      await client.connection.sendRequest(DocumentSymbolRequest.type, doc);
      await client.close(uri);
    }
    expect(failures).toEqual([]);
  }, 300_000);

  it('a normal sheet still answers a hover afterwards', async () => {
    const text = EXAMPLES.get('sensor-node.rfsheet')!;
    const uri = 'file:///untrusted/sensor-node.rfsheet';
    await client.open(uri, text);
    const line = text.split('\n').findIndex((l) => l.startsWith('stub tune'));
    const hover = await client.connection.sendRequest(HoverRequest.type, { textDocument: { uri }, position: { line, character: 6 } });
    expect((hover?.contents as MarkupContent).value).toContain('**tune**');
  });

  it('attempted nothing outside (no refused operation), logged no error, and exits with code 0', async () => {
    const errors = client.events
      .filter((e) => e.method === 'window/logMessage' && (e.params as LogMessageParams).type === 1)
      .map((e) => (e.params as LogMessageParams).message)
      .filter((m) => !/ExperimentalWarning|--trace-warnings/.test(m));
    expect(errors).toEqual([]);
    expect(await client.shutdown()).toBe(0);
    expect(client.stderr()).toContain('SANDBOX-ARMED');
    expect(violations(client.stderr())).toEqual([]);
  });
});
