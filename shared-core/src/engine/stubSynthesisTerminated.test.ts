import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { idealLine } from './idealLine.js';
import { microstripLine } from './microstripLine.js';
import { openEndExtension } from './openEnd.js';
import { guidedWavelength } from './stub.js';
import { synthesizeStub, type StubTarget } from './stubSynthesis.js';
import { synthesizeEndedStub } from './stubSynthesisTerminated.js';
import { analyseEndedStub, type StubEnd, viaEquivalentLength } from './terminatedStub.js';
import { viaInductance } from './via.js';

const f = 2.45e9;
const lossless = idealLine({ z0: 50, epsEff: 3.2 });
const lossy = idealLine({ z0: 50, epsEff: 3.2, df: 0.004 });
const lambdaG = guidedWavelength(3.2, f);
const viaL = 0.35e-9; // ωL ≈ 5.4 Ω at 2.45 GHz
const xVia = 2 * Math.PI * f * viaL;
const reactanceArb = fc.double({ min: -400, max: 400, noNaN: true }).filter((x) => Math.abs(x) > 0.1);

/** Round trip: analyse the drawn length with its end and compare with the asked reactance. */
const roundTripError = (end: StubEnd, line: typeof lossless, x: number, n: number) => {
  const r = synthesizeEndedStub(end, line, { kind: 'reactance', ohms: x }, f, n);
  return Math.abs(analyseEndedStub(end, line, r.drawnLengthM, f).reactance / x - 1);
};

describe('open stub with end extension', () => {
  const end = { kind: 'open', extensionM: 0.6e-3 } as const;

  it('draws the ideal length minus Δl', () => {
    const target: StubTarget = { kind: 'capacitance', farads: 1.2e-12 };
    const ideal = synthesizeStub('open', lossless, target, f);
    const r = synthesizeEndedStub(end, lossless, target, f);
    expect(r.drawnLengthM).toBeCloseTo(ideal.lengthM - 0.6e-3, 15);
    expect(r.idealLengthM).toBe(ideal.lengthM);
    expect(r.endCorrectionM).toBe(0.6e-3);
  });

  it('property: analysis of the drawn length with Δl reproduces the target to 1e-9 (lossless and lossy, n = 1…3)', () => {
    fc.assert(
      fc.property(reactanceArb, fc.integer({ min: 1, max: 3 }), fc.boolean(), (x, n, withLoss) => {
        fc.pre(n > 1 || x < -20 || x > 0); // small capacitive targets on branch 1 are shorter than Δl
        expect(roundTripError(end, withLoss ? lossy : lossless, x, n)).toBeLessThan(1e-9);
      }),
    );
  });

  it('round trip on a real microstrip with its own Kirschning–Jansen–Koster Δl', () => {
    const g = { widthM: 1.15e-3, heightM: 0.508e-3, dk: 3.66, thicknessM: 35e-6 };
    const line = microstripLine({ ...g, df: 0.004 });
    const microEnd: StubEnd = { kind: 'open', extensionM: openEndExtension(g).extensionM };
    const r = synthesizeEndedStub(microEnd, line, { kind: 'capacitance', farads: 1.5e-12 }, 5.8e9);
    expect(analyseEndedStub(microEnd, line, r.drawnLengthM, 5.8e9).capacitance! / 1.5e-12).toBeCloseTo(1, 9);
  });

  it('rejects a stub shorter than its own end effect, with a fix', () => {
    const tiny = -1 / (2 * Math.PI * f * 0.02e-12); // 0.02 pF: a very short open stub
    expect(() => synthesizeEndedStub({ kind: 'open', extensionM: 2e-3 }, lossless, { kind: 'reactance', ohms: tiny }, f)).toThrow(
      /shorter than its own end effect.*use solution 2/,
    );
    expect(synthesizeEndedStub({ kind: 'open', extensionM: 2e-3 }, lossless, { kind: 'reactance', ohms: tiny }, f, 2).drawnLengthM).toBeGreaterThan(0);
  });
});

describe('short stub through a via', () => {
  const end = { kind: 'short', viaInductanceH: viaL } as const;

  it('with no via is exactly synthesizeStub', () => {
    const target: StubTarget = { kind: 'inductance', henries: 2e-9 };
    expect(synthesizeEndedStub({ kind: 'short' }, lossy, target, f, 2).drawnLengthM).toBe(synthesizeStub('short', lossy, target, f, 2).lengthM);
  });

  it('draws the ideal length minus the via equivalent length on a lossless line', () => {
    const target: StubTarget = { kind: 'inductance', henries: 2e-9 };
    const r = synthesizeEndedStub(end, lossless, target, f);
    expect(r.drawnLengthM + viaEquivalentLength(viaL, lossless(f), f)).toBeCloseTo(synthesizeStub('short', lossless, target, f).lengthM, 15);
    expect(r.endCorrectionM).toBeGreaterThan(0);
  });

  it('property: analysis of the drawn length with the via reproduces the target to 1e-9 (lossless and lossy, n = 1…3)', () => {
    fc.assert(
      fc.property(reactanceArb, fc.integer({ min: 1, max: 3 }), fc.boolean(), fc.double({ min: 0, max: 0.05, noNaN: true }), (x, n, withLoss, viaR) => {
        fc.pre(n > 1 || x < 0 || x > xVia * 1.05);
        const e: StubEnd = { kind: 'short', viaInductanceH: viaL, viaResistanceOhm: viaR };
        expect(roundTripError(e, withLoss ? lossy : lossless, x, n)).toBeLessThan(1e-9);
      }),
    );
  });

  it('round trip with a Goldfarb–Pucel via on microstrip', () => {
    const line = microstripLine({ widthM: 3.0e-3, heightM: 1.6e-3, dk: 4.4, thicknessM: 35e-6, df: 0.02 });
    const via: StubEnd = { kind: 'short', viaInductanceH: viaInductance({ heightM: 1.6e-3, diameterM: 0.4e-3 }).inductanceH };
    for (const target of [{ kind: 'inductance', henries: 3e-9 }, { kind: 'capacitance', farads: 2e-12 }] as const) {
      const r = synthesizeEndedStub(via, line, target, 1.2e9);
      const a = analyseEndedStub(via, line, r.drawnLengthM, 1.2e9);
      const got = target.kind === 'inductance' ? a.inductance! / target.henries : a.capacitance! / target.farads;
      expect(got).toBeCloseTo(1, 9);
    }
  });

  it('property: more via inductance gives a shorter drawn stub for the same target', () => {
    fc.assert(
      fc.property(fc.double({ min: 20, max: 300, noNaN: true }), fc.double({ min: 0.05e-9, max: 0.3e-9, noNaN: true }), fc.boolean(), (x, l1, withLoss) => {
        const line = withLoss ? lossy : lossless;
        const target: StubTarget = { kind: 'reactance', ohms: x };
        const a = synthesizeEndedStub({ kind: 'short', viaInductanceH: l1 }, line, target, f).drawnLengthM;
        const b = synthesizeEndedStub({ kind: 'short', viaInductanceH: l1 * 1.5 }, line, target, f).drawnLengthM;
        expect(b).toBeLessThan(a);
        expect(a).toBeLessThan(synthesizeStub('short', line, target, f).lengthM);
      }),
    );
  });

  it('rejects an inductive target below the via reactance, naming the via reactance', () => {
    for (const line of [lossless, lossy]) {
      expect(() => synthesizeEndedStub(end, line, { kind: 'reactance', ohms: xVia / 2 }, f)).toThrow(/the via alone is already 5\.38\d Ω/);
    }
    // Half a wave further the same target is reachable.
    const r = synthesizeEndedStub(end, lossless, { kind: 'reactance', ohms: xVia / 2 }, f, 2);
    expect(r.drawnLengthM).toBeGreaterThan(lambdaG / 2 - r.endCorrectionM);
  });

  it('rejects a target beyond the lossy resonance peak', () => {
    expect(() => synthesizeEndedStub(end, lossy, { kind: 'reactance', ohms: 1e6 }, f)).toThrow(/beyond what this lossy short stub/);
  });

  it('maps an angle target to the equivalent ideal stub', () => {
    const r = synthesizeEndedStub(end, lossless, { kind: 'angle', radians: Math.PI / 4 }, f);
    expect(r.drawnLengthM + r.endCorrectionM).toBeCloseTo(lambdaG / 8, 15);
  });

  it('rejects a non-positive frequency and a bad solution number', () => {
    expect(() => synthesizeEndedStub(end, lossless, { kind: 'reactance', ohms: 10 }, 0)).toThrow(RangeError);
    expect(() => synthesizeEndedStub(end, lossless, { kind: 'reactance', ohms: 10 }, f, 1.5)).toThrow(RangeError);
  });
});
