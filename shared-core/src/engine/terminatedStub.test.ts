import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { type Complex, cabs, cadd, cdiv, cmul, complex, cscale, csub } from './complex.js';
import { idealLine } from './idealLine.js';
import { findRoot } from './rootFind.js';
import { analyseStub, guidedWavelength, phaseConstant, propagationConstant, stubInputImpedance } from './stub.js';
import {
  analyseEndedStub,
  effectiveLength,
  endedStubInputImpedance,
  terminatedLineInputImpedance,
  viaEquivalentLength,
  viaLoad,
} from './terminatedStub.js';

const Z0 = 50;
const relC = (a: Complex, b: Complex) => cabs(csub(a, b)) / Math.max(cabs(b), 1e-300);
const gammaArb = fc.record({ re: fc.double({ min: 0, max: 2, noNaN: true }), im: fc.double({ min: 1, max: 200, noNaN: true }) });
const lengthArb = fc.double({ min: 0, max: 0.2, noNaN: true });
const loadArb = fc.record({ re: fc.double({ min: 0, max: 500, noNaN: true }), im: fc.double({ min: -500, max: 500, noNaN: true }) });
/** Angles away from the lossless poles and zeros. */
const regularAngle = fc.double({ min: 0.02, max: Math.PI / 2 - 0.02, noNaN: true }).chain((a) => fc.integer({ min: 0, max: 5 }).map((k) => a + (k * Math.PI) / 2));

const ccosh = (z: Complex) => complex(Math.cosh(z.re) * Math.cos(z.im), Math.sinh(z.re) * Math.sin(z.im));
const csinh = (z: Complex) => complex(Math.sinh(z.re) * Math.cos(z.im), Math.cosh(z.re) * Math.sin(z.im));

describe('terminated line: reductions', () => {
  it('Z_L = 0 is exactly the short stub and Z_L = ∞ exactly the open stub', () => {
    fc.assert(
      fc.property(gammaArb, lengthArb, fc.double({ min: 10, max: 150, noNaN: true }), (gamma, l, z0) => {
        expect(terminatedLineInputImpedance(z0, gamma, l, 0)).toEqual(stubInputImpedance('short', z0, gamma, l));
        expect(terminatedLineInputImpedance(z0, gamma, l, complex(0, 0))).toEqual(stubInputImpedance('short', z0, gamma, l));
        expect(terminatedLineInputImpedance(z0, gamma, l, Infinity)).toEqual(stubInputImpedance('open', z0, gamma, l));
        expect(terminatedLineInputImpedance(z0, gamma, l, complex(0, Infinity))).toEqual(stubInputImpedance('open', z0, gamma, l));
      }),
    );
  });

  it('tends to the open and short stub as Z_L → ∞ and Z_L → 0', () => {
    fc.assert(
      fc.property(regularAngle, (theta) => {
        const gamma = complex(0, theta); // l = 1 m
        expect(relC(terminatedLineInputImpedance(Z0, gamma, 1, 1e14), stubInputImpedance('open', Z0, gamma, 1))).toBeLessThan(1e-9);
        expect(relC(terminatedLineInputImpedance(Z0, gamma, 1, complex(0, -1e14)), stubInputImpedance('open', Z0, gamma, 1))).toBeLessThan(1e-9);
        expect(relC(terminatedLineInputImpedance(Z0, gamma, 1, 1e-14), stubInputImpedance('short', Z0, gamma, 1))).toBeLessThan(1e-9);
      }),
    );
  });

  // Pozar, Microwave Engineering, 4th ed., §2.3: a matched line shows Z0 at any length.
  it('a matched load gives Z0 at any length, lossy or not', () => {
    fc.assert(
      fc.property(gammaArb, lengthArb, (gamma, l) => {
        expect(relC(terminatedLineInputImpedance(Z0, gamma, l, Z0), complex(Z0))).toBeLessThan(1e-12);
      }),
    );
  });

  // Pozar, 4th ed., §2.4–2.5 (from memory): a lossless λ/4 line inverts the load, Zin = Z0²/Z_L;
  // a λ/2 line repeats it, Zin = Z_L.
  it('a lossless quarter wave inverts the load and a half wave repeats it', () => {
    fc.assert(
      fc.property(loadArb, (zl) => {
        fc.pre(cabs(zl) > 1e-3);
        const quarter = terminatedLineInputImpedance(Z0, complex(0, Math.PI / 2), 1, zl);
        const half = terminatedLineInputImpedance(Z0, complex(0, Math.PI), 1, zl);
        expect(relC(quarter, cdiv(complex(Z0 * Z0), zl))).toBeLessThan(1e-9);
        expect(relC(half, zl)).toBeLessThan(1e-9);
      }),
    );
  });

  // Independent formulation: the ABCD matrix of a line, A = D = cosh γl, B = Z0·sinh γl,
  // C = sinh γl / Z0 (Pozar, 4th ed., Table 4.1, from memory), gives Zin = (A·Z_L + B)/(C·Z_L + D).
  it('agrees with the ABCD-matrix form on lossy lines with any load', () => {
    fc.assert(
      fc.property(gammaArb, lengthArb, loadArb, (gamma, l, zl) => {
        const gl = cscale(gamma, l);
        const a = ccosh(gl);
        const s = csinh(gl);
        const abcd = cdiv(cadd(cmul(a, zl), cscale(s, Z0)), cadd(cscale(cmul(s, zl), 1 / Z0), a));
        const denom = cabs(cadd(cscale(cmul(s, zl), 1 / Z0), a));
        fc.pre(denom > 1e-6); // away from a series resonance where both forms are ill-conditioned
        expect(relC(terminatedLineInputImpedance(Z0, gamma, l, zl), abcd)).toBeLessThan(1e-9);
      }),
    );
  });

  it('is continuous where it switches from the tanh to the coth form (|tanh γl| = 1)', () => {
    const zl = complex(12, 30);
    const a = terminatedLineInputImpedance(Z0, complex(0, Math.PI / 4 - 1e-12), 1, zl);
    const b = terminatedLineInputImpedance(Z0, complex(0, Math.PI / 4 + 1e-12), 1, zl);
    expect(relC(a, b)).toBeLessThan(1e-10);
  });
});

describe('short through a via', () => {
  const f = 2.4e9;
  const lossless = idealLine({ z0: Z0, epsEff: 3.3 });
  const at = lossless(f);
  const beta = phaseConstant(at.epsEff, f);
  const lambdaG = guidedWavelength(at.epsEff, f);
  const viaL = 0.46e-9;

  // Exact for a lossless line: jωL at the end of Z0 is Z0·tan θv of reactance, i.e. a short stub
  // θv = atan(ωL/Z0) longer (Pozar, 4th ed., §2.3, jZ0·tan βl solved for the length).
  it('is a short stub atan(ωL/Z0)/β longer on a lossless line', () => {
    const extra = viaEquivalentLength(viaL, at, f);
    expect(extra * beta).toBeCloseTo(Math.atan((2 * Math.PI * f * viaL) / Z0), 14);
    fc.assert(
      fc.property(fc.double({ min: 0.001, max: 0.45, noNaN: true }), (fraction) => {
        const l = fraction * lambdaG;
        const phi = beta * (l + extra);
        fc.pre(Math.abs(Math.cos(phi)) > 1e-3);
        const withVia = endedStubInputImpedance({ kind: 'short', viaInductanceH: viaL }, at, l, f);
        expect(relC(withVia, stubInputImpedance('short', Z0, propagationConstant(at, f), l + extra))).toBeLessThan(1e-9);
      }),
    );
  });

  it('stays exact next to the parallel resonance (no cancellation)', () => {
    const extra = viaEquivalentLength(viaL, at, f);
    const delta = 1e-7;
    const l = (Math.PI / 2 - delta) / beta - extra;
    const z = endedStubInputImpedance({ kind: 'short', viaInductanceH: viaL }, at, l, f);
    expect(z.im / (Z0 / Math.tan(delta))).toBeCloseTo(1, 6);
  });

  it('moves the first parallel resonance down in frequency', () => {
    const l = lambdaG / 4; // plain short stub resonates at f
    const susceptance = (fq: number) => {
      const line = lossless(fq);
      const z = terminatedLineInputImpedance(line.z0, propagationConstant(line, fq), l, viaLoad(viaL, fq));
      return cdiv(complex(1), z).im;
    };
    const fVia = findRoot(susceptance, 0.5 * f, f);
    expect(fVia).toBeLessThan(f * 0.97);
    // The same resonance from βl + atan(ωL/Z0) = π/2.
    const phase = (fq: number) => phaseConstant(3.3, fq) * l + Math.atan((2 * Math.PI * fq * viaL) / Z0) - Math.PI / 2;
    expect(fVia / findRoot(phase, 0.5 * f, f)).toBeCloseTo(1, 9);
  });

  it('analysis reports the equivalent length and the lossless resonance exactly', () => {
    const extra = viaEquivalentLength(viaL, at, f);
    const a = analyseEndedStub({ kind: 'short', viaInductanceH: viaL }, lossless, lambdaG / 4 - extra, f);
    expect(a.equivalentLengthM).toBeCloseTo(lambdaG / 4, 15);
    expect(a.behaviour).toBe('resonant');
    expect(a.reactance).toBe(Infinity);
    const b = analyseEndedStub({ kind: 'short', viaInductanceH: viaL }, lossless, lambdaG / 10, f);
    expect(b.behaviour).toBe('inductive');
    expect(b.inductance! * 2 * Math.PI * f).toBeCloseTo(b.reactance, 9);
    expect(b.inductance!).toBeGreaterThan(analyseStub('short', lossless, lambdaG / 10, f).inductance!);
  });

  it('on a lossy line uses the terminated-line formula with the via resistance', () => {
    const lossy = idealLine({ z0: Z0, epsEff: 3.3, df: 0.02 });
    const end = { kind: 'short', viaInductanceH: viaL, viaResistanceOhm: 0.05 } as const;
    const a = analyseEndedStub(end, lossy, lambdaG / 10, f);
    const line = lossy(f);
    expect(a.zin).toEqual(terminatedLineInputImpedance(line.z0, propagationConstant(line, f), lambdaG / 10, complex(0.05, 2 * Math.PI * f * viaL)));
    expect(a.resistance).toBeGreaterThan(0.05);
    expect(a.behaviour).toBe('inductive');
  });
});

describe('open end with extension', () => {
  const f = 5.8e9;
  const line = idealLine({ z0: 60, epsEff: 2.9 });
  it('is an open stub of length l + Δl', () => {
    const end = { kind: 'open', extensionM: 0.4e-3 } as const;
    const a = analyseEndedStub(end, line, 5e-3, f);
    const b = analyseStub('open', line, 5.4e-3, f);
    expect(a.equivalentLengthM).toBe(effectiveLength(5e-3, 0.4e-3));
    expect(a.zin).toEqual(b.zin);
    expect(a.capacitance).toBe(b.capacitance);
    expect(a.drawnLengthM).toBe(5e-3);
  });

  // Common practice, no source: the fringing field makes an open stub look longer, so it is more capacitive.
  it('makes a short open stub more capacitive than the drawn length alone', () => {
    const drawn = analyseStub('open', line, 3e-3, f).capacitance!;
    expect(analyseEndedStub({ kind: 'open', extensionM: 0.3e-3 }, line, 3e-3, f).capacitance!).toBeGreaterThan(drawn);
  });
});

describe('input checks', () => {
  it('throws a RangeError for a negative length, a NaN load, or a negative extension or via value', () => {
    expect(() => terminatedLineInputImpedance(Z0, complex(0, 1), -1, 0)).toThrow(/lengthM/);
    expect(() => terminatedLineInputImpedance(Z0, complex(0, 1), 1, Number.NaN)).toThrow(/NaN/);
    expect(() => effectiveLength(1e-3, -1e-4)).toThrow(/extensionM/);
    expect(() => viaLoad(-1e-9, 1e9)).toThrow(/viaInductanceH/);
  });
});
