import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { type Complex, cabs, cdiv, complex } from '../engine/index.js';
import { abcdToS, onePortS, shuntS } from './sparams.js';

const passive = fc.record({ re: fc.double({ min: 0, max: 1e6, noNaN: true }), im: fc.double({ min: -1e6, max: 1e6, noNaN: true }) });
const reference = fc.double({ min: 1, max: 500, noNaN: true });
const close = (a: Complex, b: Complex, tol = 1e-12) => expect(cabs({ re: a.re - b.re, im: a.im - b.im })).toBeLessThan(tol);

describe('S-parameters of a stub as a one-port and as a shunt two-port (Pozar 4th ed. §4.3, Table 4.2; from memory)', () => {
  it('known points: matched, short, open, pure reactance', () => {
    close(onePortS(complex(50), 50), complex(0));
    close(onePortS(complex(0), 50), complex(-1));
    close(onePortS(complex(0, Infinity), 50), complex(1));
    close(onePortS(complex(0, 50), 50), complex(0, 1));
    close(shuntS(complex(0), 50).s11, complex(-1));
    close(shuntS(complex(0), 50).s21, complex(0));
    close(shuntS(complex(0, Infinity), 50).s21, complex(1));
    close(shuntS(complex(25), 50).s11, complex(-0.5)); // 25 Ω across 50 Ω: load 16.7 Ω
  });

  it('is passive: |S11| ≤ 1, and |S11|² + |S21|² ≤ 1 for a shunt element, for any R ≥ 0 (property)', () => {
    fc.assert(fc.property(passive, reference, (z, z0) => {
      expect(cabs(onePortS(z, z0))).toBeLessThanOrEqual(1 + 1e-12);
      const s = shuntS(z, z0);
      expect(cabs(s.s11) ** 2 + cabs(s.s21) ** 2).toBeLessThanOrEqual(1 + 1e-12);
      expect(s.s12).toEqual(s.s21);
      expect(s.s22).toEqual(s.s11);
    }));
  });

  it('a pure reactance loses nothing: |S11| = 1, and |S11|² + |S21|² = 1 in shunt (property)', () => {
    fc.assert(fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), reference, (x, z0) => {
      const z = complex(0, x);
      expect(cabs(onePortS(z, z0))).toBeCloseTo(1, 12);
      const s = shuntS(z, z0);
      expect(cabs(s.s11) ** 2 + cabs(s.s21) ** 2).toBeCloseTo(1, 12);
    }));
  });

  it('the shunt formulas equal the general ABCD conversion of [1, 0; 1/Z, 1] (property)', () => {
    fc.assert(fc.property(passive.filter((z) => cabs(z) > 1e-6), reference, (z, z0) => {
      const viaAbcd = abcdToS({ a: complex(1), b: complex(0), c: cdiv(complex(1), z), d: complex(1) }, z0);
      const direct = shuntS(z, z0);
      for (const k of ['s11', 's21', 's12', 's22'] as const) close(direct[k], viaAbcd[k], 1e-9);
    }));
  });

  it('a series impedance [1, Z; 0, 1] gives S11 = Z/(Z + 2Z0), S21 = 2Z0/(Z + 2Z0)', () => {
    const s = abcdToS({ a: complex(1), b: complex(30, 40), c: complex(0), d: complex(1) }, 50);
    close(s.s11, cdiv(complex(30, 40), complex(130, 40)));
    close(s.s21, cdiv(complex(100), complex(130, 40)));
  });

  it('refuses a reference impedance that is not a positive number', () => {
    for (const z0 of [0, -50, Number.NaN, Infinity]) {
      expect(() => onePortS(complex(1), z0)).toThrow(RangeError);
      expect(() => shuntS(complex(1), z0)).toThrow(RangeError);
    }
  });
});
