/**
 * Short- and open-circuited stubs as reactive elements.
 *
 * Input impedance of a line of length l terminated in a short or an open, with complex
 * propagation constant γ = α + jβ and characteristic impedance Z0:
 *   short: Zin = Z0·tanh(γl)      open: Zin = Z0·coth(γl)
 * (Pozar, Microwave Engineering, 4th ed., §2.4–2.7, eqs. 2.44/2.45 lossless and 2.91 lossy).
 * For α = 0 these are exactly jZ0·tan βl and −jZ0·cot βl.
 * Valid for TEM and quasi-TEM lines whose Z0 and εeff are taken at the frequency of interest.
 */
import { c0 } from './constants.js';
import { type Complex, cabs, ccoth, cmul, complex, ctanh } from './complex.js';
import type { LineAtFrequency, LineModel } from './types.js';

export type StubKind = 'short' | 'open';

/** Phase constant β = 2πf·√εeff / c0, rad/m. */
export function phaseConstant(epsEff: number, frequencyHz: number): number {
  return (2 * Math.PI * frequencyHz * Math.sqrt(epsEff)) / c0;
}

/** Guided wavelength λg = c0 / (f·√εeff), m. */
export function guidedWavelength(epsEff: number, frequencyHz: number): number {
  return c0 / (frequencyHz * Math.sqrt(epsEff));
}

/** Propagation constant γ = α + jβ of a line at one frequency. */
export function propagationConstant(line: LineAtFrequency, frequencyHz: number): Complex {
  return complex(line.alpha, phaseConstant(line.epsEff, frequencyHz));
}

/**
 * Input impedance of a stub, Ω. `z0` may be complex (a lossy RLGC line); `gamma` is α + jβ in 1/m.
 * Returns non-finite parts exactly at a lossless parallel resonance.
 */
export function stubInputImpedance(kind: StubKind, z0: Complex | number, gamma: Complex, lengthM: number): Complex {
  const z = typeof z0 === 'number' ? complex(z0) : z0;
  const gl = complex(gamma.re * lengthM, gamma.im * lengthM);
  return cmul(z, kind === 'short' ? ctanh(gl) : ccoth(gl));
}

/** Electrical length θ = βl, rad. */
export function electricalLength(line: LineAtFrequency, lengthM: number, frequencyHz: number): number {
  return phaseConstant(line.epsEff, frequencyHz) * lengthM;
}

/** 'resonant' when the stub sits on a resonance, or so near one that |X| ≤ R (Q below 1). */
export type Behaviour = 'inductive' | 'capacitive' | 'resonant';

export interface StubAnalysis {
  kind: StubKind;
  lengthM: number;
  frequencyHz: number;
  /** Line state used (dispersive values at `frequencyHz`). */
  line: LineAtFrequency;
  zin: Complex;
  /** Im(Zin), Ω; ±Infinity exactly at a lossless parallel resonance. */
  reactance: number;
  /** Re(Zin): the series loss resistance, Ω. */
  resistance: number;
  /** Equivalent inductance X/ω, H, when X > 0 and |X| > R; else null. */
  inductance: number | null;
  /** Equivalent capacitance −1/(ωX), F, when X < 0 and |X| > R; else null. */
  capacitance: number | null;
  /** Electrical length βl in degrees. */
  electricalDeg: number;
  /** Physical length as a fraction of the guided wavelength, l/λg. */
  wavelengthFraction: number;
  guidedWavelengthM: number;
  behaviour: Behaviour;
}

/** Electrical-length tolerance (rad) inside which a lossless stub is reported as resonant. */
const RESONANCE_EPS_RAD = 1e-9;

/** Everything about one stub at one frequency. */
export function analyseStub(kind: StubKind, lineModel: LineModel, lengthM: number, frequencyHz: number): StubAnalysis {
  const line = lineModel(frequencyHz);
  const gamma = propagationConstant(line, frequencyHz);
  const theta = gamma.im * lengthM;
  const lambdaG = guidedWavelength(line.epsEff, frequencyHz);
  const quarterTurns = theta / (Math.PI / 2);
  const onResonance =
    line.alpha === 0 && Math.abs(quarterTurns - Math.round(quarterTurns)) * (Math.PI / 2) < RESONANCE_EPS_RAD;
  let zin = stubInputImpedance(kind, line.z0, gamma, lengthM);
  if (onResonance) {
    // Lossless resonance: a series resonance is an exact zero, a parallel one an open circuit.
    const n = Math.round(quarterTurns);
    const series = (kind === 'short') === (n % 2 === 0);
    zin = series ? complex(0, 0) : complex(0, Infinity);
  }
  return {
    kind,
    lengthM,
    frequencyHz,
    line,
    ...reactiveEquivalent(zin, frequencyHz, onResonance),
    electricalDeg: (theta * 180) / Math.PI,
    wavelengthFraction: lengthM / lambdaG,
    guidedWavelengthM: lambdaG,
  };
}

/**
 * Zin read as a reactive element: X, R, the equivalent L = X/ω or C = −1/(ωX), and the behaviour.
 * At or very near a resonance of a lossy stub |X| ≤ R: the stub is then more resistor than reactor
 * (its Q as an L or C is below 1) and no equivalent L or C is reported.
 */
export function reactiveEquivalent(zin: Complex, frequencyHz: number, onResonance = false) {
  const reactance = zin.im;
  const omega = 2 * Math.PI * frequencyHz;
  const finite = Number.isFinite(reactance) && !onResonance && reactance !== 0 && Math.abs(reactance) > Math.abs(zin.re);
  return {
    zin,
    reactance,
    resistance: zin.re,
    inductance: finite && reactance > 0 ? reactance / omega : null,
    capacitance: finite && reactance < 0 ? -1 / (omega * reactance) : null,
    behaviour: (!finite ? 'resonant' : reactance > 0 ? 'inductive' : 'capacitive') as Behaviour,
  };
}

/** |Zin| helper for callers that plot or compare magnitudes. */
export const impedanceMagnitude = (z: Complex): number => cabs(z);
