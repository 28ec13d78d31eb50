/**
 * Microstrip, quasi-static: characteristic impedance Z0 and effective permittivity εeff.
 *
 * Source: E. Hammerstad and Ø. Jensen, "Accurate models for microstrip computer-aided design",
 * IEEE MTT-S Int. Microwave Symp. Digest, 1980, pp. 407–409. Used here: the air-line impedance
 * Z01(u) with f(u); εeff(u, εr) with a(u), b(εr); and the finite-thickness correction (Δu1, Δur).
 * The paper's equation numbers were not available to check, so none are quoted.
 *
 * Validity: the paper gives better than 0.2 % for εeff when εr ≤ 128 and 0.01 ≤ w/h ≤ 100
 * (these bounds are stated by the authors and repeated in later surveys). It does not give a
 * thickness bound; t/h ≤ 0.1 is common practice, no source. Outside these ranges the results
 * get a ValidityNote, not an error.
 */
import { eta0 } from './constants.js';
import type { ValidityNote } from './types.js';

/** A single strip over a ground plane. All lengths are in metres. */
export interface MicrostripGeometry {
  /** Strip width w, m (> 0). */
  widthM: number;
  /** Substrate height h between the strip and the ground plane, m (> 0). */
  heightM: number;
  /** Relative permittivity εr of the substrate (≥ 1). */
  dk: number;
  /** Strip thickness t, m (≥ 0, default 0). */
  thicknessM?: number;
}

export interface MicrostripStaticResult {
  /** Quasi-static characteristic impedance, Ω. */
  z0: number;
  /** Quasi-static effective relative permittivity. */
  epsEff: number;
  /** Normalised width w/h as given. */
  u: number;
  /** Width widened for thickness in air, u1 = u + Δu1. */
  u1: number;
  /** Width widened for thickness on the substrate, ur = u + Δur. */
  ur: number;
  notes: ValidityNote[];
}

export const HJ_MODEL = 'Hammerstad–Jensen 1980';

/** Throws a RangeError unless `value` is finite and > 0 (or ≥ 0 with `allowZero`). */
export function checkPositiveInput(name: string, value: number, allowZero = false): void {
  const ok = Number.isFinite(value) && (allowZero ? value >= 0 : value > 0);
  if (!ok) {
    const want = allowZero ? 'a finite number ≥ 0' : 'a finite number > 0';
    throw new RangeError(`${name} must be ${want}, got ${value}`);
  }
}

/** Checks a geometry and throws a RangeError naming the first bad field. */
export function validateMicrostripGeometry(g: MicrostripGeometry): void {
  checkPositiveInput('heightM', g.heightM);
  checkPositiveInput('widthM', g.widthM);
  checkPositiveInput('dk', g.dk);
  if (g.dk < 1) throw new RangeError(`dk must be ≥ 1 (relative permittivity), got ${g.dk}`);
  checkPositiveInput('thicknessM', g.thicknessM ?? 0, true);
}

/**
 * Impedance of a zero-thickness strip over ground in air (HJ 1980), Ω:
 * Z01(u) = (η0/2π)·ln[f(u)/u + √(1 + (2/u)²)], f(u) = 6 + (2π − 6)·exp(−(30.666/u)^0.7528).
 * Quoted accuracy 0.01 % for u ≤ 1 and 0.03 % for u ≤ 1000 (as restated in later surveys).
 * @param u normalised width w/h (> 0)
 */
export function hjAirImpedance(u: number): number {
  const f = 6 + (2 * Math.PI - 6) * Math.exp(-Math.pow(30.666 / u, 0.7528));
  return (eta0 / (2 * Math.PI)) * Math.log(f / u + Math.sqrt(1 + (2 / u) ** 2));
}

/**
 * Effective permittivity of a zero-thickness strip (HJ 1980):
 * εeff = (εr + 1)/2 + (εr − 1)/2 · (1 + 10/u)^(−a(u)·b(εr)), with
 * a(u) = 1 + ln[(u⁴ + (u/52)²)/(u⁴ + 0.432)]/49 + ln[1 + (u/18.1)³]/18.7 and
 * b(εr) = 0.564·((εr − 0.9)/(εr + 3))^0.053. Within 0.2 % for εr ≤ 128, 0.01 ≤ u ≤ 100.
 */
export function hjEpsEffZeroThickness(u: number, dk: number): number {
  const u4 = u ** 4;
  const a = 1 + Math.log((u4 + (u / 52) ** 2) / (u4 + 0.432)) / 49 + Math.log(1 + (u / 18.1) ** 3) / 18.7;
  const b = 0.564 * Math.pow((dk - 0.9) / (dk + 3), 0.053);
  return (dk + 1) / 2 + ((dk - 1) / 2) * Math.pow(1 + 10 / u, -a * b);
}

/**
 * Width increase for a strip of thickness t (HJ 1980), all normalised to h (T = t/h):
 * Δu1 = (T/π)·ln[1 + 4e / (T·coth²√(6.517u))]  (in air),
 * Δur = ½·(1 + sech√(εr − 1))·Δu1              (on the substrate).
 */
export function hjThicknessCorrection(u: number, tOverH: number, dk: number): { du1: number; dur: number } {
  // Below 1e-12 the correction (≈ T·ln(1/T)) is far under round-off, and T·coth² may underflow.
  if (tOverH < 1e-12) return { du1: 0, dur: 0 };
  const coth = 1 / Math.tanh(Math.sqrt(6.517 * u));
  const du1 = (tOverH / Math.PI) * Math.log(1 + (4 * Math.E) / (tOverH * coth * coth));
  const dur = 0.5 * (1 + 1 / Math.cosh(Math.sqrt(dk - 1))) * du1;
  return { du1, dur };
}

function rangeNote(parameter: string, value: number, min: number | undefined, max: number | undefined, why: string): ValidityNote | null {
  if ((min === undefined || value >= min) && (max === undefined || value <= max)) return null;
  const range = `${min ?? '−∞'} … ${max ?? '∞'}`;
  return { model: HJ_MODEL, parameter, value, min, max, message: `${parameter} = ${value.toPrecision(4)} is outside ${range} (${why})` };
}

/**
 * Quasi-static Z0 (Ω) and εeff of a microstrip line of finite thickness (HJ 1980):
 * Z0 = Z01(ur)/√εeff(ur, εr);  εeff(t) = εeff(ur, εr)·[Z01(u1)/Z01(ur)]².
 * With t = 0 this is Z01(u)/√εeff(u, εr). Throws a RangeError for non-finite, non-positive
 * width/height, εr < 1 or negative thickness.
 */
export function microstripStatic(g: MicrostripGeometry): MicrostripStaticResult {
  validateMicrostripGeometry(g);
  const u = g.widthM / g.heightM;
  const tOverH = (g.thicknessM ?? 0) / g.heightM;
  const { du1, dur } = hjThicknessCorrection(u, tOverH, g.dk);
  const u1 = u + du1;
  const ur = u + dur;
  const z01r = hjAirImpedance(ur);
  const epsEffR = hjEpsEffZeroThickness(ur, g.dk);
  const z0 = z01r / Math.sqrt(epsEffR);
  const epsEff = epsEffR * (hjAirImpedance(u1) / z01r) ** 2;
  const notes = [
    rangeNote('w/h', u, 0.01, 100, 'range stated by Hammerstad & Jensen 1980'),
    rangeNote('εr', g.dk, undefined, 128, 'range stated by Hammerstad & Jensen 1980'),
    rangeNote('t/h', tOverH, undefined, 0.1, 'thin-strip correction; common practice, no published bound'),
  ].filter((n): n is ValidityNote => n !== null);
  return { z0, epsEff, u, u1, ur, notes };
}
