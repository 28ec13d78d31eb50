import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { eta0 } from './constants.js';
import { type CoplanarGeometry, coplanarInfiniteSubstrate, coplanarModuli, coplanarStatic } from './coplanarStatic.js';

const rel = (a: number, b: number) => Math.abs(a / b - 1);
const cpw = (s: number, g: number, h: number, dk: number, grounded: boolean, t = 0) =>
  coplanarStatic({ widthM: s * 1e-3, gapM: g * 1e-3, heightM: h * 1e-3, dk, grounded, thicknessM: t * 1e-3 });

describe('coplanar moduli', () => {
  it('k0 = s/(s + 2g) with the full centre width, and k1 < k0 < k3 on a finite substrate', () => {
    // Pitfall 3: k uses the full strip width s, not s/2. sinh(x)/x grows and tanh(x)/x falls with x,
    // so k1 < k0 < k3 for any finite h, and both tend to k0 as h → ∞.
    const m = coplanarModuli(1, 0.25, 2);
    expect(m.k0).toBe(1 / 1.5);
    expect(m.k1).toBeLessThan(m.k0);
    expect(m.k3).toBeGreaterThan(m.k0);
    const far = coplanarModuli(1, 0.25, 1e7);
    expect(rel(far.k1, far.k0)).toBeLessThan(1e-12);
    expect(rel(far.k3, far.k0)).toBeLessThan(1e-12);
    expect(rel(far.k1p, far.k0p)).toBeLessThan(1e-12);
    expect(rel(far.k3p, far.k0p)).toBeLessThan(1e-12);
  });

  it('property: k² + k′² = 1 for every modulus, from h ≪ s (no overflow) to h ≫ s (no cancellation)', () => {
    fc.assert(
      fc.property(fc.double({ min: -4, max: 4, noNaN: true }), fc.double({ min: -4, max: 4, noNaN: true }), (lgG, lgH) => {
        const m = coplanarModuli(1, 10 ** lgG, 10 ** lgH);
        for (const [k, kp] of [[m.k0, m.k0p], [m.k1, m.k1p], [m.k3, m.k3p]] as const) {
          expect(k).toBeGreaterThanOrEqual(0);
          expect(kp).toBeGreaterThanOrEqual(0);
          expect(k * k + kp * kp).toBeCloseTo(1, 13);
        }
        // The logarithms stay finite (and right) where k1 or k3′ underflow.
        expect(Number.isFinite(m.lnK1) && Number.isFinite(m.lnK3p)).toBe(true);
        if (m.k1 > 1e-300) expect(m.lnK1).toBeCloseTo(Math.log(m.k1), 10);
        if (m.k3p > 1e-300) expect(m.lnK3p).toBeCloseTo(Math.log(m.k3p), 10);
      }),
    );
  });
});

describe('coplanarStatic: exact values and limits', () => {
  it('Wen 1969 in air: Z0 = η0/4 at k0 = 1/√2, and η0/4·K(k0′)/K(k0) = 120.5 Ω at k0 = 1/2', () => {
    // K(k0′)/K(k0) = 1 at k0 = 1/√2 (exact). At k0 = 0.5: K(0.5) = 1.6857503548125961,
    // K(√3/2) = 2.1565156474996432 (A&S table 17.1 values, from memory). CPW carries K(k′)/K(k),
    // the reverse of stripline (pitfall 3): the reversed ratio would give 73.6 Ω here.
    const g = (Math.SQRT2 - 1) / 2; // s = 1: s/(s + 2g) = 1/√2
    expect(rel(coplanarInfiniteSubstrate(1, g, 1).z0, eta0 / 4)).toBeLessThan(1e-15);
    expect(rel(coplanarInfiniteSubstrate(2, 1, 1).z0, (eta0 / 4) * (2.1565156474996432 / 1.6857503548125961))).toBeLessThan(1e-14);
    expect(coplanarInfiniteSubstrate(2, 1, 1).z0).toBeCloseTo(120.48, 2);
  });

  it('εr = 1 gives εeff = 1 and the air-line Z0, with and without backing', () => {
    // Exact: a homogeneous (air) line; without backing the substrate height then cannot matter.
    for (const h of [0.01, 0.3, 1, 100]) {
      expect(cpw(1, 0.2, h, 1, false).epsEff).toBe(1);
      expect(cpw(1, 0.2, h, 1, true).epsEff).toBe(1);
      expect(rel(cpw(1, 0.2, h, 1, false).z0, coplanarInfiniteSubstrate(1e-3, 0.2e-3, 1).z0)).toBeLessThan(1e-15);
    }
  });

  it('a substrate much thicker than the slots is Wen’s half-space, with and without backing', () => {
    // h → ∞: k1, k3 → k0, so εeff → (εr + 1)/2 (Wen 1969) and the backed form reduces to the same line.
    for (const dk of [2.2, 4.4, 12.9]) {
      const wen = coplanarInfiniteSubstrate(0.5e-3, 0.1e-3, dk);
      for (const grounded of [false, true]) {
        const r = cpw(0.5, 0.1, 1e5, dk, grounded);
        expect(rel(r.epsEff, wen.epsEff)).toBeLessThan(1e-9);
        expect(rel(r.z0, wen.z0)).toBeLessThan(1e-9);
      }
    }
  });

  it('a substrate much thinner than the slots: εeff → 1 without backing; εr and a parallel plate with it', () => {
    // Without backing the field leaves the thin sheet (k1 → 0). With backing the strip sees the
    // plane h below: C → εr·ε0·s/h, so Z0 → η0·h/(√εr·s) (exact parallel-plate limit).
    // Without backing εeff − 1 shrinks in proportion to h/g (r(k1) ≈ π/(2·ln(4/k1)), ln k1 ≈ −πg/2h),
    // which needs ln k1 where k1 itself underflows (g/h = 1e4, 1e5 here).
    const [e4, e5] = [cpw(1, 1, 1e-4, 10, false).epsEff - 1, cpw(1, 1, 1e-5, 10, false).epsEff - 1];
    expect(e4).toBeLessThan(1e-3);
    expect(e4 / e5).toBeCloseTo(10, 1);
    const backed = cpw(1, 1, 1e-4, 10, true);
    expect(rel(backed.epsEff, 10)).toBeLessThan(1e-3);
    expect(rel(backed.z0, (eta0 * 1e-4) / Math.sqrt(10))).toBeLessThan(1e-3);
  });

  it('1 < εeff < (εr + 1)/2 without backing; (εr + 1)/2 < εeff < εr with it; backing lowers Z0', () => {
    // Partial capacitances: the finite sheet holds less dielectric than a half-space (r(k1) < r(k0));
    // the backing plane draws field into the substrate (r(k3) > r(k0)) and adds capacitance.
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 10, noNaN: true }), fc.double({ min: 0.01, max: 10, noNaN: true }), fc.double({ min: 0.05, max: 20, noNaN: true }), fc.double({ min: 1.5, max: 20, noNaN: true }), (s, g, h, dk) => {
        const free = cpw(s, g, h, dk, false);
        const backed = cpw(s, g, h, dk, true);
        expect(free.epsEff).toBeGreaterThan(1);
        expect(free.epsEff).toBeLessThan((dk + 1) / 2);
        expect(backed.epsEff).toBeGreaterThan((dk + 1) / 2);
        expect(backed.epsEff).toBeLessThan(dk);
        expect(backed.z0).toBeLessThan(free.z0);
        expect(free.epsEff).toBeCloseTo(1 + free.fillingFactor * (dk - 1), 13);
      }),
    );
  });
});

describe('coplanarStatic: monotonic in the geometry', () => {
  const s = fc.double({ min: 1e-3, max: 100, noNaN: true });
  const g = fc.double({ min: 1e-3, max: 100, noNaN: true });
  const h = fc.double({ min: 1e-2, max: 100, noNaN: true });
  const dk = fc.double({ min: 1, max: 20, noNaN: true });
  const grounded = fc.boolean();

  it('property: Z0 falls as the centre strip widens (gap fixed)', () => {
    fc.assert(
      fc.property(s, g, h, dk, grounded, fc.double({ min: 1.001, max: 3, noNaN: true }), (ss, gg, hh, er, gr, k) => {
        expect(cpw(ss * k, gg, hh, er, gr).z0).toBeLessThan(cpw(ss, gg, hh, er, gr).z0);
      }),
    );
  });

  it('property: Z0 rises as the gap widens (strip fixed)', () => {
    fc.assert(
      fc.property(s, g, h, dk, grounded, fc.double({ min: 1.001, max: 3, noNaN: true }), (ss, gg, hh, er, gr, k) => {
        expect(cpw(ss, gg * k, hh, er, gr).z0).toBeGreaterThan(cpw(ss, gg, hh, er, gr).z0);
      }),
    );
  });
});

describe('coplanarStatic: input checks and validity notes', () => {
  const ok: CoplanarGeometry = { widthM: 1e-3, gapM: 0.2e-3, heightM: 1e-3, dk: 4.4, grounded: false };

  it('throws RangeError for impossible geometry', () => {
    for (const bad of [0, -1e-3, Number.NaN, Number.POSITIVE_INFINITY]) {
      expect(() => coplanarStatic({ ...ok, widthM: bad })).toThrow(/widthM/);
      expect(() => coplanarStatic({ ...ok, gapM: bad })).toThrow(/gapM/);
      expect(() => coplanarStatic({ ...ok, heightM: bad })).toThrow(/heightM/);
    }
    expect(() => coplanarStatic({ ...ok, dk: 0.5 })).toThrow(/dk must be ≥ 1/);
    expect(() => coplanarStatic({ ...ok, thicknessM: -1e-6 })).toThrow(/thicknessM/);
  });

  it('notes a thin substrate (no backing), a far backing plane and metal thick against the strip or slot', () => {
    expect(cpw(1, 0.2, 1, 4.4, false).notes).toEqual([]);
    expect(cpw(1, 0.2, 1, 4.4, true).notes).toEqual([]);
    expect(cpw(1, 0.6, 1, 4.4, false).notes).toMatchObject([{ parameter: '(s+2g)/h', max: 2, model: 'Ghione–Naldi 1984' }]);
    expect(cpw(1, 1.2, 1, 4.4, true).notes).toMatchObject([{ parameter: 'g/h', max: 1, model: 'Ghione–Naldi 1983' }]);
    expect(cpw(1, 0.2, 1, 4.4, false, 0.035).notes).toEqual([]);
    expect(cpw(1, 0.2, 1, 4.4, false, 0.15).notes.map((n) => n.parameter)).toEqual(['t/g']);
    expect(cpw(0.1, 0.2, 1, 4.4, false, 0.035).notes.map((n) => n.parameter)).toEqual(['t/s']);
  });

  it('metal thickness adds the slot walls\' capacitance: Z0 falls, εeff falls toward 1, the filling factor stays geometric', () => {
    const thin = cpw(1, 0.2, 1, 4.4, false);
    const thick = cpw(1, 0.2, 1, 4.4, false, 0.02);
    expect(thick.z0).toBeLessThan(thin.z0);
    expect(thick.epsEff).toBeLessThan(thin.epsEff);
    // Check by hand: capacitances per ε0, walls 2t/g = 0.2 added in air.
    const cAir0 = 376.730313668 / (thin.z0 * Math.sqrt(thin.epsEff));
    const c = thin.epsEff * cAir0 + 0.2;
    expect(thick.z0).toBeCloseTo(376.730313668 / Math.sqrt(c * (cAir0 + 0.2)), 9);
    expect(thick.epsEff).toBeCloseTo(c / (cAir0 + 0.2), 12);
    expect(thick.epsEff).toBeCloseTo(1 + thick.fillingFactor * 3.4, 12);
    expect(cpw(1, 0.2, 1, 9, false, 0.02).fillingFactor).toBeCloseTo(thick.fillingFactor, 12);
  });
});
