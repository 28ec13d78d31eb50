/** Character classes shared by the spelling map and the lexer (kept in step with the mathjs parser). */

/**
 * Identifier start as mathjs accepts it (Latin, Latin-1/extended letters, Greek, letterlike), plus µ,
 * minus × and ÷ (mathjs counts them as letters; the sheet rewrites them to operators).
 */
export function isIdentStart(c: number): boolean {
  return (
    (c >= 0x61 && c <= 0x7a) || (c >= 0x41 && c <= 0x5a) || c === 0x5f || c === 0x24 || c === 0xb5 ||
    (c >= 0xc0 && c <= 0x2af && c !== 0xd7 && c !== 0xf7) || (c >= 0x370 && c <= 0x3ff) ||
    (c >= 0x2100 && c <= 0x214f)
  );
}

/** ASCII digit. */
export function isDigit(c: number): boolean {
  return c >= 0x30 && c <= 0x39;
}

/** Identifier continuation: an identifier start or a digit. */
export function isIdentPart(c: number): boolean {
  return isIdentStart(c) || isDigit(c);
}

/** Spaces the lexer skips (mathjs itself only skips space and tab; the spelling map turns the rest into spaces). */
export function isSpace(c: number): boolean {
  return c === 0x20 || c === 0x09;
}

/** Micro sign U+00B5 and Greek small mu U+03BC. */
export const isMicro = (c: number): boolean => c === 0xb5 || c === 0x3bc;

/** Greek capital omega U+03A9 and the ohm sign U+2126. */
export const isOhm = (c: number): boolean => c === 0x3a9 || c === 0x2126;

/** Single characters rewritten outside identifiers, with their replacement text. */
export const CHAR_REWRITES: ReadonlyMap<string, string> = new Map(Object.entries({
  '\u00b0': ' deg', // degree sign: 90° → 90 deg, 20°C → 20 degC
  '\u00d7': '*', // multiplication sign
  '\u00f7': '/', // division sign
  '\u00b7': '*', // middle dot (Ω·m)
  '\u22c5': '*', // dot operator
  '\u2212': '-', // minus sign
  '\u00b2': '^2', // superscript two (mm²)
  '\u00b3': '^3', // superscript three
  '\u00a0': ' ', // no-break space
  '\u2009': ' ', // thin space
  '\u202f': ' ', // narrow no-break space
}));

const RADIX_PREFIX = /^0[xXbBoO]/;
const HEX = /[0-9a-fA-F]/;
const BIN = /[01]/;
const OCT = /[0-7]/;

/** End of the number starting at `i`, as mathjs reads it: `12`, `1.5`, `.5`, `2e-3`, `0x1F`, `0b101`, `0o17`. */
export function scanNumber(text: string, i: number): number {
  const radix = RADIX_PREFIX.test(text.slice(i, i + 2)) ? text.charAt(i + 1).toLowerCase() : '';
  const digit = radix === 'x' ? HEX : radix === 'b' ? BIN : radix === 'o' ? OCT : null;
  if (digit !== null && digit.test(text.charAt(i + 2))) {
    let j = i + 2;
    while (digit.test(text.charAt(j))) j++;
    return j;
  }
  let j = i;
  while (isDigit(text.charCodeAt(j))) j++;
  if (text.charAt(j) === '.') j++;
  while (isDigit(text.charCodeAt(j))) j++;
  const e = text.charAt(j);
  if (e === 'e' || e === 'E') {
    const sign = text.charAt(j + 1) === '+' || text.charAt(j + 1) === '-' ? 1 : 0;
    if (isDigit(text.charCodeAt(j + 1 + sign))) {
      j += 1 + sign;
      while (isDigit(text.charCodeAt(j))) j++;
    }
  }
  return j;
}
