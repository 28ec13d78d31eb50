/**
 * The attack corpus planted in sheet files, checked by the built command line running under
 * Node's permission model (read access to the bundle and the folder only: no writes, no child
 * processes, no workers) with sockets, DNS and fetch trapped. One process checks every file:
 * each attack gets a located error on its own line, the process attempted nothing outside
 * (nothing refused), and the folder is byte for byte as it was.
 */
import { mkdtemp, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LARGE } from '../fuzz/hostile.js';
import { buildCli, CLI, runCliProcess, STACK_TRACE } from '../safety/cliBundle.js';
import { ATTACK_EXPRESSIONS, ATTACK_TEMPLATES, placements, type Placement } from './attacks.js';
import { lockedDown, violations } from './permission.js';

/** Harmless once read (see evaluator.test.ts): they may evaluate to a plain value. */
const PLAIN_ARITHMETIC = new Set(['2^-1e9', 'mm^1e9', '\uFEFF1']);

/** CI: every attack in two positions (rotating, not the pair the server test uses); `npm run fuzz`: all. */
const CHOSEN: Placement[] = LARGE
  ? placements()
  : ATTACK_EXPRESSIONS.flatMap((a, i) => placements([a], [ATTACK_TEMPLATES[(i + 1) % ATTACK_TEMPLATES.length]!, ATTACK_TEMPLATES[(i + 5) % ATTACK_TEMPLATES.length]!]));

let dir = '';
const name = (i: number) => `attack-${String(i).padStart(4, '0')}.rfsheet`;

beforeAll(async () => {
  await buildCli();
  dir = await mkdtemp(join(tmpdir(), 'stubwright-attacks-'));
  for (const [i, p] of CHOSEN.entries()) await writeFile(join(dir, name(i)), p.text);
}, 120_000);

afterAll(async () => {
  if (dir) await rm(dir, { recursive: true, force: true });
});

describe('attack corpus through the command line under the permission model', () => {
  it(`check --format json on ${CHOSEN.length} attacked sheets: a located error on each attack's line, nothing attempted outside`, async () => {
    const r = runCliProcess(dir, ['check', '--format', 'json', ...CHOSEN.map((_, i) => name(i))], lockedDown([CLI, dir]));
    // A NUL byte makes a file binary: refused whole with a message naming it (exit 2), never evaluated.
    const binary = CHOSEN.flatMap((p, i) => (p.attack.includes('\u0000') ? [name(i)] : []));
    expect(binary.length).toBeGreaterThan(0);
    expect(r.code).toBe(2);
    expect(r.stderr.split('\n').filter((l) => l.startsWith('stubwright:'))).toEqual(binary.map((f) => expect.stringMatching(new RegExp(`^stubwright: ${f}: is a binary file`))));
    expect(r.stderr).toContain('SANDBOX-ARMED');
    expect(violations(r.stderr)).toEqual([]);
    expect(r.stderr).not.toMatch(STACK_TRACE);
    const reports = new Map((JSON.parse(r.stdout) as { file: string; diagnostics: { line: number; column: number; severity: string }[] }[]).map((x) => [x.file, x]));
    expect(reports.size).toBe(CHOSEN.length - binary.length);
    const failures = CHOSEN.flatMap((p, i) => {
      if (binary.includes(name(i))) return [];
      const hit = reports.get(name(i))!.diagnostics.some((d) => d.severity === 'error' && d.line === p.line + 1 && d.column >= p.column + 1);
      return hit || PLAIN_ARITHMETIC.has(p.attack) ? [] : [p.label];
    });
    expect(failures).toEqual([]);
  }, 300_000);

  it('eval on the same files prints every sheet back and leaves the folder as it was', async () => {
    const before = await Promise.all(CHOSEN.map((_, i) => readFile(join(dir, name(i)), 'utf8')));
    const r = runCliProcess(dir, ['eval', ...CHOSEN.map((_, i) => name(i))], lockedDown([CLI, dir]));
    expect(r.code).toBe(2); // the binary ones, as above
    expect(violations(r.stderr)).toEqual([]);
    expect(r.stdout.match(/^==> attack-\d{4}\.rfsheet <==$/gm)).toHaveLength(CHOSEN.filter((p) => !p.attack.includes('\u0000')).length);
    expect((await readdir(dir)).sort()).toEqual(CHOSEN.map((_, i) => name(i)));
    expect(await Promise.all(CHOSEN.map((_, i) => readFile(join(dir, name(i)), 'utf8')))).toEqual(before);
  }, 300_000);
});
