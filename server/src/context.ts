/** What every feature adapter receives: the connection, the documents, the service, what the client supports. */
import type { Connection } from 'vscode-languageserver';
import type { SheetService } from './core.js';
import type { ClientSupport } from './capabilities.js';
import type { SheetDocuments } from './documents.js';
import type { RunSafe } from './runSafe.js';
import type { SettingsStore } from './settings.js';

/** Shared state of one server instance (nothing lives at module level). */
export interface ServerContext {
  connection: Connection;
  documents: SheetDocuments;
  service: SheetService;
  settings: SettingsStore;
  runSafe: RunSafe;
  /** What the client supports (known from `initialize` on). */
  readonly client: ClientSupport;
  /** Injected timers (push-diagnostic debounce). */
  timers: Timers;
  /** Push-diagnostic debounce, ms. */
  pushDebounceMs: number;
}

/** The two timer functions the server uses, injectable for tests. */
export interface Timers {
  setTimeout(fn: () => void, ms: number): unknown;
  clearTimeout(handle: unknown): void;
}
