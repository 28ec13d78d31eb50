/**
 * A throwaway extension for the code-server end-to-end test: its command runs the same API checks
 * inside code-server's extension host and writes `{ ok, passed, error }` next to the checked sheet
 * (`<sheet>.result.json`), which the test reads from disk.
 */
import { writeFileSync } from 'node:fs';
import * as vscode from 'vscode';
import { runApiChecks } from './apiChecks.js';

/** Registers `stubwrightProbe.runApiChecks` (argument-free: it checks `api/*.rfsheet` in the workspace). */
export function activate(context: vscode.ExtensionContext): void {
  context.subscriptions.push(vscode.commands.registerCommand('stubwrightProbe.runApiChecks', async () => {
    const [sheet] = await vscode.workspace.findFiles('api/*.rfsheet', null, 1);
    if (!sheet) throw new Error('no api/*.rfsheet in the workspace');
    const out = `${sheet.fsPath}.result.json`;
    try {
      const passed = await runApiChecks(sheet);
      writeFileSync(out, JSON.stringify({ ok: true, passed }));
    } catch (e) {
      writeFileSync(out, JSON.stringify({ ok: false, error: e instanceof Error ? e.stack ?? e.message : String(e) }));
    }
  }));
}
