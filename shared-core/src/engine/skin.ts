/**
 * Skin effect: skin depth, surface resistance and a surface-roughness correction.
 *
 * Skin depth δ = √(2/(ω·μ0·σ)) = 1/√(π·f·μ0·σ) and surface resistance Rs = 1/(σ·δ) = √(π·f·μ0/σ)
 * of a good, non-magnetic conductor (σ ≫ ω·ε0): Pozar, Microwave Engineering, 4th ed., §1.7 (plane
 * waves in a good conductor) and §1.8 (surface resistance); equation numbers from memory (≈ 1.129–1.131).
 * Valid while the conductor is several skin depths thick and its radius of curvature is ≫ δ.
 *
 * Roughness: the conductor loss of a rough surface is the smooth-surface loss times K ≥ 1.
 *  - Hammerstad–Bekkadal (default): K = 1 + (2/π)·atan(1.4·(Δ/δ)²), Δ the rms roughness.
 *    E. Hammerstad and F. Bekkadal, "Microstrip Handbook", ELAB report STF44 A74169, University of
 *    Trondheim, 1975 (formula as restated in later literature; the report was not available to check).
 *    An empirical fit to grooves across the current; it saturates at K = 2 (Δ ≫ δ), so it cannot
 *    describe foils whose measured loss rises more than twofold.
 *  - Groiss: K = 1 + exp(−(δ/(2Δ))^1.6). S. Groiss, I. Bardi, O. Biro, K. Preis and K. R. Richter,
 *    "Parameters of lossy cavity resonators calculated by the finite element method", IEEE Trans.
 *    Magnetics 32(3), 1996, pp. 894–897 (from memory). Also saturates at 2; it rises later and
 *    more steeply: below Hammerstad–Bekkadal for Δ/δ < 0.26, above it up to Δ/δ ≈ 2.4
 *    (1.72 against 1.61 at Δ = δ).
 */
import { mu0, sigmaCopperAnnealed } from './constants.js';
import { checkPositiveInput } from './microstripStatic.js';

export type RoughnessModel = 'hammerstad-bekkadal' | 'groiss';

export const HB_ROUGHNESS_MODEL = 'Hammerstad–Bekkadal 1975';
export const GROISS_ROUGHNESS_MODEL = 'Groiss 1996';

function checkConductor(frequencyHz: number, conductivity: number): void {
  checkPositiveInput('frequencyHz', frequencyHz, true);
  checkPositiveInput('conductivity', conductivity);
}

/**
 * Skin depth δ = 1/√(π·f·μ0·σ), m (Pozar 4th ed. §1.7). Infinity at f = 0.
 * @param conductivity σ in S/m (default annealed copper, 5.8e7 S/m)
 */
export function skinDepth(frequencyHz: number, conductivity: number = sigmaCopperAnnealed): number {
  checkConductor(frequencyHz, conductivity);
  return 1 / Math.sqrt(Math.PI * frequencyHz * mu0 * conductivity);
}

/**
 * Surface resistance Rs = √(π·f·μ0/σ) = 1/(σ·δ), Ω per square (Pozar 4th ed. §1.8). 0 at f = 0.
 * @param conductivity σ in S/m (default annealed copper, 5.8e7 S/m)
 */
export function surfaceResistance(frequencyHz: number, conductivity: number = sigmaCopperAnnealed): number {
  checkConductor(frequencyHz, conductivity);
  return Math.sqrt((Math.PI * frequencyHz * mu0) / conductivity);
}

/** Hammerstad–Bekkadal 1975: K = 1 + (2/π)·atan(1.4·(Δ/δ)²); 1 at Δ = 0, → 2 for Δ ≫ δ. */
export function hammerstadBekkadalRoughness(roughnessOverSkinDepth: number): number {
  return 1 + (2 / Math.PI) * Math.atan(1.4 * roughnessOverSkinDepth ** 2);
}

/** Groiss 1996: K = 1 + exp(−(δ/(2Δ))^1.6); 1 at Δ = 0, → 2 for Δ ≫ δ. */
export function groissRoughness(roughnessOverSkinDepth: number): number {
  if (roughnessOverSkinDepth === 0) return 1;
  return 1 + Math.exp(-Math.pow(1 / (2 * roughnessOverSkinDepth), 1.6));
}

/**
 * Conductor-loss factor K(Δ, δ) ∈ [1, 2) of a surface with rms roughness Δ at skin depth δ.
 * Throws a RangeError for negative or non-finite roughness or a non-positive skin depth.
 * @param roughnessRmsM Δ, rms surface roughness, m (≥ 0; 0 = smooth)
 * @param skinDepthM δ, m (> 0; Infinity, i.e. f = 0, gives 1)
 */
export function roughnessFactor(roughnessRmsM: number, skinDepthM: number, model: RoughnessModel = 'hammerstad-bekkadal'): number {
  checkPositiveInput('roughnessM', roughnessRmsM, true);
  if (!(skinDepthM > 0)) throw new RangeError(`skin depth must be > 0, got ${skinDepthM}`);
  const ratio = roughnessRmsM / skinDepthM;
  return model === 'groiss' ? groissRoughness(ratio) : hammerstadBekkadalRoughness(ratio);
}
