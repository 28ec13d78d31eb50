/**
 * Coplanar waveguide (with or without a backing plane) as a LineModel: Z0, εeff and dielectric
 * attenuation at any frequency ≥ 0.
 *
 * Z0 and εeff: coplanarStatic.ts (Ghione–Naldi 1984 without backing, 1983 with it; zero
 * thickness). Quasi-static: no dispersion model, so Z0 and εeff do not change with frequency
 * (CPW dispersion grows as the substrate approaches a quarter wavelength thick).
 * Loss: dielectric only, the quasi-TEM filling-factor form α_d = k0·εr·q·tanδ/(2√εeff) Np/m
 * (Pozar, Microwave Engineering, 4th ed., eq. 3.198, as in microstripLine.ts), with the filling
 * factor q taken from the conformal map itself (so εr = 1 needs no special case).
 * Conductor loss: coplanarConductorLoss.ts (added by the sheet with withConductorLoss). Validity
 * notes are available from coplanarStatic().
 */
import { type CoplanarGeometry, coplanarStatic } from './coplanarStatic.js';
import { quasiTemDielectricAlpha } from './microstripLine.js';
import { checkPositiveInput } from './microstripStatic.js';
import type { LineModel } from './types.js';

export interface CoplanarLineInput extends CoplanarGeometry {
  /** Dielectric loss tangent tanδ (≥ 0, default 0). */
  df?: number;
}

/**
 * Adapts a CPW to the LineModel shape. Geometry and tanδ are checked once here (RangeError on bad
 * input); the returned function throws a RangeError for f < 0 or non-finite f.
 */
export function coplanarLine(input: CoplanarLineInput): LineModel {
  const df = input.df ?? 0;
  checkPositiveInput('df', df, true);
  const { z0, epsEff, fillingFactor } = coplanarStatic(input);
  return (frequencyHz: number) => {
    checkPositiveInput('frequencyHz', frequencyHz, true);
    return { z0, epsEff, alpha: quasiTemDielectricAlpha(input.dk, epsEff, df, frequencyHz, fillingFactor) };
  };
}
