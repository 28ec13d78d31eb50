/**
 * Coplanar waveguide synthesis: the centre strip width s that gives a target Z0 for a fixed slot
 * width g, substrate and backing.
 *
 * The engine's bracketed root finder (rootFind.ts) on ln(Z0(s)/Z0target) of the analysis model
 * (coplanarStatic.ts), in the variable ln(s/g), so that analysis(synthesis(Z)) = Z to about
 * 1e-12 relative. With g fixed, Z0 falls monotonically as s grows: k0 = s/(s + 2g), k1 and k3 all
 * grow with s, and so do both the capacitance with the substrate and the one in air
 * (Z0 = 1/(c0·√(C·C_air))). So the root is unique.
 * Search range 1e-3 ≤ s/g ≤ 1e3; targets outside it throw a RangeError naming the reachable range.
 */
import { type CoplanarGeometry, coplanarStatic, validateCoplanarGeometry } from './coplanarStatic.js';
import { checkPositiveInput } from './microstripStatic.js';
import { findRoot } from './rootFind.js';
import type { ValidityNote } from './types.js';

export const COPLANAR_SYNTHESIS_S_OVER_G_MIN = 1e-3;
export const COPLANAR_SYNTHESIS_S_OVER_G_MAX = 1e3;

export interface CoplanarSynthesisInput extends Omit<CoplanarGeometry, 'widthM'> {
  /** Target characteristic impedance, Ω (> 0). */
  z0: number;
}

export interface CoplanarSynthesisResult {
  /** Centre strip width s, m. */
  widthM: number;
  /** Z0 of the analysis model at `widthM`, Ω. */
  z0: number;
  /** εeff of the analysis model at `widthM`. */
  epsEff: number;
  /** Evaluations of the analysis model used, including the range check. */
  evaluations: number;
  notes: ValidityNote[];
}

/**
 * Centre strip width (m) of a CPW (or conductor-backed CPW) with characteristic impedance `z0`,
 * for the given slot width, substrate and backing, solved on coplanarStatic. Throws a RangeError
 * for bad inputs or when the target needs s/g outside 1e-3 … 1e3.
 */
export function coplanarWidthForZ0(input: CoplanarSynthesisInput): CoplanarSynthesisResult {
  const { z0, ...rest } = input;
  checkPositiveInput('z0', z0);
  checkPositiveInput('gapM', rest.gapM);
  validateCoplanarGeometry({ ...rest, widthM: rest.gapM });
  const at = (sOverG: number) => coplanarStatic({ ...rest, widthM: sOverG * rest.gapM });
  // Solve in y = ln(s/g) − ln(min) + 1 ∈ [1, 14.8]: smooth in both the narrow and the wide limit,
  // and never near 0, where a relative tolerance on y would mean nothing.
  const lnMin = Math.log(COPLANAR_SYNTHESIS_S_OVER_G_MIN);
  const sOverG = (y: number) => Math.exp(y - 1 + lnMin);
  let evaluations = 0;
  const g = (y: number) => {
    evaluations++;
    return Math.log(at(sOverG(y)).z0 / z0);
  };
  const [lo, hi] = [1, Math.log(COPLANAR_SYNTHESIS_S_OVER_G_MAX) - lnMin + 1];
  const [gLo, gHi] = [g(lo), g(hi)];
  if (!(gLo >= 0 && gHi <= 0)) {
    throw new RangeError(
      `Z0 = ${z0} Ω is not reachable with this gap and substrate: s/g from ${COPLANAR_SYNTHESIS_S_OVER_G_MIN} to ` +
        `${COPLANAR_SYNTHESIS_S_OVER_G_MAX} gives ${(z0 * Math.exp(gLo)).toPrecision(4)} Ω down to ` +
        `${(z0 * Math.exp(gHi)).toPrecision(4)} Ω; change the gap to move that range`,
    );
  }
  const y = findRoot(g, lo, hi, { relTol: 1e-15 });
  const result = at(sOverG(y));
  return { widthM: sOverG(y) * rest.gapM, z0: result.z0, epsEff: result.epsEff, evaluations, notes: result.notes };
}
