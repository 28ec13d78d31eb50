// Builds bench/bench.ts with esbuild into bench/dist/ (gitignored) and runs it; arguments pass through
// (`--small` for CI-size runs). Builds the server bundle first when it is missing.
// The JSON figures go to stdout, progress to stderr.
import { build } from 'esbuild';
import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));
const root = join(here, '..');
if (!existsSync(join(root, 'server/dist/server.js'))) {
  execFileSync(process.execPath, [join(root, 'server/build.mjs')], { stdio: ['ignore', 'inherit', 'inherit'] });
}
const outfile = join(here, 'dist/bench.cjs');
await build({
  entryPoints: [join(here, 'bench.ts')],
  bundle: true,
  platform: 'node',
  target: 'node20',
  format: 'cjs',
  outfile,
  logLevel: 'warning',
});
execFileSync(process.execPath, [outfile, ...process.argv.slice(2)], {
  cwd: root,
  env: { ...process.env, STUBWRIGHT_ROOT: root },
  stdio: 'inherit',
});
