import { describe, expect, it } from 'vitest';
import { c0 } from './constants.js';
import { striplineStatic } from './striplineStatic.js';
import { striplineLine } from './striplineLine.js';
import { analyseStub } from './stub.js';

const rel = (a: number, b: number) => Math.abs(a / b - 1);
const base = { widthM: 0.3e-3, heightM: 0.8e-3, dk: 3.5, thicknessM: 18e-6 };

describe('striplineLine as a LineModel', () => {
  it('returns the static Z0 and εeff = εr at every frequency (TEM, quasi-static)', () => {
    const s = striplineStatic(base);
    const line = striplineLine({ ...base, df: 0.003 });
    expect(line(0)).toEqual({ z0: s.z0, epsEff: 3.5, alpha: 0 });
    expect(line(20e9).z0).toBe(s.z0);
    expect(line(20e9).epsEff).toBe(3.5);
  });

  it('dielectric loss is the TEM value π·f·√εr·tanδ/c0: 0.155 Np/m for Pozar’s Example 3.5', () => {
    // Pozar, Microwave Engineering, 4th ed., Example 3.5 (from memory): 10 GHz, εr = 2.20,
    // tanδ = 0.001 → k = 310.6 m⁻¹, α_d = k·tanδ/2 = 0.155 Np/m.
    const line = striplineLine({ widthM: 2.653e-3, heightM: 3.2e-3, dk: 2.2, df: 0.001 });
    expect(line(10e9).alpha).toBeCloseTo(0.155, 3);
    expect(rel(line(10e9).alpha, (Math.PI * 10e9 * Math.sqrt(2.2) * 0.001) / c0)).toBeLessThan(1e-15);
    expect(striplineLine({ widthM: 2.653e-3, heightM: 3.2e-3, dk: 2.2 })(10e9).alpha).toBe(0);
  });

  it('plugs into the stub engine: an open stub a quarter wavelength long is resonant there', () => {
    const f = 5e9;
    const lambda = c0 / (f * Math.sqrt(base.dk));
    expect(analyseStub('open', striplineLine(base), lambda / 4, f).behaviour).toBe('resonant');
  });

  it('throws RangeError for a bad loss tangent, geometry or frequency', () => {
    expect(() => striplineLine({ ...base, df: -0.01 })).toThrow(/df/);
    expect(() => striplineLine({ ...base, thicknessM: 1e-3 })).toThrow(/less than heightM/);
    expect(() => striplineLine(base)(-1)).toThrow(/frequencyHz/);
  });
});
