/**
 * Editor settings (section `stubwright`) → the service's `ServiceSettings`.
 *
 * Pulled per document with `workspace/configuration` (scopeUri = the document), cached per
 * document (one request in flight at most), cleared on `workspace/didChangeConfiguration`.
 * Clients without `workspace/configuration` get the settings last pushed in
 * `didChangeConfiguration` (`settings.stubwright`), or the defaults.
 */
import { DEFAULT_SETTINGS, type ServiceSettings } from './core.js';

/** The `stubwright` settings section as an editor sends it (user input: anything may be wrong). */
export interface EditorSettings {
  /** Resonance margin, percent (0–100). */
  resonanceMargin?: unknown;
  /** Manufacturing grid for written-back lengths, millimetres (> 0, ≤ 10). */
  manufacturingGrid?: unknown;
  /** Display unit for lengths: `mm` or `mil`. */
  lengthUnit?: unknown;
  /** Show inlay hints. */
  inlayHints?: unknown;
}

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
const finite = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

/**
 * Converts the raw section into service settings. Missing keys take the defaults; a present but
 * invalid value takes the default too and is reported through `warn` (never thrown).
 */
export function toServiceSettings(raw: unknown, warn: (message: string) => void = () => {}): ServiceSettings {
  const out: ServiceSettings = { ...DEFAULT_SETTINGS };
  if (!isRecord(raw)) return out;
  const bad = (key: string, want: string) => warn(`stubwright.${key}: ${JSON.stringify(raw[key])} is not ${want}; using the default`);
  const { resonanceMargin: margin, manufacturingGrid: grid, lengthUnit: unit, inlayHints: hints } = raw as EditorSettings;
  if (margin !== undefined) {
    if (finite(margin) && margin >= 0 && margin <= 100) out.marginPct = margin;
    else bad('resonanceMargin', 'a percentage from 0 to 100');
  }
  if (grid !== undefined) {
    if (finite(grid) && grid > 0 && grid <= 10) out.gridM = grid * 1e-3;
    else bad('manufacturingGrid', 'a length in mm above 0 and at most 10');
  }
  if (unit !== undefined) {
    if (unit === 'mm' || unit === 'mil') out.lengthUnit = unit;
    else bad('lengthUnit', '"mm" or "mil"');
  }
  if (hints !== undefined) {
    if (typeof hints === 'boolean') out.inlayHints = hints;
    else bad('inlayHints', 'true or false');
  }
  return out;
}

/** Per-document settings cache. */
export interface SettingsStore {
  /** Settings for a document (cached; fetched from the editor on first use). */
  get(uri: string): Promise<ServiceSettings>;
  /** Forgets every document's settings; `pushed` is the `settings` of a didChangeConfiguration. */
  clear(pushed?: unknown): void;
  /** Forgets one document's settings (on close). */
  forget(uri: string): void;
  /** Incremented by every `clear`: part of pull-diagnostic result ids. */
  readonly generation: number;
}

/** What the store needs from the editor connection. */
export interface SettingsSource {
  /** True when the client answers `workspace/configuration`. */
  pull: boolean;
  /** Fetches the `stubwright` section for a document. */
  fetch(uri: string): Promise<unknown>;
  warn(message: string): void;
}

/** Creates the per-document settings cache. */
export function createSettingsStore(source: SettingsSource): SettingsStore {
  const cache = new Map<string, Promise<ServiceSettings>>();
  let pushed: unknown;
  let generation = 0;
  const load = async (uri: string): Promise<ServiceSettings> => {
    if (!source.pull) return toServiceSettings(pushed, source.warn);
    try {
      return toServiceSettings(await source.fetch(uri), source.warn);
    } catch (e) {
      source.warn(`workspace/configuration failed (${e instanceof Error ? e.message : String(e)}); using default settings`);
      return { ...DEFAULT_SETTINGS };
    }
  };
  return {
    get(uri) {
      let p = cache.get(uri);
      if (!p) cache.set(uri, (p = load(uri)));
      return p;
    },
    clear(settings) {
      cache.clear();
      generation++;
      if (isRecord(settings) && 'stubwright' in settings) pushed = settings.stubwright;
    },
    forget: (uri) => void cache.delete(uri),
    get generation() {
      return generation;
    },
  };
}
