import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { eta0 } from './constants.js';
import { hjAirImpedance, microstripStatic } from './microstripStatic.js';

const h = 1e-3;
const at = (u: number, dk: number, tOverH = 0) => microstripStatic({ widthM: u * h, heightM: h, dk, thicknessM: tOverH * h });
const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('microstripStatic: limits', () => {
  it('εr = 1 gives εeff = 1 exactly, with and without thickness', () => {
    // Exact: a homogeneous (air) line has εeff = 1; the model keeps it because Δur = Δu1 when εr = 1.
    for (const u of [0.01, 0.3, 1, 7, 100]) {
      expect(at(u, 1).epsEff).toBe(1);
      expect(at(u, 1, 0.05).epsEff).toBe(1);
    }
  });

  it('very wide strip tends to the parallel-plate line Z0 = η0·h/(w·√εr), εeff = εr', () => {
    // Exact limit of a TEM parallel-plate line (fringing vanishes as w/h → ∞); no source needed.
    for (const dk of [1, 2.2, 10]) {
      const r = at(1e4, dk);
      expect(rel(r.z0, eta0 / (1e4 * Math.sqrt(dk)))).toBeLessThan(1e-3);
      expect(rel(r.epsEff, dk)).toBeLessThan(1e-3);
    }
  });

  it('fringing always lowers Z0 below the parallel-plate value', () => {
    // Physics: fringing fields only add capacitance per unit length; no source needed.
    for (const u of [0.1, 1, 10, 100, 1000]) expect(hjAirImpedance(u) * u).toBeLessThan(eta0);
  });

  it('zero thickness is the t → 0 limit of the thickness correction', () => {
    // Continuity of the model (Δu1 ~ t·ln(1/t) → 0); no source needed.
    expect(rel(at(1, 4, 1e-9).z0, at(1, 4).z0)).toBeLessThan(1e-7);
  });
});

describe('microstripStatic: independent published formulas', () => {
  // Wheeler's closed forms (narrow strip w/h ≤ 3.3, wide strip w/h > 3.3), H. A. Wheeler, IEEE Trans.
  // MTT-13(2), 1965, pp. 172–185 (from memory; formula text checked against a secondary restatement,
  // which quotes < 1 % error for 8 ≤ εr ≤ 12).
  const wheeler = (u: number, er: number) =>
    u <= 3.3
      ? (eta0 / (Math.PI * Math.sqrt(2 * (er + 1)))) *
        (Math.log(4 / u + Math.sqrt(16 / u ** 2 + 2)) - 0.5 * ((er - 1) / (er + 1)) * (Math.log(Math.PI / 2) + Math.log(4 / Math.PI) / er))
      : eta0 /
        (2 * Math.sqrt(er)) /
        (u / 2 + Math.log(4) / Math.PI + ((er + 1) / (2 * Math.PI * er)) * Math.log(((Math.PI * Math.E) / 2) * (u / 2 + 0.94)) +
          ((er - 1) / (2 * Math.PI * er ** 2)) * Math.log((Math.E * Math.PI ** 2) / 16));

  it('agrees with Wheeler within his stated 1 % for 8 ≤ εr ≤ 12', () => {
    for (const er of [8, 9.8, 12]) for (const u of [0.05, 0.2, 1, 3, 3.4, 10, 20]) expect(rel(at(u, er).z0, wheeler(u, er))).toBeLessThan(0.01);
  });

  // Pozar, Microwave Engineering, 4th ed., eqs. 3.195 (εeff) and 3.196 (Z0): the simpler textbook set.
  const pozarEps = (u: number, er: number) => (er + 1) / 2 + (er - 1) / 2 / Math.sqrt(1 + 12 / u);
  const pozarZ0 = (u: number, er: number) => {
    const e = pozarEps(u, er);
    return u <= 1 ? (60 / Math.sqrt(e)) * Math.log(8 / u + u / 4) : (120 * Math.PI) / (Math.sqrt(e) * (u + 1.393 + 0.667 * Math.log(u + 1.444)));
  };

  it('agrees with the textbook set to about 1–2 % over 0.1 ≤ w/h ≤ 10', () => {
    // Tolerance: the textbook εeff is "about 1 % off" (ENGINEERING.md pitfall 4); observed worst
    // 2.2 % in εeff and 1.2 % in Z0 at εr = 10, so 2.5 % / 1.5 % bounds.
    for (const er of [2.2, 4.4, 10]) {
      for (let u = 0.1; u <= 10; u *= 1.25) {
        expect(rel(at(u, er).epsEff, pozarEps(u, er))).toBeLessThan(0.025);
        expect(rel(at(u, er).z0, pozarZ0(u, er))).toBeLessThan(0.015);
      }
    }
  });
});

describe('microstripStatic: thickness', () => {
  it('a thicker strip has lower Z0 and lower εeff', () => {
    // Physics: a thick strip adds side-wall capacitance, mostly in air (HJ 1980 model behaviour;
    // direction of the εeff change from memory, also the model's structure u1 > ur).
    const thin = at(2, 4);
    const thick = at(2, 4, 0.07);
    expect(thick.z0).toBeLessThan(thin.z0);
    expect(thick.epsEff).toBeLessThan(thin.epsEff);
  });

  it('35 µm on 0.5 mm lowers Z0 of a 50 Ω-class line by 1–4 %', () => {
    // Common practice, no source: foil thickness of a few % of h shifts Z0 by a few %.
    const z = (t: number) => microstripStatic({ widthM: 1e-3, heightM: 0.5e-3, dk: 4, thicknessM: t }).z0;
    const drop = 1 - z(35e-6) / z(0);
    expect(drop).toBeGreaterThan(0.01);
    expect(drop).toBeLessThan(0.04);
  });

  it('property: thickness always lowers Z0', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.02, max: 50, noNaN: true }), fc.double({ min: 1, max: 16, noNaN: true }), fc.double({ min: 1e-4, max: 0.1, noNaN: true }), (u, dk, t) => {
        expect(at(u, dk, t).z0).toBeLessThan(at(u, dk).z0);
      }),
    );
  });
});

describe('microstripStatic: properties', () => {
  const u = fc.double({ min: 0.01, max: 100, noNaN: true });
  const dk = fc.double({ min: 1.01, max: 20, noNaN: true });
  const t = fc.oneof(fc.constant(0), fc.double({ min: 1e-4, max: 0.1, noNaN: true }));

  it('Z0 falls as the strip gets wider (with and without thickness)', () => {
    fc.assert(
      fc.property(u, fc.double({ min: 1.001, max: 3, noNaN: true }), dk, t, (u0, k, er, tt) => {
        expect(at(u0 * k, er, tt).z0).toBeLessThan(at(u0, er, tt).z0);
      }),
    );
  });

  it('1 < εeff < εr; for t = 0 also εeff > (εr + 1)/2 (the narrow-strip limit)', () => {
    // Narrow-strip limit (εr + 1)/2 of a zero-thickness strip on the interface: from memory (Wheeler 1965).
    fc.assert(
      fc.property(u, dk, t, (uu, er, tt) => {
        const e = at(uu, er, tt).epsEff;
        expect(e).toBeGreaterThan(1);
        expect(e).toBeLessThan(er);
        if (tt === 0) expect(e).toBeGreaterThan((er + 1) / 2);
      }),
    );
  });
});

describe('microstripStatic: input checks and validity notes', () => {
  it('throws RangeError for non-positive or non-finite inputs', () => {
    const ok = { widthM: 1e-3, heightM: 1e-3, dk: 4 };
    for (const bad of [0, -1e-3, Number.NaN, Number.POSITIVE_INFINITY]) {
      expect(() => microstripStatic({ ...ok, widthM: bad })).toThrow(RangeError);
      expect(() => microstripStatic({ ...ok, heightM: bad })).toThrow(RangeError);
      expect(() => microstripStatic({ ...ok, dk: bad })).toThrow(RangeError);
    }
    expect(() => microstripStatic({ ...ok, dk: 0.5 })).toThrow(/dk must be ≥ 1/);
    expect(() => microstripStatic({ ...ok, thicknessM: -1e-6 })).toThrow(/thicknessM/);
    expect(() => microstripStatic({ ...ok, thicknessM: Number.NaN })).toThrow(RangeError);
    expect(() => microstripStatic({ ...ok, widthM: 0 })).toThrow(/widthM must be a finite number > 0, got 0/);
  });

  it('notes w/h, εr and t/h outside the published / customary range, and nothing inside it', () => {
    expect(at(1, 4, 0.02).notes).toEqual([]);
    expect(at(0.005, 4).notes.map((n) => n.parameter)).toEqual(['w/h']);
    expect(at(200, 4).notes[0]).toMatchObject({ parameter: 'w/h', max: 100, model: 'Hammerstad–Jensen 1980' });
    expect(at(1, 200).notes.map((n) => n.parameter)).toEqual(['εr']);
    expect(at(1, 4, 0.2).notes.map((n) => n.parameter)).toEqual(['t/h']);
  });
});
