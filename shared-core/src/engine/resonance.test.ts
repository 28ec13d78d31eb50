import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { c0 } from './constants.js';
import { idealLine } from './idealLine.js';
import { electricalLengthAt, nearestResonances, resonanceFrequency, resonancesInRange, resonanceType } from './resonance.js';
import type { LineModel } from './types.js';

const line = idealLine({ z0: 50, epsEff: 4 });
/** A quarter wave at 1 GHz on εeff = 4: λg = c0 / (1 GHz · 2). */
const quarterAt1GHz = c0 / (1e9 * 2) / 4;

describe('resonance types', () => {
  // Common practice, no source: short stub parallel-resonant at odd λ/4, series at λ/2 multiples; open stub the reverse.
  it('follows the short/open pattern', () => {
    expect(resonanceType('short', 1)).toBe('parallel');
    expect(resonanceType('short', 2)).toBe('series');
    expect(resonanceType('short', 3)).toBe('parallel');
    expect(resonanceType('open', 1)).toBe('series');
    expect(resonanceType('open', 2)).toBe('parallel');
  });
});

describe('nearest resonances on a dispersion-free line', () => {
  it('finds the λ/4 and λ/2 frequencies exactly', () => {
    expect(resonanceFrequency(line, quarterAt1GHz, 1) / 1e9).toBeCloseTo(1, 10);
    expect(resonanceFrequency(line, quarterAt1GHz, 2) / 1e9).toBeCloseTo(2, 10);
  });

  it('reports neighbours and margin', () => {
    const r = nearestResonances('short', line, quarterAt1GHz, 1.2e9);
    expect(r.below?.frequencyHz).toBeCloseTo(1e9, 0);
    expect(r.below?.type).toBe('parallel');
    expect(r.above.frequencyHz).toBeCloseTo(2e9, 0);
    expect(r.above.type).toBe('series');
    expect(r.marginPct).toBeCloseTo((0.2 / 1.2) * 100, 8);
    expect(r.nearest).toBe(r.below);
  });

  it('has no resonance below for a stub shorter than λ/4', () => {
    const r = nearestResonances('open', line, quarterAt1GHz, 0.5e9);
    expect(r.below).toBeNull();
    expect(r.above.type).toBe('series');
    expect(r.marginPct).toBeCloseTo(100, 8);
  });

  it('counts a stub exactly on resonance as margin 0', () => {
    expect(nearestResonances('short', line, quarterAt1GHz, 1e9).marginPct).toBeLessThan(1e-9);
  });

  it('lists the resonances inside a range', () => {
    const rs = resonancesInRange('open', line, quarterAt1GHz, 0.9e9, 3.1e9);
    expect(rs.map((r) => Math.round(r.frequencyHz / 1e8) / 10)).toEqual([1, 2, 3]);
    expect(rs.map((r) => r.type)).toEqual(['series', 'parallel', 'series']);
  });
});

describe('resonances on a dispersive line', () => {
  /** A made-up line whose εeff rises with frequency (as microstrip does). */
  const dispersive: LineModel = (f) => ({ z0: 50, epsEff: 4 + 0.5 * (f / 10e9) ** 2, alpha: 0 });

  it('solves θ(f_res) = n·90° with εeff at f_res, not scaled from θ at the operating frequency', () => {
    const l = 0.02;
    const fOp = 1e9;
    const r = nearestResonances('short', dispersive, l, fOp);
    expect(electricalLengthAt(dispersive, l, r.above.frequencyHz)).toBeCloseTo(Math.PI / 2, 10);
    const scaled = fOp * (Math.PI / 2) / electricalLengthAt(dispersive, l, fOp);
    expect(r.above.frequencyHz).toBeLessThan(scaled * 0.999); // dispersion pulls the resonance down
  });

  it('property: every resonance found sits at an exact multiple of 90°', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 0.2, noNaN: true }), fc.integer({ min: 1, max: 9 }), (l, n) => {
        const f = resonanceFrequency(dispersive, l, n);
        expect(electricalLengthAt(dispersive, l, f) / ((n * Math.PI) / 2)).toBeCloseTo(1, 9);
      }),
    );
  });
});
