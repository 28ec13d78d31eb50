/**
 * Node entry point of the Stubwright language server. Transport from the command line, as
 * vscode-languageserver reads it: `--stdio`, `--node-ipc`, `--socket=PORT` or `--pipe=NAME`.
 *
 *   node server/dist/server.js --stdio
 */
import { createConnection, ProposedFeatures } from 'vscode-languageserver/node';
import { startServer } from '../startServer.js';

const TRANSPORTS = /^--(stdio|node-ipc|socket=\d+|pipe=.+)$/;

if (!process.argv.slice(2).some((a) => TRANSPORTS.test(a))) {
  process.stderr.write('Stubwright language server. Usage: node server.js --stdio | --node-ipc | --socket=PORT | --pipe=NAME\n');
  process.exit(2);
}
startServer(createConnection(ProposedFeatures.all));
