/**
 * The sheet's vocabulary as data: which keys each declaration takes, what quantity each wants,
 * which are required or mutually exclusive. Line types live in `eval/lineTypes.ts`, each one a
 * table entry (keys + builder), so adding a line type never touches the parser.
 */
import type { QuantityKind } from './expr/index.js';

export type ValueType =
  | { type: 'quantity'; quantity: QuantityKind; tolerance?: boolean }
  | { type: 'range'; quantity: QuantityKind }
  | { type: 'flag' }
  | { type: 'copper' }
  | { type: 'count'; min?: number; max?: number }
  | { type: 'name' }
  | { type: 'choice'; options: readonly string[] };

export interface KeySpec {
  value: ValueType;
  /** One-line description for hovers and completion. */
  doc: string;
  aliases?: string[];
}

export interface KeyTable {
  keys: Record<string, KeySpec>;
  /** Each group needs at least one of its keys. */
  required: string[][];
  /** Each group allows at most one of its keys. */
  exclusive: string[][];
}

const q = (quantity: QuantityKind, tolerance = false): ValueType => ({ type: 'quantity', quantity, tolerance });

export const SUBSTRATE_KEYS: KeyTable = {
  keys: {
    dk: { value: q('dimensionless', true), doc: 'relative permittivity (Dk, εr); "± T" or "± P %" adds a tolerance', aliases: ['er'] },
    df: { value: q('dimensionless'), doc: 'loss tangent (Df, tan δ)' },
    height: { value: q('length', true), doc: 'dielectric height between strip and ground' },
    copper: { value: { type: 'copper' }, doc: 'copper thickness, e.g. 35 um, or weight in oz per square foot (1 oz ≈ 34.1 µm)' },
    roughness: { value: q('length'), doc: 'rms surface roughness of the copper (reserved for conductor loss)' },
    conductivity: { value: q('conductivity'), doc: 'conductor conductivity (default annealed copper, 5.8e7 S/m)' },
  },
  required: [['dk'], ['height']],
  exclusive: [],
};

export const STUB_TARGETS = ['length', 'inductance', 'capacitance', 'reactance', 'angle'] as const;

export const STUB_KEYS: KeyTable = {
  keys: {
    length: { value: q('length', true), doc: 'physical length (analysis)' },
    inductance: { value: q('inductance'), doc: 'target inductance at the design frequency: the length is synthesized' },
    capacitance: { value: q('capacitance'), doc: 'target capacitance at the design frequency: the length is synthesized' },
    reactance: { value: q('impedance'), doc: 'target reactance at the design frequency (positive inductive)' },
    angle: { value: q('angle'), doc: 'electrical length at the design frequency, e.g. 90 deg' },
    at: { value: q('frequency'), doc: 'design frequency' },
    band: { value: { type: 'range', quantity: 'frequency' }, doc: 'operating band, e.g. 2.4 GHz .. 2.5 GHz' },
    resonant: { value: { type: 'flag' }, doc: 'marks an intended resonance (bias choke, trap): being far from it is flagged' },
    solution: { value: { type: 'count' }, doc: 'which solution to synthesize: 1 is the shortest, 2 half a wave longer, …' },
    via: { value: { type: 'quantity', quantity: 'length' }, doc: 'drill diameter of the via that makes the short; its inductance (Goldfarb–Pucel) is included' },
    end: { value: { type: 'choice', options: ['corrected', 'ideal'] }, doc: 'open end: "corrected" (default) adds the microstrip open-end extension, "ideal" assumes a perfect open' },
    power: { value: { type: 'quantity', quantity: 'power' }, doc: 'RF power at the stub\'s "at" frequency on the line it shunts: peak voltage and current on the stub are reported' },
  },
  required: [[...STUB_TARGETS], ['at']],
  exclusive: [[...STUB_TARGETS]],
};

export const STUB_KINDS = ['short', 'open'] as const;

/** `sweep NAME: of STUB, over 1 GHz .. 6 GHz, points 201` or `sweep NAME: of LINE, length 12 mm, over …`. */
export const SWEEP_KEYS: KeyTable = {
  keys: {
    of: { value: { type: 'name' }, doc: 'the stub or line to sweep' },
    over: { value: { type: 'range', quantity: 'frequency' }, doc: 'frequency range, e.g. 1 GHz .. 6 GHz (default for a stub: around its "at", from the resonance below to just past the one above, its band included)' },
    points: { value: { type: 'count', min: 2, max: 10001 }, doc: 'number of frequencies, evenly spaced, ends included (default 401)' },
    length: { value: q('length'), doc: 'for a line: the length of the line section, which is swept as a two-port' },
    ref: { value: q('impedance'), doc: 'reference impedance of exported S-parameters (default 50 Ω)' },
  },
  required: [['of']],
  exclusive: [],
};

/** Resolves aliases: returns the canonical key or undefined. */
export function canonicalKey(table: KeyTable, key: string): string | undefined {
  if (key in table.keys) return key;
  for (const [name, spec] of Object.entries(table.keys)) if (spec.aliases?.includes(key)) return name;
  return undefined;
}
