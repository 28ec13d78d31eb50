/**
 * The extension's TextMate grammar, tokenized by vscode-textmate with the oniguruma wasm (the engine
 * VS Code itself uses). Each check names the token text and the scope it must carry.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { STUB_KINDS } from '../../shared-core/src/sheet/schema.js';
import { LINE_TYPES } from '../../shared-core/src/sheet/eval/lineTypes.js';
import { loadSheetGrammar, type SheetTokenizer } from './textmate.js';

let grammar: SheetTokenizer;
beforeAll(async () => {
  grammar = await loadSheetGrammar();
});

/** The innermost scope of each token whose text is `text` (trimmed), in order. */
function scopesOf(line: string, text: string): string[] {
  return grammar.tokenizeLine(line).filter((t) => t.text.trim() === text).map((t) => t.scopes.at(-1)!);
}

/** Asserts that the first token with this text carries a scope starting with `scope`. */
function expectScope(line: string, text: string, scope: string): void {
  const found = scopesOf(line, text);
  expect(found, `"${text}" in: ${line}`).not.toHaveLength(0);
  expect(found[0], `"${text}" in: ${line}`).toMatch(new RegExp(`^${scope.replace(/\./g, '\\.')}(\\.|$)`));
}

describe('rfsheet grammar', () => {
  it('scopes a comment line and a trailing comment', () => {
    const line = '# bias choke: λ/4 short stub at 2.45 GHz';
    const tokens = grammar.tokenizeLine(line);
    expect(tokens.every((t) => t.scopes.includes('comment.line.number-sign.rfsheet'))).toBe(true);
    expectScope(line, '#', 'punctuation.definition.comment');
    const trailing = 'line feed: microstrip on board, z0 50 ohm   # width is synthesized';
    expectScope(trailing, '# width is synthesized'.slice(1).trim(), 'comment.line.number-sign');
    expectScope(trailing, 'ohm', 'keyword.other.unit');
  });

  it('scopes let: keyword, name, =, number, unit, range ..', () => {
    const line = 'let band = 2.40 GHz .. 2.50 GHz';
    expectScope(line, 'let', 'keyword.control');
    expectScope(line, 'band', 'entity.name');
    expectScope(line, '=', 'keyword.operator.assignment');
    expectScope(line, '2.40', 'constant.numeric');
    expect(scopesOf(line, 'GHz')).toEqual(['keyword.other.unit.rfsheet', 'keyword.other.unit.rfsheet']);
    expectScope(line, '..', 'keyword.operator.range');
  });

  it('scopes a toleranced let with ±', () => {
    const line = 'let h = 0.8 mm ± 0.05 mm';
    expectScope(line, '±', 'keyword.operator.tolerance');
    expect(scopesOf(line, 'mm')).toEqual(['keyword.other.unit.rfsheet', 'keyword.other.unit.rfsheet']);
  });

  it('scopes substrate keys, tolerances and copper weight', () => {
    const line = 'substrate board: dk 2.55 ± 0.04, df 0.0022, height 0.8 mm, copper 1 oz, roughness 1 um, conductivity 5.8e7 S/m';
    expectScope(line, 'substrate', 'keyword.control');
    expectScope(line, 'board', 'entity.name');
    for (const key of ['dk', 'df', 'height', 'copper', 'roughness', 'conductivity']) expectScope(line, key, 'support.type.property-name');
    expectScope(line, '±', 'keyword.operator.tolerance');
    expectScope(line, '5.8e7', 'constant.numeric');
    for (const unit of ['mm', 'oz', 'um', 'S', 'm']) expectScope(line, unit, 'keyword.other.unit');
  });

  it('scopes every line type of the schema, with `on` and the substrate reference', () => {
    for (const type of Object.keys(LINE_TYPES)) {
      const line = `line l1: ${type} on board, width 1.5 mm, at f0`;
      expectScope(line, 'line', 'keyword.control');
      expectScope(line, 'l1', 'entity.name');
      expectScope(line, type, 'support.type');
      expectScope(line, 'on', 'keyword.other.on');
      expectScope(line, 'board', 'variable.other');
      expectScope(line, 'f0', 'variable.other');
    }
    const coax = 'line cable: coax, inner 0.9 mm, outer 2.95 mm, dk 2.1';
    for (const key of ['inner', 'outer', 'dk']) expectScope(coax, key, 'support.type.property-name');
    const ideal = 'line t: ideal, z0 50 Ω, velocity 0.66';
    for (const key of ['z0', 'velocity']) expectScope(ideal, key, 'support.type.property-name');
    expectScope(ideal, 'Ω', 'keyword.other.unit');
  });

  it('scopes every stub kind and stub key', () => {
    for (const kind of STUB_KINDS) {
      const line = `stub choke: ${kind} on thin, length 19.8 mm, at f0, band 2.4 GHz .. 2.5 GHz, resonant, solution 2`;
      expectScope(line, 'stub', 'keyword.control');
      expectScope(line, 'choke', 'entity.name');
      expectScope(line, kind, 'support.type');
      expectScope(line, 'on', 'keyword.other.on');
      expectScope(line, 'thin', 'variable.other');
      for (const key of ['length', 'at', 'band', 'resonant', 'solution']) expectScope(line, key, 'support.type.property-name');
      expectScope(line, '19.8', 'constant.numeric');
      expectScope(line, '..', 'keyword.operator.range');
    }
  });

  it('scopes a sweep: keyword, name, `of` and what it sweeps, its keys and range', () => {
    const line = 'sweep wide: of tune, over 1 GHz .. 6 GHz, points 201, ref 50 ohm   # for the plot';
    expectScope(line, 'sweep', 'keyword.control');
    expectScope(line, 'wide', 'entity.name');
    expectScope(line, 'of', 'support.type.property-name');
    expectScope(line, 'tune', 'variable.other');
    for (const key of ['over', 'points', 'ref']) expectScope(line, key, 'support.type.property-name');
    expectScope(line, '..', 'keyword.operator.range');
    expect(scopesOf(line, 'GHz')).toEqual(['keyword.other.unit.rfsheet', 'keyword.other.unit.rfsheet']);
    expectScope('sweep sec: of feed, length 20 mm, over 0.1 GHz .. 10 GHz', 'length', 'support.type.property-name');
  });

  it('scopes units after numbers, with and without a space', () => {
    const line = 'stub t: open on feed, angle 90°, at 2*f0, capacitance 0.9pF';
    expectScope(line, '°', 'keyword.other.unit');
    expectScope(line, 'pF', 'keyword.other.unit');
    expectScope(line, '*', 'keyword.operator.arithmetic');
    for (const unit of ['nH', 'mil', 'kHz', 'µm', 'rad', 'deg']) expectScope(`let x = 3 ${unit}`, unit, 'keyword.other.unit');
  });

  it('keeps names with digits whole, and a comma inside a call is not a key separator', () => {
    const line = 'let w2 = max(w1, 0.2 mm) * 1.05';
    expectScope(line, 'w2', 'entity.name');
    expectScope(line, 'max', 'support.function');
    expectScope(line, 'w1', 'variable.other');
    expect(scopesOf(line, ',')).toEqual(['punctuation.separator.arguments.rfsheet']);
    expect(scopesOf(line, '0')).toEqual([]);
  });

  it('does not colour a line that is not a declaration as one', () => {
    const tokens = grammar.tokenizeLine('lett x = 3');
    expect(tokens.flatMap((t) => t.scopes).some((s) => s.startsWith('keyword.control'))).toBe(false);
  });
});
