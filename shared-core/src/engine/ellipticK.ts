/**
 * Complete elliptic integral of the first kind and the ratio K(k)/K(k′) that conformal-mapping
 * line models (stripline, coplanar waveguide) need.
 *
 * Source: the arithmetic–geometric mean, K(k) = π / (2·M(1, k′)) with k′ = √(1 − k²)
 * (Abramowitz & Stegun, Handbook of Mathematical Functions, 1964, §17.6). Hence
 *   K(k)/K(k′) = M(1, k) / M(1, k′),
 * exact to rounding with no series truncation; the iteration converges quadratically (about six
 * steps for 1e-300 ≤ k ≤ 1 − 1e-16).
 *
 * Convention: everything here takes the modulus k, not the parameter m = k² that many libraries
 * use (ENGINEERING.md, formula pitfall 1). Near k → 1, k′ = √(1 − k²) loses digits to
 * cancellation: callers that know k′ in closed form (k′ = tanh x when k = sech x) pass it in.
 * Validity: 0 ≤ k ≤ 1, 0 ≤ k′ ≤ 1 (k = 1 or k′ = 0 gives an infinite ratio).
 */

/**
 * Arithmetic–geometric mean M(a, b) of two numbers ≥ 0 (A&S §17.6), to rounding.
 * M(a, 0) = 0. Throws a RangeError for negative or non-finite input.
 */
export function arithmeticGeometricMean(a: number, b: number): number {
  if (!(a >= 0 && b >= 0 && Number.isFinite(a) && Number.isFinite(b))) {
    throw new RangeError(`the arithmetic–geometric mean needs finite numbers ≥ 0, got ${a} and ${b}`);
  }
  if (a === 0 || b === 0) return 0;
  let [x, y] = [a, b];
  // Quadratic convergence: |x − y| shrinks as its square once x/y is near 1; 64 steps is far more
  // than any double needs (at most about 12 from the most lopsided inputs).
  for (let i = 0; i < 64 && Math.abs(x - y) > 1e-15 * x; i++) [x, y] = [(x + y) / 2, Math.sqrt(x * y)];
  return (x + y) / 2;
}

function checkModulus(name: string, value: number): void {
  if (!(value >= 0 && value <= 1)) throw new RangeError(`${name} must lie in [0, 1] (a modulus, not the parameter m = k²), got ${value}`);
}

/**
 * Complete elliptic integral of the first kind K(k), modulus k in [0, 1): K = π/(2·M(1, k′)).
 * Pass `kComplement` = k′ when it is known more accurately than √(1 − k²). K(1) = ∞.
 */
export function ellipticK(k: number, kComplement = Math.sqrt((1 - k) * (1 + k))): number {
  checkModulus('k', k);
  checkModulus('k′', kComplement);
  return Math.PI / (2 * arithmeticGeometricMean(1, kComplement));
}

/**
 * K(k)/K(k′) = M(1, k)/M(1, k′) for a modulus k in [0, 1], k′ = √(1 − k²) unless given.
 * 0 at k = 0, 1 at k = 1/√2, ∞ at k = 1; swapping k and k′ inverts it (to rounding).
 * Stripline uses this ratio, coplanar waveguide its inverse (ENGINEERING.md, pitfall 3).
 */
export function ellipticKRatio(k: number, kComplement = Math.sqrt((1 - k) * (1 + k))): number {
  checkModulus('k', k);
  checkModulus('k′', kComplement);
  return arithmeticGeometricMean(1, k) / arithmeticGeometricMean(1, kComplement);
}

/** Below this modulus K(k)/K(k′) = π/(2·ln(4/k)) holds to rounding (the O(k²) terms are < 1e-16). */
export const SMALL_MODULUS = 1e-8;

/**
 * K(k)/K(k′) for a tiny modulus given by its logarithm (ln k ≤ ln 1e-8), where k itself may
 * underflow: π/(2·ln(4/k)) (A&S 17.3.26 for K(k′) with k → 0, K(k) = π/2 to rounding).
 * Its inverse, (2/π)·ln(4/k′), is the ratio when k′ is the tiny one.
 */
export function ellipticKRatioFromLogModulus(lnK: number): number {
  if (!(lnK <= Math.log(SMALL_MODULUS))) throw new RangeError(`ln k must be ≤ ln 1e-8 for the small-modulus form, got ${lnK}`);
  return Math.PI / (2 * (2 * Math.LN2 - lnK));
}

