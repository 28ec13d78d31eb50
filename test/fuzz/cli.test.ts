/**
 * Fuzzing the command line with hostile files, as bytes (NUL bytes, invalid UTF-8, byte-order
 * marks, CR/CRLF endings, very long lines): every command resolves with exit 0, 1 or 2 (2 only
 * when a file cannot be read as a sheet), never prints a stack trace, prints valid JSON/SARIF
 * whose locations lie inside the file, and `eval` prints every line of the sheet back unchanged
 * before its note. In process (the real evaluator behind `runCli`), then a batch through the
 * built bundle as a child process.
 */
import { mkdtemp, readdir, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { decodeSheet } from '../../shared-core/src/cli/decode.js';
import { runCli, type CliDeps } from '../../shared-core/src/cli/run.js';
import { evaluateSheet } from '../../shared-core/src/sheet/evaluate.js';
import { createSafeMath } from '../../shared-core/src/sheet/expr/index.js';
import { buildCli, runCliProcess, STACK_TRACE } from '../safety/cliBundle.js';
import { hostileSheetArb, LARGE, linesOf, runs } from './hostile.js';

const math = createSafeMath();

/** A hostile file as bytes: a hostile sheet's UTF-8, sometimes with a byte-level mutation. */
const bytesArb: fc.Arbitrary<Uint8Array> = fc
  .tuple(
    hostileSheetArb,
    fc.oneof(
      { arbitrary: fc.constant(null), weight: 4 },
      fc.record({ at: fc.double({ min: 0, max: 1, noNaN: true }), bytes: fc.constantFrom([0xff], [0xc3], [0xed, 0xa0, 0x80], [0xf4, 0x90, 0x80, 0x80], [0xc0, 0xaf], [0x80], [0xe2, 0x82]) }),
      fc.constantFrom({ prefix: [0xef, 0xbb, 0xbf] }, { prefix: [0xff, 0xfe] }, { prefix: [0xfe, 0xff] }),
    ),
  )
  .map(([text, m]) => {
    const utf8 = Buffer.from(text, 'utf8');
    if (m === null) return utf8;
    if ('prefix' in m) return Buffer.concat([Buffer.from(m.prefix), utf8]);
    const i = Math.floor(m.at * (utf8.length + 1));
    return Buffer.concat([utf8.subarray(0, i), Buffer.from(m.bytes), utf8.subarray(i)]);
  });

const commandArb = fc.constantFrom(
  ['eval'], ['eval', '--json'], ['eval', '--margin', '1'], ['check'], ['check', '--strict'],
  ['check', '--format', 'json'], ['check', '--format', 'sarif', '--margin', '50'],
);

interface Out {
  stdout: string;
  stderr: string;
}

function memoryDeps(files: Map<string, Uint8Array>, out: Out): CliDeps {
  return {
    evaluate: (text, options) => evaluateSheet(text, undefined, { ...options, math }),
    readSheet: async (file) => decodeSheet(files.get(file)!),
    writeFileAtomic: async () => {
      throw new Error('this test never asks for a file to be written');
    },
    stdout: (t) => void (out.stdout += t),
    stderr: (t) => void (out.stderr += t),
    artifactUri: (file) => file,
    srcRoot: 'file:///fuzz/',
    version: '0.0.0-fuzz',
  };
}

/** Checks the output of one command on `files` (name → bytes). */
function expectSaneOutput(args: readonly string[], names: string[], files: Map<string, Uint8Array>, code: number | null, out: Out): void {
  const decoded = new Map(names.map((n) => [n, decodeSheet(files.get(n)!)]));
  const unreadable = names.filter((n) => !decoded.get(n)!.ok);
  expect([0, 1, 2]).toContain(code);
  expect(code === 2).toBe(unreadable.length > 0);
  expect(out.stderr).not.toMatch(STACK_TRACE);
  expect(out.stdout).not.toMatch(STACK_TRACE);
  for (const n of unreadable) expect(out.stderr).toContain(`stubwright: ${n}: `);
  const textOf = (n: string) => (decoded.get(n) as { ok: true; text: string }).text;
  const readable = names.filter((n) => decoded.get(n)!.ok);
  const json = args.includes('--json') || args.includes('json');
  if (json && readable.length > 0) {
    const parsed = JSON.parse(out.stdout) as unknown;
    const reports = (Array.isArray(parsed) ? parsed : [parsed]) as { file: string; diagnostics: { line: number; column: number; endLine: number; endColumn: number }[] }[];
    expect(reports.map((r) => r.file)).toEqual(readable);
    for (const r of reports) {
      const lines = linesOf(textOf(r.file));
      for (const d of r.diagnostics) {
        expect(d.line).toBeGreaterThanOrEqual(1);
        expect(d.line).toBeLessThanOrEqual(lines.length);
        expect(d.column).toBeGreaterThanOrEqual(1);
        expect(d.endColumn - 1).toBeLessThanOrEqual(lines[d.line - 1]!.length);
      }
    }
  } else if (args.includes('sarif')) {
    const log = JSON.parse(out.stdout) as { runs: { results: { locations: { physicalLocation: { artifactLocation: { uri: string }; region: { startLine: number; startColumn: number } } }[] }[] }[] };
    for (const result of log.runs[0]!.results) {
      const loc = result.locations[0]!.physicalLocation;
      expect(loc.region.startLine).toBeLessThanOrEqual(linesOf(textOf(loc.artifactLocation.uri)).length);
      expect(loc.region.startColumn).toBeGreaterThanOrEqual(1);
    }
  } else if (args[0] === 'eval' && readable.length === 1 && names.length === 1) {
    const lines = linesOf(textOf(readable[0]!));
    if (lines.length > 1 && lines[lines.length - 1] === '') lines.pop();
    const printed = out.stdout.split('\n');
    lines.forEach((line, i) => expect(printed[i]!.startsWith(line.trimEnd()), `line ${i + 1} printed back`).toBe(true));
  }
}

describe('fuzz: command line, in process', () => {
  it('every command on one or several hostile files: exit 0/1/2 as documented, sane output, no stack trace', async () => {
    await fc.assert(fc.asyncProperty(fc.array(bytesArb, { minLength: 1, maxLength: 3 }), commandArb, async (contents, command) => {
      const names = contents.map((_, i) => `sheet${i}.rfsheet`);
      const files = new Map(names.map((n, i) => [n, contents[i]!]));
      const out: Out = { stdout: '', stderr: '' };
      const code = await runCli([...command, ...names], memoryDeps(files, out));
      expectSaneOutput(command, names, files, code, out);
    }), runs(0.5));
  });
});

describe('fuzz: command line, the built bundle on a batch of hostile files', () => {
  let dir = '';
  const count = LARGE ? 300 : 20;
  let names: string[] = [];
  const files = new Map<string, Uint8Array>();

  beforeAll(async () => {
    await buildCli();
    dir = await mkdtemp(join(tmpdir(), 'stubwright-fuzz-cli-'));
    const seed = fc.readConfigureGlobal().seed ?? 1;
    const samples = fc.sample(bytesArb, { numRuns: count, seed });
    names = samples.map((_, i) => `hostile-${String(i).padStart(3, '0')}.rfsheet`);
    for (const [i, bytes] of samples.entries()) {
      files.set(names[i]!, bytes);
      await writeFile(join(dir, names[i]!), bytes);
    }
  }, 120_000);
  afterAll(async () => {
    if (dir) await rm(dir, { recursive: true, force: true });
  });

  it.each(LARGE ? [[['check', '--format', 'json']], [['check', '--format', 'sarif']], [['eval']]] : [[['check', '--format', 'json']], [['eval']]])('%j on all of them in one process', (command) => {
    const r = runCliProcess(dir, [...command, ...names]);
    expectSaneOutput(command, names, files, r.code, r);
  });

  it('left the directory as it was', async () => {
    expect((await readdir(dir)).sort()).toEqual([...names].sort());
  });
});
