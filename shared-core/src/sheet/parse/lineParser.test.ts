import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { MAX_LINE_LENGTH, parseLine, type LocalDiagnostic, type ParsedDeclaration, type Span } from './lineParser.js';

/** The single error of `text`, with the slice it covers (which may be '' one past the end of the line). */
function error(text: string): LocalDiagnostic & { slice: string } {
  const p = parseLine(text);
  expect(p.errors.map((e) => e.message), text).toHaveLength(1);
  const e = p.errors[0]!;
  return { ...e, slice: text.slice(e.start, e.end) };
}

function declaration(text: string): ParsedDeclaration {
  const p = parseLine(text);
  expect(p.errors, text).toEqual([]);
  expect(p.declaration, text).not.toBeNull();
  return p.declaration!;
}

/** A span must be the exact, trimmed slice of the line it claims to be. */
function expectSpan(text: string, s: Span | null | undefined, want: string): void {
  expect(s).toBeTruthy();
  expect(s!.text).toBe(want);
  expect(text.slice(s!.start, s!.end)).toBe(want);
}

describe('lines that declare nothing', () => {
  it.each(['', '   ', '\t', '# a note', '   # let x = 1', '#', '#: substrate b: dk 3'])('%j: no declaration, no error', (text) => {
    expect(parseLine(text)).toEqual({ declaration: null, errors: [] });
  });
});

describe('let', () => {
  it('plain value: name, value and span with exact columns', () => {
    const text = 'let f0 = 2.45 GHz';
    const d = declaration(text);
    expect(d.kind).toBe('let');
    expectSpan(text, d.name, 'f0');
    expectSpan(text, d.value, '2.45 GHz');
    expectSpan(text, d.span, text);
    expect(d.head).toBeNull();
    expect(d.items).toEqual([]);
  });

  it.each([
    ['range', 'let band = 2.40 GHz .. 2.50 GHz', '2.40 GHz .. 2.50 GHz'],
    ['absolute tolerance', 'let h = 0.8 mm ± 0.05 mm', '0.8 mm ± 0.05 mm'],
    ['percent tolerance', 'let z = 50 Ω ± 5 %', '50 Ω ± 5 %'],
    ['ASCII tolerance', 'let z = 50 ohm +/- 5%', '50 ohm +/- 5%'],
    ['expression with commas', 'let f = max(1 GHz, 2 GHz) * 2', 'max(1 GHz, 2 GHz) * 2'],
  ])('%s: the value is kept whole for the evaluator to split', (_label, text, value) => {
    expectSpan(text, declaration(text).value, value);
  });

  it('indentation, tabs and a trailing comment are left out of the spans', () => {
    const text = '  let\tx\t=\t1 mm   # the comment, with = and :';
    const d = declaration(text);
    expect(d.name).toEqual({ text: 'x', start: 6, end: 7 });
    expect(d.value).toEqual({ text: '1 mm', start: 10, end: 14 });
    expect(d.span).toEqual({ text: 'let\tx\t=\t1 mm', start: 2, end: 14 });
  });

  it('parseLine takes single lines: the evaluator splits at CRLF, CR and LF; a stray CR is whitespace', () => {
    expect(parseLine('let x = 1 mm\r')).toEqual(parseLine('let x = 1 mm'));
    expect(parseLine('\r')).toEqual({ declaration: null, errors: [] });
  });

  it('a name may hold underscores and digits after the first letter', () => {
    expect(declaration('let _f_2 = 1').name).toEqual({ text: '_f_2', start: 4, end: 8 });
  });
});

describe('substrate', () => {
  it('splits key/value items at commas with exact spans', () => {
    const text = 'substrate board: dk 2.55 ± 0.04, df 0.0022, height 0.8 mm, copper 1 oz';
    const d = declaration(text);
    expect(d.kind).toBe('substrate');
    expectSpan(text, d.name, 'board');
    expect(d.head).toBeNull();
    expect(d.items.map((i) => [i.key.text, i.value?.text, i.span.text])).toEqual([
      ['dk', '2.55 ± 0.04', 'dk 2.55 ± 0.04'],
      ['df', '0.0022', 'df 0.0022'],
      ['height', '0.8 mm', 'height 0.8 mm'],
      ['copper', '1 oz', 'copper 1 oz'],
    ]);
    for (const item of d.items) {
      expectSpan(text, item.key, item.key.text);
      expectSpan(text, item.value, item.value!.text);
      expectSpan(text, item.span, item.span.text);
    }
  });

  it('passes alias keys through as written (er → dk is resolved by the evaluator)', () => {
    expect(declaration('substrate b: er 3, height 1 mm').items[0]!.key).toEqual({ text: 'er', start: 13, end: 15 });
  });

  it('keeps commas inside parentheses in one item', () => {
    const d = declaration('substrate b: dk max(2, 3), height 1 mm');
    expect(d.items.map((i) => i.value?.text)).toEqual(['max(2, 3)', '1 mm']);
  });

  it('a key followed by a space-separated word is one item (a missing comma is the evaluator\'s to report)', () => {
    const d = declaration('substrate b: dk 3 height 1 mm');
    expect(d.items).toHaveLength(1);
    expect(d.items[0]!.value).toEqual({ text: '3 height 1 mm', start: 16, end: 29 });
  });
});

describe('line', () => {
  it('microstrip on a substrate: head word, on-target and items', () => {
    const text = 'line thin: microstrip on board, width 0.4 mm, at f0';
    const d = declaration(text);
    expect(d.kind).toBe('line');
    expectSpan(text, d.head!.word, 'microstrip');
    expectSpan(text, d.head!.on, 'board');
    expect(d.items.map((i) => i.span.text)).toEqual(['width 0.4 mm', 'at f0']);
  });

  it('extra spaces around the on-target are trimmed', () => {
    const d = declaration('line l: microstrip on  core ,width 1 mm');
    expect(d.head!.on).toEqual({ text: 'core', start: 23, end: 27 });
    expect(d.items[0]!.span).toEqual({ text: 'width 1 mm', start: 29, end: 39 });
  });

  it.each([
    ['ideal', 'line l: ideal, z0 50 Ω, dk 2 ± 0.1, at 1 GHz', ['z0 50 Ω', 'dk 2 ± 0.1', 'at 1 GHz']],
    ['ideal with velocity', 'line l: ideal, z0 75 ohm, velocity 0.66, df 0.001', ['z0 75 ohm', 'velocity 0.66', 'df 0.001']],
    ['coax', 'line c: coax, inner 0.91 mm, outer 2.95 mm, dk 2.1', ['inner 0.91 mm', 'outer 2.95 mm', 'dk 2.1']],
  ])('%s: head without on', (_label, text, items) => {
    const d = declaration(text);
    expect(d.head!.on).toBeNull();
    expect(d.items.map((i) => i.span.text)).toEqual(items);
  });

  it('columns count UTF-16 units: Ω, ± and µ are one column each', () => {
    const text = 'line l: ideal, z0 50 Ω ± 1 Ω, dk 2, at 1 GHz   # note';
    const d = declaration(text);
    expect(d.items[0]!.value).toEqual({ text: '50 Ω ± 1 Ω', start: 18, end: 28 });
    expect(d.items[1]!.key).toEqual({ text: 'dk', start: 30, end: 32 });
    expect(d.span.end).toBe(44);
  });
});

describe('stub', () => {
  it('short/open on a line, items and a bare flag', () => {
    const text = 'stub choke: short on thin, length 22.1 mm, at max(1 GHz, 2 GHz), resonant';
    const d = declaration(text);
    expect(d.kind).toBe('stub');
    expectSpan(text, d.head!.word, 'short');
    expectSpan(text, d.head!.on, 'thin');
    expect(d.items.map((i) => [i.key.text, i.value?.text ?? null])).toEqual([
      ['length', '22.1 mm'],
      ['at', 'max(1 GHz, 2 GHz)'],
      ['resonant', null],
    ]);
    expectSpan(text, d.items[2]!.span, 'resonant');
  });

  it('needs no spaces after ":" or ","', () => {
    const d = declaration('stub s:open on l,length 1 mm,at 1 GHz');
    expect(d.head!.word).toEqual({ text: 'open', start: 7, end: 11 });
    expect(d.head!.on).toEqual({ text: 'l', start: 15, end: 16 });
    expect(d.items.map((i) => i.span.text)).toEqual(['length 1 mm', 'at 1 GHz']);
  });

  it('a flag given a value is still an item (the evaluator says "takes no value")', () => {
    expect(declaration('stub s: open on l, resonant yes').items[0]!.value).toEqual({ text: 'yes', start: 28, end: 31 });
  });

  it('a comment cuts the line, commas in it included', () => {
    const d = declaration('stub s: short on l # , length 1 mm');
    expect(d.items).toEqual([]);
    expect(d.span.text).toBe('stub s: short on l');
  });
});

describe('syntax errors, each at its exact columns', () => {
  it.each([
    ['unknown keyword', 'foo x = 1', 0, 3, 'foo'],
    ['keywords are case-sensitive', 'Let x = 1', 0, 3, 'Let'],
    ['keyword glued to the name', 'letx = 3', 0, 4, 'letx'],
    ['a number', '  123 mm', 2, 8, '123 mm'],
    ['punctuation', '( let x', 0, 7, '( let x'],
  ])('%s: %j', (_label, text, start, end, slice) => {
    const e = error(text);
    expect([e.code, e.start, e.end, e.slice]).toEqual(['syntax', start, end, slice]);
    expect(e.message).toBe('a line starts with let, substrate, line, stub or sweep; start free text with #');
  });

  it.each([
    ['let', 3, 4, '', 'let needs a name: let NAME = value'],
    ['let ', 4, 5, '', 'let needs a name: let NAME = value'],
    ['let = 3', 4, 7, '= 3', 'let needs a name: let NAME = value'],
    ['let 1x = 3', 4, 10, '1x = 3', 'let needs a name: let NAME = value'],
    ['substrate : dk 3', 10, 16, ': dk 3', 'substrate needs a name: substrate NAME: …'],
    ['line', 4, 5, '', 'line needs a name: line NAME: …'],
    ['stub # no name', 5, 6, '#', 'stub needs a name: stub NAME: …'],
  ])('missing name: %j at %i–%i', (text, start, end, slice, message) => {
    expect(error(text)).toMatchObject({ code: 'syntax', start, end, slice, message });
  });

  it.each([
    ['let x 3', 6, 7, '3', 'expected "=" after the name x, found "3"'],
    ['let x: 2', 5, 6, ':', 'expected "=" after the name x, found ":"'],
    ['let x', 5, 6, '', 'expected "=" after the name x, the line ends'],
    ['substrate b = dk 3', 12, 13, '=', 'expected ":" after the name b, found "="'],
    ['substrate b', 11, 12, '', 'expected ":" after the name b, the line ends'],
    ['substrate b # comment', 12, 13, '#', 'expected ":" after the name b, the line ends'],
    ['line l microstrip', 7, 8, 'm', 'expected ":" after the name l, found "m"'],
  ])('missing separator: %j at %i–%i', (text, start, end, slice, message) => {
    // At the end of the line the column is one past it; the evaluator moves it back onto the line.
    expect(error(text)).toMatchObject({ code: 'syntax', start, end, slice, message });
  });

  it.each([
    ['let x =', 6, 7],
    ['let x =    # later', 6, 7],
  ])('let without a value: %j points at "="', (text, start, end) => {
    const p = parseLine(text);
    expect(p.declaration?.name.text).toBe('x');
    expect(p.errors).toEqual([{ start, end, severity: 'error', code: 'syntax', message: 'let x needs a value after "="' }]);
  });

  it('a reserved word cannot be a name (it would break every expression of the sheet)', () => {
    expect(error('let end = 1')).toMatchObject({ code: 'syntax', start: 4, end: 7, slice: 'end', message: '"end" is a reserved word: choose another name' });
    expect(error('line end: ideal, z0 50 ohm')).toMatchObject({ start: 5, end: 8, slice: 'end' });
    expect(parseLine('let end = 1').declaration).toBeNull();
    expect(parseLine('let ending = 1').errors).toEqual([]);
  });
});

describe('missing head after ":"', () => {
  it.each([
    ['substrate b:', 'substrate b needs dk …, height … after ":"'],
    ['substrate b:   # empty', 'substrate b needs dk …, height … after ":"'],
    ['line l:', 'line l needs a line type (microstrip, ideal, coax) after ":"'],
    ['stub s:', 'stub s needs short or open on LINE after ":"'],
  ])('%j: missing at the ":"', (text, message) => {
    const p = parseLine(text);
    const colon = text.indexOf(':');
    expect(p.errors).toEqual([{ start: colon, end: colon + 1, severity: 'error', code: 'missing', message }]);
    expect(p.declaration?.items).toEqual([]);
    expect(p.declaration?.head).toBeNull();
  });

  it.each([
    ['line l: on b, z0 50 ohm', 'the line type goes before "on": microstrip on b'],
    ['stub s: on l, length 1 mm', 'short or open goes before "on": short on l'],
  ])('%j: a head that starts with "on" lacks its type', (text, message) => {
    const p = parseLine(text);
    expect(p.errors).toEqual([{ start: 8, end: 10, severity: 'error', code: 'missing', message }]);
    expect(p.declaration?.head).toBeNull();
    expect(p.declaration?.items).toHaveLength(1);
  });
});

describe('items', () => {
  it.each([
    ['doubled comma', 'substrate b: dk 3,, height 1 mm', 18, 19, ',', ['dk', 'height']],
    ['leading comma', 'substrate b: , dk 3', 13, 14, ',', ['dk']],
    ['trailing comma', 'substrate b: dk 3,', 18, 19, '', ['dk']],
    ['trailing comma before a comment', 'substrate b: dk 3, # c', 19, 20, '#', ['dk']],
  ])('empty item (%s): %j at %i–%i', (_label, text, start, end, slice, keys) => {
    expect(error(text)).toMatchObject({ code: 'syntax', start, end, slice, message: 'empty item: remove the extra comma' });
    expect(parseLine(text).declaration?.items.map((i) => i.key.text)).toEqual(keys);
  });

  it.each([
    ['dk(3)', 13, 18],
    ['height0.8mm', 13, 24],
  ])('key without a space before its value: %j', (item, start, end) => {
    const text = `substrate b: ${item}, height 1 mm`;
    const p = parseLine(text);
    expect(p.errors).toEqual([{ start, end, severity: 'error', code: 'syntax', message: 'put a space between the key and its value' }]);
    expect(text.slice(start, end)).toBe(item);
    expect(p.declaration?.items.map((i) => i.key.text)).toEqual(['height']);
  });

  it('an item that does not start with a key word', () => {
    const text = 'substrate b: 3 dk, height 1 mm';
    expect(error(text)).toMatchObject({ code: 'syntax', start: 13, end: 17, slice: '3 dk', message: 'each item starts with a key word, e.g. "height 0.8 mm"' });
  });

  it('when every item of a substrate fails, the missing keys are reported at ":" as well', () => {
    expect(parseLine('substrate b: dk(3)').errors.map((e) => [e.code, e.start, e.end])).toEqual([
      ['syntax', 13, 18],
      ['missing', 11, 12],
    ]);
  });

  it('a digit-ending word is a key of its own (dk3 is an unknown key for the evaluator)', () => {
    expect(declaration('substrate b: dk3').items[0]).toMatchObject({ key: { text: 'dk3', start: 13, end: 16 }, value: null });
  });
});

describe('"on" forms', () => {
  it.each([
    ['on without a name', 'line l: microstrip on', 19, 21, 'on', '"on" needs one name, e.g. "on core"'],
    ['on with two words', 'line l: microstrip on b c, width 1 mm', 22, 25, 'b c', '"on" needs one name, e.g. "on core"'],
    ['on a number', 'line l: microstrip on 3', 22, 23, '3', '"on" needs one name, e.g. "on core"'],
    ['on a name with a dot', 'stub s: open on a.b', 16, 19, 'a.b', '"on" needs one name, e.g. "on core"'],
    ['another word than on', 'line l: microstrip over b', 19, 25, 'over b', 'put a comma after microstrip, or write "microstrip on NAME"'],
    ['on glued to the name', 'line l: microstrip onb', 19, 22, 'onb', 'put a comma after microstrip, or write "microstrip on NAME"'],
    ['stub without on', 'stub s: short l', 14, 15, 'l', 'put a comma after short, or write "short on NAME"'],
  ])('%s: %j', (_label, text, start, end, slice, message) => {
    const p = parseLine(text);
    expect(p.errors).toHaveLength(1);
    expect({ ...p.errors[0], slice: text.slice(start, end) }).toEqual({ start, end, severity: 'error', code: 'syntax', message, slice });
    expect(p.declaration?.head?.on).toBeNull();
  });

  it('a head without "on" parses (the evaluator decides whether the type needs a substrate)', () => {
    const d = declaration('line l: microstrip, width 1 mm');
    expect(d.head).toEqual({ word: { text: 'microstrip', start: 8, end: 18 }, on: null });
  });
});

describe('line length limit', () => {
  it(`accepts a line of exactly ${MAX_LINE_LENGTH} characters`, () => {
    const text = `# ${'x'.repeat(MAX_LINE_LENGTH - 2)}`;
    expect(parseLine(text)).toEqual({ declaration: null, errors: [] });
    const long = `let x = ${'1+'.repeat((MAX_LINE_LENGTH - 9) / 2)}1`;
    expect(long.length).toBeLessThanOrEqual(MAX_LINE_LENGTH);
    expect(parseLine(long).errors).toEqual([]);
  });

  it.each([
    ['a comment', `# ${'x'.repeat(MAX_LINE_LENGTH)}`],
    ['a declaration', `let x = ${'1+'.repeat(MAX_LINE_LENGTH)}1`],
  ])('refuses %s one character too long, from the limit to the end', (_label, text) => {
    const p = parseLine(text);
    expect(p.declaration).toBeNull();
    expect(p.errors).toEqual([{
      start: MAX_LINE_LENGTH, end: text.length, severity: 'error', code: 'limit',
      message: `line longer than ${MAX_LINE_LENGTH} characters: split it or shorten it`,
    }]);
  });
});

describe('never throws, spans stay on the line', () => {
  const words = ['let', 'substrate', 'line', 'stub', 'on', 'short', 'open', 'microstrip', 'x', 'b', ':', '=', ',', ',,', '(', ')', '#', ' ', '\t', '±', 'µm', 'Ω', '°', '\u0000', '\u{1F600}', '2.45', 'GHz', '..', 'resonant'];
  const lineArb = fc.oneof(
    fc.string({ maxLength: 80 }),
    fc.string({ unit: 'binary', maxLength: 80 }),
    fc.array(fc.constantFrom(...words), { maxLength: 16 }).map((w) => w.join(' ')),
    fc.array(fc.constantFrom(...words), { maxLength: 16 }).map((w) => w.join('')),
  );

  it('for arbitrary single lines', () => {
    fc.assert(fc.property(lineArb, (text) => {
      const p = parseLine(text);
      for (const e of p.errors) {
        expect(e.start).toBeGreaterThanOrEqual(0);
        expect(e.end).toBeGreaterThan(e.start);
        // at most one column past the end (a "the line ends" error)
        expect(e.end).toBeLessThanOrEqual(text.length + 1);
        expect(e.message.length).toBeGreaterThan(0);
      }
      const d = p.declaration;
      if (!d) return;
      const spans: Span[] = [d.name, d.span, ...(d.value ? [d.value] : []), ...(d.head ? [d.head.word, ...(d.head.on ? [d.head.on] : [])] : [])];
      for (const i of d.items) spans.push(i.key, i.span, ...(i.value ? [i.value] : []));
      for (const s of spans) expect(text.slice(s.start, s.end)).toBe(s.text);
      // nothing after a comment is parsed
      const hash = text.indexOf('#');
      if (hash >= 0) expect(d.span.end).toBeLessThanOrEqual(hash);
    }));
  });
});
