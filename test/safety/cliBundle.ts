/**
 * The built `stubwright` bundle for tests that run it as a child process. Built with the options of
 * `npm run build:cli` (test/cli.test.ts checks that they agree) into a temporary file, then renamed
 * into place, so test files building it in parallel never see a half-written bundle. Test-only.
 */
import { spawnSync } from 'node:child_process';
import { rename } from 'node:fs/promises';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';

export const ROOT = fileURLToPath(new URL('../..', import.meta.url));
export const CLI = join(ROOT, 'shared-core', 'dist', 'cli.js');

/** Builds shared-core/dist/cli.js. */
export async function buildCli(): Promise<void> {
  const temp = `${CLI}.${process.pid}.${Math.random().toString(36).slice(2)}.tmp`;
  await build({
    entryPoints: [join(ROOT, 'shared-core', 'src', 'cli', 'main.ts')],
    bundle: true,
    platform: 'node',
    target: 'node20',
    format: 'esm',
    banner: { js: '#!/usr/bin/env node' },
    outfile: temp,
    logLevel: 'warning',
  });
  await rename(temp, CLI);
}

/** One run of the bundle. */
export interface Run {
  code: number | null;
  stdout: string;
  stderr: string;
}

/** Runs the bundle in `cwd` with `args`, optionally with Node options before it. */
export function runCliProcess(cwd: string, args: readonly string[], nodeArgs: readonly string[] = []): Run {
  const r = spawnSync(process.execPath, [...nodeArgs, CLI, ...args], { cwd, encoding: 'utf8', timeout: 120_000, maxBuffer: 256 * 1024 * 1024 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** A stack trace line in output: never shown to a user. */
export const STACK_TRACE = /\n\s+at \S+ \(|\n\s+at node:/;
