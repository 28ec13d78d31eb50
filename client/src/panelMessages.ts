/** Messages between the plot webview and the extension (both directions are plain JSON). */
import type { PlotResult, PlotView } from './protocol';

/** Extension → webview. */
export type ToWebview =
  /** A new plot (also after every edit of the sheet); `sheet` is the file's base name. */
  | { type: 'plot'; result: PlotResult; sheet: string }
  /** The last request failed: the message is shown, the last plot stays (dimmed). */
  | { type: 'error'; message: string };

/** Export formats offered by the panel's buttons. */
export type PanelExportFormat = 'svg' | 'png' | 'touchstone' | 'csv';

/** Webview → extension. */
export type FromWebview =
  /** The page loaded (first time or after being shown again): send the current plot. */
  | { type: 'ready' }
  /** The user switched the horizontal axis. */
  | { type: 'view'; view: PlotView }
  /** Save the plot's SVG text, or the server's Touchstone / CSV sweep. */
  | { type: 'export'; format: 'svg' | 'touchstone' | 'csv' }
  /** The picture as the user sees it, rendered to PNG in the webview. */
  | { type: 'exportPng'; dataUrl: string }
  /** Rendering the PNG failed in the webview. */
  | { type: 'exportFailed'; message: string };

const VIEWS = new Set<unknown>(['frequency', 'length']);
const EXPORTS = new Set<unknown>(['svg', 'touchstone', 'csv']);

/** Checks a message from the webview (its content is never trusted blindly). */
export function parseFromWebview(m: unknown): FromWebview | undefined {
  if (typeof m !== 'object' || m === null) return undefined;
  const r = m as Record<string, unknown>;
  switch (r.type) {
    case 'ready':
      return { type: 'ready' };
    case 'view':
      return VIEWS.has(r.view) ? { type: 'view', view: r.view as PlotView } : undefined;
    case 'export':
      return EXPORTS.has(r.format) ? { type: 'export', format: r.format as 'svg' | 'touchstone' | 'csv' } : undefined;
    case 'exportPng':
      return typeof r.dataUrl === 'string' && r.dataUrl.startsWith('data:image/png;base64,') ? { type: 'exportPng', dataUrl: r.dataUrl } : undefined;
    case 'exportFailed':
      return typeof r.message === 'string' ? { type: 'exportFailed', message: r.message } : undefined;
    default:
      return undefined;
  }
}
