/**
 * The trailing note of a declaration in `stubwright eval` output: the same compact figures the
 * editor shows as an inlay hint (one source for both), e.g. `# → w = 2.2 mm · εeff 2.106`.
 */
import { hintLabel } from '../service/inlayHints.js';
import { DEFAULT_SETTINGS } from '../service/types.js';
import type { SheetEntry } from '../sheet/types.js';

/** Note options. */
export interface NoteOptions {
  lengthUnit?: 'mm' | 'mil';
  /** Resonance margin in percent: a margin below twice this is shown. */
  marginPct?: number;
}

/** The trailing note of an entry, or null when it has no figures. */
export function entryNote(entry: SheetEntry, opts: NoteOptions = {}): string | null {
  const label = hintLabel(entry, { ...DEFAULT_SETTINGS, lengthUnit: opts.lengthUnit ?? 'mm', marginPct: opts.marginPct ?? DEFAULT_SETTINGS.marginPct });
  return label === null ? null : `# → ${label}`;
}
