// Bundles the language server into dist/server.js: one CommonJS file for Node 20 with every
// dependency inside (vscode-languageserver, mathjs, shared-core), runnable as
//   node server/dist/server.js --stdio
// dist/package.json marks the folder CommonJS (this package is "type": "module"), so the bundle
// also loads when an editor forks it as a module. Files are written under temporary names and
// renamed into place, so concurrent builds (parallel test files) never expose a half-written file.
import { build } from 'esbuild';
import { chmodSync, mkdirSync, renameSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));
const dist = join(here, 'dist');
const temp = (name) => join(dist, `.${name}.${process.pid}.tmp`);

mkdirSync(dist, { recursive: true });
writeFileSync(temp('package.json'), '{ "type": "commonjs" }\n');
renameSync(temp('package.json'), join(dist, 'package.json'));

await build({
  entryPoints: [join(here, 'src/node/main.ts')],
  bundle: true,
  platform: 'node',
  target: 'node20',
  format: 'cjs',
  banner: { js: '#!/usr/bin/env node' },
  outfile: temp('server.js'),
  logLevel: 'warning',
});
chmodSync(temp('server.js'), 0o755);
renameSync(temp('server.js'), join(dist, 'server.js'));
