import fc from 'fast-check';
/**
 * Results of a sheet: the pinned JSON keys per entry kind, values checked against closed forms,
 * synthesis reproducing its target, scoping rules, tolerance corners, and the example sheets.
 */
import { describe, expect, it } from 'vitest';
import { c0 } from '../engine/constants.js';
import { evaluateSheet } from './evaluate.js';
import { entry, example, expectRangesInside, located, num, withCode } from './testUtil.js';

const sheet = (...lines: string[]) => lines.join('\n');
const IDEAL = 'line l: ideal, z0 50 ohm, dk 4, at 1 GHz';

const SUBSTRATE_KEYS = ['dk', 'df', 'height_m', 'copper_m'];
const LINE_KEYS = ['z0_ohm', 'eps_eff', 'width_m'];
const LINE_AT_KEYS = ['frequency_hz', 'eps_eff_at_f', 'z0_at_f_ohm', 'wavelength_m', 'loss_db_per_m'];
const STUB_KEYS = [
  'length_m', 'frequency_hz', 'electrical_deg', 'wavelength_fraction', 'reactance_ohm', 'resistance_ohm',
  'inductance_h', 'capacitance_f', 'behaviour', 'resonance_below_hz', 'resonance_above_hz', 'resonance_margin_pct',
];
const STUB_BAND_KEYS = ['band_min', 'band_max', 'band_spread_pct'];

describe('pinned JSON keys', () => {
  const r = evaluateSheet(example('sensor-node'));

  it('substrate: dk, df, height_m, copper_m', () => {
    const results = entry(r, 'board').results;
    for (const k of SUBSTRATE_KEYS) expect(typeof results[k], k).toBe('number');
    expect(results).toMatchObject({ dk: 2.55, df: 0.0022, height_m: 0.8e-3 });
  });

  it('line: z0_ohm, eps_eff, width_m; the frequency keys only with at', () => {
    const feed = entry(r, 'feed').results;
    for (const k of LINE_KEYS) expect(typeof feed[k], k).toBe('number');
    for (const k of LINE_AT_KEYS) expect(feed, k).not.toHaveProperty(k);
    const thin = entry(r, 'thin').results;
    for (const k of [...LINE_KEYS, ...LINE_AT_KEYS]) expect(typeof thin[k], k).toBe('number');
    expect(thin['frequency_hz']).toBe(2.45e9);
    expect(thin['width_m']).toBeCloseTo(0.4e-3, 15);
  });

  it('a line without a width (ideal, coax) has width_m null', () => {
    const s = evaluateSheet(sheet(IDEAL, 'line c: coax, inner 1 mm, outer 3.3 mm, dk 2.1'));
    expect(entry(s, 'l').results['width_m']).toBeNull();
    expect(entry(s, 'c').results['width_m']).toBeNull();
  });

  it('stub: every key present (null where not defined); the band keys only with band', () => {
    for (const name of ['choke', 'trap', 'tune', 'lbias']) {
      const results = entry(r, name).results;
      for (const k of STUB_KEYS) expect(results, `${name}.${k}`).toHaveProperty(k);
      expect(typeof results['behaviour']).toBe('string');
      expect(results['resonance_above_hz']).toBeGreaterThan(0);
    }
    for (const k of STUB_BAND_KEYS) {
      expect(entry(r, 'choke').results, k).not.toHaveProperty(k);
      expect(typeof entry(r, 'tune').results[k], k).toBe('number');
    }
    // a capacitive stub has no inductance and no resonance below its first one
    expect(entry(r, 'tune').results).toMatchObject({ behaviour: 'capacitive', inductance_h: null, resonance_below_hz: null });
    expect(entry(r, 'lbias').results).toMatchObject({ behaviour: 'inductive', capacitance_f: null });
  });

  it('results are JSON-safe: finite numbers, strings, flags or null, and they survive a JSON round trip', () => {
    for (const e of r.entries) {
      for (const [k, v] of Object.entries(e.results)) {
        expect(v === null || typeof v === 'string' || typeof v === 'boolean' || (typeof v === 'number' && Number.isFinite(v)), `${e.name}.${k}`).toBe(true);
      }
    }
    expect(JSON.parse(JSON.stringify(r.entries.map((e) => e.results)))).toEqual(r.entries.map((e) => e.results));
  });

  it('a let shows its value; an entry that cannot be evaluated has empty results', () => {
    expect(entry(r, 'f0').results).toMatchObject({ value: '2.45 GHz' });
    expect(entry(r, 'band').results).toMatchObject({ value: '2.4 GHz .. 2.5 GHz' });
    const bad = evaluateSheet('substrate b: dk 3');
    expect(entry(bad, 'b').results).toEqual({});
  });
});

describe('values against closed forms (lossless TEM line, εeff = 4)', () => {
  // Short-circuited lossless line: Zin = j Z0 tan(βl); open: Zin = −j Z0 cot(βl), β = 2π f √εeff / c0.
  // Textbook transmission-line results (Pozar, Microwave Engineering, 4th ed., §2.3 "the terminated
  // lossless transmission line"; from memory, equation numbers not confirmed).
  const f = 1e9;
  const beta = (2 * Math.PI * f * 2) / c0;

  it('the line at f: λg = c0 / (f √εeff), no loss without df', () => {
    const r = evaluateSheet(IDEAL);
    expect(entry(r, 'l').results).toMatchObject({ z0_ohm: 50, eps_eff: 4, width_m: null, frequency_hz: f, eps_eff_at_f: 4, z0_at_f_ohm: 50, loss_db_per_m: 0 });
    expect(num(r, 'l', 'wavelength_m')).toBeCloseTo(c0 / (f * 2), 12);
  });

  it('a short stub: θ, X = Z0 tan θ, L = X / ω, λ/4 resonance at c0 / (4 l √εeff)', () => {
    const l = 0.01;
    const r = evaluateSheet(sheet(IDEAL, 'stub s: short on l, length 10 mm, at 1 GHz'));
    const theta = beta * l;
    const x = 50 * Math.tan(theta);
    expect(num(r, 's', 'length_m')).toBeCloseTo(l, 15);
    expect(num(r, 's', 'frequency_hz')).toBe(f);
    expect(num(r, 's', 'electrical_deg')).toBeCloseTo((theta * 180) / Math.PI, 9);
    expect(num(r, 's', 'wavelength_fraction')).toBeCloseTo(theta / (2 * Math.PI), 12);
    expect(num(r, 's', 'reactance_ohm') / x - 1).toBeCloseTo(0, 9);
    expect(num(r, 's', 'resistance_ohm')).toBeCloseTo(0, 9);
    expect(num(r, 's', 'inductance_h') / (x / (2 * Math.PI * f)) - 1).toBeCloseTo(0, 9);
    expect(entry(r, 's').results).toMatchObject({ capacitance_f: null, behaviour: 'inductive', resonance_below_hz: null });
    const fr = c0 / (4 * l * 2);
    expect(num(r, 's', 'resonance_above_hz') / fr - 1).toBeCloseTo(0, 9);
    expect(num(r, 's', 'resonance_margin_pct')).toBeCloseTo(((fr - f) / f) * 100, 6);
  });

  it('an open stub: X = −Z0 cot θ, C = −1 / (ω X)', () => {
    const l = 0.01;
    const r = evaluateSheet(sheet(IDEAL, 'stub s: open on l, length 10 mm, at 1 GHz'));
    const x = -50 / Math.tan(beta * l);
    expect(num(r, 's', 'reactance_ohm') / x - 1).toBeCloseTo(0, 9);
    expect(num(r, 's', 'capacitance_f') / (-1 / (2 * Math.PI * f * x)) - 1).toBeCloseTo(0, 9);
    expect(entry(r, 's').results['behaviour']).toBe('capacitive');
  });

  it('band keys: L at the band edges and centre brackets, spread = (max − min) / centre', () => {
    const r = evaluateSheet(sheet(IDEAL, 'stub s: short on l, length 10 mm, at 1 GHz, band 0.9 GHz .. 1.1 GHz'));
    const lOf = (fx: number) => (50 * Math.tan((2 * Math.PI * fx * 2 * 0.01) / c0)) / (2 * Math.PI * fx);
    const values = [0.9e9, 1e9, 1.1e9].map(lOf);
    expect(num(r, 's', 'band_min') / Math.min(...values) - 1).toBeCloseTo(0, 9);
    expect(num(r, 's', 'band_max') / Math.max(...values) - 1).toBeCloseTo(0, 9);
    expect(num(r, 's', 'band_spread_pct')).toBeCloseTo(((Math.max(...values) - Math.min(...values)) / values[1]!) * 100, 6);
  });
});

describe('synthesis reproduces its target', () => {
  const s = evaluateSheet(example('sensor-node'));

  it('capacitance 0.9 pF → capacitance_f = 0.9 pF to 1e-9 relative', () => {
    expect(Math.abs(num(s, 'tune', 'capacitance_f') / 0.9e-12 - 1)).toBeLessThan(1e-9);
    expect(entry(s, 'tune').synthesized.map((x) => x.key)).toEqual(['length']);
    expect(entry(s, 'tune').synthesized[0]!.valueSI).toBe(num(s, 'tune', 'length_m'));
  });

  it('inductance 1.5 nH → inductance_h = 1.5 nH to 1e-9 relative', () => {
    expect(Math.abs(num(s, 'lbias', 'inductance_h') / 1.5e-9 - 1)).toBeLessThan(1e-9);
  });

  it('angle 90° at 2·f0 → electrical_deg = 90, a quarter wave', () => {
    expect(num(s, 'trap', 'electrical_deg')).toBeCloseTo(90, 9);
    expect(num(s, 'trap', 'wavelength_fraction')).toBeCloseTo(0.25, 12);
    expect(num(s, 'trap', 'frequency_hz')).toBe(4.9e9);
  });

  it('reactance +30 Ω, and the second solution is half a wave longer', () => {
    const r = evaluateSheet(sheet(IDEAL, 'stub a: short on l, reactance 30 ohm, at 1 GHz', 'stub b: short on l, reactance 30 ohm, at 1 GHz, solution 2'));
    expect(Math.abs(num(r, 'a', 'reactance_ohm') / 30 - 1)).toBeLessThan(1e-9);
    expect(Math.abs(num(r, 'b', 'reactance_ohm') / 30 - 1)).toBeLessThan(1e-9);
    expect(num(r, 'b', 'length_m') - num(r, 'a', 'length_m')).toBeCloseTo(c0 / (1e9 * 2) / 2, 12);
  });

  it('a microstrip z0 50 Ω synthesizes a width whose analysis gives 50 Ω', () => {
    expect(Math.abs(num(s, 'feed', 'z0_ohm') / 50 - 1)).toBeLessThan(1e-6);
    const feed = entry(s, 'feed');
    const text = example('sensor-node');
    const line = text.split('\n').findIndex((l) => l.startsWith('line feed'));
    const start = text.split('\n')[line]!.indexOf('z0 50 Ω');
    // the range is the z0 item the width answers
    expect(feed.synthesized).toEqual([{ key: 'width', valueSI: feed.results['width_m'], range: { start: { line, character: start }, end: { line, character: start + 7 } } }]);
    // the synthesized width, given back as a width, gives the same line
    const w = feed.results['width_m'] as number;
    const again = evaluateSheet(sheet('substrate board: dk 2.55, df 0.0022, height 0.8 mm, copper 1 oz', `line w: microstrip on board, width ${w} m`));
    expect(Math.abs(num(again, 'w', 'z0_ohm') / 50 - 1)).toBeLessThan(1e-6);
  });
});

describe('copper weight', () => {
  it('copper 1 oz ≈ 34.06 µm: 1 oz (28.3495 g) of copper over 1 ft² (0.09290304 m²) at 8.96 g/cm³ (common practice, no source)', () => {
    // 28.3495 g / (929.0304 cm² · 8.96 g/cm³) = 3.4057e-3 cm. (The figure 34.8 µm = 1.37 mil that is
    // often quoted does not follow from this density.)
    const r = evaluateSheet('substrate b: dk 3, height 1 mm, copper 1 oz');
    const expected = 0.0283495 / (0.09290304 * 8960);
    expect(num(r, 'b', 'copper_m')).toBeCloseTo(expected, 15);
    expect(num(r, 'b', 'copper_m') * 1e6).toBeCloseTo(34.06, 2);
  });

  it('scales with the weight and takes a plain thickness too', () => {
    const r = evaluateSheet(sheet('substrate a: dk 3, height 1 mm, copper 2 oz', 'substrate b: dk 3, height 1 mm, copper 0.5 oz', 'substrate c: dk 3, height 1 mm, copper 18 µm', 'substrate d: dk 3, height 1 mm'));
    expect(num(r, 'a', 'copper_m') / num(r, 'b', 'copper_m')).toBeCloseTo(4, 12);
    expect(num(r, 'c', 'copper_m')).toBeCloseTo(18e-6, 15);
    expect(num(r, 'd', 'copper_m')).toBe(0);
  });

  it('a weight that is not a plain number is a located unit error', () => {
    const [d] = withCode('substrate b: dk 3, height 1 mm, copper 1 mm oz', 'unit');
    expect(d).toMatchObject({ line: 0, start: 39, end: 43, slice: '1 mm' });
  });
});

describe('scope', () => {
  it('names used above their declaration work, for lets, substrates and lines alike', () => {
    const text = sheet(
      'stub s: short on l, length len, at f0',
      'line l: microstrip on board, width w, at f0',
      'substrate board: dk dk0, height h0',
      'let len = 2 * w',
      'let w = h0 * 2',
      'let h0 = 0.8 mm',
      'let dk0 = 3.0',
      'let f0 = 2 GHz',
    );
    const r = evaluateSheet(text);
    expect(r.diagnostics).toEqual([]);
    expect(num(r, 's', 'length_m')).toBeCloseTo(3.2e-3, 15);
    expect(num(r, 'l', 'width_m')).toBeCloseTo(1.6e-3, 15);
    expect(num(r, 'board', 'dk')).toBe(3);
    // entries come back in text order
    expect(r.entries.map((e) => e.name)).toEqual(['s', 'l', 'board', 'len', 'w', 'h0', 'dk0', 'f0']);
  });

  it('a let that shadows a unit letter (h = hour) resolves to the sheet value', () => {
    const r = evaluateSheet(sheet('let h = 2 mm', 'substrate b: dk 3, height h'));
    expect(r.diagnostics).toEqual([]);
    expect(num(r, 'b', 'height_m')).toBeCloseTo(2e-3, 15);
    // also inside an expression, and declared below its use
    const below = evaluateSheet(sheet('substrate b: dk 3, height 2 * h', 'let h = 0.5 mm'));
    expect(below.diagnostics).toEqual([]);
    expect(num(below, 'b', 'height_m')).toBeCloseTo(1e-3, 15);
  });

  it('a let that shadows a unit name (mm) wins inside expressions', () => {
    const r = evaluateSheet(sheet('let mm = 2', 'let x = 3 * mm'));
    expect(r.diagnostics).toEqual([]);
    expect(entry(r, 'x').results['value']).toBe('6');
  });

  it('symbols: declarations and references with exact ranges', () => {
    const text = sheet('let f0 = 2 GHz', 'line l: ideal, z0 50 ohm, at f0', 'stub s: open on l, length 5 mm, at f0 * 2');
    const r = evaluateSheet(text);
    const f0 = r.symbols.get('f0')!;
    expect(f0.kind).toBe('let');
    expect(f0.declaration).toEqual({ start: { line: 0, character: 4 }, end: { line: 0, character: 6 } });
    expect(f0.references).toEqual([
      { start: { line: 1, character: 29 }, end: { line: 1, character: 31 } },
      { start: { line: 2, character: 35 }, end: { line: 2, character: 37 } },
    ]);
    expect(r.symbols.get('l')!.references).toEqual([{ start: { line: 2, character: 16 }, end: { line: 2, character: 17 } }]);
  });

  it('a let holding a range or a tolerance is used whole by a key that takes it', () => {
    const text = sheet('let band = 0.9 GHz .. 1.1 GHz', 'let len = 10 mm ± 0.1 mm', IDEAL, 'stub s: short on l, length len, at 1 GHz, band band');
    const r = evaluateSheet(text);
    expect(r.diagnostics).toEqual([]);
    expect(typeof entry(r, 's').results['band_spread_pct']).toBe('number');
    expect(entry(r, 's').details.some((d) => d.startsWith('tolerance corners (3)'))).toBe(true);
  });
});

describe('tolerances widen the resonance checks', () => {
  // λ/4 resonance of a short stub on the εeff = 4 line: c0 / (8 · 33.8 mm) = 1.109 GHz, 10.9 % above
  // 1 GHz, just outside the default 10 % margin.
  const stub = (length: string) => `stub t: short on l, length ${length}, at 1 GHz`;

  it('nominally outside the margin: no warning', () => {
    const r = evaluateSheet(sheet(IDEAL, stub('33.8 mm')));
    expect(r.diagnostics).toEqual([]);
    expect(num(r, 't', 'resonance_margin_pct')).toBeGreaterThan(10);
    expect(num(r, 't', 'resonance_margin_pct')).toBeLessThan(11);
  });

  it('a length tolerance: the long corner (34.8 mm, 1.077 GHz) is inside the margin', () => {
    const [d, ...rest] = withCode(sheet(IDEAL, stub('33.8 mm ± 1 mm')), 'near-resonance');
    expect(rest).toEqual([]);
    expect(d).toMatchObject({ line: 1, start: 27, end: 41, slice: '33.8 mm ± 1 mm' });
    expect(d!.message).toMatch(/^t is 7\.7 % from its parallel resonance at 1\.077 GHz \(λ\/4\) at the worst tolerance corner/);
  });

  it('a percentage length tolerance works the same way', () => {
    expect(withCode(sheet(IDEAL, stub('33.8 mm ± 3 %')), 'near-resonance')).toHaveLength(1);
  });

  it('a dk tolerance on the line: εeff 4.4 at the corner gives 1.057 GHz', () => {
    const [d] = withCode(sheet('line l: ideal, z0 50 ohm, dk 4 ± 0.4', stub('33.8 mm')), 'near-resonance');
    expect(d!.message).toMatch(/5\.7 % from its parallel resonance at 1\.057 GHz .* at the worst tolerance corner/);
  });

  it('substrate tolerances reach a microstrip stub through its line', () => {
    const base = (dk: string) => sheet(`substrate b: dk ${dk}, height 0.8 mm`, 'line ms: microstrip on b, width 1.5 mm', 'stub t: short on ms, length LEN, at 2 GHz');
    // find a length whose nominal margin is 11 %: the λ/4 resonance at 2.22 GHz
    const probe = evaluateSheet(base('3').replace('LEN', '20 mm'));
    const len = (20e-3 * num(probe, 't', 'resonance_above_hz')) / 2.22e9;
    const nominal = evaluateSheet(base('3').replace('LEN', `${len} m`));
    expect(num(nominal, 't', 'resonance_margin_pct')).toBeCloseTo(11, 0);
    expect(withCode(base('3').replace('LEN', `${len} m`), 'near-resonance')).toEqual([]);
    expect(withCode(base('3 ± 0.3').replace('LEN', `${len} m`), 'near-resonance')).toHaveLength(1);
  });

  it('a resonant stub is detuned when any corner falls outside the margin', () => {
    // 36 mm: λ/4 at 1.041 GHz, 4.1 % away; with ± 3 mm the short corner (33 mm) is at 1.136 GHz, 13.6 %.
    expect(withCode(sheet(IDEAL, 'stub c: short on l, length 36 mm, at 1 GHz, resonant'), 'detuned')).toEqual([]);
    const [d, ...rest] = withCode(sheet(IDEAL, 'stub c: short on l, length 36 mm ± 3 mm, at 1 GHz, resonant'), 'detuned');
    expect(rest).toEqual([]);
    expect(d!.message).toMatch(/^c is marked resonant but its nearest resonance is 13\.6 % away at the worst tolerance corner \(parallel resonance at 1\.136 GHz/);
  });

  it('resonance-in-band looks at every corner', () => {
    // 36.5 mm: λ/4 at 1.027 GHz; band 0.80…0.85 GHz widened by 10 % ends at 0.935 GHz.
    const band = 'band 0.80 GHz .. 0.85 GHz, resonant';
    expect(withCode(sheet(IDEAL, `stub e: short on l, length 36.5 mm, at 1 GHz, ${band}`), 'resonance-in-band')).toEqual([]);
    expect(withCode(sheet(IDEAL, `stub e: short on l, length 36.5 mm ± 4 mm, at 1 GHz, ${band}`), 'resonance-in-band')).toHaveLength(1);
  });
});

describe('the example sheets', () => {
  it('sensor-node: no errors, no warnings, every declaration evaluated', () => {
    const text = example('sensor-node');
    const r = evaluateSheet(text);
    expect(located(text, r)).toEqual([]);
    expect(r.entries.map((e) => e.name)).toEqual(['f0', 'band', 'board', 'feed', 'thin', 'choke', 'trap', 'tune', 'lbias', 'port', 'esd', 'carrier', 'ref', 'h3trap']);
    for (const e of r.entries) expect(Object.keys(e.results).length, e.name).toBeGreaterThan(0);
    expect(r.stats).toEqual({ evaluated: 14, reused: 0 });
    // The demo shows the engine's breadth: line types, losses and Q, end and via effects, tolerances, power.
    expect(text).toMatch(/gcpw on board/);
    expect(text).toMatch(/stripline on carrier/);
    const results = (name: string) => r.entries.find((e) => e.name === name)!.results;
    for (const line of ['thin', 'port', 'ref']) expect(results(line).alpha_c_db_per_m as number, line).toBeGreaterThan(0);
    for (const stub of ['tune', 'lbias']) expect(results(stub).q as number, stub).toBeGreaterThan(10);
    for (const stub of ['choke', 'trap', 'esd', 'h3trap']) {
      expect(results(stub).resonator_q as number, stub).toBeGreaterThan(10);
      expect(results(stub).bandwidth_hz as number, stub).toBeGreaterThan(0);
    }
    expect(results('tune').end_extension_m as number).toBeGreaterThan(0);
    expect(results('esd').via_inductance_h as number).toBeGreaterThan(0);
    expect(results('choke').resonance_nearest_hz_min).toBeDefined();
  });

  it('warnings-tour: exactly model-validity, detuned, near-resonance and resonance-in-band, no errors', () => {
    const text = example('warnings-tour');
    const r = evaluateSheet(text);
    expectRangesInside(text, r);
    const ds = located(text, r);
    expect(ds.filter((d) => d.severity === 'error')).toEqual([]);
    expect(new Set(ds.map((d) => d.code))).toEqual(new Set(['model-validity', 'detuned', 'near-resonance', 'resonance-in-band']));
    expect(ds.every((d) => d.severity === 'warning')).toBe(true);
    // each where the comment above it says
    const lines = text.split('\n');
    const lineOf = (prefix: string) => lines.findIndex((l) => l.startsWith(prefix));
    expect(ds.filter((d) => d.code === 'model-validity').every((d) => d.line === lineOf('line hairline') && d.slice === 'microstrip')).toBe(true);
    expect(ds.find((d) => d.code === 'detuned')).toMatchObject({ line: lineOf('stub choke'), slice: '19.8 mm' });
    expect(ds.find((d) => d.code === 'near-resonance')).toMatchObject({ line: lineOf('stub lload'), slice: '20.5 mm' });
    expect(ds.find((d) => d.code === 'resonance-in-band')).toMatchObject({ line: lineOf('stub edge'), slice: 'band' });
  });
});

describe('tolerances and loss, as properties', () => {
  const sheetWith = (dkTol: number, df: number) => [
    `substrate b: dk 3.5 ± ${dkTol}, df ${df}, height 0.8 mm, copper 35 um`,
    'line l: microstrip on b, width 1.7 mm',
    'stub s: open on l, length 6 mm, at 2.45 GHz',
  ].join('\n');
  const stub = (text: string) => evaluateSheet(text).entries.find((e) => e.name === 's')!.results;

  it('a wider tolerance gives a wider range of C and of the nearest resonance', () => {
    fc.assert(fc.property(fc.double({ min: 0.01, max: 0.2, noNaN: true }), fc.double({ min: 1.2, max: 3, noNaN: true }), (tolA, factor) => {
      const narrow = stub(sheetWith(tolA, 0.002));
      const wide = stub(sheetWith(tolA * factor, 0.002));
      const spread = (r: typeof narrow, k: string) => (r[`${k}_max`] as number) - (r[`${k}_min`] as number);
      expect(spread(wide, 'capacitance_f')).toBeGreaterThan(spread(narrow, 'capacitance_f'));
      expect(spread(wide, 'resonance_nearest_hz')).toBeGreaterThan(spread(narrow, 'resonance_nearest_hz'));
    }), { numRuns: 15 });
  });

  it('more dielectric loss gives a lower stub Q', () => {
    fc.assert(fc.property(fc.double({ min: 0.0005, max: 0.01, noNaN: true }), fc.double({ min: 1.5, max: 5, noNaN: true }), (df, factor) => {
      expect(stub(sheetWith(0.05, df * factor)).q as number).toBeLessThan(stub(sheetWith(0.05, df)).q as number);
    }), { numRuns: 15 });
  });
});
