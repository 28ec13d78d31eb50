/**
 * Exact closed-form references for checking the Laplace solver (tests only).
 */

/**
 * Complete elliptic integral of the first kind K(k), modulus k (not the parameter m = k²),
 * 0 ≤ k < 1, by the arithmetic–geometric mean: K(k) = π / (2·M(1, k′)), k′ = √(1 − k²)
 * (Abramowitz & Stegun, Handbook of Mathematical Functions, §17.6). Exact to rounding; the
 * iteration converges quadratically.
 */
export function ellipticK(k: number): number {
  if (!(k >= 0 && k < 1)) throw new RangeError(`modulus must be in [0, 1), got ${k}`);
  let a = 1;
  let b = Math.sqrt((1 - k) * (1 + k));
  while (Math.abs(a - b) > 1e-15 * a) {
    const mean = (a + b) / 2;
    b = Math.sqrt(a * b);
    a = mean;
  }
  return Math.PI / (a + b);
}

/** Impedance of free space η0 = μ0·c0, Ω (CODATA 2018 μ0; kept apart from the engine on purpose). */
export const ETA0 = 1.25663706212e-6 * 299_792_458;

/**
 * Characteristic impedance of zero-thickness symmetric stripline, Ω — exact (conformal mapping):
 *   Z0 = η0/(4√εr) · K(k)/K(k′),  k = sech(πw/2b),  k′ = tanh(πw/2b),
 * w strip width, b ground-plane spacing, strip midway and the planes infinitely wide.
 * Source: S. B. Cohn, "Characteristic impedance of the shielded-strip transmission line",
 * IRE Trans. Microwave Theory Tech., vol. MTT-2, pp. 52–57, July 1954 (the zero-thickness
 * result, written there with 30π in place of η0/4; equation number not checked at the source).
 */
export function striplineZ0Cohn(wOverB: number, epsR = 1): number {
  const x = (Math.PI * wOverB) / 2;
  const k = 1 / Math.cosh(x);
  const kp = Math.tanh(x);
  return (ETA0 / (4 * Math.sqrt(epsR))) * (ellipticK(k) / ellipticK(kp));
}
