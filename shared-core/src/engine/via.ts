/**
 * Inductance of a via hole that grounds a microstrip through the substrate.
 *
 * Source: M. E. Goldfarb and R. A. Pucel, "Modeling via hole grounds in microstrip", IEEE Microwave
 * and Guided Wave Letters 1(6), 1991, pp. 135–137:
 *   L = (μ0/2π)·[h·ln((h + √(r² + h²))/r) + 1.5·(r − √(r² + h²))]
 * with h the via length (substrate height) and r the via RADIUS (half the drilled or plated
 * diameter; ENGINEERING.md pitfall 7). The formula was checked against two independent
 * restatements; the paper itself was not available, so no equation number is quoted.
 *
 * Validity: the authors verified the model numerically and experimentally for h < 0.03·λ0 (as
 * restated in a secondary source; not confirmed against the paper). It describes one cylindrical via
 * to the ground plane under the strip with no nearby return vias and ignores the pad; several vias
 * side by side couple and do not simply divide L by their number.
 */
import { c0, mu0 } from './constants.js';
import { checkPositiveInput } from './microstripStatic.js';
import type { ValidityNote } from './types.js';

export const GP_MODEL = 'Goldfarb–Pucel 1991';

/** Largest h/λ0 for which the authors verified the model. */
export const GP_MAX_HEIGHT_WAVELENGTHS = 0.03;

export interface ViaGeometry {
  /** Via length: the substrate height h between the strip and the ground plane, m (> 0). */
  heightM: number;
  /** Via (drill) diameter D, m (> 0). The model uses the radius r = D/2. */
  diameterM: number;
}

export interface ViaResult {
  inductanceH: number;
  notes: ValidityNote[];
}

/**
 * Goldfarb–Pucel via inductance, H, from height h and RADIUS r (both m, > 0).
 * L = (μ0/2π)·[h·ln((h + √(r² + h²))/r) + 1.5·(r − √(r² + h²))].
 */
export function goldfarbPucelInductance(heightM: number, radiusM: number): number {
  const a = Math.hypot(radiusM, heightM);
  return (mu0 / (2 * Math.PI)) * (heightM * Math.log((heightM + a) / radiusM) + 1.5 * (radiusM - a));
}

/**
 * Inductance of a via of drilled diameter D through a substrate of height h (Goldfarb–Pucel 1991).
 * With `frequencyHz`, a ValidityNote is given when h exceeds 0.03·λ0. Throws a RangeError for a
 * non-finite or non-positive height or diameter.
 */
export function viaInductance(via: ViaGeometry, frequencyHz?: number): ViaResult {
  checkPositiveInput('heightM', via.heightM);
  checkPositiveInput('diameterM', via.diameterM);
  const inductanceH = goldfarbPucelInductance(via.heightM, via.diameterM / 2);
  const notes: ValidityNote[] = [];
  if (frequencyHz !== undefined) {
    checkPositiveInput('frequencyHz', frequencyHz);
    const hOverLambda = (via.heightM * frequencyHz) / c0;
    if (hOverLambda > GP_MAX_HEIGHT_WAVELENGTHS) {
      notes.push({
        model: GP_MODEL,
        parameter: 'h/λ0',
        value: hOverLambda,
        max: GP_MAX_HEIGHT_WAVELENGTHS,
        message: `h/λ0 = ${hOverLambda.toPrecision(3)} is above ${GP_MAX_HEIGHT_WAVELENGTHS} (range verified by Goldfarb & Pucel 1991); the via is no longer a lumped inductance, use a thinner substrate or a lower frequency`,
      });
    }
  }
  return { inductanceH, notes };
}
