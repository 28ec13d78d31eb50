import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { cabs } from './complex.js';
import { idealLine } from './idealLine.js';
import { matchedLineVoltagePeak, needsStressCheck, shuntJunctionVoltagePeak, STRESS_CAUTION_THRESHOLDS, type StubStress, stubStress, stubStressCautions } from './power.js';
import { guidedWavelength, phaseConstant } from './stub.js';
import { endedStubInputImpedance, type StubEnd } from './terminatedStub.js';

const f = 1e9;
const Z0 = 50;
const lossless = idealLine({ z0: Z0, epsEff: 2.5 })(f);
const lossy = idealLine({ z0: Z0, epsEff: 2.5, df: 0.01 })(f);
const beta = phaseConstant(2.5, f);
const lambdaG = guidedWavelength(2.5, f);
const rel = (a: number, b: number) => Math.abs(a / b - 1);
const stress = (end: StubEnd, lengthM: number, powerW = 1, line = lossless) =>
  stubStress({ powerW, lineZ0: Z0, end, stubLine: line, drawnLengthM: lengthM, frequencyHz: f });

const endArb: fc.Arbitrary<StubEnd> = fc.oneof(
  fc.constant<StubEnd>({ kind: 'open' }),
  fc.constant<StubEnd>({ kind: 'short' }),
  fc.double({ min: 0, max: 3e-3, noNaN: true }).map<StubEnd>((extensionM) => ({ kind: 'open', extensionM })),
  fc.record({ viaInductanceH: fc.double({ min: 0.05e-9, max: 1e-9, noNaN: true }), viaResistanceOhm: fc.double({ min: 0, max: 0.1, noNaN: true }) }).map<StubEnd>((v) => ({ kind: 'short', ...v })),
);
/** Lengths away from the lossless series resonances, where the stress is infinite. */
const lengthArb = fc.double({ min: 0.002, max: 0.98, noNaN: true }).map((x) => x * lambdaG);

describe('junction voltage', () => {
  // P = |V|²/(2·Z0) on a matched line (Pozar, 4th ed., §2.1, from memory): 1 W on 50 Ω is 10 V peak.
  it('is √(2·P·Z0line)', () => {
    expect(matchedLineVoltagePeak(1, 50)).toBe(10);
    expect(stress({ kind: 'open' }, lambdaG / 8, 100).junctionVoltagePeak).toBeCloseTo(100, 12);
  });

  it('can be given directly when the junction sits on a standing wave', () => {
    const s = stubStress({ powerW: 1, lineZ0: Z0, junctionVoltagePeak: 25, end: { kind: 'open' }, stubLine: lossless, drawnLengthM: lambdaG / 8, frequencyHz: f });
    expect(s.junctionVoltagePeak).toBe(25);
    expect(s.endVoltagePeak! / 25).toBeCloseTo(Math.SQRT2, 12);
  });
});

describe('standing-wave stress from the line equations', () => {
  // Derived from V(d) = V_L·cosh γd + I_L·Z0·sinh γd (Pozar, 4th ed., §2.1/§2.7): on a lossless open
  // stub V_end = V_j/|cos βl|, on a short stub I_short = V_j/(Z0·|sin βl|).
  it('lossless: open-end voltage ratio is 1/|cos βl| and short current V_j/(Z0·|sin βl|)', () => {
    fc.assert(
      fc.property(lengthArb, (l) => {
        const theta = beta * l;
        fc.pre(Math.abs(Math.cos(theta)) > 1e-3 && Math.abs(Math.sin(theta)) > 1e-3);
        expect(rel(stress({ kind: 'open' }, l).endVoltagePeak! / 10, 1 / Math.abs(Math.cos(theta)))).toBeLessThan(1e-12);
        expect(rel(stress({ kind: 'short' }, l).endCurrentPeak!, 10 / (Z0 * Math.abs(Math.sin(theta))))).toBeLessThan(1e-12);
      }),
    );
  });

  it('current into the stub is V_j/|Zin| for every end, lossy or not', () => {
    fc.assert(
      fc.property(endArb, lengthArb, fc.boolean(), (end, l, withLoss) => {
        const line = withLoss ? lossy : lossless;
        const zin = endedStubInputImpedance(end, line, l, f);
        const s = stress(end, l, 1, line);
        fc.pre(Number.isFinite(s.junctionCurrentPeak) && s.junctionCurrentPeak < 1e6);
        expect(rel(s.junctionCurrentPeak, 10 / cabs(zin))).toBeLessThan(1e-9);
      }),
    );
  });

  // Lossless standing wave: |V(d)|² + Z0²·|I(d)|² is the same everywhere along the stub, so once
  // the stub holds a full voltage and current maximum (l ≥ λ/4) the two peaks satisfy V = Z0·I.
  it('lossless: the largest voltage and current along a stub of λ/4 or more satisfy V = Z0·I', () => {
    fc.assert(
      fc.property(fc.constantFrom<StubEnd>({ kind: 'open' }, { kind: 'short' }, { kind: 'short', viaInductanceH: 0.5e-9 }), fc.double({ min: 0.5, max: 0.98, noNaN: true }), (end, fraction) => {
        const s = stress(end, fraction * lambdaG);
        fc.pre(Number.isFinite(s.maxVoltagePeak));
        expect(rel(s.maxVoltagePeak, Z0 * s.maxCurrentPeak)).toBeLessThan(1e-9);
      }),
    );
  });

  it('a capacitive short stub carries more voltage inside it than at the junction', () => {
    const l = 0.3 * lambdaG; // 108°: the voltage peaks λ/4 from the short
    const s = stress({ kind: 'short' }, l);
    expect(s.endVoltagePeak).toBe(0);
    expect(rel(s.maxVoltagePeak, 10 / Math.sin(beta * l))).toBeLessThan(1e-12);
    expect(s.maxVoltagePeak).toBeGreaterThan(s.junctionVoltagePeak);
  });

  it('measures the open-end voltage at the strip edge, Δl in from the virtual open end', () => {
    const dl = 1e-3;
    const l = 0.1 * lambdaG;
    const s = stress({ kind: 'open', extensionM: dl }, l);
    expect(rel(s.endVoltagePeak!, (10 * Math.cos(beta * dl)) / Math.abs(Math.cos(beta * (l + dl))))).toBeLessThan(1e-12);
  });

  it('puts the via current and the voltage across the via in the end values', () => {
    const viaL = 0.5e-9;
    const l = 0.1 * lambdaG;
    const s = stress({ kind: 'short', viaInductanceH: viaL }, l);
    const xv = 2 * Math.PI * f * viaL;
    const expected = 10 / Math.abs(xv * Math.cos(beta * l) + Z0 * Math.sin(beta * l));
    expect(rel(s.endCurrentPeak!, expected)).toBeLessThan(1e-12);
    expect(rel(s.endVoltagePeak!, xv * expected)).toBeLessThan(1e-12);
  });

  it('a lossless series resonance is infinite, the lossy one finite: V_j/sinh(αl) at λ/4', () => {
    const l = lambdaG / 4;
    const ideal = stress({ kind: 'open' }, l);
    expect(ideal.endVoltagePeak).toBe(Infinity);
    expect(needsStressCheck(ideal)).toBe(true);
    const real = stress({ kind: 'open' }, l, 1, lossy);
    expect(rel(real.endVoltagePeak!, 10 / Math.sinh(lossy.alpha * l))).toBeLessThan(1e-9);
  });

  it('property: loss never raises the end stress (|cosh γl| ≥ |cos βl|)', () => {
    fc.assert(
      fc.property(lengthArb, (l) => {
        expect(stress({ kind: 'open' }, l, 1, lossy).endVoltagePeak!).toBeLessThanOrEqual(stress({ kind: 'open' }, l).endVoltagePeak! * (1 + 1e-12));
        expect(stress({ kind: 'short' }, l, 1, lossy).endCurrentPeak!).toBeLessThanOrEqual(stress({ kind: 'short' }, l).endCurrentPeak! * (1 + 1e-12));
      }),
    );
  });

  it('property: stress grows as √P', () => {
    const fields = (s: StubStress) => [s.junctionVoltagePeak, s.junctionCurrentPeak, s.endVoltagePeak ?? 0, s.endCurrentPeak ?? 0, s.maxVoltagePeak, s.maxCurrentPeak];
    fc.assert(
      fc.property(endArb, lengthArb, fc.double({ min: 1e-3, max: 1e3, noNaN: true }), fc.double({ min: 1.01, max: 100, noNaN: true }), (end, l, p, k) => {
        const a = fields(stress(end, l, p, lossy));
        const b = fields(stress(end, l, k * p, lossy));
        a.forEach((v, i) => expect(Math.abs(b[i]! - Math.sqrt(k) * v)).toBeLessThanOrEqual(1e-12 * Math.sqrt(k) * v));
      }),
    );
  });
});

describe('stress cautions (common practice, no source: a prompt to check, not a rating)', () => {
  it('stays quiet at 1 W and speaks up at 100 W on a λ/8 short stub', () => {
    const quiet = stress({ kind: 'short' }, lambdaG / 8, 1);
    expect(stubStressCautions(quiet)).toEqual([]);
    const loud = stress({ kind: 'short' }, lambdaG / 8, 100); // I_short = 100 V/(50 Ω·sin 45°) = 2.8 A
    const cautions = stubStressCautions(loud);
    expect(cautions.map((c) => c.quantity)).toEqual(['current']);
    expect(cautions[0]!.threshold).toBe(STRESS_CAUTION_THRESHOLDS.currentPeakA);
    expect(cautions[0]!.message).toMatch(/2\.83 A is above 1 A: check heating/);
  });

  it('flags the open-end voltage near a quarter wave and honours custom thresholds', () => {
    const s = stress({ kind: 'open' }, 0.24 * lambdaG, 10); // V_end = 31.6 V/cos 86.4° ≈ 503 V
    expect(stubStressCautions(s).map((c) => c.quantity)).toContain('voltage');
    expect(needsStressCheck(s, { voltagePeakV: 1e4, currentPeakA: 1e3 })).toBe(false);
  });

  it('throws a RangeError for negative power or a bad impedance', () => {
    expect(() => stress({ kind: 'open' }, 0.01, -1)).toThrow(/powerW/);
    expect(() => stubStress({ powerW: 1, lineZ0: 0, end: { kind: 'open' }, stubLine: lossless, drawnLengthM: 0.01, frequencyHz: f })).toThrow(/lineZ0/);
  });
});

describe('junction voltage with the stub shunting a matched line', () => {
  // Shunt element between matched lines: V = V_inc·2/(2 + Z0/Zin) (Pozar, Microwave Engineering,
  // 4th ed., ch. 4, from memory). An open circuit leaves the line voltage; a short removes it.
  it('is the matched-line voltage for an open, zero for a short, and |2/(2 + Z0/Zin)| between', () => {
    const v = matchedLineVoltagePeak(1, 50);
    expect(shuntJunctionVoltagePeak(1, 50, { re: 1e12, im: 0 })).toBeCloseTo(v, 6);
    expect(shuntJunctionVoltagePeak(1, 50, { re: 1e-9, im: 0 })).toBeLessThan(1e-6);
    expect(shuntJunctionVoltagePeak(1, 50, { re: 0, im: -25 }) / v).toBeCloseTo(2 / Math.hypot(2, 2), 12);
  });
});
