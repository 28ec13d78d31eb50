/**
 * Coaxial line, exact TEM result for concentric round conductors:
 *   Z0 = η0 / (2π·√εr) · ln(D/d),  εeff = εr
 * with d the inner conductor's outer diameter and D the outer conductor's inner diameter.
 * Source: Pozar, Microwave Engineering, 4th ed., Example 2.1 / Table 2.1 (Z0 = √(μ/ε)·ln(b/a)/2π).
 * Validity: exact for the TEM mode below the first higher-order (TE11) cutoff,
 * fc ≈ c0 / (π·√εr·(D + d)/2) (Pozar §3.5, approximate).
 * Loss: dielectric α_d = k·tanδ/2 (idealLine.ts) and, when `conductivity` is given, the exact
 * conductor loss α_c = Rs·(1/a + 1/b)/(2·η·ln(b/a)) with a roughness factor (conductorLoss.ts).
 */
import { coaxConductorAlpha } from './conductorLoss.js';
import { eta0 } from './constants.js';
import { c0 } from './constants.js';
import { temDielectricAlpha } from './idealLine.js';
import type { LossyLineModel } from './lineLoss.js';
import { checkPositiveInput } from './microstripStatic.js';
import type { RoughnessModel } from './skin.js';
import type { LineModel, ValidityNote } from './types.js';

export interface CoaxSpec {
  innerDiameterM: number;
  outerDiameterM: number;
  dk: number;
  df?: number;
  /** Conductivity σ of both conductors, S/m (> 0). Omitted: no conductor loss. Copper: 5.8e7. */
  conductivity?: number;
  /** rms surface roughness Δ of the conductors, m (≥ 0, default 0); needs `conductivity`. */
  roughnessM?: number;
  /** Roughness correction (default 'hammerstad-bekkadal'). */
  roughnessModel?: RoughnessModel;
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
  if (spec.conductivity !== undefined) checkPositiveInput('conductivity', spec.conductivity);
  if (spec.roughnessM !== undefined) {
    if (spec.conductivity === undefined) throw new RangeError('roughnessM applies to conductor loss: also give conductivity (5.8e7 S/m for copper)');
    checkPositiveInput('roughnessM', spec.roughnessM, true);
  }
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

/** Coaxial line with its attenuation split into α_c and α_d (Np/m); RangeError on bad input. */
export function coaxLossyLine(spec: CoaxSpec): LossyLineModel {
  checkCoax(spec);
  const z0 = coaxZ0(spec.innerDiameterM, spec.outerDiameterM, spec.dk);
  const df = spec.df ?? 0;
  const conductor = { conductivity: spec.conductivity, roughnessM: spec.roughnessM, roughnessModel: spec.roughnessModel };
  return (f) => {
    const alphaC = spec.conductivity === undefined ? 0 : coaxConductorAlpha(spec, f, conductor);
    const alphaD = temDielectricAlpha(spec.dk, df, f);
    return { z0, epsEff: spec.dk, alphaC, alphaD, alpha: alphaC + alphaD };
  };
}

/** Coaxial line as a LineModel: dielectric loss, plus conductor loss when `conductivity` is given. */
export function coaxLine(spec: CoaxSpec): LineModel {
  const lossy = coaxLossyLine(spec);
  return (f) => {
    const at = lossy(f);
    return { z0: at.z0, epsEff: at.epsEff, alpha: at.alpha };
  };
}
