import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseCsv, renderCsv } from './csv.js';
import { parseTouchstone, renderTouchstone, TouchstoneError, type NetworkData } from './touchstone.js';

const finite = fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e3, max: 1e3 });
const complexArb = fc.record({ re: finite, im: finite });

const network = (ports: 1 | 2) =>
  fc.uniqueArray(fc.double({ min: 1, max: 1e12, noNaN: true }), { minLength: 1, maxLength: 20 }).chain((fs) =>
    fc.record({
      frequenciesHz: fc.constant([...fs].sort((a, b) => a - b)),
      s: fc.array(fc.array(complexArb, { minLength: ports === 1 ? 1 : 4, maxLength: ports === 1 ? 1 : 4 }), { minLength: fs.length, maxLength: fs.length }),
      referenceOhm: fc.double({ min: 1, max: 1000, noNaN: true }),
      comments: fc.array(fc.string({ maxLength: 30 }), { maxLength: 3 }),
    }).map((r): NetworkData => ({ ports, ...r })));

describe('Touchstone 1.1', () => {
  it('writes the option line and the version 1 two-port order (S11 S21 S12 S22)', () => {
    const text = renderTouchstone({
      ports: 2, referenceOhm: 50, frequenciesHz: [1e9], comments: ['a two-port'],
      s: [[{ re: 0.1, im: -0.2 }, { re: 0.9, im: 0 }, { re: 0.8, im: 0.01 }, { re: 0, im: 0 }]],
    });
    expect(text).toBe('! a two-port\n# Hz S RI R 50\n1000000000 0.1 -0.2 0.9 0 0.8 0.01 0 0\n');
  });

  it('reads back exactly what it writes, one- and two-port (property)', () => {
    for (const ports of [1, 2] as const) {
      fc.assert(fc.property(network(ports), (data) => {
        const back = parseTouchstone(renderTouchstone(data), ports);
        expect(back.frequenciesHz).toEqual(data.frequenciesHz);
        expect(back.referenceOhm).toBe(data.referenceOhm);
        expect(back.s.map((row) => row.map((z) => [z.re + 0, z.im + 0]))).toEqual(data.s.map((row) => row.map((z) => [z.re + 0, z.im + 0])));
        expect(back.comments).toEqual(data.comments.map((c) => c.replace(/[\r\n]+/g, ' ').trim()));
      }), { numRuns: 50 });
    }
  });

  it('reads MA and DB data in GHz with the default reference', () => {
    const ma = parseTouchstone('# GHz S MA\n1 0.5 90\n2 1 180 ! trailing comment\n', 1);
    expect(ma.frequenciesHz).toEqual([1e9, 2e9]);
    expect(ma.referenceOhm).toBe(50);
    expect(ma.s[0]![0]!.re).toBeCloseTo(0, 12);
    expect(ma.s[0]![0]!.im).toBeCloseTo(0.5, 12);
    expect(ma.s[1]![0]!.re).toBeCloseTo(-1, 12);
    const db = parseTouchstone('# MHz S DB R 75\n100 -6.020599913279624 0\n', 1);
    expect(db.referenceOhm).toBe(75);
    expect(db.s[0]![0]!.re).toBeCloseTo(0.5, 12);
  });

  it.each([
    ['# Hz Y RI R 50\n1 0 0\n', 1, /line 1: unsupported option "Y"/],
    ['1 0 0\n', 1, /no option line/],
    ['# Hz S RI R 50\n1 0\n', 1, /line 2: a 1-port row has 3 numbers, found 2/],
    ['# Hz S RI R 50\n2 0 0\n1 0 0\n', 1, /line 3: frequencies must increase/],
    ['# Hz S RI R 50\n1 0 x\n', 1, /line 2: not a number/],
    ['# Hz S RI R 50\n# Hz S RI R 50\n', 1, /line 2: a second option line/],
    ['# Hz S RI R 50\n1 0 0\n', 2, /a 2-port row has 9 numbers/],
    ['# Hz S RI R -5\n', 1, /positive reference/],
  ] as const)('refuses %j with a located message', (text, ports, message) => {
    expect(() => parseTouchstone(text, ports)).toThrow(TouchstoneError);
    expect(() => parseTouchstone(text, ports)).toThrow(message);
  });

  it('refuses to write what is not Touchstone: non-finite numbers, frequencies out of order, wrong row sizes', () => {
    const base: NetworkData = { ports: 1, referenceOhm: 50, frequenciesHz: [1, 2], s: [[{ re: 0, im: 0 }], [{ re: 0, im: 0 }]], comments: [] };
    expect(() => renderTouchstone({ ...base, s: [[{ re: Number.NaN, im: 0 }], [{ re: 0, im: 0 }]] })).toThrow(RangeError);
    expect(() => renderTouchstone({ ...base, frequenciesHz: [2, 1] })).toThrow(/increase/);
    expect(() => renderTouchstone({ ...base, ports: 2 })).toThrow(/2-port row/);
  });
});

describe('CSV (RFC 4180)', () => {
  it('writes a header, CRLF line ends, empty fields for undefined values, and reads back exactly (property)', () => {
    fc.assert(fc.property(fc.array(fc.tuple(finite, fc.option(finite), fc.string({ maxLength: 8 })), { maxLength: 20 }), (rows) => {
      const text = renderCsv(['a', 'b', 'c'], rows);
      expect(text.endsWith('\r\n')).toBe(true);
      const back = parseCsv(text);
      expect(back[0]).toEqual(['a', 'b', 'c']);
      expect(back.slice(1)).toEqual(rows.map(([a, b, c]) => [String(a + 0), b === null ? '' : String(b + 0), c]));
    }));
  });

  it('refuses rows of the wrong length', () => {
    expect(() => renderCsv(['a', 'b'], [[1]])).toThrow(/row 1 has 1 fields/);
  });
});
