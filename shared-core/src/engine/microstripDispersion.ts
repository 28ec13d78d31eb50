/**
 * Microstrip dispersion: εeff(f) and Z0(f).
 *
 * εeff(f): M. Kirschning and R. H. Jansen, "Accurate model for effective dielectric constant of
 * microstrip with validity up to millimetre-wave frequencies", Electronics Letters 18(6), 1982,
 * pp. 272–273 (the P(f), P1…P4 expressions). Accuracy 0.6 % for 0.1 ≤ w/h ≤ 100, 1 ≤ εr ≤ 20,
 * h/λ0 ≤ 0.13 (as restated in later surveys).
 *
 * Z0(f): R. H. Jansen and M. Kirschning, "Arguments and an accurate model for the power-current
 * formulation of microstrip characteristic impedance", AEÜ 37, 1983, pp. 108–112 (the R1…R17
 * expressions, Z0(f) = Z0(0)·(R13/R14)^R17, with R1, R2, R6 capped at 20 as the authors advise).
 * Range as restated in later surveys (the original was not available to check):
 * 0.1 ≤ w/h ≤ 10, 1 ≤ εr ≤ 18, h/λ0 ≤ 0.1. R8 is taken as 1 + 1.275·{1 − exp[−0.004625·R3·εr^1.674·
 * (fn/18.365)^2.745]}, the reading shared by independent restatements; one restatement puts
 * the (fn/18.365)^2.745 factor outside the exponential. Not checked against the original.
 *
 * Both take the normalised frequency fn = f·h in GHz·mm and the static εeff from the same
 * thickness model (microstripStatic). The width u = w/h inside P and R is the drawn width.
 * Equation numbers of either paper were not available to check, so none are quoted.
 */
import { c0 } from './constants.js';
import { type MicrostripGeometry, type MicrostripStaticResult, microstripStatic, checkPositiveInput } from './microstripStatic.js';
import type { ValidityNote } from './types.js';

export const KJ_MODEL = 'Kirschning–Jansen 1982';
export const JK_MODEL = 'Jansen–Kirschning 1983';

/** Normalised frequency fn = f·h in GHz·mm, from f in Hz and h in m. */
export const normalizedFrequencyGHzMm = (frequencyHz: number, heightM: number): number => frequencyHz * heightM * 1e-6;

/**
 * Kirschning–Jansen 1982 dispersive effective permittivity:
 * εeff(f) = εr − (εr − εeff0)/(1 + P), P = P1·P2·((0.1844 + P3·P4)·fn)^1.5763,
 * P1 = 0.27488 + (0.6315 + 0.525/(1 + 0.0157·fn)^20)·u − 0.065683·exp(−8.7513u),
 * P2 = 0.33622·(1 − exp(−0.03442·εr)), P3 = 0.0363·exp(−4.6u)·(1 − exp(−(fn/38.7)^4.97)),
 * P4 = 1 + 2.751·(1 − exp(−(εr/15.916)^8)).
 * @param fn normalised frequency f·h, GHz·mm
 */
export function kirschningJansenEpsEff(u: number, dk: number, epsEff0: number, fn: number): number {
  const p1 = 0.27488 + (0.6315 + 0.525 / (1 + 0.0157 * fn) ** 20) * u - 0.065683 * Math.exp(-8.7513 * u);
  const p2 = 0.33622 * (1 - Math.exp(-0.03442 * dk));
  const p3 = 0.0363 * Math.exp(-4.6 * u) * (1 - Math.exp(-Math.pow(fn / 38.7, 4.97)));
  const p4 = 1 + 2.751 * (1 - Math.exp(-Math.pow(dk / 15.916, 8)));
  const p = p1 * p2 * Math.pow((0.1844 + p3 * p4) * fn, 1.5763);
  return dk - (dk - epsEff0) / (1 + p);
}

/**
 * Jansen–Kirschning 1983 impedance dispersion factor Z0(f)/Z0(0) = (R13/R14)^R17.
 * Returns NaN where the fit is undefined (R13 or R14 ≤ 0, which happens for εeff close to 1).
 * @param fn normalised frequency f·h, GHz·mm
 */
export function jansenKirschningZ0Factor(u: number, dk: number, epsEff0: number, epsEffF: number, fn: number): number {
  const r1 = Math.min(0.03891 * dk ** 1.4, 20);
  const r2 = Math.min(0.267 * u ** 7, 20);
  const r3 = 4.766 * Math.exp(-3.228 * u ** 0.641);
  const r4 = 0.016 + (0.0514 * dk) ** 4.524;
  const r5 = (fn / 28.843) ** 12;
  const r6 = Math.min(22.2 * u ** 1.92, 20);
  const r7 = 1.206 - 0.3144 * Math.exp(-r1) * (1 - Math.exp(-r2));
  const r8 = 1 + 1.275 * (1 - Math.exp(-0.004625 * r3 * dk ** 1.674 * (fn / 18.365) ** 2.745));
  const e6 = (dk - 1) ** 6;
  const r9 = ((5.086 * r4 * r5) / (0.3838 + 0.386 * r4)) * (Math.exp(-r6) / (1 + 1.2992 * r5)) * (e6 / (1 + 10 * e6));
  const r10 = 0.00044 * dk ** 2.136 + 0.0184;
  const x11 = (fn / 19.47) ** 6;
  const r11 = x11 / (1 + 0.0962 * x11);
  const r12 = 1 / (1 + 0.00245 * u * u);
  const r13 = 0.9408 * epsEffF ** r8 - 0.9603;
  const r14 = (0.9408 - r9) * epsEff0 ** r8 - 0.9603;
  const r15 = 0.707 * r10 * (fn / 12.3) ** 1.097;
  const r16 = 1 + 0.0503 * dk * dk * r11 * (1 - Math.exp(-((u / 15) ** 6)));
  const r17 = r7 * (1 - 1.1241 * (r12 / r16) * Math.exp(-0.026 * fn ** 1.15656 - r15));
  if (r13 === r14) return 1; // εr = 1, or f = 0: no dispersion
  if (!(r13 > 0 && r14 > 0)) return Number.NaN;
  return (r13 / r14) ** r17;
}

export interface MicrostripAtFrequency {
  /** Z0(f), Ω. */
  z0: number;
  /** εeff(f). */
  epsEff: number;
  /** The quasi-static solution it was derived from. */
  static: MicrostripStaticResult;
  notes: ValidityNote[];
}

function note(model: string, parameter: string, value: number, min: number | undefined, max: number | undefined): ValidityNote | null {
  if ((min === undefined || value >= min) && (max === undefined || value <= max)) return null;
  const range = `${min ?? '−∞'} … ${max ?? '∞'}`;
  return { model, parameter, value, min, max, message: `${model}: ${parameter} = ${value.toPrecision(4)} is outside ${range}` };
}

/**
 * Dispersive values from an already computed static solution (saves work in frequency sweeps).
 * f = 0 returns the static values exactly, with no dispersion notes.
 */
export function microstripAtFromStatic(stat: MicrostripStaticResult, dk: number, heightM: number, frequencyHz: number): MicrostripAtFrequency {
  checkPositiveInput('frequencyHz', frequencyHz, true);
  if (frequencyHz === 0) return { z0: stat.z0, epsEff: stat.epsEff, static: stat, notes: [...stat.notes] };
  const u = stat.u;
  const fn = normalizedFrequencyGHzMm(frequencyHz, heightM);
  const hOverLambda = (heightM * frequencyHz) / c0;
  const epsEff = kirschningJansenEpsEff(u, dk, stat.epsEff, fn);
  const factor = jansenKirschningZ0Factor(u, dk, stat.epsEff, epsEff, fn);
  const notes = [
    ...stat.notes,
    note(KJ_MODEL, 'w/h', u, 0.1, 100),
    note(KJ_MODEL, 'εr', dk, 1, 20),
    note(KJ_MODEL, 'h/λ0', hOverLambda, undefined, 0.13),
    note(JK_MODEL, 'w/h', u, 0.1, 10),
    note(JK_MODEL, 'εr', dk, 1, 18),
    note(JK_MODEL, 'h/λ0', hOverLambda, undefined, 0.1),
  ].filter((n): n is ValidityNote => n !== null);
  if (Number.isNaN(factor)) {
    notes.push({ model: JK_MODEL, parameter: 'εeff', value: stat.epsEff, min: 0.9603 / 0.9408, message: `${JK_MODEL}: Z0(f) fit undefined for εeff this close to 1; static Z0 used` });
  }
  return { z0: stat.z0 * (Number.isNaN(factor) ? 1 : factor), epsEff, static: stat, notes };
}

/** Z0(f) (Ω), εeff(f) and validity notes of a microstrip line at `frequencyHz` (≥ 0). */
export function microstripAt(g: MicrostripGeometry, frequencyHz: number): MicrostripAtFrequency {
  return microstripAtFromStatic(microstripStatic(g), g.dk, g.heightM, frequencyHz);
}

/** εeff(f), Kirschning–Jansen 1982 over Hammerstad–Jensen 1980 static εeff. */
export const microstripEpsEffAt = (g: MicrostripGeometry, frequencyHz: number): number => microstripAt(g, frequencyHz).epsEff;

/** Z0(f) in Ω, Jansen–Kirschning 1983 over Hammerstad–Jensen 1980 static Z0. */
export const microstripZ0At = (g: MicrostripGeometry, frequencyHz: number): number => microstripAt(g, frequencyHz).z0;
