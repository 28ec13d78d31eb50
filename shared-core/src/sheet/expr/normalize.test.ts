import { describe, expect, it } from 'vitest';
import { toSI } from './dimension.js';
import { createSafeMath } from './mathInstance.js';
import { normalizeSpelling, toOriginal } from './normalize.js';
import { compiled, refused, valueOf } from './testUtil.js';

const math = createSafeMath();
const norm = (text: string) => normalizeSpelling(text, math.isUnitName).text;

describe('engineer spellings', () => {
  it.each([
    ['50 Ω', '50 ohm'],
    ['50 \u2126', '50 ohm'],
    ['2 kΩ', '2 kohm'],
    ['1 MΩ', '1 Mohm'],
    ['35 \u00b5m', '35 um'],
    ['35 \u03bcm', '35 um'],
    ['4.7 \u00b5H', '4.7 uH'],
    ['10 \u03bcs', '10 us'],
    ['90°', '90 deg'],
    ['20°C', '20 degC'],
    ['2×3', '2*3'],
    ['6÷3', '6/3'],
    ['5 − 2', '5 - 2'],
    ['2 mm²', '2 mm^2'],
    ['1 Ω·m', '1 ohm*m'],
    ['2.45\u00a0GHz', '2.45 GHz'],
    ['\u03bcr', '\u03bcr'], // Greek mu in a name that is not a unit stays as written
    ['3 Ωx', '3 Ωx'],
    ['2.45 GHz', '2.45 GHz'],
  ])('%j → %j', (input, output) => {
    expect(norm(input)).toBe(output);
  });

  it('leaves ASCII text untouched without a map', () => {
    expect(normalizeSpelling('2*f0 + 3 mm', math.isUnitName).map).toBeNull();
  });

  it('maps ranges of expanded text back to the original', () => {
    const n = normalizeSpelling('90° + 1 kΩ', math.isUnitName);
    expect(n.text).toBe('90 deg + 1 kohm');
    expect(toOriginal(n.map, 3, 6)).toEqual({ start: 2, end: 3 }); // deg → °
    expect(toOriginal(n.map, 11, 15)).toEqual({ start: 8, end: 10 }); // kohm → kΩ
    expect(toOriginal(n.map, 15, 15)).toEqual({ start: 10, end: 10 }); // end of text
  });
});

describe('spellings through compileExpression', () => {
  it('evaluates mapped units', () => {
    expect(toSI(valueOf('35 µm', math), 'length')).toBeCloseTo(35e-6, 12);
    expect(toSI(valueOf('2 kΩ', math), 'impedance')).toBeCloseTo(2000, 9);
    expect(toSI(valueOf('90°', math), 'angle')).toBeCloseTo(Math.PI / 2, 12);
    expect(toSI(valueOf('−0.5 μH', math), 'inductance')).toBeCloseTo(-0.5e-6, 15);
  });

  it('reports names and errors at the original spelling', () => {
    expect(compiled('1 kΩ + 2 Ω', math).names.map((n) => [n.name, n.start, n.end])).toEqual([
      ['kohm', 2, 4],
      ['ohm', 9, 10],
    ]);
    const text = '3 Ωx';
    const r = compiled(text, math).evaluate(new Map());
    expect(!r.ok && [r.error.code, text.slice(r.error.start, r.error.end)]).toEqual(['unknown-name', 'Ωx']);
    expect(refused('90° + @', math).slice).toBe('@');
    expect(refused('2 kΩ = 1', math).slice).toBe('=');
    expect(refused('3 µx', math)).toMatchObject({ code: 'syntax', start: 2, end: 4 });
  });

  it('keeps a Greek-mu sheet name as written', () => {
    const c = compiled('2 * μr', math);
    expect(c.names).toEqual([{ name: 'μr', start: 4, end: 6, fallback: 'none' }]);
    expect(valueOf('2 * μr', math, new Map([['μr', 3]]))).toBe(6);
  });
});
