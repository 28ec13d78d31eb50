import { describe, expect, it } from 'vitest';
import { c0 } from './constants.js';
import { coplanarLine } from './coplanarLine.js';
import { coplanarStatic } from './coplanarStatic.js';
import { quasiTemDielectricAlpha } from './microstripLine.js';
import { analyseStub } from './stub.js';

const rel = (a: number, b: number) => Math.abs(a / b - 1);
const base = { widthM: 0.6e-3, gapM: 0.15e-3, heightM: 0.8e-3, dk: 3.5, grounded: false };

describe('coplanarLine as a LineModel', () => {
  it('returns the static Z0 and εeff at every frequency (quasi-static, no dispersion)', () => {
    for (const grounded of [false, true]) {
      const s = coplanarStatic({ ...base, grounded });
      const line = coplanarLine({ ...base, grounded, df: 0.002 });
      expect(line(0)).toEqual({ z0: s.z0, epsEff: s.epsEff, alpha: 0 });
      expect(line(30e9).z0).toBe(s.z0);
      expect(line(30e9).epsEff).toBe(s.epsEff);
    }
  });

  it('plugs into the stub engine: an open stub a quarter guided wavelength long is resonant there', () => {
    const f = 4e9;
    const model = coplanarLine(base);
    expect(analyseStub('open', model, c0 / (f * Math.sqrt(model(f).epsEff)) / 4, f).behaviour).toBe('resonant');
  });

  it('throws RangeError for a bad loss tangent, geometry or frequency', () => {
    expect(() => coplanarLine({ ...base, df: -1e-3 })).toThrow(/df/);
    expect(() => coplanarLine({ ...base, gapM: -1 })).toThrow(/gapM/);
    expect(() => coplanarLine(base)(Number.NaN)).toThrow(/frequencyHz/);
  });
});

describe('coplanarLine dielectric loss (Pozar 4th ed. eq. 3.198, filling factor from the map)', () => {
  it('equals eq. 3.198 with the line’s own εeff', () => {
    for (const grounded of [false, true]) {
      const line = coplanarLine({ ...base, grounded, df: 0.004 })(6e9);
      expect(rel(line.alpha, quasiTemDielectricAlpha(base.dk, line.epsEff, 0.004, 6e9))).toBeLessThan(1e-12);
    }
  });

  it('lies below the bulk value k0·√εr·tanδ/2 and tends to it when the backing plane is very close', () => {
    // Exact limit: with h ≪ s the backed line is a filled parallel plate (q → 1, εeff → εr).
    const f = 10e9;
    const bulk = (((2 * Math.PI * f) / c0) * Math.sqrt(base.dk) * 0.01) / 2;
    expect(coplanarLine({ ...base, df: 0.01 })(f).alpha).toBeLessThan(bulk);
    expect(rel(coplanarLine({ ...base, heightM: 1e-7, grounded: true, df: 0.01 })(f).alpha, bulk)).toBeLessThan(1e-3);
  });

  it('is defined at εr = 1 (lossy air-like fill): the field fraction in the substrate times the bulk loss', () => {
    // No 0/0: q comes from the conformal map, not from (εeff − 1)/(εr − 1).
    const line = coplanarLine({ ...base, dk: 1, df: 0.01 })(1e9);
    const q = coplanarStatic({ ...base, dk: 1 }).fillingFactor;
    expect(rel(line.alpha, (((2 * Math.PI * 1e9) / c0) * q * 0.01) / 2)).toBeLessThan(1e-12);
    expect(q).toBeGreaterThan(0);
    expect(q).toBeLessThan(0.5);
  });
});
