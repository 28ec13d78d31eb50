/**
 * Quality factor and bandwidth of stubs on lossy lines.
 *
 * - A stub used as a reactor at f: Q = |X|/R of its input impedance (the usual Q of a lossy
 *   inductor or capacitor). Zin is taken on the exact RLGC line rebuilt from α_c and α_d
 *   (lineLoss.ts), i.e. with the complex Z0: with a real Z0 the resistance of a stub well below
 *   resonance comes out up to 2× low on a conductor-loss line, and its Q up to 2× high.
 * - A stub at resonance, as a transmission-line resonator: unloaded Q0 = β/(2α) (Pozar, Microwave
 *   Engineering, 4th ed., §6.3, series and parallel line resonators; equation numbers from memory),
 *   and 1/Q0 = 1/Qc + 1/Qd with Qc = β/(2α_c), Qd = β/(2α_d). Its 3 dB (half-power) bandwidth is
 *   BW = f_res/Q0 (Pozar §6.1, from memory).
 * Dispersion: near a resonance Zin ≈ Z0·coth(αl + jΔθ) (or tanh), whose half-power points lie at
 * Δθ = ±αl; so BW = 2α/(dβ/df) and Q0 = (f/2α)·dβ/df = (β/2α)·(n_g/n), n = √εeff and n_g the group
 * index (derived here from the low-loss Zin; on a dispersion-free line it is Pozar's β/2α).
 * stubResonanceBandwidth uses that form with dβ/df from the line model itself.
 * Validity: low-loss lines (Q0 ≫ 1); α taken at f_res, constant across the bandwidth.
 */
import type { Complex } from './complex.js';
import { type LossyLineAtFrequency, type LossyLineModel, rlgcLineAt, rlgcOf } from './lineLoss.js';
import { type Resonance, resonance } from './resonance.js';
import { type StubKind, phaseConstant, stubInputImpedance } from './stub.js';
import type { LineAtFrequency, LineModel } from './types.js';

/**
 * Q = |X|/R of an impedance: Infinity when R = 0 (lossless), 0 when X = 0.
 * Throws a RangeError for R < 0 (not a passive element).
 */
export function reactanceQ(z: Complex): number {
  if (z.re < 0) throw new RangeError(`a passive element has R ≥ 0, got ${z.re} Ω`);
  if (z.im === 0) return 0;
  return z.re === 0 ? Infinity : Math.abs(z.im) / z.re;
}

/**
 * Input impedance of a stub on the exact RLGC line of `line` (complex Z0 and γ), Ω.
 * Equals stubInputImpedance with a real Z0 when the line is lossless.
 */
export function lossyStubImpedance(kind: StubKind, line: LossyLineAtFrequency, lengthM: number, frequencyHz: number): Complex {
  if (!(lengthM > 0) || !Number.isFinite(lengthM)) throw new RangeError(`stub length must be positive, got ${lengthM} m`);
  if (!(frequencyHz > 0) || !Number.isFinite(frequencyHz)) throw new RangeError(`frequency must be positive, got ${frequencyHz} Hz`);
  const { z0, gamma } = rlgcLineAt(rlgcOf(line), frequencyHz);
  return stubInputImpedance(kind, z0, gamma, lengthM);
}

/** Q = |X|/R of a stub used as a reactive element at f (Infinity on a lossless line). */
export function stubElementQ(kind: StubKind, line: LossyLineModel, lengthM: number, frequencyHz: number): number {
  const at = line(frequencyHz);
  if (at.alpha === 0) return Infinity;
  return reactanceQ(lossyStubImpedance(kind, at, lengthM, frequencyHz));
}

/** Unloaded Q of a TEM line resonator, β/(2α) (Pozar 4th ed. §6.3); Infinity when α = 0. */
export function lineResonatorQ(betaRadPerM: number, alphaNpPerM: number): number {
  if (!(alphaNpPerM >= 0)) throw new RangeError(`attenuation must be ≥ 0 Np/m, got ${alphaNpPerM}`);
  return alphaNpPerM === 0 ? Infinity : betaRadPerM / (2 * alphaNpPerM);
}

export interface ResonatorQParts {
  /** Q0 = β/(2α). */
  q: number;
  /** Qc = β/(2α_c), conductor loss alone. */
  qConductor: number;
  /** Qd = β/(2α_d), dielectric loss alone; 1/Q0 = 1/Qc + 1/Qd. */
  qDielectric: number;
}

/** Q0, Qc and Qd of a line resonator at f, from the line's attenuation split (Pozar 4th ed. §6.3). */
export function resonatorQParts(line: LossyLineAtFrequency, frequencyHz: number): ResonatorQParts {
  const beta = phaseConstant(line.epsEff, frequencyHz);
  return { q: lineResonatorQ(beta, line.alpha), qConductor: lineResonatorQ(beta, line.alphaC), qDielectric: lineResonatorQ(beta, line.alphaD) };
}

export interface StubResonanceQ extends Resonance {
  /** Line state at the resonance. */
  line: LineAtFrequency;
  /** Unloaded Q0 = (f/2α)·dβ/df at the resonance (β/2α on a dispersion-free line). */
  q: number;
  /** Half-power bandwidth f_res/Q0, Hz (0 on a lossless line). */
  bandwidthHz: number;
}

/** Relative step for dβ/df by central difference. */
const GROUP_STEP = 1e-6;

/**
 * Unloaded Q and 3 dB bandwidth of a stub at its n-th resonance (n quarter waves), with the
 * resonance solved on the dispersive line (resonance.ts). RangeError as resonanceFrequency.
 */
export function stubResonanceBandwidth(kind: StubKind, line: LineModel, lengthM: number, quarterWaves: number): StubResonanceQ {
  const res = resonance(kind, line, lengthM, quarterWaves);
  const f = res.frequencyHz;
  const at = line(f);
  const beta = (x: number) => phaseConstant(line(x).epsEff, x);
  const dBetaDf = (beta(f * (1 + GROUP_STEP)) - beta(f * (1 - GROUP_STEP))) / (2 * f * GROUP_STEP);
  const q = lineResonatorQ(f * dBetaDf, at.alpha);
  return { ...res, line: at, q, bandwidthHz: f / q };
}
