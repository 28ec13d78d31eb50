/**
 * `writeFileAtomic` (the only way the command line writes) with the file system failing at each
 * step: half-way through the write (no space left), at the flush, at the rename. Each time the
 * previous file keeps its bytes, no temporary file is left behind, and the error says what went
 * wrong in words. The real file system is used; only the failing call is replaced.
 */
import { mkdtemp, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';

/** Which step fails next (set by each test). */
const failure: { at: 'none' | 'write' | 'sync' | 'rename' } = { at: 'none' };

const fsError = (code: string, message: string) => Object.assign(new Error(`${code}: ${message}`), { code });

vi.mock('node:fs/promises', async (importOriginal) => {
  const real = await importOriginal<typeof import('node:fs/promises')>();
  return {
    ...real,
    open: async (...args: Parameters<typeof real.open>) => {
      const handle = await real.open(...args);
      return new Proxy(handle, {
        get(target, key) {
          if (key === 'writeFile' && failure.at === 'write') {
            return async (data: string) => {
              await target.writeFile(data.slice(0, Math.floor(data.length / 2)), 'utf8');
              throw fsError('ENOSPC', 'no space left on device, write');
            };
          }
          if (key === 'sync' && failure.at === 'sync') return async () => Promise.reject(fsError('EIO', 'i/o error, fsync'));
          const value = Reflect.get(target, key, target) as unknown;
          return typeof value === 'function' ? value.bind(target) : value;
        },
      });
    },
    rename: async (...args: Parameters<typeof real.rename>) => {
      if (failure.at === 'rename') throw fsError('EXDEV', 'cross-device link not permitted, rename');
      return real.rename(...args);
    },
  };
});

const { writeFileAtomic } = await import('../../shared-core/src/cli/nodeFiles.js');

let dir = '';
const OLD = '{"report": "the previous one"}\n';
const NEW = `${JSON.stringify({ report: 'the new one', padding: 'x'.repeat(100_000) })}\n`;

beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), 'stubwright-atomic-'));
});
afterAll(async () => {
  if (dir) await rm(dir, { recursive: true, force: true });
});
afterEach(() => {
  failure.at = 'none';
});

describe('writeFileAtomic when the file system fails', () => {
  it.each([
    ['half-way through the write', 'write', /no space left on the device/],
    ['at the flush', 'sync', /EIO: i\/o error, fsync/],
    ['at the rename', 'rename', /EXDEV: cross-device link not permitted/],
  ] as const)('%s: the old file is intact and no temporary file is left', async (_label, at, message) => {
    const target = join(dir, `report-${at}.json`);
    await writeFile(target, OLD);
    failure.at = at;
    await expect(writeFileAtomic(target, NEW)).rejects.toThrow(message);
    expect(await readFile(target, 'utf8')).toBe(OLD);
    expect((await readdir(dir)).filter((f) => f.startsWith(`.report-${at}.json`))).toEqual([]);
  });

  it('with nothing failing, the new content replaces the old whole (the mocks pass through)', async () => {
    const target = join(dir, 'report-ok.json');
    await writeFile(target, OLD);
    await writeFileAtomic(target, NEW);
    expect(await readFile(target, 'utf8')).toBe(NEW);
    expect((await readdir(dir)).filter((f) => f.endsWith('.tmp'))).toEqual([]);
  });
});
