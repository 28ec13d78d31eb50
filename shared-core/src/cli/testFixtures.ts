/** Hand-made `SheetResult`s for the command-line tests (test-only; not part of the bundle). */
import type { EntryKind, EntryResults, Range, SheetDiagnostic, SheetEntry, SheetResult } from '../sheet/types.js';

/** A range on one line (0-based, end exclusive). */
export const at = (line: number, start: number, end: number): Range => ({
  start: { line, character: start },
  end: { line, character: end },
});

/** An entry declared on `line` whose text spans `length` characters. */
export function entry(line: number, kind: EntryKind, name: string, results: EntryResults, length = 20): SheetEntry {
  return {
    line, kind, name, results,
    nameRange: at(line, 4, 4 + name.length),
    range: at(line, 0, length),
    details: [],
    synthesized: [],
  };
}

/** A result with the given entries and diagnostics. */
export function sheetResult(entries: SheetEntry[], diagnostics: SheetDiagnostic[] = []): SheetResult {
  return { entries, diagnostics, symbols: new Map(), stats: { evaluated: entries.length, reused: 0 }, cache: null };
}

/** The demo sheet from the brief. */
export const DEMO_TEXT = [
  '# invented demo: 2.45 GHz sensor node, 0.8 mm glass-PTFE board',
  'let f0 = 2.45 GHz',
  'let band = 2.40 GHz .. 2.50 GHz',
  'substrate core: dk 2.55 ± 0.04, df 0.0022, height 0.8 mm, copper 35 um',
  'line feed: microstrip on core, z0 50 ohm            # width is synthesized',
  'stub choke: short on thin, length 19.8 mm, at f0, resonant',
  'stub tune: open on feed, capacitance 0.9 pF, at f0, band band',
  '',
].join('\n');

/** A plausible evaluation of `DEMO_TEXT` with the evaluator's result keys (numbers invented, not engine output). */
export const DEMO_RESULT: SheetResult = sheetResult(
  [
    entry(1, 'let', 'f0', { value: '2.45 GHz' }, 17),
    entry(2, 'let', 'band', { value: '2.4 GHz .. 2.5 GHz' }, 31),
    entry(3, 'substrate', 'core', { dk: 2.55, df: 0.0022, height_m: 0.8e-3, copper_m: 35e-6 }, 72),
    entry(4, 'line', 'feed', { z0_ohm: 50.01, eps_eff: 2.0912, width_m: 2.1934e-3 }, 40),
    entry(5, 'stub', 'choke', {
      length_m: 19.8e-3, reactance_ohm: null, inductance_h: null, capacitance_f: null, resonance_margin_pct: 0.4, behaviour: 'resonant',
    }, 58),
    entry(6, 'stub', 'tune', {
      length_m: 4.12e-3, reactance_ohm: -72.2, inductance_h: null, capacitance_f: 0.9e-12, resonance_margin_pct: 61.5, behaviour: 'capacitive',
    }, 61),
  ],
  [
    {
      range: at(5, 0, 58), severity: 'warning', code: 'near-resonance',
      message: 'choke is 0.4 % from its λ/4 resonance at 2.44 GHz (margin 10 %)',
    },
    {
      range: at(5, 13, 17), severity: 'error', code: 'unknown-name',
      message: "'thin' is not declared: declare `line thin: …` or use an existing line",
      related: [{ range: at(4, 5, 9), message: 'a line declared here' }],
    },
  ],
);

/** A clean result with no entries. */
export const EMPTY_RESULT: SheetResult = sheetResult([]);
