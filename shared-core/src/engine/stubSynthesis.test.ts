import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { idealLine } from './idealLine.js';
import { analyseStub, guidedWavelength, type StubKind } from './stub.js';
import { losslessStubAngle, synthesizeStub, type StubTarget } from './stubSynthesis.js';

const f = 2.45e9;
const lossless = idealLine({ z0: 50, epsEff: 2.1 });
const lossy = idealLine({ z0: 50, epsEff: 2.1, df: 0.004 });
const kinds: StubKind[] = ['short', 'open'];

describe('lossless stub synthesis', () => {
  it('hits a target inductance and capacitance exactly (analysis ∘ synthesis = identity)', () => {
    for (const kind of kinds) {
      const l = synthesizeStub(kind, lossless, { kind: 'inductance', henries: 3.3e-9 }, f).lengthM;
      expect(analyseStub(kind, lossless, l, f).inductance! / 3.3e-9).toBeCloseTo(1, 10);
      const c = synthesizeStub(kind, lossless, { kind: 'capacitance', farads: 0.9e-12 }, f).lengthM;
      expect(analyseStub(kind, lossless, c, f).capacitance! / 0.9e-12).toBeCloseTo(1, 10);
    }
  });

  it('returns the shortest solution and the n-th one half a wave further', () => {
    const target: StubTarget = { kind: 'reactance', ohms: -20 };
    const first = synthesizeStub('short', lossless, target, f);
    const third = synthesizeStub('short', lossless, target, f, 3);
    const lambdaG = guidedWavelength(2.1, f);
    expect(first.lengthM).toBeGreaterThan(lambdaG / 4); // a capacitive short stub is longer than λ/4
    expect(first.lengthM).toBeLessThan(lambdaG / 2);
    expect(third.lengthM - first.lengthM).toBeCloseTo(lambdaG, 12);
  });

  // Richards' transformation (Richards, Proc. IRE 36, 1948): |X| = Z0 at λ/8.
  it('gives λ/8 for X = +Z0 on a short stub and X = −Z0 on an open stub', () => {
    const lambdaG = guidedWavelength(2.1, f);
    expect(synthesizeStub('short', lossless, { kind: 'reactance', ohms: 50 }, f).lengthM).toBeCloseTo(lambdaG / 8, 12);
    expect(synthesizeStub('open', lossless, { kind: 'reactance', ohms: -50 }, f).lengthM).toBeCloseTo(lambdaG / 8, 12);
  });

  it('maps an electrical angle to a length at the design frequency', () => {
    const r = synthesizeStub('open', lossless, { kind: 'angle', radians: Math.PI / 2 }, f);
    expect(r.lengthM).toBeCloseTo(guidedWavelength(2.1, f) / 4, 12);
  });

  it('property: the shortest lossless angle lies in (0, π] and reproduces X', () => {
    fc.assert(
      fc.property(fc.constantFrom<StubKind>('short', 'open'), fc.double({ min: -5000, max: 5000, noNaN: true }), (kind, x) => {
        fc.pre(Math.abs(x) > 1e-3);
        const t = losslessStubAngle(kind, 50, x);
        expect(t).toBeGreaterThan(0);
        expect(t).toBeLessThanOrEqual(Math.PI);
        const back = kind === 'short' ? 50 * Math.tan(t) : -50 / Math.tan(t);
        expect(back / x).toBeCloseTo(1, 8);
      }),
    );
  });
});

describe('lossy stub synthesis', () => {
  it('property: Im(Zin) of the synthesized lossy stub equals the target', () => {
    fc.assert(
      fc.property(fc.constantFrom<StubKind>('short', 'open'), fc.double({ min: -400, max: 400, noNaN: true }), fc.integer({ min: 1, max: 3 }), (kind, x, n) => {
        fc.pre(Math.abs(x) > 0.1);
        const r = synthesizeStub(kind, lossy, { kind: 'reactance', ohms: x }, f, n);
        expect(analyseStub(kind, lossy, r.lengthM, f).reactance / x).toBeCloseTo(1, 7);
      }),
    );
  });

  it('stays within a fraction of a percent of the lossless length for a low-loss line', () => {
    const a = synthesizeStub('open', lossless, { kind: 'capacitance', farads: 1e-12 }, f).lengthM;
    const b = synthesizeStub('open', lossy, { kind: 'capacitance', farads: 1e-12 }, f).lengthM;
    expect(Math.abs(b / a - 1)).toBeLessThan(1e-3);
  });
});

describe('unreachable targets', () => {
  it('rejects non-positive L and C with a clear message', () => {
    expect(() => synthesizeStub('short', lossless, { kind: 'inductance', henries: -1e-9 }, f)).toThrow(/inductance must be positive/);
    expect(() => synthesizeStub('open', lossless, { kind: 'capacitance', farads: 0 }, f)).toThrow(/capacitance must be positive/);
  });

  it('rejects a reactance larger than the lossy resonance can provide', () => {
    expect(() => synthesizeStub('short', lossy, { kind: 'reactance', ohms: 1e6 }, f)).toThrow(/beyond what this lossy short stub can reach/);
  });

  it('rejects a non-positive frequency and a bad solution number', () => {
    expect(() => synthesizeStub('short', lossless, { kind: 'reactance', ohms: 10 }, 0)).toThrow(RangeError);
    expect(() => synthesizeStub('short', lossless, { kind: 'reactance', ohms: 10 }, f, 0)).toThrow(RangeError);
  });
});
