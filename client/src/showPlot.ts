/**
 * The `stubwright.showPlot` command. From a code lens it arrives with `[uri, name]`; from the command
 * palette (or the editor title button) without arguments, it offers the active sheet's stubs and
 * lines, taken from the server's own "Plot" code lenses, the one at the cursor first.
 */
import * as vscode from 'vscode';
import { LANGUAGE_ID } from './names';
import type { PlotPanels, SendRequest } from './plotPanel';
import { SHOW_PLOT_COMMAND } from './protocol';

interface Target extends vscode.QuickPickItem {
  name: string;
  line: number;
}

/**
 * Plot targets of a sheet: the arguments of the server's plot code lenses, in line order. Asked of
 * the server directly, so the targets are there even with the lenses hidden (`stubwright.plotCodeLens`).
 */
async function plotTargets(send: SendRequest, doc: vscode.TextDocument): Promise<Target[]> {
  const answer = await send('textDocument/codeLens', { textDocument: { uri: doc.uri.toString() } });
  const lenses = Array.isArray(answer) ? (answer as LspCodeLens[]) : [];
  const seen = new Set<string>();
  return lenses
    .flatMap((lens) => {
      const args = lens.command?.command === SHOW_PLOT_COMMAND ? lens.command.arguments : undefined;
      const name = args?.[1];
      const line = lens.range?.start?.line;
      if (typeof name !== 'string' || typeof line !== 'number' || seen.has(name)) return [];
      seen.add(name);
      const text = line < doc.lineCount ? doc.lineAt(line).text.trim() : '';
      return [{ name, line, label: name, description: `line ${line + 1}`, detail: text.replace(/\s*#.*$/, '') }];
    })
    .sort((a, b) => a.line - b.line);
}

/** A code lens as the server sends it (only what is read here). */
interface LspCodeLens {
  range?: { start?: { line?: number } };
  command?: { command?: string; arguments?: unknown[] };
}

/** The command handler. */
export async function showPlot(panels: PlotPanels, send: SendRequest, uriArg?: unknown, nameArg?: unknown): Promise<void> {
  if (uriArg !== undefined && typeof nameArg === 'string') {
    const uri = uriArg instanceof vscode.Uri ? uriArg : vscode.Uri.parse(String(uriArg));
    await panels.show(uri, nameArg);
    return;
  }
  const editor = vscode.window.activeTextEditor;
  if (!editor || editor.document.languageId !== LANGUAGE_ID) {
    void vscode.window.showInformationMessage('Stubwright: open a .rfsheet sheet to plot one of its stubs or lines.');
    return;
  }
  const targets = await plotTargets(send, editor.document);
  if (targets.length === 0) {
    void vscode.window.showInformationMessage('Stubwright: this sheet has no evaluated stub or line to plot yet.');
    return;
  }
  const cursor = editor.selection.active.line;
  const atCursor = [...targets].reverse().find((t) => t.line <= cursor) ?? targets[0]!;
  const ordered = [atCursor, ...targets.filter((t) => t !== atCursor)];
  const picked = await vscode.window.showQuickPick(ordered, { title: 'Plot a stub or line', placeHolder: 'stub or line of this sheet', matchOnDetail: true });
  if (picked) await panels.show(editor.document.uri, picked.name);
}
