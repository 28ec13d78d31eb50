import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { c0 } from './constants.js';
import { idealLine } from './idealLine.js';
import { analyseStub, guidedWavelength, stubInputImpedance } from './stub.js';

const Z0 = 50;
const lossless = (thetaRad: number) => ({ re: 0, im: thetaRad }); // γl with l = 1 m
const zShort = (theta: number) => stubInputImpedance('short', Z0, lossless(theta), 1);
const zOpen = (theta: number) => stubInputImpedance('open', Z0, lossless(theta), 1);
const deg = (d: number) => (d * Math.PI) / 180;
/** Angles away from the lossless poles and zeros, where tan/cot are well conditioned. */
const regularAngle = fc.double({ min: 0.01, max: Math.PI / 2 - 0.01, noNaN: true }).chain((a) =>
  fc.integer({ min: 0, max: 7 }).map((k) => a + (k * Math.PI) / 2),
);

describe('stub input impedance, lossless limit', () => {
  // Pozar, Microwave Engineering, 4th ed., eqs. 2.44 and 2.45: Zin = jZ0·tan βl (short), −jZ0·cot βl (open).
  it('equals jZ0·tan βl and −jZ0·cot βl', () => {
    fc.assert(
      fc.property(regularAngle, (theta) => {
        expect(zShort(theta).im).toBeCloseTo(Z0 * Math.tan(theta), 6);
        expect(zOpen(theta).im).toBeCloseTo(-Z0 / Math.tan(theta), 6);
      }),
    );
  });

  it('is purely imaginary', () => {
    fc.assert(fc.property(regularAngle, (theta) => {
      expect(zShort(theta).re).toBe(0);
      expect(zOpen(theta).re).toBe(0);
    }));
  });

  // Common practice, no source: the stub response repeats every half wavelength.
  it('repeats every half wave (θ + 180°)', () => {
    fc.assert(fc.property(regularAngle, (theta) => {
      const a = zShort(theta).im;
      const b = zShort(theta + Math.PI).im;
      expect(Math.abs(a - b)).toBeLessThan(1e-7 * Math.max(1, Math.abs(a)));
    }));
  });

  // Common practice, no source: an open stub behaves as a short stub a quarter wave longer.
  it('open(θ) = short(θ + 90°)', () => {
    fc.assert(fc.property(regularAngle, (theta) => {
      const a = zOpen(theta).im;
      const b = zShort(theta + Math.PI / 2).im;
      expect(Math.abs(a - b)).toBeLessThan(1e-7 * Math.max(1, Math.abs(a)));
    }));
  });

  // Richards' transformation (P. I. Richards, Proc. IRE 36, 1948, pp. 217–220): at λ/8 a stub's |X| = Z0.
  it('has |X| = Z0 at λ/8 (45°)', () => {
    expect(zShort(deg(45)).im).toBeCloseTo(Z0, 10);
    expect(zOpen(deg(45)).im).toBeCloseTo(-Z0, 10);
  });
});

describe('stub behaviour by length', () => {
  const f = 1e9;
  const line = idealLine({ z0: Z0, epsEff: 3 });
  const lambdaG = guidedWavelength(3, f);
  const at = (kind: 'short' | 'open', fraction: number) => analyseStub(kind, line, fraction * lambdaG, f);

  // Common practice, no source: short stub inductive below λ/4, capacitive from λ/4 to λ/2, repeating every λ/2.
  it('short stub: inductive below λ/4, capacitive λ/4…λ/2, periodic', () => {
    for (const base of [0, 0.5, 1]) {
      expect(at('short', base + 0.1).behaviour).toBe('inductive');
      expect(at('short', base + 0.24).behaviour).toBe('inductive');
      expect(at('short', base + 0.26).behaviour).toBe('capacitive');
      expect(at('short', base + 0.49).behaviour).toBe('capacitive');
    }
  });

  // Common practice, no source: the open stub is the same pattern shifted by λ/4.
  it('open stub: capacitive below λ/4, inductive λ/4…λ/2, periodic', () => {
    for (const base of [0, 0.5, 1]) {
      expect(at('open', base + 0.1).behaviour).toBe('capacitive');
      expect(at('open', base + 0.26).behaviour).toBe('inductive');
      expect(at('open', base + 0.49).behaviour).toBe('inductive');
    }
  });

  it('reports electrical length and wavelength fraction consistently', () => {
    const a = at('short', 0.125);
    expect(a.electricalDeg).toBeCloseTo(45, 9);
    expect(a.wavelengthFraction).toBeCloseTo(0.125, 12);
    expect(a.guidedWavelengthM).toBeCloseTo(c0 / (f * Math.sqrt(3)), 12);
  });

  it('uses L = X/ω and C = −1/(ωX) exactly (no low-frequency approximation)', () => {
    const ind = at('short', 31 / 360);
    expect(ind.inductance).toBeCloseTo(ind.reactance / (2 * Math.PI * f), 20);
    // Pitfall: L ≈ Z0·τ is already ~11 % low at 31° (Z0 tan θ vs Z0 θ); the engine must not use it.
    const tau = (deg(31) / (2 * Math.PI * f));
    expect(ind.inductance! / (Z0 * tau)).toBeGreaterThan(1.1);
    const cap = at('open', 31 / 360);
    expect(cap.capacitance).toBeCloseTo(-1 / (2 * Math.PI * f * cap.reactance), 25);
  });

  it('reports a lossless quarter-wave short stub as a parallel resonance, not 1e16 Ω', () => {
    const a = at('short', 0.25);
    expect(a.behaviour).toBe('resonant');
    expect(a.inductance).toBeNull();
    expect(a.capacitance).toBeNull();
    expect(a.reactance).toBe(Infinity);
    const b = at('open', 0.25);
    expect(b.behaviour).toBe('resonant');
    expect(b.reactance).toBe(0);
  });
});

describe('stub input impedance on a lossy line', () => {
  // Pozar, 4th ed., §2.7: a λ/4 short-circuited lossy line is a parallel resonator with Zin = Z0/(αl) (approximately, for αl ≪ 1).
  it('gives a finite, real Zin ≈ Z0/(αl) at the quarter-wave resonance', () => {
    const f = 1e9;
    const line = idealLine({ z0: Z0, epsEff: 2, df: 0.002 });
    const l = guidedWavelength(2, f) / 4;
    const a = analyseStub('short', line, l, f);
    const alpha = line(f).alpha;
    expect(a.resistance / (Z0 / (alpha * l))).toBeCloseTo(1, 4);
    expect(Math.abs(a.reactance)).toBeLessThan(1e-6 * a.resistance);
    expect(a.behaviour).toBe('resonant');
    expect(a.inductance).toBeNull();
    expect(a.capacitance).toBeNull();
  });

  it('more loss lowers the peak |Zin| at resonance', () => {
    const f = 1e9;
    const peak = (df: number) => {
      const line = idealLine({ z0: Z0, epsEff: 2, df });
      return analyseStub('short', line, guidedWavelength(2, f) / 4, f).resistance;
    };
    expect(peak(0.001)).toBeGreaterThan(peak(0.01));
  });
});
