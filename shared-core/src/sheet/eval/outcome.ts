/** What evaluating one declaration yields, independent of its line number (so it can be cached). */
import type { LocalDiagnostic } from '../parse/lineParser.js';
import type { EntryResults } from '../types.js';
import type { LineBuild, SubstrateValue } from './lineTypes.js';
import type { StubBuild } from './stubPoint.js';
import type { SweepBuild } from './sweep.js';
import type { LetValue } from './values.js';

export interface Outcome {
  results: EntryResults;
  details: string[];
  /** Synthesized values with the column range of the key item they answer. */
  synthesized: { key: string; valueSI: number; start: number; end: number }[];
  diagnostics: LocalDiagnostic[];
  /** Names read (declared or not): the evaluation depends on them. */
  reads: Set<string>;
  references: { name: string; start: number; end: number }[];
  letValue?: LetValue;
  substrate?: SubstrateValue;
  line?: LineBuild;
  /** What a sweep, plot or export of a stub needs. */
  stub?: StubBuild;
  sweep?: SweepBuild;
}
