/**
 * `check --output` never overwrites a sheet it is checking: the same path, another spelling of
 * it, or a link to it is refused (exit 2) before anything is read or written.
 */
import { link, mkdtemp, readFile, rm, symlink, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { nodeDeps } from './nodeDeps.js';
import { sameFile } from './nodeFiles.js';
import { runCli, type CliDeps } from './run.js';
import { EMPTY_RESULT } from './testFixtures.js';

let dir = '';
const SHEET = 'let f0 = 2.45 GHz\n';

beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), 'stubwright-clash-'));
  await writeFile(join(dir, 'a.rfsheet'), SHEET);
  await writeFile(join(dir, 'b.rfsheet'), SHEET);
  await symlink(join(dir, 'a.rfsheet'), join(dir, 'a-link.rfsheet'));
  await link(join(dir, 'a.rfsheet'), join(dir, 'a-hard.rfsheet'));
});
afterAll(async () => {
  if (dir) await rm(dir, { recursive: true, force: true });
});

function deps(): { deps: CliDeps; out: { stderr: string; evaluated: number; written: string[] } } {
  const out = { stderr: '', evaluated: 0, written: [] as string[] };
  const real = nodeDeps(dir);
  return {
    out,
    deps: {
      ...real,
      evaluate: () => (out.evaluated++, EMPTY_RESULT),
      writeFileAtomic: async (file, content) => {
        out.written.push(file);
        await real.writeFileAtomic(file, content);
      },
      stdout: () => {},
      stderr: (t) => void (out.stderr += t),
    },
  };
}

describe('check --output never overwrites an input sheet', () => {
  it.each([
    ['the same path', 'a.rfsheet'],
    ['another spelling of it', './sub/../a.rfsheet'],
    ['a symbolic link to it', 'a-link.rfsheet'],
    ['a hard link to it', 'a-hard.rfsheet'],
  ])('refuses %s (exit 2), evaluates and writes nothing', async (_what, output) => {
    const { deps: d, out } = deps();
    expect(await runCli(['check', '--format', 'json', '--output', output, 'b.rfsheet', 'a.rfsheet'], d)).toBe(2);
    expect(out.stderr).toBe(`stubwright: --output ${output} is the sheet a.rfsheet: refusing to overwrite it with a report\n`);
    expect(out.evaluated).toBe(0);
    expect(out.written).toEqual([]);
    expect(await readFile(join(dir, 'a.rfsheet'), 'utf8')).toBe(SHEET);
  });

  it('still writes a report next to the sheets', async () => {
    const { deps: d, out } = deps();
    expect(await runCli(['check', '--format', 'json', '--output', 'report.json', 'a.rfsheet'], d)).toBe(0);
    expect(out.written).toEqual(['report.json']);
    expect(JSON.parse(await readFile(join(dir, 'report.json'), 'utf8'))).toMatchObject({ file: 'a.rfsheet' });
  });

  it('sameFile: links count, a missing file compares by path', async () => {
    expect(await sameFile(join(dir, 'a.rfsheet'), join(dir, 'a-link.rfsheet'))).toBe(true);
    expect(await sameFile(join(dir, 'a.rfsheet'), join(dir, 'b.rfsheet'))).toBe(false);
    expect(await sameFile(join(dir, 'new.json'), join(dir, 'x', '..', 'new.json'))).toBe(true);
    expect(await sameFile(join(dir, 'new.json'), join(dir, 'a.rfsheet'))).toBe(false);
  });
});
