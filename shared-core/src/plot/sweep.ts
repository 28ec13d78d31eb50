/**
 * Sweeps of a stub over frequency or drawn length, and of a line section over frequency. Pure.
 *
 * Every stub point comes from `stubPointAt`, the function the sheet's own stub figures come from,
 * so a sweep point at the stub's `at` equals the sheet's reactance_ohm and resistance_ohm exactly.
 * Resonances come from the engine's root finding (resonance.ts, θ(f) = n·90° on the dispersive
 * line), never from sign changes between samples.
 *
 * A line section of length l is the two-port of the line's own Z0 and γ = α + jβ: on lines with a
 * loss split the exact R′L′G′C′ line (complex Z0, lineLoss.ts), else the real Z0 with γ = α + jβ.
 * ABCD = [cosh γl, Z0·sinh γl; sinh γl / Z0, cosh γl] (Pozar, Microwave Engineering, 4th ed.,
 * Table 4.1, transmission line; from memory).
 */
import {
  type Complex, type LineModel, type Resonance, cdiv, cmul, complex, electricalLengthAt, nearestResonances, phaseConstant, propagationConstant, resonance, resonanceType, resonancesInRange, rlgcLineAt, rlgcOf,
} from '../engine/index.js';
import type { LineBuild } from '../sheet/eval/lineTypes.js';
import { endExtraLength, stubPointAt, type StubBuild, type StubPoint } from '../sheet/eval/stubPoint.js';

/** Default number of points of a sweep and a plot. */
export const DEFAULT_POINTS = 401;
/** Most points a sweep, plot or export takes. */
export const MAX_POINTS = 10_001;
/** Fewest points. */
export const MIN_POINTS = 2;

/** `points` values from `from` to `to` inclusive, evenly spaced. */
export function linearGrid(from: number, to: number, points: number): number[] {
  if (!(Number.isInteger(points) && points >= MIN_POINTS && points <= MAX_POINTS)) {
    throw new RangeError(`points must be a whole number from ${MIN_POINTS} to ${MAX_POINTS}, got ${points}`);
  }
  if (!(Number.isFinite(from) && Number.isFinite(to) && to > from)) throw new RangeError(`a sweep goes from low to high, got ${from} … ${to}`);
  return Array.from({ length: points }, (_, i) => (i === points - 1 ? to : from + ((to - from) * i) / (points - 1)));
}

export interface Span {
  from: number;
  to: number;
}

/** Least share of a default span left on each side of `at` and of the resonance nearest it. */
export const SPAN_ROOM = 0.08;

/**
 * Default frequency span of a stub. Its anchors are `at` and the resonance nearest `at` when that
 * lies within 3.5·at; the span runs from below the resonance under the lower anchor (half the gap
 * again below it; near DC when there is none) to past the resonance above the upper anchor (15 % of
 * the gap beyond it, at least 2·at; when that resonance lies above 3.5·at, to 15 % of the anchors'
 * distance past the upper anchor, at least 2·at), is widened to hold the band plus the margin, and
 * finally widened so that at least SPAN_ROOM of it lies on each side of both anchors: a stub sitting
 * on a resonance (a trap, a choke) is never drawn on the edge. Resonances come from the engine, at
 * the effective length the sheet uses.
 */
export function defaultStubSpan(build: StubBuild, marginPct = 10): Span {
  const f = build.frequencyHz;
  const length = resonanceLength(build);
  const nearest = nearestResonances(build.kind, build.line.model, length, f).nearest;
  const anchored = nearest.frequencyHz <= 3.5 * f;
  const lo = anchored ? Math.min(f, nearest.frequencyHz) : f;
  const hi = anchored ? Math.max(f, nearest.frequencyHz) : f;
  // Neighbours by quarter-wave count: the resonance under the lower anchor and the one over the upper.
  const n = nearest.quarterWaves;
  const below = anchored && n > 1 ? resonance(build.kind, build.line.model, length, n - 1).frequencyHz : undefined;
  const above = anchored ? resonance(build.kind, build.line.model, length, n + 1).frequencyHz : nearest.frequencyHz;
  let to = above <= 3.5 * f ? Math.max(2 * f, above + 0.15 * (above - hi)) : Math.max(2 * f, hi + 0.15 * (hi - lo));
  let from = below !== undefined ? Math.max(0.02 * f, below - 0.5 * (lo - below)) : 0.02 * f;
  if (build.band) {
    from = Math.min(from, build.band[0] * (1 - marginPct / 100));
    to = Math.max(to, build.band[1] * (1 + marginPct / 100));
  }
  // Room on both sides of the anchors (a long stub's span is otherwise tight below `at`).
  const floor = Math.min(from, 0.02 * f);
  for (let i = 0; i < 8; i++) {
    const span = to - from;
    const needFrom = Math.max(floor, lo - SPAN_ROOM * span);
    const needTo = hi + SPAN_ROOM * span;
    if (needFrom >= from && needTo <= to) break;
    from = Math.min(from, needFrom);
    to = Math.max(to, needTo);
  }
  return { from: Math.max(from, 1e-6 * to), to };
}

/**
 * Default drawn-length span at the stub's `at`: from near zero to the longer of 1.5 × the drawn
 * length and 0.6 λg (at most the drawn length + λg), so the resonant lengths around it show.
 */
export function defaultLengthSpan(build: StubBuild): Span {
  const at = build.line.model(build.frequencyHz);
  const lambda = (2 * Math.PI) / phaseConstant(at.epsEff, build.frequencyHz);
  const to = Math.min(Math.max(1.5 * build.lengthM, 0.6 * lambda), build.lengthM + lambda);
  return { from: to / 200, to };
}

/** Default span of a line: 0.02·at … 2·at. */
export function defaultLineSpan(atHz: number): Span {
  return { from: 0.02 * atHz, to: 2 * atHz };
}

/** Effective length the sheet's resonance checks use: drawn + what the end adds at `at`, m. */
export function resonanceLength(build: StubBuild): number {
  return build.lengthM + endExtraLength(build.end, build.line.model(build.frequencyHz), build.frequencyHz);
}

/** About how many resonances the stub has in [fromHz, toHz] (quarter waves gained across it). */
export function resonanceCount(build: StubBuild, fromHz: number, toHz: number): number {
  const q = (f: number) => electricalLengthAt(build.line.model, resonanceLength(build), Math.max(0, f)) / (Math.PI / 2);
  return q(toHz) - q(fromHz);
}

/** Resonances of the stub with frequency in [fromHz, toHz], ascending (engine root finding). */
export function stubResonances(build: StubBuild, fromHz: number, toHz: number): Resonance[] {
  return resonancesInRange(build.kind, build.line.model, resonanceLength(build), Math.max(0, fromHz), toHz);
}

/** A resonance on the length axis: the drawn length at which the stub resonates at `at`. */
export interface LengthResonance {
  lengthM: number;
  quarterWaves: number;
  type: Resonance['type'];
}

/** Drawn lengths in [fromM, toM] at which the stub resonates at its `at`: n·λg/4 minus the end's extra length. */
export function stubLengthResonances(build: StubBuild, fromM: number, toM: number): LengthResonance[] {
  const f = build.frequencyHz;
  const at = build.line.model(f);
  const quarter = Math.PI / 2 / phaseConstant(at.epsEff, f);
  const extra = endExtraLength(build.end, at, f);
  const out: LengthResonance[] = [];
  for (let n = Math.max(1, Math.floor((fromM + extra) / quarter)); n <= Math.ceil((toM + extra) / quarter); n++) {
    const lengthM = n * quarter - extra;
    if (lengthM >= fromM && lengthM <= toM && lengthM > 0) out.push({ lengthM, quarterWaves: n, type: resonanceType(build.kind, n) });
  }
  return out;
}

export interface StubSample {
  frequencyHz: number;
  lengthM: number;
  point: StubPoint;
}

/** The stub at each frequency (its drawn length fixed). */
export function sweepStubFrequency(build: StubBuild, frequenciesHz: readonly number[]): StubSample[] {
  return frequenciesHz.map((f) => ({ frequencyHz: f, lengthM: build.lengthM, point: stubPointAt(build, f) }));
}

/** The stub at each drawn length, at its `at`. */
export function sweepStubLength(build: StubBuild, lengthsM: readonly number[]): StubSample[] {
  return lengthsM.map((l) => ({ frequencyHz: build.frequencyHz, lengthM: l, point: stubPointAt(build, build.frequencyHz, l) }));
}

/** Z0 (possibly complex) and γ of a line at f: the exact R′L′G′C′ line where the loss split is known. */
export function lineWaveAt(line: Pick<LineBuild, 'model' | 'lossy'>, frequencyHz: number): { z0: Complex; gamma: Complex } {
  const lossy = line.lossy?.(frequencyHz);
  if (lossy && lossy.alpha > 0) return rlgcLineAt(rlgcOf(lossy), frequencyHz);
  const at = line.model(frequencyHz);
  return { z0: complex(at.z0), gamma: propagationConstant(at, frequencyHz) };
}

/** Chain (ABCD) matrix of a two-port. */
export interface Abcd {
  a: Complex;
  b: Complex;
  c: Complex;
  d: Complex;
}

const ccosh = (z: Complex): Complex => complex(Math.cosh(z.re) * Math.cos(z.im), Math.sinh(z.re) * Math.sin(z.im));
const csinh = (z: Complex): Complex => complex(Math.sinh(z.re) * Math.cos(z.im), Math.cosh(z.re) * Math.sin(z.im));

/** ABCD of a line section of length l (m) at f (Hz); see the file header. */
export function lineSectionAbcd(line: Pick<LineBuild, 'model' | 'lossy'>, lengthM: number, frequencyHz: number): Abcd {
  if (!(lengthM > 0 && Number.isFinite(lengthM))) throw new RangeError(`a line section needs a positive length, got ${lengthM} m`);
  const { z0, gamma } = lineWaveAt(line, frequencyHz);
  const gl = complex(gamma.re * lengthM, gamma.im * lengthM);
  const ch = ccosh(gl);
  const sh = csinh(gl);
  return { a: ch, b: cmul(z0, sh), c: cdiv(sh, z0), d: ch };
}

/** Static Z0, εeff(f) and loss of a line over frequency (for plotting a line on its own). */
export function sweepLine(model: LineModel, frequenciesHz: readonly number[]): { frequencyHz: number; z0: number; epsEff: number; alphaNpPerM: number }[] {
  return frequenciesHz.map((f) => {
    const at = model(f);
    return { frequencyHz: f, z0: at.z0, epsEff: at.epsEff, alphaNpPerM: at.alpha };
  });
}
