// Builds the extension into dist/: bundles src/extension.ts (CommonJS, `vscode` external) and copies
// the language server bundle (server/dist/server.js, built by `npm run build -w server`) beside it.
// Usage: node build.mjs [--no-server]   (--no-server: the client alone, for work before the server exists)
import { build } from 'esbuild';
import { copyFileSync, existsSync, mkdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));
const dist = join(here, 'dist');
mkdirSync(dist, { recursive: true });

await build({
  entryPoints: [join(here, 'src/extension.ts')],
  outfile: join(dist, 'extension.js'),
  bundle: true,
  platform: 'node',
  target: 'node20',
  format: 'cjs',
  external: ['vscode'],
  minify: true,
  sourcemap: false,
  logLevel: 'warning',
});

if (!process.argv.includes('--no-server')) {
  const server = join(here, '../server/dist/server.js');
  if (!existsSync(server)) {
    console.error(`client build: ${server} is missing; run "npm run build -w server" first`);
    process.exit(1);
  }
  copyFileSync(server, join(dist, 'server.js'));
}
