/**
 * Incremental evaluation: what is re-evaluated after an edit, and that the outcome always equals a
 * cold evaluation of the same text.
 */
import { describe, expect, it } from 'vitest';
import { evaluateSheet } from './evaluate.js';
import { example, fixture, observable } from './testUtil.js';
import type { SheetOptions, SheetResult } from './types.js';

const sheet = (...lines: string[]) => lines.join('\n');
const SENSOR = fixture('two-layer-node');

function edit(text: string, from: string, to: string): string {
  expect(text.split(from), `"${from}" occurs once`).toHaveLength(2);
  return text.replace(from, to);
}

/** Evaluates `next` incrementally after `previous` and checks it against a cold evaluation. */
function step(previous: SheetResult, next: string, options?: SheetOptions): SheetResult {
  const warm = evaluateSheet(next, previous, options);
  expect(observable(warm)).toEqual(observable(evaluateSheet(next, undefined, options)));
  return warm;
}

describe('what an edit re-evaluates (sensor-node: 2 lets, 1 substrate, 2 lines, 4 stubs)', () => {
  const cold = () => evaluateSheet(SENSOR);

  it('the same text again re-evaluates nothing', () => {
    expect(step(cold(), SENSOR).stats).toEqual({ evaluated: 0, reused: 9 });
  });

  it("editing one stub's value re-evaluates only that stub", () => {
    const r = step(cold(), edit(SENSOR, 'capacitance 0.9 pF', 'capacitance 1.0 pF'));
    expect(r.stats).toEqual({ evaluated: 1, reused: 8 });
    expect(r.entries.find((e) => e.name === 'tune')!.results['capacitance_f']).toBeCloseTo(1e-12, 20);
  });

  it('editing the substrate re-evaluates it, both lines and all four stubs, not the lets', () => {
    const r = step(cold(), edit(SENSOR, 'df 0.0022', 'df 0.004'));
    expect(r.stats).toEqual({ evaluated: 7, reused: 2 });
  });

  it('editing a line re-evaluates it and its stubs only', () => {
    const r = step(cold(), edit(SENSOR, 'width 0.4 mm', 'width 0.5 mm'));
    expect(r.stats).toEqual({ evaluated: 2, reused: 7 }); // thin and choke
  });

  it('editing a let re-evaluates what reads it', () => {
    const r = step(cold(), edit(SENSOR, 'let f0 = 2.45 GHz', 'let f0 = 2.4 GHz'));
    // f0, thin (at f0) and the four stubs; band, board and feed do not read f0
    expect(r.stats).toEqual({ evaluated: 6, reused: 3 });
  });

  it('inserting a blank line above everything re-evaluates nothing but shifts every range by one line', () => {
    const before = cold();
    const r = step(before, `\n${SENSOR}`);
    expect(r.stats).toEqual({ evaluated: 0, reused: 9 });
    const down = (x: unknown) => JSON.parse(JSON.stringify(x), (k, v: unknown) => (k === 'line' && typeof v === 'number' ? v + 1 : v)) as unknown;
    expect(r.entries).toEqual(down(before.entries));
    expect(r.diagnostics).toEqual(down(before.diagnostics));
    expect([...r.symbols.values()]).toEqual(down([...before.symbols.values()]));
  });

  it('shifting a sheet with warnings moves their related ranges too', () => {
    const tour = example('warnings-tour');
    const before = evaluateSheet(tour);
    const r = step(before, `# moved\n\n${tour}`);
    expect(r.stats.evaluated).toBe(0);
    const shifted = before.diagnostics.map((d) => ({
      ...d,
      range: { start: { ...d.range.start, line: d.range.start.line + 2 }, end: { ...d.range.end, line: d.range.end.line + 2 } },
      ...(d.related ? { related: d.related.map((x) => ({ ...x, range: { start: { ...x.range.start, line: x.range.start.line + 2 }, end: { ...x.range.end, line: x.range.end.line + 2 } } })) } : {}),
    }));
    expect(r.diagnostics).toEqual(shifted);
  });

  it('changing marginPct re-evaluates the stubs only', () => {
    const r = step(cold(), SENSOR, { marginPct: 20 });
    expect(r.stats).toEqual({ evaluated: 4, reused: 5 });
    // and back: the old stub outcomes are gone from the cache, so the stubs run again
    expect(step(r, SENSOR).stats).toEqual({ evaluated: 4, reused: 5 });
  });

  it('editing or adding a comment re-evaluates nothing', () => {
    const r = step(cold(), edit(SENSOR, '# width is synthesized', '# the width comes out of z0'));
    expect(r.stats).toEqual({ evaluated: 0, reused: 9 });
    expect(step(r, edit(SENSOR, 'width 0.4 mm, at f0', 'width 0.4 mm, at f0 # note')).stats.evaluated).toBe(0);
  });

  it('moving a declaration re-evaluates nothing', () => {
    const lines = SENSOR.split('\n');
    const i = lines.findIndex((l) => l.startsWith('stub lbias'));
    const moved = [lines[i]!, ...lines.slice(0, i), ...lines.slice(i + 1)].join('\n');
    expect(step(cold(), moved).stats).toEqual({ evaluated: 0, reused: 9 });
  });

  it('line endings do not matter: LF, CRLF and CR give the same results and ranges', () => {
    const lf = cold();
    for (const eol of ['\r\n', '\r']) {
      const text = SENSOR.split('\n').join(eol);
      expect(observable(evaluateSheet(text))).toEqual(observable(lf));
      expect(step(lf, text).stats).toEqual({ evaluated: 0, reused: 9 });
    }
  });
});

describe('incremental equals cold', () => {
  it('through a series of edits that break and repair the sheet', () => {
    const edits: [string, string][] = [
      ['height 0.8 mm ± 0.05 mm', 'height 0.8 GHz'], // unit error: lines and stubs fail
      ['height 0.8 GHz', 'height 0.8 mm ± 0.05 mm'], // repaired
      ['line thin:', 'line thinner:'], // choke now stands on an undeclared line
      ['stub choke: short on thin', 'stub choke: short on thinner'],
      ['let f0 = 2.45 GHz', 'let f0 = f1'], // unknown name, then a cycle
      ['let band = 2.40 GHz .. 2.50 GHz', 'let f1 = f0'],
      ['let f1 = f0', 'let f1 = 2.45 GHz'], // cycle broken
      ['stub tune: open on feed, capacitance 0.9 pF', 'stub tune: open on feed, capacitance 0.9 pF, band 2.4 GHz .. 2.5 GHz, band 1 GHz .. 2 GHz'],
    ];
    let text = SENSOR;
    let r = evaluateSheet(text);
    for (const [from, to] of edits) {
      text = edit(text, from, to);
      r = step(r, text);
    }
    expect(r.diagnostics.map((d) => d.code)).toEqual(expect.arrayContaining(['conflict']));
  });

  it('a let that becomes a cycle and back', () => {
    let r = evaluateSheet(sheet('let a = 1 mm', 'let b = a * 2', 'substrate s: dk 3, height b'));
    r = step(r, sheet('let a = b / 2', 'let b = a * 2', 'substrate s: dk 3, height b'));
    expect(r.diagnostics.map((d) => d.code)).toEqual(['cycle', 'cycle']);
    r = step(r, sheet('let a = 1 mm', 'let b = a * 2', 'substrate s: dk 3, height b'));
    expect(r.diagnostics).toEqual([]);
  });

  it('removing the first of two duplicates makes the second one count', () => {
    let r = evaluateSheet(sheet('let a = 1 mm', 'let a = 2 mm', 'substrate s: dk 3, height a'));
    expect(r.entries.find((e) => e.name === 's')!.results['height_m']).toBeCloseTo(1e-3, 15);
    r = step(r, sheet('', 'let a = 2 mm', 'substrate s: dk 3, height a'));
    expect(r.entries.find((e) => e.name === 's')!.results['height_m']).toBeCloseTo(2e-3, 15);
  });

  it('deleting a declaration that others read: they re-evaluate and report it', () => {
    let r = evaluateSheet(SENSOR);
    r = step(r, edit(SENSOR, 'substrate board:', 'substrate core:'));
    expect(r.diagnostics.filter((d) => d.code === 'unknown-name')).toHaveLength(2);
  });

  // Regression: a name read before it is evaluated (a line read by a let, a stub read by a line) was
  // tracked as "not declared" whether or not it was declared, so the cached outcome survived its
  // declaration and the incremental result differed from a cold one.
  it.each([
    ['a line declared after a let reads its name', 'let x = l * 2', sheet('let x = l * 2', 'line l: ideal, z0 50 ohm')],
    ['a stub declared after a line stands "on" it', 'line a: microstrip on s, width 1 mm', sheet('line a: microstrip on s, width 1 mm', 'stub s: open on a, length 1 mm, at 1 GHz')],
    ['a stub that becomes a line', sheet('let x = s', 'stub s: open on a, length 1 mm, at 1 GHz'), sheet('let x = s', 'line s: ideal, z0 50 ohm')],
    ['a line that becomes a substrate', sheet('line a: microstrip on s, width 1 mm', 'stub s: open on a, length 1 mm, at 1 GHz'), sheet('line a: microstrip on s, width 1 mm', 'substrate s: dk 3, height 1 mm')],
  ])('the kind of a name not evaluated yet is tracked: %s', (_label, before, after) => {
    // and back again
    step(step(evaluateSheet(before), after), before);
  });

  it('a previous result of an unrelated sheet is only a cache', () => {
    const other = evaluateSheet(example('warnings-tour'));
    const r = step(other, SENSOR);
    expect(r.stats.evaluated + r.stats.reused).toBe(9);
    expect(r.diagnostics).toEqual([]);
  });

  it('two different edits from the same previous result are both right', () => {
    const base = evaluateSheet(SENSOR);
    step(base, edit(SENSOR, 'length 21.8 mm', 'length 20 mm'));
    step(base, edit(SENSOR, 'inductance 1.5 nH', 'inductance 2.2 nH'));
  });
});
