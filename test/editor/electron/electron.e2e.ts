/**
 * The extension in VS Code desktop through @vscode/test-electron: the API checks in suite/ run in
 * the extension host of the build named by VSCODE_EXECUTABLE (`runTests({ vscodeExecutablePath })`,
 * so nothing is ever downloaded). Without VSCODE_EXECUTABLE the suite reports itself skipped;
 * REQUIRE_VSCODE_E2E=1 turns that into a failure. On Linux without a display, run under xvfb-run.
 */
import { copyFileSync, existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { runTests } from '@vscode/test-electron';
import { describe, expect, it } from 'vitest';
import { ROOT } from '../codeserver/paths.js';
import { buildSuite } from './buildSuite.js';
import { API_CHECK_COUNT } from './probeExtension.js';

const executable = process.env.VSCODE_EXECUTABLE;
const reason = !executable ? 'VSCODE_EXECUTABLE is not set' : existsSync(executable) ? '' : `VSCODE_EXECUTABLE=${executable} does not exist`;
const available = reason === '';
const OUT = join(ROOT, 'test/artifacts/electron');

if (process.env.REQUIRE_VSCODE_E2E === '1' && !available) {
  describe('VS Code desktop (required by REQUIRE_VSCODE_E2E=1)', () => {
    it('has a VS Code desktop build', () => {
      expect.fail(`REQUIRE_VSCODE_E2E=1 but ${reason}`);
    });
  });
}

describe.skipIf(!available)(`VS Code desktop via @vscode/test-electron${available ? '' : ` — skipped: ${reason}`}`, () => {
  it('passes the API checks: activation, diagnostics, hover, inlay hints, quick fix', async () => {
    for (const f of ['dist/extension.js', 'dist/server.js']) {
      expect(existsSync(join(ROOT, 'client', f)), `client/${f} (run "npm run build:extension")`).toBe(true);
    }
    rmSync(OUT, { recursive: true, force: true });
    const workspace = join(OUT, 'workspace');
    mkdirSync(workspace, { recursive: true });
    const sheet = join(workspace, 'warnings-tour.rfsheet');
    copyFileSync(join(ROOT, 'examples/warnings-tour.rfsheet'), sheet);
    mkdirSync(join(OUT, 'suite'));
    writeFileSync(join(OUT, 'suite/package.json'), '{ "type": "commonjs" }\n');
    await buildSuite('index', join(OUT, 'suite/index.js'));
    const code = await runTests({
      vscodeExecutablePath: executable!,
      extensionDevelopmentPath: join(ROOT, 'client'),
      extensionTestsPath: join(OUT, 'suite/index'),
      extensionTestsEnv: { STUBWRIGHT_SHEET: sheet },
      launchArgs: [workspace, '--disable-extensions', '--disable-workspace-trust', '--skip-welcome', '--skip-release-notes',
        `--user-data-dir=${join(OUT, 'user-data')}`, `--extensions-dir=${join(OUT, 'extensions')}`],
    });
    expect(code).toBe(0);
    const result = `${sheet}.result.json`;
    expect(existsSync(result), 'the suite ran and wrote its result').toBe(true);
    const outcome = JSON.parse(readFileSync(result, 'utf8')) as { ok: boolean; passed?: string[]; error?: string };
    expect(outcome.error).toBeUndefined();
    expect(outcome.passed).toHaveLength(API_CHECK_COUNT);
  }, 180_000);
});
