/** What sweeps, plots and exports can reach of an evaluated declaration (SheetResult.models). */
import type { LineBuild } from './lineTypes.js';
import type { StubBuild } from './stubPoint.js';
import type { SweepBuild } from './sweep.js';

export type EntryModel =
  | { kind: 'line'; line: LineBuild; /** The line's `at`, Hz, when given. */ frequencyHz: number | null }
  | { kind: 'stub'; stub: StubBuild }
  | { kind: 'sweep'; sweep: SweepBuild };
