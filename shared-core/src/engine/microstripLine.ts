/**
 * Microstrip as a LineModel: Z0(f), εeff(f), dielectric and (optionally) conductor attenuation at
 * any frequency ≥ 0.
 *
 * Z0 and εeff: Hammerstad–Jensen 1980 (static, with thickness), Kirschning–Jansen 1982 (εeff(f))
 * and Jansen–Kirschning 1983 (Z0(f)); see microstripStatic.ts and microstripDispersion.ts.
 * Dielectric loss: α_d = k0·εr·(εeff − 1)·tanδ / (2·√εeff·(εr − 1)) Np/m
 * (Pozar, Microwave Engineering, 4th ed., eq. 3.198), evaluated with the dispersive εeff(f),
 * so that α_d tends to the bulk value k0·√εr·tanδ/2 as the field moves into the substrate.
 * Conductor loss (optional, when `conductivity` is given): Wheeler's incremental-inductance rule on
 * the Hammerstad–Jensen air impedance, α_c = R′(f)/(2·Z0(f)), with the roughness factor of skin.ts;
 * see conductorLoss.ts. Without `conductivity` the line has dielectric loss only, as before.
 * Validity: that of the models above; validity notes are available from microstripAt() and
 * microstripConductorNotes() for the same inputs.
 */
import { microstripConductorResistanceModel } from './conductorLoss.js';
import { c0 } from './constants.js';
import type { LossyLineModel } from './lineLoss.js';
import { microstripAtFromStatic } from './microstripDispersion.js';
import { type MicrostripGeometry, microstripStatic, checkPositiveInput } from './microstripStatic.js';
import type { RoughnessModel } from './skin.js';
import type { LineModel } from './types.js';

export interface MicrostripLineInput extends MicrostripGeometry {
  /** Dielectric loss tangent tanδ (≥ 0, default 0). */
  df?: number;
  /**
   * Conductivity σ of strip and ground, S/m (> 0). Omitted: no conductor loss (dielectric loss
   * only). Copper: `sigmaCopperAnnealed` (5.8e7). Needs thicknessM > 0.
   */
  conductivity?: number;
  /** rms surface roughness Δ of the copper, m (≥ 0, default 0); needs `conductivity`. */
  roughnessM?: number;
  /** Roughness correction (default 'hammerstad-bekkadal'). */
  roughnessModel?: RoughnessModel;
}

/** Below this εr − 1 the filling factor is taken from a nearby εr to avoid 0/0. */
const DK_AIR_STEP = 1e-6;

/**
 * Dielectric attenuation of a quasi-TEM line, Np/m (Pozar 4th ed. eq. 3.198):
 * α_d = k0·εr·q·tanδ / (2·√εeff), with filling factor q = (εeff − 1)/(εr − 1), k0 = 2πf/c0.
 * Pass `fillingFactor` when εr = 1 (where q is 0/0).
 */
export function quasiTemDielectricAlpha(dk: number, epsEff: number, lossTangent: number, frequencyHz: number, fillingFactor = (epsEff - 1) / (dk - 1)): number {
  if (lossTangent === 0 || frequencyHz === 0) return 0;
  const k0 = (2 * Math.PI * frequencyHz) / c0;
  return (k0 * dk * fillingFactor * lossTangent) / (2 * Math.sqrt(epsEff));
}

/**
 * Microstrip with its attenuation split into α_c and α_d (Np/m). Geometry, tanδ and conductor are
 * checked once here (RangeError on bad input, including conductor loss asked for on a strip of zero
 * thickness); the returned function throws a RangeError for f < 0 or non-finite f. At f = 0 it
 * returns the static Z0 and εeff with no loss.
 */
export function microstripLossyLine(input: MicrostripLineInput): LossyLineModel {
  const df = input.df ?? 0;
  checkPositiveInput('df', df, true);
  if (input.roughnessM !== undefined && input.conductivity === undefined) {
    throw new RangeError('roughnessM applies to conductor loss: also give conductivity (5.8e7 S/m for copper)');
  }
  const geometry: MicrostripGeometry = { widthM: input.widthM, heightM: input.heightM, dk: input.dk, thicknessM: input.thicknessM ?? 0 };
  const stat = microstripStatic(geometry);
  const resistance = input.conductivity === undefined
    ? null
    : microstripConductorResistanceModel(geometry, { conductivity: input.conductivity, roughnessM: input.roughnessM, roughnessModel: input.roughnessModel });
  const nearAir = input.dk - 1 < DK_AIR_STEP;
  const statNearby = nearAir ? microstripStatic({ ...geometry, dk: 1 + DK_AIR_STEP }) : stat;
  return (frequencyHz: number) => {
    const at = microstripAtFromStatic(stat, input.dk, input.heightM, frequencyHz);
    let q = (at.epsEff - 1) / (input.dk - 1);
    if (nearAir && df > 0 && frequencyHz > 0) {
      q = (microstripAtFromStatic(statNearby, 1 + DK_AIR_STEP, input.heightM, frequencyHz).epsEff - 1) / DK_AIR_STEP;
    }
    const alphaD = df > 0 ? quasiTemDielectricAlpha(input.dk, at.epsEff, df, frequencyHz, q) : 0;
    const alphaC = resistance === null ? 0 : resistance(frequencyHz) / (2 * at.z0);
    return { z0: at.z0, epsEff: at.epsEff, alphaC, alphaD, alpha: alphaC + alphaD };
  };
}

/**
 * Adapts a microstrip line to the LineModel shape (α = α_c + α_d; see microstripLossyLine for the
 * split and the input checks). At f = 0 it returns the static Z0 and εeff with α = 0.
 */
export function microstripLine(input: MicrostripLineInput): LineModel {
  const lossy = microstripLossyLine(input);
  return (frequencyHz: number) => {
    const at = lossy(frequencyHz);
    return { z0: at.z0, epsEff: at.epsEff, alpha: at.alpha };
  };
}
