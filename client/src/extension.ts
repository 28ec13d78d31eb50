/**
 * Stubwright's VS Code extension: starts the bundled language server (`server.js`, shipped next to
 * this file in `dist/`) for `rfsheet` documents and stops it on deactivation. All sheet logic lives
 * in the server; this file only wires the client.
 */
import * as path from 'node:path';
import type { ExtensionContext } from 'vscode';
import {
  LanguageClient,
  TransportKind,
  type LanguageClientOptions,
  type ServerOptions,
} from 'vscode-languageclient/node';
import { CLIENT_ID, CLIENT_NAME, CONFIGURATION_SECTION, LANGUAGE_ID, SERVER_MODULE } from './names';

let client: LanguageClient | undefined;

/** Starts the language client; VS Code calls this on `onLanguage:rfsheet`. */
export async function activate(context: ExtensionContext): Promise<void> {
  const module = context.asAbsolutePath(path.join('dist', SERVER_MODULE));
  const serverOptions: ServerOptions = { module, transport: TransportKind.ipc };
  const clientOptions: LanguageClientOptions = {
    documentSelector: [{ language: LANGUAGE_ID }],
    synchronize: { configurationSection: CONFIGURATION_SECTION },
    outputChannelName: CLIENT_NAME,
  };
  client = new LanguageClient(CLIENT_ID, CLIENT_NAME, serverOptions, clientOptions);
  await client.start();
}

/** Stops the language client (and with it the server process). */
export async function deactivate(): Promise<void> {
  const running = client;
  client = undefined;
  await running?.stop();
}
