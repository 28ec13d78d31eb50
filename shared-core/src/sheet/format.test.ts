import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { formatQuantity, MINUS, NO_VALUE, type QuantityKind } from './format.js';

const KINDS: QuantityKind[] = [
  'length', 'frequency', 'impedance', 'reactance', 'resistance', 'inductance', 'capacitance', 'angle', 'percent', 'ratio',
];

describe('formatQuantity', () => {
  it.each<[number, QuantityKind, string]>([
    [2.45e9, 'frequency', '2.45 GHz'],
    [2.412e9, 'frequency', '2.412 GHz'],
    [433.92e6, 'frequency', '433.9 MHz'],
    [32768, 'frequency', '32.77 kHz'],
    [50, 'impedance', '50 Ω'],
    [49.987, 'impedance', '50 Ω'],
    [120.4, 'impedance', '120 Ω'],
    [1500, 'impedance', '1.5 kΩ'],
    [0.125, 'resistance', '0.125 Ω'],
    [0.012, 'resistance', '12 mΩ'],
    [64.6, 'reactance', '+64.6 Ω'],
    [-12, 'reactance', `${MINUS}12 Ω`],
    [4.2e-9, 'inductance', '4.2 nH'],
    [0.35e-9, 'inductance', '0.35 nH'],
    [50e-12, 'inductance', '50 pH'],
    [1.2e-6, 'inductance', '1.2 µH'],
    [0.9e-12, 'capacitance', '0.9 pF'],
    [50e-15, 'capacitance', '50 fF'],
    [1.5e-12, 'capacitance', '1.5 pF'],
    [22e-9, 'capacitance', '22 nF'],
    [19.8e-3, 'length', '19.8 mm'],
    [2.1934e-3, 'length', '2.19 mm'],
    [0.15e-3, 'length', '0.15 mm'],
    [35e-6, 'length', '35 µm'],
    [1.25, 'length', '1.25 m'],
    [0.5e-9, 'length', '0.5 nm'],
    [Math.PI / 4, 'angle', '45°'],
    [-Math.PI / 2, 'angle', `${MINUS}90°`],
    [12.345, 'percent', '12.3 %'],
    [1.8734, 'ratio', '1.87'],
    [-0.5, 'ratio', `${MINUS}0.5`],
  ])('%d as %s → %s', (value, kind, expected) => {
    expect(formatQuantity(value, kind)).toBe(expected);
  });

  it('rounds before choosing the prefix (no "1000 Ω", no "0.1 mm" that is really 100 µm)', () => {
    expect(formatQuantity(999.96, 'impedance')).toBe('1 kΩ');
    expect(formatQuantity(0.99996e-9, 'inductance')).toBe('1 nH');
    expect(formatQuantity(0.099996e-3, 'length')).toBe('0.1 mm');
    expect(formatQuantity(999.96e6, 'frequency')).toBe('1 GHz');
  });

  it('prints zero in the base unit and never a negative zero', () => {
    expect(formatQuantity(0, 'impedance')).toBe('0 Ω');
    expect(formatQuantity(-0, 'reactance')).toBe('0 Ω');
    expect(formatQuantity(0, 'length')).toBe('0 mm');
    expect(formatQuantity(-0, 'ratio')).toBe('0');
    expect(formatQuantity(-0, 'angle')).toBe('0°');
    expect(formatQuantity(-0, 'percent')).toBe('0 %');
  });

  it('prints — for null and non-finite values', () => {
    for (const kind of KINDS) {
      for (const v of [null, Number.NaN, Infinity, -Infinity]) expect(formatQuantity(v, kind)).toBe(NO_VALUE);
    }
  });

  it('honours digits and the mil length unit', () => {
    expect(formatQuantity(2.45e9, 'frequency', { digits: 2 })).toBe('2.5 GHz');
    expect(formatQuantity(2.1934e-3, 'length', { digits: 5 })).toBe('2.1934 mm');
    expect(formatQuantity(19.8e-3, 'length', { lengthUnit: 'mil' })).toBe('780 mil');
    expect(formatQuantity(254e-6, 'length', { lengthUnit: 'mil' })).toBe('10 mil');
    expect(formatQuantity(1, 'ratio', { digits: 0 })).toBe('1');
    expect(formatQuantity(1.23456, 'ratio', { digits: 99 })).toBe('1.23456');
  });

  it('uses one minus sign convention everywhere (U+2212, never a hyphen)', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.constantFrom(...KINDS), (v, kind) => {
        const s = formatQuantity(v, kind);
        expect(s).not.toMatch(/(^|[^e])-/); // a hyphen only inside an exponent (1e-21)
        if (s.startsWith(MINUS)) expect(v).toBeLessThan(0);
        if (v > 0) expect(s.startsWith(MINUS)).toBe(false);
      }),
    );
  });

  it.each<[QuantityKind, number, number]>([
    ['capacitance', 1e-18, 999],
    ['inductance', 1e-12, 999],
    ['impedance', 1e-3, 999e9],
    ['length', 1e-9, 999],
    ['frequency', 1, 999e12],
  ])('keeps the %s mantissa within [0.1, 1000) from %d to %d', (kind, min, max) => {
    fc.assert(
      fc.property(fc.double({ min, max, noNaN: true }), (v) => {
        const mantissa = Number(formatQuantity(v, kind).split(' ')[0]);
        expect(mantissa).toBeGreaterThanOrEqual(0.1);
        expect(mantissa).toBeLessThan(1000);
      }),
    );
  });
});
