/**
 * What one plot panel does, without VS Code: which entry of which sheet it shows and on which axis,
 * asking the server again (debounced) when the sheet changes, dropping answers that a newer request
 * has overtaken, and turning the webview's buttons into saves. Everything outside (the language
 * client, the webview, the save dialog, timers) comes in through `PlotSessionHost`, so
 * test/panel/plotSession.test.ts drives it with fakes.
 */
import { parseFromWebview, type ToWebview } from './panelMessages';
import {
  EXPORT_REQUEST,
  PLOT_REQUEST,
  isPlotError,
  type ExportParams,
  type ExportResult,
  type PlotError,
  type PlotParams,
  type PlotResult,
  type PlotView,
} from './protocol';

/** A file the user may save; the host asks where (nothing is written without that). */
export interface SaveRequest {
  /** Suggested file name, e.g. `trap-frequency.svg`. */
  fileName: string;
  data: string | Uint8Array;
  /** For the dialog's filter, e.g. `{ 'SVG image': ['svg'] }`. */
  filters: Record<string, string[]>;
}

/** Everything the session needs from outside. */
export interface PlotSessionHost {
  /** A request to the language server; rejects on a protocol error. */
  request(method: string, params: object): Promise<unknown>;
  /** A message to the webview. */
  post(message: ToWebview): void;
  /** Asks the user for a file and writes it; resolves to the path written, or undefined when cancelled. */
  save(request: SaveRequest): Promise<string | undefined>;
  /** Shows an error outside the webview (notifications). */
  showError(message: string): void;
  /** Shows a short confirmation. */
  showInfo(message: string): void;
  setTimeout(fn: () => void, ms: number): unknown;
  clearTimeout(handle: unknown): void;
}

/** Debounce of live updates after an edit, ms. */
export const REFRESH_DEBOUNCE_MS = 250;

const message = (e: unknown) => (e instanceof Error ? e.message : String(e));

/** Decodes a `data:image/png;base64,…` URL. */
export function pngBytes(dataUrl: string): Uint8Array {
  const b64 = dataUrl.slice(dataUrl.indexOf(',') + 1);
  return Uint8Array.from(atob(b64), (c) => c.charCodeAt(0));
}

/** One panel's state and behaviour. */
export class PlotSession {
  private view: PlotView = 'frequency';
  private last: PlotResult | undefined;
  private serial = 0;
  private timer: unknown;
  private disposed = false;

  constructor(
    private readonly host: PlotSessionHost,
    /** The sheet's URI as the server knows it. */
    readonly uri: string,
    /** The sheet's base name, shown in the panel. */
    private readonly sheet: string,
    private name: string,
  ) {}

  /** The entry shown. */
  get entry(): string {
    return this.name;
  }

  /** The axis shown. */
  get currentView(): PlotView {
    return this.view;
  }

  /** Shows another entry of the same sheet (from the frequency view). */
  async showEntry(name: string): Promise<void> {
    this.name = name;
    this.view = 'frequency';
    await this.refresh();
  }

  /** Asks the server now; an answer overtaken by a newer request is dropped. */
  async refresh(): Promise<void> {
    this.cancelScheduled();
    const serial = ++this.serial;
    const params: PlotParams = { uri: this.uri, name: this.name, view: this.view };
    let answer: unknown;
    try {
      answer = await this.host.request(PLOT_REQUEST, params);
    } catch (e) {
      answer = { error: message(e) } satisfies PlotError;
    }
    if (this.disposed || serial !== this.serial) return;
    if (isPlotError(answer)) {
      this.host.post({ type: 'error', message: answer.error });
    } else if (isPlotResult(answer)) {
      this.last = answer;
      this.host.post({ type: 'plot', result: answer, sheet: this.sheet });
    } else {
      this.host.post({ type: 'error', message: 'The language server gave no plot (is it a current Stubwright server?).' });
    }
  }

  /** Refreshes after the sheet stopped changing for REFRESH_DEBOUNCE_MS. */
  scheduleRefresh(): void {
    if (this.disposed) return;
    this.cancelScheduled();
    this.timer = this.host.setTimeout(() => {
      this.timer = undefined;
      void this.refresh();
    }, REFRESH_DEBOUNCE_MS);
  }

  /** Handles a message posted by the webview. */
  async onMessage(raw: unknown): Promise<void> {
    const m = parseFromWebview(raw);
    if (!m || this.disposed) return;
    switch (m.type) {
      case 'ready':
        if (this.last && this.last.name === this.name && this.last.view === this.view) this.host.post({ type: 'plot', result: this.last, sheet: this.sheet });
        await this.refresh();
        return;
      case 'view':
        if (m.view === this.view) return;
        this.view = m.view;
        await this.refresh();
        return;
      case 'export':
        await (m.format === 'svg' ? this.saveSvg() : this.saveExport(m.format));
        return;
      case 'exportPng':
        await this.saveFile({ fileName: `${this.baseName()}.png`, data: pngBytes(m.dataUrl), filters: { 'PNG image': ['png'] } });
        return;
      case 'exportFailed':
        this.host.showError(`Stubwright: the PNG could not be made: ${m.message}`);
        return;
    }
  }

  /** Stops timers and ignores answers still on their way. */
  dispose(): void {
    this.disposed = true;
    this.cancelScheduled();
  }

  /** File name stem of the picture on screen, e.g. `trap-frequency`. */
  private baseName(): string {
    return this.last ? `${this.last.name}-${this.last.view}` : `${this.name}-${this.view}`;
  }

  private cancelScheduled(): void {
    if (this.timer !== undefined) this.host.clearTimeout(this.timer);
    this.timer = undefined;
  }

  private async saveSvg(): Promise<void> {
    if (!this.last) return this.host.showError('Stubwright: there is no plot to save yet.');
    await this.saveFile({ fileName: `${this.baseName()}.svg`, data: this.last.svg, filters: { 'SVG image': ['svg'] } });
  }

  private async saveExport(format: 'touchstone' | 'csv'): Promise<void> {
    const params: ExportParams = { uri: this.uri, name: this.name, format };
    let answer: unknown;
    try {
      answer = await this.host.request(EXPORT_REQUEST, params);
    } catch (e) {
      return this.host.showError(`Stubwright: export failed: ${message(e)}`);
    }
    if (isPlotError(answer)) return this.host.showError(`Stubwright: ${answer.error}`);
    if (!isExportResult(answer)) return this.host.showError('Stubwright: the language server gave no export.');
    const fileName = safeFileName(answer.fileName, `${this.name}.${format === 'csv' ? 'csv' : 's1p'}`);
    const ext = fileName.includes('.') ? fileName.slice(fileName.lastIndexOf('.') + 1) : format === 'csv' ? 'csv' : 's1p';
    const filters: Record<string, string[]> = { [format === 'csv' ? 'CSV' : 'Touchstone']: [ext] };
    await this.saveFile({ fileName, data: answer.text, filters });
  }

  private async saveFile(request: SaveRequest): Promise<void> {
    try {
      const where = await this.host.save(request);
      if (where) this.host.showInfo(`Stubwright: saved ${where}`);
    } catch (e) {
      this.host.showError(`Stubwright: could not save ${request.fileName}: ${message(e)}`);
    }
  }
}

/** A suggested file name reduced to one harmless path segment (`fallback` when nothing is left). */
export function safeFileName(name: string, fallback: string): string {
  const base = name.split(/[\\/]/).pop() ?? '';
  const clean = base.replace(/[^\w.\-+ ]/g, '_').replace(/^\.+/, '');
  return clean.length > 0 ? clean : fallback;
}

function isPlotResult(r: unknown): r is PlotResult {
  if (typeof r !== 'object' || r === null) return false;
  const p = r as Partial<PlotResult>;
  return typeof p.svg === 'string' && typeof p.name === 'string' && (p.view === 'frequency' || p.view === 'length') && Array.isArray(p.markers);
}

function isExportResult(r: unknown): r is ExportResult {
  if (typeof r !== 'object' || r === null) return false;
  const e = r as Partial<ExportResult>;
  return typeof e.text === 'string' && typeof e.fileName === 'string' && e.fileName.length > 0;
}
