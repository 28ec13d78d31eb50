import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { mu0 } from './constants.js';
import { GP_MODEL, goldfarbPucelInductance, viaInductance } from './via.js';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('Goldfarb–Pucel via inductance', () => {
  // Goldfarb & Pucel, IEEE MGWL 1(6), 1991, as restated in secondary sources:
  // L = (μ0/2π)·[h·ln((h + √(r² + h²))/r) + 1.5·(r − √(r² + h²))]. Worked by hand for h = 1.6 mm,
  // D = 0.4 mm (r = 0.2 mm): √(r² + h²) = 1.612452 mm, ln(3.212452/0.2) = 2.776472,
  // bracket = 4.442356 − 2.118677 = 2.323678 mm, L = 2.0e-7 H/m × 2.323678e-3 m = 0.464736 nH.
  it('matches a hand evaluation for a 1.6 mm board and a 0.4 mm drill', () => {
    const { inductanceH, notes } = viaInductance({ heightM: 1.6e-3, diameterM: 0.4e-3 });
    expect(rel(inductanceH, 0.464736e-9)).toBeLessThan(2e-6);
    expect(notes).toEqual([]);
  });

  // ENGINEERING.md pitfall 7: the formula takes the radius. Feeding it the diameter is 21 % low here.
  it('uses the radius D/2, not the diameter', () => {
    const viaL = viaInductance({ heightM: 1.6e-3, diameterM: 0.4e-3 }).inductanceH;
    expect(viaL).toBe(goldfarbPucelInductance(1.6e-3, 0.2e-3));
    expect(goldfarbPucelInductance(1.6e-3, 0.4e-3) / viaL).toBeLessThan(0.8);
  });

  // Exact expansion of the formula for r ≪ h: L = (μ0/2π)·{h·[ln(2h/r) − 1.5] + 1.5·r} + O(r²/h).
  it('tends to (μ0/2π)·{h·[ln(2h/r) − 1.5] + 1.5·r} for a thin via', () => {
    const h = 1e-3;
    const r = 1e-8;
    expect(rel(goldfarbPucelInductance(h, r), (mu0 / (2 * Math.PI)) * (h * (Math.log((2 * h) / r) - 1.5) + 1.5 * r))).toBeLessThan(1e-9);
  });

  // Common practice, no source: the isolated-wire rule of thumb L ≈ (μ0/2π)·h·[ln(4h/D) + 1]
  // (5.08·h·[ln(4h/D) + 1] nH with h, D in inches) ignores the ground return and overstates a via.
  it('lies below the isolated-wire rule of thumb', () => {
    for (const [h, d] of [[1.6e-3, 0.4e-3], [0.8e-3, 0.3e-3], [0.2e-3, 0.2e-3]] as const) {
      const wire = (mu0 / (2 * Math.PI)) * h * (Math.log((4 * h) / d) + 1);
      expect(viaInductance({ heightM: h, diameterM: d }).inductanceH).toBeLessThan(wire);
    }
  });

  it('property: positive, scales linearly with size, grows with h and falls with D', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-5, max: 5e-3, noNaN: true }), fc.double({ min: 0.01, max: 10, noNaN: true }), fc.double({ min: 0.1, max: 10, noNaN: true }), (h, dOverH, k) => {
        const d = dOverH * h;
        const base = viaInductance({ heightM: h, diameterM: d }).inductanceH;
        expect(base).toBeGreaterThan(0);
        expect(rel(viaInductance({ heightM: k * h, diameterM: k * d }).inductanceH, k * base)).toBeLessThan(1e-9);
        expect(viaInductance({ heightM: h * 1.1, diameterM: d }).inductanceH).toBeGreaterThan(base);
        expect(viaInductance({ heightM: h, diameterM: d * 1.1 }).inductanceH).toBeLessThan(base);
      }),
    );
  });

  it('notes h/λ0 above 0.03, the range the authors verified', () => {
    const via = { heightM: 1.6e-3, diameterM: 0.4e-3 };
    expect(viaInductance(via, 5e9).notes).toEqual([]); // h/λ0 = 0.027
    const [note] = viaInductance(via, 6e9).notes; // h/λ0 = 0.032
    expect(note?.model).toBe(GP_MODEL);
    expect(note?.parameter).toBe('h/λ0');
  });

  it('throws a RangeError for a non-positive height or diameter', () => {
    expect(() => viaInductance({ heightM: 0, diameterM: 0.3e-3 })).toThrow(/heightM/);
    expect(() => viaInductance({ heightM: 1e-3, diameterM: -1 })).toThrow(/diameterM/);
    expect(() => viaInductance({ heightM: 1e-3, diameterM: Number.NaN })).toThrow(RangeError);
  });
});
