/** Where the code-server end-to-end test keeps its install, cache, workspace and artifacts. */
import { homedir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** Repository root. */
export const ROOT = fileURLToPath(new URL('../../../', import.meta.url));

/** Cache folder for the code-server tarball and built snapshot (as install-code-server.sh computes it). */
export const snapshotCacheDir = (): string =>
  process.env.STUBWRIGHT_EDITOR_CACHE || join(process.env.XDG_CACHE_HOME || join(homedir(), '.cache'), 'stubwright-editor');

/** code-server install folder ($CODE_SERVER_DIR, else inside the cache). */
export const codeServerDir = (): string => process.env.CODE_SERVER_DIR || join(snapshotCacheDir(), 'code-server');

/** The install script, a project copy of the shared harness's logic. */
export const INSTALL_SCRIPT = join(ROOT, 'test/editor/install-code-server.sh');

/** Screenshots, summary and logs of the last run (gitignored). */
export const ARTIFACTS = join(ROOT, 'test/artifacts/codeserver');

/** The packaged extension, as `npm run package` writes it. */
export function vsixPath(version: string): string {
  return join(ROOT, 'client', `stubwright-${version}.vsix`);
}
