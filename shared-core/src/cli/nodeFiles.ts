/**
 * File access of the command line (Node): bounded, checked reading of sheets and atomic writing
 * of reports. Never throws from `readSheetFile`; `writeFileAtomic` throws an Error with a plain message.
 */
import { randomBytes } from 'node:crypto';
import { open, rename, rm, stat } from 'node:fs/promises';
import { basename, dirname, join, resolve } from 'node:path';
import { decodeSheet, type DecodeResult } from './decode.js';

/**
 * Largest sheet read (1 MiB). Design notes are kilobytes; a 1 MiB sheet of 40 000 declarations
 * already takes seconds to evaluate, so a stray huge file is refused instead of stalling CI.
 */
export const MAX_SHEET_BYTES = 1024 * 1024;

const REASONS: Record<string, string> = {
  ENOENT: 'no such file or directory',
  EACCES: 'permission denied',
  EPERM: 'permission denied',
  EISDIR: 'is a directory',
  ENOTDIR: 'a part of the path is not a directory',
  ELOOP: 'too many levels of symbolic links',
  ENAMETOOLONG: 'file name too long',
  EROFS: 'read-only file system',
  ENOSPC: 'no space left on the device',
  EMFILE: 'too many open files',
};

/** A readable reason for a file-system error. */
export function describeFsError(e: unknown): string {
  const code = (e as { code?: unknown } | null)?.code;
  if (typeof code === 'string' && REASONS[code]) return REASONS[code];
  return e instanceof Error ? e.message : String(e);
}

const tooLarge = (bytes: number, max: number): DecodeResult => ({
  ok: false,
  message: `is too large for a sheet (${bytes} bytes or more; the limit is ${max} bytes)`,
});

/** Reads a sheet: refuses directories, devices, FIFOs, files over `maxBytes`, binary and non-UTF-8 data. */
export async function readSheetFile(file: string, maxBytes = MAX_SHEET_BYTES): Promise<DecodeResult> {
  try {
    const info = await stat(file);
    if (info.isDirectory()) return { ok: false, message: 'is a directory: give the sheet files inside it' };
    if (!info.isFile()) return { ok: false, message: 'is not a regular file' };
    if (info.size > maxBytes) return tooLarge(info.size, maxBytes);
    const handle = await open(file, 'r');
    try {
      // Read in chunks and stop past maxBytes: the file may have grown since `stat`.
      const chunks: Buffer[] = [];
      let length = 0;
      for (;;) {
        const chunk = Buffer.alloc(65_536);
        const { bytesRead } = await handle.read(chunk, 0, chunk.length, null);
        if (bytesRead === 0) break;
        chunks.push(chunk.subarray(0, bytesRead));
        length += bytesRead;
        if (length > maxBytes) return tooLarge(length, maxBytes);
      }
      return decodeSheet(Buffer.concat(chunks, length));
    } finally {
      await handle.close();
    }
  } catch (e) {
    return { ok: false, message: describeFsError(e) };
  }
}

/** Whether two paths name the same file (links followed); when either does not exist, whether the paths are equal. */
export async function sameFile(a: string, b: string): Promise<boolean> {
  if (resolve(a) === resolve(b)) return true;
  try {
    const [x, y] = await Promise.all([stat(a), stat(b)]);
    return x.dev === y.dev && x.ino === y.ino;
  } catch {
    return resolve(a) === resolve(b);
  }
}

/**
 * Writes `content` (UTF-8) to `file` atomically: a temporary file in the same directory, flushed,
 * then renamed over the target, so readers see the old report or the new one, never a partial one.
 * An existing target keeps its permission bits. The temporary file is removed on failure.
 */
export async function writeFileAtomic(file: string, content: string): Promise<void> {
  const target = resolve(file);
  const temp = join(dirname(target), `.${basename(target)}.${process.pid}.${randomBytes(6).toString('hex')}.tmp`);
  let created = false;
  try {
    const mode = await stat(target).then((s) => (s.isFile() ? s.mode & 0o7777 : undefined), () => undefined);
    const handle = await open(temp, 'wx', mode ?? 0o666);
    created = true;
    try {
      await handle.writeFile(content, 'utf8');
      await handle.sync();
    } finally {
      await handle.close();
    }
    await rename(temp, target);
  } catch (e) {
    if (created) await rm(temp, { force: true }).catch(() => undefined);
    throw new Error(describeFsError(e));
  }
}
