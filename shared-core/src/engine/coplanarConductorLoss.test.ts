import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { eta0 } from './constants.js';
import { coplanarAirImpedanceSlope, coplanarConductorAlpha, coplanarConductorNotes, coplanarConductorResistanceModel } from './coplanarConductorLoss.js';
import { ellipticKRatio } from './ellipticK.js';
import { surfaceResistance } from './skin.js';

/** Zero-thickness CPW impedance in vacuum, η0/4 · K(k′)/K(k), k = a/b (Wen 1969). */
const airImpedance = (a: number, b: number): number => eta0 / (4 * ellipticKRatio(a / b));

describe('CPW conductor loss (Owyang–Wu 1958 as restated by Ghione 1993, from memory)', () => {
  const g = { widthM: 0.6e-3, gapM: 0.25e-3, thicknessM: 35e-6 };

  it('its non-logarithmic part is Wheeler\'s rule on the zero-thickness conformal map (algebraic identity)', () => {
    // (η0/8)(π/a + π/b)/(K²k′²) must equal ∂/∂n of η0/4·K(k′)/K(k) with a → a − n, b → b + n.
    for (const [w, gap] of [[0.6e-3, 0.25e-3], [0.2e-3, 0.8e-3], [2e-3, 0.1e-3]] as const) {
      const a = w / 2;
      const b = a + gap;
      const n = 1e-4 * gap;
      const numeric = (airImpedance(a - n, b + n) - airImpedance(a + n, b - n)) / (2 * n);
      // Closed form with the logarithms removed: subtract their share from the full slope at two
      // thicknesses t1, t2. Σ(t) = Σπ + (1/a + 1/b)·ln(C/t): linear in ln t, so Σπ follows exactly.
      const s1 = coplanarAirImpedanceSlope({ widthM: w, gapM: gap, thicknessM: 1e-6 });
      const s2 = coplanarAirImpedanceSlope({ widthM: w, gapM: gap, thicknessM: 2e-6 });
      const perLog = (s1 - s2) / Math.LN2; // slope share per unit of ln(1/t)
      const k = a / b;
      const logs = Math.log((4 * Math.PI * a * (1 - k)) / (1e-6 * (1 + k))) / a + Math.log((4 * Math.PI * b * (1 - k)) / (1e-6 * (1 + k))) / b;
      const piPart = s1 - (perLog * logs) / (1 / a + 1 / b);
      expect(Math.abs(piPart / numeric - 1)).toBeLessThan(1e-6);
    }
  });

  it('α_c = R′/(2·Z0) with R′ = Rs·∂Z0air/∂n/η0, and scales as √f on smooth metal', () => {
    const f = 2.45e9;
    const alpha = coplanarConductorAlpha(g, 50, f);
    expect(alpha).toBeCloseTo((surfaceResistance(f, 5.8e7) * coplanarAirImpedanceSlope(g)) / eta0 / 100, 12);
    expect(coplanarConductorAlpha(g, 50, 4 * f) / alpha).toBeCloseTo(2, 9);
    expect(coplanarConductorResistanceModel(g)(0)).toBe(0);
  });

  it('order of magnitude: 0.6 mm strip, 0.25 mm slots, 35 µm copper, εeff 1.8, 2.45 GHz is a few dB/m (common practice, no source)', () => {
    // Hand evaluation of the same closed form gives ≈ 0.26 Np/m for s = 0.3 mm, g = 0.15 mm; a
    // printed-board CPW of this size is known to lose a few dB/m at 2–3 GHz.
    const z0 = airImpedance(0.3e-3, 0.75e-3) / Math.sqrt(1.8);
    const db = coplanarConductorAlpha(g, z0, 2.45e9) * (20 / Math.LN10);
    expect(db).toBeGreaterThan(0.5);
    expect(db).toBeLessThan(6);
  });

  it('thicker metal, wider strips and slots lose less; roughness loses more (property)', () => {
    fc.assert(fc.property(
      fc.double({ min: 0.05e-3, max: 3e-3, noNaN: true }), fc.double({ min: 0.05e-3, max: 2e-3, noNaN: true }),
      fc.double({ min: 2e-6, max: 20e-6, noNaN: true }), fc.double({ min: 1.05, max: 2, noNaN: true }),
      (w, gap, t, grow) => {
        const base = coplanarAirImpedanceSlope({ widthM: w, gapM: gap, thicknessM: t });
        expect(coplanarAirImpedanceSlope({ widthM: w, gapM: gap, thicknessM: t * grow })).toBeLessThan(base);
        expect(coplanarAirImpedanceSlope({ widthM: w * grow, gapM: gap * grow, thicknessM: t })).toBeLessThan(base);
        const smooth = coplanarConductorResistanceModel({ widthM: w, gapM: gap, thicknessM: t })(5e9);
        const rough = coplanarConductorResistanceModel({ widthM: w, gapM: gap, thicknessM: t }, { roughnessM: 1e-6 })(5e9);
        expect(rough).toBeGreaterThan(smooth);
      }));
  });

  it('refuses zero thickness and metal too thick for the formula; notes thick metal, thin metal and a close backing plane', () => {
    expect(() => coplanarAirImpedanceSlope({ ...g, thicknessM: 0 })).toThrow(/metal thickness/);
    expect(() => coplanarAirImpedanceSlope({ widthM: 10e-6, gapM: 5e-6, thicknessM: 35e-6 })).toThrow(/too large/);
    expect(() => coplanarAirImpedanceSlope({ ...g, widthM: Number.NaN })).toThrow(RangeError);
    expect(coplanarConductorNotes(g, 2.45e9)).toEqual([]);
    expect(coplanarConductorNotes({ ...g, thicknessM: 0.2e-3 }, 2.45e9).map((n) => n.parameter)).toEqual(['t/g']);
    expect(coplanarConductorNotes({ ...g, thicknessM: 2e-6 }, 1e8).map((n) => n.parameter)).toEqual(['t/δ']);
    expect(coplanarConductorNotes({ ...g, heightM: 0.5e-3, grounded: true }, 2.45e9).map((n) => n.parameter)).toEqual(['h/(s+2g)']);
    expect(coplanarConductorNotes({ ...g, heightM: 0.6e-3, grounded: true }, 2.45e9)).toEqual([]);
    expect(coplanarConductorNotes({ ...g, heightM: 0.5e-3, grounded: false }, 2.45e9)).toEqual([]);
  });
});
