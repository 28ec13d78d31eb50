import { describe, expect, it } from 'vitest';
import { analyseBand } from './band.js';
import { idealLine } from './idealLine.js';
import { guidedWavelength } from './stub.js';

const line = idealLine({ z0: 50, epsEff: 2.1 });
const lambdaAt = (f: number) => guidedWavelength(2.1, f);

describe('band analysis', () => {
  it('reports C at the edges and centre and a spread for a short open stub', () => {
    const l = lambdaAt(2.45e9) / 12; // 30° at centre: a capacitor
    const b = analyseBand('open', line, l, 2.4e9, 2.5e9);
    expect(b.quantity).toBe('capacitance');
    expect(b.resonancesInBand).toEqual([]);
    expect(b.min).toBe(Math.min(b.low.capacitance!, b.center.capacitance!, b.high.capacitance!));
    expect(b.max).toBe(Math.max(b.low.capacitance!, b.center.capacitance!, b.high.capacitance!));
    // Common practice, no source: a stub's equivalent C rises with frequency (C = tan θ/(ωZ0) grows faster than 1/ω falls).
    expect(b.high.capacitance!).toBeGreaterThan(b.low.capacitance!);
    expect(b.spreadPct).toBeCloseTo(((b.max! - b.min!) / b.center.capacitance!) * 100, 12);
  });

  it('finds a resonance inside the band and then gives no spread', () => {
    const l = lambdaAt(2.45e9) / 4;
    const b = analyseBand('short', line, l, 2.4e9, 2.5e9);
    expect(b.resonancesInBand).toHaveLength(1);
    expect(b.resonancesInBand[0]!.type).toBe('parallel');
    expect(b.resonancesInBand[0]!.frequencyHz / 2.45e9).toBeCloseTo(1, 9);
    expect(b.spreadPct).toBeNull();
  });

  it('rejects an empty or inverted band', () => {
    expect(() => analyseBand('short', line, 0.01, 2.5e9, 2.4e9)).toThrow(RangeError);
  });
});
