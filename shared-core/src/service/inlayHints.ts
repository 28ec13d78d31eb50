/**
 * Inlay hints: the one or two figures an engineer wants at the end of each evaluated line.
 * line: Z0 and εeff (or the synthesized width); stub: the synthesized length, X and the
 * equivalent L or C at f, and the resonance margin when it is tight.
 */
import type { Range, SheetEntry } from '../sheet/types.js';
import { equivalent, num, shower } from './display.js';
import type { EvaluatedDocument, InlayHint } from './types.js';

/** Margins below this multiple of the configured margin are shown in the hint. */
const TIGHT_FACTOR = 2;

export function hintLabel(entry: SheetEntry, doc: EvaluatedDocument): string | null {
  const show = shower(entry.results, doc.settings);
  const r = entry.results;
  switch (entry.kind) {
    case 'let':
    case 'substrate':
      return null;
    case 'line': {
      if (num(r, 'z0_ohm') === null) return null;
      const eps = `εeff ${(num(r, 'eps_eff_at_f') ?? num(r, 'eps_eff'))!.toFixed(3)}`;
      if (entry.synthesized.some((s) => s.key === 'width')) return `w = ${show('width_m', 'length')} · ${eps}`;
      return `Z0 ${show('z0_ohm', 'impedance')} · ${eps}`;
    }
    case 'stub': {
      if (num(r, 'length_m') === null) return null;
      const parts: string[] = [];
      if (entry.synthesized.some((s) => s.key === 'length')) parts.push(`ℓ = ${show('length_m', 'length')}`);
      const eq = equivalent(entry, show);
      if (eq) parts.push(eq, `X ${show('reactance_ohm', 'reactance')}`);
      else parts.push(`resonant (R ${show('resistance_ohm', 'resistance')})`);
      const margin = num(r, 'resonance_margin_pct');
      if (margin !== null && margin < TIGHT_FACTOR * doc.settings.marginPct && r.behaviour !== 'resonant') {
        parts.push(`${margin.toFixed(1)} % from resonance`);
      }
      return parts.join(' · ');
    }
  }
}

/** Hints for entries whose line lies in `range` (all lines when omitted). */
export function getInlayHints(doc: EvaluatedDocument, range?: Range): InlayHint[] {
  if (!doc.settings.inlayHints) return [];
  const hints: InlayHint[] = [];
  for (const entry of doc.result.entries) {
    if (range && (entry.line < range.start.line || entry.line > range.end.line)) continue;
    const label = hintLabel(entry, doc);
    if (label) hints.push({ position: entry.range.end, label, tooltip: entry.details.join('\n') });
  }
  return hints;
}
