/**
 * Schema-driven evaluation of a declaration's `key value` items: unknown keys, duplicates,
 * per-key quantity checks, required and mutually exclusive keys, all with located diagnostics.
 */
import { copperThicknessPerOz } from '../../engine/constants.js';
import type { Item, Span } from '../parse/lineParser.js';
import { canonicalKey, type KeyTable } from '../schema.js';
import type { Quantity, ValueReader } from './values.js';

export interface ItemValue {
  key: string;
  item: Item;
  quantity?: Quantity;
  range?: [number, number];
  flag?: true;
  count?: number;
  /** A name given as a value (`of tune`). */
  name?: Span;
  choice?: string;
}

export type ItemValues = Map<string, ItemValue>;

/**
 * Evaluates `items` against `table`. Items that fail are reported and left out of the map, so
 * callers proceed with what is valid. `what` names the declaration in messages ("microstrip line").
 */
export function readItems(reader: ValueReader, table: KeyTable, items: Item[], what: string, declName: Span): ItemValues {
  const out: ItemValues = new Map();
  const seen = new Map<string, Item>();
  for (const item of items) {
    const key = canonicalKey(table, item.key.text);
    if (key === undefined) {
      reader.error(item.key.start, item.key.end, 'syntax', `unknown key "${item.key.text}" for a ${what}; expected one of: ${Object.keys(table.keys).join(', ')}`);
      continue;
    }
    if (seen.has(key)) {
      reader.error(item.key.start, item.key.end, 'conflict', `${key} is given twice in this ${what}: keep one`);
      continue;
    }
    seen.set(key, item);
    const value = readOne(reader, table, key, item);
    if (value) out.set(key, value);
  }
  for (const group of table.exclusive) {
    const given = group.filter((k) => seen.has(k));
    for (const extra of given.slice(1)) {
      const item = seen.get(extra)!;
      reader.error(item.key.start, item.key.end, 'conflict', `give only one of ${group.join(', ')}: ${given[0]} is already given`);
      out.delete(extra);
    }
  }
  for (const group of table.required) {
    if (group.some((k) => seen.has(k))) continue;
    const need = group.length === 1 ? group[0] : `one of ${group.join(', ')}`;
    reader.error(declName.start, declName.end, 'missing', `${declName.text} needs ${need}: add ", ${group[0]} …"`);
  }
  return out;
}

function readOne(reader: ValueReader, table: KeyTable, key: string, item: Item): ItemValue | null {
  const spec = table.keys[key]!.value;
  if (spec.type === 'flag') {
    if (item.value) {
      reader.error(item.value.start, item.value.end, 'syntax', `${key} takes no value: write just "${key}"`);
      return null;
    }
    return { key, item, flag: true };
  }
  if (!item.value) {
    reader.error(item.key.start, item.key.end, 'missing', `${key} needs a value, e.g. ${example(key)}`);
    return null;
  }
  const span = item.value;
  switch (spec.type) {
    case 'quantity': {
      const quantity = reader.quantity(span, spec.quantity, key, spec.tolerance ?? false);
      return quantity ? { key, item, quantity } : null;
    }
    case 'range': {
      const range = reader.range(span, spec.quantity, key);
      return range ? { key, item, range } : null;
    }
    case 'copper': {
      const oz = /^(.*?)\s*oz$/.exec(span.text);
      if (oz) {
        const weight = reader.quantity({ text: oz[1]!, start: span.start, end: span.start + oz[1]!.length }, 'dimensionless', 'copper weight', false);
        return weight ? { key, item, quantity: { si: weight.si * copperThicknessPerOz, tolSI: 0 } } : null;
      }
      const quantity = reader.quantity(span, 'length', key, false);
      return quantity ? { key, item, quantity } : null;
    }
    case 'choice': {
      if (!spec.options.includes(span.text)) {
        reader.error(span.start, span.end, 'syntax', `${key} is one of: ${spec.options.join(', ')}`);
        return null;
      }
      return { key, item, choice: span.text };
    }
    case 'count': {
      const n = reader.quantity(span, 'dimensionless', key, false);
      if (!n) return null;
      const [min, max] = [spec.min ?? 1, spec.max ?? 1000];
      if (!(Number.isInteger(n.si) && n.si >= min && n.si <= max)) {
        const message = spec.max === undefined ? `${key} is a whole number from 1 (the shortest) upward` : `${key} is a whole number from ${min} to ${max}`;
        reader.error(span.start, span.end, 'range', message);
        return null;
      }
      return { key, item, count: n.si };
    }
    case 'name': {
      if (!/^[A-Za-z_][A-Za-z0-9_]*$/.test(span.text)) {
        reader.error(span.start, span.end, 'syntax', `${key} takes one name, e.g. "${key} tune"`);
        return null;
      }
      return { key, item, name: span };
    }
  }
}

function example(key: string): string {
  const examples: Record<string, string> = {
    dk: 'dk 3.5', df: 'df 0.002', height: 'height 0.8 mm', copper: 'copper 35 um', width: 'width 1.2 mm',
    z0: 'z0 50 ohm', at: 'at 2.45 GHz', length: 'length 12 mm', band: 'band 2.4 GHz .. 2.5 GHz',
  };
  return examples[key] ?? `${key} …`;
}

/** SI value of a quantity key, or undefined. */
export const si = (values: ItemValues, key: string): number | undefined => values.get(key)?.quantity?.si;
/** Absolute SI tolerance of a quantity key (0 when none). */
export const tol = (values: ItemValues, key: string): number => values.get(key)?.quantity?.tolSI ?? 0;
