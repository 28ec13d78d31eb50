/**
 * Node options that lock a bundle down: Node's permission model with read access to the listed
 * paths only (no file writes, no child processes, no workers, no native addons), plus
 * `netTrap.cjs`, which refuses sockets, DNS and fetch (the permission model does not cover the
 * network in Node 20). Test-only.
 */
import { fileURLToPath } from 'node:url';

/** `--permission` where Node has it (22+), `--experimental-permission` on Node 20. */
export const PERMISSION_FLAG = process.allowedNodeEnvironmentFlags.has('--permission') ? '--permission' : '--experimental-permission';

/** The network trap preloaded into the process under test. */
export const NET_TRAP = fileURLToPath(new URL('./netTrap.cjs', import.meta.url));

/** Node options: permission model, read access to `readable` (and the trap) only, the trap preloaded. */
export function lockedDown(readable: readonly string[]): string[] {
  return [PERMISSION_FLAG, ...[...readable, NET_TRAP].map((p) => `--allow-fs-read=${p}`), '--require', NET_TRAP];
}

/** Lines of a locked-down process's stderr that report a refused operation. */
export function violations(stderr: string): string[] {
  return stderr.split('\n').filter((l) => /SANDBOX-VIOLATION|ERR_ACCESS_DENIED|Access to this API has been restricted/.test(l));
}
