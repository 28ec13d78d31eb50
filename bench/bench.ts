/**
 * Stubwright benchmark: prints ONE JSON object of figures on stdout and never asserts a timing.
 * Bundled and run by `npm run bench` (bench/run.mjs); `--small` for CI-size runs.
 * Keys are read by other tools: add keys, never rename.
 *
 *   cold_*            evaluateSheet(text, undefined, { math }) with one shared safe-math instance
 *   edit_10k_eval_*   in-process incremental re-evaluation after a one-line stub edit (top and bottom)
 *   edit_10k_*        the bundled server: didChange (one-line range edit) + textDocument/diagnostic pull
 *   hover_*, inlay_*  the bundled server, varied positions
 *   raw_engine_10k_ms the same stubs through the engine directly (nominal, no tolerances, no parsing)
 */
import { spawn } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { cpus } from 'node:os';
import { resolve } from 'node:path';
import {
  ConfigurationRequest, DiagnosticRefreshRequest, DidChangeTextDocumentNotification, DidOpenTextDocumentNotification,
  DocumentDiagnosticRequest, ExitNotification, HoverRequest, InitializedNotification, InitializeRequest, InlayHintRefreshRequest,
  InlayHintRequest, RegistrationRequest, ShutdownRequest, StreamMessageReader, StreamMessageWriter, WorkDoneProgressCreateRequest,
  createProtocolConnection, type ClientCapabilities, type ProtocolConnection,
} from 'vscode-languageserver-protocol/node';
import {
  analyseBand, analyseStub, microstripLine, microstripWidthForZ0, nearestResonances, sigmaCopperAnnealed, synthesizeStub, type LineModel,
} from '../shared-core/src/engine/index.js';
import { evaluateSheet } from '../shared-core/src/sheet/evaluate.js';
import { createSafeMath } from '../shared-core/src/sheet/expr/index.js';
import type { SheetResult } from '../shared-core/src/sheet/types.js';
import { BAND, BOARDS, F0, generateSheet, type GeneratedSheet } from './sheet.js';

const small = process.argv.includes('--small');
const ROOT = process.env.STUBWRIGHT_ROOT ?? process.cwd();
const SERVER = resolve(ROOT, 'server/dist/server.js');
const SIZES = small ? { a: 200, b: 1000 } : { a: 1000, b: 10000 };
const REPS = small ? { cold: 3, edit: 40, server: 40, requests: 100 } : { cold: 3, edit: 40, server: 40, requests: 200 };

const now = () => performance.now();
const round = (x: number, d = 2) => Math.round(x * 10 ** d) / 10 ** d;
function pct(xs: number[], p: number): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.max(0, Math.ceil((p / 100) * s.length) - 1))]!;
}
const median = (xs: number[]) => pct(xs, 50);
const log = (s: string) => process.stderr.write(`bench: ${s}\n`);

/** Replaces one line of `text` (0-based) and returns the new text. */
function replaceLine(lines: string[], index: number, content: string): string {
  const copy = [...lines];
  copy[index] = content;
  return copy.join('\n');
}

/** Two alternating versions of a `stub … length lenN` line: a literal length that changes one stub only. */
function editVariants(line: string): [string, string] {
  const a = line.replace(/length len\d+/, 'length 5.10 mm').replace(/(capacitance|inductance) [\d.]+ (pF|nH)/, '$1 0.80 $2');
  const b = line.replace(/length len\d+/, 'length 5.20 mm').replace(/(capacitance|inductance) [\d.]+ (pF|nH)/, '$1 0.90 $2');
  return [a, b];
}

// ---------------------------------------------------------------- in process

function coldEval(text: string, math: ReturnType<typeof createSafeMath>, runs: number): number {
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t = now();
    evaluateSheet(text, undefined, { math });
    times.push(now() - t);
  }
  return median(times);
}

function editEval(sheet: GeneratedSheet, math: ReturnType<typeof createSafeMath>, stubLine: number, reps: number) {
  const variants = editVariants(sheet.lines[stubLine]!);
  const texts = variants.map((v) => replaceLine(sheet.lines, stubLine, v));
  let previous: SheetResult = evaluateSheet(sheet.text, undefined, { math });
  const times: number[] = [];
  let evaluated = 0;
  for (let i = 0; i < reps; i++) {
    const t = now();
    previous = evaluateSheet(texts[i % 2]!, previous, { math });
    times.push(now() - t);
    evaluated = previous.stats.evaluated;
  }
  return { p50: pct(times, 50), p95: pct(times, 95), evaluated };
}

function rawEngine(sheet: GeneratedSheet): number {
  const t = now();
  const models = new Map<string, LineModel>();
  let sink = 0;
  for (const l of sheet.microstrips) {
    const b = BOARDS[l.board];
    const widthM = l.widthM ?? microstripWidthForZ0({ z0: l.z0!, heightM: b.heightM, dk: b.dk, thicknessM: b.thicknessM }).widthM;
    models.set(l.name, microstripLine({ widthM, heightM: b.heightM, dk: b.dk, thicknessM: b.thicknessM, df: b.df, conductivity: sigmaCopperAnnealed, roughnessM: b.roughnessM }));
  }
  for (const s of sheet.stubs) {
    const model = models.get(s.on)!;
    const lengthM = s.target ? synthesizeStub(s.kind, model, s.target, F0).lengthM : s.lengthM!;
    const a = analyseStub(s.kind, model, lengthM, F0);
    const near = nearestResonances(s.kind, model, lengthM, F0);
    sink += a.reactance + near.marginPct;
    if (s.band) sink += analyseBand(s.kind, model, lengthM, BAND[0], BAND[1]).spreadPct ?? 0;
  }
  if (Number.isNaN(sink)) log('raw engine produced NaN');
  return now() - t;
}

// ---------------------------------------------------------------- the bundled server

const CAPABILITIES: ClientCapabilities = {
  workspace: { configuration: true, diagnostics: { refreshSupport: true }, inlayHint: { refreshSupport: true } },
  textDocument: {
    synchronization: { dynamicRegistration: false },
    diagnostic: { dynamicRegistration: false },
    hover: { contentFormat: ['markdown', 'plaintext'] },
    inlayHint: { dynamicRegistration: false },
  },
};

interface Server {
  connection: ProtocolConnection;
  pid: number;
  /** Peak RSS of the server process, MB (VmHWM), or null where /proc is missing. */
  peakRssMb(): number | null;
  stop(): Promise<void>;
}

async function startServer(): Promise<Server> {
  const child = spawn(process.execPath, [SERVER, '--stdio'], { stdio: ['pipe', 'pipe', 'pipe'] });
  child.stderr!.resume();
  const exited = new Promise<void>((r) => child.on('exit', () => r()));
  const connection = createProtocolConnection(new StreamMessageReader(child.stdout!), new StreamMessageWriter(child.stdin!));
  connection.onRequest(ConfigurationRequest.type, (p) => p.items.map(() => null));
  connection.onRequest(RegistrationRequest.type, () => undefined);
  connection.onRequest(DiagnosticRefreshRequest.type, () => undefined);
  connection.onRequest(InlayHintRefreshRequest.type, () => undefined);
  connection.onRequest(WorkDoneProgressCreateRequest.type, () => undefined);
  connection.onUnhandledNotification(() => undefined);
  connection.listen();
  await connection.sendRequest(InitializeRequest.type, { processId: process.pid, rootUri: null, capabilities: CAPABILITIES });
  await connection.sendNotification(InitializedNotification.type, {});
  return {
    connection,
    pid: child.pid!,
    peakRssMb: () => vmHwmMb(child.pid!),
    async stop() {
      await connection.sendRequest(ShutdownRequest.type);
      await connection.sendNotification(ExitNotification.type);
      await Promise.race([exited, new Promise((r) => setTimeout(r, 3000))]);
      if (child.exitCode === null) child.kill();
      connection.dispose();
    },
  };
}

function vmHwmMb(pid: number | 'self'): number | null {
  try {
    const m = readFileSync(`/proc/${pid}/status`, 'utf8').match(/VmHWM:\s+(\d+) kB/);
    return m ? round(Number(m[1]) / 1024, 1) : null;
  } catch {
    return null;
  }
}

const pull = (c: ProtocolConnection, uri: string) => c.sendRequest(DocumentDiagnosticRequest.type, { textDocument: { uri } });

async function startToDiagnostics(text: string): Promise<number> {
  const t = now();
  const s = await startServer();
  const uri = 'file:///bench/start.rfsheet';
  await s.connection.sendNotification(DidOpenTextDocumentNotification.type, { textDocument: { uri, languageId: 'rfsheet', version: 1, text } });
  await pull(s.connection, uri);
  const ms = now() - t;
  await s.stop();
  return ms;
}

async function serverFigures(sheet: GeneratedSheet, stubLines: number[], reps: number, requests: number) {
  const s = await startServer();
  const c = s.connection;
  const uri = 'file:///bench/big.rfsheet';
  let t = now();
  await c.sendNotification(DidOpenTextDocumentNotification.type, { textDocument: { uri, languageId: 'rfsheet', version: 1, text: sheet.text } });
  await pull(c, uri);
  const openMs = now() - t;

  // Edits: one line replaced by an incremental range change, then a diagnostic pull.
  let version = 1;
  const editTimes: number[] = [];
  const perLine: Record<string, { p50: number; p95: number }> = {};
  for (const line of stubLines) {
    const variants = editVariants(sheet.lines[line]!);
    const times: number[] = [];
    let current = sheet.lines[line]!;
    for (let i = 0; i < reps; i++) {
      const next = variants[i % 2]!;
      t = now();
      await c.sendNotification(DidChangeTextDocumentNotification.type, {
        textDocument: { uri, version: ++version },
        contentChanges: [{ range: { start: { line, character: 0 }, end: { line, character: current.length } }, text: next }],
      });
      await pull(c, uri);
      times.push(now() - t);
      current = next;
    }
    perLine[line === stubLines[0] ? 'top' : 'bottom'] = { p50: pct(times, 50), p95: pct(times, 95) };
    editTimes.push(...times);
  }

  // Hover and inlay hints at varied positions (on names, values and keys of stub lines).
  const hover: number[] = [];
  const inlay: number[] = [];
  const stubs = sheet.stubs;
  for (let i = 0; i < requests; i++) {
    const stub = stubs[Math.floor((i * 7919) % stubs.length)]!;
    const text = sheet.lines[stub.line] ?? '';
    const character = Math.min(text.length - 1, 5 + ((i * 13) % Math.max(1, text.length - 5)));
    t = now();
    await c.sendRequest(HoverRequest.type, { textDocument: { uri }, position: { line: stub.line, character } });
    hover.push(now() - t);
    // An editor asks for the visible range: about 60 lines.
    const start = Math.max(0, stub.line - 30);
    t = now();
    await c.sendRequest(InlayHintRequest.type, { textDocument: { uri }, range: { start: { line: start, character: 0 }, end: { line: start + 60, character: 0 } } });
    inlay.push(now() - t);
  }
  const rss = s.peakRssMb();
  await s.stop();
  return { openMs, editTimes, perLine, hover, inlay, rss };
}

// ---------------------------------------------------------------- main

async function main() {
  if (!existsSync(SERVER)) throw new Error(`${SERVER} is missing: run "npm run build -w server" (bench/run.mjs does it)`);
  const started = now();
  const sheetA = generateSheet(SIZES.a);
  const sheetB = generateSheet(SIZES.b);

  let t = now();
  const math = createSafeMath();
  const mathMs = now() - t;

  log(`cold ${SIZES.a}`);
  coldEval(sheetA.text, math, 1); // warm-up (JIT)
  const cold1 = coldEval(sheetA.text, math, REPS.cold);
  log(`cold ${SIZES.b}`);
  const cold10 = coldEval(sheetB.text, math, REPS.cold);

  log('edit (in process)');
  const top = sheetB.stubs[0]!.line;
  const bottom = sheetB.stubs[sheetB.stubs.length - 1]!.line;
  const editTop = editEval(sheetB, math, top, REPS.edit);
  const editBottom = editEval(sheetB, math, bottom, REPS.edit);

  log('raw engine');
  rawEngine(sheetB); // warm-up
  const raws = [rawEngine(sheetB), rawEngine(sheetB), rawEngine(sheetB)];
  const raw = median(raws);

  log('server: start to diagnostics');
  const startMs = median([await startToDiagnostics(sheetA.text), await startToDiagnostics(sheetA.text), await startToDiagnostics(sheetA.text)]);
  log(`server: ${SIZES.b}-line document`);
  const srv = await serverFigures(sheetB, [top, bottom], REPS.server, REPS.requests);

  const out = {
    cold_1k_ms: round(cold1),
    cold_10k_ms: round(cold10),
    edit_10k_p50_ms: round(pct(srv.editTimes, 50)),
    edit_10k_p95_ms: round(pct(srv.editTimes, 95)),
    hover_p50_ms: round(pct(srv.hover, 50), 3),
    hover_p95_ms: round(pct(srv.hover, 95), 3),
    inlay_p95_ms: round(pct(srv.inlay, 95), 3),
    start_to_diagnostics_ms: round(startMs),
    rss_mb: srv.rss,
    raw_engine_10k_ms: round(raw),
    overhead_ratio: round(cold10 / raw, 1),
    node: process.version,
    cpus: cpus().length,
    date: new Date().toISOString(),
    size: small ? 'small' : 'full',
    // Additional figures (add keys, never rename).
    lines: { cold_1k: SIZES.a, cold_10k: SIZES.b },
    declarations_10k: sheetB.stubs.length + sheetB.microstrips.length,
    stubs_10k: sheetB.stubs.length,
    math_instance_ms: round(mathMs),
    edit_10k_eval_p50_ms: round(Math.max(editTop.p50, editBottom.p50)),
    edit_10k_eval_p95_ms: round(Math.max(editTop.p95, editBottom.p95)),
    edit_10k_eval_top: { p50_ms: round(editTop.p50), p95_ms: round(editTop.p95), evaluated: editTop.evaluated },
    edit_10k_eval_bottom: { p50_ms: round(editBottom.p50), p95_ms: round(editBottom.p95), evaluated: editBottom.evaluated },
    edit_10k_server_top: { p50_ms: round(srv.perLine.top!.p50), p95_ms: round(srv.perLine.top!.p95) },
    edit_10k_server_bottom: { p50_ms: round(srv.perLine.bottom!.p50), p95_ms: round(srv.perLine.bottom!.p95) },
    server_open_10k_ms: round(srv.openMs),
    inlay_p50_ms: round(pct(srv.inlay, 50), 3),
    bench_rss_mb: vmHwmMb('self') ?? round(process.memoryUsage().rss / 2 ** 20, 1),
    repetitions: REPS,
    bench_total_s: 0,
    targets: {
      edit_10k_p95_ms: '< 20',
      cold_10k_ms: '< 100',
      hover_p95_ms: '< 2',
      overhead_ratio: '< 5',
      rss_mb: '< 150',
      note: 'reference only, never asserted; cold_10k/overhead apply to the full size (10 000 lines)',
    },
  };
  out.bench_total_s = round((now() - started) / 1000, 1);
  process.stdout.write(`${JSON.stringify(out, null, 2)}\n`);
}

main().catch((e) => {
  process.stderr.write(`bench failed: ${e instanceof Error ? e.stack : String(e)}\n`);
  process.exit(1);
});
