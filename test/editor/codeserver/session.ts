/**
 * One end-to-end session: fresh copies of the example sheet in a scratch workspace, code-server with
 * the packaged extension (and the test-only API probe) installed, and chromium showing the workbench
 * with the sheet open.
 */
import { copyFileSync, existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import { packageProbe } from '../electron/probeExtension.js';
import { extensionHostLog, installCodeServer, startCodeServer } from './codeServer.js';
import { ARTIFACTS, ROOT, vsixPath } from './paths.js';
import { openWorkbench, quickOpen } from './workbench.js';

const PROBE_ID = 'stubwright.stubwright-probe';

/** What the tests get. */
export interface Session {
  page: Page;
  extensionId: string;
  /** The sheet on disk in the scratch workspace (the quick fix edits it there, never in examples/). */
  sheetPath: string;
  /** The scratch workspace folder (the other sheets are copied there too). */
  workspace: string;
  /** A second copy, in `api/`, for the API checks the probe extension runs. */
  apiSheetPath: string;
  /** The sheet's text as opened. */
  original: string;
  timings: Record<string, number>;
  exthostLog(): string;
  /** Saves a screenshot in the artifacts folder and returns its path. */
  screenshot(name: string): Promise<string>;
  close(): Promise<void>;
}

/** Starts everything; `file` is a sheet in examples/ (opened), `others` more sheets copied beside it. */
export async function startSession(file: string, others: string[] = []): Promise<Session> {
  const timings: Record<string, number> = {};
  const step = async <T>(name: string, fn: () => Promise<T> | T): Promise<T> => {
    const t = Date.now();
    try { return await fn(); } finally { timings[name] = Date.now() - t; }
  };
  const version: string = JSON.parse(readFileSync(join(ROOT, 'client/package.json'), 'utf8')).version;
  const vsix = vsixPath(version);
  if (!existsSync(vsix)) throw new Error(`${vsix} is missing: run "npm run package" first (npm run test:editor does)`);

  rmSync(ARTIFACTS, { recursive: true, force: true });
  const runDir = join(ARTIFACTS, 'run');
  const workspace = join(runDir, 'workspace');
  mkdirSync(workspace, { recursive: true });
  const sheetPath = join(workspace, file);
  copyFileSync(join(ROOT, 'examples', file), sheetPath);
  for (const other of others) copyFileSync(join(ROOT, 'examples', other), join(workspace, other));

  const apiSheetPath = join(workspace, 'api', `api-checks-${file}`);
  mkdirSync(join(workspace, 'api'));
  copyFileSync(join(ROOT, 'examples', file), apiSheetPath);
  const probe = await step('probePackage', () => packageProbe(join(runDir, 'probe')));

  const entry = await step('codeServerInstall', () => installCodeServer());
  const server = await step('codeServerStart', () => startCodeServer(entry, runDir, [vsix, probe], workspace));
  const extensionId = server.extensionIds.find((id) => id !== PROBE_ID) ?? '';
  let context: BrowserContext | undefined;
  try {
    const opened = await step('workbenchLoad', () => openWorkbench(server.url, workspace, join(runDir, 'chromium-profile')));
    context = opened.context;
    const page = opened.page;
    await step('fileOpen', () => quickOpen(page, file));
    return {
      page,
      extensionId,
      sheetPath,
      workspace,
      apiSheetPath,
      original: readFileSync(sheetPath, 'utf8'),
      timings,
      exthostLog: () => extensionHostLog(server.userDataDir),
      async screenshot(name) {
        const path = join(ARTIFACTS, name);
        await page.screenshot({ path });
        return path;
      },
      async close() {
        writeFileSync(join(ARTIFACTS, 'timings.json'), JSON.stringify(timings, null, 2));
        await context?.close().catch(() => {});
        await server.stop();
        rmSync(join(runDir, 'chromium-profile'), { recursive: true, force: true });
        rmSync(join(runDir, 'extensions'), { recursive: true, force: true });
      },
    };
  } catch (e) {
    await context?.close().catch(() => {});
    await server.stop();
    throw e;
  }
}
