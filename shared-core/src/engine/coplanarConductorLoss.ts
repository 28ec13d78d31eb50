/**
 * Conductor attenuation α_c of a coplanar waveguide (centre strip s, slots g, metal thickness t), Np/m.
 *
 * Closed form of G. H. Owyang and T. T. Wu, "The approximate parameters of slot lines and their
 * complement", IRE Trans. Antennas Propag. AP-6(1), 1958, pp. 49–55, as restated for CPW by
 * G. Ghione, "A CAD-oriented analytical model for the losses of general asymmetric coplanar lines
 * in hybrid and monolithic MICs", IEEE Trans. MTT-41(9), 1993, pp. 1499–1510 (from memory; the
 * equation was not checked against either paper):
 *   α_c = Rs·√εeff / (480π·K(k)·K(k′)·(1 − k²)) · { (1/a)·[π + ln(4πa(1 − k)/(t(1 + k)))]
 *                                                 + (1/b)·[π + ln(4πb(1 − k)/(t(1 + k)))] },
 * a = s/2, b = s/2 + g, k = a/b. It is Wheeler's incremental-inductance rule (conductorLoss.ts) on
 * the conformal map: with Z0air = 30π·K(k′)/K(k) and α_c = R′/(2·Z0), R′ = (Rs/η0)·∂Z0air/∂n,
 *   ∂Z0air/∂n = (η0/8)·Σ / (K(k)²·(1 − k²)),   Σ = the braces above
 * (the printed 480π is 4·η0 with η0 rounded to 120π; η0 is used here, a 0.07 % difference).
 * Its π/a + π/b part is exactly the derivative of the zero-thickness map as the strip edges and the
 * ground edges recede (d(K′/K)/dk = −π/(2k·k′²·K²)); the logarithms replace the edge singularity of
 * a zero-thickness strip with the finite edge of a strip t thick. This identity is what
 * coplanarConductorLoss.test.ts checks, and test/coplanar-conductor-loss.test.ts compares ∂Z0air/∂n
 * with a field solution of a thick CPW in air: the closed form is 5–11 % LOW for t/g 0.03–0.13
 * (measured), so CPW conductor loss is underestimated by that much.
 *
 * The formula carries the current of the strip and of the two coplanar grounds of a CPW without a
 * backing plane. For grounded CPW it is used as it stands; measured against the field solver, in air,
 * with the backing plane receding too: −2 … +1 % for h = 0.7 … 1·(s + 2g), +8 % at h = 0.48·(s + 2g) and
 * +20 % at h = 0.36·(s + 2g) (the backing plane draws field from the slot edges, so the real loss is
 * LOWER). A ValidityNote where h < (s + 2g)/2. Roughness multiplies R′ by K(Δ, δ) from skin.ts, as
 * for the other lines.
 *
 * Validity: t ≪ s and t ≪ g (the strip edges must look like thin plates); notes where t > s/2 or
 * t > g/2 (common practice, no source) and where the metal is thinner than 3 skin depths, where the
 * logarithms' arguments fall below 1 the formula is no longer meaningful and a RangeError is thrown.
 * Needs t > 0: zero-thickness metal has no finite conductor loss under the rule.
 */
import { eta0, sigmaCopperAnnealed } from './constants.js';
import { type ConductorSpec, checkConductor, wheelerResistance } from './conductorLoss.js';
import { ellipticK } from './ellipticK.js';
import { checkPositiveInput } from './microstripStatic.js';
import { skinDepth } from './skin.js';
import type { ValidityNote } from './types.js';

export const OWYANG_WU_MODEL = 'Owyang–Wu 1958 (CPW conductor loss, restated by Ghione 1993)';

/** What the conductor-loss formula needs of a CPW: strip width, slot width and metal thickness, m. */
export interface CoplanarConductorGeometry {
  widthM: number;
  gapM: number;
  thicknessM: number;
}

function check(g: CoplanarConductorGeometry): void {
  checkPositiveInput('widthM', g.widthM);
  checkPositiveInput('gapM', g.gapM);
  checkPositiveInput('thicknessM', g.thicknessM, true);
  if (!(g.thicknessM > 0)) {
    throw new RangeError('conductor loss needs the metal thickness: set thicknessM > 0 (1 oz copper is about 35 µm)');
  }
}

/**
 * ∂Z0air/∂n of a CPW in Wheeler's sense (every metal surface receded by n), Ω/m, from the
 * Owyang–Wu closed form. Throws a RangeError for bad geometry, zero thickness, or metal so thick
 * against the strip or slot that the formula's logarithms turn negative.
 */
export function coplanarAirImpedanceSlope(g: CoplanarConductorGeometry): number {
  check(g);
  const a = g.widthM / 2;
  const b = a + g.gapM;
  const k = a / b;
  const kp = (2 * Math.sqrt(g.gapM * (g.widthM + g.gapM))) / (g.widthM + 2 * g.gapM); // √(1 − k²) without cancellation
  const edge = (x: number): number => {
    const arg = (4 * Math.PI * x * (1 - k)) / (g.thicknessM * (1 + k));
    if (!(arg > 1)) {
      throw new RangeError(`metal thickness ${g.thicknessM} m is too large against the strip and slot for the CPW conductor-loss formula (needs t ≪ s and t ≪ g)`);
    }
    return (Math.PI + Math.log(arg)) / x;
  };
  const kk = ellipticK(k, kp);
  return (eta0 * (edge(a) + edge(b))) / (8 * kk * kk * kp * kp);
}

/**
 * Conductor series resistance per metre of a CPW (strip and coplanar grounds), Ω/m, as a function
 * of frequency; the geometry factor is computed once. Throws a RangeError on bad input.
 */
export function coplanarConductorResistanceModel(g: CoplanarConductorGeometry, conductor: ConductorSpec = {}): (frequencyHz: number) => number {
  checkConductor(conductor);
  const slope = coplanarAirImpedanceSlope(g);
  return (frequencyHz) => wheelerResistance(slope, frequencyHz, conductor);
}

/**
 * CPW conductor attenuation α_c = R′/(2·Z0), Np/m.
 * @param z0 the line's impedance, Ω (the substrate's εeff enters through it: Z0 = Z0air/√εeff)
 */
export function coplanarConductorAlpha(g: CoplanarConductorGeometry, z0: number, frequencyHz: number, conductor: ConductorSpec = {}): number {
  checkPositiveInput('z0', z0);
  return coplanarConductorResistanceModel(g, conductor)(frequencyHz) / (2 * z0);
}

/** Validity notes of the CPW conductor-loss formula at f (thickness against strip, slot, skin depth and backing plane). */
export function coplanarConductorNotes(g: CoplanarConductorGeometry & { heightM?: number; grounded?: boolean }, frequencyHz: number, conductor: ConductorSpec = {}): ValidityNote[] {
  const notes: ValidityNote[] = [];
  const t = g.thicknessM;
  if (t > g.widthM / 2) {
    notes.push({ model: OWYANG_WU_MODEL, parameter: 't/s', value: t / g.widthM, max: 0.5, message: `metal thickness is ${(t / g.widthM).toPrecision(3)} of the strip width; the CPW conductor-loss formula assumes t ≪ s (note above 0.5, common practice, no source)` });
  }
  if (t > g.gapM / 2) {
    notes.push({ model: OWYANG_WU_MODEL, parameter: 't/g', value: t / g.gapM, max: 0.5, message: `metal thickness is ${(t / g.gapM).toPrecision(3)} of the slot width; the CPW conductor-loss formula assumes t ≪ g (note above 0.5, common practice, no source)` });
  }
  if (g.grounded && g.heightM !== undefined && g.heightM < (g.widthM + 2 * g.gapM) / 2) {
    const r = g.heightM / (g.widthM + 2 * g.gapM);
    notes.push({ model: OWYANG_WU_MODEL, parameter: 'h/(s+2g)', value: r, min: 0.5, message: `the backing plane is ${r.toPrecision(3)}·(s + 2g) below the metal: the CPW conductor-loss formula overestimates the loss (by 8 % at 0.48, 20 % at 0.36 against a field solution)` });
  }
  if (frequencyHz > 0) {
    const ratio = t / skinDepth(frequencyHz, conductor.conductivity ?? sigmaCopperAnnealed);
    if (ratio < 3) {
      notes.push({ model: OWYANG_WU_MODEL, parameter: 't/δ', value: ratio, min: 3, message: `metal thickness is ${ratio.toPrecision(3)} skin depths at ${(frequencyHz / 1e6).toPrecision(4)} MHz; Wheeler's rule needs several (≥ 3, common practice), so conductor loss is underestimated` });
    }
  }
  return notes;
}
