/**
 * `createSheetService`: the facade the language server talks to. Holds one incremental evaluation
 * per open document (the cache belongs to the service instance, never to the module) and exposes
 * one function per editor feature, each implemented in its own file.
 */
import { evaluateSheet } from '../sheet/evaluate.js';
import { createSafeMath } from '../sheet/expr/index.js';
import type { SheetDiagnostic } from '../sheet/types.js';
import { getCodeActions } from './codeActions.js';
import { getCompletions } from './completion.js';
import { getHover } from './hover.js';
import { getInlayHints } from './inlayHints.js';
import { getExport, getPlot, getPlotTargets } from './plot.js';
import { getDefinition, getReferences, getRename, prepareRename } from './navigation.js';
import { getSymbols } from './symbols.js';
import { DEFAULT_SETTINGS, type EvaluatedDocument, type ServiceSettings } from './types.js';

export interface SheetService {
  /** Evaluates a document version incrementally against its previous version. */
  evaluate(uri: string, version: number, text: string, settings?: Partial<ServiceSettings>): EvaluatedDocument;
  /** The last evaluation of a document, if any. */
  get(uri: string): EvaluatedDocument | undefined;
  /** Forgets a closed document. */
  close(uri: string): void;
  getDiagnostics(doc: EvaluatedDocument): SheetDiagnostic[];
  getHover: typeof getHover;
  getInlayHints: typeof getInlayHints;
  getCodeActions: typeof getCodeActions;
  getCompletions: typeof getCompletions;
  getSymbols: typeof getSymbols;
  getDefinition: typeof getDefinition;
  getReferences: typeof getReferences;
  prepareRename: typeof prepareRename;
  getRename: typeof getRename;
  /** The SVG picture of a stub, line or sweep, with its markers. */
  getPlot: typeof getPlot;
  /** Every evaluated stub, line and sweep (for "Plot" code lenses). */
  getPlotTargets: typeof getPlotTargets;
  /** Touchstone or CSV text of a stub, line section or line. */
  getExport: typeof getExport;
}

interface Stored {
  version: number;
  marginPct: number;
  doc: EvaluatedDocument;
}

/** Creates a service instance; all state lives in the returned object. */
export function createSheetService(): SheetService {
  const docs = new Map<string, Stored>();
  const math = createSafeMath();
  return {
    evaluate(uri, version, text, partial = {}) {
      const settings = { ...DEFAULT_SETTINGS, ...partial };
      const stored = docs.get(uri);
      if (stored && stored.version === version && stored.marginPct === settings.marginPct && stored.doc.text === text) {
        // Display-only settings (grid, length unit, hints) need no re-evaluation, only a new view.
        const s = stored.doc.settings;
        if (s.gridM !== settings.gridM || s.lengthUnit !== settings.lengthUnit || s.inlayHints !== settings.inlayHints) {
          stored.doc = { ...stored.doc, settings };
        }
        return stored.doc;
      }
      const result = evaluateSheet(text, stored?.doc.result, { marginPct: settings.marginPct, math });
      const doc: EvaluatedDocument = { text, lines: text.split(/\r\n|\r|\n/), result, settings };
      docs.set(uri, { version, marginPct: settings.marginPct, doc });
      return doc;
    },
    get: (uri) => docs.get(uri)?.doc,
    close: (uri) => void docs.delete(uri),
    getDiagnostics: (doc) => doc.result.diagnostics,
    getHover, getInlayHints, getCodeActions, getCompletions, getSymbols, getDefinition, getReferences, prepareRename, getRename,
    getPlot, getPlotTargets, getExport,
  };
}
