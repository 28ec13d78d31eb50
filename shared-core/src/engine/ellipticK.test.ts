import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { arithmeticGeometricMean, ellipticK, ellipticKRatio, ellipticKRatioFromLogModulus } from './ellipticK.js';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

/**
 * K(k) by the trapezoid rule on ∫₀^{π/2} dθ/√(1 − k²sin²θ): an independent method. The integrand
 * is smooth, even and π-periodic, so the rule converges geometrically (about 1e-15 with 400 points
 * for k ≤ 0.99).
 */
function kByQuadrature(k: number, n = 400): number {
  const h = Math.PI / 2 / n;
  let sum = 0;
  for (let i = 0; i <= n; i++) {
    const w = i === 0 || i === n ? 0.5 : 1;
    sum += w / Math.sqrt(1 - (k * Math.sin(i * h)) ** 2);
  }
  return sum * h;
}

describe('arithmetic–geometric mean', () => {
  it('M(1, √2) is Gauss’s constant inverse, 1.19814023473559220744…', () => {
    // Gauss's constant G = 1/M(1, √2) = 0.834626841674073186…; value from memory, and consistent
    // with the lemniscatic K(1/√2) checked below (K(1/√2) = π/(2·M(1, 1/√2))).
    expect(rel(arithmeticGeometricMean(1, Math.SQRT2), 1.1981402347355922)).toBeLessThan(1e-15);
  });

  it('is symmetric, homogeneous, between the geometric and the arithmetic mean, and 0 with a 0', () => {
    expect(arithmeticGeometricMean(3, 7)).toBe(arithmeticGeometricMean(7, 3));
    expect(rel(arithmeticGeometricMean(6, 14), 2 * arithmeticGeometricMean(3, 7))).toBeLessThan(1e-15);
    const m = arithmeticGeometricMean(3, 7);
    expect(m).toBeGreaterThan(Math.sqrt(21));
    expect(m).toBeLessThan(5);
    expect(arithmeticGeometricMean(1, 0)).toBe(0);
    expect(arithmeticGeometricMean(1, 1e-300)).toBeGreaterThan(0);
  });

  it('rejects negative or non-finite input', () => {
    for (const bad of [-1, Number.NaN, Number.POSITIVE_INFINITY]) expect(() => arithmeticGeometricMean(1, bad)).toThrow(RangeError);
  });
});

describe('ellipticK (modulus k, by the AGM)', () => {
  it('K(0) = π/2 and the lemniscatic K(1/√2) = Γ(1/4)²/(4√π)', () => {
    // Legendre's lemniscatic case (A&S §17.3, from memory); Γ(1/4) = 3.625609908221908311930685….
    const gammaQuarter = 3.6256099082219083;
    expect(ellipticK(0)).toBe(Math.PI / 2);
    expect(rel(ellipticK(Math.SQRT1_2), gammaQuarter ** 2 / (4 * Math.sqrt(Math.PI)))).toBeLessThan(1e-15);
  });

  it('agrees with direct quadrature of the integral to 1e-14 for 0 ≤ k ≤ 0.99', () => {
    for (const k of [0, 0.01, 0.1, 0.3, 0.5, 0.7, 0.9, 0.95, 0.99]) expect(rel(ellipticK(k), kByQuadrature(k))).toBeLessThan(1e-14);
  });

  it('takes the modulus, not the parameter m = k² (pitfall 1)', () => {
    // K(m = 0.5) would be K(k = 1/√2) = 1.8540746773013719; K(k = 0.5) = 1.6857503548125961 (A&S table 17.1 values, from memory).
    expect(ellipticK(0.5)).toBeCloseTo(1.6857503548125961, 14);
    expect(ellipticK(0.5)).not.toBeCloseTo(1.8540746773013719, 3);
  });

  it('tends to ln(4/k′) as k → 1 when k′ is passed in accurately', () => {
    // A&S 17.3.26 (from memory): K = ln(4/k′) + (k′²/4)(ln(4/k′) − 1) + O(k′⁴ ln k′).
    for (const kp of [1e-4, 1e-8, 1e-12, 1e-100]) {
      const l = Math.log(4 / kp);
      expect(rel(ellipticK(Math.sqrt(1 - kp * kp), kp), l + (kp * kp * (l - 1)) / 4)).toBeLessThan(1e-14);
    }
  });

  it('rejects a modulus outside [0, 1], naming the modulus/parameter confusion', () => {
    expect(() => ellipticK(1.2)).toThrow(/modulus, not the parameter/);
    expect(() => ellipticK(-0.1)).toThrow(RangeError);
    expect(() => ellipticK(Number.NaN)).toThrow(RangeError);
  });
});

describe('ellipticKRatio K(k)/K(k′)', () => {
  it('hits the singular values K(k′)/K(k) = √n exactly', () => {
    // k = λ*(n): n = 1: 1/√2; n = 4: (√2 − 1)², one descending Landen step from 1/√2 (A&S 17.5);
    // n = 3: (√6 − √2)/4 = sin 15° (table of singular values, Borwein & Borwein, "Pi and the AGM",
    // 1987, from memory).
    expect(ellipticKRatio(Math.SQRT1_2)).toBeCloseTo(1, 15);
    expect(rel(1 / ellipticKRatio((Math.SQRT2 - 1) ** 2), 2)).toBeLessThan(2e-15);
    expect(rel(1 / ellipticKRatio((Math.sqrt(6) - Math.SQRT2) / 4), Math.sqrt(3))).toBeLessThan(2e-15);
  });

  it('matches the Hilberg-type closed form π/ln(2(1+√k′)/(1−√k′)) to 3e-6, and to rounding as k → 0', () => {
    // W. Hilberg, IEEE Trans. MTT-17, 1969 (from memory): an approximation for k ≤ 1/√2 whose error
    // falls off fast with k; observed 2.2e-6 at 1/√2, 5e-8 at 0.5, 4e-14 at 0.1. 1 − √k′ is written
    // as k²/((1 + k′)(1 + √k′)) so that the reference itself keeps its digits for small k.
    const hilberg = (k: number) => {
      const kp = Math.sqrt((1 - k) * (1 + k));
      const s = Math.sqrt(kp);
      return Math.PI / Math.log((2 * (1 + s) * (1 + kp) * (1 + s)) / (k * k));
    };
    for (const k of [Math.SQRT1_2, 0.5, 0.3]) expect(rel(ellipticKRatio(k), hilberg(k))).toBeLessThan(3e-6);
    for (const k of [0.1, 1e-2, 1e-4, 1e-8, 1e-150]) expect(rel(ellipticKRatio(k), hilberg(k))).toBeLessThan(1e-13);
  });

  it('small-modulus form from ln k matches the AGM where both work, and goes on where k underflows', () => {
    for (const k of [1e-8, 1e-12, 1e-100, 1e-300]) expect(rel(ellipticKRatioFromLogModulus(Math.log(k)), ellipticKRatio(k))).toBeLessThan(1e-15);
    expect(ellipticKRatioFromLogModulus(-5000)).toBeCloseTo(Math.PI / (2 * (5000 + Math.log(4))), 18);
    expect(() => ellipticKRatioFromLogModulus(Math.log(1e-3))).toThrow(RangeError);
  });

  it('is 0 at k = 0 and infinite at k = 1', () => {
    expect(ellipticKRatio(0)).toBe(0);
    expect(ellipticKRatio(1)).toBe(Number.POSITIVE_INFINITY);
  });

  it('property: swapping k and k′ inverts it, and it grows with k', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-12, max: 1 - 1e-12, noNaN: true }), fc.double({ min: 1.0001, max: 1.5, noNaN: true }), (k, f) => {
        const kp = Math.sqrt((1 - k) * (1 + k));
        expect(ellipticKRatio(k, kp) * ellipticKRatio(kp, k)).toBeCloseTo(1, 14);
        if (k * f < 1) expect(ellipticKRatio(k * f)).toBeGreaterThan(ellipticKRatio(k));
      }),
    );
  });
});
