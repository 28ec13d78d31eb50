/**
 * Line loss bookkeeping: conductor and dielectric attenuation, their sum, dB conversion, and the
 * per-metre RLGC line they imply.
 *
 * For a low-loss line the two attenuations add: α = α_c + α_d with α_c = R′/(2·Z0) and
 * α_d = G′·Z0/2 (Pozar, Microwave Engineering, 4th ed., §2.7, low-loss line; equation number from
 * memory). Conversely R′ = 2·Z0·α_c, G′ = 2·α_d/Z0, L′ = Z0·√εeff/c0, C′ = √εeff/(Z0·c0), and the
 * exact line of those R′L′G′C′ has Z0 = √((R′ + jωL′)/(G′ + jωC′)) and γ = √((R′ + jωL′)(G′ + jωC′))
 * (Pozar 4th ed. §2.1). Its complex Z0 matters wherever the stub is far from resonance: with a real
 * Z0 the series resistance of a short conductor-loss stub comes out half the true R′·l, because
 * Im Z0 ≈ −Z0·(R′/ωL′ − G′/ωC′)/2 contributes to Re Zin at first order.
 * 1 Np = 20·log10(e) dB ≈ 8.686 dB (definition of the neper).
 */
import { type Complex, cdiv, cmul, complex } from './complex.js';
import { c0 } from './constants.js';
import type { LineAtFrequency, LineModel } from './types.js';

/** dB per neper: 20·log10(e) = 20/ln 10 ≈ 8.685890. */
export const DB_PER_NEPER = 20 / Math.LN10;

/** Np/m → dB/m. */
export const nepersToDb = (alphaNp: number): number => alphaNp * DB_PER_NEPER;

/** dB/m → Np/m. */
export const dbToNepers = (alphaDb: number): number => alphaDb / DB_PER_NEPER;

/** Attenuation split by cause, Np/m. `alpha` is always alphaC + alphaD. */
export interface LossBreakdown {
  /** Conductor attenuation α_c, Np/m. */
  alphaC: number;
  /** Dielectric attenuation α_d, Np/m. */
  alphaD: number;
  /** Total α = α_c + α_d, Np/m. */
  alpha: number;
}

/** The same split in dB/m, for display. */
export interface LossBreakdownDb {
  alphaCDbPerM: number;
  alphaDDbPerM: number;
  alphaDbPerM: number;
}

/** A line state with its attenuation split; assignable to LineAtFrequency. */
export type LossyLineAtFrequency = LineAtFrequency & LossBreakdown;

/** A line model that reports α_c and α_d separately; usable wherever a LineModel is. */
export type LossyLineModel = (frequencyHz: number) => LossyLineAtFrequency;

/** α = α_c + α_d (low-loss line, Pozar 4th ed. §2.7). Throws a RangeError for negative or non-finite parts. */
export function totalAlpha(alphaC: number, alphaD: number): LossBreakdown {
  for (const [name, v] of [['alphaC', alphaC], ['alphaD', alphaD]] as const) {
    if (!(v >= 0) || !Number.isFinite(v)) throw new RangeError(`${name} must be a finite attenuation ≥ 0 Np/m, got ${v}`);
  }
  return { alphaC, alphaD, alpha: alphaC + alphaD };
}

/** The split in dB/m. */
export function lossBreakdownDb(loss: LossBreakdown): LossBreakdownDb {
  return { alphaCDbPerM: nepersToDb(loss.alphaC), alphaDDbPerM: nepersToDb(loss.alphaD), alphaDbPerM: nepersToDb(loss.alpha) };
}

/**
 * Adds an explicit conductor attenuation to a line whose own α is taken as dielectric loss
 * (an ideal line has no geometry from which to derive α_c, so the caller gives it).
 * @param alphaC α_c(f), Np/m (≥ 0)
 */
export function withConductorLoss(line: LineModel, alphaC: (frequencyHz: number) => number): LossyLineModel {
  return (frequencyHz) => {
    const at = line(frequencyHz);
    return { z0: at.z0, epsEff: at.epsEff, ...totalAlpha(alphaC(frequencyHz), at.alpha) };
  };
}

/** Per-metre parameters: Ω/m, H/m, S/m, F/m. */
export interface RlgcPerMetre {
  r: number;
  l: number;
  g: number;
  c: number;
}

/**
 * R′ = 2·Z0·α_c, L′ = Z0·√εeff/c0, G′ = 2·α_d/Z0, C′ = √εeff/(Z0·c0) of a line at one frequency
 * (the low-loss relations read backwards).
 */
export function rlgcOf(line: LossyLineAtFrequency): RlgcPerMetre {
  const root = Math.sqrt(line.epsEff);
  return { r: 2 * line.z0 * line.alphaC, l: (line.z0 * root) / c0, g: (2 * line.alphaD) / line.z0, c: root / (line.z0 * c0) };
}

/** Principal square root, free of cancellation on either half-plane. */
function csqrt(z: Complex): Complex {
  const r = Math.hypot(z.re, z.im);
  if (r === 0) return complex(0);
  if (z.re >= 0) {
    const re = Math.sqrt((r + z.re) / 2);
    return complex(re, z.im / (2 * re));
  }
  const im = Math.sqrt((r - z.re) / 2) * (z.im < 0 ? -1 : 1);
  return complex(z.im / (2 * im), im);
}

/**
 * Complex Z0 = √Z′/√Y′ and γ = √Z′·√Y′ of the exact RLGC line, Z′ = R′ + jωL′, Y′ = G′ + jωC′
 * (Pozar 4th ed. §2.1). Both roots stay on the principal branch for R′, L′, G′, C′ ≥ 0.
 */
export function rlgcLineAt(rlgc: RlgcPerMetre, frequencyHz: number): { z0: Complex; gamma: Complex } {
  const w = 2 * Math.PI * frequencyHz;
  const sz = csqrt(complex(rlgc.r, w * rlgc.l));
  const sy = csqrt(complex(rlgc.g, w * rlgc.c));
  return { z0: cdiv(sz, sy), gamma: cmul(sz, sy) };
}
