/**
 * Ideal TEM line described by its characteristic impedance and either the effective
 * permittivity (Dk of a homogeneous fill) or the velocity factor v/c0 = 1/√εeff.
 *
 * Source: definition of a TEM line (Pozar, Microwave Engineering, 4th ed., §2.1).
 * Optional dielectric loss of a homogeneous TEM fill: α_d = (k0·√εr·tanδ)/2 = π·f·√εr·tanδ/c0
 * (α_d = k·tanδ/2 for a TEM line, Pozar §2.7; equation number from memory).
 * Validity: any frequency; no dispersion.
 */
import { c0 } from './constants.js';
import type { LineModel } from './types.js';

export interface IdealLineSpec {
  z0: number;
  /** Effective relative permittivity (use either this or velocityFactor). */
  epsEff?: number;
  /** Velocity factor v/c0 in (0, 1]. */
  velocityFactor?: number;
  /** Loss tangent of the fill (0 = lossless). */
  df?: number;
}

/** Effective permittivity implied by a velocity factor: εeff = 1/VF². */
export const epsEffFromVelocityFactor = (vf: number): number => 1 / (vf * vf);

/** TEM dielectric attenuation α_d = π·f·√εr·tanδ / c0, Np/m. */
export function temDielectricAlpha(epsR: number, df: number, frequencyHz: number): number {
  return (Math.PI * frequencyHz * Math.sqrt(epsR) * df) / c0;
}

/** Builds a dispersion-free LineModel; throws RangeError on non-physical input. */
export function idealLine(spec: IdealLineSpec): LineModel {
  const { z0, df = 0 } = spec;
  if (!(z0 > 0) || !Number.isFinite(z0)) throw new RangeError(`z0 must be a positive impedance, got ${z0} Ω`);
  if (spec.epsEff !== undefined && spec.velocityFactor !== undefined) {
    throw new RangeError('give either dk or velocity, not both');
  }
  let epsEff = 1;
  if (spec.velocityFactor !== undefined) {
    const vf = spec.velocityFactor;
    if (!(vf > 0 && vf <= 1)) throw new RangeError(`velocity factor must lie in (0, 1], got ${vf}`);
    epsEff = epsEffFromVelocityFactor(vf);
  } else if (spec.epsEff !== undefined) {
    if (!(spec.epsEff >= 1) || !Number.isFinite(spec.epsEff)) {
      throw new RangeError(`dk must be at least 1, got ${spec.epsEff}`);
    }
    epsEff = spec.epsEff;
  }
  if (!(df >= 0) || !Number.isFinite(df)) throw new RangeError(`df must be a non-negative loss tangent, got ${df}`);
  return (f) => ({ z0, epsEff, alpha: temDielectricAlpha(epsEff, df, f) });
}
