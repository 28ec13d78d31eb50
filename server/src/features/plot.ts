/**
 * Plots and exports: a "Plot" code lens above every stub and line (command `stubwright.showPlot`
 * with `[uri, name]`), and the custom requests `stubwright/plot` and `stubwright/export`, each
 * mapped straight onto the service. A name the sheet does not have comes back as a result
 * `{ error }` the panel shows; malformed parameters are `InvalidParams` and a document the server
 * does not have open is `RequestFailed`, as protocol errors.
 */
import { ErrorCodes, LSPErrorCodes, ResponseError, type CodeLens } from 'vscode-languageserver';
import type { ServerContext } from '../context.js';
import type { Evaluated } from '../documents.js';
import type { PlotOptions, PlotView } from '../core.js';

/** Command the lenses run; the VS Code extension registers it. */
export const SHOW_PLOT_COMMAND = 'stubwright.showPlot';
/** Custom request: one plot (SVG plus its markers) of a stub or line. */
export const PLOT_REQUEST = 'stubwright/plot';
/** Custom request: a Touchstone or CSV sweep of a stub or line. */
export const EXPORT_REQUEST = 'stubwright/export';

/** Parameters of `stubwright/plot`. */
export interface PlotParams {
  uri: string;
  name: string;
  view?: PlotView;
  fromHz?: number;
  toHz?: number;
  points?: number;
}

/** Parameters of `stubwright/export`. */
export interface ExportParams {
  uri: string;
  name: string;
  format: 'touchstone' | 'csv';
  fromHz?: number;
  toHz?: number;
  points?: number;
}

/** Lens title per entry kind. */
export const LENS_TITLE = { stub: 'Plot reactance', line: 'Plot' } as const;

const invalid = (message: string) => new ResponseError<never>(ErrorCodes.InvalidParams, message);
const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/** The common part of both requests: uri, name and the optional sweep, checked. */
function sweepParams(raw: unknown, method: string): { uri: string; name: string; fromHz?: number; toHz?: number; points?: number } {
  if (!isRecord(raw)) throw invalid(`${method}: the parameters must be an object { uri, name, … }`);
  const { uri, name } = raw;
  if (typeof uri !== 'string' || uri === '') throw invalid(`${method}: "uri" must be the document's URI`);
  if (typeof name !== 'string' || name === '') throw invalid(`${method}: "name" must be the name of a stub or line`);
  const out: { uri: string; name: string; fromHz?: number; toHz?: number; points?: number } = { uri, name };
  for (const key of ['fromHz', 'toHz', 'points'] as const) {
    const v = raw[key];
    if (v === undefined || v === null) continue;
    if (typeof v !== 'number' || !Number.isFinite(v) || v <= 0) throw invalid(`${method}: "${key}" must be a positive number`);
    if (key === 'points' && !Number.isInteger(v)) throw invalid(`${method}: "points" must be a whole number`);
    out[key] = v;
  }
  return out;
}

/** Checks `stubwright/plot` parameters; throws `InvalidParams`. */
export function toPlotParams(raw: unknown): PlotParams {
  const base = sweepParams(raw, PLOT_REQUEST);
  const view = (raw as Record<string, unknown>).view;
  if (view !== undefined && view !== null && view !== 'frequency' && view !== 'length') {
    throw invalid(`${PLOT_REQUEST}: "view" must be "frequency" or "length"`);
  }
  return view === 'frequency' || view === 'length' ? { ...base, view } : base;
}

/** Checks `stubwright/export` parameters; throws `InvalidParams`. */
export function toExportParams(raw: unknown): ExportParams {
  const base = sweepParams(raw, EXPORT_REQUEST);
  const format = (raw as Record<string, unknown>).format;
  if (format !== 'touchstone' && format !== 'csv') throw invalid(`${EXPORT_REQUEST}: "format" must be "touchstone" or "csv"`);
  return { ...base, format };
}

const sweep = (p: { fromHz?: number; toHz?: number; points?: number }) => ({
  ...(p.fromHz !== undefined ? { fromHz: p.fromHz } : {}),
  ...(p.toHz !== undefined ? { toHz: p.toHz } : {}),
  ...(p.points !== undefined ? { points: p.points } : {}),
});

/** The file name of a document URI (for the export's header comment), if it has one. */
export function sheetName(uri: string): string | undefined {
  const last = uri.replace(/[?#].*$/, '').split('/').pop() ?? '';
  try {
    return decodeURIComponent(last) || undefined;
  } catch {
    return last || undefined;
  }
}

/** Installs the code-lens handler and the two custom requests. */
export function registerPlot(ctx: ServerContext): void {
  const opened = async (uri: string, method: string): Promise<Evaluated> => {
    const ev = await ctx.documents.evaluated(uri);
    if (!ev) throw new ResponseError<never>(LSPErrorCodes.RequestFailed, `${method}: ${uri} is not open in the Stubwright server (open the sheet first)`);
    return ev;
  };

  ctx.connection.onCodeLens((params, token) =>
    ctx.runSafe(token, [], async (): Promise<CodeLens[]> => {
      const uri = params.textDocument.uri;
      const ev = await ctx.documents.evaluated(uri);
      if (!ev) return [];
      return ctx.service.getPlotTargets(ev.doc).map((t) => ({
        range: t.range,
        command: { title: LENS_TITLE[t.kind], command: SHOW_PLOT_COMMAND, arguments: [uri, t.name] },
      }));
    }, 'textDocument/codeLens'),
  );

  ctx.connection.onRequest(PLOT_REQUEST, (raw: unknown, token) =>
    ctx.runSafe(token, { error: 'the plot could not be made (see the Stubwright server log)' }, async () => {
      const p = toPlotParams(raw);
      const ev = await opened(p.uri, PLOT_REQUEST);
      const options: PlotOptions = { ...sweep(p), view: p.view ?? 'frequency', lengthUnit: ev.doc.settings.lengthUnit };
      return ctx.service.getPlot(ev.doc, p.name, options);
    }, PLOT_REQUEST),
  );

  ctx.connection.onRequest(EXPORT_REQUEST, (raw: unknown, token) =>
    ctx.runSafe(token, { error: 'the export could not be made (see the Stubwright server log)' }, async () => {
      const p = toExportParams(raw);
      const ev = await opened(p.uri, EXPORT_REQUEST);
      const source = sheetName(p.uri);
      return ctx.service.getExport(ev.doc, p.name, p.format, { ...sweep(p), ...(source ? { source } : {}) });
    }, EXPORT_REQUEST),
  );
}
