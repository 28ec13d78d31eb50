/** Display helpers shared by hovers, inlay hints and code actions (settings-aware units). */
import { formatQuantity, type QuantityKind } from '../sheet/format.js';
import type { EntryResults, SheetEntry } from '../sheet/types.js';
import type { ServiceSettings } from './types.js';

export type Show = (key: string, quantity: QuantityKind) => string;

/** Formats result `key` of an entry in engineering units, honouring the display length unit. */
export function shower(results: EntryResults, settings: ServiceSettings): Show {
  return (key, quantity) => {
    const v = results[key];
    return formatQuantity(typeof v === 'number' ? v : null, quantity, { lengthUnit: settings.lengthUnit });
  };
}

export const num = (results: EntryResults, key: string): number | null => {
  const v = results[key];
  return typeof v === 'number' && Number.isFinite(v) ? v : null;
};

/** The equivalent L or C of a stub, or null. */
export function equivalent(entry: SheetEntry, show: Show): string | null {
  if (num(entry.results, 'inductance_h') !== null) return `≈ ${show('inductance_h', 'inductance')}`;
  if (num(entry.results, 'capacitance_f') !== null) return `≈ ${show('capacitance_f', 'capacitance')}`;
  return null;
}

/** A length in the display unit, rounded to the manufacturing grid, as sheet text (e.g. `20.35 mm`). */
export function gridLengthText(valueM: number, settings: ServiceSettings): string {
  const grid = settings.gridM > 0 ? settings.gridM : 1e-6;
  const rounded = Math.max(grid, Math.round(valueM / grid) * grid);
  if (settings.lengthUnit === 'mil') {
    const decimals = Math.max(0, Math.min(4, Math.ceil(-Math.log10(grid / 25.4e-6) - 1e-9)));
    return `${(rounded / 25.4e-6).toFixed(decimals)} mil`;
  }
  const decimals = Math.max(0, Math.min(6, Math.ceil(-Math.log10(grid / 1e-3) - 1e-9)));
  return `${(rounded * 1e3).toFixed(decimals)} mm`;
}
