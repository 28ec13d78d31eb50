/**
 * One-sentence descriptions of the diagnostic codes, used as SARIF rules. A `Record` over
 * `DiagnosticCode`, so adding a code without a description fails the type check.
 */
import type { DiagnosticCode } from '../sheet/types.js';

/** Short description of each diagnostic code. */
export const RULE_DESCRIPTIONS: Readonly<Record<DiagnosticCode, string>> = {
  syntax: 'A line that is not a valid declaration or expression.',
  'unknown-name': 'A name that is neither declared in the sheet nor a known unit or constant.',
  'duplicate-name': 'A name declared more than once.',
  unit: 'A value whose unit or dimension does not fit its key.',
  missing: 'A declaration that lacks a value it needs.',
  conflict: 'Values that contradict each other or specify the same thing twice.',
  range: 'A value outside the physically possible range.',
  'model-validity': 'A model used outside the input range its published source covers.',
  'near-resonance': 'A stub closer to a resonance than the resonance margin, where it no longer acts as an L or a C.',
  'resonance-in-band': 'A stub resonance inside the declared band.',
  detuned: 'A stub that does not do at its frequency what its declaration says.',
  cycle: 'Declarations that depend on each other in a cycle.',
  limit: 'Input beyond a safety limit (sheet, line or expression size, nesting).',
  power: 'High standing-wave voltage or current on a stub at the stated RF power: check breakdown, creepage and heating.',
};

/** Diagnostic codes in a fixed order (the SARIF rules array and `ruleIndex` follow it). */
export const RULE_IDS = Object.keys(RULE_DESCRIPTIONS) as DiagnosticCode[];
