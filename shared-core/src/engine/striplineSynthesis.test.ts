import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { striplineStatic } from './striplineStatic.js';
import { closedFormStriplineWidthRatio, striplineWidthForZ0 } from './striplineSynthesis.js';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('stripline synthesis: worked example', () => {
  it('50 Ω with b = 0.32 cm, εr = 2.20 needs W ≈ 0.266 cm', () => {
    // Pozar, Microwave Engineering, 4th ed., Example 3.5 (from memory; the inputs also appear in a
    // public restatement of the example): W/b = 30π/(√εr·Z0) − 0.441 = 0.830, W = 0.266 cm, from the
    // book's approximate eq. 3.181. The exact Cohn result gives W = 0.2653 cm (−0.3 %).
    const r = striplineWidthForZ0({ z0: 50, heightM: 3.2e-3, dk: 2.2 });
    expect(rel(r.widthM, 2.66e-3)).toBeLessThan(0.005);
    expect(r.epsEff).toBe(2.2);
    expect(r.notes).toEqual([]);
  });

  it('the closed-form start is within 5 % and keeps the search short', () => {
    for (const [z0, dk, t] of [[50, 2.2, 0], [25, 4, 0.05], [100, 3.5, 0.01], [150, 1, 0]] as const) {
      const r = striplineWidthForZ0({ z0, heightM: 1e-3, dk, thicknessM: t * 1e-3 });
      expect(rel(r.initialWidthM, r.widthM)).toBeLessThan(0.05);
      expect(r.evaluations).toBeLessThan(25);
      expect(rel(closedFormStriplineWidthRatio(z0, dk, t), r.widthM / 1e-3)).toBeLessThan(0.05);
    }
  });
});

describe('stripline synthesis: analysis(synthesis(Z)) = Z', () => {
  // Targets as the air-line impedance Z0·√εr, so every one is reachable: w/b = 1e-3 reaches 470 Ω
  // in air at t = 0, and about 140 Ω at t/b = 0.2 (the thick strip's equivalent width stays wide).
  const zAir = fc.double({ min: 10, max: 400, noNaN: true });
  const zAirThick = fc.double({ min: 10, max: 130, noNaN: true });
  const dk = fc.double({ min: 1, max: 12, noNaN: true });
  const b = fc.double({ min: 0.05e-3, max: 5e-3, noNaN: true });

  it('property: zero thickness, 1e-9 relative or better', () => {
    fc.assert(
      fc.property(zAir, dk, b, (za, er, bb) => {
        const z = za / Math.sqrt(er);
        const r = striplineWidthForZ0({ z0: z, heightM: bb, dk: er });
        expect(rel(striplineStatic({ widthM: r.widthM, heightM: bb, dk: er }).z0, z)).toBeLessThan(1e-9);
      }),
    );
  });

  it('property: with thickness up to t/b = 0.2, 1e-9 relative or better, and a narrower strip', () => {
    fc.assert(
      fc.property(zAirThick, dk, b, fc.double({ min: 1e-3, max: 0.2, noNaN: true }), (za, er, bb, t) => {
        const z = za / Math.sqrt(er);
        const g = { heightM: bb, dk: er, thicknessM: t * bb };
        const r = striplineWidthForZ0({ z0: z, ...g });
        expect(rel(striplineStatic({ widthM: r.widthM, ...g }).z0, z)).toBeLessThan(1e-9);
        expect(r.widthM).toBeLessThan(striplineWidthForZ0({ z0: z, heightM: bb, dk: er }).widthM);
      }),
    );
  });
});

describe('stripline synthesis: unreachable targets and bad input', () => {
  it('throws RangeError for non-positive targets and impossible geometry', () => {
    for (const z of [0, -50, Number.NaN, Number.POSITIVE_INFINITY]) expect(() => striplineWidthForZ0({ z0: z, heightM: 1e-3, dk: 4 })).toThrow(RangeError);
    expect(() => striplineWidthForZ0({ z0: 50, heightM: 0, dk: 4 })).toThrow(/heightM/);
    expect(() => striplineWidthForZ0({ z0: 50, heightM: 1e-3, dk: 0.5 })).toThrow(/dk/);
    expect(() => striplineWidthForZ0({ z0: 50, heightM: 1e-3, dk: 4, thicknessM: 2e-3 })).toThrow(/less than heightM/);
  });

  it('throws RangeError naming the reachable range when w/b would leave 1e-3 … 1e3', () => {
    // Air: w/b = 1e-3 gives (η0/2π)·ln(8000/π) ≈ 470 Ω; w/b = 1e3 gives about 0.094 Ω.
    expect(() => striplineWidthForZ0({ z0: 600, heightM: 1e-3, dk: 1 })).toThrow(/not reachable.*470\.\d Ω down to 0\.09\d+ Ω/);
    expect(() => striplineWidthForZ0({ z0: 0.05, heightM: 1e-3, dk: 1 })).toThrow(RangeError);
  });
});
