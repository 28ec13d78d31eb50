/** `sweep` declarations: results, every located error, dependencies and incremental evaluation. */
import { describe, expect, it } from 'vitest';
import { defaultStubSpan, stubResonances } from '../plot/sweep.js';
import { evaluateSheet } from './evaluate.js';
import { entry, located, num, observable, only } from './testUtil.js';

// Invented example: a 2.45 GHz front end.
const BASE = [
  'let f0 = 2.45 GHz',
  'substrate board: dk 2.55, df 0.0022, height 0.8 mm, copper 1 oz',
  'line feed: microstrip on board, z0 50 ohm, at f0',
  'line bare: microstrip on board, width 1 mm',
  'stub tune: open on feed, capacitance 0.9 pF, at f0, band 2.4 GHz .. 2.5 GHz',
];
const sheet = (...more: string[]) => [...BASE, ...more].join('\n');

describe('sweep results', () => {
  it('a stub sweep over a range: points, range, reactance span and the engine\'s resonances in it', () => {
    const r = evaluateSheet(sheet('sweep wide: of tune, over 1 GHz .. 14 GHz, points 201'));
    expect(r.diagnostics).toEqual([]);
    const e = entry(r, 'wide');
    expect(e.kind).toBe('sweep');
    expect(e.results).toMatchObject({ target: 'tune', target_kind: 'stub', points: 201, from_hz: 1e9, to_hz: 14e9, reference_ohm: 50 });
    const model = r.models!.get('tune');
    if (model?.kind !== 'stub') throw new Error('tune has no stub model');
    const res = stubResonances(model.stub, 1e9, 14e9);
    expect(res.length).toBeGreaterThanOrEqual(2);
    expect(e.results.resonance_count).toBe(res.length);
    expect(e.results.resonance_lowest_hz).toBe(res[0]!.frequencyHz);
    expect(e.results.resonance_lowest_hz).toBe(num(r, 'tune', 'resonance_above_hz'));
    expect(num(r, 'wide', 'reactance_min_ohm')).toBeLessThan(0);
    expect(num(r, 'wide', 'reactance_max_ohm')).toBeGreaterThan(0);
    expect(e.details.join('\n')).toMatch(/resonances in the range: .*GHz \(series, λ\/4\)/);
  });

  it('without "over" a stub sweep takes the plot\'s default span, 401 points', () => {
    const r = evaluateSheet(sheet('sweep around: of tune'));
    const model = r.models!.get('tune');
    if (model?.kind !== 'stub') throw new Error('tune has no stub model');
    const span = defaultStubSpan(model.stub, 10);
    expect(entry(r, 'around').results).toMatchObject({ points: 401, from_hz: span.from, to_hz: span.to });
    expect(entry(r, 'around').details[0]).toContain('(default span)');
  });

  it('a line section: insertion and return loss over the range, with its own reference impedance', () => {
    const r = evaluateSheet(sheet('sweep sec: of feed, length 20 mm, over 0.1 GHz .. 10 GHz, points 11, ref 75 ohm'));
    expect(r.diagnostics).toEqual([]);
    expect(entry(r, 'sec').results).toMatchObject({ target: 'feed', target_kind: 'line', length_m: 0.02, reference_ohm: 75, points: 11 });
    expect(num(r, 'sec', 'insertion_loss_db_max')).toBeGreaterThan(0);
    expect(num(r, 'sec', 'return_loss_db_min')).toBeLessThan(20); // a 50 Ω line between 75 Ω ports is mismatched
    const matched = evaluateSheet(sheet('sweep sec: of feed, length 20 mm, over 0.1 GHz .. 10 GHz, points 11'));
    expect(num(matched, 'sec', 'return_loss_db_min')).toBeGreaterThan(30);
  });

  it('a line with "at" gives a line sweep its default range', () => {
    const r = evaluateSheet(sheet('sweep sec: of feed, length 20 mm'));
    expect(entry(r, 'sec').results).toMatchObject({ from_hz: 0.02 * 2.45e9, to_hz: 2 * 2.45e9 });
  });

  it('the sweep\'s name of its target is a reference (for rename and find references)', () => {
    const text = sheet('sweep wide: of tune');
    const r = evaluateSheet(text);
    const refs = r.symbols.get('tune')!.references;
    expect(refs).toContainEqual({ start: { line: 5, character: 15 }, end: { line: 5, character: 19 } });
  });
});

describe('sweep errors are located', () => {
  it.each([
    ['sweep s: of nope', 'unknown-name', 'nope', /no stub or line named nope/],
    ['sweep s: of f0', 'unknown-name', 'f0', /f0 is a let; a sweep is of a stub or a line/],
    ['sweep s: of board', 'unknown-name', 'board', /is a substrate/],
    ['sweep s: of feed', 'missing', 's', /add ", length …"/],
    ['sweep s: of bare, length 5 mm', 'missing', 's', /has no "at": give the sweep a range/],
    ['sweep s: of tune, length 3 mm', 'conflict', 'length', /uses the stub's own length/],
    ['sweep s: of tune, points 1', 'range', '1', /points is a whole number from 2 to 10001/],
    ['sweep s: of tune, points 2.5', 'range', '2.5', /whole number/],
    ['sweep s: of tune, over 6 GHz .. 1 GHz', 'range', '6 GHz .. 1 GHz', /swap the two ends/],
    ['sweep s: of tune, over 0 Hz .. 1 GHz', 'range', '0 Hz .. 1 GHz', /starts above 0 Hz/],
    ['sweep s: of tune, over 2 GHz', 'syntax', '2 GHz', /wants a range/],
    ['sweep s: of tune, ref -50 ohm', 'range', '-50 ohm', /reference impedance must be positive/],
    ['sweep s: of tune, bogus 1', 'syntax', 'bogus', /unknown key "bogus" for a sweep/],
    ['sweep s: of 2 GHz', 'syntax', '2 GHz', /of takes one name/],
    ['sweep s: over 1 GHz .. 2 GHz', 'missing', 's', /s needs of/],
    ['sweep s:', 'missing', ':', /sweep s needs "of STUB"/],
    ['sweep s: of tune, over 1 Hz .. 1e14 Hz', 'limit', '1 Hz .. 1e14 Hz', /more than 1000: narrow the range/],
    ['sweep s: of sec2\nsweep sec2: of tune', 'unknown-name', 'sec2', /sec2 is a sweep/],
  ])('%j → %s on %j', (line, code, slice, message) => {
    const d = only(sheet(line));
    expect(d.code).toBe(code);
    expect(d.slice).toBe(slice);
    expect(d.message).toMatch(message);
  });

  it('a range of lengths is a unit error on the range', () => {
    const all = located(sheet('sweep s: of tune, over 1 mm .. 2 mm'), evaluateSheet(sheet('sweep s: of tune, over 1 mm .. 2 mm')));
    expect(all.length).toBeGreaterThan(0);
    for (const d of all) expect([d.code, d.slice]).toEqual(['unit', '1 mm .. 2 mm']);
  });

  it('a sweep of a stub that failed is silent (the stub\'s own line carries the error)', () => {
    const text = [...BASE.slice(0, 4), 'stub bad: open on feed, length -3 mm, at f0', 'sweep s: of bad'].join('\n');
    expect(located(text, evaluateSheet(text)).map((d) => d.line)).toEqual([4]);
    expect(entry(evaluateSheet(text), 's').results).toEqual({});
  });
});

describe('sweeps and incremental evaluation', () => {
  const text = sheet('sweep wide: of tune, over 1 GHz .. 6 GHz, points 11', 'sweep sec: of feed, length 20 mm');

  it('an edit of the swept stub re-evaluates the stub and its sweep, and equals a cold evaluation', () => {
    const first = evaluateSheet(text);
    const next = text.replace('capacitance 0.9 pF', 'capacitance 1.2 pF');
    const warm = evaluateSheet(next, first);
    expect(warm.stats).toEqual({ evaluated: 2, reused: 5 });
    expect(observable(warm)).toEqual(observable(evaluateSheet(next)));
    expect(num(warm, 'wide', 'reactance_min_ohm')).not.toBe(num(first, 'wide', 'reactance_min_ohm'));
  });

  it('an edit of the line re-evaluates the stub on it and both sweeps', () => {
    const first = evaluateSheet(text);
    const warm = evaluateSheet(text.replace('z0 50 ohm', 'z0 45 ohm'), first);
    expect(warm.stats).toEqual({ evaluated: 4, reused: 3 });
    expect(warm.models!.get('wide')).toMatchObject({ kind: 'sweep' });
  });

  it('a change of margin re-evaluates stubs and sweeps only', () => {
    const first = evaluateSheet(text);
    const warm = evaluateSheet(text, first, { marginPct: 5 });
    expect(warm.stats).toEqual({ evaluated: 3, reused: 4 });
    expect(observable(warm)).toEqual(observable(evaluateSheet(text, undefined, { marginPct: 5 })));
  });
});
