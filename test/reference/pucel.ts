/**
 * Pucel–Massé–Hartwig microstrip conductor loss (tests only), an independent closed form to check
 * the engine's Wheeler-rule conductor loss against.
 *
 * Source: R. A. Pucel, D. J. Massé and C. P. Hartwig, "Losses in microstrip", IEEE Trans. Microwave
 * Theory Tech. MTT-16(6), June 1968, pp. 342–350, with the correction in MTT-16(12), Dec. 1968,
 * p. 1064. The formulas are written as restated in K. C. Gupta, R. Garg, I. Bahl and P. Bhartia,
 * "Microstrip Lines and Slotlines", 2nd ed., 1996 (from memory; neither the paper nor the book was
 * available to check). With u = w/h, we the effective width, Rs in Ω, Z0 the line impedance:
 *
 *   we = w + (t/π)·(1 + ln(2B/t)),  B = h for u ≥ 1/2π,  B = 2πw for u ≤ 1/2π
 *   Q  = 1 + h/we + (h/(π·we))·(ln(4πw/t) + t/w)     for u ≤ 1/2π
 *   Q  = 1 + h/we + (h/(π·we))·(ln(2h/t) − t/h)      for u ≥ 1/2π
 *   u ≤ 2:  α_c = Rs/(2π·Z0·h) · [1 − (we/4h)²] · Q
 *   u ≥ 2:  α_c = Rs/(Z0·h) · [we/h + (we/(πh))/(we/2h + 0.94)] · Q / [we/h + (2/π)·ln(2πe·(we/2h + 0.94))]²
 *
 * in Np/m (the published forms carry 8.68 for dB). The recalled text was checked by derivation:
 * each branch is Wheeler's incremental-inductance rule applied to Wheeler's 1965 air impedances
 * (narrow: (η0/2π)·ln(8h/we + we/4h); wide: η0/[we/h + (2/π)·ln(2πe·(we/2h + 0.94))]) with the
 * effective width above, receding every surface (w − 2n, t − 2n, h + 2n). The derivative of we/h
 * gives Q exactly; the narrow branch's [1 − (we/4h)²] is the first-order form of the exact
 * derivative (32 − u²)/(32 + u²) of ln(8/u + u/4). The two branches do not meet at u = 2 (a jump
 * of about 9 %), a known property of the piecewise fit.
 */

/**
 * Pucel–Massé–Hartwig conductor attenuation, Np/m.
 * @param widthM strip width w, m
 * @param heightM substrate height h, m
 * @param thicknessM strip thickness t, m (> 0)
 * @param surfaceResistance Rs, Ω
 * @param z0 line impedance to divide by, Ω
 */
export function pucelConductorAlpha(widthM: number, heightM: number, thicknessM: number, surfaceResistance: number, z0: number): number {
  const [w, h, t] = [widthM, heightM, thicknessM];
  const u = w / h;
  const narrow = u <= 1 / (2 * Math.PI);
  const b = narrow ? 2 * Math.PI * w : h;
  const we = w + (t / Math.PI) * (1 + Math.log((2 * b) / t));
  const ue = we / h;
  const edge = narrow ? Math.log((4 * Math.PI * w) / t) + t / w : Math.log((2 * h) / t) - t / h;
  const q = 1 + h / we + (h / (Math.PI * we)) * edge;
  if (u <= 2) return (surfaceResistance / (2 * Math.PI * z0 * h)) * (1 - (ue / 4) ** 2) * q;
  const d = ue + (2 / Math.PI) * Math.log(2 * Math.PI * Math.E * (ue / 2 + 0.94));
  return ((surfaceResistance / (z0 * h)) * (ue + ue / Math.PI / (ue / 2 + 0.94)) * q) / (d * d);
}
