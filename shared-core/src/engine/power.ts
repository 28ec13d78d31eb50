/**
 * Standing-wave stress on a stub that shunts a line carrying RF power: the peak voltage at an open
 * end and the peak current in a short, which at high power can arc, break down or heat.
 *
 * Junction: a matched line of impedance Z0line carrying average power P has the travelling-wave
 * peak voltage V_j = √(2·P·Z0line) (P = |V|²/(2·Z0); Pozar, Microwave Engineering, 4th ed., §2.1,
 * from memory). A reactive stub in shunt on a matched line only lowers the junction voltage, so on a
 * matched through line the figures below are upper bounds. Where the stub is part of a matching
 * network the junction can sit on a standing wave: pass the junction voltage itself then.
 *
 * Along the stub, with d measured from its end towards the junction and terminal voltage V_L and
 * current I_L (the general solution V(z) = V⁺e^(−γz) + V⁻e^(γz) of Pozar §2.1 and §2.7, rewritten
 * about the load; derived here):
 *   V(d) = V_L·cosh γd + I_L·Z0·sinh γd,   I(d) = I_L·cosh γd + (V_L/Z0)·sinh γd.
 *   open end (I_L = 0):  V_end = V_j / |cosh γl|        (lossless: V_j / |cos βl|)
 *   short (V_L = 0):     I_short = V_j / |Z0·sinh γl|   (lossless: V_j / (Z0·|sin βl|))
 *   via (V_L = Z_L·I_L): I_via = V_j / |Z_L·cosh γl + Z0·sinh γl|
 * |cosh(αl + jβl)|² = sinh²αl + cos²βl has no cancellation near resonance. At a lossless series
 * resonance the stress is infinite and is reported as Infinity; a lossy line gives the finite value.
 * An open end's extension Δl is included: l is then l + Δl and the end voltage is taken at the strip
 * edge, Δl in from the virtual open end.
 *
 * The caution thresholds (100 V peak, 1 A peak) are common practice, no source: a prompt to check
 * breakdown, creepage and heating for the design, not a rating.
 */
import { type Complex, cabs, cadd, cdiv, cmul, complex, cscale } from './complex.js';
import { checkPositiveInput } from './microstripStatic.js';
import { phaseConstant, propagationConstant } from './stub.js';
import { endedLineLength, endLoad, isOpenLoad, type StubEnd } from './terminatedStub.js';
import type { LineAtFrequency } from './types.js';

export interface StubStressInput {
  /** Average power on the through line, W (≥ 0). */
  powerW: number;
  /** Characteristic impedance of the through line, Ω (> 0). */
  lineZ0: number;
  /** Peak junction voltage, V; overrides √(2·P·Z0line) when the junction sits on a standing wave. */
  junctionVoltagePeak?: number;
  end: StubEnd;
  /** The stub's line at f (its Z0, εeff and α). */
  stubLine: LineAtFrequency;
  /** Length drawn on the board, m. */
  drawnLengthM: number;
  frequencyHz: number;
}

export interface StubStress {
  /** Peak voltage at the junction, V. */
  junctionVoltagePeak: number;
  /** Peak current flowing into the stub at the junction, V_j/|Zin|, A. */
  junctionCurrentPeak: number;
  /** Peak voltage at the stub's end: the open strip edge, or the top of a via, V. */
  endVoltagePeak?: number;
  /** Peak current at a short or through a via, A. */
  endCurrentPeak?: number;
  /** Largest peak voltage anywhere along the stub, junction and end included, V. */
  maxVoltagePeak: number;
  /** Largest peak current anywhere along the stub, junction and end included, A. */
  maxCurrentPeak: number;
}

/** Peak voltage of a matched line carrying average power P: √(2·P·Z0), V. */
export function matchedLineVoltagePeak(powerW: number, lineZ0: number): number {
  checkPositiveInput('powerW', powerW, true);
  checkPositiveInput('lineZ0', lineZ0);
  return Math.sqrt(2 * powerW * lineZ0);
}

/**
 * Peak junction voltage when a stub of input impedance Zin shunts a matched line Z0line carrying P:
 * the incident peak √(2·P·Z0) times the transmission through a shunt impedance, |2/(2 + Z0/Zin)|
 * (a shunt element between matched lines; Pozar, Microwave Engineering, 4th ed., ch. 4, from memory).
 * A trap at its series resonance shorts the line and is not credited with the full line voltage.
 */
export function shuntJunctionVoltagePeak(powerW: number, lineZ0: number, zin: Complex): number {
  const transmission = cabs(cdiv(complex(2), cadd(complex(2), cdiv(complex(lineZ0), zin))));
  return matchedLineVoltagePeak(powerW, lineZ0) * (Number.isFinite(transmission) ? transmission : 1);
}

const ccosh = (z: Complex): Complex => complex(Math.cosh(z.re) * Math.cos(z.im), Math.sinh(z.re) * Math.sin(z.im));
const csinh = (z: Complex): Complex => complex(Math.sinh(z.re) * Math.cos(z.im), Math.cosh(z.re) * Math.sin(z.im));

/** Relative size below which a lossless junction voltage counts as an exact series resonance. */
const RESONANCE_REL = 1e-9;

/**
 * Peak voltages and currents on a stub shunting a line (formulas in the file header).
 * Throws a RangeError for negative power or length, or non-positive impedance or frequency.
 */
export function stubStress(input: StubStressInput): StubStress {
  const { end, stubLine: line, frequencyHz: f } = input;
  checkPositiveInput('frequencyHz', f);
  checkPositiveInput('drawnLengthM', input.drawnLengthM, true);
  const vj = input.junctionVoltagePeak ?? matchedLineVoltagePeak(input.powerW, input.lineZ0);
  checkPositiveInput('junctionVoltagePeak', vj, true);
  const z0 = line.z0;
  const gamma = propagationConstant(line, f);
  const load = endLoad(end, f);
  const open = isOpenLoad(load);
  const zl = open ? complex(0) : (load as Complex);
  // Unit terminal state: V_L = 1 at an open end, I_L = 1 at a short or via.
  const wave = (d: number): { v: Complex; i: Complex } => {
    const gd = complex(gamma.re * d, gamma.im * d);
    const ch = ccosh(gd);
    const sh = csinh(gd);
    return open ? { v: ch, i: cscale(sh, 1 / z0) } : { v: cadd(cmul(zl, ch), cscale(sh, z0)), i: cadd(ch, cscale(cmul(zl, sh), 1 / z0)) };
  };
  const dEnd = end.kind === 'open' ? (end.extensionM ?? 0) : 0;
  const dJunction = endedLineLength(end, input.drawnLengthM);
  const atJunction = wave(dJunction);
  const amplitude = open ? 1 : Math.hypot(cabs(zl), z0);
  const lossless = line.alpha === 0 && zl.re === 0;
  const resonant = lossless && cabs(atJunction.v) <= RESONANCE_REL * amplitude;
  const scale = resonant ? Infinity : vj / cabs(atJunction.v);
  const peak = (x: Complex) => (resonant ? Infinity : scale * cabs(x));
  const atEnd = wave(dEnd);
  // Standing-wave maxima sit where the reflection Γ(d) = Γ_L·e^(−2γd) is real: positive for |V|,
  // negative for |I| (exact on a lossless line; on a lossy one the envelope moves them by O((α/β)²)).
  // There, |V| = |V⁺|·(e^(αd) + |Γ_L|·e^(−αd)) (and |I| alike), which never falls with d because
  // |Γ_L| ≤ 1 for a passive end: the last maximum before the junction is the largest. Only the first
  // and the last are evaluated, so a stub thousands of wavelengths long costs no more than a short one.
  const argGamma = open ? 0 : Math.atan2(2 * zl.im * z0, cabs(zl) ** 2 - z0 * z0);
  const beta = phaseConstant(line.epsEff, f);
  let maxV = Math.max(vj, peak(atEnd.v));
  let maxI = Math.max(peak(atJunction.i), peak(atEnd.i));
  for (const [offset, isVoltage] of [[0, true], [Math.PI, false]] as const) {
    const first = Math.ceil((2 * beta * dEnd - argGamma - offset) / (2 * Math.PI));
    const last = Math.floor((2 * beta * dJunction - argGamma - offset) / (2 * Math.PI));
    // (last − 1 as well, in case rounding put `last` a hair past the junction)
    for (const m of new Set([first, last - 1, last].filter((k) => k >= first))) {
      const d = (argGamma + offset + 2 * Math.PI * m) / (2 * beta);
      if (d > dJunction) continue;
      const w = wave(d);
      if (isVoltage) maxV = Math.max(maxV, peak(w.v));
      else maxI = Math.max(maxI, peak(w.i));
    }
  }
  return {
    junctionVoltagePeak: vj,
    junctionCurrentPeak: peak(atJunction.i),
    ...(end.kind === 'open' ? { endVoltagePeak: peak(atEnd.v) } : { endVoltagePeak: peak(atEnd.v), endCurrentPeak: peak(atEnd.i) }),
    maxVoltagePeak: maxV,
    maxCurrentPeak: maxI,
  };
}

/** Levels above which a stub's stress deserves a look (common practice, no source; not a rating). */
export interface StressThresholds {
  /** Peak voltage, V (default 100 V). */
  voltagePeakV: number;
  /** Peak current, A (default 1 A). */
  currentPeakA: number;
}

export const STRESS_CAUTION_THRESHOLDS: StressThresholds = { voltagePeakV: 100, currentPeakA: 1 };

export interface StressCaution {
  quantity: 'voltage' | 'current';
  /** The peak found on the stub (V or A); Infinity at a lossless resonance. */
  value: number;
  threshold: number;
  message: string;
}

/**
 * Prompts to check a stub's voltage or current: one entry per quantity above its threshold, none when
 * both are below. A prompt to check breakdown, creepage, clearance and heating, not a rating.
 */
export function stubStressCautions(stress: StubStress, thresholds: StressThresholds = STRESS_CAUTION_THRESHOLDS): StressCaution[] {
  const out: StressCaution[] = [];
  if (stress.maxVoltagePeak > thresholds.voltagePeakV) {
    out.push({
      quantity: 'voltage',
      value: stress.maxVoltagePeak,
      threshold: thresholds.voltagePeakV,
      message: `peak voltage on the stub ${stress.maxVoltagePeak.toPrecision(3)} V is above ${thresholds.voltagePeakV} V: check breakdown, creepage and clearance at the power you will run`,
    });
  }
  if (stress.maxCurrentPeak > thresholds.currentPeakA) {
    out.push({
      quantity: 'current',
      value: stress.maxCurrentPeak,
      threshold: thresholds.currentPeakA,
      message: `peak current on the stub ${stress.maxCurrentPeak.toPrecision(3)} A is above ${thresholds.currentPeakA} A: check heating of the strip and the via at the power you will run`,
    });
  }
  return out;
}

/** True when the stub's stress deserves a look (see stubStressCautions). */
export function needsStressCheck(stress: StubStress, thresholds: StressThresholds = STRESS_CAUTION_THRESHOLDS): boolean {
  return stubStressCautions(stress, thresholds).length > 0;
}
