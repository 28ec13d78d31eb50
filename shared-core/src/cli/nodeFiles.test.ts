import { mkdir, mkdtemp, readdir, readFile, rm, stat, symlink, writeFile, chmod } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { artifactUri, directoryUri } from './nodeDeps.js';
import { readSheetFile, writeFileAtomic } from './nodeFiles.js';

let dir = '';
beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), 'stubwright-files-'));
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

describe('readSheetFile', () => {
  it('reads UTF-8 text', async () => {
    await writeFile(join(dir, 'ok.rfsheet'), 'let f0 = 2.45 GHz\n');
    expect(await readSheetFile(join(dir, 'ok.rfsheet'))).toEqual({ ok: true, text: 'let f0 = 2.45 GHz\n' });
  });

  it('refuses what is not a readable text file, with a reason', async () => {
    await mkdir(join(dir, 'sub'));
    await writeFile(join(dir, 'big.rfsheet'), 'x'.repeat(101));
    await writeFile(join(dir, 'bin.rfsheet'), Buffer.from([0x7f, 0x45, 0x4c, 0x46, 0, 1]));
    await writeFile(join(dir, 'latin1.rfsheet'), Buffer.from('caf\xe9', 'latin1'));
    await symlink(join(dir, 'loop'), join(dir, 'loop'));
    const reason = async (p: string, max?: number) => {
      const r = await readSheetFile(join(dir, p), max);
      return r.ok ? 'read' : r.message;
    };
    expect(await reason('nothing.rfsheet')).toBe('no such file or directory');
    expect(await reason('sub')).toMatch(/^is a directory/);
    expect(await reason('big.rfsheet', 100)).toBe('is too large for a sheet (101 bytes or more; the limit is 100 bytes)');
    expect(await reason('big.rfsheet', 101)).toBe('read');
    expect(await reason('bin.rfsheet')).toMatch(/binary file/);
    expect(await reason('latin1.rfsheet')).toMatch(/not UTF-8 text \(byte 0xE9 at line 1, byte 4\)/);
    expect(await reason('loop')).toBe('too many levels of symbolic links');
    expect(await reason('ok.rfsheet/x')).toBe('a part of the path is not a directory');
  });

  it.skipIf(process.platform === 'win32')('refuses devices without reading them', async () => {
    expect(await readSheetFile('/dev/zero')).toEqual({ ok: false, message: 'is not a regular file' });
  });
});

describe('writeFileAtomic', () => {
  it('creates and replaces a file, leaving no temporary file behind', async () => {
    const out = join(dir, 'w', 'report.sarif');
    await mkdir(join(dir, 'w'));
    await writeFileAtomic(out, 'one');
    await writeFileAtomic(out, 'two µ');
    expect(await readFile(out, 'utf8')).toBe('two µ');
    expect(await readdir(join(dir, 'w'))).toEqual(['report.sarif']);
  });

  it.skipIf(process.platform === 'win32')('keeps the permission bits of an existing file', async () => {
    const out = join(dir, 'w', 'mode.txt');
    await writeFile(out, 'x');
    await chmod(out, 0o640);
    await writeFileAtomic(out, 'y');
    expect((await stat(out)).mode & 0o777).toBe(0o640);
  });

  it('fails with a plain reason and cleans up', async () => {
    await expect(writeFileAtomic(join(dir, 'no', 'such', 'dir', 'r.txt'), 'x')).rejects.toThrow('no such file or directory');
    await mkdir(join(dir, 'target-is-dir'));
    await mkdir(join(dir, 'target-is-dir', 'r.txt'));
    await expect(writeFileAtomic(join(dir, 'target-is-dir', 'r.txt'), 'x')).rejects.toThrow();
    expect(await readdir(join(dir, 'target-is-dir'))).toEqual(['r.txt']);
  });
});

describe('artifact URIs', () => {
  it('are relative, slash-separated and percent-encoded', () => {
    expect(artifactUri('sheets/demo.rfsheet', '/work/proj')).toBe('sheets/demo.rfsheet');
    expect(artifactUri('/work/proj/my board #2.rfsheet', '/work/proj')).toBe('my%20board%20%232.rfsheet');
    expect(artifactUri('../other/a.rfsheet', '/work/proj')).toBe('../other/a.rfsheet');
    expect(artifactUri('./x/../b.rfsheet', '/work/proj')).toBe('b.rfsheet');
    expect(directoryUri('/work/proj')).toBe('file:///work/proj/');
    expect(directoryUri('/')).toBe('file:///');
  });
});
