/**
 * Coplanar waveguide (CPW), quasi-static: a centre strip of width s between two coplanar grounds,
 * slots of width g, on a substrate of height h and permittivity εr; optionally conductor-backed
 * (a ground plane under the substrate, "grounded CPW"). Conformal mapping, zero thickness,
 * infinitely wide coplanar grounds. Quasi-static: no dispersion.
 *
 * With k0 = s/(s + 2g) (the full centre width; ENGINEERING.md pitfall 3) and r(k) = K(k)/K(k′):
 * - Infinite substrate: C. P. Wen, "Coplanar waveguide: a surface strip transmission line suitable
 *   for nonreciprocal gyromagnetic device applications", IEEE Trans. MTT-17(12), 1969,
 *   pp. 1087–1090 (from memory): εeff = (εr + 1)/2, Z0 = η0/(4√εeff) · K(k0′)/K(k0) = 30π/√εeff · …
 *   CPW carries K(k′)/K(k), the reverse of stripline.
 * - Substrate of height h, no backing: G. Ghione and C. U. Naldi, "Analytical formulas for
 *   coplanar lines in hybrid and monolithic MICs", Electronics Letters 20(4), 1984, pp. 179–181:
 *   k1 = sinh(πs/4h)/sinh(π(s + 2g)/4h), εeff = 1 + (εr − 1)/2 · r(k1)/r(k0), Z0 as above.
 * - Conductor-backed: G. Ghione and C. U. Naldi, "Parameters of coplanar waveguides with lower
 *   ground plane", Electronics Letters 19(18), 1983, pp. 734–735: k3 = tanh(πs/4h)/tanh(π(s + 2g)/4h),
 *   εeff = (r(k0) + εr·r(k3))/(r(k0) + r(k3)), Z0 = η0/(2√εeff) / (r(k0) + r(k3)) = 60π/√εeff / (…).
 * Both are collected in R. N. Simons, "Coplanar Waveguide Circuits, Components, and Systems",
 * Wiley 2001, ch. 2 (from memory; no equation numbers checked). The formulas above were checked
 * against secondary restatements, not against the papers.
 *
 * Accuracy observed against the 2-D field solver in test/reference/laplace2d.ts (see
 * test/coplanar-laplace.test.ts), εr 4.4–10: without backing, Z0 within 0.2 % and εeff within
 * 0.35 % for s + 2g ≤ h, 0.6 % / 1.2 % for s + 2g ≤ 2h, growing to about 1.2 % / 2.3 % at 4h
 * (the model underestimates εeff as the field reaches through a thin substrate);
 * conductor-backed, Z0 and εeff within 0.21 % for g ≤ 0.7h, 0.7 % at g = h, 2.7 % at g = 2h
 * (the model is high).
 * Validity notes: (s + 2g)/h > 2 without backing, g/h > 1 with backing.
 *
 * Metal thickness t: the facing walls of each slot are taken as a parallel-plate capacitor in air,
 * ε0·t/g per slot, added to the zero-thickness capacitance with and without the dielectric:
 *   C_air = ε0·η0/(Z0,0·√εeff,0) + 2ε0·t/g,   C = εeff,0·(C_air − 2ε0·t/g) + 2ε0·t/g,
 *   Z0 = 1/(c0·√(C·C_air)),   εeff = C/C_air.
 * A first-order estimate of our own (elementary electrostatics, no published source), kept because
 * it measured far better than the textbook correction of K. C. Gupta et al., "Microstrip Lines and
 * Slotlines", 2nd ed., 1996, §7.3 (the Δ = (1.25t/π)(1 + ln(4πs/t)) widening, 1.4–15 % off), and
 * than ignoring t (1–25 % off). Against the field solver (test/coplanar-laplace.test.ts; εr 2.2 and
 * 10, with and without backing, s/h 0.2–2, g/h 0.1–0.5, t/h 0.01–0.05): Z0 +0.5 … +2.2 % (high:
 * the corners' fringing is missing) for t/s ≤ 0.17 and t/g ≤ 0.5, up to +4.1 % at t/s = 0.25;
 * εeff within −1.7 … +1.6 % (+3.4 % at t/s = 0.25). Validity notes above t/s = 0.2 or t/g = 0.5.
 */
import { eta0 } from './constants.js';
import { SMALL_MODULUS, ellipticKRatio, ellipticKRatioFromLogModulus } from './ellipticK.js';
import { checkPositiveInput } from './microstripStatic.js';
import type { ValidityNote } from './types.js';

export const WEN_MODEL = 'Wen 1969';
export const CPW_MODEL = 'Ghione–Naldi 1984';
export const GCPW_MODEL = 'Ghione–Naldi 1983';

/** A coplanar waveguide. All lengths in metres. */
export interface CoplanarGeometry {
  /** Centre strip width s, m (> 0). */
  widthM: number;
  /** Slot width g between the strip and each coplanar ground, m (> 0). */
  gapM: number;
  /** Substrate height h, m (> 0). */
  heightM: number;
  /** Relative permittivity εr of the substrate (≥ 1). */
  dk: number;
  /** Metal thickness t, m (≥ 0, default 0): slot-wall capacitance added (see the header). */
  thicknessM?: number;
  /** true: conductor-backed (ground plane under the substrate); false: no backing. */
  grounded: boolean;
}

export interface CoplanarStaticResult {
  /** Quasi-static characteristic impedance, Ω. */
  z0: number;
  /** Quasi-static effective permittivity. */
  epsEff: number;
  /** Filling factor q = (εeff − 1)/(εr − 1), from the geometry alone (defined at εr = 1 too). */
  fillingFactor: number;
  notes: ValidityNote[];
}

/** The moduli of the conformal maps, each with its complement computed without cancellation. */
export interface CoplanarModuli {
  /** k0 = s/(s + 2g) and k0′ = 2√(g(s + g))/(s + 2g). */
  k0: number;
  k0p: number;
  /** k1 = sinh(πs/4h)/sinh(π(s + 2g)/4h) (substrate of height h) and k1′. */
  k1: number;
  k1p: number;
  /** ln k1, finite where k1 underflows (g ≳ 470h). */
  lnK1: number;
  /** k3 = tanh(πs/4h)/tanh(π(s + 2g)/4h) (conductor-backed) and k3′. */
  k3: number;
  k3p: number;
  /** ln k3′, finite where k3′ underflows (s ≳ 470h). */
  lnK3p: number;
}

/**
 * Moduli k0, k1, k3 and their complements for strip width s, slot g and substrate height h.
 * sinh and tanh are written with expm1 of negative arguments (a = πs/4h, b = π(s + 2g)/4h,
 * u = e^(−2a), v = e^(−2b)):  k1 = e^(a−b)·(1 − u)/(1 − v),  k1′ = √((1 − v/u)(1 − uv))/(1 − v),
 * k3 = (1 − u)(1 + v)/((1 + u)(1 − v)),  k3′ = 2√((u − v)(1 − uv))/((1 + u)(1 − v)),
 * so nothing overflows for h ≪ s and nothing cancels for g ≪ h or h ≫ s. ln k1 and ln k3′ are
 * returned too, for where k1 or k3′ underflows.
 */
export function coplanarModuli(widthM: number, gapM: number, heightM: number): CoplanarModuli {
  const total = widthM + 2 * gapM;
  const a = (Math.PI * widthM) / (4 * heightM);
  const b = (Math.PI * total) / (4 * heightM);
  const d = (Math.PI * gapM) / (2 * heightM); // b − a, without cancellation
  const oneMinusU = -Math.expm1(-2 * a);
  const oneMinusV = -Math.expm1(-2 * b);
  const oneMinusUV = -Math.expm1(-2 * (a + b));
  const oneMinusVOverU = -Math.expm1(-2 * d);
  const u = Math.exp(-2 * a);
  const v = Math.exp(-2 * b);
  const k3Den = (1 + u) * oneMinusV;
  return {
    k0: widthM / total,
    k0p: (2 * Math.sqrt(gapM * (widthM + gapM))) / total,
    k1: (Math.exp(-d) * oneMinusU) / oneMinusV,
    k1p: Math.sqrt(oneMinusVOverU * oneMinusUV) / oneMinusV,
    lnK1: -d + Math.log(oneMinusU / oneMinusV),
    k3: (oneMinusU * (1 + v)) / k3Den,
    k3p: (2 * Math.sqrt(u * oneMinusVOverU * oneMinusUV)) / k3Den,
    lnK3p: Math.LN2 - a + 0.5 * Math.log(oneMinusVOverU * oneMinusUV) - Math.log(k3Den),
  };
}

/** r(k1) = K(k1)/K(k1′), through its small-modulus form where k1 is tiny or underflows. */
const ratioK1 = (m: CoplanarModuli): number => (m.k1 < SMALL_MODULUS ? ellipticKRatioFromLogModulus(m.lnK1) : ellipticKRatio(m.k1, m.k1p));

/** r(k3) = K(k3)/K(k3′), through its small-complement form where k3′ is tiny or underflows. */
const ratioK3 = (m: CoplanarModuli): number => (m.k3p < SMALL_MODULUS ? 1 / ellipticKRatioFromLogModulus(m.lnK3p) : ellipticKRatio(m.k3, m.k3p));

/**
 * Wen 1969, CPW on a substrate filling the whole half-space below the slots:
 * εeff = (εr + 1)/2, Z0 = η0/(4√εeff) · K(k0′)/K(k0), k0 = s/(s + 2g). Ω and dimensionless.
 */
export function coplanarInfiniteSubstrate(widthM: number, gapM: number, dk: number): { z0: number; epsEff: number } {
  const { k0, k0p } = coplanarModuli(widthM, gapM, 1);
  const epsEff = (dk + 1) / 2;
  return { z0: eta0 / (4 * Math.sqrt(epsEff) * ellipticKRatio(k0, k0p)), epsEff };
}

/** Checks a CPW geometry and throws a RangeError naming the first bad field. */
export function validateCoplanarGeometry(g: CoplanarGeometry): void {
  checkPositiveInput('widthM', g.widthM);
  checkPositiveInput('gapM', g.gapM);
  checkPositiveInput('heightM', g.heightM);
  checkPositiveInput('dk', g.dk);
  if (g.dk < 1) throw new RangeError(`dk must be ≥ 1 (relative permittivity), got ${g.dk}`);
  checkPositiveInput('thicknessM', g.thicknessM ?? 0, true);
  if (typeof g.grounded !== 'boolean') throw new RangeError('grounded must be true (conductor-backed) or false (no backing plane)');
}

function note(model: string, parameter: string, value: number, max: number, why: string): ValidityNote | null {
  if (value <= max) return null;
  return { model, parameter, value, max, message: `${model}: ${parameter} = ${value.toPrecision(4)} is above ${max} (${why})` };
}

/**
 * Quasi-static Z0 (Ω), εeff and filling factor of a CPW (Ghione–Naldi 1984) or a conductor-backed
 * CPW (Ghione–Naldi 1983), with the slot-wall thickness estimate when t > 0. Throws a RangeError for non-finite or non-positive
 * width, gap or height, εr < 1 or a negative thickness.
 */
export function coplanarStatic(g: CoplanarGeometry): CoplanarStaticResult {
  validateCoplanarGeometry(g);
  const m = coplanarModuli(g.widthM, g.gapM, g.heightM);
  const r0 = ellipticKRatio(m.k0, m.k0p);
  let z0: number;
  let fillingFactor: number;
  const notes: (ValidityNote | null)[] = [];
  if (g.grounded) {
    const r3 = ratioK3(m);
    fillingFactor = r3 / (r0 + r3);
    const epsEff = 1 + fillingFactor * (g.dk - 1);
    z0 = eta0 / (2 * Math.sqrt(epsEff) * (r0 + r3));
    notes.push(note(GCPW_MODEL, 'g/h', g.gapM / g.heightM, 1, 'backing plane closer than a slot width: Z0 and εeff high, by 2–3 % at g = 2h'));
  } else {
    fillingFactor = ratioK1(m) / (2 * r0);
    const epsEff = 1 + fillingFactor * (g.dk - 1);
    z0 = eta0 / (4 * Math.sqrt(epsEff) * r0);
    const span = (g.widthM + 2 * g.gapM) / g.heightM;
    notes.push(note(CPW_MODEL, '(s+2g)/h', span, 2, 'substrate thin against the slots: εeff underestimated by 1–2 %'));
  }
  const t = g.thicknessM ?? 0;
  let epsEff = 1 + fillingFactor * (g.dk - 1);
  if (t > 0) {
    // Capacitances per ε0: zero-thickness values plus the two slots' walls (parallel plates in air).
    const wall = (2 * t) / g.gapM;
    const cAir = eta0 / (z0 * Math.sqrt(epsEff)) + wall;
    const c = epsEff * (cAir - wall) + wall;
    z0 = eta0 / Math.sqrt(c * cAir);
    epsEff = c / cAir;
    fillingFactor *= (cAir - wall) / cAir; // (εeff − 1)/(εr − 1), still geometric
    const model = 'slot-wall thickness estimate';
    notes.push(note(model, 't/s', t / g.widthM, 0.2, 'metal thick against the strip: Z0 about 4 % high at t/s = 0.25 in field solutions'));
    notes.push(note(model, 't/g', t / g.gapM, 0.5, 'metal thick against the slot: beyond the range checked against field solutions'));
  }
  return { z0, epsEff, fillingFactor, notes: notes.filter((n): n is ValidityNote => n !== null) };
}
