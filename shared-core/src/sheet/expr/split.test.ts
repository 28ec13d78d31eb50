import { describe, expect, it } from 'vitest';
import { splitRange, splitTolerance } from './split.js';

describe('splitTolerance', () => {
  it('splits at ± with exact offsets', () => {
    expect(splitTolerance('2.55 ± 0.04')).toEqual({
      nominal: { text: '2.55', start: 0, end: 4 },
      tolerance: { text: '0.04', start: 7, end: 11, percent: false },
    });
  });

  it('accepts +/- and a percent tolerance', () => {
    expect(splitTolerance(' 50 ohm +/- 5 % ')).toEqual({
      nominal: { text: '50 ohm', start: 1, end: 7 },
      tolerance: { text: '5', start: 12, end: 13, percent: true },
    });
  });

  it('ignores markers inside parentheses and returns the whole text without one', () => {
    expect(splitTolerance('(2 ± 1) mm')).toEqual({ nominal: { text: '(2 ± 1) mm', start: 0, end: 10 }, tolerance: null });
    expect(splitTolerance('2 + -3')).toMatchObject({ tolerance: null });
  });

  it('gives an empty span for a missing side', () => {
    expect(splitTolerance('2.55 ±')).toEqual({
      nominal: { text: '2.55', start: 0, end: 4 },
      tolerance: { text: '', start: 6, end: 6, percent: false },
    });
  });
});

describe('splitRange', () => {
  it('splits A .. B with exact offsets', () => {
    expect(splitRange('2.40 GHz .. 2.50 GHz')).toEqual({
      low: { text: '2.40 GHz', start: 0, end: 8 },
      high: { text: '2.50 GHz', start: 12, end: 20 },
    });
  });

  it('splits decimals written tight and the ellipsis character', () => {
    expect(splitRange('2.4..2.5 GHz')).toEqual({ low: { text: '2.4', start: 0, end: 3 }, high: { text: '2.5 GHz', start: 5, end: 12 } });
    expect(splitRange('1 … 2')).toMatchObject({ low: { text: '1' }, high: { text: '2', start: 4 } });
  });

  it('respects parentheses and returns null without a marker', () => {
    expect(splitRange('(a..b) .. c')).toMatchObject({ low: { text: '(a..b)' }, high: { text: 'c', start: 10 } });
    expect(splitRange('2.45 GHz')).toBeNull();
  });
});
