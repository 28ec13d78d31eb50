/**
 * Whether the code-server end-to-end test can run on this machine, and why not. Unavailability is a
 * skip, unless REQUIRE_CODESERVER=1 (CI) turns it into a failure.
 */
import { accessSync, constants, existsSync, readdirSync } from 'node:fs';
import { delimiter, join } from 'node:path';
import { codeServerDir, snapshotCacheDir } from './paths.js';

/** Result of the availability probe. */
export interface Availability {
  available: boolean;
  /** Why the test cannot run (empty when it can). */
  reason: string;
}

/** Chromium binary driven by playwright-core ($CHROMIUM, else Debian's /usr/bin/chromium). */
export const chromiumPath = (): string => process.env.CHROMIUM || '/usr/bin/chromium';

const onPath = (cmd: string): boolean =>
  (process.env.PATH ?? '').split(delimiter).some((dir) => {
    try {
      accessSync(join(dir, cmd), constants.X_OK);
      return true;
    } catch {
      return false;
    }
  });

/** True when code-server is installed, or a built snapshot is cached (no build tools needed then). */
function codeServerReady(): boolean {
  if (existsSync(join(codeServerDir(), '.code-server-installed'))) return true;
  const cache = snapshotCacheDir();
  return existsSync(cache) && readdirSync(cache).some((f) => /^code-server-.*-built\.tar\.(zst|gz)$/.test(f));
}

/** What a first build of code-server needs (Debian packages named in install-code-server.sh). */
function buildToolsMissing(): string[] {
  const missing = ['rg', 'make', 'g++', 'python3'].filter((c) => !onPath(c));
  if (!existsSync('/usr/include/krb5.h') && !existsSync('/usr/include/krb5/krb5.h')) missing.push('libkrb5-dev');
  return missing;
}

/** Probes chromium and code-server (installed, cached, or buildable). */
export function codeServerAvailability(): Availability {
  if (!existsSync(chromiumPath())) return { available: false, reason: `no chromium at ${chromiumPath()} (apt-get install chromium)` };
  if (!codeServerReady()) {
    const missing = buildToolsMissing();
    if (missing.length) return { available: false, reason: `code-server not built and build tools missing: ${missing.join(', ')}` };
  }
  return { available: true, reason: '' };
}
