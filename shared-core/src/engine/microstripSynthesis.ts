/**
 * Microstrip synthesis: the strip width that gives a target Z0.
 *
 * Start: the closed-form synthesis equations attributed to Hammerstad (1975, narrow strips, the
 * "A" form) and Wheeler (1977, wide strips, the "B" form), with the constants as printed in
 * Pozar, Microwave Engineering, 4th ed., eq. 3.197 (a starting estimate, typically within 1 %).
 * Then: the engine's bracketed root finder (rootFind.ts) on ln(Z0(u)/Z0target) of the analysis
 * model in use (Hammerstad–Jensen 1980 with the given thickness; plus Jansen–Kirschning 1983 when
 * a frequency is given), so that analysis(synthesis(Z)) = Z to about 1e-12 relative.
 * The static Z0 falls monotonically as w grows, so that root is unique.
 * Search range 1e-3 ≤ w/h ≤ 1e3; targets outside it throw a RangeError.
 */
import { microstripAtFromStatic } from './microstripDispersion.js';
import { checkPositiveInput, microstripStatic, validateMicrostripGeometry } from './microstripStatic.js';
import { findRootNearStart } from './rootFind.js';
import type { ValidityNote } from './types.js';

export const SYNTHESIS_U_MIN = 1e-3;
export const SYNTHESIS_U_MAX = 1e3;

export interface MicrostripSynthesisInput {
  /** Target characteristic impedance, Ω (> 0). */
  z0: number;
  /** Substrate height h, m. */
  heightM: number;
  /** Substrate relative permittivity εr (≥ 1). */
  dk: number;
  /** Strip thickness t, m (default 0). */
  thicknessM?: number;
  /** Design frequency, Hz (default 0: the quasi-static model). */
  frequencyHz?: number;
}

export interface MicrostripSynthesisResult {
  /** Strip width w, m. */
  widthM: number;
  /** The closed-form starting width, m. */
  initialWidthM: number;
  /** Z0 of the analysis model at `widthM`, Ω. */
  z0: number;
  /** εeff of the analysis model at `widthM`. */
  epsEff: number;
  /** Evaluations of the analysis model used, including the range check. */
  evaluations: number;
  notes: ValidityNote[];
}

/**
 * Closed-form w/h for a target Z0 (Pozar 4th ed. eq. 3.197):
 * A = (Z0/60)·√((εr+1)/2) + (εr−1)/(εr+1)·(0.23 + 0.11/εr),  w/h = 8e^A/(e^{2A} − 2) if that is < 2;
 * else B = 377π/(2Z0√εr),  w/h = (2/π)[B − 1 − ln(2B−1) + (εr−1)/(2εr)·(ln(B−1) + 0.39 − 0.61/εr)].
 * A starting estimate only; returns NaN where the expressions break down (extreme Z0).
 */
export function closedFormWidthRatio(z0: number, dk: number): number {
  const a = (z0 / 60) * Math.sqrt((dk + 1) / 2) + ((dk - 1) / (dk + 1)) * (0.23 + 0.11 / dk);
  const narrow = (8 * Math.exp(a)) / (Math.exp(2 * a) - 2);
  if (narrow > 0 && narrow < 2) return narrow;
  const b = (377 * Math.PI) / (2 * z0 * Math.sqrt(dk));
  const wide = (2 / Math.PI) * (b - 1 - Math.log(2 * b - 1) + ((dk - 1) / (2 * dk)) * (Math.log(b - 1) + 0.39 - 0.61 / dk));
  return wide > 0 ? wide : Number.NaN;
}

/**
 * Width (m) of a microstrip line with characteristic impedance `z0` on the given substrate,
 * solved on the same analysis model the rest of the engine uses. Throws a RangeError for bad
 * inputs or when the target needs w/h outside 1e-3 … 1e3.
 */
export function microstripWidthForZ0(input: MicrostripSynthesisInput): MicrostripSynthesisResult {
  const { z0, heightM, dk } = input;
  const thicknessM = input.thicknessM ?? 0;
  const frequencyHz = input.frequencyHz ?? 0;
  checkPositiveInput('z0', z0);
  validateMicrostripGeometry({ widthM: heightM, heightM, dk, thicknessM });
  checkPositiveInput('frequencyHz', frequencyHz, true);
  const at = (u: number) =>
    microstripAtFromStatic(microstripStatic({ widthM: u * heightM, heightM, dk, thicknessM }), dk, heightM, frequencyHz);
  let evaluations = 0;
  const g = (u: number) => {
    evaluations++;
    return Math.log(at(u).z0 / z0);
  };
  const [lo, hi] = [SYNTHESIS_U_MIN, SYNTHESIS_U_MAX];
  const [gLo, gHi] = [g(lo), g(hi)];
  if (!(gLo >= 0 && gHi <= 0)) {
    const zMax = z0 * Math.exp(gLo);
    const zMin = z0 * Math.exp(gHi);
    throw new RangeError(
      `Z0 = ${z0} Ω is not reachable on this substrate: w/h from ${lo} to ${hi} ` +
        `gives ${zMax.toPrecision(4)} Ω down to ${zMin.toPrecision(4)} Ω`,
    );
  }
  const u0 = closedFormWidthRatio(z0, dk);
  // The closed-form start is usually good to ~1 %: bracket it within ±5 % first.
  const u = findRootNearStart(g, lo, hi, u0, 0.05, { relTol: 1e-14 });
  const result = at(u);
  return {
    widthM: u * heightM,
    initialWidthM: (Number.isFinite(u0) ? u0 : Number.NaN) * heightM,
    z0: result.z0,
    epsEff: result.epsEff,
    evaluations,
    notes: result.notes,
  };
}
