import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { coaxZ0 } from './coaxLine.js';
import {
  coaxConductorAlpha,
  coaxConductorResistance,
  microstripAirImpedance,
  microstripAirImpedanceSlope,
  microstripConductorAlpha,
  microstripConductorNotes,
  microstripConductorResistanceModel,
  wheelerAirImpedanceSlope,
} from './conductorLoss.js';
import { eta0 } from './constants.js';
import { microstripStatic } from './microstripStatic.js';
import { hammerstadBekkadalRoughness, skinDepth, surfaceResistance } from './skin.js';

const rel = (a: number, b: number) => Math.abs(a / b - 1);
const h = 0.762e-3;
const strip = (u: number, t = 35e-6, dk = 3.5) => ({ widthM: u * h, heightM: h, dk, thicknessM: t });

describe('coax conductor loss (exact TEM result)', () => {
  const coax = { innerDiameterM: 0.91e-3, outerDiameterM: 2.95e-3, dk: 2.1 };

  // Pozar 4th ed. §2.7: Wheeler's rule applied to coax, a → a − n, b → b + n, gives the closed form
  // α_c = Rs·(1/a + 1/b)/(2η·ln(b/a)) (from memory). Checked here against a numerical derivative of
  // the engine's own coaxZ0 with the walls receded, which shares no code with the closed form.
  it('equals Wheeler’s rule evaluated numerically on coaxZ0 with receding walls, to 1e-8', () => {
    for (const f of [1e8, 1e9, 1e10]) {
      const slope = wheelerAirImpedanceSlope((n) => coaxZ0(coax.innerDiameterM - 2 * n, coax.outerDiameterM + 2 * n, 1), 1e-9);
      const numeric = (surfaceResistance(f) * slope) / eta0 / (2 * coaxZ0(coax.innerDiameterM, coax.outerDiameterM, coax.dk));
      expect(rel(coaxConductorAlpha(coax, f), numeric)).toBeLessThan(1e-8);
    }
  });

  // Pozar 4th ed. Table 2.1 (from memory): coax R = (Rs/2π)·(1/a + 1/b); low-loss α_c = R/(2Z0).
  it('is R/(2·Z0) with the per-metre resistance of the textbook table', () => {
    const [a, b] = [coax.innerDiameterM / 2, coax.outerDiameterM / 2];
    const r = (surfaceResistance(3e9) / (2 * Math.PI)) * (1 / a + 1 / b);
    expect(rel(coaxConductorResistance(coax.innerDiameterM, coax.outerDiameterM, 3e9), r)).toBeLessThan(1e-13);
    expect(rel(coaxConductorAlpha(coax, 3e9), r / (2 * coaxZ0(coax.innerDiameterM, coax.outerDiameterM, coax.dk)))).toBeLessThan(1e-13);
  });

  // Common practice, no source: at fixed outer diameter the conductor loss is least at b/a = 3.5911,
  // the root of ln x = 1 + 1/x (d/dx of (1 + x)/ln x = 0); an air line there is about 77 Ω.
  it('is least at b/a ≈ 3.5911 for a fixed outer diameter', () => {
    const x0 = 3.5911;
    expect(Math.log(x0) - 1 - 1 / x0).toBeCloseTo(0, 4);
    const at = (x: number) => coaxConductorAlpha({ innerDiameterM: 7e-3 / x, outerDiameterM: 7e-3, dk: 1 }, 1e9);
    expect(at(x0)).toBeLessThan(at(x0 * 0.99));
    expect(at(x0)).toBeLessThan(at(x0 * 1.01));
  });

  it('scales as √εr at fixed geometry (η = η0/√εr) and as √f', () => {
    const air = coaxConductorAlpha({ ...coax, dk: 1 }, 2e9);
    expect(rel(coaxConductorAlpha({ ...coax, dk: 4 }, 2e9), 2 * air)).toBeLessThan(1e-13);
    expect(rel(coaxConductorAlpha(coax, 8e9), 2 * coaxConductorAlpha(coax, 2e9))).toBeLessThan(1e-13);
  });

  it('rejects impossible geometry and conductors', () => {
    expect(() => coaxConductorAlpha({ ...coax, outerDiameterM: 0.5e-3 }, 1e9)).toThrow(/outer diameter/);
    expect(() => coaxConductorAlpha(coax, 1e9, { conductivity: -1 })).toThrow(/conductivity/);
  });
});

describe('microstrip conductor loss (Wheeler 1942 on Hammerstad–Jensen 1980)', () => {
  // ../shared/ENGINEERING.md, formula pitfall 8 (checked there against numerical solutions): the
  // parallel-plate estimate Rs/(Z0·w) is nearly 2× too high at w/h ≈ 1. This is also the textbook
  // first estimate (Pozar 4th ed. eq. 3.199, from memory). A model that used it would fail here.
  it('is about half the parallel-plate estimate Rs/(Z0·w) at w/h = 1', () => {
    const g = strip(1);
    const f = 5e9;
    const z0 = microstripStatic(g).z0;
    const ratio = microstripConductorAlpha(g, f) / (surfaceResistance(f) / (z0 * g.widthM));
    expect(ratio).toBeGreaterThan(0.45);
    expect(ratio).toBeLessThan(0.52);
  });

  // Wheeler 1942 states the rule as a derivative; its classic finite form recedes every surface by
  // δ/2 (w − δ, h + δ, t − δ). The two differ by O(δ/t): halving δ must roughly halve the gap.
  it('agrees with the finite recession by δ/2 to O(δ/t)', () => {
    const g = strip(1.5);
    const finiteGap = (f: number) => {
      const delta = skinDepth(f);
      const dz = microstripAirImpedance(g.widthM - delta, h + delta, g.thicknessM - delta) - microstripAirImpedance(g.widthM, h, g.thicknessM);
      const finite = (surfaceResistance(f) / eta0) * (dz / (delta / 2));
      return rel(finite, microstripConductorResistanceModel(g)(f));
    };
    const at10 = finiteGap(10e9);
    const at40 = finiteGap(40e9);
    expect(at10).toBeLessThan(0.02);
    expect(at40 / at10).toBeGreaterThan(0.4);
    expect(at40 / at10).toBeLessThan(0.6);
  });

  it('R′ rises exactly as √f for smooth copper, and α_c·Z0 with it', () => {
    fc.assert(fc.property(fc.double({ min: 0.1, max: 10, noNaN: true }), fc.double({ min: 1e7, max: 2e10, noNaN: true }), (u, f) => {
      const r = microstripConductorResistanceModel(strip(u));
      expect(rel(r(4 * f), 2 * r(f))).toBeLessThan(1e-12);
      expect(rel(microstripConductorAlpha(strip(u), 4 * f), 2 * microstripConductorAlpha(strip(u), f))).toBeLessThan(1e-12);
    }));
  });

  it('roughness multiplies α_c by the roughness factor K(Δ/δ)', () => {
    const f = 10e9;
    const smooth = microstripConductorAlpha(strip(2), f);
    const rough = microstripConductorAlpha(strip(2), f, { roughnessM: 1e-6 });
    expect(rel(rough / smooth, hammerstadBekkadalRoughness(1e-6 / skinDepth(f)))).toBeLessThan(1e-13);
  });

  it('lower conductivity and rougher copper both raise α_c', () => {
    fc.assert(fc.property(fc.double({ min: 0.1, max: 10, noNaN: true }), fc.double({ min: 0, max: 5e-6, noNaN: true }), (u, rough) => {
      const base = microstripConductorAlpha(strip(u), 5e9, { roughnessM: rough });
      expect(microstripConductorAlpha(strip(u), 5e9, { roughnessM: rough, conductivity: 3.5e7 })).toBeGreaterThan(base);
      expect(microstripConductorAlpha(strip(u), 5e9, { roughnessM: rough + 0.2e-6 })).toBeGreaterThan(base);
    }));
  });

  it('∂Z0air/∂n is positive and the differential step does not matter', () => {
    // Receding conductors always raise the air impedance (less capacitance, more inductance).
    for (const u of [0.05, 0.3, 1, 5, 30]) expect(microstripAirImpedanceSlope(strip(u))).toBeGreaterThan(0);
    const g = strip(0.7);
    const { widthM: w, thicknessM: t } = g;
    const coarse = wheelerAirImpedanceSlope((n) => microstripAirImpedance(w - 2 * n, h + 2 * n, t - 2 * n), t * 1e-3);
    expect(rel(coarse, microstripAirImpedanceSlope(g))).toBeLessThan(1e-6);
  });

  it('is 0 at f = 0 (skin-effect loss only)', () => {
    expect(microstripConductorAlpha(strip(1), 0)).toBe(0);
  });

  it('needs a strip thickness and a valid conductor', () => {
    expect(() => microstripConductorAlpha(strip(1, 0), 1e9)).toThrow(/thicknessM > 0/);
    expect(() => microstripConductorAlpha(strip(1), 1e9, { conductivity: 0 })).toThrow(/conductivity/);
    expect(() => microstripConductorAlpha(strip(1), 1e9, { roughnessM: -1e-6 })).toThrow(/roughnessM/);
    expect(() => microstripConductorAlpha({ ...strip(1), widthM: -1 }, 1e9)).toThrow(/widthM/);
  });

  it('notes a strip thinner than 3 skin depths', () => {
    // 35 µm copper: 3δ = 35 µm at about 32 MHz.
    expect(microstripConductorNotes(strip(1), 10e6)[0]?.parameter).toBe('t/δ');
    expect(microstripConductorNotes(strip(1), 100e6)).toEqual([]);
    expect(microstripConductorNotes(strip(1), 0)).toEqual([]);
  });
});
