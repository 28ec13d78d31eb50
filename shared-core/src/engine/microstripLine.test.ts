import { describe, expect, it } from 'vitest';
import { c0 } from './constants.js';
import { microstripAt } from './microstripDispersion.js';
import { microstripLine, quasiTemDielectricAlpha } from './microstripLine.js';
import { microstripStatic } from './microstripStatic.js';
import { analyseStub } from './stub.js';

const rel = (a: number, b: number) => Math.abs(a / b - 1);
const base = { widthM: 1.2e-3, heightM: 0.762e-3, dk: 3.5, thicknessM: 35e-6 };

describe('microstripLine as a LineModel', () => {
  it('f = 0 gives the static Z0 and εeff with no loss', () => {
    const s = microstripStatic(base);
    expect(microstripLine({ ...base, df: 0.004 })(0)).toEqual({ z0: s.z0, epsEff: s.epsEff, alpha: 0 });
  });

  it('returns the dispersive Z0(f) and εeff(f) of the same geometry', () => {
    const at = microstripAt(base, 12e9);
    const line = microstripLine(base)(12e9);
    expect(line.z0).toBe(at.z0);
    expect(line.epsEff).toBe(at.epsEff);
    expect(line.alpha).toBe(0);
  });

  it('plugs into the stub engine: an open stub a quarter guided wavelength long is resonant there', () => {
    const f = 5e9;
    const model = microstripLine(base);
    const lambdaG = c0 / (f * Math.sqrt(model(f).epsEff));
    expect(analyseStub('open', model, lambdaG / 4, f).behaviour).toBe('resonant');
  });
});

describe('microstripLine dielectric loss (Pozar 4th ed. eq. 3.198)', () => {
  it('tends to the bulk TEM value k0·√εr·tanδ/2 for a very wide strip', () => {
    // Exact limit: a filled TEM line has α_d = k·tanδ/2 (Pozar 4th ed. §3.1, from memory of the
    // section); a wide strip fills its field with substrate.
    const f = 10e9;
    const k0 = (2 * Math.PI * f) / c0;
    const line = microstripLine({ widthM: 1, heightM: 1e-4, dk: 4, df: 0.01 })(f);
    expect(rel(line.alpha, (k0 * 2 * 0.01) / 2)).toBeLessThan(1e-3);
  });

  it('lies between the half-filled and the fully filled values', () => {
    // Follows from 1 < εeff < εr in eq. 3.198: α_d/(k0·tanδ/2) = εr·q/√εeff with 0 < q < 1.
    const f = 3e9;
    const k0 = (2 * Math.PI * f) / c0;
    const a = microstripLine({ ...base, df: 0.002 })(f).alpha;
    expect(a).toBeGreaterThan(0);
    expect(a).toBeLessThan((k0 * Math.sqrt(base.dk) * 0.002) / 2);
  });

  it('is proportional to tanδ and, where dispersion is negligible, to f', () => {
    const l1 = microstripLine({ ...base, df: 0.001 });
    const l2 = microstripLine({ ...base, df: 0.002 });
    expect(rel(l2(1e9).alpha, 2 * l1(1e9).alpha)).toBeLessThan(1e-12);
    expect(rel(l1(2e8).alpha, 2 * l1(1e8).alpha)).toBeLessThan(1e-4);
  });

  it('matches eq. 3.198 evaluated with the line’s own εeff(f)', () => {
    const f = 8e9;
    const line = microstripLine({ ...base, df: 0.0037 })(f);
    expect(line.alpha).toBe(quasiTemDielectricAlpha(base.dk, line.epsEff, 0.0037, f));
  });

  it('εr = 1 with a loss tangent stays finite (the 0/0 filling factor is resolved)', () => {
    const f = 10e9;
    const k0 = (2 * Math.PI * f) / c0;
    const a = microstripLine({ widthM: 1e-3, heightM: 1e-3, dk: 1, df: 0.01 })(f).alpha;
    expect(a).toBeGreaterThan((k0 * 0.01) / 4);
    expect(a).toBeLessThan((k0 * 0.01) / 2);
  });
});

describe('microstripLine input checks', () => {
  it('throws RangeError at construction for bad geometry or loss tangent', () => {
    expect(() => microstripLine({ ...base, widthM: 0 })).toThrow(RangeError);
    expect(() => microstripLine({ ...base, df: -0.001 })).toThrow(/df/);
    expect(() => microstripLine({ ...base, df: Number.NaN })).toThrow(RangeError);
  });

  it('throws RangeError for negative or non-finite frequency', () => {
    const line = microstripLine(base);
    for (const f of [-1, Number.NaN, Number.POSITIVE_INFINITY]) expect(() => line(f)).toThrow(RangeError);
  });
});
