/**
 * Nothing lost: the command line never writes unless told to, and then only atomically.
 * - Every command, on a copy of the examples plus awkward files (CRLF, BOM, binary, non-UTF-8,
 *   empty, a folder, a link, a read-only sheet), leaves the folder exactly as it was: the same
 *   names, bytes, sizes, modes and modification times.
 * - The same commands under Node's permission model with no write access give the same exit
 *   codes and output, so none of them needed to write.
 * - `check --output` adds exactly that one file, refuses to overwrite a sheet it checks, and a
 *   write that fails part-way (the file-size limit `ulimit -f` cuts it off after 1 KiB) leaves the
 *   previous report byte for byte intact and no temporary file behind.
 */
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { chmod, cp, lstat, mkdir, mkdtemp, readdir, readFile, rm, symlink, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { lockedDown } from '../sandbox/permission.js';
import { buildCli, CLI, ROOT, runCliProcess, STACK_TRACE, type Run } from './cliBundle.js';

let dir = '';
/** `ulimit -f` needs a POSIX shell; bash is what the cut-off write test uses. */
const HAVE_BASH = process.platform !== 'win32' && spawnSync('bash', ['-c', 'ulimit -f 1'], { encoding: 'utf8' }).status === 0;

/** Name → type, size, mode, mtime and SHA-256 of everything under `root` (links not followed). */
async function snapshot(root: string): Promise<Record<string, string>> {
  const out: Record<string, string> = {};
  const walk = async (rel: string): Promise<void> => {
    for (const name of (await readdir(join(root, rel))).sort()) {
      const path = join(root, rel, name);
      const s = await lstat(path);
      const kind = s.isDirectory() ? 'dir' : s.isSymbolicLink() ? 'link' : 'file';
      const hash = s.isFile() ? createHash('sha256').update(await readFile(path)).digest('hex') : '';
      out[join(rel, name)] = `${kind} ${s.size} ${(s.mode & 0o7777).toString(8)} ${s.mtimeMs} ${hash}`;
      if (s.isDirectory()) await walk(join(rel, name));
    }
  };
  await walk('');
  return out;
}

const SHEETS = ['power-check.rfsheet', 'sensor-node.rfsheet', 'warnings-tour.rfsheet'];
const ODD = ['crlf.rfsheet', 'bom.rfsheet', 'binary.rfsheet', 'latin1.rfsheet', 'empty.rfsheet', 'readonly.rfsheet', 'link.rfsheet'];

const EVAL_ALL = ['eval', ...SHEETS, ...ODD, 'folder', 'missing.rfsheet'];
const SARIF_ALL = ['check', '--format', 'sarif', ...SHEETS, ...ODD];
const CLASH_SAME = ['check', '--output', 'sensor-node.rfsheet', 'sensor-node.rfsheet'];
const CLASH_LINK = ['check', '--output', 'link.rfsheet', 'warnings-tour.rfsheet'];

/** Every command the CLI has, with valid and invalid arguments. */
const COMMANDS: string[][] = [
  ['--help'], ['--version'], [],
  EVAL_ALL,
  ['eval', '--json', '--margin', '25', ...SHEETS, 'crlf.rfsheet', 'bom.rfsheet'],
  ['check', ...SHEETS, ...ODD, 'folder'],
  ['check', '--strict', '--format', 'json', ...SHEETS],
  SARIF_ALL,
  CLASH_SAME, CLASH_LINK,
  ['check', '--output', join('no', 'such', 'folder', 'r.json'), 'sensor-node.rfsheet'],
  ['check', '--output'], ['lint', 'sensor-node.rfsheet'],
];

beforeAll(async () => {
  await buildCli();
  dir = await mkdtemp(join(tmpdir(), 'stubwright-nothing-lost-'));
  await cp(join(ROOT, 'examples'), dir, { recursive: true });
  const sensor = await readFile(join(dir, 'sensor-node.rfsheet'), 'utf8');
  await writeFile(join(dir, 'crlf.rfsheet'), sensor.replace(/\n/g, '\r\n'));
  await writeFile(join(dir, 'bom.rfsheet'), `\ufeff${sensor}`);
  await writeFile(join(dir, 'binary.rfsheet'), Buffer.from([0x7f, 0x45, 0x4c, 0x46, 0x00, 0x01]));
  await writeFile(join(dir, 'latin1.rfsheet'), Buffer.from('let caf\xe9 = 1\n', 'latin1'));
  await writeFile(join(dir, 'empty.rfsheet'), '');
  await writeFile(join(dir, 'readonly.rfsheet'), sensor);
  await chmod(join(dir, 'readonly.rfsheet'), 0o444);
  await symlink('warnings-tour.rfsheet', join(dir, 'link.rfsheet'));
  await mkdir(join(dir, 'folder'));
  await writeFile(join(dir, 'folder', 'inner.rfsheet'), sensor);
}, 120_000);

afterAll(async () => {
  if (dir) await rm(dir, { recursive: true, force: true });
});

describe('the command line never writes unless told to', () => {
  const runs = new Map<string, Run>();

  it(`${COMMANDS.length} commands leave every name, byte, mode and time in the folder as it was`, async () => {
    const before = await snapshot(dir);
    expect(Object.keys(before)).toEqual(expect.arrayContaining([...SHEETS, ...ODD, 'folder', join('folder', 'inner.rfsheet')]));
    for (const args of COMMANDS) {
      const r = runCliProcess(dir, args);
      runs.set(JSON.stringify(args), r);
      expect([0, 1, 2], JSON.stringify(args)).toContain(r.code);
      expect(r.stderr, JSON.stringify(args)).not.toMatch(STACK_TRACE);
    }
    expect(await snapshot(dir)).toEqual(before);
    // --output naming a checked sheet, directly or through a link, is refused
    expect(runs.get(JSON.stringify(CLASH_SAME))).toMatchObject({ code: 2, stderr: expect.stringMatching(/refusing to overwrite it with a report/) });
    expect(runs.get(JSON.stringify(CLASH_LINK))).toMatchObject({ code: 2, stderr: expect.stringMatching(/--output link\.rfsheet is the sheet warnings-tour\.rfsheet: refusing/) });
  }, 120_000);

  it('the same commands without write permission give the same exit codes and output', () => {
    const noWrite = lockedDown([CLI, dir]);
    // eval and check over every file (the other commands stop at argument parsing or share these paths)
    for (const args of [EVAL_ALL, SARIF_ALL]) {
      const free = runs.get(JSON.stringify(args))!;
      const locked = runCliProcess(dir, args, noWrite);
      expect(locked.code, JSON.stringify(args)).toBe(free.code);
      expect(locked.stdout, JSON.stringify(args)).toBe(free.stdout);
      expect(locked.stderr.split('\n').filter((l) => l.startsWith('stubwright')), JSON.stringify(args)).toEqual(free.stderr.split('\n').filter((l) => l.startsWith('stubwright')));
    }
  }, 120_000);
});

describe('check --output writes one file, atomically', () => {
  it('adds exactly the report, and replaces it whole on the next run', async () => {
    const before = await snapshot(dir);
    const first = runCliProcess(dir, ['check', '--format', 'sarif', '--output', 'report.sarif', 'warnings-tour.rfsheet']);
    expect(first.code).toBe(0);
    const after = await snapshot(dir);
    expect(Object.keys(after).filter((k) => !(k in before))).toEqual(['report.sarif']);
    for (const k of Object.keys(before)) expect(after[k], k).toBe(before[k]);
    const second = runCliProcess(dir, ['check', '--format', 'json', '--output', 'report.sarif', 'sensor-node.rfsheet']);
    expect(second.code).toBe(0);
    expect(JSON.parse(await readFile(join(dir, 'report.sarif'), 'utf8'))).toMatchObject({ file: 'sensor-node.rfsheet' });
    await rm(join(dir, 'report.sarif'));
  });

  it.skipIf(!HAVE_BASH)('a write cut off part-way (bash ulimit -f; skipped without bash) leaves the previous report intact and no temporary file', async () => {
    const old = '{"previous": "report"}\n';
    await writeFile(join(dir, 'kept.sarif'), old);
    const before = await snapshot(dir);
    // bash's ulimit -f counts 1024-byte blocks: the SARIF log of the tour is several KiB.
    const r = spawnSync('bash', ['-c', `ulimit -f 1 && exec "$0" "$@"`, process.execPath, CLI, 'check', '--format', 'sarif', '--output', 'kept.sarif', 'warnings-tour.rfsheet'], { cwd: dir, encoding: 'utf8' });
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/^stubwright: cannot write kept\.sarif: .*(file too large|EFBIG)/im);
    expect(await readFile(join(dir, 'kept.sarif'), 'utf8')).toBe(old);
    expect(await snapshot(dir)).toEqual(before);
    // without the limit the same command succeeds: the failure above was the cut-off write
    expect(runCliProcess(dir, ['check', '--format', 'sarif', '--output', 'kept.sarif', 'warnings-tour.rfsheet']).code).toBe(0);
    expect((await readFile(join(dir, 'kept.sarif'), 'utf8')).length).toBeGreaterThan(1024);
    await rm(join(dir, 'kept.sarif'));
  });
});
