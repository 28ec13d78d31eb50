import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { mu0, sigmaCopperAnnealed } from './constants.js';
import { groissRoughness, hammerstadBekkadalRoughness, roughnessFactor, skinDepth, surfaceResistance } from './skin.js';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('skin depth and surface resistance (Pozar 4th ed. §1.7–1.8)', () => {
  // Pozar, Microwave Engineering, 4th ed., §1.7 worked example on skin depths at 10 GHz, with the
  // conductivities of its Appendix F (both from memory): Al 3.816e7 → 0.814 µm, Cu 5.813e7 →
  // 0.660 µm, Au 4.098e7 → 0.786 µm, Ag 6.173e7 → 0.640 µm.
  it('matches the textbook skin depths of four metals at 10 GHz to the printed 3 digits', () => {
    const cases: Array<[number, number]> = [[3.816e7, 0.814e-6], [5.813e7, 0.66e-6], [4.098e7, 0.786e-6], [6.173e7, 0.64e-6]];
    for (const [sigma, delta] of cases) expect(rel(skinDepth(10e9, sigma), delta)).toBeLessThan(0.002);
  });

  // Pozar 4th ed. Example 3.5 (copper stripline at 10 GHz, from memory): Rs = 0.026 Ω.
  it('gives Rs = 0.026 Ω for copper (5.813e7 S/m) at 10 GHz', () => {
    expect(surfaceResistance(10e9, 5.813e7)).toBeCloseTo(0.026, 3);
  });

  it('Rs = 1/(σδ), and δ defaults to annealed copper (5.8e7 S/m)', () => {
    // Identity of the two forms; no source needed.
    fc.assert(fc.property(fc.double({ min: 1, max: 1e12, noNaN: true }), fc.double({ min: 1e5, max: 1e8, noNaN: true }), (f, sigma) => {
      expect(rel(surfaceResistance(f, sigma), 1 / (sigma * skinDepth(f, sigma)))).toBeLessThan(1e-12);
    }));
    expect(skinDepth(1e9)).toBe(skinDepth(1e9, sigmaCopperAnnealed));
    expect(surfaceResistance(1e9)).toBe(Math.sqrt((Math.PI * 1e9 * mu0) / 5.8e7));
  });

  it('Rs grows as √f and δ falls as 1/√f', () => {
    fc.assert(fc.property(fc.double({ min: 1e3, max: 1e11, noNaN: true }), (f) => {
      expect(rel(surfaceResistance(4 * f), 2 * surfaceResistance(f))).toBeLessThan(1e-12);
      expect(rel(skinDepth(4 * f), skinDepth(f) / 2)).toBeLessThan(1e-12);
    }));
  });

  it('f = 0: no surface resistance, infinite skin depth', () => {
    expect(surfaceResistance(0)).toBe(0);
    expect(skinDepth(0)).toBe(Infinity);
  });

  it('rejects negative frequency and non-positive conductivity with a RangeError', () => {
    expect(() => skinDepth(-1)).toThrow(/frequencyHz/);
    expect(() => surfaceResistance(1e9, 0)).toThrow(/conductivity/);
    expect(() => surfaceResistance(1e9, Number.NaN)).toThrow(RangeError);
  });
});

describe('surface roughness factor', () => {
  const ratio = fc.double({ min: 0, max: 50, noNaN: true });

  // Hammerstad–Bekkadal 1975 and Groiss 1996 (see skin.ts): both are 1 when smooth, rise
  // monotonically with Δ/δ and saturate at 2.
  it('lies in [1, 2] and is monotone in Δ/δ for both models', () => {
    for (const k of [hammerstadBekkadalRoughness, groissRoughness]) {
      fc.assert(fc.property(ratio, ratio, (a, b) => {
        const [lo, hi] = a <= b ? [a, b] : [b, a];
        expect(k(lo)).toBeGreaterThanOrEqual(1);
        expect(k(hi)).toBeLessThanOrEqual(2);
        expect(k(lo)).toBeLessThanOrEqual(k(hi));
      }));
      expect(k(0)).toBe(1);
      expect(k(1e6)).toBeCloseTo(2, 6);
    }
  });

  it('Hammerstad–Bekkadal: K = 1 + (2/π)·atan(1.4) ≈ 1.6051 at Δ = δ', () => {
    // Direct evaluation of the published form; the number is arithmetic, not a quoted value.
    expect(hammerstadBekkadalRoughness(1)).toBeCloseTo(1 + (2 / Math.PI) * Math.atan(1.4), 14);
    expect(hammerstadBekkadalRoughness(1)).toBeCloseTo(1.6051, 4);
  });

  it('Groiss: K = 1 + e^(−1) at Δ = δ/2', () => {
    expect(groissRoughness(0.5)).toBeCloseTo(1 + Math.exp(-1), 14);
  });

  it('roughnessFactor picks the model and defaults to Hammerstad–Bekkadal', () => {
    expect(roughnessFactor(1e-6, 2e-6)).toBe(hammerstadBekkadalRoughness(0.5));
    expect(roughnessFactor(1e-6, 2e-6, 'groiss')).toBe(groissRoughness(0.5));
    expect(roughnessFactor(0, 1e-6)).toBe(1);
    expect(roughnessFactor(1e-6, Infinity)).toBe(1);
  });

  it('rejects negative roughness and non-positive skin depth', () => {
    expect(() => roughnessFactor(-1e-6, 1e-6)).toThrow(/roughnessM/);
    expect(() => roughnessFactor(1e-6, 0)).toThrow(/skin depth/);
  });
});
