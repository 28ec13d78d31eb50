/**
 * Stub resonances with a dispersive line.
 *
 * A stub of length l resonates where its electrical length θ(f) = 2π·f·√εeff(f)·l / c0 reaches a
 * multiple of 90°. A short stub has parallel (open-circuit) resonances at odd multiples of λ/4 and
 * series (short-circuit) resonances at multiples of λ/2; an open stub the reverse
 * (Pozar, Microwave Engineering, 4th ed., §2.3 and §6.x on transmission-line resonators).
 * θ(f) is solved with εeff(f) from the line model, not scaled from θ at one frequency, so microstrip
 * dispersion moves the resonances correctly. Requires θ(f) to increase with f (true for all lines
 * in the engine: εeff(f) is non-decreasing).
 */
import { c0 } from './constants.js';
import { findRoot } from './rootFind.js';
import type { StubKind } from './stub.js';
import type { LineModel } from './types.js';

export type ResonanceType = 'series' | 'parallel';

export interface Resonance {
  frequencyHz: number;
  /** Number of quarter wavelengths in the stub at resonance (1 = λ/4, 2 = λ/2, …). */
  quarterWaves: number;
  type: ResonanceType;
}

export interface NearestResonances {
  below: Resonance | null;
  above: Resonance;
  /** min |f_res − f| / f · 100 over the two neighbours. */
  marginPct: number;
  /** The neighbour that sets the margin. */
  nearest: Resonance;
}

/** Electrical length θ(f) of a stub, rad, with the line's εeff at f. */
export function electricalLengthAt(line: LineModel, lengthM: number, frequencyHz: number): number {
  return (2 * Math.PI * frequencyHz * Math.sqrt(line(frequencyHz).epsEff) * lengthM) / c0;
}

/** Series or parallel, for a stub of `kind` at n quarter waves. */
export function resonanceType(kind: StubKind, quarterWaves: number): ResonanceType {
  const odd = quarterWaves % 2 === 1;
  return (kind === 'short') === odd ? 'parallel' : 'series';
}

/** Frequency at which the stub is exactly n quarter waves long (n ≥ 1), Hz. */
export function resonanceFrequency(line: LineModel, lengthM: number, quarterWaves: number): number {
  if (!(lengthM > 0)) throw new RangeError(`stub length must be positive, got ${lengthM} m`);
  if (!(Number.isInteger(quarterWaves) && quarterWaves >= 1)) throw new RangeError('quarterWaves must be an integer ≥ 1');
  const target = (quarterWaves * Math.PI) / 2;
  const g = (f: number) => electricalLengthAt(line, lengthM, f) - target;
  // Non-dispersive first guess, then bracket it: θ grows at least as fast as f·√εeff(0).
  const fGuess = (target * c0) / (2 * Math.PI * lengthM * Math.sqrt(line(0).epsEff));
  let lo = fGuess;
  for (let i = 0; i < 60 && g(lo) > 0; i++) lo /= 2;
  let hi = fGuess * 1.0001;
  for (let i = 0; i < 60 && g(hi) < 0; i++) hi *= 1.5;
  return findRoot(g, lo, hi);
}

/** Resonance n of a stub, with its type. */
export function resonance(kind: StubKind, line: LineModel, lengthM: number, quarterWaves: number): Resonance {
  return {
    frequencyHz: resonanceFrequency(line, lengthM, quarterWaves),
    quarterWaves,
    type: resonanceType(kind, quarterWaves),
  };
}

/**
 * The nearest resonances strictly below and at-or-above f, and the margin to the nearer one.
 * A stub shorter than λ/4 at f has no resonance below (DC is not counted).
 */
export function nearestResonances(kind: StubKind, line: LineModel, lengthM: number, frequencyHz: number): NearestResonances {
  if (!(frequencyHz > 0)) throw new RangeError(`frequency must be positive, got ${frequencyHz} Hz`);
  const quarter = electricalLengthAt(line, lengthM, frequencyHz) / (Math.PI / 2);
  let nAbove = Math.max(1, Math.ceil(quarter));
  let above = resonance(kind, line, lengthM, nAbove);
  // Guard against rounding at an exact resonance: treat f_res within 1e-12 as "at".
  if (above.frequencyHz < frequencyHz * (1 - 1e-12)) above = resonance(kind, line, lengthM, ++nAbove);
  const below = nAbove > 1 ? resonance(kind, line, lengthM, nAbove - 1) : null;
  const marginOf = (r: Resonance) => (Math.abs(r.frequencyHz - frequencyHz) / frequencyHz) * 100;
  const nearest = below && marginOf(below) < marginOf(above) ? below : above;
  return { below, above, marginPct: marginOf(nearest), nearest };
}

/** All resonances with frequency in [fLow, fHigh], ascending. */
export function resonancesInRange(kind: StubKind, line: LineModel, lengthM: number, fLow: number, fHigh: number): Resonance[] {
  if (!(fHigh >= fLow && fLow >= 0)) throw new RangeError('band must satisfy 0 ≤ low ≤ high');
  const quarterLo = electricalLengthAt(line, lengthM, fLow) / (Math.PI / 2);
  const quarterHi = electricalLengthAt(line, lengthM, fHigh) / (Math.PI / 2);
  const out: Resonance[] = [];
  for (let n = Math.max(1, Math.floor(quarterLo)); n <= Math.ceil(quarterHi); n++) {
    const r = resonance(kind, line, lengthM, n);
    if (r.frequencyHz >= fLow && r.frequencyHz <= fHigh) out.push(r);
  }
  return out;
}
