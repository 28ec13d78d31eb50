import { describe, expect, it } from 'vitest';
import { evaluateSheet } from '../sheet/evaluate.js';
import { contains, entryOnLine, symbolAt } from './locate.js';
import { applyEdits, example, fixture, lineOf, lineRange, open } from './testUtil.js';

const tour = example('warnings-tour');
const node = fixture('two-layer-node');

describe('inlay hints', () => {
  it('show Z0/εeff for lines, the synthesized width, and L/C with X for stubs', () => {
    const { service, doc } = open(node);
    const hints = service.getInlayHints(doc);
    const at = (needle: string) => hints.find((h) => h.position.line === lineOf(node, needle))?.label;
    expect(at('line feed')).toMatch(/^w = 2\.2 mm · εeff 2\.1/);
    expect(at('line thin')).toMatch(/^Z0 115 Ω · εeff 1\.9/);
    expect(at('stub tune:')).toMatch(/^ℓ = 7\.73 mm · ≈ 0\.9 pF · X −72\.2 Ω$/);
    expect(at('stub lbias:')).toMatch(/≈ 1\.5 nH/);
    expect(at('let f0')).toBeUndefined();
  });

  it('place the hint at the end of the declaration, before a trailing comment', () => {
    const { service, doc } = open(node);
    const line = lineOf(node, 'line feed');
    const hint = service.getInlayHints(doc).find((h) => h.position.line === line)!;
    expect(node.split('\n')[line]!.slice(hint.position.character).trimStart().startsWith('#')).toBe(true);
  });

  it('mention a tight resonance margin and honour the display unit and the on/off setting', () => {
    const { service, doc } = open(tour, { lengthUnit: 'mil' });
    const hint = service.getInlayHints(doc).find((h) => h.position.line === lineOf(tour, 'stub lload'))!;
    expect(hint.label).toMatch(/2\.7 % to res\./);
    const feed = service.getInlayHints(doc).find((h) => h.position.line === lineOf(tour, 'line feed'))!;
    expect(feed.label).toMatch(/mil/);
    expect(open(tour, { inlayHints: false }).service.getInlayHints(open(tour, { inlayHints: false }).doc)).toEqual([]);
  });

  it('for a range, exactly the hints of the lines inside it (every range of the demo)', () => {
    const text = example('sensor-node');
    const { service, doc } = open(text);
    const all = service.getInlayHints(doc);
    const n = doc.lines.length;
    for (let a = 0; a < n; a += 3) {
      for (let b = a; b < n + 2; b += 5) {
        const range = { start: { line: a, character: 0 }, end: { line: b, character: 0 } };
        expect(service.getInlayHints(doc, range)).toEqual(all.filter((h) => h.position.line >= a && h.position.line <= b));
      }
    }
  });
});

describe('hover', () => {
  it('summarises a stub: electrical length, Zin, L/C, resonances, margin, model', () => {
    const { service, doc } = open(tour);
    const line = lineOf(tour, 'stub lload');
    const hover = service.getHover(doc, { line, character: 2 })!;
    expect(hover.contents).toContain('**lload** · stub');
    expect(hover.contents).toMatch(/electrical length \| 87\.\d° = 0\.24\d\d λg/);
    expect(hover.contents).toMatch(/Zin \| .*Ω \+j1\.2\d kΩ/);
    expect(hover.contents).toMatch(/≈ 7\d\.\d nH/);
    expect(hover.contents).toMatch(/margin to nearest \| 2\.7 %/);
    expect(hover.contents).toMatch(/Hammerstad–Jensen 1980/);
  });

  it('shows the value of a referenced name', () => {
    const { service, doc } = open(tour);
    const line = lineOf(tour, 'stub lload');
    const character = tour.split('\n')[line]!.indexOf('feed') + 1;
    expect(service.getHover(doc, { line, character })!.contents).toMatch(/^\*\*feed\*\* \(line\): Z0 50 Ω/);
  });

  it('returns null on comments and past the end', () => {
    const { service, doc } = open(tour);
    expect(service.getHover(doc, { line: 0, character: 3 })).toBeNull();
    expect(service.getHover(doc, { line: 9999, character: 0 })).toBeNull();
  });
});

describe('code actions', () => {
  it('moves a near-resonance stub out of the margin, and the warning goes away (idempotent)', () => {
    const { service, doc } = open(tour);
    const line = lineOf(tour, 'stub lload');
    const fix = service.getCodeActions(doc, lineRange(line)).find((a) => a.title.startsWith('Move out of the resonance margin'))!;
    expect(fix.kind).toBe('quickfix');
    const fixed = applyEdits(tour, fix.edits);
    const after = evaluateSheet(fixed);
    expect(after.diagnostics.filter((d) => d.range.start.line === line && d.code === 'near-resonance')).toEqual([]);
    const again = open(fixed);
    expect(again.service.getCodeActions(again.doc, lineRange(line)).some((a) => a.title.startsWith('Move out'))).toBe(false);
  });

  it('retunes a detuned resonant stub onto its resonance', () => {
    const { service, doc } = open(tour);
    const line = lineOf(tour, 'stub choke');
    const fix = service.getCodeActions(doc, lineRange(line)).find((a) => a.title.startsWith('Retune'))!;
    const after = evaluateSheet(applyEdits(tour, fix.edits));
    expect(after.diagnostics.some((d) => d.range.start.line === line && d.code === 'detuned')).toBe(false);
  });

  it('writes a synthesized width back, rounded to the manufacturing grid', () => {
    const { service, doc } = open(tour, { gridM: 50e-6 });
    const line = lineOf(tour, 'line feed');
    const action = service.getCodeActions(doc, lineRange(line)).find((a) => a.title.startsWith('Write the synthesized width'))!;
    const edited = applyEdits(tour, action.edits);
    expect(edited.split('\n')[line]).toContain('microstrip on board, width 2.20 mm');
    const reopened = open(edited);
    expect(reopened.service.getCodeActions(reopened.doc, lineRange(line)).some((a) => a.title.startsWith('Write'))).toBe(false);
    const z0 = evaluateSheet(edited).entries.find((e) => e.name === 'feed')!.results.z0_ohm as number;
    expect(Math.abs(z0 - 50)).toBeLessThan(0.5);
  });

  it('swaps an open stub for the short stub with the same reactance at f (and back)', () => {
    const text = node;
    const { service, doc } = open(text);
    const line = lineOf(text, 'stub tune:');
    const swap = service.getCodeActions(doc, lineRange(line)).find((a) => a.title.startsWith('Swap'))!;
    const swapped = applyEdits(text, swap.edits);
    expect(swapped.split('\n')[line]).toContain('tune: short on feed');
    // capacitance target: the length is re-synthesized, so the C is unchanged
    const c = (t: string) => evaluateSheet(t).entries.find((e) => e.name === 'tune')!.results.capacitance_f as number;
    expect(c(swapped) / c(text)).toBeCloseTo(1, 6);
  });

  it('swaps a stub given by length to the equivalent length', () => {
    const { service, doc } = open(tour);
    const line = lineOf(tour, 'stub edge');
    const swap = service.getCodeActions(doc, lineRange(line)).find((a) => a.title.startsWith('Swap'))!;
    const swapped = applyEdits(tour, swap.edits);
    const x = (t: string) => evaluateSheet(t).entries.find((e) => e.name === 'edge')!.results.reactance_ohm as number;
    expect(swapped.split('\n')[line]).toContain('edge: open on feed');
    expect(Math.abs(x(swapped) / x(tour) - 1)).toBeLessThan(0.03); // grid rounding and loss
  });
});

describe('completion', () => {
  const labels = (text: string, line: number, character: number) => {
    const { service, doc } = open(text);
    return service.getCompletions(doc, { line, character }).map((c) => c.label);
  };
  it('offers declaration keywords at the start of a line', () => {
    expect(labels('', 0, 0)).toEqual(expect.arrayContaining(['let', 'substrate', 'line', 'stub']));
  });
  it('offers line types, stub kinds and names of the right kind after "on"', () => {
    const base = `${tour}\n`;
    const n = base.split('\n').length - 1;
    expect(labels(`${base}line x: `, n, 8)).toEqual(['microstrip', 'stripline', 'cpw', 'gcpw', 'ideal', 'coax']);
    expect(labels(`${base}stub y: `, n, 8)).toEqual(['short', 'open']);
    expect(labels(`${base}stub y: open on `, n, 16)).toEqual(['feed', 'thin', 'hairline']);
    expect(labels(`${base}line x: microstrip on `, n, 22)).toEqual(['board']);
  });
  it('offers unused keys for the declaration and units for the key', () => {
    const base = `${tour}\n`;
    const n = base.split('\n').length - 1;
    const keys = labels(`${base}stub y: open on feed, length 3 mm, `, n, 35);
    expect(keys).toContain('at');
    expect(keys).not.toContain('length');
    expect(labels(`${base}stub y: open on feed, at 2.4 `, n, 29)).toEqual(expect.arrayContaining(['f0', 'GHz', 'MHz']));
  });
});

describe('symbols and navigation', () => {
  it('outlines every declaration', () => {
    const { service, doc } = open(node);
    expect(service.getSymbols(doc).map((s) => `${s.kind} ${s.name}`)).toEqual([
      'let f0', 'let band', 'substrate board', 'line feed', 'line thin', 'stub choke', 'stub trap', 'stub tune', 'stub lbias',
    ]);
  });

  it('goes to the definition and finds references', () => {
    const { service, doc } = open(node);
    const line = lineOf(node, 'stub tune:');
    const character = node.split('\n')[line]!.indexOf('feed') + 1;
    expect(service.getDefinition(doc, { line, character })!.range.start.line).toBe(lineOf(node, 'line feed'));
    expect(service.getReferences(doc, { line, character }, true)).toHaveLength(4); // declaration + trap, tune, lbias
  });

  it('renames a name everywhere and refuses bad names', () => {
    const { service, doc } = open(node);
    const line = lineOf(node, 'let f0');
    const result = service.getRename(doc, { line, character: 5 }, 'fc');
    expect('edits' in result && result.edits.length).toBe(1 + 5);
    const renamed = applyEdits(node, 'edits' in result ? result.edits : []);
    expect(evaluateSheet(renamed).diagnostics).toEqual([]);
    expect(service.getRename(doc, { line, character: 5 }, '2x')).toHaveProperty('error');
    expect(service.getRename(doc, { line, character: 5 }, 'feed')).toHaveProperty('error');
    expect(service.getRename(doc, { line, character: 5 }, 'stub')).toHaveProperty('error');
  });
});

describe('document store', () => {
  it('evaluates incrementally per document and forgets closed ones', () => {
    const { service } = open('');
    const a = service.evaluate('u', 1, node);
    const b = service.evaluate('u', 2, node.replace('capacitance 0.9 pF', 'capacitance 1.0 pF'));
    expect(b.result.stats.evaluated).toBe(1);
    expect(service.evaluate('u', 2, b.text)).toBe(b);
    expect(a).not.toBe(b);
    service.close('u');
    expect(service.get('u')).toBeUndefined();
  });
});

describe('locating what sits at a position (binary searches, per-line name lookup)', () => {
  /** The straightforward scans the indexed lookups replace: every entry, every symbol. */
  const slowEntry = (doc: ReturnType<typeof open>['doc'], line: number) => doc.result.entries.find((e) => e.line === line);
  const slowSymbol = (doc: ReturnType<typeof open>['doc'], p: { line: number; character: number }) => {
    for (const symbol of doc.result.symbols.values()) {
      if (contains(symbol.declaration, p)) return { symbol, range: symbol.declaration };
      const ref = symbol.references.find((r) => contains(r, p));
      if (ref) return { symbol, range: ref };
    }
    return undefined;
  };
  it('finds exactly what a full scan finds, at every position of every example', () => {
    for (const text of [example('sensor-node'), example('warnings-tour'), example('trap-sweep'), example('power-check'), node]) {
      const { doc } = open(text);
      doc.lines.forEach((line, l) => {
        expect(entryOnLine(doc, l)).toBe(slowEntry(doc, l));
        for (let c = 0; c <= line.length + 1; c++) expect(symbolAt(doc, { line: l, character: c })).toEqual(slowSymbol(doc, { line: l, character: c }));
      });
      expect(entryOnLine(doc, doc.lines.length + 5)).toBeUndefined();
      expect(symbolAt(doc, { line: doc.lines.length + 5, character: 0 })).toBeUndefined();
    }
  });
});
