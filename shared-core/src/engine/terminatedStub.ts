/**
 * Stubs with real ends: a line of length l terminated in a load Z_L, and the two ends a printed
 * stub actually has, an open end with its fringing extension Δl and a short made through a via.
 *
 * Input impedance of a terminated line with γ = α + jβ (Pozar, Microwave Engineering, 4th ed.,
 * §2.7, eq. 2.91; the equation number is from memory, the lossless form is in §2.3):
 *   Zin = Z0·(Z_L + Z0·tanh γl) / (Z0 + Z_L·tanh γl).
 * Where |tanh γl| > 1 the same expression is evaluated with coth γl = 1/tanh γl,
 *   Zin = Z0·(Z_L·coth γl + Z0) / (Z0·coth γl + Z_L),
 * so neither form divides by a quantity that has cancelled near a resonance. Z_L = 0 and Z_L = ∞
 * are handed to stubInputImpedance and so are exactly the short and open stub.
 *
 * Ends:
 * - open end: an open stub of electrical length l + Δl (Δl from openEnd.ts), Z_L = ∞;
 * - short through a via: Z_L = R_via + jωL_via (L_via from via.ts, R_via default 0). On a lossless
 *   line this is exactly a short stub longer by atan(ωL_via/Z0)/β: a via makes a stub look longer.
 * Validity: that of the line model and of the end models; the end is treated as lumped.
 */
import { type Complex, cabs, cadd, ccoth, cdiv, cmul, complex, ctanh } from './complex.js';
import { checkPositiveInput } from './microstripStatic.js';
import { analyseStub, guidedWavelength, phaseConstant, propagationConstant, type StubAnalysis, stubInputImpedance, reactiveEquivalent } from './stub.js';
import type { LineAtFrequency, LineModel } from './types.js';

/** A load impedance, Ω: a complex number, a real number, or Infinity for an open circuit. */
export type StubLoad = Complex | number;

/** How a printed stub ends. Lengths in m, inductance in H, resistance in Ω. */
export type StubEnd =
  | { kind: 'open'; /** open-end extension Δl, m (default 0: an ideal open) */ extensionM?: number }
  | { kind: 'short'; /** via inductance, H (default 0: an ideal short) */ viaInductanceH?: number; /** via resistance, Ω (default 0) */ viaResistanceOhm?: number };

/** True when the load is an open circuit (any infinite part). Throws a RangeError for NaN. */
export function isOpenLoad(load: StubLoad): boolean {
  const z = typeof load === 'number' ? complex(load) : load;
  if (Number.isNaN(z.re) || Number.isNaN(z.im)) throw new RangeError('load impedance is NaN; give a number of ohms, 0 for a short or Infinity for an open');
  return !Number.isFinite(z.re) || !Number.isFinite(z.im);
}

/**
 * Input impedance of a line of length l terminated in `load`, Ω (formula in the file header).
 * `z0` may be complex (a lossy RLGC line); `gamma` is α + jβ in 1/m; `lengthM` ≥ 0.
 * Exactly stubInputImpedance('short', …) for load 0 and stubInputImpedance('open', …) for Infinity.
 */
export function terminatedLineInputImpedance(z0: Complex | number, gamma: Complex, lengthM: number, load: StubLoad): Complex {
  checkPositiveInput('lengthM', lengthM, true);
  if (isOpenLoad(load)) return stubInputImpedance('open', z0, gamma, lengthM);
  const zl = typeof load === 'number' ? complex(load) : load;
  if (zl.re === 0 && zl.im === 0) return stubInputImpedance('short', z0, gamma, lengthM);
  const z = typeof z0 === 'number' ? complex(z0) : z0;
  const gl = complex(gamma.re * lengthM, gamma.im * lengthM);
  const t = ctanh(gl);
  if (cabs(t) <= 1) return cmul(z, cdiv(cadd(zl, cmul(z, t)), cadd(z, cmul(zl, t))));
  const u = ccoth(gl);
  return cmul(z, cdiv(cadd(cmul(zl, u), z), cadd(cmul(z, u), zl)));
}

/** Load of a short made through a via: Z_L = R_via + jωL_via, Ω. */
export function viaLoad(viaInductanceH: number, frequencyHz: number, viaResistanceOhm = 0): Complex {
  checkPositiveInput('viaInductanceH', viaInductanceH, true);
  checkPositiveInput('viaResistanceOhm', viaResistanceOhm, true);
  return complex(viaResistanceOhm, 2 * Math.PI * frequencyHz * viaInductanceH);
}

/** Electrical length of an open stub with its end extension: l + Δl, m. */
export function effectiveLength(drawnLengthM: number, extensionM: number): number {
  checkPositiveInput('drawnLengthM', drawnLengthM, true);
  checkPositiveInput('extensionM', extensionM, true);
  return drawnLengthM + extensionM;
}

/**
 * Extra line length a via inductance looks like at f, m: atan(ωL/Z0)/β, from
 * Zin = jZ0·tan(βl + atan(ωL/Z0)) for a lossless line shorted through jωL. Exact for a lossless
 * line; on a lossy line a close estimate.
 */
export function viaEquivalentLength(viaInductanceH: number, line: LineAtFrequency, frequencyHz: number): number {
  checkPositiveInput('viaInductanceH', viaInductanceH, true);
  checkPositiveInput('frequencyHz', frequencyHz);
  const x = 2 * Math.PI * frequencyHz * viaInductanceH;
  return Math.atan(x / line.z0) / phaseConstant(line.epsEff, frequencyHz);
}

/** The load an end presents at f: Infinity for an open end, R_via + jωL_via (or 0) for a short. */
export function endLoad(end: StubEnd, frequencyHz: number): StubLoad {
  if (end.kind === 'open') return Infinity;
  return viaLoad(end.viaInductanceH ?? 0, frequencyHz, end.viaResistanceOhm ?? 0);
}

/** Length of line the end's load sits at: l + Δl for an open end, l for a short. */
export function endedLineLength(end: StubEnd, drawnLengthM: number): number {
  return end.kind === 'open' ? effectiveLength(drawnLengthM, end.extensionM ?? 0) : drawnLengthM;
}

/** Input impedance of a drawn stub with its real end, Ω. */
export function endedStubInputImpedance(end: StubEnd, line: LineAtFrequency, drawnLengthM: number, frequencyHz: number): Complex {
  const gamma = propagationConstant(line, frequencyHz);
  return terminatedLineInputImpedance(line.z0, gamma, endedLineLength(end, drawnLengthM), endLoad(end, frequencyHz));
}

export interface EndedStubAnalysis extends Omit<StubAnalysis, 'kind' | 'lengthM'> {
  end: StubEnd;
  /** Length drawn on the board, m. */
  drawnLengthM: number;
  /**
   * Length of the ideal open or short stub with the same Zin at f, m: l + Δl for an open end,
   * l + atan(ωL/Z0)/β for a short through a via (exact on a lossless line, an estimate on a lossy one).
   * `electricalDeg` and `wavelengthFraction` refer to this length.
   */
  equivalentLengthM: number;
}

/** Everything about one drawn stub with its real end at one frequency (see analyseStub). */
export function analyseEndedStub(end: StubEnd, lineModel: LineModel, drawnLengthM: number, frequencyHz: number): EndedStubAnalysis {
  checkPositiveInput('frequencyHz', frequencyHz);
  checkPositiveInput('drawnLengthM', drawnLengthM, true);
  const line = lineModel(frequencyHz);
  const viaL = end.kind === 'short' ? (end.viaInductanceH ?? 0) : 0;
  const viaR = end.kind === 'short' ? (end.viaResistanceOhm ?? 0) : 0;
  const equivalentLengthM = end.kind === 'open' ? effectiveLength(drawnLengthM, end.extensionM ?? 0) : drawnLengthM + viaEquivalentLength(viaL, line, frequencyHz);
  if (end.kind === 'open' || (viaR === 0 && (viaL === 0 || line.alpha === 0))) {
    // An ideal end after the length shift, exactly: resonances are reported as analyseStub does.
    const { kind: _kind, lengthM: _lengthM, ...rest } = analyseStub(end.kind, lineModel, equivalentLengthM, frequencyHz);
    return { ...rest, end, drawnLengthM, equivalentLengthM };
  }
  const zin = endedStubInputImpedance(end, line, drawnLengthM, frequencyHz);
  const lambdaG = guidedWavelength(line.epsEff, frequencyHz);
  return {
    end,
    drawnLengthM,
    equivalentLengthM,
    frequencyHz,
    line,
    ...reactiveEquivalent(zin, frequencyHz),
    electricalDeg: (phaseConstant(line.epsEff, frequencyHz) * equivalentLengthM * 180) / Math.PI,
    wavelengthFraction: equivalentLengthM / lambdaG,
    guidedWavelengthM: lambdaG,
  };
}
