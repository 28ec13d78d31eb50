/**
 * Completion by position: declaration keywords at the start of a line, line types and stub kinds
 * after the colon, names of the right kind after `on`, the keys valid for the declaration, and
 * let names and units in value position.
 */
import { LINE_TYPES } from '../sheet/eval/lineTypes.js';
import { DECLARATION_KEYWORDS } from '../sheet/parse/lineParser.js';
import { STUB_KEYS, STUB_KINDS, SUBSTRATE_KEYS, SWEEP_KEYS, type KeyTable } from '../sheet/schema.js';
import type { Position } from '../sheet/types.js';
import type { CompletionItem, EvaluatedDocument } from './types.js';

const UNITS: Record<string, string[]> = {
  length: ['mm', 'um', 'mil', 'in', 'cm', 'm'],
  frequency: ['GHz', 'MHz', 'kHz', 'Hz'],
  impedance: ['ohm', 'kohm'],
  inductance: ['nH', 'pH', 'uH'],
  capacitance: ['pF', 'fF', 'nF'],
  angle: ['deg', 'rad'],
};

const SNIPPETS: Record<string, string> = {
  let: 'let ${1:name} = ${2:2.45 GHz}',
  substrate: 'substrate ${1:board}: dk ${2:3.5}, df ${3:0.002}, height ${4:0.8 mm}, copper ${5:35 um}',
  line: 'line ${1:feed}: microstrip on ${2:board}, z0 ${3:50 ohm}',
  stub: 'stub ${1:tune}: ${2|open,short|} on ${3:feed}, ${4:capacitance 0.9 pF}, at ${5:2.45 GHz}',
  sweep: 'sweep ${1:wide}: of ${2:tune}, over ${3:1 GHz .. 6 GHz}, points ${4:401}',
};

function keyTableFor(kind: string, type: string | undefined): KeyTable | undefined {
  if (kind === 'substrate') return SUBSTRATE_KEYS;
  if (kind === 'stub') return STUB_KEYS;
  if (kind === 'sweep') return SWEEP_KEYS;
  if (kind === 'line' && type) return LINE_TYPES[type]?.keys;
  return undefined;
}

const names = (doc: EvaluatedDocument, kind: string): CompletionItem[] =>
  [...doc.result.symbols.values()].filter((s) => s.kind === kind).map((s) => ({ label: s.name, kind: 'reference', detail: s.kind }));

export function getCompletions(doc: EvaluatedDocument, p: Position): CompletionItem[] {
  const before = (doc.lines[p.line] ?? '').slice(0, p.character);
  if (before.includes('#')) return [];
  const decl = /^\s*(let|substrate|line|stub|sweep)\s+[A-Za-z_]\w*\s*[:=]/.exec(before);
  if (!decl) {
    if (!/^\s*[A-Za-z_]*$/.test(before)) return [];
    return DECLARATION_KEYWORDS.flatMap((k) => [
      { label: k, kind: 'keyword' as const, detail: `${k} declaration` },
      { label: `${k} …`, kind: 'snippet' as const, detail: `new ${k} declaration`, insertText: SNIPPETS[k], snippet: true },
    ]);
  }
  const kind = decl[1]!;
  const rest = before.slice(decl[0].length);
  if (kind === 'let') return valueCompletions(doc, undefined);
  const items = rest.split(',');
  const current = items[items.length - 1]!;
  const first = items.length === 1;
  if (first && (kind === 'line' || kind === 'stub')) {
    if (/\bon\s+\w*$/.test(current)) return names(doc, kind === 'line' ? 'substrate' : 'line');
    if (/^\s*\w*$/.test(current)) {
      const words = kind === 'line' ? Object.keys(LINE_TYPES) : [...STUB_KINDS];
      return words.map((w) => ({ label: w, kind: 'keyword', detail: kind === 'line' ? 'line type' : 'stub kind' }));
    }
    return [{ label: 'on', kind: 'keyword', detail: kind === 'line' ? 'on SUBSTRATE' : 'on LINE' }];
  }
  const type = kind === 'line' ? /^\s*(\w+)/.exec(items[0] ?? '')?.[1] : undefined;
  const table = keyTableFor(kind, type);
  if (!table) return [];
  const keyMatch = /^\s*(\w*)$/.exec(current);
  if (keyMatch) {
    const used = new Set(items.slice(0, -1).map((i) => /^\s*(\w+)/.exec(i)?.[1]));
    return Object.entries(table.keys)
      .filter(([k]) => !used.has(k))
      .map(([k, spec]) => ({ label: k, kind: 'property', detail: spec.doc, insertText: spec.value.type === 'flag' ? k : `${k} ` }));
  }
  const key = /^\s*(\w+)/.exec(current)?.[1] ?? '';
  const spec = table.keys[key]?.value;
  if (spec?.type === 'name') return [...names(doc, 'stub'), ...names(doc, 'line')];
  const quantity = spec && 'quantity' in spec ? spec.quantity : undefined;
  return valueCompletions(doc, quantity);
}

function valueCompletions(doc: EvaluatedDocument, quantity: string | undefined): CompletionItem[] {
  const units = (quantity ? UNITS[quantity] ?? [] : Object.values(UNITS).flat()).map((u) => ({ label: u, kind: 'unit' as const, detail: 'unit' }));
  return [...names(doc, 'let'), ...units];
}
