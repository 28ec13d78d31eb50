/**
 * Name references with exact ranges, and the messages for names the sheet does not define.
 */
import type { Token } from './lex.js';
import { SHEET_FUNCTIONS } from './mathInstance.js';
import type { NameFallback, NameRef } from './types.js';

/** Common miscasings and plurals of units used on RF sheets, lower-cased → mathjs spelling. */
const UNIT_SPELLINGS: ReadonlyMap<string, string> = new Map(Object.entries({
  hz: 'Hz', khz: 'kHz', mhz: 'MHz', ghz: 'GHz', thz: 'THz', ohms: 'ohm', kohms: 'kohm',
  ph: 'pH', nh: 'nH', uh: 'uH', mh: 'mH', ff: 'fF', pf: 'pF', nf: 'nF', uf: 'uF',
  mils: 'mil', thou: 'mil', micron: 'um', microns: 'um', mm: 'mm', um: 'um', nm: 'nm', cm: 'cm',
  degree: 'deg', degrees: 'deg', rads: 'rad', radian: 'rad', radians: 'rad', siemens: 'S',
}));

/** Unit names of single letters, for the "read as a unit" note. */
export const LETTER_UNITS: ReadonlyMap<string, string> = new Map(Object.entries({
  h: 'hour', L: 'litre', l: 'litre', H: 'henry', C: 'coulomb', S: 'siemens', W: 'watt', m: 'metre',
  s: 'second', g: 'gram', A: 'ampere', K: 'kelvin', J: 'joule', N: 'newton', T: 'tesla', V: 'volt',
  F: 'farad', t: 'tonne', b: 'bit', B: 'byte', u: 'atomic mass unit',
}));

/**
 * Ranges of every referenced symbol, in source order. A token counts as a symbol when the AST holds a
 * symbol of that name and the token is not a call (`name(`); a symbol with no matching token (not
 * expected) gets the whole text as its range.
 */
export function collectRefs(
  tokens: readonly Token[], symbols: ReadonlySet<string>, calls: ReadonlySet<string>,
  fallbackOf: (name: string) => NameFallback, textLength: number,
): { names: NameRef[]; functions: NameRef[] } {
  const names: NameRef[] = [];
  const functions: NameRef[] = [];
  const seen = new Set<string>();
  for (let k = 0; k < tokens.length; k++) {
    const t = tokens[k];
    if (t === undefined || t.kind !== 'ident') continue;
    const isCall = tokens[k + 1]?.kind === 'open';
    if (isCall && calls.has(t.text)) {
      functions.push({ name: t.text, start: t.start, end: t.end, fallback: 'none' });
    } else if (!isCall && symbols.has(t.text)) {
      names.push({ name: t.text, start: t.start, end: t.end, fallback: fallbackOf(t.text) });
      seen.add(t.text);
    }
  }
  for (const name of symbols) {
    if (!seen.has(name)) names.push({ name, start: 0, end: textLength, fallback: fallbackOf(name) });
  }
  return { names, functions };
}

/** A name as quoted in messages: at most 40 characters. */
export function quoteName(name: string): string {
  return name.length <= 40 ? name : `${name.slice(0, 39)}…`;
}

/** Message for a name that is neither a sheet name nor a unit or constant. */
export function unknownNameMessage(name: string): string {
  if (SHEET_FUNCTIONS.has(name)) return `"${name}" is a function: call it as ${name}(…)`;
  const unit = UNIT_SPELLINGS.get(name.toLowerCase());
  if (unit !== undefined && unit !== name) return `unknown name "${name}": did you mean the unit ${unit}?`;
  const q = quoteName(name);
  return `unknown name "${q}": define it on its own line (let ${q} = …) or check the spelling`;
}
