/**
 * Engineering-unit formatting of SI results for display (CLI notes, inlay hints, hovers). Pure.
 *
 * Conventions (pinned; the CLI, hints and hovers all rely on them):
 * - Input is SI: metres, hertz, ohms, henries, farads; angles in **radians** (the SI unit);
 *   `percent` takes a value already in percent (`12.5` → `12.5 %`, like the engine's `…Pct` fields);
 *   `ratio` is a plain number (εeff, Dk, VSWR).
 * - Negative values use the minus sign U+2212 (`−12 Ω`); a reactance always carries its sign
 *   (`+64.6 Ω`, `−12 Ω`) because the sign says inductive or capacitive. Negative zero prints as `0`.
 * - Significant digits: 4 for frequency (entered values such as 2.412 GHz stay exact), 3 otherwise;
 *   trailing zeros are dropped (`50 Ω`, `2.4 GHz`).
 * - Prefixes step by 1000, except that the units boards are drawn in start at 0.1 of the unit:
 *   `0.15 mm` (µm below), `0.3 Ω` (mΩ below), `0.35 nH` (pH below), `0.9 pF` (fF below).
 * - One space between number and unit (`2.19 mm`, `12.3 %`), none before the degree sign (`45°`).
 *   The µ, Ω, − and ° spellings used here are accepted back by the sheet language.
 * - `null`, `NaN` and ±Infinity print as `—`.
 */

/** Quantities `formatQuantity` knows how to display. */
export type QuantityKind =
  | 'length'
  | 'frequency'
  | 'impedance'
  | 'reactance'
  | 'resistance'
  | 'inductance'
  | 'capacitance'
  | 'angle'
  | 'percent'
  | 'ratio';

/** Display options. */
export interface FormatQuantityOptions {
  /** Significant digits, 1–15 (default 4 for frequency, 3 otherwise). */
  digits?: number;
  /** Length unit: engineering metric (`mm`/`µm`/`m`, default) or thousandths of an inch (`mil`). */
  lengthUnit?: 'mm' | 'mil';
}

/** What `formatQuantity` prints for a missing or non-finite value. */
export const NO_VALUE = '—';

/** The minus sign used for negative numbers (U+2212). */
export const MINUS = '\u2212';

const MICRO = '\u00b5';
const OHM = '\u03a9';

/** One rung of a unit ladder: from |value| ≥ `from` (SI) the value is shown as value / `size` `unit`. */
interface Step {
  readonly from: number;
  readonly size: number;
  readonly unit: string;
}

/** A unit ladder, smallest rung first, and the unit used for an exact zero. */
interface Ladder {
  readonly steps: readonly Step[];
  readonly zero: string;
}

/** Engineering rungs: each prefix is used from one of its own units up. */
const engineering = (zero: string, ...rungs: [number, string][]): Ladder => ({
  zero,
  steps: rungs.map(([size, unit]) => ({ from: size, size, unit })),
});

/** Ohms from 0.1 Ω (a stub's loss resistance reads 0.3 Ω), milliohms below. */
const OHMS: Ladder = {
  zero: OHM,
  steps: [
    { from: 0, size: 1e-3, unit: `m${OHM}` },
    { from: 0.1, size: 1, unit: OHM },
    { from: 1e3, size: 1e3, unit: `k${OHM}` },
    { from: 1e6, size: 1e6, unit: `M${OHM}` },
    { from: 1e9, size: 1e9, unit: `G${OHM}` },
  ],
};

const LADDERS: Record<Exclude<QuantityKind, 'angle' | 'percent' | 'ratio'>, Ladder> = {
  // Board practice: millimetres from 0.1 mm up to 1 m, micrometres below (copper, gaps), metres above.
  length: {
    zero: 'mm',
    steps: [
      { from: 0, size: 1e-9, unit: 'nm' },
      { from: 1e-7, size: 1e-6, unit: `${MICRO}m` },
      { from: 1e-4, size: 1e-3, unit: 'mm' },
      { from: 1, size: 1, unit: 'm' },
    ],
  },
  frequency: engineering('Hz', [1, 'Hz'], [1e3, 'kHz'], [1e6, 'MHz'], [1e9, 'GHz'], [1e12, 'THz']),
  impedance: OHMS,
  reactance: OHMS,
  resistance: OHMS,
  // RF practice: nanohenries and picofarads from 0.1 of the unit (0.35 nH, 0.9 pF), prefixes elsewhere.
  inductance: {
    zero: 'nH',
    steps: [
      { from: 0, size: 1e-12, unit: 'pH' },
      { from: 1e-10, size: 1e-9, unit: 'nH' },
      { from: 1e-6, size: 1e-6, unit: `${MICRO}H` },
      { from: 1e-3, size: 1e-3, unit: 'mH' },
      { from: 1, size: 1, unit: 'H' },
    ],
  },
  capacitance: {
    zero: 'pF',
    steps: [
      { from: 0, size: 1e-18, unit: 'aF' },
      { from: 1e-15, size: 1e-15, unit: 'fF' },
      { from: 1e-13, size: 1e-12, unit: 'pF' },
      { from: 1e-9, size: 1e-9, unit: 'nF' },
      { from: 1e-6, size: 1e-6, unit: `${MICRO}F` },
      { from: 1e-3, size: 1e-3, unit: 'mF' },
      { from: 1, size: 1, unit: 'F' },
    ],
  },
};

const MIL_M = 25.4e-6;

/** Formats a finite number with `digits` significant digits, trailing zeros dropped, no sign. */
function magnitude(x: number, digits: number): string {
  const s = Math.abs(x).toPrecision(digits);
  return s.replace(/(\.\d*?)0+(?=$|e)/, '$1').replace(/\.(?=$|e)/, '');
}

function signOf(x: number, explicitPlus: boolean): string {
  if (x < 0) return MINUS;
  return explicitPlus && x > 0 ? '+' : '';
}

function pickStep(ladder: Ladder, abs: number): Step {
  let chosen = ladder.steps[0] as Step;
  for (const step of ladder.steps) if (abs >= step.from) chosen = step;
  return chosen;
}

function withLadder(value: number, ladder: Ladder, digits: number, explicitPlus: boolean): string {
  if (value === 0) return `0 ${ladder.zero}`;
  // Round first so that 999.96 Ω becomes 1 kΩ, not 1000 Ω.
  const rounded = Number(value.toPrecision(digits));
  const step = pickStep(ladder, Math.abs(rounded));
  return `${signOf(rounded, explicitPlus)}${magnitude(rounded / step.size, digits)} ${step.unit}`;
}

function clampDigits(d: number | undefined, fallback: number): number {
  if (d === undefined || !Number.isFinite(d)) return fallback;
  return Math.min(15, Math.max(1, Math.round(d)));
}

/**
 * Formats an SI value in engineering units: `2.45 GHz`, `50 Ω`, `+64.6 Ω`, `4.2 nH`, `0.9 pF`,
 * `19.8 mm`, `35 µm`, `780 mil`, `45°`, `12.3 %`, `1.87`; `—` for null or non-finite input.
 * See the module comment for the input units of `angle` (radians) and `percent` (percent).
 */
export function formatQuantity(
  valueSI: number | null,
  quantity: QuantityKind,
  opts: FormatQuantityOptions = {},
): string {
  if (valueSI === null || !Number.isFinite(valueSI)) return NO_VALUE;
  const digits = clampDigits(opts.digits, quantity === 'frequency' ? 4 : 3);
  const plain = (x: number, suffix: string): string => {
    const m = magnitude(x, digits);
    return Number(m) === 0 ? `0${suffix}` : `${signOf(x, false)}${m}${suffix}`;
  };
  switch (quantity) {
    case 'angle':
      return plain((valueSI * 180) / Math.PI, '\u00b0');
    case 'percent':
      return plain(valueSI, ' %');
    case 'ratio':
      return plain(valueSI, '');
    case 'length':
      if (opts.lengthUnit === 'mil') return plain(valueSI / MIL_M, ' mil');
      return withLadder(valueSI, LADDERS.length, digits, false);
    default:
      return withLadder(valueSI, LADDERS[quantity], digits, quantity === 'reactance');
  }
}
