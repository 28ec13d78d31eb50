/**
 * S-parameters of the networks a stub or a line section makes, for a real reference impedance Z0r.
 * Formulas (Pozar, Microwave Engineering, 4th ed., §4.3 and Table 4.2, from memory):
 * - one-port (a stub from a node to ground): S11 = (Z − Z0r)/(Z + Z0r); an open circuit (Z = ∞) is 1;
 * - a shunt impedance Z across a through line: S11 = S22 = −Z0r/(2Z + Z0r), S21 = S12 = 2Z/(2Z + Z0r)
 *   (the ABCD [1, 0; 1/Z, 1] converted); Z = ∞ is a plain through line;
 * - any two-port from ABCD: Δ = A + B/Z0r + C·Z0r + D, S11 = (A + B/Z0r − C·Z0r − D)/Δ,
 *   S12 = 2(AD − BC)/Δ, S21 = 2/Δ, S22 = (−A + B/Z0r − C·Z0r + D)/Δ.
 */
import { type Complex, cadd, cdiv, cmul, complex, cscale, csub } from '../engine/index.js';
import type { Abcd } from './sweep.js';

/** A two-port's S-parameters. */
export interface TwoPortS {
  s11: Complex;
  s21: Complex;
  s12: Complex;
  s22: Complex;
}

const isOpen = (z: Complex) => !Number.isFinite(z.re) || !Number.isFinite(z.im);

function checkReference(z0r: number): void {
  if (!(z0r > 0 && Number.isFinite(z0r))) throw new RangeError(`the reference impedance must be a positive number of ohms, got ${z0r}`);
}

/** S11 of a one-port of impedance z (Ω) to ground. */
export function onePortS(z: Complex, z0r: number): Complex {
  checkReference(z0r);
  if (isOpen(z)) return complex(1);
  return cdiv(csub(z, complex(z0r)), cadd(z, complex(z0r)));
}

/** S-parameters of an impedance z (Ω) in shunt across a through connection. */
export function shuntS(z: Complex, z0r: number): TwoPortS {
  checkReference(z0r);
  if (isOpen(z)) return { s11: complex(0), s21: complex(1), s12: complex(1), s22: complex(0) };
  const den = cadd(cscale(z, 2), complex(z0r));
  const s11 = cdiv(complex(-z0r), den);
  const s21 = cdiv(cscale(z, 2), den);
  return { s11, s21, s12: s21, s22: s11 };
}

/** S-parameters of a two-port given by its ABCD matrix. */
export function abcdToS(m: Abcd, z0r: number): TwoPortS {
  checkReference(z0r);
  const bn = cscale(m.b, 1 / z0r);
  const cn = cscale(m.c, z0r);
  const delta = cadd(cadd(m.a, bn), cadd(cn, m.d));
  const det = csub(cmul(m.a, m.d), cmul(m.b, m.c));
  return {
    s11: cdiv(csub(cadd(m.a, bn), cadd(cn, m.d)), delta),
    s12: cdiv(cscale(det, 2), delta),
    s21: cdiv(complex(2), delta),
    s22: cdiv(cadd(csub(bn, m.a), csub(m.d, cn)), delta),
  };
}
