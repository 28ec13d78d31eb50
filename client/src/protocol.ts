/**
 * The plot requests the extension sends to the Stubwright language server, and the command its code
 * lenses run. The client depends on nothing of ours but the protocol, so these shapes are written
 * out here; test/panel/protocol.test.ts checks them against the server's.
 */

/** Command run by the "Plot" code lenses and the command palette; arguments `[uri, name]`. */
export const SHOW_PLOT_COMMAND = 'stubwright.showPlot';
/** Custom request: one plot of a stub or line. */
export const PLOT_REQUEST = 'stubwright/plot';
/** Custom request: a Touchstone or CSV sweep of a stub or line. */
export const EXPORT_REQUEST = 'stubwright/export';

/** Horizontal axis: frequency (Hz) or physical length at the fixed frequency (m). */
export type PlotView = 'frequency' | 'length';

/** Parameters of `stubwright/plot`. */
export interface PlotParams {
  uri: string;
  name: string;
  view?: PlotView;
  fromHz?: number;
  toHz?: number;
  points?: number;
}

/** A resonance or the operating point; x in Hz (frequency view) or metres (length view). */
export interface PlotMarker {
  kind: 'resonance' | 'operating';
  x: number;
  label: string;
  resonanceType?: 'series' | 'parallel';
}

/** Answer of `stubwright/plot`. */
export interface PlotResult {
  name: string;
  entryKind: 'stub' | 'line';
  view: PlotView;
  title: string;
  /** Self-contained SVG; colours through `var(--vscode-…, fallback)`. */
  svg: string;
  markers: PlotMarker[];
  band?: [number, number];
}

/** Export formats the server writes. */
export type ExportFormat = 'touchstone' | 'csv';

/** Parameters of `stubwright/export`. */
export interface ExportParams {
  uri: string;
  name: string;
  format: ExportFormat;
  fromHz?: number;
  toHz?: number;
  points?: number;
}

/** Answer of `stubwright/export`: the file's text and a suggested file name (e.g. `trap.s1p`). */
export interface ExportResult {
  text: string;
  fileName: string;
}

/** What a request answers when the sheet has no such entry or it cannot be plotted. */
export interface PlotError {
  error: string;
}

/** True when a server answer is an error result. */
export const isPlotError = (r: unknown): r is PlotError =>
  typeof r === 'object' && r !== null && typeof (r as { error?: unknown }).error === 'string';
