/**
 * Stripline synthesis: the strip width that gives a target Z0 for a given plane spacing b.
 *
 * Start: Wheeler's closed-form thin-strip impedance (H. A. Wheeler, IEEE Trans. MTT-26(11), 1978,
 * pp. 866–876) inverted in closed form,
 *   y = exp(4π·Z0·√εr/η0) − 1,  A = y/√(4y + 6.27),  w′/(b − t) = 4/(πA),
 * then his thickness correction removed once (striplineStatic.ts). Within a few % of the answer.
 * Then: the engine's bracketed root finder (rootFind.ts) on ln(Z0(w)/Z0target) of the analysis
 * model (striplineStatic), so that analysis(synthesis(Z)) = Z to about 1e-12 relative.
 * Z0 falls monotonically as w grows (w′ grows with w), so the root is unique.
 * Search range 1e-3 ≤ w/b ≤ 1e3; targets outside it throw a RangeError naming the reachable range.
 */
import { eta0 } from './constants.js';
import { checkPositiveInput } from './microstripStatic.js';
import { findRootNearStart } from './rootFind.js';
import { striplineStatic, validateStriplineGeometry, wheelerStriplineWidthRatio } from './striplineStatic.js';
import type { ValidityNote } from './types.js';

export const STRIPLINE_SYNTHESIS_U_MIN = 1e-3;
export const STRIPLINE_SYNTHESIS_U_MAX = 1e3;

export interface StriplineSynthesisInput {
  /** Target characteristic impedance, Ω (> 0). */
  z0: number;
  /** Ground-plane spacing b, m. */
  heightM: number;
  /** Relative permittivity εr of the fill (≥ 1). */
  dk: number;
  /** Strip thickness t, m (default 0). */
  thicknessM?: number;
}

export interface StriplineSynthesisResult {
  /** Strip width w, m. */
  widthM: number;
  /** The closed-form starting width, m. */
  initialWidthM: number;
  /** Z0 of the analysis model at `widthM`, Ω. */
  z0: number;
  /** εeff (= εr). */
  epsEff: number;
  /** Evaluations of the analysis model used, including the range check. */
  evaluations: number;
  notes: ValidityNote[];
}

/**
 * Closed-form w/b for a target Z0 (Wheeler 1978 thin-strip formula inverted, thickness removed
 * once). A starting estimate only; NaN where it breaks down (a strip narrower than zero).
 */
export function closedFormStriplineWidthRatio(z0: number, dk: number, tOverB = 0): number {
  const y = Math.expm1((4 * Math.PI * z0 * Math.sqrt(dk)) / eta0);
  const a = y / Math.sqrt(4 * y + 6.27);
  const wPrimeRatio = 4 / (Math.PI * a);
  const u1 = wPrimeRatio * (1 - tOverB);
  const u = u1 - (wheelerStriplineWidthRatio(u1, tOverB) - wPrimeRatio) * (1 - tOverB);
  return u > 0 ? u : Number.NaN;
}

/**
 * Width (m) of a symmetric stripline with characteristic impedance `z0` between planes
 * `heightM` apart, solved on striplineStatic. Throws a RangeError for bad inputs or when the
 * target needs w/b outside 1e-3 … 1e3 (the message gives the reachable impedance range).
 */
export function striplineWidthForZ0(input: StriplineSynthesisInput): StriplineSynthesisResult {
  const { z0, heightM, dk } = input;
  const thicknessM = input.thicknessM ?? 0;
  checkPositiveInput('z0', z0);
  validateStriplineGeometry({ widthM: heightM, heightM, dk, thicknessM });
  const at = (u: number) => striplineStatic({ widthM: u * heightM, heightM, dk, thicknessM });
  let evaluations = 0;
  const g = (u: number) => {
    evaluations++;
    return Math.log(at(u).z0 / z0);
  };
  const [lo, hi] = [STRIPLINE_SYNTHESIS_U_MIN, STRIPLINE_SYNTHESIS_U_MAX];
  const [gLo, gHi] = [g(lo), g(hi)];
  if (!(gLo >= 0 && gHi <= 0)) {
    throw new RangeError(
      `Z0 = ${z0} Ω is not reachable in this stripline: w/b from ${lo} to ${hi} ` +
        `gives ${(z0 * Math.exp(gLo)).toPrecision(4)} Ω down to ${(z0 * Math.exp(gHi)).toPrecision(4)} Ω`,
    );
  }
  const u0 = closedFormStriplineWidthRatio(z0, dk, thicknessM / heightM);
  // The closed-form start is usually good to ~1 %: bracket it within ±5 % first.
  const u = findRootNearStart(g, lo, hi, u0, 0.05, { relTol: 1e-14 });
  const result = at(u);
  return {
    widthM: u * heightM,
    initialWidthM: u0 * heightM,
    z0: result.z0,
    epsEff: result.epsEff,
    evaluations,
    notes: result.notes,
  };
}
