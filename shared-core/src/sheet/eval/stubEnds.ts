/**
 * What terminates a stub in the sheet: an open end (with the microstrip open-end extension unless
 * `end ideal`), or a short, ideal or made through a via (`via D`, Goldfarb–Pucel inductance over the
 * board height). Resolved to the engine's StubEnd plus the extra electrical length it adds at f,
 * so resonance searches can work on the effective length (drawn + extra).
 */
import { type LineAtFrequency, type StubEnd, type StubKind, viaEquivalentLength, viaInductance } from '../../engine/index.js';
import { formatQuantity } from '../format.js';
import type { ItemValues } from './items.js';
import type { LineBuild } from './lineTypes.js';
import type { ValueReader } from './values.js';

export interface ResolvedEnd {
  end: StubEnd;
  /** Extra length the end adds at f (open-end Δl, or the via's equivalent length), m. */
  extraM: number;
  endExtensionM: number | null;
  viaInductanceH: number | null;
  details: string[];
  notes: string[];
}

/** Resolves the stub's end; null after reporting a located error. */
export function resolveEnd(kind: StubKind, values: ItemValues, line: LineBuild, lineAtF: LineAtFrequency, f: number, reader: ValueReader): ResolvedEnd | null {
  const via = values.get('via');
  const endChoice = values.get('end');
  if (kind === 'open') {
    if (via) {
      reader.error(via.item.key.start, via.item.key.end, 'conflict', 'an open stub has no via: remove "via", or make the stub "short"');
      return null;
    }
    if (endChoice?.choice === 'ideal' || !line.openEnd) {
      const why = endChoice?.choice === 'ideal' ? 'ideal open end (as asked)' : 'ideal open end (no open-end model for this line type)';
      return { end: { kind: 'open', extensionM: 0 }, extraM: 0, endExtensionM: null, viaInductanceH: null, details: [why], notes: [] };
    }
    const oe = line.openEnd();
    return {
      end: { kind: 'open', extensionM: oe.extensionM }, extraM: oe.extensionM, endExtensionM: oe.extensionM, viaInductanceH: null,
      details: [`open end: +${formatQuantity(oe.extensionM, 'length')} effective length (${oe.model}); the drawn length is what goes on the board`],
      notes: oe.notes.map((n) => n.message),
    };
  }
  if (endChoice) {
    reader.error(endChoice.item.key.start, endChoice.item.key.end, 'conflict', '"end" applies to open stubs; a short stub takes "via D" instead');
    return null;
  }
  if (!via) return { end: { kind: 'short' }, extraM: 0, endExtensionM: null, viaInductanceH: null, details: ['ideal short (add "via D" for a via to ground)'], notes: [] };
  const span = via.item.value!;
  if (line.viaHeightM === undefined) {
    reader.error(span.start, span.end, 'range', 'a via needs a board: use it on a line that sits on a substrate');
    return null;
  }
  const d = via.quantity!.si;
  if (!(d > 0)) {
    reader.error(span.start, span.end, 'range', 'the via diameter must be positive');
    return null;
  }
  const v = viaInductance({ heightM: line.viaHeightM, diameterM: d }, f);
  const extraM = viaEquivalentLength(v.inductanceH, lineAtF, f);
  return {
    end: { kind: 'short', viaInductanceH: v.inductanceH }, extraM, endExtensionM: null, viaInductanceH: v.inductanceH,
    details: [`via ⌀${formatQuantity(d, 'length')} through ${formatQuantity(line.viaHeightM, 'length')}: ${formatQuantity(v.inductanceH, 'inductance')} (Goldfarb–Pucel 1991), +${formatQuantity(extraM, 'length')} effective length at f`],
    notes: v.notes.map((n) => n.message),
  };
}
