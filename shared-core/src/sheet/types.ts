/**
 * Public types of the sheet language service: text in, results / diagnostics / symbols out.
 * Positions are 0-based lines and 0-based UTF-16 columns (as LSP uses); the CLI's JSON adds 1.
 */

import type { EntryModel } from './eval/models.js';
import type { SafeMath } from './expr/index.js';

export interface Position {
  line: number;
  character: number;
}

export interface Range {
  start: Position;
  end: Position;
}

export type Severity = 'error' | 'warning' | 'info';

/** Stable diagnostic codes (pinned: other tools read them; add, never rename). */
export type DiagnosticCode =
  | 'syntax'
  | 'unknown-name'
  | 'duplicate-name'
  | 'unit'
  | 'missing'
  | 'conflict'
  | 'range'
  | 'model-validity'
  | 'near-resonance'
  | 'resonance-in-band'
  | 'detuned'
  | 'cycle'
  | 'limit'
  | 'power';

export interface RelatedInformation {
  range: Range;
  message: string;
}

export interface SheetDiagnostic {
  range: Range;
  severity: Severity;
  code: DiagnosticCode;
  /** Says what is wrong and how to fix it. */
  message: string;
  related?: RelatedInformation[];
  /** Machine-readable fix data for code actions, e.g. a stub length that clears the warning (m). */
  data?: { lengthM?: number };
}

export type EntryKind = 'let' | 'substrate' | 'line' | 'stub' | 'sweep';

/** A JSON-safe result value: SI numbers, strings for enumerations, flags, null where not defined. */
export type ResultValue = number | string | boolean | null;

/** Pinned result keys per entry kind (see README "JSON output"); add keys, never rename. */
export type EntryResults = Record<string, ResultValue>;

export interface SheetEntry {
  /** 0-based line of the declaration. */
  line: number;
  kind: EntryKind;
  name: string;
  nameRange: Range;
  /** Range of the whole declaration (without a trailing comment). */
  range: Range;
  /** SI results; empty when the entry could not be evaluated. */
  results: EntryResults;
  /** Human-readable detail lines for hovers (model used, validity, resonances…). */
  details: string[];
  /** Values that were synthesized (e.g. "width", "length"), with the range of the key they answer. */
  synthesized: { key: string; valueSI: number; range: Range }[];
}

export type SymbolKind = EntryKind;

export interface SheetSymbol {
  name: string;
  kind: SymbolKind;
  declaration: Range;
  references: Range[];
}

export interface SheetOptions {
  /** Resonance margin in percent (default 10). */
  marginPct?: number;
  /**
   * A locked-down mathjs instance to reuse (building one costs ~0.2 s). It is immutable, so one
   * instance may serve many sheets; when omitted a new one is made for a cold evaluation.
   */
  math?: SafeMath;
}

export interface EvaluationStats {
  /** Declarations evaluated afresh in this call. */
  evaluated: number;
  /** Declarations whose previous evaluation was reused unchanged. */
  reused: number;
}

export interface SheetResult {
  entries: SheetEntry[];
  diagnostics: SheetDiagnostic[];
  symbols: Map<string, SheetSymbol>;
  stats: EvaluationStats;
  /** Opaque caches for the next incremental call; pass the whole result back as `previous`. */
  readonly cache: unknown;
  /**
   * What sweeps, plots and exports need of each evaluated line, stub and sweep (engine models,
   * resolved ends, ranges), by name. Not part of the JSON results.
   */
  readonly models?: ReadonlyMap<string, EntryModel>;
}
