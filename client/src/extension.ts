/**
 * Stubwright's VS Code extension: starts the bundled language server (`server.js`, shipped next to
 * this file in `dist/`) for `rfsheet` documents, registers the plot command (panels in plotPanel.ts)
 * and stops the server on deactivation. All sheet logic lives in the server; this file only wires.
 */
import * as path from 'node:path';
import { commands, workspace, type ExtensionContext } from 'vscode';
import {
  LanguageClient,
  TransportKind,
  type LanguageClientOptions,
  type ServerOptions,
} from 'vscode-languageclient/node';
import { CLIENT_ID, CLIENT_NAME, CONFIGURATION_SECTION, LANGUAGE_ID, PLOT_CODE_LENS_SETTING, SERVER_MODULE } from './names';
import { PlotPanels } from './plotPanel';
import { SHOW_PLOT_COMMAND } from './protocol';
import { showPlot } from './showPlot';

let client: LanguageClient | undefined;

/** Starts the language client; VS Code calls this on `onLanguage:rfsheet`. */
export async function activate(context: ExtensionContext): Promise<void> {
  const module = context.asAbsolutePath(path.join('dist', SERVER_MODULE));
  const serverOptions: ServerOptions = { module, transport: TransportKind.ipc };
  const clientOptions: LanguageClientOptions = {
    documentSelector: [{ language: LANGUAGE_ID }],
    synchronize: { configurationSection: CONFIGURATION_SECTION },
    outputChannelName: CLIENT_NAME,
    middleware: {
      // The "Plot" lenses are the server's only code lenses; `stubwright.plotCodeLens` hides them.
      provideCodeLenses: (document, token, next) =>
        workspace.getConfiguration(CONFIGURATION_SECTION, document).get<boolean>(PLOT_CODE_LENS_SETTING, true) ? next(document, token) : [],
    },
  };
  const started = new LanguageClient(CLIENT_ID, CLIENT_NAME, serverOptions, clientOptions);
  client = started;
  const send = (method: string, params: object) => started.sendRequest(method, params);
  const panels = new PlotPanels(send);
  context.subscriptions.push(panels, commands.registerCommand(SHOW_PLOT_COMMAND, (uri?: unknown, name?: unknown) => showPlot(panels, send, uri, name)));
  await started.start();
}

/** Stops the language client (and with it the server process). */
export async function deactivate(): Promise<void> {
  const running = client;
  client = undefined;
  await running?.stop();
}
