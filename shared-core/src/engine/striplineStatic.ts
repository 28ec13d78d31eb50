/**
 * Symmetric stripline, TEM: a strip centred between two ground planes b apart in a homogeneous
 * dielectric. εeff = εr exactly (TEM); Z0 below. Quasi-static, so also no dispersion.
 *
 * Zero thickness, exact (conformal mapping): S. B. Cohn, "Characteristic impedance of the
 * shielded-strip transmission line", IRE Trans. Microwave Theory Tech. MTT-2, July 1954, pp. 52–57:
 *   Z0 = η0/(4√εr) · K(k)/K(k′),  k = sech(πw/2b),  k′ = tanh(πw/2b),
 * with η0 = μ0·c0 (Cohn writes 30π for η0/4, 0.07 % high; ENGINEERING.md pitfall 2). The
 * equation number was not checked at the source.
 *
 * Finite thickness: H. A. Wheeler, "Transmission-line properties of a strip line between parallel
 * planes", IEEE Trans. MTT-26(11), Nov. 1978, pp. 866–876. A strip of thickness t acts as a thin
 * strip of width w′ = w + Δw between planes b − t apart, with x = t/b and
 *   Δw/(b − t) = x/(π(1 − x)) · {1 − ½·ln[(x/(2 − x))² + (0.0796·x/(w/b + 1.1·x))^m]},
 *   m = 2/(1 + (2/3)·x/(1 − x)).
 * Wheeler then approximates the thin-strip impedance in closed form (stated within 0.5 % for
 * w′/(b − t) < 10, as restated in later surveys). Here the thin strip of width w′ in spacing b − t
 * is instead evaluated with Cohn's exact result: this pairing is this project's choice, exact at
 * t = 0 and continuous in t. The Δw expression is copied from two independent secondary
 * restatements that agree; the paper itself and its equation numbers were not available.
 *
 * Accuracy observed against the 2-D field solver in test/reference/laplace2d.ts (see
 * test/stripline-laplace.test.ts), 0.03 ≤ w/b ≤ 30, while the strip is at least as wide as it is
 * thick (w ≥ t): within 0.25 % for t/b ≤ 0.1 (0.06 % for w/b ≥ 0.3) and 0.4 % for t/b ≤ 0.3;
 * strips narrower than thick come out low, by up to about 2 % (w/t = 0.1–0.5). Wheeler's closed
 * form alone: within 0.9 % for w′/(b − t) < 10.
 * Validity: exact for t = 0 at any w/b. No published thickness bound was found; t/b > 0.3 and
 * w/t < 1 (beyond what was checked to 0.4 %) get a ValidityNote; t ≥ b is impossible and throws.
 */
import { eta0 } from './constants.js';
import { ellipticKRatio } from './ellipticK.js';
import { checkPositiveInput } from './microstripStatic.js';
import type { ValidityNote } from './types.js';

export const COHN_STRIPLINE_MODEL = 'Cohn 1954';
export const WHEELER_STRIPLINE_MODEL = 'Wheeler 1978 thickness';

/** Largest t/b checked against the field solver. */
export const STRIPLINE_T_OVER_B_CHECKED = 0.3;

/** A strip centred between two ground planes. All lengths in metres. */
export interface StriplineGeometry {
  /** Strip width w, m (> 0). */
  widthM: number;
  /** Ground-plane spacing b (plane to plane, the strip midway), m (> thickness). */
  heightM: number;
  /** Relative permittivity εr of the homogeneous fill (≥ 1). */
  dk: number;
  /** Strip thickness t, m (0 ≤ t < b, default 0). */
  thicknessM?: number;
}

export interface StriplineStaticResult {
  /** Characteristic impedance, Ω. */
  z0: number;
  /** Effective permittivity: εr (TEM). */
  epsEff: number;
  /** Normalised width w/b as given. */
  u: number;
  /** Equivalent thin-strip width over spacing, w′/(b − t) (= w/b for t = 0). */
  effectiveWidthRatio: number;
  notes: ValidityNote[];
}

/** Checks a stripline geometry and throws a RangeError naming the first bad field. */
export function validateStriplineGeometry(g: StriplineGeometry): void {
  checkPositiveInput('heightM', g.heightM);
  checkPositiveInput('widthM', g.widthM);
  checkPositiveInput('dk', g.dk);
  if (g.dk < 1) throw new RangeError(`dk must be ≥ 1 (relative permittivity), got ${g.dk}`);
  const t = g.thicknessM ?? 0;
  checkPositiveInput('thicknessM', t, true);
  if (t >= g.heightM) {
    throw new RangeError(`thicknessM (${t}) must be less than heightM (${g.heightM}), the plane-to-plane spacing b that the strip sits in`);
  }
}

/**
 * Exact impedance of a zero-thickness strip centred between planes (Cohn 1954), Ω:
 * Z0 = η0/(4√εr) · K(k)/K(k′), k = sech(πu/2), k′ = tanh(πu/2).
 * @param u normalised width w/b (> 0)
 * @param dk relative permittivity εr (default 1)
 */
export function cohnStriplineZ0(u: number, dk = 1): number {
  const x = (Math.PI * u) / 2;
  // k = sech x underflows to 0 for x > 710, where the ratio has long reached its wide-strip limit
  // K(k)/K(k′) = π/(2x + 2 ln 2) to rounding; sech and tanh keep k′ accurate for narrow strips.
  const ratio = x > 350 ? Math.PI / (2 * x + 2 * Math.LN2) : ellipticKRatio(1 / Math.cosh(x), Math.tanh(x));
  return (eta0 / (4 * Math.sqrt(dk))) * ratio;
}

/**
 * Wheeler 1978 equivalent width of a thick strip, normalised to the reduced spacing:
 * w′/(b − t) = u/(1 − x) + x/(π(1 − x)) · {1 − ½·ln[(x/(2 − x))² + (0.0796x/(u + 1.1x))^m]},
 * m = 2/(1 + (2/3)·x/(1 − x)), u = w/b, x = t/b (0 ≤ x < 1). Equals u at x = 0.
 */
export function wheelerStriplineWidthRatio(u: number, tOverB: number): number {
  const x = tOverB;
  if (x === 0) return u;
  const m = 2 / (1 + ((2 / 3) * x) / (1 - x));
  const bracket = 1 - 0.5 * Math.log((x / (2 - x)) ** 2 + ((0.0796 * x) / (u + 1.1 * x)) ** m);
  return u / (1 - x) + (x / (Math.PI * (1 - x))) * bracket;
}

function note(parameter: string, value: number, min: number | undefined, max: number | undefined, why: string): ValidityNote | null {
  if ((min === undefined || value >= min) && (max === undefined || value <= max)) return null;
  const range = `${min ?? '0'} … ${max ?? '∞'}`;
  return { model: WHEELER_STRIPLINE_MODEL, parameter, value, min, max, message: `${parameter} = ${value.toPrecision(4)} is outside ${range} (${why})` };
}

/**
 * Z0 (Ω) and εeff (= εr) of a symmetric stripline: Cohn 1954 exact for t = 0; for t > 0 Cohn's
 * result at Wheeler's (1978) equivalent width w′ in the reduced spacing b − t.
 * Throws a RangeError for non-finite or non-positive width/spacing, εr < 1, t < 0 or t ≥ b.
 */
export function striplineStatic(g: StriplineGeometry): StriplineStaticResult {
  validateStriplineGeometry(g);
  const u = g.widthM / g.heightM;
  const tOverB = (g.thicknessM ?? 0) / g.heightM;
  const effectiveWidthRatio = wheelerStriplineWidthRatio(u, tOverB);
  const z0 = cohnStriplineZ0(effectiveWidthRatio, g.dk);
  const t = g.thicknessM ?? 0;
  const notes = [
    note('t/b', tOverB, undefined, STRIPLINE_T_OVER_B_CHECKED, 'beyond the range checked against a field solution; no published bound found'),
    t > 0 ? note('w/t', g.widthM / t, 1, undefined, 'strip narrower than thick: Z0 up to about 2 % low against a field solution') : null,
  ].filter((n): n is ValidityNote => n !== null);
  return { z0, epsEff: g.dk, u, effectiveWidthRatio, notes };
}
