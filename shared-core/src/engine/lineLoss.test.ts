import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { coaxLine, coaxLossyLine } from './coaxLine.js';
import { coaxConductorAlpha, microstripConductorResistanceModel } from './conductorLoss.js';
import { c0, sigmaCopperAnnealed } from './constants.js';
import { idealLine, temDielectricAlpha } from './idealLine.js';
import {
  DB_PER_NEPER,
  dbToNepers,
  lossBreakdownDb,
  nepersToDb,
  rlgcLineAt,
  rlgcOf,
  totalAlpha,
  withConductorLoss,
} from './lineLoss.js';
import { microstripLine, microstripLossyLine } from './microstripLine.js';

const rel = (a: number, b: number) => Math.abs(a / b - 1);
const base = { widthM: 1.7e-3, heightM: 0.762e-3, dk: 3.5, thicknessM: 35e-6 };

describe('nepers and decibels', () => {
  // Definition of the neper: 1 Np = 20·log10(e) dB = 8.685 889 638… dB.
  it('1 Np/m is 8.6859 dB/m and the conversion round-trips', () => {
    expect(DB_PER_NEPER).toBeCloseTo(8.685889638, 9);
    fc.assert(fc.property(fc.double({ min: 0, max: 1e4, noNaN: true }), (a) => {
      expect(dbToNepers(nepersToDb(a))).toBeCloseTo(a, 9);
    }));
  });

  it('splits and converts α = α_c + α_d', () => {
    const loss = totalAlpha(0.1, 0.05);
    expect(loss.alpha).toBeCloseTo(0.15, 15);
    const db = lossBreakdownDb(loss);
    expect(db.alphaDbPerM).toBeCloseTo(db.alphaCDbPerM + db.alphaDDbPerM, 12);
    expect(db.alphaCDbPerM).toBeCloseTo(0.1 * DB_PER_NEPER, 12);
  });

  it('rejects negative or non-finite parts', () => {
    expect(() => totalAlpha(-0.1, 0)).toThrow(/alphaC/);
    expect(() => totalAlpha(0, Number.NaN)).toThrow(/alphaD/);
  });
});

describe('microstrip with conductor loss', () => {
  it('without conductivity is the dielectric-only line of before (α_c = 0)', () => {
    const lossy = microstripLossyLine({ ...base, df: 0.002 });
    const plain = microstripLine({ ...base, df: 0.002 });
    for (const f of [0, 1e9, 10e9]) {
      const at = lossy(f);
      expect(at.alphaC).toBe(0);
      expect(plain(f)).toEqual({ z0: at.z0, epsEff: at.epsEff, alpha: at.alphaD });
    }
  });

  it('α_c = R′(f)/(2·Z0(f)) with the line’s own dispersive Z0, and α = α_c + α_d', () => {
    const lossy = microstripLossyLine({ ...base, df: 0.002, conductivity: sigmaCopperAnnealed, roughnessM: 0.5e-6 });
    const r = microstripConductorResistanceModel(base, { roughnessM: 0.5e-6 });
    for (const f of [1e9, 5e9, 20e9]) {
      const at = lossy(f);
      expect(rel(at.alphaC, r(f) / (2 * at.z0))).toBeLessThan(1e-14);
      expect(at.alpha).toBe(at.alphaC + at.alphaD);
      expect(microstripLine({ ...base, df: 0.002, conductivity: sigmaCopperAnnealed, roughnessM: 0.5e-6 })(f).alpha).toBe(at.alpha);
    }
    expect(lossy(0)).toMatchObject({ alphaC: 0, alphaD: 0, alpha: 0 });
  });

  // Orders of magnitude for a 50 Ω line on a 0.76 mm, εr 3.5 laminate with 35 µm copper: conductor
  // loss of a few tenths of a dB per metre per √GHz, and conductor loss above the dielectric loss
  // of tanδ = 0.002 at 1 GHz (common practice, no source; exact values are checked in test/).
  it('gives plausible magnitudes for a 50 Ω line on a common laminate', () => {
    const at = microstripLossyLine({ ...base, df: 0.002, conductivity: sigmaCopperAnnealed })(1e9);
    expect(at.z0).toBeGreaterThan(45);
    expect(at.z0).toBeLessThan(55);
    expect(nepersToDb(at.alphaC)).toBeGreaterThan(0.2);
    expect(nepersToDb(at.alphaC)).toBeLessThan(1);
    expect(at.alphaC).toBeGreaterThan(at.alphaD);
  });

  it('rejects conductor loss on a zero-thickness strip and roughness without conductivity', () => {
    expect(() => microstripLossyLine({ ...base, thicknessM: 0, conductivity: 5.8e7 })).toThrow(/thicknessM > 0/);
    expect(() => microstripLossyLine({ ...base, roughnessM: 1e-6 })).toThrow(/also give conductivity/);
    expect(() => microstripLine({ ...base, conductivity: Number.NaN })).toThrow(/conductivity/);
  });
});

describe('coax with conductor loss', () => {
  const spec = { innerDiameterM: 0.91e-3, outerDiameterM: 2.95e-3, dk: 2.1, df: 3e-4 };

  it('adds the exact conductor loss to the TEM dielectric loss when conductivity is given', () => {
    const lossy = coaxLossyLine({ ...spec, conductivity: sigmaCopperAnnealed });
    const at = lossy(3e9);
    expect(at.alphaC).toBe(coaxConductorAlpha(spec, 3e9, { conductivity: sigmaCopperAnnealed }));
    expect(at.alphaD).toBe(temDielectricAlpha(2.1, 3e-4, 3e9));
    expect(coaxLine({ ...spec, conductivity: sigmaCopperAnnealed })(3e9).alpha).toBe(at.alpha);
    expect(coaxLine(spec)(3e9).alpha).toBe(at.alphaD);
  });

  it('rejects roughness without conductivity and a bad conductivity', () => {
    expect(() => coaxLine({ ...spec, roughnessM: 1e-6 })).toThrow(/also give conductivity/);
    expect(() => coaxLine({ ...spec, conductivity: 0 })).toThrow(/conductivity/);
  });
});

describe('explicit conductor loss on an ideal line', () => {
  it('keeps the line’s own α as α_d and adds the given α_c', () => {
    const line = withConductorLoss(idealLine({ z0: 50, epsEff: 2.2, df: 0.001 }), (f) => 1e-5 * Math.sqrt(f));
    const at = line(4e8);
    expect(at.alphaD).toBe(temDielectricAlpha(2.2, 0.001, 4e8));
    expect(at.alphaC).toBeCloseTo(0.2, 14);
    expect(at.alpha).toBe(at.alphaC + at.alphaD);
    expect(() => withConductorLoss(idealLine({ z0: 50 }), () => -1)(1e9)).toThrow(RangeError);
  });
});

describe('RLGC per metre from a lossy line state', () => {
  // Pozar 4th ed. §2.1 and §2.7 (from memory): Z0 = √((R + jωL)/(G + jωC)), γ = √((R + jωL)(G + jωC));
  // for a low-loss line α ≈ R/(2Z0) + G·Z0/2, β ≈ ω√(LC), Z0 ≈ √(L/C)·(1 − j(R/ωL − G/ωC)/2).
  it('rebuilds α, β and Z0 to second order in the loss', () => {
    const line = microstripLossyLine({ ...base, df: 0.004, conductivity: sigmaCopperAnnealed });
    for (const f of [5e8, 3e9]) {
      const at = line(f);
      const rlgc = rlgcOf(at);
      const { z0, gamma } = rlgcLineAt(rlgc, f);
      const w = 2 * Math.PI * f;
      const beta = (w * Math.sqrt(at.epsEff)) / c0;
      const eps = at.alpha / beta; // 1/(2Q)
      expect(rel(gamma.re, at.alpha)).toBeLessThan(4 * eps * eps);
      expect(rel(gamma.im, beta)).toBeLessThan(4 * eps * eps);
      expect(rel(z0.re, at.z0)).toBeLessThan(4 * eps * eps);
      const imExpected = (-at.z0 * (rlgc.r / (w * rlgc.l) - rlgc.g / (w * rlgc.c))) / 2;
      expect(Math.abs(z0.im - imExpected)).toBeLessThan(at.z0 * 4 * eps * eps);
      expect(Math.sqrt(rlgc.l / rlgc.c)).toBeCloseTo(at.z0, 10);
    }
  });
});
