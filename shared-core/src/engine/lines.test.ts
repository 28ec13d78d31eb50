import { describe, expect, it } from 'vitest';
import { coaxLine, coaxNotes, coaxZ0 } from './coaxLine.js';
import { c0, eps0, eta0, mu0 } from './constants.js';
import { idealLine } from './idealLine.js';

describe('constants', () => {
  // CODATA 2018: η0 = μ0·c0 = 376.730 313 668 Ω; c0 = 1/√(μ0·ε0).
  it('are mutually consistent', () => {
    expect(eta0).toBeCloseTo(376.730313668, 6);
    expect(1 / Math.sqrt(mu0 * eps0) / c0).toBeCloseTo(1, 9);
  });
});

describe('ideal line', () => {
  it('takes εeff from dk or from the velocity factor (εeff = 1/VF²)', () => {
    expect(idealLine({ z0: 75, velocityFactor: 0.66 })(1e9).epsEff).toBeCloseTo(1 / 0.66 ** 2, 12);
    expect(idealLine({ z0: 75, epsEff: 2.25 })(1e9).epsEff).toBe(2.25);
  });
  it('rejects impossible values with a message', () => {
    expect(() => idealLine({ z0: -50 })).toThrow(/z0 must be a positive impedance/);
    expect(() => idealLine({ z0: 50, velocityFactor: 1.2 })).toThrow(/velocity factor/);
    expect(() => idealLine({ z0: 50, epsEff: 0.5 })).toThrow(/dk must be at least 1/);
  });
});

describe('coaxial line', () => {
  // Pozar, Microwave Engineering, 4th ed., Table 2.1: L = (μ/2π)·ln(b/a), C = 2π·ε/ln(b/a); Z0 = √(L/C).
  it('matches √(L/C) from the per-unit-length parameters', () => {
    const [d, D, er] = [0.9e-3, 2.95e-3, 2.1];
    const L = (mu0 / (2 * Math.PI)) * Math.log(D / d);
    const C = (2 * Math.PI * eps0 * er) / Math.log(D / d);
    expect(coaxZ0(d, D, er) / Math.sqrt(L / C)).toBeCloseTo(1, 8);
  });

  // Common practice, no source: an air line with D/d ≈ 3.59 is ≈ 77 Ω (the lowest-attenuation ratio).
  it('gives about 77 Ω for an air line with D/d = 3.59', () => {
    expect(Math.abs(coaxZ0(1, 3.59, 1) / 77 - 1)).toBeLessThan(0.01);
  });

  it('is dispersion-free and flags operation above the TE11 cutoff', () => {
    const spec = { innerDiameterM: 1.3e-3, outerDiameterM: 4.2e-3, dk: 2.1 };
    const line = coaxLine(spec);
    expect(line(1e9).epsEff).toBe(2.1);
    expect(line(1e9).z0).toBe(line(20e9).z0);
    expect(coaxNotes(spec, 1e9)).toEqual([]);
    expect(coaxNotes(spec, 40e9)[0]?.parameter).toBe('f');
  });

  it('rejects an outer diameter not larger than the inner one', () => {
    expect(() => coaxLine({ innerDiameterM: 2e-3, outerDiameterM: 1e-3, dk: 1 })).toThrow(/outer diameter must be larger/);
  });
});
