/**
 * Every diagnostic code of the sheet, each with its exact range (line, start, end character), its
 * severity and a message that says how to fix it.
 */
import { describe, expect, it } from 'vitest';
import { evaluateSheet } from './evaluate.js';
import { MAX_LINE_LENGTH } from './parse/lineParser.js';
import { located, only, withCode, type Located } from './testUtil.js';
import type { DiagnosticCode } from './types.js';

const SUB = 'substrate b: dk 3, height 1 mm';
const MS = 'line l: microstrip on b, width 1 mm';
/** A dispersion-free line with εeff = 4: λ/4 of a short stub resonates at c0 / (8 · length). */
const IDEAL = 'line l: ideal, z0 50 ohm, dk 4';
const sheet = (...lines: string[]) => lines.join('\n');

/** Code, line, columns and the exact text covered. */
function at(d: Located): [DiagnosticCode, number, number, number, string] {
  return [d.code, d.line, d.start, d.end, d.slice];
}

/** One small sheet per code; the type below fails to compile when a code is added without one. */
const ONE_PER_CODE = {
  syntax: 'hello',
  'unknown-name': 'let x = y',
  'duplicate-name': 'let a = 1\nlet a = 2',
  unit: 'substrate b: dk 3, height 2.4 GHz',
  missing: 'substrate b: height 1 mm',
  conflict: 'substrate b: dk 3, dk 4, height 1 mm',
  range: 'substrate b: dk 3, height -1 mm',
  'model-validity': 'line l: coax, inner 1 mm, outer 3.3 mm, dk 2.1, at 100 GHz',
  'near-resonance': `${IDEAL}\nstub s: short on l, length 36 mm, at 1 GHz`,
  'resonance-in-band': `${IDEAL}\nstub e: short on l, length 33 mm, at 1 GHz, band 0.95 GHz .. 1.05 GHz`,
  detuned: `${IDEAL}\nstub c: short on l, length 30 mm, at 1 GHz, resonant`,
  cycle: 'let a = a + 1',
  limit: `let x = ${'('.repeat(41)}1${')'.repeat(41)}`,
  // V_j = √(2·100 W·50 Ω) = 100 V; an open stub at 72° raises it to 100 V / cos 72° ≈ 324 V at its end.
  power: `${IDEAL}\nstub p: open on l, length 30 mm, at 1 GHz, power 100 W`,
} satisfies Record<DiagnosticCode, string>;

describe('every pinned code', () => {
  it.each(Object.entries(ONE_PER_CODE))('%s: produced alone by its sheet, with a range inside the text', (code, text) => {
    const d = only(text);
    expect(d.code).toBe(code);
    expect(d.slice.length).toBeGreaterThan(0);
    const warning = ['model-validity', 'near-resonance', 'resonance-in-band', 'detuned', 'power'].includes(code);
    expect(d.severity).toBe(warning ? 'warning' : 'error');
  });
});

describe('syntax', () => {
  it('free text without # (from the parser), at the first word', () => {
    const d = only(sheet('let a = 1', 'the feed is 50 ohm'));
    expect(at(d)).toEqual(['syntax', 1, 0, 3, 'the']);
    expect(d.severity).toBe('error');
    expect(d.message).toMatch(/start free text with #/);
  });

  it('a missing ":" at the end of a line is moved back onto the line', () => {
    expect(at(only('substrate b'))).toEqual(['syntax', 0, 10, 11, 'b']);
    expect(only('substrate b').message).toBe('expected ":" after the name b, the line ends');
  });

  it('an unknown key, listing the keys that exist', () => {
    const d = only(`${SUB}, thickness 35 um`);
    expect(at(d)).toEqual(['syntax', 0, 32, 41, 'thickness']);
    expect(d.message).toBe('unknown key "thickness" for a substrate; expected one of: dk, df, height, copper, roughness, conductivity');
  });

  it('an unknown line type', () => {
    const d = only('line l: slotline, z0 50 ohm');
    expect(at(d)).toEqual(['syntax', 0, 8, 16, 'slotline']);
    expect(d.message).toMatch(/expected one of: microstrip, stripline, cpw, gcpw, ideal, coax/);
  });

  it('a stub that is neither short nor open', () => {
    const d = only(sheet(IDEAL, 'stub s: shorted on l, length 1 mm, at 1 GHz'));
    expect(at(d)).toEqual(['syntax', 1, 8, 15, 'shorted']);
    expect(d.message).toMatch(/"short on LINE" or "open on LINE"/);
  });

  it('a flag given a value', () => {
    const d = only(sheet(IDEAL, 'stub s: short on l, length 1 mm, at 1 GHz, resonant yes'));
    expect(at(d)).toEqual(['syntax', 1, 52, 55, 'yes']);
    expect(d.message).toBe('resonant takes no value: write just "resonant"');
  });

  it('a tolerance on a key that takes none', () => {
    const d = only(sheet(IDEAL, 'stub s: open on l, angle 45 deg ± 1 deg, at 1 GHz'));
    expect(at(d)).toEqual(['syntax', 1, 25, 39, '45 deg ± 1 deg']);
    expect(d.message).toBe('angle takes no tolerance: remove the "± …" part');
  });

  it('a band that is not a range', () => {
    const d = only(sheet(IDEAL, 'stub s: short on l, length 1 mm, at 1 GHz, band 1 GHz'));
    expect(at(d)).toEqual(['syntax', 1, 48, 53, '1 GHz']);
    expect(d.message).toMatch(/LOW \.\. HIGH, e\.g\. 2\.4 GHz \.\. 2\.5 GHz/);
  });

  it('an ideal line given a substrate', () => {
    const d = only('line l: ideal on b, z0 50 ohm');
    expect(at(d)).toEqual(['syntax', 0, 17, 18, 'b']);
    expect(d.message).toBe('an ideal line needs no substrate: remove "on b"');
  });
});

describe('unknown-name', () => {
  it('an undefined name in an expression, at the name', () => {
    const d = only('let x = 2 * y + 1');
    expect(at(d)).toEqual(['unknown-name', 0, 12, 13, 'y']);
    expect(d.message).toBe('unknown name "y": define it on its own line (let y = …) or check the spelling');
  });

  it('a miscased unit is suggested', () => {
    expect(only('let f = 2.45 ghz').message).toMatch(/did you mean the unit GHz/);
  });

  it('"on" an undeclared name', () => {
    const d = only('line a: microstrip on nosub, width 1 mm');
    expect(at(d)).toEqual(['unknown-name', 0, 22, 27, 'nosub']);
    expect(d.message).toBe('no substrate named nosub: declare "substrate nosub: …" or fix the name');
  });

  it('a stub "on" an undeclared line', () => {
    const d = only('stub s: open on feed, length 1 mm, at 1 GHz');
    expect(at(d)).toEqual(['unknown-name', 0, 16, 20, 'feed']);
    expect(d.message).toMatch(/declare "line feed: …"/);
  });

  it('"on" a name of the wrong kind: a line on a let', () => {
    const d = only(sheet('let s = 1', 'line a: microstrip on s, width 1 mm'));
    expect(at(d)).toEqual(['unknown-name', 1, 22, 23, 's']);
    expect(d.message).toBe('s is a let; a line goes on a substrate');
  });

  it('"on" a name of the wrong kind: a stub on a substrate', () => {
    const d = only(sheet(SUB, MS, 'stub s: open on b, length 5 mm, at 1 GHz'));
    expect(at(d)).toEqual(['unknown-name', 2, 16, 17, 'b']);
    expect(d.message).toBe('b is a substrate; a stub goes on a line');
  });

  it('a line name used inside an expression', () => {
    const d = only(sheet(IDEAL, 'let x = 2 * l'));
    expect(at(d)).toEqual(['unknown-name', 1, 12, 13, 'l']);
    expect(d.message).toBe('l is a line, not a value: only let names can be used in expressions');
  });

  it('a stub name used as a key value', () => {
    const d = only(sheet(IDEAL, 'stub s: short on l, length 5 mm, at 1 GHz', 'stub t: short on l, length s, at 1 GHz'));
    expect(at(d)).toEqual(['unknown-name', 2, 27, 28, 's']);
    expect(d.message).toMatch(/s is a stub, not a value/);
  });
});

describe('duplicate-name', () => {
  it('points at the second name, with related information at the first', () => {
    const text = sheet('let a = 1', '# between', 'let a = 2');
    const d = only(text);
    expect(at(d)).toEqual(['duplicate-name', 2, 4, 5, 'a']);
    expect(d.message).toBe('a is already declared on line 1: rename one of them');
    expect(d.related).toEqual([{ range: { start: { line: 0, character: 4 }, end: { line: 0, character: 5 } }, message: 'first declared here' }]);
  });

  it('across kinds: a substrate named like a let; the first one wins', () => {
    const text = sheet('let b = 2', SUB);
    const r = evaluateSheet(text);
    expect(located(text, r).map(at)).toEqual([['duplicate-name', 1, 10, 11, 'b']]);
    expect(r.entries.map((e) => [e.kind, e.name])).toEqual([['let', 'b']]);
  });
});

describe('unit', () => {
  it('height wants a length, got 2.4 GHz', () => {
    const d = only('substrate b: dk 3, height 2.4 GHz');
    expect(at(d)).toEqual(['unit', 0, 26, 33, '2.4 GHz']);
    expect(d.message).toBe('height wants a length, got 2.4 GHz (a frequency)');
  });

  it('a plain number where an angle is wanted suggests deg or rad', () => {
    const d = only(sheet(IDEAL, 'stub s: short on l, angle 90, at 1 GHz'));
    expect(at(d)).toEqual(['unit', 1, 26, 28, '90']);
    expect(d.message).toBe('angle wants an angle, got 90 (a plain number); add deg or rad');
  });

  it('a single letter read as a unit says so (h is the hour when the sheet defines no h)', () => {
    const d = only('substrate b: dk 3, height h');
    expect(at(d)).toEqual(['unit', 0, 26, 27, 'h']);
    expect(d.message).toBe('height wants a length, got h; "h" was read as the unit hour because the sheet defines no h');
  });

  it('a bare unit inside a sum (no mathjs wording leaks through)', () => {
    const d = only('let x = 2 mm + mm');
    expect(at(d)).toEqual(['unit', 0, 8, 17, '2 mm + mm']);
    expect(d.message).toBe('a unit on its own has no value here: put a number before it (2 mm + 1 mm, not 2 mm + mm)');
  });

  it('a range where a single value is wanted', () => {
    const d = only(sheet('let band = 1 GHz .. 2 GHz', IDEAL, 'stub s: short on l, length 1 mm, at band'));
    expect(at(d)).toEqual(['unit', 2, 36, 40, 'band']);
    expect(d.message).toBe('at wants a single value, but band is a range');
  });

  it('the ends of a range of different kinds', () => {
    const d = only('let band = 1 GHz .. 2 mm');
    expect(at(d)).toEqual(['unit', 0, 20, 24, '2 mm']);
  });

  it('a tolerance of another kind than its value', () => {
    const d = only('let w = 1 mm ± 1 GHz');
    expect(at(d)).toEqual(['unit', 0, 15, 20, '1 GHz']);
    expect(d.message).toMatch(/same kind of quantity as its value .*, or a percentage/);
  });
});

describe('missing', () => {
  it('a stub without at', () => {
    const d = only(sheet(IDEAL, 'stub s: open on l, length 5 mm'));
    expect(at(d)).toEqual(['missing', 1, 5, 6, 's']);
    expect(d.message).toBe('s needs at: add ", at …"');
  });

  it('a stub without a length or a target', () => {
    const d = only(sheet(IDEAL, 'stub s: open on l, at 1 GHz'));
    expect(at(d)).toEqual(['missing', 1, 5, 6, 's']);
    expect(d.message).toBe('s needs one of length, inductance, capacitance, reactance, angle: add ", length …"');
  });

  it('a stub without "on LINE"', () => {
    const d = only(sheet(IDEAL, 'stub s: short, length 1 mm, at 1 GHz'));
    expect(at(d)).toEqual(['missing', 1, 8, 13, 'short']);
    expect(d.message).toBe('say which line the stub is made of: "short on LINE"');
  });

  it('a microstrip without width or z0', () => {
    const d = only(sheet(SUB, 'line l: microstrip on b'));
    expect(at(d)).toEqual(['missing', 1, 5, 6, 'l']);
    expect(d.message).toBe('l needs one of width, z0: add ", width …"');
  });

  it('a microstrip without a substrate', () => {
    const d = only('line l: microstrip, width 1 mm');
    expect(at(d)).toEqual(['missing', 0, 8, 18, 'microstrip']);
    expect(d.message).toBe('a microstrip line needs a substrate: "microstrip on NAME"');
  });

  it('a substrate without dk', () => {
    const d = only('substrate b: height 1 mm');
    expect(at(d)).toEqual(['missing', 0, 10, 11, 'b']);
    expect(d.message).toBe('b needs dk: add ", dk …"');
  });

  it('a key without its value', () => {
    const d = only(sheet(IDEAL, 'stub s: short on l, length, at 1 GHz'));
    expect(at(d)).toEqual(['missing', 1, 20, 26, 'length']);
    expect(d.message).toBe('length needs a value, e.g. length 12 mm');
  });
});

describe('conflict', () => {
  it('width and z0 together: at the second of them', () => {
    const d = only(sheet(SUB, 'line l: microstrip on b, width 1 mm, z0 50 ohm'));
    expect(at(d)).toEqual(['conflict', 1, 37, 39, 'z0']);
    expect(d.message).toBe('give only one of width, z0: width is already given');
  });

  it('a key given twice: at the second key', () => {
    const d = only('substrate b: dk 3, dk 4, height 1 mm');
    expect(at(d)).toEqual(['conflict', 0, 19, 21, 'dk']);
    expect(d.message).toBe('dk is given twice in this substrate: keep one');
  });

  it('a key and its alias count as the same key (er = dk)', () => {
    const d = only('substrate b: dk 3, er 4, height 1 mm');
    expect(at(d)).toEqual(['conflict', 0, 19, 21, 'er']);
    expect(d.message).toBe('dk is given twice in this substrate: keep one');
  });

  it('a length and a target together', () => {
    const d = only(sheet(IDEAL, 'stub s: open on l, length 5 mm, capacitance 1 pF, at 1 GHz'));
    expect(at(d)).toEqual(['conflict', 1, 32, 43, 'capacitance']);
    expect(d.message).toMatch(/^give only one of length, inductance, capacitance, reactance, angle/);
  });
});

describe('range', () => {
  it('a negative height', () => {
    const d = only('substrate b: dk 3, height -1 mm');
    expect(at(d)).toEqual(['range', 0, 26, 31, '-1 mm']);
    expect(d.message).toBe('height must be positive');
  });

  it('dk below 1', () => {
    const d = only('substrate b: dk 0.5, height 1 mm');
    expect(at(d)).toEqual(['range', 0, 16, 19, '0.5']);
    expect(d.message).toBe('dk must be at least 1 (vacuum), got 0.5');
  });

  it('a z0 no microstrip on this substrate reaches, with the reachable span', () => {
    const d = only(sheet(SUB, 'line l: microstrip on b, z0 1000 ohm'));
    expect(at(d)).toEqual(['range', 1, 28, 36, '1000 ohm']);
    expect(d.message).toMatch(/^Z0 = 1000 Ω is not reachable on this substrate: w\/h from .* gives .* Ω down to .* Ω$/);
  });

  it('a negative stub length', () => {
    const d = only(sheet(IDEAL, 'stub s: open on l, length -5 mm, at 1 GHz'));
    expect(at(d)).toEqual(['range', 1, 26, 31, '-5 mm']);
    expect(d.message).toBe('a stub length must be positive');
  });

  it('a negative target capacitance', () => {
    const d = only(sheet(IDEAL, 'stub s: short on l, capacitance -1 pF, at 1 GHz'));
    expect(at(d)).toEqual(['range', 1, 32, 37, '-1 pF']);
  });

  it('a band from high to low', () => {
    const d = only(sheet(IDEAL, 'stub s: short on l, length 10 mm, at 1 GHz, band 2 GHz .. 1 GHz'));
    expect(at(d)).toEqual(['range', 1, 49, 63, '2 GHz .. 1 GHz']);
    expect(d.message).toBe('band must go from low to high: swap the two ends');
  });

  it.each([
    ['the velocity factor, not z0', 'line l: ideal, z0 50 ohm, velocity 1.5', 35, 38, '1.5', /^velocity factor must lie in \(0, 1\]/],
    ['df of an ideal line', 'line l: ideal, z0 50 ohm, df -0.1', 29, 33, '-0.1', /^df must be a non-negative loss tangent/],
    ['the outer diameter of a coax', 'line l: coax, inner 3 mm, outer 1 mm', 32, 36, '1 mm', /^outer diameter must be larger/],
    ['the inner diameter of a coax', 'line l: coax, inner -3 mm, outer 1 mm', 20, 25, '-3 mm', /^inner diameter must be positive/],
  ])('an engine refusal points at the key it names: %s', (_label, text, start, end, slice, message) => {
    const d = only(text);
    expect(at(d)).toEqual(['range', 0, start, end, slice]);
    expect(d.message).toMatch(message);
  });

  it('a design frequency that is not positive', () => {
    const d = only(sheet(IDEAL, 'stub s: short on l, length 1 mm, at -1 GHz'));
    expect(at(d)).toEqual(['range', 1, 36, 42, '-1 GHz']);
  });

  it('a solution number below 1', () => {
    const d = only(sheet(IDEAL, 'stub s: short on l, length 1 mm, at 1 GHz, solution 0'));
    expect(at(d)).toEqual(['range', 1, 52, 53, '0']);
    expect(d.message).toMatch(/whole number from 1/);
  });
});

describe('model-validity (warning)', () => {
  it('a coax above its first higher-order mode, at the line type and at the stub frequency', () => {
    const text = sheet('line l: coax, inner 1 mm, outer 3.3 mm, dk 2.1, at 100 GHz', 'stub s: open on l, length 0.3 mm, at 100 GHz');
    const ds = withCode(text, 'model-validity');
    expect(ds.map(at)).toEqual([
      ['model-validity', 0, 8, 12, 'coax'],
      ['model-validity', 1, 37, 44, '100 GHz'],
    ]);
    for (const d of ds) {
      expect(d.severity).toBe('warning');
      expect(d.message).toMatch(/TE11 cutoff .*: results are outside the model's published range$/);
    }
  });

  it('a microstrip far narrower than the published range, once per distinct note', () => {
    const ds = withCode(sheet('substrate b: dk 2.55, height 0.8 mm', 'line l: microstrip on b, width 5 um, at 2 GHz'), 'model-validity');
    expect(ds.length).toBeGreaterThanOrEqual(1);
    expect(new Set(ds.map((d) => d.message)).size).toBe(ds.length);
    for (const d of ds) expect(at(d)).toEqual(['model-validity', 1, 8, 18, 'microstrip']);
    expect(ds[0]!.message).toMatch(/w\/h = 0\.006250 is outside/);
  });
});

describe('resonance checks (warnings), with related information pointing at the line', () => {
  const lineName = { start: { line: 0, character: 5 }, end: { line: 0, character: 6 } };
  const related = [{ range: lineName, message: 'the line l sets Z0 and εeff' }];

  it('near-resonance: a short stub just below λ/4, at its length', () => {
    // λ/4 resonance at c0 / (8 · 36 mm) = 1.041 GHz, 4.1 % above the 1 GHz design frequency.
    const d = only(sheet(IDEAL, 'stub s: short on l, length 36 mm, at 1 GHz'));
    expect(at(d)).toEqual(['near-resonance', 1, 27, 32, '36 mm']);
    expect(d.severity).toBe('warning');
    expect(d.message).toMatch(/^s is 4\.1 % from its parallel resonance at 1\.041 GHz \(λ\/4\), inside the 10 % margin/);
    expect(d.message).toMatch(/Shorten or lengthen it, or mark it "resonant" if intended$/);
    expect(d.related).toEqual(related);
  });

  it('resonance-in-band: clear at f, but the resonance falls in the widened band, at the band', () => {
    // λ/4 at c0 / (8 · 33 mm) = 1.136 GHz: 13.6 % from 1 GHz, inside 0.95…1.05 GHz widened by 10 %.
    const d = only(sheet(IDEAL, 'stub e: short on l, length 33 mm, at 1 GHz, band 0.95 GHz .. 1.05 GHz'));
    expect(at(d)).toEqual(['resonance-in-band', 1, 49, 69, '0.95 GHz .. 1.05 GHz']);
    expect(d.severity).toBe('warning');
    expect(d.message).toMatch(/^parallel resonance at 1\.136 GHz \(λ\/4\) falls inside the band widened by the 10 % margin \(855 MHz … 1\.155 GHz\)/);
    expect(d.message).toMatch(/Shorten it to move that resonance above the band$/);
    expect(d.related).toEqual(related);
  });

  it('detuned: marked resonant but far from resonance, at its length', () => {
    const d = only(sheet(IDEAL, 'stub c: short on l, length 30 mm, at 1 GHz, resonant'));
    expect(at(d)).toEqual(['detuned', 1, 27, 32, '30 mm']);
    expect(d.severity).toBe('warning');
    expect(d.message).toMatch(/^c is marked resonant but its nearest resonance is 24\.9 % away .*retune the length$/);
    expect(d.related).toEqual(related);
  });

  it('the related range follows the line when lines move', () => {
    const d = only(sheet('# a note', '', IDEAL, 'stub s: short on l, length 36 mm, at 1 GHz'));
    expect(d.related?.[0]?.range).toEqual({ start: { line: 2, character: 5 }, end: { line: 2, character: 6 } });
  });

  it('"resonant" silences near-resonance, and the margin option moves the threshold', () => {
    expect(evaluateSheet(sheet(IDEAL, 'stub s: short on l, length 36 mm, at 1 GHz, resonant')).diagnostics).toEqual([]);
    expect(evaluateSheet(sheet(IDEAL, 'stub s: short on l, length 36 mm, at 1 GHz'), undefined, { marginPct: 3 }).diagnostics).toEqual([]);
    expect(withCode(sheet(IDEAL, 'stub s: short on l, length 33 mm, at 1 GHz'), 'near-resonance', { marginPct: 15 })[0]?.message).toMatch(/inside the 15 % margin/);
  });
});

describe('cycle', () => {
  it('a → b → a: both names, each with the loop from itself', () => {
    const text = sheet('let a = b + 1 mm', 'let b = 2 * a');
    const ds = located(text, evaluateSheet(text));
    expect(ds.map(at)).toEqual([['cycle', 0, 4, 5, 'a'], ['cycle', 1, 4, 5, 'b']]);
    expect(ds[0]!.message).toBe('a depends on itself: a → b → a; break the loop with a plain value');
    expect(ds[1]!.message).toBe('b depends on itself: b → a → b; break the loop with a plain value');
  });

  it('self-reference', () => {
    const d = only('let a = a + 1');
    expect(at(d)).toEqual(['cycle', 0, 4, 5, 'a']);
    expect(d.message).toBe('a depends on itself: a → a; break the loop with a plain value');
  });

  it('a cycle through a tolerance, and a let that reads a cyclic let stays silent', () => {
    const text = sheet('let a = 1 mm ± b', 'let b = a / 10', 'let c = a', 'substrate sub: dk 3, height c');
    expect(located(text, evaluateSheet(text)).map((d) => [d.code, d.line])).toEqual([['cycle', 0], ['cycle', 1]]);
  });
});

describe('limit', () => {
  it('a very long line: from the limit to the end of the line', () => {
    const text = sheet('let a = 1', `let x = ${'1+'.repeat(MAX_LINE_LENGTH / 2)}1`);
    const d = only(text);
    expect(at(d).slice(0, 4)).toEqual(['limit', 1, MAX_LINE_LENGTH, MAX_LINE_LENGTH + 9]);
    expect(d.message).toBe(`line longer than ${MAX_LINE_LENGTH} characters: split it or shorten it`);
  });

  it('too deep an expression: at the first bracket too many', () => {
    const d = only(`let x = ${'('.repeat(41)}1${')'.repeat(41)}`);
    expect(at(d)).toEqual(['limit', 0, 48, 49, '(']);
    expect(d.message).toBe('brackets nested deeper than 40');
  });

  it('too long an expression inside an acceptable line', () => {
    const d = only(`let x = ${'1+'.repeat(1100)}1`);
    expect([d.code, d.start]).toEqual(['limit', 8 + 2000]);
  });

  it('a band holding more resonances than are checked (a huge length or band): at the band, never a hang', () => {
    const d = only(sheet(IDEAL, 'stub e: short on l, length 10 mm, at 1 GHz, band 1 Hz .. 1e18 Hz'));
    expect(at(d)).toEqual(['limit', 1, 49, 64, '1 Hz .. 1e18 Hz']);
    expect(d.message).toMatch(/^the band widened by the 10 % margin holds about \d\.\de\+8 resonances of this stub, more than 1000 are not checked: check the length, its unit and the band$/);
    const long = withCode(sheet(IDEAL, 'stub f: short on l, length 1e9 m, at 1 GHz, band 0.9 GHz .. 1.1 GHz'), 'limit');
    expect(long.map(at)).toEqual([['limit', 1, 49, 67, '0.9 GHz .. 1.1 GHz']]);
  });

  it('too many parts', () => {
    const d = only(`let x = ${'1+'.repeat(600)}1`);
    expect(at(d).slice(0, 3)).toEqual(['limit', 0, 8]);
    expect(d.message).toMatch(/more than 500 parts/);
  });
});

describe('unit spellings Ω, µm, °, ± are accepted and later columns stay exact', () => {
  it('a clean sheet written with them', () => {
    const text = sheet(
      'substrate b: dk 3 ± 2 %, height 800 µm ± 50 μm, copper 35 µm',
      'line l: microstrip on b, z0 50 Ω, at 1 GHz',
      'stub s: open on l, angle 30°, at 1 GHz',
    );
    const r = evaluateSheet(text);
    expect(r.diagnostics).toEqual([]);
    expect(r.entries[0]!.results['height_m']).toBeCloseTo(800e-6, 15);
    expect(r.entries[0]!.results['copper_m']).toBeCloseTo(35e-6, 15);
    expect(r.entries[2]!.results['electrical_deg']).toBeCloseTo(30, 9);
  });

  it.each([
    ['after µm', 'substrate b: dk 3, height 35 µm, copper 2 GHz', 40, 45, '2 GHz'],
    ['after Ω (one column, three letters in mathjs)', 'let x = 50 Ω + foo', 15, 18, 'foo'],
    ['after kΩ', 'let x = 2 kΩ * 3 + foo', 19, 22, 'foo'],
    ['after ° (one column, " deg" in mathjs)', 'let x = 90° + baz', 14, 17, 'baz'],
    ['after ±', 'let x = 2 mm ± 0.1 mm + qux', 24, 27, 'qux'],
    ['after Greek mu', 'let x = 3 μm ± 1 μm * zz', 22, 24, 'zz'],
  ])('%s', (_label, text, start, end, slice) => {
    const d = only(text);
    expect([d.line, d.start, d.end, d.slice]).toEqual([0, start, end, slice]);
  });

  it('in a stub after Ω and °', () => {
    const d = only(sheet('line l: ideal, z0 50 Ω, dk 2, at 1 GHz', 'stub s: open on l, angle 45°, at 1 GHz + zz'));
    expect([d.code, d.line, d.start, d.end, d.slice]).toEqual(['unknown-name', 1, 41, 43, 'zz']);
  });

  it('an empty tolerance after ± is reported on the ± (not past the end of the line)', () => {
    const d = only('let x = 2 mm ±');
    expect(at(d)).toEqual(['syntax', 0, 13, 14, '±']);
  });
});

describe('the expression sandbox reached through a sheet: located diagnostics, never a throw', () => {
  it.each<[string, DiagnosticCode, number, number, string]>([
    ['let x = constructor', 'unknown-name', 8, 19, 'constructor'],
    ['let y = import("fs")', 'syntax', 15, 19, '"fs"'],
    ['let y = import(x)', 'syntax', 8, 14, 'import'],
    ['let z = evaluate("1")', 'syntax', 17, 20, '"1"'],
    ['let z = evaluate(x)', 'syntax', 8, 16, 'evaluate'],
    ['let w = f(x) = x', 'syntax', 13, 14, '='],
    ['let v = [1,2]', 'syntax', 8, 9, '['],
    ['let u = 1:1e9', 'syntax', 9, 10, ':'],
    ['let p = sqrt.constructor', 'syntax', 12, 13, '.'],
    ['let p = a.__proto__', 'syntax', 9, 10, '.'],
    ['let p = __proto__', 'unknown-name', 8, 17, '__proto__'],
    ['let p = hasOwnProperty', 'unknown-name', 8, 22, 'hasOwnProperty'],
    ['let p = zeros(1e9)', 'syntax', 8, 13, 'zeros'],
    ['let p = createUnit(x)', 'syntax', 8, 18, 'createUnit'],
    ['substrate b: dk toString, height 1 mm', 'unknown-name', 16, 24, 'toString'],
    ['substrate b: dk 3, height 1 mm, copper constructor', 'unknown-name', 39, 50, 'constructor'],
  ])('%j → %s at %i–%i', (text, code, start, end, slice) => {
    let d: Located | undefined;
    expect(() => { d = only(text); }).not.toThrow();
    expect([d!.code, d!.line, d!.start, d!.end, d!.slice]).toEqual([code, 0, start, end, slice]);
    expect(d!.severity).toBe('error');
  });

  it('prototype names work as ordinary sheet names', () => {
    const text = sheet('let constructor = 2', 'let __proto__ = 3', 'let toString = 1 mm', 'let x = constructor * __proto__', 'substrate b: dk x, height toString');
    const r = evaluateSheet(text);
    expect(r.diagnostics).toEqual([]);
    expect(r.entries.find((e) => e.name === 'b')?.results).toMatchObject({ dk: 6, height_m: 0.001 });
  });

  it('a reserved word is refused where it is declared, and does not break the other expressions', () => {
    const text = sheet('let end = 1', 'let x = 2 mm', SUB);
    const ds = located(text, evaluateSheet(text));
    expect(ds.map(at)).toEqual([['syntax', 0, 4, 7, 'end']]);
  });
});
