/**
 * A stub as the sheet built it (kind, real end, line, drawn length, design frequency, band) and its
 * impedance at any frequency or drawn length. The sheet's own figures at `at` and every sweep, plot
 * and export point come from `stubPointAt`, so a sweep point at `at` is the sheet's result exactly.
 *
 * - X: the engine's ended-stub analysis (analyseEndedStub: open end with its extension, short ideal
 *   or through a via).
 * - R: on a line with a loss split, Re Zin of the exact R′L′G′C′ line (complex Z0, lossyStubImpedance)
 *   over the effective length (drawn + end extension, or + the via's equivalent length at f);
 *   otherwise Re Zin of the same ended-stub analysis.
 * - The equivalent L or C and the behaviour: read from that X and that R (|X| ≤ R is `resonant`),
 *   so what a stub is said to act as always agrees with the R reported beside it.
 */
import {
  analyseEndedStub, lossyStubImpedance, reactiveEquivalent, viaEquivalentLength,
  type Behaviour, type Complex, type EndedStubAnalysis, type LineAtFrequency, type StubEnd, type StubKind,
} from '../../engine/index.js';
import type { LineBuild } from './lineTypes.js';

/** What a sweep of a stub needs, kept on the stub's evaluation outcome. */
export interface StubBuild {
  kind: StubKind;
  end: StubEnd;
  line: LineBuild;
  /** Name of the line the stub is made of. */
  lineName: string;
  /** Drawn length on the board, m (given or synthesized). */
  lengthM: number;
  /** The stub's `at`, Hz. */
  frequencyHz: number;
  /** The stub's `band`, Hz, when given. */
  band: [number, number] | null;
  /** Marked `resonant` (a choke or trap). */
  resonant: boolean;
}

/** The stub's impedance and what it acts as, at one frequency and drawn length. */
export interface StubPoint {
  /** Zin = R + jX, Ω (X is ±Infinity exactly at a lossless parallel resonance). */
  zin: Complex;
  reactance: number;
  resistance: number;
  inductance: number | null;
  capacitance: number | null;
  behaviour: Behaviour;
  /** Drawn length plus what the end adds at f, m. */
  effectiveLengthM: number;
  /** R comes from the line's R′L′G′C′ (complex Z0), not from the real-Z0 analysis. */
  lossyResistance: boolean;
}

/** Extra length the stub's end adds at f: the open-end extension, or a via's equivalent length, m. */
export function endExtraLength(end: StubEnd, lineAtF: LineAtFrequency, frequencyHz: number): number {
  if (end.kind === 'open') return end.extensionM ?? 0;
  const viaL = end.viaInductanceH ?? 0;
  return viaL > 0 ? viaEquivalentLength(viaL, lineAtF, frequencyHz) : 0;
}

/**
 * The stub of `build` at frequency f (Hz), with drawn length `lengthM` (default: the sheet's).
 * `analysis`: the engine's analyseEndedStub of the same stub at f, when the caller has it already.
 */
export function stubPointAt(build: Pick<StubBuild, 'kind' | 'end' | 'line' | 'lengthM'>, frequencyHz: number, lengthM = build.lengthM, analysis?: EndedStubAnalysis): StubPoint {
  const a = analysis ?? analyseEndedStub(build.end, build.line.model, lengthM, frequencyHz);
  const effectiveLengthM = lengthM + endExtraLength(build.end, a.line, frequencyHz);
  let resistance = a.resistance;
  let lossyResistance = false;
  const lossy = build.line.lossy?.(frequencyHz);
  if (lossy && lossy.alpha > 0) {
    const z = lossyStubImpedance(build.kind, lossy, effectiveLengthM, frequencyHz);
    if (Number.isFinite(z.re) && z.re > 0) {
      resistance = z.re;
      lossyResistance = true;
    }
  }
  // The real-Z0 analysis read X against its own R; with the R′L′G′C′ R, read it again against that one.
  const element = lossyResistance ? reactiveEquivalent({ re: resistance, im: a.reactance }, frequencyHz) : a;
  return {
    zin: { re: resistance, im: a.reactance },
    reactance: a.reactance,
    resistance,
    inductance: element.inductance,
    capacitance: element.capacitance,
    behaviour: element.behaviour,
    effectiveLengthM,
    lossyResistance,
  };
}

/** Relative resolution of a computed reactance (see `shownReactance`). */
export const REACTANCE_RESOLUTION = 1e-9;

/**
 * A reactance as it may be shown: 0 when |X| < 1e-9 · max(|Z0|, R), which is below what the
 * computation resolves (at an exact quarter wave X is Z0 times the cosine of a rounded π/2, about
 * 6e-17 · Z0, not a value); otherwise X itself. For display only: results keep the computed X.
 */
export function shownReactance(reactance: number, z0: number, resistance: number): number {
  return Number.isFinite(reactance) && Math.abs(reactance) < REACTANCE_RESOLUTION * Math.max(Math.abs(z0), Math.abs(resistance)) ? 0 : reactance;
}
