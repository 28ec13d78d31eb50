import { describe, expect, it } from 'vitest';
import { expectKind, quantityKind, toSI, type QuantityKind } from './dimension.js';
import { formatNumber, formatValue } from './format.js';
import { createSafeMath } from './mathInstance.js';
import { compiled, valueOf } from './testUtil.js';

const math = createSafeMath();

describe('quantityKind', () => {
  it.each<[string, QuantityKind]>([
    ['1 mm', 'length'], ['10 mil', 'length'], ['1 inch', 'length'],
    ['2.45 GHz', 'frequency'], ['1 / (1 ns)', 'frequency'],
    ['1 / 1 ns', 'other'], // mathjs: implicit multiplication binds tighter, so this is (1/1) ns
    ['50 ohm', 'impedance'], ['1 V / 1 A', 'impedance'],
    ['3 nH', 'inductance'], ['0.9 pF', 'capacitance'],
    ['90 deg', 'angle'], ['1 rad', 'angle'],
    ['2.55', 'dimensionless'], ['2 mm / 1 mm', 'dimensionless'],
    ['5.8e7 S/m', 'conductivity'],
    ['2 h', 'other'], ['1 L', 'other'], ['pi/2 rad', 'other'], ['20 degC', 'other'],
  ])('%s is %s', (text, kind) => {
    expect(quantityKind(valueOf(text, math))).toBe(kind);
  });
});

describe('toSI', () => {
  it('converts to SI numbers', () => {
    expect(toSI(valueOf('90 deg', math), 'angle')).toBeCloseTo(Math.PI / 2, 15);
    expect(toSI(valueOf('35 um', math), 'length')).toBeCloseTo(35e-6, 15);
    expect(toSI(valueOf('5 cm / 1 m', math), 'dimensionless')).toBeCloseTo(0.05, 15);
    expect(toSI(valueOf('1 kohm', math), 'impedance')).toBeCloseTo(1000, 9);
    expect(toSI(valueOf('2 mm to mil', math), 'length')).toBeCloseTo(2e-3, 15);
    expect(toSI(valueOf('2.45 GHz', math), 'length')).toBeUndefined();
    expect(toSI(valueOf('mm', math), 'length')).toBeUndefined(); // bare unit
  });
});

describe('expectKind', () => {
  it('returns the SI number for the right kind', () => {
    expect(expectKind(valueOf('0.8 mm', math), 'length', 'height')).toEqual({ ok: true, si: 0.0008 });
    expect(expectKind(2.55, 'dimensionless', 'dk')).toEqual({ ok: true, si: 2.55 });
  });

  it('names the key, the wanted kind and the value with 4 significant digits', () => {
    expect(expectKind(valueOf('2.4 GHz', math), 'length', 'height')).toEqual({
      ok: false, message: 'height wants a length, got 2.4 GHz (a frequency)',
    });
    expect(expectKind(valueOf('0.3 mm * 1.05', math), 'frequency', 'f0')).toEqual({
      ok: false, message: 'f0 wants a frequency, got 0.315 mm (a length)',
    });
    expect(expectKind(valueOf('3 mm', math), 'dimensionless', 'dk')).toMatchObject({ ok: false, message: 'dk wants a plain number, got 3 mm (a length)' });
    expect(expectKind(1.5, 'angle', 'phase')).toMatchObject({ message: expect.stringContaining('add deg or rad') });
    expect(expectKind(valueOf('mm', math), 'length', 'height')).toMatchObject({ message: expect.stringContaining('bare unit mm') });
  });

  it('says when an undefined single letter was read as a unit', () => {
    const r = compiled('2*h', math).evaluate(new Map());
    if (!r.ok) throw new Error(r.error.message);
    const check = expectKind(r.value, 'length', 'height', r.letterUnits);
    expect(check).toEqual({
      ok: false,
      message: 'height wants a length, got 2 h; "h" was read as the unit hour because the sheet defines no h',
    });
  });
});

describe('formatting', () => {
  it('formats with a precision', () => {
    expect(formatValue(valueOf('0.3 mm * 1.05', math))).toBe('0.315 mm');
    expect(formatNumber(0.1 + 0.2)).toBe('0.3');
    expect(formatNumber(2.45e9)).toBe('2.45e+9');
    expect(formatNumber(-1e-12)).toBe('-1e-12');
    expect(formatNumber(100)).toBe('100');
    expect(formatNumber(0)).toBe('0');
    expect(formatNumber(Math.PI, 6)).toBe('3.14159');
    expect(formatNumber(Number.NaN)).toBe('NaN');
  });
});

describe('dimension table matches mathjs', () => {
  it.each<[QuantityKind, string]>([
    ['length', 'm'], ['frequency', 'Hz'], ['impedance', 'ohm'], ['inductance', 'H'],
    ['capacitance', 'F'], ['angle', 'rad'], ['conductivity', 'S/m'],
  ])('%s ↔ %s', (kind, unit) => {
    expect(quantityKind(math.unit(1, unit))).toBe(kind);
  });
});
