import { describe, expect, it } from 'vitest';
import type { SheetOptions, SheetResult } from '../sheet/types.js';
import type { DecodeResult } from './decode.js';
import { runCli, type CliDeps } from './run.js';
import { DEMO_RESULT, DEMO_TEXT, EMPTY_RESULT, sheetResult } from './testFixtures.js';

const WARNING_ONLY: SheetResult = sheetResult(DEMO_RESULT.entries, [DEMO_RESULT.diagnostics[0]!]);

/** In-memory deps: files map to texts; the evaluator looks the text up in `results`. */
function fake(files: Record<string, string | DecodeResult>, results: Record<string, SheetResult> = {}) {
  const out = { stdout: '', stderr: '', written: new Map<string, string>(), options: [] as SheetOptions[] };
  const deps: CliDeps = {
    evaluate: (text, options) => {
      out.options.push(options);
      if (text === 'boom') throw new Error('kaput');
      return results[text] ?? EMPTY_RESULT;
    },
    readSheet: async (file) => {
      const f = files[file];
      if (f === undefined) return { ok: false, message: 'no such file or directory' };
      return typeof f === 'string' ? { ok: true, text: f } : f;
    },
    writeFileAtomic: async (file, content) => {
      if (file.startsWith('/readonly/')) throw new Error('permission denied');
      out.written.set(file, content);
    },
    stdout: (t) => void (out.stdout += t),
    stderr: (t) => void (out.stderr += t),
    artifactUri: (file) => file,
    srcRoot: 'file:///w/',
    version: '9.8.7',
  };
  return { deps, out };
}

const files = { 'demo.rfsheet': DEMO_TEXT, 'clean.rfsheet': 'let a = 1\n', 'warn.rfsheet': 'warn' };
const results = { [DEMO_TEXT]: DEMO_RESULT, warn: WARNING_ONLY };

describe('runCli', () => {
  it('prints help and version on stdout with exit 0', async () => {
    const { deps, out } = fake({});
    expect(await runCli(['--help'], deps)).toBe(0);
    expect(out.stdout).toMatch(/^Usage: stubwright <command>/);
    expect(await runCli(['--version'], deps)).toBe(0);
    expect(out.stdout.endsWith('9.8.7\n')).toBe(true);
    expect(out.stderr).toBe('');
  });

  it('reports usage errors on stderr with exit 2 and reads nothing', async () => {
    const { deps, out } = fake(files);
    expect(await runCli(['check', '--nope', 'demo.rfsheet'], deps)).toBe(2);
    expect(out.stderr).toBe("stubwright: unknown option '--nope' for check (see stubwright check --help)\nTry 'stubwright check --help' for usage.\n");
    expect(out.stdout).toBe('');
    expect(out.options).toEqual([]);
  });

  it('eval: annotated sheet then diagnostics; exit 1 on errors, 0 when clean', async () => {
    const { deps, out } = fake(files, results);
    expect(await runCli(['eval', 'demo.rfsheet'], deps)).toBe(1);
    expect(out.stdout).toContain('line feed: microstrip on core, z0 50 ohm            # width is synthesized  # → Z0 50 Ω');
    expect(out.stdout).toMatch(/\n\ndemo\.rfsheet:6:1: warning \[near-resonance\].*\ndemo\.rfsheet:6:14: error \[unknown-name\]/);
    expect(out.stdout).not.toContain('==>');
    const clean = fake(files, results);
    expect(await runCli(['eval', 'clean.rfsheet'], clean.deps)).toBe(0);
    expect(clean.out.stdout).toBe('let a = 1\n');
  });

  it('eval of several files: a header per file; warnings alone exit 0', async () => {
    const { deps, out } = fake(files, results);
    expect(await runCli(['eval', 'clean.rfsheet', 'warn.rfsheet'], deps)).toBe(0);
    expect(out.stdout).toBe('==> clean.rfsheet <==\nlet a = 1\n\n==> warn.rfsheet <==\nwarn\n\n' +
      'warn.rfsheet:6:1: warning [near-resonance] choke is 0.4 % from its λ/4 resonance at 2.44 GHz (margin 10 %)\n');
  });

  it('eval --json: object for one file, array for several; the margin reaches the evaluator', async () => {
    const { deps, out } = fake(files, results);
    expect(await runCli(['eval', '--json', '--margin', '12.5', 'demo.rfsheet'], deps)).toBe(1);
    expect(JSON.parse(out.stdout)).toMatchObject({ file: 'demo.rfsheet', entries: expect.any(Array), diagnostics: expect.any(Array) });
    expect(out.options).toEqual([{ marginPct: 12.5 }]);
    const several = fake(files, results);
    expect(await runCli(['eval', '--json', 'demo.rfsheet', 'clean.rfsheet'], several.deps)).toBe(1);
    expect((JSON.parse(several.out.stdout) as { file: string }[]).map((r) => r.file)).toEqual(['demo.rfsheet', 'clean.rfsheet']);
    expect(several.out.options).toEqual([{}, {}]);
  });

  it('check: text lines, summary on stderr, exit codes with and without --strict', async () => {
    const a = fake(files, results);
    expect(await runCli(['check', 'clean.rfsheet'], a.deps)).toBe(0);
    expect(a.out.stdout + a.out.stderr).toBe('');
    const b = fake(files, results);
    expect(await runCli(['check', 'warn.rfsheet'], b.deps)).toBe(0);
    expect(b.out.stdout).toMatch(/^warn\.rfsheet:6:1: warning \[near-resonance\]/);
    expect(b.out.stderr).toBe('1 file: 0 errors, 1 warning, 0 infos\n');
    const c = fake(files, results);
    expect(await runCli(['check', '--strict', 'warn.rfsheet'], c.deps)).toBe(1);
    const d = fake(files, results);
    expect(await runCli(['check', 'clean.rfsheet', 'demo.rfsheet'], d.deps)).toBe(1);
    expect(d.out.stdout.split('\n').filter(Boolean)).toHaveLength(2);
  });

  it('check: unreadable input is exit 2, and the readable files are still reported', async () => {
    const { deps, out } = fake({ ...files, 'bin.rfsheet': { ok: false, message: 'is a binary file' } }, results);
    expect(await runCli(['check', 'missing.rfsheet', 'bin.rfsheet', 'warn.rfsheet'], deps)).toBe(2);
    expect(out.stderr).toContain('stubwright: missing.rfsheet: no such file or directory\n');
    expect(out.stderr).toContain('stubwright: bin.rfsheet: is a binary file\n');
    expect(out.stdout).toMatch(/^warn\.rfsheet:6:1:/);
  });

  it('check --format json with one unreadable file prints nothing on stdout', async () => {
    const { deps, out } = fake(files, results);
    expect(await runCli(['check', '--format', 'json', 'missing.rfsheet'], deps)).toBe(2);
    expect(out.stdout).toBe('');
  });

  it('check --format sarif: one run, failures as notifications', async () => {
    const { deps, out } = fake(files, results);
    expect(await runCli(['check', '--format', 'sarif', 'demo.rfsheet', 'missing.rfsheet'], deps)).toBe(2);
    const log = JSON.parse(out.stdout);
    expect(log.version).toBe('2.1.0');
    expect(log.runs[0].tool.driver.version).toBe('9.8.7');
    expect(log.runs[0].results).toHaveLength(2);
    expect(log.runs[0].invocations[0].executionSuccessful).toBe(false);
  });

  it('check --output writes the report and nothing to stdout', async () => {
    const { deps, out } = fake(files, results);
    expect(await runCli(['check', '--format', 'sarif', '--output', 'r.sarif', 'demo.rfsheet'], deps)).toBe(1);
    expect(out.stdout).toBe('');
    expect(JSON.parse(out.written.get('r.sarif')!).runs[0].results).toHaveLength(2);
    expect(out.stderr).toBe('stubwright: wrote r.sarif (1 file: 1 error, 1 warning, 0 infos)\n');
  });

  it('check --output to an unwritable place is exit 2', async () => {
    const { deps, out } = fake(files, results);
    expect(await runCli(['check', '--output', '/readonly/r.txt', 'clean.rfsheet'], deps)).toBe(2);
    expect(out.stderr).toBe('stubwright: cannot write /readonly/r.txt: permission denied\n');
  });

  it('an evaluator failure is reported, not thrown (exit 2)', async () => {
    const { deps, out } = fake({ 'x.rfsheet': 'boom' });
    expect(await runCli(['eval', 'x.rfsheet'], deps)).toBe(2);
    expect(out.stderr).toMatch(/^stubwright: x\.rfsheet: internal error while evaluating .*kaput/);
  });
});
