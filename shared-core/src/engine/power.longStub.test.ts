/**
 * The largest standing-wave peak along a stub, checked against a dense walk of the line equations
 * V(d) = V_L·cosh γd + I_L·Z0·sinh γd, I(d) = I_L·cosh γd + (V_L/Z0)·sinh γd (Pozar, Microwave
 * Engineering, 4th ed., §2.1 and §2.7, from memory; the same equations as power.ts), and a stub
 * millions of wavelengths long (a slip of units in a sheet), whose peaks are found without walking
 * every one of them: the work no longer grows with the length.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { cabs, cadd, cmul, complex, cscale, type Complex } from './complex.js';
import { idealLine } from './idealLine.js';
import { stubStress } from './power.js';
import { guidedWavelength, phaseConstant, propagationConstant } from './stub.js';
import { endedLineLength, endLoad, isOpenLoad, type StubEnd } from './terminatedStub.js';
import type { LineAtFrequency } from './types.js';

const f = 1e9;
const Z0 = 50;
const lambdaG = guidedWavelength(2.5, f);
const lines: Record<string, LineAtFrequency> = {
  lossless: idealLine({ z0: Z0, epsEff: 2.5 })(f),
  lossy: idealLine({ z0: Z0, epsEff: 2.5, df: 0.01 })(f),
  'very lossy': idealLine({ z0: Z0, epsEff: 2.5, df: 0.2 })(f),
};

const ccosh = (z: Complex) => complex(Math.cosh(z.re) * Math.cos(z.im), Math.sinh(z.re) * Math.sin(z.im));
const csinh = (z: Complex) => complex(Math.sinh(z.re) * Math.cos(z.im), Math.cosh(z.re) * Math.sin(z.im));

/** The unit terminal state carried along the stub: V and I at distance d from the end. */
function waveOf(end: StubEnd, line: LineAtFrequency) {
  const gamma = propagationConstant(line, f);
  const load = endLoad(end, f);
  const open = isOpenLoad(load);
  const zl = open ? complex(0) : (load as Complex);
  const at = (d: number) => {
    const gd = complex(gamma.re * d, gamma.im * d);
    return open
      ? { v: ccosh(gd), i: cscale(csinh(gd), 1 / Z0) }
      : { v: cadd(cmul(zl, ccosh(gd)), cscale(csinh(gd), Z0)), i: cadd(ccosh(gd), cscale(cmul(zl, csinh(gd)), 1 / Z0)) };
  };
  return { at, open, zl, dEnd: end.kind === 'open' ? (end.extensionM ?? 0) : 0 };
}

/**
 * The search as it was before it stopped walking every maximum: |V| at every point where
 * Γ(d) = Γ_L·e^(−2γd) is real and positive, |I| where it is real and negative, plus both ends.
 */
function everyMaximum(end: StubEnd, line: LineAtFrequency, drawnLengthM: number, vj: number): { v: number; i: number } {
  const { at, open, zl, dEnd } = waveOf(end, line);
  const dJunction = endedLineLength(end, drawnLengthM);
  const scale = vj / cabs(at(dJunction).v);
  const argGamma = open ? 0 : Math.atan2(2 * zl.im * Z0, cabs(zl) ** 2 - Z0 * Z0);
  const beta = phaseConstant(line.epsEff, f);
  let v = Math.max(vj, scale * cabs(at(dEnd).v));
  let i = Math.max(scale * cabs(at(dJunction).i), scale * cabs(at(dEnd).i));
  for (const [offset, isVoltage] of [[0, true], [Math.PI, false]] as const) {
    for (let m = Math.ceil((2 * beta * dEnd - argGamma - offset) / (2 * Math.PI)); ; m++) {
      const d = (argGamma + offset + 2 * Math.PI * m) / (2 * beta);
      if (d > dJunction) break;
      if (isVoltage) v = Math.max(v, scale * cabs(at(d).v));
      else i = Math.max(i, scale * cabs(at(d).i));
    }
  }
  return { v, i };
}

/** Largest |V| and |I| along the stub by walking it in steps of λg/4000, scaled to the junction voltage. */
function walk(end: StubEnd, line: LineAtFrequency, drawnLengthM: number, vj: number): { v: number; i: number } {
  const { at, dEnd } = waveOf(end, line);
  const dJunction = endedLineLength(end, drawnLengthM);
  const scale = vj / cabs(at(dJunction).v);
  let v = 0;
  let i = 0;
  const step = lambdaG / 4000;
  const n = Math.ceil((dJunction - dEnd) / step);
  for (let k = 0; k <= n; k++) {
    const w = at(dEnd + ((dJunction - dEnd) * k) / n);
    v = Math.max(v, cabs(w.v));
    i = Math.max(i, cabs(w.i));
  }
  return { v: v * scale, i: i * scale };
}

const endArb: fc.Arbitrary<StubEnd> = fc.oneof(
  fc.constant<StubEnd>({ kind: 'open' }),
  fc.constant<StubEnd>({ kind: 'short' }),
  fc.double({ min: 0, max: 3e-3, noNaN: true }).map<StubEnd>((extensionM) => ({ kind: 'open', extensionM })),
  fc.record({ viaInductanceH: fc.double({ min: 0.05e-9, max: 1e-9, noNaN: true }), viaResistanceOhm: fc.double({ min: 0, max: 0.5, noNaN: true }) })
    .map<StubEnd>((v) => ({ kind: 'short', ...v })),
);

describe('largest standing-wave peak along a stub', () => {
  it('is the one every maximum gives, up to 5 000 wavelengths, any end and loss', () => {
    fc.assert(
      fc.property(endArb, fc.double({ min: -2, max: Math.log10(5000), noNaN: true }), fc.constantFrom(...Object.keys(lines)), (end, log, which) => {
        const line = lines[which]!;
        const l = 10 ** log * lambdaG;
        const s = stubStress({ powerW: 1, lineZ0: Z0, end, stubLine: line, drawnLengthM: l, frequencyHz: f });
        fc.pre(Number.isFinite(s.maxVoltagePeak) && Number.isFinite(s.maxCurrentPeak));
        const all = everyMaximum(end, line, l, s.junctionVoltagePeak);
        expect(Math.abs(s.maxVoltagePeak / all.v - 1)).toBeLessThan(1e-9);
        expect(Math.abs(s.maxCurrentPeak / all.i - 1)).toBeLessThan(1e-9);
      }),
      { numRuns: 80 },
    );
  });

  it('equals the largest value of a dense walk along the stub, up to 20 wavelengths, any end, with or without (small) loss', () => {
    fc.assert(
      fc.property(endArb, fc.double({ min: 0.01, max: 20, noNaN: true }), fc.constantFrom('lossless', 'lossy'), (end, wavelengths, which) => {
        const line = lines[which]!;
        const s = stubStress({ powerW: 1, lineZ0: Z0, end, stubLine: line, drawnLengthM: wavelengths * lambdaG, frequencyHz: f });
        fc.pre(Number.isFinite(s.maxVoltagePeak) && Number.isFinite(s.maxCurrentPeak) && s.maxVoltagePeak < 1e6);
        const w = walk(end, line, wavelengths * lambdaG, s.junctionVoltagePeak);
        // the walk misses a peak by at most cos(2π/4000) ≈ 1 − 1.2e-6; loss moves peaks by O((α/β)²)
        expect(Math.abs(s.maxVoltagePeak / Math.max(w.v, s.junctionVoltagePeak) - 1)).toBeLessThan(1e-4);
        expect(Math.abs(s.maxCurrentPeak / w.i - 1)).toBeLessThan(1e-4);
      }),
      { numRuns: 60 },
    );
  });

  it('a stub about 10^10 wavelengths long (a unit slip) is answered at once, and right', () => {
    const beta = phaseConstant(2.5, f);
    const l = 1e9; // metres
    const s = stubStress({ powerW: 1, lineZ0: Z0, end: { kind: 'open' }, stubLine: lines.lossless!, drawnLengthM: l, frequencyHz: f });
    // lossless open stub: every voltage maximum equals the open-end voltage V_j/|cos βl| (file header of power.ts)
    expect(Math.abs(s.maxVoltagePeak / Math.max(10, 10 / Math.abs(Math.cos(beta * l))) - 1)).toBeLessThan(1e-6);
    const short = stubStress({ powerW: 1, lineZ0: Z0, end: { kind: 'short' }, stubLine: lines.lossless!, drawnLengthM: l, frequencyHz: f });
    // lossless short stub: every current maximum equals the short's current V_j/(Z0·|sin βl|)
    expect(Math.abs(short.maxCurrentPeak / (10 / (Z0 * Math.abs(Math.sin(beta * l)))) - 1)).toBeLessThan(1e-6);
  });
});
