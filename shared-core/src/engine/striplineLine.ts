/**
 * Symmetric stripline as a LineModel: Z0, εeff and dielectric attenuation at any frequency ≥ 0.
 *
 * Z0 and εeff = εr: striplineStatic.ts (Cohn 1954 exact for t = 0; Wheeler 1978 equivalent
 * width for t > 0). Quasi-static: stripline is a pure TEM line, so Z0 and εeff do not depend on
 * frequency below the first higher-order mode; that cutoff is not checked here.
 * Loss: dielectric only, the TEM form α_d = k·tanδ/2 = π·f·√εr·tanδ/c0 Np/m (Pozar, Microwave
 * Engineering, 4th ed., §2.7; equation number from memory), the same as idealLine.ts. Conductor
 * loss is not included yet. Validity notes are available from striplineStatic() for the same inputs.
 */
import { temDielectricAlpha } from './idealLine.js';
import { checkPositiveInput } from './microstripStatic.js';
import { type StriplineGeometry, striplineStatic } from './striplineStatic.js';
import type { LineModel } from './types.js';

export interface StriplineLineInput extends StriplineGeometry {
  /** Dielectric loss tangent tanδ (≥ 0, default 0). */
  df?: number;
}

/**
 * Adapts a symmetric stripline to the LineModel shape. Geometry and tanδ are checked once here
 * (RangeError on bad input); the returned function throws a RangeError for f < 0 or non-finite f.
 */
export function striplineLine(input: StriplineLineInput): LineModel {
  const df = input.df ?? 0;
  checkPositiveInput('df', df, true);
  const { z0, epsEff } = striplineStatic(input);
  return (frequencyHz: number) => {
    checkPositiveInput('frequencyHz', frequencyHz, true);
    return { z0, epsEff, alpha: temDielectricAlpha(epsEff, df, frequencyHz) };
  };
}
