/**
 * Plot panels: one webview panel per sheet (reused when another entry of the same sheet is plotted),
 * live updates while the sheet is edited, and saves that always go through the save dialog (written
 * to a temporary file beside the target, then renamed over it).
 */
import { randomBytes } from 'node:crypto';
import * as vscode from 'vscode';
import { panelHtml } from './panelHtml';
import { PlotSession, type PlotSessionHost, type SaveRequest } from './plotSession';

/** View type of the plot webview panels. */
export const PLOT_VIEW_TYPE = 'stubwright.plot';

/** Sends a request to the language server (the running client's `sendRequest`). */
export type SendRequest = (method: string, params: object) => Promise<unknown>;

interface Open {
  panel: vscode.WebviewPanel;
  session: PlotSession;
}

const baseName = (uri: vscode.Uri) => uri.path.slice(uri.path.lastIndexOf('/') + 1);

/** Writes `data` to `target` atomically: a temporary file in the same folder, then a rename. */
async function writeAtomically(target: vscode.Uri, data: Uint8Array): Promise<void> {
  const temp = target.with({ path: `${target.path}.${randomBytes(4).toString('hex')}.tmp` });
  try {
    await vscode.workspace.fs.writeFile(temp, data);
    await vscode.workspace.fs.rename(temp, target, { overwrite: true });
  } catch (e) {
    await vscode.workspace.fs.delete(temp).then(undefined, () => undefined);
    throw e;
  }
}

/** All open plot panels of the window. */
export class PlotPanels implements vscode.Disposable {
  private readonly open = new Map<string, Open>();
  private readonly subscriptions: vscode.Disposable[] = [];

  constructor(private readonly send: SendRequest) {
    this.subscriptions.push(
      vscode.workspace.onDidChangeTextDocument((e) => {
        if (e.contentChanges.length > 0) this.open.get(e.document.uri.toString())?.session.scheduleRefresh();
      }),
      vscode.workspace.onDidChangeConfiguration((e) => {
        if (e.affectsConfiguration('stubwright')) for (const o of this.open.values()) o.session.scheduleRefresh();
      }),
    );
  }

  /** Shows `name` of the sheet `uri`: in the sheet's panel if it has one, else in a new panel beside the editor. */
  async show(uri: vscode.Uri, name: string): Promise<void> {
    const key = uri.toString();
    const existing = this.open.get(key);
    if (existing) {
      existing.panel.title = this.title(uri, name);
      existing.panel.reveal(undefined, true);
      await existing.session.showEntry(name);
      return;
    }
    const panel = vscode.window.createWebviewPanel(PLOT_VIEW_TYPE, this.title(uri, name), { viewColumn: vscode.ViewColumn.Beside, preserveFocus: true }, {
      enableScripts: true,
      enableCommandUris: false,
      localResourceRoots: [],
    });
    const session = new PlotSession(this.host(panel, uri), key, baseName(uri), name);
    this.open.set(key, { panel, session });
    panel.onDidDispose(() => {
      session.dispose();
      if (this.open.get(key)?.panel === panel) this.open.delete(key);
    });
    panel.webview.onDidReceiveMessage((m: unknown) => void session.onMessage(m));
    // The page posts `ready` when it has loaded (and again whenever VS Code reloads a hidden panel), and the session answers with the plot.
    panel.webview.html = panelHtml({ cspSource: panel.webview.cspSource, nonce: randomBytes(18).toString('base64') });
  }

  dispose(): void {
    for (const o of this.open.values()) o.panel.dispose();
    this.open.clear();
    for (const s of this.subscriptions) s.dispose();
  }

  private title(uri: vscode.Uri, name: string): string {
    return `Plot: ${name} (${baseName(uri)})`;
  }

  private host(panel: vscode.WebviewPanel, sheet: vscode.Uri): PlotSessionHost {
    return {
      request: (method, params) => this.send(method, params),
      post: (message) => void panel.webview.postMessage(message),
      save: (request) => this.save(sheet, request),
      showError: (message) => void vscode.window.showErrorMessage(message),
      showInfo: (message) => void vscode.window.setStatusBarMessage(message, 5000),
      setTimeout: (fn, ms) => setTimeout(fn, ms),
      clearTimeout: (handle) => clearTimeout(handle as NodeJS.Timeout),
    };
  }

  /** Asks where to save (next to the sheet by default) and writes only if the user chose a file. */
  private async save(sheet: vscode.Uri, request: SaveRequest): Promise<string | undefined> {
    const folder = sheet.scheme === 'untitled' ? vscode.workspace.workspaceFolders?.[0]?.uri : vscode.Uri.joinPath(sheet, '..');
    const target = await vscode.window.showSaveDialog({
      ...(folder ? { defaultUri: vscode.Uri.joinPath(folder, request.fileName) } : {}),
      filters: request.filters,
      saveLabel: 'Save',
      title: `Save ${request.fileName}`,
    });
    if (!target) return undefined;
    const bytes = typeof request.data === 'string' ? new TextEncoder().encode(request.data) : request.data;
    await writeAtomically(target, bytes);
    return target.scheme === 'file' ? target.fsPath : target.toString();
  }
}
