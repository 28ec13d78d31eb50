/** The real, Node-backed `CliDeps` (everything except the evaluator, which `main.ts` supplies). */
import { isAbsolute, relative, resolve, sep } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { CliDeps } from './run.js';
import { readSheetFile, sameFile, writeFileAtomic } from './nodeFiles.js';
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

/** Node implementations of the command line's I/O, relative to `cwd`. */
export function nodeDeps(cwd: string): Omit<CliDeps, 'evaluate'> {
  return {
    readSheet: (file) => readSheetFile(resolve(cwd, file)),
    writeFileAtomic: (file, content) => writeFileAtomic(resolve(cwd, file), content),
    sameFile: (a, b) => sameFile(resolve(cwd, a), resolve(cwd, b)),
    stdout: (text) => void process.stdout.write(text),
    stderr: (text) => void process.stderr.write(text),
    artifactUri: (file) => artifactUri(file, cwd),
    srcRoot: directoryUri(cwd),
    version: STUBWRIGHT_VERSION,
  };
}
