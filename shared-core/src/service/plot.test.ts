/** The service's plots, plot targets and exports, and how sweeps show in hovers, hints and completion. */
import { describe, expect, it } from 'vitest';
import { parseCsv } from '../plot/csv.js';
import { parseTouchstone } from '../plot/touchstone.js';
import { analyseEndedStub } from '../engine/index.js';
import { stubPointAt, type StubBuild } from '../sheet/eval/stubPoint.js';
import { example, lineOf, open } from './testUtil.js';

// Invented example: a 2.45 GHz front end.
const TEXT = [
  'let f0 = 2.45 GHz',
  'substrate board: dk 2.55, df 0.0022, height 0.8 mm, copper 1 oz',
  'line feed: microstrip on board, z0 50 ohm, at f0   # the main line',
  'line bare: microstrip on board, width 1 mm',
  'stub tune: open on feed, capacitance 0.9 pF, at f0, band 2.4 GHz .. 2.5 GHz',
  'stub broken: open on nowhere, length 3 mm, at f0',
  'sweep wide: of tune, over 1 GHz .. 6 GHz, points 11, ref 75 ohm',
  'sweep sec: of feed, length 20 mm, over 0.5 GHz .. 5 GHz, points 4',
].join('\n');

const { service, doc } = open(TEXT);

describe('getPlotTargets', () => {
  it('lists every evaluated stub, line and sweep with its declaration range; sweeps say what they sweep; a line with neither "at" nor stubs is left out', () => {
    expect(service.getPlotTargets(doc)).toEqual([
      { name: 'feed', kind: 'line', range: { start: { line: 2, character: 0 }, end: { line: 2, character: 48 } } },
      { name: 'tune', kind: 'stub', range: expect.objectContaining({ start: { line: 4, character: 0 } }) },
      { name: 'wide', kind: 'stub', sweepOf: 'tune', range: expect.objectContaining({ start: { line: 6, character: 0 } }) },
      { name: 'sec', kind: 'line', sweepOf: 'feed', range: expect.objectContaining({ start: { line: 7, character: 0 } }) },
    ]);
  });
});

describe('getPlot', () => {
  it('plots a stub over frequency by default, with its markers', () => {
    const p = service.getPlot(doc, 'tune');
    if ('error' in p) throw new Error(p.error);
    expect(p).toMatchObject({ name: 'tune', entryKind: 'stub', view: 'frequency', band: [2.4e9, 2.5e9] });
    expect(p.title).toMatch(/^tune: open stub on feed, 7\.\d+ mm: reactance vs frequency$/);
    expect(p.markers.filter((m) => m.kind === 'operating')).toEqual([{ kind: 'operating', x: 2.45e9, label: expect.stringContaining('0.9 pF') }]);
    expect(p.markers.some((m) => m.kind === 'resonance' && m.resonanceType === 'series')).toBe(true);
    expect(p.svg).toContain('data-view="frequency"');
  });

  it('a sweep is plotted over its own range unless asked otherwise; its length view is the stub\'s', () => {
    const p = service.getPlot(doc, 'wide');
    if ('error' in p) throw new Error(p.error);
    expect(p.svg).toContain('data-x-min="1000000000" data-x-max="6000000000"');
    const asked = service.getPlot(doc, 'wide', { fromHz: 2e9 });
    if ('error' in asked) throw new Error(asked.error);
    expect(asked.svg).toContain('data-x-min="2000000000" data-x-max="6000000000"');
    const length = service.getPlot(doc, 'wide', { view: 'length', fromM: 1e-3, toM: 30e-3, lengthUnit: 'mil' });
    if ('error' in length) throw new Error(length.error);
    expect(length).toMatchObject({ view: 'length', entryKind: 'stub' });
    expect(length.svg).toContain('data-x-min="0.001" data-x-max="0.03"');
    expect(length.svg).toContain('drawn length (mil)');
  });

  it('plots a line, and a line section', () => {
    expect(service.getPlot(doc, 'feed')).toMatchObject({ entryKind: 'line', title: 'feed: line over frequency' });
    expect(service.getPlot(doc, 'sec')).toMatchObject({ entryKind: 'line', title: 'sec: 20 mm of line feed as a two-port' });
  });

  it.each([
    ['nope', {}, /no stub, line or sweep named "nope"/],
    ['f0', {}, /f0 is a let: plots and exports are of stubs, lines and sweeps/],
    ['board', {}, /board is a substrate/],
    ['broken', {}, /broken \(line 6\) could not be evaluated/],
    ['bare', {}, /^bare has no "at", and no stub on it has one, to centre a span on: give the range \(from and to\)$/],
    ['feed', { view: 'length' }, /the length view is for stubs: feed is a line/],
    ['sec', { view: 'length' }, /the length view is for stubs/],
    ['tune', { fromHz: 3e9, toHz: 2e9 }, /the range must go from low to high: 3 GHz … 2 GHz/],
    ['tune', { fromHz: 7e9 }, /from low to high/],
    ['tune', { points: 1 }, /points must be a whole number from 2 to 10001, got 1/],
    ['tune', { points: 20000 }, /points must be a whole number/],
    ['tune', { fromHz: -1 }, /from must be a positive frequency/],
    ['tune', { view: 'length', toM: Number.NaN }, /to must be a positive length/],
  ] as const)('%s %j → { error }', (name, options, message) => {
    const p = service.getPlot(doc, name, options);
    expect('error' in p && p.error).toMatch(message);
  });

  it('a stub many wavelengths long: the plot is refused with advice, the export still works', () => {
    const long = open(`${TEXT}\nstub long: open on feed, length 5 m, at f0`);
    const p = long.service.getPlot(long.doc, 'long');
    expect('error' in p && p.error).toMatch(/^long: the range holds about \d+ resonances of the stub, more than 200: narrow it$/);
    const l = long.service.getPlot(long.doc, 'long', { view: 'length' });
    expect('error' in l && l.error).toMatch(/more than 200: narrow it/);
    expect(long.service.getPlot(long.doc, 'long', { fromHz: 2.44e9, toHz: 2.46e9 })).toMatchObject({ entryKind: 'stub' });
    expect(long.service.getExport(long.doc, 'long', 'csv', { points: 3 })).toMatchObject({ fileName: 'long.csv' });
  });

  it('the bare line plots once given a range', () => {
    expect(service.getPlot(doc, 'bare', { fromHz: 1e9, toHz: 2e9, points: 3 })).toMatchObject({ entryKind: 'line' });
  });
});

describe('getExport', () => {
  it('a stub: .s1p by default, .s2p in shunt, both stating the reference and what was swept', () => {
    const one = service.getExport(doc, 'tune', 'touchstone', { points: 5, source: 'front-end.rfsheet' });
    if ('error' in one) throw new Error(one.error);
    expect(one.fileName).toBe('tune.s1p');
    expect(one.text).toMatch(/^! Stubwright export of tune from front-end\.rfsheet\n! open stub on line feed, drawn length 7\.\d+ mm, at 2\.45 GHz\n! one-port/);
    expect(one.text).toMatch(/^# Hz S RI R 50$/m);
    expect(/[^\x00-\x7f]/.test(one.text)).toBe(false);
    expect(parseTouchstone(one.text, 1).frequenciesHz).toHaveLength(5);
    const two = service.getExport(doc, 'tune', 'touchstone', { ports: 2, fromHz: 1e9, toHz: 2e9, points: 3 });
    if ('error' in two) throw new Error(two.error);
    expect(two.fileName).toBe('tune.s2p');
    expect(parseTouchstone(two.text, 2).frequenciesHz).toEqual([1e9, 1.5e9, 2e9]);
  });

  it('a sweep uses its range, points and reference', () => {
    const r = service.getExport(doc, 'wide', 'touchstone');
    if ('error' in r) throw new Error(r.error);
    const net = parseTouchstone(r.text, 1);
    expect(net.referenceOhm).toBe(75);
    expect(net.frequenciesHz).toHaveLength(11);
    expect(net.frequenciesHz[0]).toBe(1e9);
    expect(net.frequenciesHz[10]).toBe(6e9);
    expect(r.text).toContain('(sweep of tune)');
  });

  it('CSV of a stub, a section and a line, with SI headers', () => {
    const stub = service.getExport(doc, 'wide', 'csv');
    if ('error' in stub) throw new Error(stub.error);
    expect(stub.fileName).toBe('wide.csv');
    const rows = parseCsv(stub.text);
    expect(rows[0]).toEqual(['frequency_hz', 'resistance_ohm', 'reactance_ohm', 'inductance_h', 'capacitance_f', 's11_re', 's11_im']);
    expect(rows).toHaveLength(12);
    const sec = service.getExport(doc, 'sec', 'csv');
    expect('text' in sec && parseCsv(sec.text)[0]).toEqual(['frequency_hz', 's11_re', 's11_im', 's21_re', 's21_im', 's12_re', 's12_im', 's22_re', 's22_im']);
    const line = service.getExport(doc, 'feed', 'csv', { points: 3 });
    expect('text' in line && parseCsv(line.text)[0]).toEqual(['frequency_hz', 'z0_ohm', 'eps_eff', 'alpha_db_per_m']);
  });

  it.each([
    ['feed', 'touchstone', {}, /a line needs a length to be a two-port: declare "sweep NAME: of feed, length …"/],
    ['sec', 'touchstone', { ports: 1 }, /sec is a line section, a two-port: export it as \.s2p/],
    ['tune', 'touchstone', { referenceOhm: 0 }, /reference impedance must be a positive number/],
    ['nope', 'csv', {}, /no stub, line or sweep named "nope"/],
    ['bare', 'csv', {}, /bare has no "at"/],
  ] as const)('%s as %s %j → { error }', (name, format, options, message) => {
    const r = service.getExport(doc, name, format, options);
    expect('error' in r && r.error).toMatch(message);
  });
});

describe('sweeps in the editor', () => {
  it('hover on a sweep: a short summary', () => {
    const h = service.getHover(doc, { line: 6, character: 3 });
    expect(h?.contents).toMatch(/\*\*wide\*\* · sweep/);
    expect(h?.contents).toMatch(/\| sweep of \| stub tune, 1 GHz … 6 GHz, 11 points \|/);
    expect(h?.contents).toMatch(/\| resonances in the range \| 1: 6\.\d+ GHz … 6\.\d+ GHz \||\| resonances in the range \| none \|/);
    const sec = service.getHover(doc, { line: 7, character: 3 });
    expect(sec?.contents).toMatch(/insertion loss, worst \| 0\.\d+ dB/);
  });

  it('hover on the sweep\'s target name inside "of" shows the stub', () => {
    expect(service.getHover(doc, { line: 6, character: 16 })?.contents).toMatch(/^\*\*tune\*\* \(stub\)/);
  });

  it('inlay hints and the outline include sweeps', () => {
    const hints = service.getInlayHints(doc).filter((h) => h.position.line >= 6).map((h) => h.label);
    expect(hints[0]).toMatch(/^1 GHz … 6 GHz, 11 pts · (no resonance|1 resonance)$/);
    expect(hints[1]).toMatch(/^500 MHz … 5 GHz, 4 pts · IL ≤ 0\.\d\d dB$/);
    expect(service.getSymbols(doc).filter((s) => s.kind === 'sweep').map((s) => s.name)).toEqual(['wide', 'sec']);
  });

  it('completion: the sweep keyword and snippet, its keys, and stubs and lines after "of"', () => {
    const at = (text: string) => open(text).service.getCompletions(open(text).doc, { line: text.split('\n').length - 1, character: text.split('\n').pop()!.length });
    expect(at('sw').map((c) => c.label)).toEqual(expect.arrayContaining(['sweep', 'sweep …']));
    expect(at(`${TEXT}\nsweep z: of tune, `).map((c) => c.label)).toEqual(['over', 'points', 'length', 'ref']);
    expect(at(`${TEXT}\nsweep z: of `).map((c) => c.label)).toEqual(['tune', 'broken', 'feed', 'bare']);
  });
});

describe('a line without "at": its span comes from the stubs built on it', () => {
  // Invented example: a feed line declared without "at", two stubs on it at different frequencies.
  const sheet = [
    'substrate board: dk 2.55, df 0.0022, height 0.8 mm, copper 1 oz',
    'line plain: microstrip on board, z0 50 ohm',
    'line lonely: microstrip on board, width 1 mm',
    'stub low: open on plain, capacitance 0.9 pF, at 2.45 GHz',
    'stub high: open on plain, angle 90 deg, at 5.8 GHz, resonant',
  ].join('\n');
  const it2 = open(sheet);

  it('is a plot target; a line with neither "at" nor stubs is not', () => {
    expect(it2.service.getPlotTargets(it2.doc).map((t) => `${t.kind} ${t.name}`)).toEqual(['line plain', 'stub low', 'stub high']);
  });

  it('plots Z0, εeff and loss over 0.02 × the lowest … 2 × the highest stub "at"', () => {
    const p = it2.service.getPlot(it2.doc, 'plain');
    if ('error' in p) throw new Error(p.error);
    expect(p).toMatchObject({ entryKind: 'line', title: 'plain: line over frequency' });
    expect(p.svg).toContain(`data-x-min="${0.02 * 2.45e9}" data-x-max="${2 * 5.8e9}"`);
    expect(p.svg).toMatch(/data-quantity="z0"[\s\S]*data-quantity="eps-eff"[\s\S]*data-quantity="loss"/);
    expect(p.markers).toEqual([]);
    // A range asked for still wins, one end at a time.
    const asked = it2.service.getPlot(it2.doc, 'plain', { toHz: 3e9 });
    expect('svg' in asked && asked.svg).toContain(`data-x-min="${0.02 * 2.45e9}" data-x-max="3000000000"`);
  });

  it('exports its CSV over the same span; the lonely line still needs a range', () => {
    const csv = it2.service.getExport(it2.doc, 'plain', 'csv', { points: 3 });
    if ('error' in csv) throw new Error(csv.error);
    expect(parseCsv(csv.text).slice(1).map((r) => Number(r[0]))).toEqual([0.02 * 2.45e9, (0.02 * 2.45e9 + 2 * 5.8e9) / 2, 2 * 5.8e9]);
    expect(it2.service.getPlot(it2.doc, 'lonely')).toEqual({ error: expect.stringMatching(/^lonely has no "at", and no stub on it has one/) });
    expect(it2.service.getPlot(it2.doc, 'lonely', { fromHz: 1e9, toHz: 2e9, points: 3 })).toMatchObject({ entryKind: 'line' });
  });

  it('the demo\'s feed (no "at"; trap, tune and lbias on it) plots, and every plot target of every example plots without an error', () => {
    const demo = open(example('sensor-node'));
    const feed = demo.service.getPlot(demo.doc, 'feed');
    if ('error' in feed) throw new Error(feed.error);
    expect(feed.svg).toContain(`data-x-min="${0.02 * 2.45e9}" data-x-max="${2 * 4.9e9}"`);
    for (const file of ['sensor-node', 'warnings-tour', 'power-check', 'trap-sweep']) {
      const ex = open(example(file));
      for (const t of ex.service.getPlotTargets(ex.doc)) expect(ex.service.getPlot(ex.doc, t.name), `${file} ${t.name}`).not.toHaveProperty('error');
    }
  });
});

describe('the operating-point label', () => {
  /** The demo with one stub's angle replaced by a drawn length (m). */
  const demoWith = (stubName: string, lengthM: number) => {
    const text = example('sensor-node');
    const line = text.split('\n').find((l) => l.startsWith(`stub ${stubName}:`))!;
    expect(line).toContain('angle 90°');
    return open(text.replace(line, line.replace('angle 90°', `length ${(lengthM * 1e3).toPrecision(17)} mm`)));
  };
  const buildOf = (d: ReturnType<typeof open>, name: string): StubBuild => {
    const m = d.doc.result.models!.get(name);
    if (m?.kind !== 'stub') throw new Error(`${name} is not an evaluated stub`);
    return m.stub;
  };
  /** R of the real-Z0 analysis and R of the R′L′G′C′ line (the one reported) at `at`, for a drawn length. */
  const twoRs = (b: StubBuild, lengthM: number) => {
    const a = analyseEndedStub(b.end, b.line.model, lengthM, b.frequencyHz);
    return { x: a.reactance, analysisR: a.resistance, reportedR: stubPointAt(b, b.frequencyHz, lengthM, a).resistance };
  };
  /** A drawn length, between `onResonance` and `detuned`, where |X| lies halfway between the two Rs (bisection). */
  const straddling = (b: StubBuild, onResonance: number, detuned: number) => {
    const g = (l: number) => {
      const t = twoRs(b, l);
      return Math.abs(t.x) - (t.analysisR + t.reportedR) / 2;
    };
    let [lo, hi] = [onResonance, detuned];
    expect(g(lo)).toBeLessThan(0);
    expect(g(hi)).toBeGreaterThan(0);
    for (let i = 0; i < 200; i++) {
      const mid = (lo + hi) / 2;
      if (g(mid) < 0) lo = mid;
      else hi = mid;
    }
    return (lo + hi) / 2;
  };

  it.each([
    ['trap', 'series resonance, open stub on a lossy microstrip'],
    ['esd', 'parallel resonance, short stub through a via on a lossy grounded CPW'],
  ])('%s (%s): says "resonant" with R exactly when |X| ≤ the R it reports, as the sheet\'s behaviour does', (name) => {
    const onResonance = buildOf(open(example('sensor-node')), name).lengthM; // angle 90° at "at"
    const length = straddling(buildOf(open(example('sensor-node')), name), onResonance, 0.98 * onResonance);
    const d = demoWith(name, length);
    const b = buildOf(d, name);
    // The case this checks: the two Rs disagree about |X| (one above it, one below).
    const t = twoRs(b, b.lengthM);
    expect(Math.sign(Math.abs(t.x) - t.analysisR)).toBe(-Math.sign(Math.abs(t.x) - t.reportedR));
    const r = d.doc.result.entries.find((e) => e.name === name)!.results;
    expect(r.resistance_ohm).toBe(t.reportedR);
    const resonant = Math.abs(t.x) <= t.reportedR;
    expect(r.behaviour).toBe(resonant ? 'resonant' : t.x > 0 ? 'inductive' : 'capacitive');
    expect(r.q !== null && (r.q as number) <= 1).toBe(resonant);
    expect(r.inductance_h === null && r.capacitance_f === null).toBe(resonant);
    const p = d.service.getPlot(d.doc, name);
    if ('error' in p) throw new Error(p.error);
    const label = p.markers.find((m) => m.kind === 'operating')!.label;
    expect(label).toMatch(resonant ? /^resonant \(R \d+(\.\d+)? [mk]?Ω\) at / : /^X [+−]\d+(\.\d+)? [mk]?Ω ≈ \d+(\.\d+)? [fpn][FH] at /);
  });

  it('every stub of every example: "resonant (R …)" where the sheet says resonant, else X with its L or C; never rounding noise', () => {
    for (const file of ['sensor-node', 'warnings-tour', 'power-check', 'trap-sweep']) {
      const ex = open(example(file));
      for (const e of ex.doc.result.entries.filter((x) => x.kind === 'stub')) {
        const p = ex.service.getPlot(ex.doc, e.name);
        if ('error' in p) throw new Error(p.error);
        const label = p.markers.find((m) => m.kind === 'operating')!.label;
        expect(label, `${file} ${e.name}`).toMatch(e.results.behaviour === 'resonant' ? /^resonant \(R / : /^X [+−]/);
        expect(label, `${file} ${e.name}`).not.toMatch(/\de[-+]?\d/);
      }
    }
  });

  it('the hover shows the trap\'s X at resonance as 0 (below what the computation resolves) and its Q as an L or C as 0', () => {
    const text = example('sensor-node');
    const d = open(text);
    const r = d.doc.result.entries.find((e) => e.name === 'trap')!.results;
    expect(Math.abs(r.reactance_ohm as number)).toBeLessThan(1e-12); // the computed X: rounding noise, kept in the results
    const hover = d.service.getHover(d.doc, { line: lineOf(text, 'stub trap:'), character: 6 })!.contents;
    expect(hover).toMatch(/\| Zin \| 0\.173 Ω \+j0 Ω \|/);
    expect(hover).toMatch(/\| Q as an L or C \(X \/ R\) \| 0 \|/);
    for (const row of hover.split('\n').filter((l) => /^\| (Zin|Q as an L or C)/.test(l))) expect(row).not.toMatch(/\de-\d/);
  });
});
