/**
 * Packages the API checks (suite/probe.ts) as a tiny extension .vsix with vsce, so the code-server
 * end-to-end test can run them in VS Code 1.100's extension host from the command palette.
 */
import { execFileSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { ROOT } from '../codeserver/paths.js';
import { buildSuite } from './buildSuite.js';

/** Number of checks in suite/apiChecks.ts (a run that passes fewer did not reach them all). */
export const API_CHECK_COUNT = 6;

/** Id and palette title of the probe's command. */
export const PROBE_COMMAND = { id: 'stubwrightProbe.runApiChecks', title: 'Stubwright Probe: Run API Checks' };

/** Builds and packages the probe into `dir`; returns the .vsix path. */
export async function packageProbe(dir: string): Promise<string> {
  mkdirSync(join(dir, 'dist'), { recursive: true });
  const manifest = {
    name: 'stubwright-probe',
    displayName: 'Stubwright API probe (tests only)',
    description: 'Runs the Stubwright API checks inside the extension host.',
    version: '0.0.1',
    publisher: 'stubwright',
    license: 'MIT',
    engines: { vscode: '^1.91.0' },
    main: './dist/probe.js',
    activationEvents: [`onCommand:${PROBE_COMMAND.id}`],
    contributes: { commands: [{ command: PROBE_COMMAND.id, title: PROBE_COMMAND.title }] },
  };
  writeFileSync(join(dir, 'package.json'), JSON.stringify(manifest, null, 2));
  writeFileSync(join(dir, 'README.md'), '# Stubwright API probe\n\nTest-only extension; see test/editor/electron/suite/probe.ts.\n');
  await buildSuite('probe', join(dir, 'dist/probe.js'));
  const vsix = join(dir, 'stubwright-probe.vsix');
  execFileSync(join(ROOT, 'node_modules/.bin/vsce'),
    ['package', '--no-dependencies', '--allow-missing-repository', '--skip-license', '--out', vsix],
    { cwd: dir, stdio: ['ignore', 'ignore', 'pipe'] });
  return vsix;
}
