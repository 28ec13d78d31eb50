/**
 * Conductor attenuation α_c of coaxial and microstrip lines, Np/m.
 *
 * Wheeler's incremental-inductance rule: H. A. Wheeler, "Formulas for the skin effect", Proc. IRE
 * 30(9), 1942, pp. 412–424. A good conductor's surface impedance has equal resistance and reactance,
 * and its internal inductance equals that of a layer δ/2 thick; so the series resistance per metre is
 *   R′ = (Rs/μ0)·∂L′/∂n = (Rs/η0)·∂Z0air/∂n,
 * with n the recession of every current-carrying surface into its metal, L′ = Z0air/c0 the external
 * inductance per metre and Z0air the impedance of the same line in vacuum (the magnetic field does not
 * see the dielectric). Then α_c = R′/(2·Z0) with Z0 the line's own impedance. This is the form of
 * Pozar, Microwave Engineering, 4th ed., §2.7 ("The Wheeler incremental inductance rule",
 * α_c = Rs/(2·Z0·η)·dZ0/dl for a homogeneous fill, equation number from memory).
 *
 * - Coax: receding surfaces give a → a − n, b → b + n, so ∂Z0air/∂n = (η0/2π)·(1/a + 1/b) and
 *   α_c = Rs·(1/a + 1/b)/(2·η·ln(b/a)), η = η0/√εr: exact for the TEM mode (Pozar 4th ed. §2.7,
 *   coax example of the rule, and Table 2.1, R = (Rs/2π)·(1/a + 1/b); numbers from memory).
 * - Microstrip: both strip edges, the strip's top and bottom faces and the ground plane recede:
 *   w → w − 2n, t → t − 2n, h → h + 2n (at n = δ/2 the classic w − δ, t − δ, h + δ). Z0air is the
 *   Hammerstad–Jensen 1980 air impedance with the strip-thickness correction (microstripStatic.ts):
 *   Z0air = Z01(u + Δu1(u, t/h)). ∂Z0air/∂n is taken by a central difference with a step of 1e-4 of
 *   the smallest dimension (truncation ~1e-8, round-off ~1e-11 relative), i.e. the differential form
 *   of the rule; the finite recession by δ/2 differs from it by O(δ/t).
 * Roughness multiplies R′ (and α_c) by K(Δ, δ) from skin.ts.
 *
 * Validity: Wheeler's rule needs conductors several skin depths thick with radii of curvature ≫ δ
 * (Wheeler 1942, as restated by Pozar); a strip thinner than 3δ gets a ValidityNote (the factor 3 is
 * common practice, no source). A zero-thickness strip has no finite conductor loss under the rule
 * (the edge current is singular: ∂Δu1/∂t ~ ln(h/t)), so microstrip conductor loss needs t > 0.
 * The quasi-static current distribution is assumed at all frequencies. The microstrip result inherits
 * the Hammerstad–Jensen range (0.01 ≤ w/h ≤ 100). The accuracy of the derivative of their fit is not
 * published; test/microstrip-conductor-loss.test.ts measures ∂Z0air/∂n within −0.5 … +1.3 % of a
 * numerical field solution for w/h 0.2–10, t/h 0.02–0.05, and compares Pucel–Massé–Hartwig 1968.
 */
import { eta0, sigmaCopperAnnealed } from './constants.js';
import type { CoaxSpec } from './coaxLine.js';
import { type MicrostripGeometry, checkPositiveInput, hjAirImpedance, hjThicknessCorrection, microstripStatic, validateMicrostripGeometry } from './microstripStatic.js';
import { type RoughnessModel, roughnessFactor, skinDepth, surfaceResistance } from './skin.js';
import type { ValidityNote } from './types.js';

export const WHEELER_MODEL = 'Wheeler 1942 incremental inductance';

/** The conductor metal: conductivity and surface roughness. */
export interface ConductorSpec {
  /** Conductivity σ, S/m (> 0; default annealed copper, 5.8e7 S/m). */
  conductivity?: number;
  /** rms surface roughness Δ, m (≥ 0; default 0 = smooth). */
  roughnessM?: number;
  /** Roughness correction (default 'hammerstad-bekkadal'). */
  roughnessModel?: RoughnessModel;
}

/** Relative central-difference step for ∂Z0air/∂n, as a fraction of the smallest dimension. */
const RECESSION_STEP = 1e-4;

/** Checks conductivity and roughness; throws a RangeError naming the bad field. */
export function checkConductor(conductor: ConductorSpec): void {
  checkPositiveInput('conductivity', conductor.conductivity ?? sigmaCopperAnnealed);
  checkPositiveInput('roughnessM', conductor.roughnessM ?? 0, true);
}

/**
 * Series resistance per metre from Wheeler's rule, Ω/m: R′ = K(Δ, δ)·Rs·(∂Z0air/∂n)/η0.
 * 0 at f = 0 (the rule describes skin-effect loss only).
 * @param airImpedanceSlope ∂Z0air/∂n of the line, Ω/m
 */
export function wheelerResistance(airImpedanceSlope: number, frequencyHz: number, conductor: ConductorSpec = {}): number {
  const sigma = conductor.conductivity ?? sigmaCopperAnnealed;
  const rs = surfaceResistance(frequencyHz, sigma);
  if (rs === 0) return 0;
  const k = roughnessFactor(conductor.roughnessM ?? 0, skinDepth(frequencyHz, sigma), conductor.roughnessModel);
  return (k * rs * airImpedanceSlope) / eta0;
}

/**
 * ∂Z0air/∂n by a central difference, Ω/m, for any line whose vacuum impedance is known as a
 * function of the recession n of all its conductor surfaces (Wheeler 1942).
 * @param airImpedanceAt Z0air with every surface receded by n (n may be slightly negative), Ω
 * @param stepM difference step, m; small against every dimension that recedes
 */
export function wheelerAirImpedanceSlope(airImpedanceAt: (recessionM: number) => number, stepM: number): number {
  return (airImpedanceAt(stepM) - airImpedanceAt(-stepM)) / (2 * stepM);
}

/** Hammerstad–Jensen air impedance with thickness, Z01(u + Δu1), of a strip w × t at height h, Ω. */
export function microstripAirImpedance(widthM: number, heightM: number, thicknessM: number): number {
  const u = widthM / heightM;
  return hjAirImpedance(u + hjThicknessCorrection(u, thicknessM / heightM, 1).du1);
}

function checkStripForConductorLoss(g: MicrostripGeometry): number {
  validateMicrostripGeometry(g);
  const t = g.thicknessM ?? 0;
  if (!(t > 0)) {
    throw new RangeError('conductor loss needs the strip thickness: set thicknessM > 0 (1 oz copper is about 35 µm)');
  }
  return t;
}

/**
 * ∂Z0air/∂n of a microstrip, Ω/m: every surface receded by n (w − 2n, t − 2n, h + 2n) in the
 * Hammerstad–Jensen air impedance. Throws a RangeError for bad geometry or zero thickness.
 */
export function microstripAirImpedanceSlope(g: MicrostripGeometry): number {
  const t = checkStripForConductorLoss(g);
  const { widthM: w, heightM: h } = g;
  const step = (RECESSION_STEP / 2) * Math.min(w, h, t);
  return wheelerAirImpedanceSlope((n) => microstripAirImpedance(w - 2 * n, h + 2 * n, t - 2 * n), step);
}

/**
 * Conductor series resistance per metre of a microstrip (strip and ground), Ω/m, as a function of
 * frequency; the geometry factor is computed once. Throws a RangeError for bad geometry, zero
 * thickness or a bad conductor; the returned function throws for f < 0.
 */
export function microstripConductorResistanceModel(g: MicrostripGeometry, conductor: ConductorSpec = {}): (frequencyHz: number) => number {
  checkConductor(conductor);
  const slope = microstripAirImpedanceSlope(g);
  return (frequencyHz) => wheelerResistance(slope, frequencyHz, conductor);
}

/**
 * Microstrip conductor attenuation α_c = R′/(2·Z0), Np/m (Wheeler 1942 on Hammerstad–Jensen 1980).
 * @param z0 the line impedance to divide by, Ω (default: the static Z0; the line model passes Z0(f))
 */
export function microstripConductorAlpha(g: MicrostripGeometry, frequencyHz: number, conductor: ConductorSpec = {}, z0?: number): number {
  const r = microstripConductorResistanceModel(g, conductor)(frequencyHz);
  return r / (2 * (z0 ?? microstripStatic(g).z0));
}

/**
 * Validity notes for microstrip conductor loss at f: a strip thinner than 3 skin depths is outside
 * Wheeler's rule (its loss is then underestimated; at DC the strip's resistance is 1/(σ·w·t)).
 */
export function microstripConductorNotes(g: MicrostripGeometry, frequencyHz: number, conductor: ConductorSpec = {}): ValidityNote[] {
  if (!(frequencyHz > 0)) return [];
  const delta = skinDepth(frequencyHz, conductor.conductivity ?? sigmaCopperAnnealed);
  const ratio = (g.thicknessM ?? 0) / delta;
  if (ratio >= 3) return [];
  return [{
    model: WHEELER_MODEL,
    parameter: 't/δ',
    value: ratio,
    min: 3,
    message: `strip thickness is ${ratio.toPrecision(3)} skin depths at ${(frequencyHz / 1e6).toPrecision(4)} MHz; Wheeler's rule needs several (≥ 3, common practice), so conductor loss is underestimated`,
  }];
}

/**
 * Coax conductor resistance per metre, Ω/m: R′ = K·Rs·(1/a + 1/b)/(2π), a = d/2, b = D/2
 * (Pozar 4th ed. Table 2.1, from memory; identical to Wheeler's rule for coax).
 */
export function coaxConductorResistance(innerDiameterM: number, outerDiameterM: number, frequencyHz: number, conductor: ConductorSpec = {}): number {
  checkConductor(conductor);
  const slope = (eta0 / (2 * Math.PI)) * (2 / innerDiameterM + 2 / outerDiameterM);
  return wheelerResistance(slope, frequencyHz, conductor);
}

/**
 * Coax conductor attenuation α_c = Rs·(1/a + 1/b)/(2·η·ln(b/a)), η = η0/√εr, times the roughness
 * factor, Np/m; exact for the TEM mode with walls many skin depths thick (Pozar 4th ed. §2.7).
 * Both conductors are taken to be of the same metal. Throws a RangeError on impossible geometry.
 */
export function coaxConductorAlpha(spec: CoaxSpec, frequencyHz: number, conductor: ConductorSpec = {}): number {
  const { innerDiameterM: d, outerDiameterM: D, dk } = spec;
  checkPositiveInput('innerDiameterM', d);
  if (!(D > d) || !Number.isFinite(D)) throw new RangeError('outer diameter must be larger than the inner diameter');
  if (!(dk >= 1) || !Number.isFinite(dk)) throw new RangeError(`dk must be at least 1, got ${dk}`);
  const eta = eta0 / Math.sqrt(dk);
  return coaxConductorResistance(d, D, frequencyHz, conductor) * Math.PI / (eta * Math.log(D / d));
}
