import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { cabs, complex } from './complex.js';
import { c0, sigmaCopperAnnealed } from './constants.js';
import { idealLine } from './idealLine.js';
import { type LossyLineModel, withConductorLoss } from './lineLoss.js';
import { microstripLossyLine } from './microstripLine.js';
import { analyseStub, phaseConstant } from './stub.js';
import { lineResonatorQ, lossyStubImpedance, reactanceQ, resonatorQParts, stubElementQ, stubResonanceBandwidth } from './stubQ.js';

const rel = (a: number, b: number) => Math.abs(a / b - 1);
const base = { widthM: 1.7e-3, heightM: 0.762e-3, dk: 3.5, thicknessM: 35e-6 };
const copperLine = (extra: { df?: number; conductivity?: number; roughnessM?: number } = {}) =>
  microstripLossyLine({ ...base, df: 0.002, conductivity: sigmaCopperAnnealed, ...extra });
/** Ideal TEM line with constant α_c and α_d (Np/m): the textbook resonator. */
const temLine = (alphaC: number, df = 0): LossyLineModel => withConductorLoss(idealLine({ z0: 50, epsEff: 2.2, df }), () => alphaC);
/** Length of n quarter waves at f on a line of εeff. */
const quarterWaves = (n: number, epsEff: number, f: number) => (n * c0) / (4 * f * Math.sqrt(epsEff));

describe('Q of an impedance', () => {
  it('is |X|/R, Infinity without loss, 0 without reactance', () => {
    expect(reactanceQ(complex(2, -50))).toBe(25);
    expect(reactanceQ(complex(0, 10))).toBe(Infinity);
    expect(reactanceQ(complex(3, 0))).toBe(0);
    expect(() => reactanceQ(complex(-1, 1))).toThrow(RangeError);
  });
});

describe('stub used as a reactive element', () => {
  // Exact limits of a short line section (first principles, Pozar 4th ed. §2.1 lumped model, from
  // memory): a short-circuited stub with βl → 0 is L′l in series with R′l, so Q → ωL′/R′ = β/(2α_c);
  // an open stub with βl → 0 is C′l in parallel with G′l, so Q → ωC′/G′ = β/(2α_d).
  it('tends to β/(2α_c) (short, conductor loss) and β/(2α_d) (open, dielectric loss) for short stubs', () => {
    const f = 1e9;
    const len = quarterWaves(1, 2.2, f) / 2000;
    const beta = phaseConstant(2.2, f);
    expect(rel(stubElementQ('short', temLine(0.05), len, f), beta / 0.1)).toBeLessThan(1e-5);
    expect(rel(stubElementQ('open', temLine(0, 0.004), len, f), beta / (2 * temLine(0, 0.004)(f).alphaD))).toBeLessThan(1e-5);
  });

  // The engine's analyseStub uses a real Z0; on a conductor-loss line far below resonance that
  // halves R (the Im Z0 term is missing), so its |X|/R is about twice the true Q. stubElementQ
  // uses the complex Z0 of the RLGC line (cross-checked against ngspice in test/).
  it('is about half of |X|/R from the real-Z0 stub analysis for a short 10° stub', () => {
    const f = 2e9;
    const line = copperLine({ df: 0 });
    const len = quarterWaves(1, line(f).epsEff, f) / 9;
    const real = analyseStub('short', line, len, f);
    const ratio = stubElementQ('short', line, len, f) / (Math.abs(real.reactance) / real.resistance);
    expect(ratio).toBeGreaterThan(0.49);
    expect(ratio).toBeLessThan(0.52);
  });

  it('agrees with the real-Z0 analysis at a parallel resonance (|X| ≪ R there)', () => {
    const f = 2e9;
    const line = copperLine();
    const len = quarterWaves(1, line(f).epsEff, f);
    const z = lossyStubImpedance('short', line(f), len, f);
    expect(rel(z.re, analyseStub('short', line, len, f).resistance)).toBeLessThan(1e-4);
  });

  it('is Infinity on a lossless line', () => {
    expect(stubElementQ('open', temLine(0), 0.01, 1e9)).toBe(Infinity);
  });

  it('falls with more loss: lower σ, rougher copper, higher tanδ', () => {
    fc.assert(fc.property(
      fc.double({ min: 0.05, max: 0.22, noNaN: true }),
      fc.double({ min: 0.5e9, max: 5e9, noNaN: true }),
      fc.constantFrom('short' as const, 'open' as const),
      (fraction, f, kind) => {
        const len = quarterWaves(4, copperLine()(f).epsEff, f) * fraction; // away from resonances
        const q = stubElementQ(kind, copperLine({ roughnessM: 0.3e-6 }), len, f);
        expect(stubElementQ(kind, copperLine({ roughnessM: 0.3e-6, conductivity: 3e7 }), len, f)).toBeLessThan(q);
        expect(stubElementQ(kind, copperLine({ roughnessM: 1e-6 }), len, f)).toBeLessThan(q);
        expect(stubElementQ(kind, copperLine({ roughnessM: 0.3e-6, df: 0.01 }), len, f)).toBeLessThan(q);
      },
    ));
  });
});

describe('stub as a resonator (Pozar 4th ed. §6.3: Q0 = β/2α, BW = f/Q0)', () => {
  it('Q0 = β/(2α), and 1/Q0 = 1/Qc + 1/Qd', () => {
    const line = copperLine();
    const at = line(3e9);
    const parts = resonatorQParts(at, 3e9);
    expect(rel(parts.q, phaseConstant(at.epsEff, 3e9) / (2 * at.alpha))).toBeLessThan(1e-14);
    expect(rel(1 / parts.q, 1 / parts.qConductor + 1 / parts.qDielectric)).toBeLessThan(1e-12);
    expect(lineResonatorQ(10, 0)).toBe(Infinity);
    expect(() => lineResonatorQ(10, -1)).toThrow(RangeError);
  });

  // Definition of the half-power bandwidth: at f_res ± BW/2, |Z|² is half its peak (parallel
  // resonance) or twice its minimum (series resonance); Pozar 4th ed. §6.1 (from memory). The
  // Lorentzian shape behind BW = f/Q0 holds to first order in 1/Q0, hence the tolerance 1/Q0.
  it('on a TEM line: Q0 = β/2α exactly and |Z|² is halved or doubled at f ± BW/2', () => {
    const line = temLine(0.2, 0.001);
    const len = quarterWaves(1, 2.2, 1e9);
    for (const [kind, n] of [['short', 1], ['open', 1], ['short', 2], ['open', 2]] as const) {
      const r = stubResonanceBandwidth(kind, line, len, n);
      expect(rel(r.frequencyHz, n * 1e9)).toBeLessThan(1e-9);
      expect(rel(r.q, phaseConstant(2.2, r.frequencyHz) / (2 * r.line.alpha))).toBeLessThan(1e-6);
      const mag2 = (f: number) => cabs(lossyStubImpedance(kind, line(f), len, f)) ** 2;
      const want = r.type === 'parallel' ? 0.5 : 2;
      for (const f of [r.frequencyHz - r.bandwidthHz / 2, r.frequencyHz + r.bandwidthHz / 2]) {
        expect(Math.abs(mag2(f) / mag2(r.frequencyHz) - want) / want, `${kind} n=${n}`).toBeLessThan(1 / r.q);
      }
    }
  });

  // On a dispersive microstrip the half-power points follow the group delay: Q0 = (f/2α)·dβ/df.
  it('on dispersive microstrip: the bandwidth of Zin itself matches f/Q0 with the group index', () => {
    const line = copperLine();
    const len = quarterWaves(1, line(10e9).epsEff, 10e9);
    const r = stubResonanceBandwidth('short', line, len, 1);
    const mag2 = (f: number) => cabs(lossyStubImpedance('short', line(f), len, f)) ** 2;
    const peak = mag2(r.frequencyHz);
    for (const f of [r.frequencyHz - r.bandwidthHz / 2, r.frequencyHz + r.bandwidthHz / 2]) {
      expect(Math.abs(mag2(f) / peak - 0.5) / 0.5).toBeLessThan(1 / r.q);
    }
    // The phase-velocity form β/2α is lower by n_g/n − 1 (about 1.9 % here) and misses the
    // half-power points by more than the 1/Q0 tolerance.
    const qPhase = lineResonatorQ(phaseConstant(r.line.epsEff, r.frequencyHz), r.line.alpha);
    expect(r.q / qPhase).toBeGreaterThan(1.01);
    expect(r.q / qPhase).toBeLessThan(1.03);
    const fPhase = r.frequencyHz + r.frequencyHz / qPhase / 2;
    expect(Math.abs(mag2(fPhase) / peak - 0.5) / 0.5).toBeGreaterThan(1 / r.q);
  });

  it('Q0 falls with more loss: lower σ, rougher copper, higher tanδ', () => {
    fc.assert(fc.property(fc.double({ min: 5e-3, max: 50e-3, noNaN: true }), fc.integer({ min: 1, max: 4 }), (len, n) => {
      const q = stubResonanceBandwidth('open', copperLine(), len, n).q;
      expect(stubResonanceBandwidth('open', copperLine({ conductivity: 3e7 }), len, n).q).toBeLessThan(q);
      expect(stubResonanceBandwidth('open', copperLine({ roughnessM: 1e-6 }), len, n).q).toBeLessThan(q);
      expect(stubResonanceBandwidth('open', copperLine({ df: 0.004 }), len, n).q).toBeLessThan(q);
    }), { numRuns: 30 });
  });

  it('lossless: infinite Q, zero bandwidth', () => {
    const r = stubResonanceBandwidth('short', temLine(0), 0.05, 1);
    expect(r.q).toBe(Infinity);
    expect(r.bandwidthHz).toBe(0);
  });
});

describe('input checks', () => {
  it('rejects non-positive length or frequency', () => {
    const at = temLine(0.1)(1e9);
    expect(() => lossyStubImpedance('short', at, 0, 1e9)).toThrow(/length/);
    expect(() => lossyStubImpedance('short', at, 0.01, 0)).toThrow(/frequency/);
  });
});
