/**
 * End-to-end tests of the built `stubwright` bundle: `node shared-core/dist/cli.js …` as a child
 * process, on real sheets evaluated by the real evaluator. The bundle is rebuilt here
 * (./safety/cliBundle.ts: the esbuild options of `npm run build:cli`, written to a temporary file,
 * then renamed into place).
 */
import { spawnSync } from 'node:child_process';
import { mkdir, mkdtemp, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildCli, CLI, ROOT } from './safety/cliBundle.js';

const VERSION = (JSON.parse(await readFile(join(ROOT, 'package.json'), 'utf8')) as { version: string }).version;

const SHEETS: Record<string, string> = {
  // Invented demo: 2.45 GHz sensor node, 0.8 mm glass-PTFE board.
  'clean.rfsheet': [
    'let f0 = 2.45 GHz',
    'substrate core: dk 2.55, df 0.0022, height 0.8 mm, copper 35 um',
    'line feed: microstrip on core, z0 50 ohm',
    'stub tune: open on feed, capacitance 0.9 pF, at f0',
    '',
  ].join('\n'),
  // The choke is marked resonant but sits about 11 % from its λ/4 resonance: a `detuned` warning at the 10 % margin.
  'warn.rfsheet': [
    'let f0 = 2.45 GHz',
    'substrate core: dk 2.55 ± 0.04, df 0.0022, height 0.8 mm, copper 35 um',
    'line thin: microstrip on core, z0 100 ohm',
    'stub choke: short on thin, length 19.8 mm, at f0, resonant',
    '',
  ].join('\n'),
  'error.rfsheet': 'let f0 = 2.45 GHz\nstub lost: short on nowhere, length 5 mm, at f0\n',
  'my sheet.rfsheet': 'let f0 = 2.45 GHz\r\nstub lost: short on nowhere, length 5 mm, at f0\r\n',
};

let work = '';

interface Run {
  code: number | null;
  stdout: string;
  stderr: string;
}

function cli(...args: string[]): Run {
  const r = spawnSync(process.execPath, [CLI, ...args], { cwd: work, encoding: 'utf8', timeout: 60_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

const listing = async (dir = work): Promise<string[]> => (await readdir(dir)).sort();

beforeAll(async () => {
  await buildCli();
  work = await mkdtemp(join(tmpdir(), 'stubwright-cli-'));
  for (const [name, text] of Object.entries(SHEETS)) await writeFile(join(work, name), text);
  await mkdir(join(work, 'folder.rfsheet'));
  await writeFile(join(work, 'binary.rfsheet'), Buffer.from([0x7f, 0x45, 0x4c, 0x46, 0x02, 0x01, 0x00, 0x00, 0xff]));
  await writeFile(join(work, 'latin1.rfsheet'), Buffer.from('let caf\xe9 = 1\n', 'latin1'));
  await writeFile(join(work, 'huge.rfsheet'), 'let a = 1\n'.repeat(120_000));
}, 120_000);

afterAll(async () => {
  if (work) await rm(work, { recursive: true, force: true });
});

const BEFORE = ['binary.rfsheet', 'clean.rfsheet', 'error.rfsheet', 'folder.rfsheet', 'huge.rfsheet', 'latin1.rfsheet', 'my sheet.rfsheet', 'warn.rfsheet'];
const DIAGNOSTIC_LINE = /^(.+):(\d+):(\d+): (error|warning|info) \[([a-z-]+)\] .+$/;

describe('stubwright (built bundle)', () => {
  it('the build script in shared-core/package.json uses the options this test builds with', async () => {
    const pkg = JSON.parse(await readFile(join(ROOT, 'shared-core', 'package.json'), 'utf8')) as { scripts: Record<string, string> };
    const script = pkg.scripts['build:cli'] ?? '';
    for (const part of ['src/cli/main.ts', '--bundle', '--platform=node', '--target=node20', '--format=esm', '#!/usr/bin/env node', '--outfile=dist/cli.js']) {
      expect(script).toContain(part);
    }
    const root = JSON.parse(await readFile(join(ROOT, 'package.json'), 'utf8')) as { bin: Record<string, string> };
    expect(root.bin).toEqual({ stubwright: 'shared-core/dist/cli.js' });
    expect((await readFile(CLI, 'utf8')).startsWith('#!/usr/bin/env node\n')).toBe(true);
  });

  it('--help and --version exit 0', () => {
    const help = cli('--help');
    expect(help).toMatchObject({ code: 0, stderr: '' });
    expect(help.stdout).toMatch(/^Usage: stubwright <command>/);
    expect(cli('check', '--help').stdout).toMatch(/--format FORMAT/);
    expect(cli('--version')).toEqual({ code: 0, stdout: `${VERSION}\n`, stderr: '' });
  });

  it('eval prints the sheet with aligned notes, then its diagnostics', () => {
    const r = cli('eval', 'clean.rfsheet');
    expect(r.code).toBe(0);
    const lines = r.stdout.trimEnd().split('\n');
    expect(lines).toHaveLength(4);
    SHEETS['clean.rfsheet']!.trimEnd().split('\n').forEach((line, i) => expect(lines[i]!.startsWith(line)).toBe(true));
    const columns = lines.filter((l) => l.includes('# →')).map((l) => l.indexOf('# →'));
    expect(columns).toHaveLength(2);
    expect(new Set(columns).size).toBe(1);
    expect(lines[2]).toMatch(/# → w = 2\.\d+ mm · εeff 2\.\d+$/);
    expect(lines[3]).toMatch(/# → ℓ = \d+(\.\d+)? mm · ≈ 0\.9 pF · X −\d+(\.\d+)? Ω$/);

    const e = cli('eval', 'error.rfsheet');
    expect(e.code).toBe(1);
    expect(e.stdout).toMatch(/\n\nerror\.rfsheet:2:21: error \[unknown-name\] no line named nowhere/);
  });

  it('eval of several files prints a header for each', () => {
    const r = cli('eval', 'clean.rfsheet', 'warn.rfsheet');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^==> clean\.rfsheet <==\n/);
    expect(r.stdout).toMatch(/\n\n==> warn\.rfsheet <==\n/);
    expect(r.stdout).toMatch(/warn\.rfsheet:4:\d+: warning \[detuned\]/);
  });

  it('eval --json: an object for one file, an array for several, with the pinned keys', () => {
    const one = cli('eval', '--json', 'error.rfsheet');
    expect(one.code).toBe(1);
    const report = JSON.parse(one.stdout);
    expect(Object.keys(report)).toEqual(['file', 'entries', 'diagnostics']);
    expect(report.file).toBe('error.rfsheet');
    expect(report.entries[0]).toEqual({ line: 1, kind: 'let', name: 'f0', results: expect.any(Object) });
    expect(report.diagnostics).toEqual([
      expect.objectContaining({ line: 2, column: 21, endLine: 2, endColumn: 28, severity: 'error', code: 'unknown-name' }),
    ]);
    const several = JSON.parse(cli('eval', '--json', 'clean.rfsheet', 'warn.rfsheet').stdout);
    expect(Array.isArray(several)).toBe(true);
    expect(several.map((r: { file: string }) => r.file)).toEqual(['clean.rfsheet', 'warn.rfsheet']);
    const feed = several[0].entries.find((e: { name: string }) => e.name === 'feed');
    expect(feed.results.z0_ohm).toBeCloseTo(50, 6);
  });

  it('check text: one FILE:LINE:COL line per diagnostic; exit codes 0, 1 and --strict', () => {
    expect(cli('check', 'clean.rfsheet')).toEqual({ code: 0, stdout: '', stderr: '' });
    const warn = cli('check', 'warn.rfsheet');
    expect(warn.code).toBe(0);
    expect(warn.stdout.endsWith('\n')).toBe(true);
    expect(warn.stdout.trimEnd().match(DIAGNOSTIC_LINE)?.slice(1, 6)).toEqual(['warn.rfsheet', '4', expect.any(String), 'warning', 'detuned']);
    expect(warn.stderr).toBe('1 file: 0 errors, 1 warning, 0 infos\n');
    expect(cli('check', '--strict', 'warn.rfsheet').code).toBe(1);
    expect(cli('check', '--strict', '--margin', '15', 'warn.rfsheet').code).toBe(0);
    const err = cli('check', 'clean.rfsheet', 'error.rfsheet', 'my sheet.rfsheet');
    expect(err.code).toBe(1);
    expect(err.stdout.trimEnd().split('\n')).toEqual([
      expect.stringMatching(/^error\.rfsheet:2:21: error \[unknown-name\]/),
      expect.stringMatching(/^my sheet\.rfsheet:2:21: error \[unknown-name\]/),
    ]);
  });

  it('check --format sarif: a SARIF 2.1.0 log', () => {
    const r = cli('check', '--format', 'sarif', 'error.rfsheet', 'my sheet.rfsheet', 'clean.rfsheet');
    expect(r.code).toBe(1);
    const log = JSON.parse(r.stdout);
    expect(log.$schema).toBe('https://json.schemastore.org/sarif-2.1.0.json');
    expect(log.version).toBe('2.1.0');
    expect(log.runs).toHaveLength(1);
    const run = log.runs[0];
    expect(run.tool.driver.name).toBe('stubwright');
    expect(run.tool.driver.version).toBe(VERSION);
    const ruleIds = run.tool.driver.rules.map((rule: { id: string }) => rule.id);
    expect(ruleIds).toContain('unknown-name');
    for (const rule of run.tool.driver.rules) expect(rule.shortDescription.text).toMatch(/\.$/);
    expect(run.results).toHaveLength(2);
    for (const result of run.results) {
      expect(ruleIds[result.ruleIndex]).toBe(result.ruleId);
      expect(result.level).toBe('error');
      expect(typeof result.message.text).toBe('string');
      expect(result.locations[0].physicalLocation.region).toEqual({ startLine: 2, startColumn: 21, endLine: 2, endColumn: 28 });
    }
    expect(run.results.map((x: any) => x.locations[0].physicalLocation.artifactLocation.uri)).toEqual(['error.rfsheet', 'my%20sheet.rfsheet']);
    expect(run.invocations).toEqual([{ executionSuccessful: true }]);
  });

  it.each([
    [['check', 'missing.rfsheet'], /missing\.rfsheet: no such file or directory/],
    [['check', 'folder.rfsheet'], /folder\.rfsheet: is a directory/],
    [['check', 'binary.rfsheet'], /binary\.rfsheet: is a binary file/],
    [['check', 'latin1.rfsheet'], /latin1\.rfsheet: is not UTF-8 text \(byte 0xE9 at line 1, byte 8\)/],
    [['eval', 'huge.rfsheet'], /huge\.rfsheet: is too large for a sheet/],
    [['check', '--bogus', 'clean.rfsheet'], /unknown option '--bogus'/],
    [['check', '--format', 'xml', 'clean.rfsheet'], /--format must be text, json or sarif/],
    [['check', '--margin', 'ten', 'clean.rfsheet'], /--margin must be a percentage/],
    [['eval', '--margin', '0', 'clean.rfsheet'], /--margin must be a percentage/],
    [['check'], /no sheet given/],
    [['lint', 'clean.rfsheet'], /unknown command 'lint'/],
    [[], /missing command/],
  ])('%j exits 2 with a clear message and no stack trace', (args, message) => {
    const r = cli(...(args as string[]));
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(message);
    expect(r.stderr).not.toMatch(/\n\s+at /);
    expect(r.stdout).toBe('');
  });

  it('reports the readable files even when another cannot be read (exit 2)', () => {
    const r = cli('check', '--format', 'sarif', 'error.rfsheet', 'missing.rfsheet');
    expect(r.code).toBe(2);
    const run = JSON.parse(r.stdout).runs[0];
    expect(run.results).toHaveLength(1);
    expect(run.invocations[0].executionSuccessful).toBe(false);
    expect(run.invocations[0].toolExecutionNotifications[0].message.text).toMatch(/missing\.rfsheet: no such file/);
  });

  it('--output writes the report atomically, prints nothing on stdout and creates no other file', async () => {
    const first = cli('check', '--format', 'sarif', '--output', 'report.sarif', 'error.rfsheet');
    expect(first.code).toBe(1);
    expect(first.stdout).toBe('');
    expect(first.stderr).toBe('stubwright: wrote report.sarif (1 file: 1 error, 0 warnings, 0 infos)\n');
    expect(await listing()).toEqual([...BEFORE, 'report.sarif'].sort());
    expect(JSON.parse(await readFile(join(work, 'report.sarif'), 'utf8')).runs[0].results).toHaveLength(1);

    const again = cli('check', '--format', 'json', '--output', 'report.sarif', 'clean.rfsheet');
    expect(again.code).toBe(0);
    expect(again.stdout).toBe('');
    expect(JSON.parse(await readFile(join(work, 'report.sarif'), 'utf8'))).toMatchObject({ file: 'clean.rfsheet', diagnostics: [] });
    expect(await listing()).toEqual([...BEFORE, 'report.sarif'].sort());

    const nowhere = cli('check', '--output', join('no', 'such', 'dir', 'r.txt'), 'clean.rfsheet');
    expect(nowhere.code).toBe(2);
    expect(nowhere.stderr).toMatch(/cannot write .*r\.txt: no such file or directory/);
    await rm(join(work, 'report.sarif'));
    expect(await listing()).toEqual(BEFORE);
  });

  it('never writes a file without --output', async () => {
    for (const args of [['eval', 'clean.rfsheet'], ['eval', '--json', 'warn.rfsheet'], ['check', '--format', 'sarif', 'error.rfsheet'], ['check', 'missing.rfsheet']]) {
      cli(...args);
    }
    expect(await listing()).toEqual(BEFORE);
  });
});
