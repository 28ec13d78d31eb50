/** `runCli` export and plot with in-memory I/O and the real evaluator. */
import { describe, expect, it } from 'vitest';
import { evaluateSheet } from '../sheet/evaluate.js';
import { createSafeMath } from '../sheet/expr/index.js';
import { runCli, type CliDeps } from './run.js';

// Invented example.
const SHEET = [
  'substrate board: dk 2.55, df 0.0022, height 0.8 mm, copper 1 oz',
  'line feed: microstrip on board, z0 50 ohm, at 2.45 GHz',
  'stub tune: open on feed, capacitance 0.9 pF, at 2.45 GHz',
].join('\n');
const math = createSafeMath();

function fake(sameFile?: CliDeps['sameFile']) {
  const out = { stdout: '', stderr: '', written: new Map<string, string>(), reads: [] as string[] };
  const deps: CliDeps = {
    evaluate: (text, options) => evaluateSheet(text, undefined, { ...options, math }),
    readSheet: async (file) => {
      out.reads.push(file);
      return file === 'front.rfsheet' ? { ok: true, text: SHEET } : { ok: false, message: 'no such file or directory' };
    },
    writeFileAtomic: async (file, content) => void out.written.set(file, content),
    stdout: (t) => void (out.stdout += t),
    stderr: (t) => void (out.stderr += t),
    artifactUri: (f) => f,
    version: '0.0.0',
    ...(sameFile ? { sameFile } : {}),
  };
  return { deps, out };
}

describe('runCli export and plot', () => {
  it('writes exactly one file through the atomic writer and nothing on stdout', async () => {
    const { deps, out } = fake();
    expect(await runCli(['export', 'front.rfsheet', '--name', 'tune', '--touchstone', 'tune.s2p', '--points', '3'], deps)).toBe(0);
    expect([...out.written.keys()]).toEqual(['tune.s2p']);
    expect(out.written.get('tune.s2p')).toMatch(/^! Stubwright export of tune from front\.rfsheet\n/);
    expect(out.written.get('tune.s2p')!.trimEnd().split('\n').filter((l) => !l.startsWith('!') && !l.startsWith('#'))).toHaveLength(3);
    expect(out.stdout).toBe('');
    expect(await runCli(['plot', 'front.rfsheet', '--name', 'tune', '--svg', 'p.svg', '--margin', '5'], deps)).toBe(0);
    expect(out.written.get('p.svg')).toMatch(/^<svg xmlns="http:\/\/www\.w3\.org\/2000\/svg" class="sw-plot"/);
  });

  it('asks whether the output is the input before reading anything, and refuses then', async () => {
    const asked: [string, string][] = [];
    const { deps, out } = fake(async (a, b) => {
      asked.push([a, b]);
      return a === 'alias.rfsheet';
    });
    expect(await runCli(['export', 'front.rfsheet', '--name', 'tune', '--csv', 'alias.rfsheet'], deps)).toBe(2);
    expect(asked).toEqual([['alias.rfsheet', 'front.rfsheet']]);
    expect(out.reads).toEqual([]);
    expect(out.written.size).toBe(0);
    expect(out.stderr).toBe('stubwright: refusing to write alias.rfsheet: it is the sheet being read; choose another output file\n');
  });

  it('without a sameFile dependency compares the paths as given', async () => {
    const { deps, out } = fake();
    expect(await runCli(['plot', 'front.rfsheet', '--name', 'tune', '--svg', 'front.rfsheet'], deps)).toBe(2);
    expect(out.written.size).toBe(0);
  });

  it('reports a write failure with exit 2', async () => {
    const { deps, out } = fake();
    deps.writeFileAtomic = async () => {
      throw new Error('read-only file system');
    };
    expect(await runCli(['export', 'front.rfsheet', '--name', 'tune', '--csv', 'x.csv'], deps)).toBe(2);
    expect(out.stderr).toBe('stubwright: cannot write x.csv: read-only file system\n');
  });
});
