/**
 * Open documents and their evaluations: the editor's text (incremental sync through
 * `TextDocuments`) evaluated by the service once per version and settings.
 */
import { TextDocuments } from 'vscode-languageserver';
import { TextDocument } from 'vscode-languageserver-textdocument';
import type { EvaluatedDocument, SheetService } from './core.js';
import type { SettingsStore } from './settings.js';

/** An open document's text and its evaluation for the same version. */
export interface Evaluated {
  text: TextDocument;
  doc: EvaluatedDocument;
}

/** Open documents plus evaluation on demand. */
export interface SheetDocuments {
  readonly open: TextDocuments<TextDocument>;
  /** The current version evaluated with the document's settings; undefined when not open. */
  evaluated(uri: string): Promise<Evaluated | undefined>;
}

/** Creates the document set; call `open.listen(connection)` to start syncing. */
export function createSheetDocuments(service: SheetService, settings: SettingsStore): SheetDocuments {
  const open = new TextDocuments(TextDocument);
  open.onDidClose((e) => {
    service.close(e.document.uri);
    settings.forget(e.document.uri);
  });
  return {
    open,
    async evaluated(uri) {
      if (!open.get(uri)) return undefined;
      const s = await settings.get(uri);
      const text = open.get(uri); // re-read: the document may have changed or closed meanwhile
      if (!text) return undefined;
      return { text, doc: service.evaluate(uri, text.version, text.getText(), s) };
    },
  };
}
