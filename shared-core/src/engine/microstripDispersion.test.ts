import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { c0 } from './constants.js';
import {
  jansenKirschningZ0Factor,
  kirschningJansenEpsEff,
  microstripAt,
  microstripEpsEffAt,
  microstripZ0At,
  normalizedFrequencyGHzMm,
} from './microstripDispersion.js';
import { microstripStatic } from './microstripStatic.js';

const geom = (u: number, dk: number, h = 0.635e-3, tOverH = 0) => ({ widthM: u * h, heightM: h, dk, thicknessM: tOverH * h });
const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('microstrip dispersion: units and limits', () => {
  it('normalised frequency is f·h in GHz·mm', () => {
    // Kirschning & Jansen 1982 define fn in GHz·mm (ENGINEERING.md pitfall 5).
    expect(normalizedFrequencyGHzMm(10e9, 1e-3)).toBeCloseTo(10, 12);
  });

  it('depends on f and h only through f·h at fixed w/h (scale invariance)', () => {
    // Physics: a lossless non-magnetic structure scaled by s behaves the same at f/s; no source needed.
    const a = microstripAt(geom(1.3, 6, 1e-3, 0.02), 12e9);
    const b = microstripAt(geom(1.3, 6, 0.5e-3, 0.02), 24e9);
    expect(rel(a.epsEff, b.epsEff)).toBeLessThan(1e-12);
    expect(rel(a.z0, b.z0)).toBeLessThan(1e-12);
  });

  it('f = 0 returns the static values exactly', () => {
    const g = geom(0.9, 9.8, 0.635e-3, 0.01);
    const s = microstripStatic(g);
    expect(microstripEpsEffAt(g, 0)).toBe(s.epsEff);
    expect(microstripZ0At(g, 0)).toBe(s.z0);
  });

  it('εr = 1 gives εeff(f) = 1 and Z0(f) = Z0(0) at every frequency', () => {
    // Exact: an air line is homogeneous and has no dispersion.
    for (const f of [1e9, 3e10, 1e11]) {
      const r = microstripAt(geom(1, 1), f);
      expect(r.epsEff).toBe(1);
      expect(r.z0).toBe(r.static.z0);
    }
  });

  it('εeff(f) tends to εr at very high frequency', () => {
    // Asymptote of the Kirschning–Jansen 1982 form (P → ∞) and the physics: the field is drawn
    // into the substrate as f grows. Far outside the model's range; only the limit is checked.
    for (const u of [0.1, 1, 10]) expect(rel(kirschningJansenEpsEff(u, 9.8, 6, 1e7), 9.8)).toBeLessThan(1e-8);
  });

  it('the Z0(f) factor is exactly 1 at fn = 0', () => {
    // Jansen & Kirschning 1983: R9 = 0 and R8 = 1 at fn = 0, so R13 = R14.
    expect(jansenKirschningZ0Factor(1, 9.8, 6.5, 6.5, 0)).toBe(1);
  });
});

describe('microstrip dispersion: published behaviour', () => {
  it('Z0(f) agrees with the Hammerstad–Jensen 1980 power–current form within 4 % up to h/λ0 = 0.05', () => {
    // The alternative Z0(f) = Z0·(εeff(f) − 1)/(εeff − 1)·√(εeff/εeff(f)) of Hammerstad & Jensen 1980
    // (form checked against a secondary restatement, not against the paper). Two published fits
    // of the same quantity, no stated accuracy for the 1980 one; observed spread up to 3.6 %.
    for (const [u, er] of [[0.3, 10], [1, 10], [3, 10], [1, 2.2], [3, 2.2], [8, 4.4]] as const) {
      for (const hOverLambda of [0.01, 0.03, 0.05]) {
        const f = (hOverLambda * c0) / 1e-3;
        const r = microstripAt({ widthM: u * 1e-3, heightM: 1e-3, dk: er }, f);
        const e0 = r.static.epsEff;
        const hj = r.static.z0 * ((r.epsEff - 1) / (e0 - 1)) * Math.sqrt(e0 / r.epsEff);
        expect(rel(r.z0, hj)).toBeLessThan(0.04);
      }
    }
  });

  // Kobayashi's independent fit: M. Kobayashi, "A dispersion formula satisfying recent requirements
  // in microstrip CAD", IEEE Trans. MTT-36(8), 1988, pp. 1246–1250 (from memory; formula text checked
  // against a secondary restatement, which quotes 0.6 % for 0.1 ≤ w/h ≤ 10, 1 < εr ≤ 128, any h/λ0).
  const kobayashi = (u: number, er: number, e0: number, h: number, f: number) => {
    const fTM0 = (c0 * Math.atan(er * Math.sqrt((e0 - 1) / (er - e0)))) / (2 * Math.PI * h * Math.sqrt(er - e0));
    const f50 = fTM0 / (0.75 + (0.75 - 0.332 / er ** 1.73) * u);
    const m0 = 1 + 1 / (1 + Math.sqrt(u)) + 0.32 * (1 / (1 + Math.sqrt(u))) ** 3;
    const mc = u <= 0.7 ? 1 + (1.4 / (1 + u)) * (0.15 - 0.235 * Math.exp((-0.45 * f) / f50)) : 1;
    return er - (er - e0) / (1 + (f / f50) ** Math.min(m0 * mc, 2.32));
  };

  it('εeff(f) agrees with Kobayashi 1988 within 1.5 % over the shared range', () => {
    // Both claim 0.6 % against full-wave solutions (sum 1.2 %); observed worst 1.34 % at the
    // corner εr = 20, w/h = 0.1, h/λ0 = 0.08, so the bound is 1.5 %.
    for (const er of [1.5, 2.2, 3.5, 6, 10, 15, 20]) {
      for (const u of [0.1, 0.3, 0.7, 1, 2, 5, 10]) {
        for (const hOverLambda of [0.005, 0.02, 0.05, 0.08, 0.13]) {
          const f = (hOverLambda * c0) / 1e-3;
          const r = microstripAt({ widthM: u * 1e-3, heightM: 1e-3, dk: er }, f);
          expect(rel(r.epsEff, kobayashi(u, er, r.static.epsEff, 1e-3, f))).toBeLessThan(0.015);
        }
      }
    }
  });

  it('near-air substrate: Z0(f) fit undefined, static Z0 kept with a note', () => {
    // Jansen–Kirschning 1983: R14 = 0.9408·εeff^R8 − 0.9603 ≤ 0 for εeff ≲ 1.02 (follows from the fit).
    const r = microstripAt(geom(1, 1.02, 1e-3), 20e9);
    expect(r.z0).toBe(r.static.z0);
    expect(r.notes.some((n) => n.model === 'Jansen–Kirschning 1983' && n.parameter === 'εeff')).toBe(true);
  });
});

describe('microstrip dispersion: properties', () => {
  it('εeff(f) rises monotonically with f, starts at the static value and stays below εr', () => {
    // Kirschning & Jansen 1982 range: 0.1 ≤ w/h ≤ 100, 1 ≤ εr ≤ 20, h/λ0 ≤ 0.13.
    fc.assert(
      fc.property(
        fc.double({ min: 0.1, max: 100, noNaN: true }),
        fc.double({ min: 1.5, max: 20, noNaN: true }),
        fc.double({ min: 0, max: 0.1, noNaN: true }),
        fc.double({ min: 0, max: 0.13, noNaN: true }),
        fc.double({ min: 0, max: 0.13, noNaN: true }),
        (u, er, t, x1, x2) => {
          const g = geom(u, er, 1e-3, t);
          const [lo, hi] = x1 < x2 ? [x1, x2] : [x2, x1];
          const eLo = microstripEpsEffAt(g, (lo * c0) / 1e-3);
          const eHi = microstripEpsEffAt(g, (hi * c0) / 1e-3);
          expect(eHi).toBeGreaterThanOrEqual(eLo);
          expect(eLo).toBeGreaterThanOrEqual(microstripStatic(g).epsEff);
          expect(eHi).toBeLessThan(er);
        },
      ),
    );
  });

  it('Z0(f) is finite and positive across the Jansen–Kirschning range', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.1, max: 10, noNaN: true }),
        fc.double({ min: 1.5, max: 18, noNaN: true }),
        fc.double({ min: 0, max: 0.1, noNaN: true }),
        (u, er, x) => {
          const z = microstripZ0At(geom(u, er, 1e-3), (x * c0) / 1e-3);
          expect(Number.isFinite(z) && z > 0).toBe(true);
        },
      ),
    );
  });
});

describe('microstrip dispersion: validity notes and input checks', () => {
  it('notes h/λ0, w/h and εr outside each model range', () => {
    const params = (u: number, er: number, f: number) => microstripAt(geom(u, er, 1e-3), f).notes.map((n) => `${n.model}:${n.parameter}`);
    expect(params(1, 4, 10e9)).toEqual([]);
    // h/λ0 = 0.12 at 36 GHz on 1 mm: beyond the Z0(f) range (0.1) but inside the εeff(f) range (0.13).
    expect(params(1, 4, 36e9)).toEqual(['Jansen–Kirschning 1983:h/λ0']);
    expect(params(1, 4, 45e9)).toEqual(['Kirschning–Jansen 1982:h/λ0', 'Jansen–Kirschning 1983:h/λ0']);
    expect(params(20, 4, 1e9)).toEqual(['Jansen–Kirschning 1983:w/h']);
    expect(params(1, 19, 1e9)).toEqual(['Jansen–Kirschning 1983:εr']);
    expect(params(1, 25, 1e9)).toEqual(['Kirschning–Jansen 1982:εr', 'Jansen–Kirschning 1983:εr']);
  });

  it('throws RangeError for negative or non-finite frequency', () => {
    for (const f of [-1, Number.NaN, Number.POSITIVE_INFINITY]) expect(() => microstripAt(geom(1, 4), f)).toThrow(RangeError);
  });
});
