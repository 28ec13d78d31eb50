/**
 * Entry point @vscode/test-electron loads in the extension host (`extensionTestsPath`). The sheet to
 * check comes from STUBWRIGHT_SHEET (set by electron.e2e.ts). A thrown error fails the run; the
 * outcome is also written to `<sheet>.result.json` so the runner can tell a run that never reached
 * the checks from one that passed them.
 */
import { writeFileSync } from 'node:fs';
import * as vscode from 'vscode';
import { runApiChecks } from './apiChecks.js';

/** Called by the test host; resolves when every check passed. */
export async function run(): Promise<void> {
  const sheet = process.env.STUBWRIGHT_SHEET;
  if (!sheet) throw new Error('STUBWRIGHT_SHEET is not set');
  try {
    const passed = await runApiChecks(vscode.Uri.file(sheet));
    writeFileSync(`${sheet}.result.json`, JSON.stringify({ ok: true, passed }));
    console.log(`stubwright API checks: ${passed.length} passed`);
  } catch (e) {
    writeFileSync(`${sheet}.result.json`, JSON.stringify({ ok: false, error: e instanceof Error ? e.stack ?? e.message : String(e) }));
    throw e;
  }
}
