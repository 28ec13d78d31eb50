/** Minimal complex arithmetic for line and stub impedances (no dependency, no allocation-heavy classes). */

export interface Complex {
  readonly re: number;
  readonly im: number;
}

export const complex = (re: number, im = 0): Complex => ({ re, im });

export const cadd = (a: Complex, b: Complex): Complex => ({ re: a.re + b.re, im: a.im + b.im });
export const csub = (a: Complex, b: Complex): Complex => ({ re: a.re - b.re, im: a.im - b.im });
export const cmul = (a: Complex, b: Complex): Complex => ({
  re: a.re * b.re - a.im * b.im,
  im: a.re * b.im + a.im * b.re,
});
export const cdiv = (a: Complex, b: Complex): Complex => {
  const d = b.re * b.re + b.im * b.im;
  return { re: (a.re * b.re + a.im * b.im) / d, im: (a.im * b.re - a.re * b.im) / d };
};
export const cscale = (a: Complex, k: number): Complex => ({ re: a.re * k, im: a.im * k });
export const cabs = (a: Complex): number => Math.hypot(a.re, a.im);

/**
 * tanh(x + jy) = (sinh 2x + j sin 2y) / (cosh 2x + cos 2y).
 * For x = 0 this is exactly j·tan y.
 */
export function ctanh(z: Complex): Complex {
  const d = Math.cosh(2 * z.re) + Math.cos(2 * z.im);
  return { re: Math.sinh(2 * z.re) / d, im: Math.sin(2 * z.im) / d };
}

/**
 * coth(x + jy) = (sinh 2x − j sin 2y) / (cosh 2x − cos 2y).
 * For x = 0 this is exactly −j·cot y.
 */
export function ccoth(z: Complex): Complex {
  const d = Math.cosh(2 * z.re) - Math.cos(2 * z.im);
  return { re: Math.sinh(2 * z.re) / d, im: -Math.sin(2 * z.im) / d };
}
