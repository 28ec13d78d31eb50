/** The real, Node-backed `CliDeps` (everything except the evaluator, which `main.ts` supplies). */
import { stat } from 'node:fs/promises';
import { isAbsolute, relative, resolve, sep } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { CliDeps } from './run.js';
import { readSheetFile, writeFileAtomic } from './nodeFiles.js';
import { STUBWRIGHT_VERSION } from './version.js';

/**
 * A SARIF artifact URI for `file` relative to `cwd`: `/`-separated and percent-encoded per segment
 * (`sheets/my%20board.rfsheet`, `../other.rfsheet`); an absolute `file:` URI when no relative path
 * exists (another drive).
 */
export function artifactUri(file: string, cwd: string): string {
  const absolute = resolve(cwd, file);
  const rel = relative(cwd, absolute);
  if (rel === '' || isAbsolute(rel)) return pathToFileURL(absolute).href;
  return rel.split(sep).map(encodeURIComponent).join('/');
}

/** `file://` URI of a directory, with the trailing slash SARIF base URIs need. */
export function directoryUri(dir: string): string {
  const href = pathToFileURL(dir).href;
  return href.endsWith('/') ? href : `${href}/`;
}

/** True when two absolute paths are one file: equal paths, or (both existing) the same device and inode. */
export async function sameFile(a: string, b: string): Promise<boolean> {
  if (a === b) return true;
  try {
    const [x, y] = await Promise.all([stat(a), stat(b)]);
    return x.dev === y.dev && x.ino === y.ino;
  } catch {
    return false;
  }
}

/** Node implementations of the command line's I/O, relative to `cwd`. */
export function nodeDeps(cwd: string): Omit<CliDeps, 'evaluate'> {
  return {
    readSheet: (file) => readSheetFile(resolve(cwd, file)),
    writeFileAtomic: (file, content) => writeFileAtomic(resolve(cwd, file), content),
    stdout: (text) => void process.stdout.write(text),
    stderr: (text) => void process.stderr.write(text),
    artifactUri: (file) => artifactUri(file, cwd),
    srcRoot: directoryUri(cwd),
    version: STUBWRIGHT_VERSION,
    sameFile: (a, b) => sameFile(resolve(cwd, a), resolve(cwd, b)),
  };
}
