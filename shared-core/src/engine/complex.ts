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
 * tanh(x + jy) = (sinh x·cosh x + j·sin y·cos y) / (sinh²x + cos²y).
 * This form has no cancellation near the poles (x = 0, y → π/2 + kπ), unlike the
 * (sinh 2x + j sin 2y)/(cosh 2x + cos 2y) form. For x = 0 it is exactly j·tan y.
 */
export function ctanh(z: Complex): Complex {
  const sh = Math.sinh(z.re);
  const c = Math.cos(z.im);
  const d = sh * sh + c * c;
  return { re: (sh * Math.cosh(z.re)) / d, im: (Math.sin(z.im) * c) / d };
}

/**
 * coth(x + jy) = (sinh x·cosh x − j·sin y·cos y) / (sinh²x + sin²y), cancellation-free near its poles.
 * For x = 0 it is exactly −j·cot y.
 */
export function ccoth(z: Complex): Complex {
  const sh = Math.sinh(z.re);
  const s = Math.sin(z.im);
  const d = sh * sh + s * s;
  return { re: (sh * Math.cosh(z.re)) / d, im: -(s * Math.cos(z.im)) / d };
}
