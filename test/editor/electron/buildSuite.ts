/** Bundles an entry of the in-editor API suite (suite/*.ts) to one CommonJS file for an extension host. */
import { build } from 'esbuild';
import { fileURLToPath } from 'node:url';

/** Bundles `suite/<entry>.ts` to `outfile` (CommonJS, `vscode` external). */
export async function buildSuite(entry: 'index' | 'probe', outfile: string): Promise<string> {
  await build({
    entryPoints: [fileURLToPath(new URL(`./suite/${entry}.ts`, import.meta.url))],
    outfile,
    bundle: true,
    platform: 'node',
    target: 'node20',
    format: 'cjs',
    external: ['vscode'],
    logLevel: 'warning',
  });
  return outfile;
}
