/**
 * Inlay hints: the one or two figures an engineer wants at the end of each evaluated line.
 * line: Z0 and εeff (or the synthesized width); stub: the synthesized length, X and the
 * equivalent L or C at f, and the resonance margin when it is tight.
 */
import type { Range, SheetEntry } from '../sheet/types.js';
import { formatQuantity } from '../sheet/format.js';
import { equivalent, num, shower } from './display.js';
import { firstEntryAtOrAfter } from './locate.js';
import type { EvaluatedDocument, InlayHint, ServiceSettings } from './types.js';

/** Margins below this multiple of the configured margin are shown in the hint. */
const TIGHT_FACTOR = 2;

/** The compact figures for one declaration (also the CLI's trailing note); null when there are none. */
export function hintLabel(entry: SheetEntry, settings: ServiceSettings): string | null {
  const show = shower(entry.results, settings);
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
      if (r.resonant_intended === true) {
        // An intended resonance (choke, trap): say where it sits, not what L or C it approximates.
        const f = num(r, 'frequency_hz')!;
        const near = [num(r, 'resonance_below_hz'), num(r, 'resonance_above_hz')].filter((x): x is number => x !== null)
          .reduce((a, b) => (Math.abs(b - f) < Math.abs(a - f) ? b : a));
        parts.push(`resonance ${formatQuantity(near, 'frequency')} (${((Math.abs(near - f) / f) * 100).toFixed(1)} % off)`);
        return parts.join(' · ');
      }
      const eq = equivalent(entry, show);
      if (eq) parts.push(eq, `X ${show('reactance_ohm', 'reactance')}`);
      else parts.push(num(r, 'resistance_ohm') === null ? 'resonant' : `resonant (R ${show('resistance_ohm', 'resistance')})`);
      const margin = num(r, 'resonance_margin_pct');
      if (margin !== null && margin < TIGHT_FACTOR * settings.marginPct && r.behaviour !== 'resonant') {
        parts.push(`${margin.toFixed(1)} % to res.`);
      }
      return parts.join(' · ');
    }
    case 'sweep': {
      if (num(r, 'points') === null) return null;
      const span = `${show('from_hz', 'frequency')} … ${show('to_hz', 'frequency')}, ${num(r, 'points')} pts`;
      if (r.target_kind === 'line') return `${span} · IL ≤ ${num(r, 'insertion_loss_db_max')!.toFixed(2)} dB`;
      const n = num(r, 'resonance_count') ?? 0;
      return `${span} · ${n === 0 ? 'no resonance' : n === 1 ? '1 resonance' : `${n} resonances`}`;
    }
  }
}

/** Hints for entries whose line lies in `range` (all lines when omitted). */
export function getInlayHints(doc: EvaluatedDocument, range?: Range): InlayHint[] {
  if (!doc.settings.inlayHints) return [];
  const hints: InlayHint[] = [];
  const entries = doc.result.entries;
  for (let i = range ? firstEntryAtOrAfter(doc, range.start.line) : 0; i < entries.length; i++) {
    const entry = entries[i]!;
    if (range && entry.line > range.end.line) break;
    const label = hintLabel(entry, doc.settings);
    if (label) hints.push({ position: entry.range.end, label, tooltip: entry.details.join('\n') });
  }
  return hints;
}
