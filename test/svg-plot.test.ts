/**
 * The plot SVG as XML: every picture the service makes (stubs over frequency and length, lines,
 * line sections, sweeps) is well-formed XML by a strict checker written for the tests
 * (./reference/xml.ts), is self-contained (no script, no foreignObject, no external reference),
 * takes its colours from CSS custom properties with fallbacks, and carries the classes and data
 * attributes of the plot contract with the engine's numbers.
 */
import { describe, expect, it } from 'vitest';
import { createSheetService } from '../shared-core/src/service/sheetService.js';
import type { PlotOptions, PlotResult } from '../shared-core/src/service/types.js';
import { allElements, byClass, deepText, parseXml, XmlError, type XmlElement } from './reference/xml.js';

// Invented example: a 2.45 GHz front end on a 0.8 mm board.
const SHEET = [
  'let f0 = 2.45 GHz',
  'substrate board: dk 2.55, df 0.0022, height 0.8 mm, copper 1 oz',
  'line feed: microstrip on board, z0 50 ohm, at f0',
  'line thin: microstrip on board, width 0.4 mm',
  'stub choke: short on thin, length 22.1 mm, at f0, resonant',
  'stub tune: open on feed, capacitance 0.9 pF, at f0, band 2.4 GHz .. 2.5 GHz',
  'stub trap: short on feed, length 30 mm, at 1 GHz',
  'sweep wide: of trap, over 0.2 GHz .. 12 GHz, points 301',
  'sweep sec: of feed, length 20 mm, over 0.1 GHz .. 10 GHz',
  '',
].join('\n');

const service = createSheetService();
const doc = service.evaluate('file:///front-end.rfsheet', 1, SHEET);

function plot(name: string, options: PlotOptions = {}): { result: PlotResult; root: XmlElement } {
  const result = service.getPlot(doc, name, options);
  if ('error' in result) throw new Error(result.error);
  return { result, root: parseXml(result.svg) };
}

const CASES: [string, PlotOptions][] = [
  ['choke', {}], ['tune', {}], ['tune', { view: 'length' }], ['choke', { view: 'length', lengthUnit: 'mil' }], ['trap', {}],
  ['wide', {}], ['feed', {}], ['sec', {}], ['tune', { fromHz: 1e9, toHz: 3e9, points: 2 }],
];

describe('the XML checker itself', () => {
  it.each([
    ['<a><b></a></b>', /closes <b>/],
    ['<a x="1" x="2"/>', /given twice/],
    ['<a x=1/>', /quoted value/],
    ['<a>&nbsp;</a>', /unknown entity/],
    ['<a>AT&T</a>', /bare "&"/],
    ['<a/><b/>', /second root/],
    ['<a x="<"/>', /"<" in the value/],
    ['<a><!-- a -- b --></a>', /inside a comment/],
    ['<a>', /never closed/],
    ['text<a/>', /outside the root/],
    ['<a>\u0001</a>', /not allowed in XML/],
  ])('refuses %j', (text, message) => {
    expect(() => parseXml(text)).toThrow(XmlError);
    expect(() => parseXml(text)).toThrow(message);
  });

  it('reads attributes, entities and nesting', () => {
    const root = parseXml('<?xml version="1.0"?><a k="&lt;1&gt;"><!-- c --><b class="x y">&#x3a9;&amp;</b></a>');
    expect(root.attributes.k).toBe('<1>');
    expect(byClass(root, 'y')[0]!.text).toBe('Ω&');
  });
});

describe('plot SVG', () => {
  it('the sheet has no errors', () => {
    expect(doc.result.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
  });

  it.each(CASES)('%s %j is well-formed, self-contained XML with the contract\'s root', (name, options) => {
    const { result, root } = plot(name, options);
    expect(root.name).toBe('svg');
    expect(root.attributes.xmlns).toBe('http://www.w3.org/2000/svg');
    expect(root.attributes.class).toBe('sw-plot');
    expect(root.attributes['data-view']).toBe(options.view ?? 'frequency');
    expect(Number(root.attributes['data-x-max'])).toBeGreaterThan(Number(root.attributes['data-x-min']));
    const [, , w, h] = root.attributes.viewBox!.split(' ').map(Number);
    const left = Number(root.attributes['data-plot-left']);
    const width = Number(root.attributes['data-plot-width']);
    expect(left).toBeGreaterThan(0);
    expect(left + width).toBeLessThanOrEqual(w!);
    const elements = allElements(root);
    expect(elements.filter((e) => /^(script|foreignObject|image|use|a|iframe|style)$/i.test(e.name))).toEqual([]);
    for (const e of elements) {
      for (const [k, v] of Object.entries(e.attributes)) {
        expect(k.startsWith('on'), `${e.name} ${k}`).toBe(false);
        expect(/href$/i.test(k), `${e.name} ${k}`).toBe(false);
        if (k !== 'xmlns') expect(/https?:|url\((?!#)/i.test(v), `${e.name} ${k}=${v}`).toBe(false);
        // Colours come only through custom properties with fallbacks.
        if (k === 'fill' || k === 'stroke') expect(v, `${e.name} ${k}`).toBe('none');
        if (k === 'style') {
          for (const decl of v.split(';').map((x) => x.trim()).filter(Boolean)) {
            const [prop, value] = decl.split(/:(.*)/s).map((x) => x!.trim()) as [string, string];
            if (/^(fill|stroke|color)$/.test(prop)) expect(value, decl).toMatch(/^var\(--vscode-[\w-]+, #[0-9a-f]{6}\)$/);
          }
        }
      }
    }
    for (const c of ['sw-axis-x', 'sw-axis-y', 'sw-trace']) expect(byClass(root, c).length, c).toBeGreaterThan(0);
    // Trace coordinates stay inside the drawing.
    for (const t of byClass(root, 'sw-trace')) {
      for (const [, x, y] of (t.attributes.d ?? '').matchAll(/[ML](-?[\d.]+) (-?[\d.]+)/g)) {
        expect(Number(x)).toBeGreaterThanOrEqual(left - 0.01);
        expect(Number(x)).toBeLessThanOrEqual(left + width + 0.01);
        expect(Number(y)).toBeGreaterThanOrEqual(0);
        expect(Number(y)).toBeLessThanOrEqual(h!);
      }
    }
    expect(result.svg.startsWith('<svg ')).toBe(true);
  });

  it('a stub: reactance, resistance (lossy) and its equivalent C traces, the band, resonances and the operating point with the engine\'s numbers', () => {
    const { result, root } = plot('tune');
    const r = doc.result.entries.find((e) => e.name === 'tune')!.results;
    expect(byClass(root, 'sw-trace').map((t) => t.attributes['data-quantity'])).toEqual(['reactance', 'resistance', 'capacitance']);
    const band = byClass(root, 'sw-band');
    expect(band.length).toBe(2); // shaded on both panels
    expect(band.map((b) => [Number(b.attributes['data-from']), Number(b.attributes['data-to'])])).toEqual([[2.4e9, 2.5e9], [2.4e9, 2.5e9]]);
    expect(result.band).toEqual([2.4e9, 2.5e9]);
    const op = byClass(root, 'sw-operating');
    expect(op.map((o) => Number(o.attributes['data-x']))).toEqual([2.45e9]);
    expect(deepText(op[0]!)).toContain('0.9 pF');
    const points = byClass(root, 'sw-operating-point');
    expect(Number(points[0]!.attributes['data-y'])).toBe(r.reactance_ohm);
    expect(Number(points[1]!.attributes['data-y'])).toBe(r.capacitance_f);
    const res = byClass(root, 'sw-resonance');
    expect(res.map((e) => Number(e.attributes['data-x']))).toContain(r.resonance_above_hz);
    expect(res.map((e) => e.attributes['data-type'])).toEqual(result.markers.filter((m) => m.kind === 'resonance').map((m) => m.resonanceType));
    for (const e of res) expect(byClass(e, 'sw-resonance-label').map(deepText)[0]).toMatch(/^\d+(\.\d+)? [GM]Hz$/);
    expect(result.markers.find((m) => m.kind === 'operating')?.x).toBe(2.45e9);
  });

  it('the reactance trace is broken at every parallel resonance: no drawn piece spans a pole', () => {
    for (const name of ['choke', 'wide', 'trap']) {
      const { result, root } = plot(name);
      const xMin = Number(root.attributes['data-x-min']);
      const xMax = Number(root.attributes['data-x-max']);
      const left = Number(root.attributes['data-plot-left']);
      const width = Number(root.attributes['data-plot-width']);
      const px = (x: number) => left + ((x - xMin) / (xMax - xMin)) * width;
      const poles = result.markers.filter((m) => m.resonanceType === 'parallel').map((m) => px(m.x));
      expect(poles.length, name).toBeGreaterThan(0);
      const trace = byClass(root, 'sw-trace').find((t) => t.attributes['data-quantity'] === 'reactance')!;
      const pieces = trace.attributes.d!.split('M').filter(Boolean).map((p) => [...p.matchAll(/(-?[\d.]+) (-?[\d.]+)/g)].map((m) => Number(m[1])));
      expect(pieces.length, name).toBeGreaterThanOrEqual(poles.length);
      for (const xs of pieces) for (const pole of poles) expect(xs[0]! < pole - 0.01 && xs[xs.length - 1]! > pole + 0.01, `${name}: a piece spans the pole at x=${pole}`).toBe(false);
    }
  });

  it.each(CASES)('%s %j: its first child is a background over the whole viewBox in the editor\'s background colour (white without a theme)', (name, options) => {
    const { root } = plot(name, options);
    const [x0, y0, w, h] = root.attributes.viewBox!.split(' ').map(Number);
    const first = root.children[0]!;
    expect(first.name).toBe('rect');
    expect(first.attributes).toEqual({
      class: 'sw-background', x: String(x0), y: String(y0), width: String(w), height: String(h),
      style: 'fill: var(--vscode-editor-background, #ffffff)',
    });
    // Only one background, and everything else is drawn over it.
    expect(byClass(root, 'sw-background')).toHaveLength(1);
  });

  it('has a title element with the plot title', () => {
    const { result, root } = plot('feed');
    expect(root.children.find((c) => c.name === 'title')!.text).toBe(result.title);
  });

  it('is the same bytes each time (deterministic)', () => {
    expect(plot('choke').result.svg).toBe(plot('choke').result.svg);
  });
});
