/**
 * Quantity kinds of sheet values, conversion to SI numbers, and the "wants a length" check.
 *
 * A mathjs quantity stores its value in SI base units (`.value`; angles in rad) and its dimension as
 * exponents of the base dimensions in `Unit.BASE_DIMENSIONS` order:
 * [MASS, LENGTH, TIME, CURRENT, TEMPERATURE, LUMINOUS_INTENSITY, AMOUNT_OF_SUBSTANCE, ANGLE, BIT].
 */
import { isUnit, type Unit } from 'mathjs';
import { formatValue } from './format.js';
import { LETTER_UNITS } from './names.js';
import type { NameRef, Value } from './types.js';

/** Kinds of quantity the sheet keys ask for. */
export type QuantityKind =
  | 'length' | 'frequency' | 'impedance' | 'inductance' | 'capacitance' | 'angle'
  | 'dimensionless' | 'conductivity' | 'power' | 'other';

/** Dimension exponents per kind (m; s⁻¹; kg·m²·s⁻³·A⁻²; kg·m²·s⁻²·A⁻²; kg⁻¹·m⁻²·s⁴·A²; rad; S/m; W; 1). */
const DIMENSIONS: ReadonlyArray<readonly [QuantityKind, readonly number[]]> = Object.freeze([
  ['length', [0, 1, 0, 0, 0, 0, 0, 0, 0]],
  ['frequency', [0, 0, -1, 0, 0, 0, 0, 0, 0]],
  ['impedance', [1, 2, -3, -2, 0, 0, 0, 0, 0]],
  ['inductance', [1, 2, -2, -2, 0, 0, 0, 0, 0]],
  ['capacitance', [-1, -2, 4, 2, 0, 0, 0, 0, 0]],
  ['angle', [0, 0, 0, 0, 0, 0, 0, 1, 0]],
  ['conductivity', [-1, -3, 3, 2, 0, 0, 0, 0, 0]],
  ['power', [1, 2, -3, 0, 0, 0, 0, 0, 0]],
  ['dimensionless', [0, 0, 0, 0, 0, 0, 0, 0, 0]],
] as const);

const ARTICLE: Readonly<Record<QuantityKind, string>> = Object.freeze({
  length: 'a length', frequency: 'a frequency', impedance: 'an impedance', inductance: 'an inductance',
  capacitance: 'a capacitance', angle: 'an angle', dimensionless: 'a plain number',
  conductivity: 'a conductivity', power: 'a power', other: 'a quantity',
});

/** The quantity kind of a value; plain numbers and unit ratios such as `mm/mm` are `dimensionless`. */
export function quantityKind(value: Value): QuantityKind {
  if (typeof value === 'number') return 'dimensionless';
  if (!isUnit(value)) return 'other';
  const dims = (value as Unit).dimensions;
  for (const [kind, ref] of DIMENSIONS) {
    const n = Math.max(dims.length, ref.length);
    let same = true;
    for (let k = 0; k < n && same; k++) same = Math.abs((dims[k] ?? 0) - (ref[k] ?? 0)) < 1e-9;
    if (same) return kind;
  }
  return 'other';
}

/** SI number of `value` if it is of `kind` (m, Hz, Ω, H, F, rad, 1, S/m), else `undefined`. */
export function toSI(value: Value, kind: QuantityKind): number | undefined {
  if (kind === 'other' || quantityKind(value) !== kind) return undefined;
  if (typeof value === 'number') return value;
  const si = (value as { value: number | null }).value;
  return si === null ? undefined : si;
}

/** Result of `expectKind`. */
export type KindCheck = { readonly ok: true; readonly si: number } | { readonly ok: false; readonly message: string };

/**
 * SI number of `value` for key `keyName`, or a message such as "height wants a length, got 2.4 GHz
 * (a frequency)". Pass `letterUnits` from the evaluation so a single-letter name that silently became
 * a unit (`h` → hour) is named in the message.
 */
export function expectKind(value: Value, kind: QuantityKind, keyName: string, letterUnits: readonly NameRef[] = []): KindCheck {
  const si = toSI(value, kind);
  if (si !== undefined) return { ok: true, si };
  const wants = `${keyName} wants ${ARTICLE[kind]}`;
  const actual = quantityKind(value);
  if (actual === kind) {
    return { ok: false, message: `${wants}, got the bare unit ${formatValue(value)}: put a number before it (1 ${formatValue(value)})` };
  }
  const note = actual === 'other' ? '' : ` (${ARTICLE[actual]})`;
  const hint = kind === 'angle' && actual === 'dimensionless' ? '; add deg or rad' : '';
  const letters = letterUnits.map((r) => `"${r.name}" was read as the unit ${LETTER_UNITS.get(r.name) ?? r.name} because the sheet defines no ${r.name}`);
  return { ok: false, message: [`${wants}, got ${formatValue(value)}${note}${hint}`, ...letters].join('; ') };
}
