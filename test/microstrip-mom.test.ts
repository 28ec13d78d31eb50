/**
 * Independent check of the quasi-static model against a numerical field solution computed here:
 * a method-of-moments solve for the charge on a zero-thickness strip on a grounded substrate
 * (pulse basis, point matching, edge-refined segments). It uses the exact quasi-static Green's
 * function on the air–substrate interface as an image series,
 *   G(x) = 1/(π·ε0·(1+εr)) · Σₙ (−K)ⁿ · ln(rₙ₊₁/rₙ),  rₙ = √(x² + (2nh)²),  K = (εr−1)/(εr+1),
 * obtained from the spectral potential 1/(ε0·|β|·(1 + εr·coth|β|h)) (derivation, no source needed).
 * C = Q/V; Z0 = 1/(c0·√(C·C_air)); εeff = C/C_air. The solution converges as 1/N²
 * (N = 50 → 100 changes Z0 by about 1e-5).
 */
import { describe, expect, it } from 'vitest';
import { c0, eps0 } from '../shared-core/src/engine/constants.js';
import { hjAirImpedance, microstripStatic } from '../shared-core/src/engine/microstripStatic.js';

/** ∫₀ˢ ln√(t² + a²) dt. */
const intLn = (s: number, a: number) => (a === 0 ? (s === 0 ? 0 : s * Math.log(Math.abs(s)) - s) : 0.5 * s * Math.log(s * s + a * a) - s + a * Math.atan(s / a));

/** Capacitance per unit length / ε0 of a strip of width u·h (h = 1) on a grounded slab εr. */
function momCapacitance(u: number, er: number, n = 60): number {
  const k = (er - 1) / (er + 1);
  const terms = k > 0 ? Math.ceil(Math.log(1e-14) / Math.log(k)) : 0;
  const edges = Array.from({ length: n + 1 }, (_, i) => (u / 2) * Math.sin((Math.PI / 2) * (i / n)));
  const mids = edges.slice(0, n).map((e, i) => (e + (edges[i + 1] as number)) / 2);
  const a = mids.map((x) =>
    mids.map((_, j) => {
      const [e0, e1] = [edges[j] as number, edges[j + 1] as number];
      let sum = 0;
      for (const [x1, x2] of [[e0, e1], [-e1, -e0]] as const) {
        const seg = (d: number) => intLn(x2 - x, d) - intLn(x1 - x, d);
        for (let m = 0, c = 1; m <= terms; m++, c *= -k) sum += c * (seg(2 * (m + 1)) - seg(2 * m));
      }
      return sum / (Math.PI * (1 + er));
    }),
  );
  const b = mids.map(() => 1);
  for (let p = 0; p < n; p++) {
    for (let i = p + 1; i < n; i++) {
      const f = (a[i]![p] as number) / (a[p]![p] as number);
      for (let j = p; j < n; j++) a[i]![j]! -= f * (a[p]![j] as number);
      b[i]! -= f * (b[p] as number);
    }
  }
  const q = new Array<number>(n).fill(0);
  for (let i = n - 1; i >= 0; i--) {
    let s = b[i] as number;
    for (let j = i + 1; j < n; j++) s -= (a[i]![j] as number) * (q[j] as number);
    q[i] = s / (a[i]![i] as number);
  }
  return q.reduce((acc, qi, j) => acc + 2 * qi * ((edges[j + 1] as number) - (edges[j] as number)), 0);
}

describe('Hammerstad–Jensen 1980 against a moment-method field solution', () => {
  const us = [0.05, 0.3, 1, 3, 10, 30];
  let airCache: Map<number, number> | undefined;
  const cAir = () => (airCache ??= new Map(us.map((u) => [u, momCapacitance(u, 1)])));

  it('air impedance Z01 is within the 0.03 % HJ 1980 states (restated in later surveys)', () => {
    for (const u of us) {
      const z01 = 1 / (c0 * eps0 * (cAir().get(u) as number));
      expect(Math.abs(hjAirImpedance(u) / z01 - 1)).toBeLessThan(3e-4);
    }
  });

  type Errors = { eps: number; z0: number }[];
  let errorCache: Errors | undefined;
  const errors = (): Errors => (errorCache ??= [2.2, 4.4, 12].flatMap((er) =>
    us.map((u) => {
      const ca = cAir().get(u) as number;
      const c = momCapacitance(u, er);
      const ms = microstripStatic({ widthM: u, heightM: 1, dk: er });
      return { eps: Math.abs(ms.epsEff / (c / ca) - 1), z0: Math.abs(ms.z0 * c0 * eps0 * Math.sqrt(c * ca) - 1) };
    }),
  ));

  it('εeff is within the 0.2 % HJ 1980 states, Z0 within 0.15 %, for εr from 2.2 to 12', () => {
    for (const e of errors()) {
      expect(e.eps).toBeLessThan(2e-3);
      expect(e.z0).toBeLessThan(1.5e-3);
    }
  });

  it('regression guard: agreement stays at the observed 0.12 % (εeff) and 0.06 % (Z0)', () => {
    // Not a published bound: slips in the a(u) or b(εr) constants (e.g. 0.053 → 0.05, 52 → 25)
    // still pass the 0.2 % above but move the worst case to about 0.17 %.
    expect(Math.max(...errors().map((e) => e.eps))).toBeLessThan(1.3e-3);
    expect(Math.max(...errors().map((e) => e.z0))).toBeLessThan(6.5e-4);
  });
});
