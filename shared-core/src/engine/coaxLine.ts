/**
 * Coaxial line, exact TEM result for concentric round conductors:
 *   Z0 = η0 / (2π·√εr) · ln(D/d),  εeff = εr
 * with d the inner conductor's outer diameter and D the outer conductor's inner diameter.
 * Source: Pozar, Microwave Engineering, 4th ed., Example 2.1 / Table 2.1 (Z0 = √(μ/ε)·ln(b/a)/2π).
 * Validity: exact for the TEM mode below the first higher-order (TE11) cutoff,
 * fc ≈ c0 / (π·√εr·(D + d)/2) (Pozar §3.5, approximate).
 */
import { eta0 } from './constants.js';
import { c0 } from './constants.js';
import { temDielectricAlpha } from './idealLine.js';
import type { LineModel, ValidityNote } from './types.js';

export interface CoaxSpec {
  innerDiameterM: number;
  outerDiameterM: number;
  dk: number;
  df?: number;
}

/** Exact coaxial Z0, Ω. */
export function coaxZ0(innerDiameterM: number, outerDiameterM: number, dk: number): number {
  return (eta0 / (2 * Math.PI * Math.sqrt(dk))) * Math.log(outerDiameterM / innerDiameterM);
}

/** Approximate TE11 cutoff, Hz: the circumference-average rule kc ≈ 2/(a + b). */
export function coaxTe11Cutoff(innerDiameterM: number, outerDiameterM: number, dk: number): number {
  return c0 / (Math.PI * Math.sqrt(dk) * ((innerDiameterM + outerDiameterM) / 2));
}

/** Checks a coax geometry; throws RangeError on impossible input. */
export function checkCoax(spec: CoaxSpec): void {
  const { innerDiameterM: d, outerDiameterM: D, dk, df = 0 } = spec;
  if (!(d > 0) || !Number.isFinite(d)) throw new RangeError(`inner diameter must be positive, got ${d} m`);
  if (!(D > d) || !Number.isFinite(D)) throw new RangeError('outer diameter must be larger than the inner diameter');
  if (!(dk >= 1) || !Number.isFinite(dk)) throw new RangeError(`dk must be at least 1, got ${dk}`);
  if (!(df >= 0)) throw new RangeError(`df must be a non-negative loss tangent, got ${df}`);
}

/** Validity notes at a frequency: above TE11 cutoff the single-mode TEM result no longer holds. */
export function coaxNotes(spec: CoaxSpec, frequencyHz: number): ValidityNote[] {
  const fc = coaxTe11Cutoff(spec.innerDiameterM, spec.outerDiameterM, spec.dk);
  return frequencyHz > fc
    ? [{
        model: 'coaxial TEM',
        parameter: 'f',
        value: frequencyHz,
        max: fc,
        message: `above the TE11 cutoff (≈ ${(fc / 1e9).toPrecision(3)} GHz) the line is no longer single-mode`,
      }]
    : [];
}

/** Coaxial line as a LineModel (dielectric loss only). */
export function coaxLine(spec: CoaxSpec): LineModel {
  checkCoax(spec);
  const z0 = coaxZ0(spec.innerDiameterM, spec.outerDiameterM, spec.dk);
  const df = spec.df ?? 0;
  return (f) => ({ z0, epsEff: spec.dk, alpha: temDielectricAlpha(spec.dk, df, f) });
}
