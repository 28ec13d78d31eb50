import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { segmentsOf } from './model.js';
import { axisUnit, clipSegment, escapeXml, niceTicks } from './svg.js';

describe('clipSegment', () => {
  it('cuts a curve at the edges of the y range, interpolating the crossing', () => {
    expect(clipSegment([[0, 0], [1, 2], [2, 0]], -1, 1)).toEqual([[[0, 0], [0.5, 1]], [[1.5, 1], [2, 0]]]);
    expect(clipSegment([[0, -3], [1, 0], [2, 3]], -1, 1)).toEqual([[[2 / 3, -1], [1, 0], [4 / 3, 1]]]);
  });

  it('never draws a jump from beyond one edge to beyond the other (a pole between two samples)', () => {
    expect(clipSegment([[0, 0.5], [1, 5], [2, -5], [3, -0.5]], -1, 1)).toEqual([[[0, 0.5], [1 / 9, 1]], [[26 / 9, -1], [3, -0.5]]]);
  });

  it('keeps every point inside the range and in x order (property)', () => {
    fc.assert(fc.property(fc.array(fc.double({ min: -100, max: 100, noNaN: true }), { minLength: 2, maxLength: 60 }), (ys) => {
      const pts = ys.map((y, i) => [i, y] as [number, number]);
      for (const piece of clipSegment(pts, -10, 10)) {
        expect(piece.length).toBeGreaterThanOrEqual(2);
        for (let k = 0; k < piece.length; k++) {
          expect(piece[k]![1]).toBeGreaterThanOrEqual(-10 - 1e-9);
          expect(piece[k]![1]).toBeLessThanOrEqual(10 + 1e-9);
          if (k > 0) expect(piece[k]![0]).toBeGreaterThanOrEqual(piece[k - 1]![0]);
        }
      }
    }));
  });
});

describe('segmentsOf', () => {
  it('breaks at undefined values and between two samples that straddle a break', () => {
    const xs = [0, 1, 2, 3, 4, 5];
    const v = [1, 2, null, 4, 5, 6];
    expect(segmentsOf(xs, (i) => v[i]!, [4.5])).toEqual([[[0, 1], [1, 2]], [[3, 4], [4, 5]]]);
    expect(segmentsOf(xs, (i) => i, [])).toHaveLength(1);
  });
});

describe('axes', () => {
  it('ticks step by 1, 2, 2.5 or 5 × a power of ten and cover the range', () => {
    expect(niceTicks(0, 10, 5)).toEqual([0, 2, 4, 6, 8, 10]);
    expect(niceTicks(-150, 150, 5)).toEqual([-100, 0, 100]);
    expect(niceTicks(0.5e9, 6e9, 8)).toEqual([1e9, 2e9, 3e9, 4e9, 5e9, 6e9]);
    fc.assert(fc.property(fc.double({ min: -1e12, max: 1e12, noNaN: true }), fc.double({ min: 1e-9, max: 1e12, noNaN: true }), (lo, width) => {
      fc.pre(lo + width > lo);
      const t = niceTicks(lo, lo + width, 6);
      expect(t.length).toBeGreaterThanOrEqual(2);
      expect(t.length).toBeLessThanOrEqual(13);
      for (const x of t) {
        expect(x).toBeGreaterThanOrEqual(lo - width * 1e-6);
        expect(x).toBeLessThanOrEqual(lo + width * (1 + 1e-6));
      }
    }));
  });

  it('picks an engineering unit from the largest value', () => {
    expect(axisUnit('frequency', 6e9)).toEqual({ scale: 1e9, unit: 'GHz' });
    expect(axisUnit('frequency', 400e6)).toEqual({ scale: 1e6, unit: 'MHz' });
    expect(axisUnit('length', 0.05)).toEqual({ scale: 1e-3, unit: 'mm' });
    expect(axisUnit('length', 0.05, 'mil')).toEqual({ scale: 25.4e-6, unit: 'mil' });
    expect(axisUnit('inductance', 30e-9)).toEqual({ scale: 1e-9, unit: 'nH' });
    expect(axisUnit('capacitance', 2.7e-12)).toEqual({ scale: 1e-12, unit: 'pF' });
    expect(axisUnit('impedance', 300)).toEqual({ scale: 1, unit: 'Ω' });
  });
});

describe('escapeXml', () => {
  it('escapes the five XML specials and nothing else', () => {
    expect(escapeXml(`a<b>&"c"'d' Ω`)).toBe('a&lt;b&gt;&amp;&quot;c&quot;&apos;d&apos; Ω');
  });
});
