/**
 * Attack expressions against the mathjs layer, and the sheet positions they are planted in.
 * Each one tries to reach JavaScript (constructors, prototypes), change the instance (`import`,
 * `createUnit`, `config`), parse or evaluate text at run time, define functions, allocate huge
 * matrices or ranges, recurse, or nest deeply. Test-only.
 */

/** Marker the attacks try to create as a global or a file; nothing may ever find it. */
export const PWNED = 'stubwrightPwned';

/** Attack expressions (values of a sheet key). */
export const ATTACK_EXPRESSIONS: readonly string[] = [
  // constructors and prototypes
  'constructor', '__proto__', 'prototype', 'toString', 'valueOf', 'hasOwnProperty', '__defineGetter__', '2 constructor',
  'sqrt.constructor', `sqrt.constructor("globalThis.${PWNED}=1")()`, `[].map.constructor("globalThis.${PWNED}=1")()`,
  'unit.prototype', 'a["constructor"]', 'a.__proto__', '{}.constructor', 'f = sqrt.constructor', 'constructor.constructor',
  `sqrt["constructor"]("return process")()`, '(1).constructor', 'typeOf(1)', 'Object', 'Function', 'globalThis', 'process',
  'require', 'this', 'Unit', 'Matrix', 'math',
  // changing the instance or reading text as code at run time
  'import({x: 1}, {override: true})', 'import("fs")', `import({${PWNED}: 1})`, 'createUnit("foo")', 'createUnit({x: "1 m"})',
  'createUnit("mm", "1 m", {override: true})', 'config({number: "BigNumber"})', 'config({epsilon: 1})',
  'evaluate("1+1")', `evaluate("${PWNED} = 1")`, 'evaluate(x)', 'parse("1")', 'parse(x)', 'compile("1")', 'simplify("x")',
  'derivative("x^2", "x")', 'resolve(x)', 'reviver(x)', 'replacer(x)', 'help(sqrt)', 'chain(1)', 'typed(x)', 'parser()',
  // definitions, assignments, recursion
  'f(x) = x', 'f(x) = f(x)', 'x = 1', 'x = x + 1', `${PWNED} = 1`, 'f(x) = f(x+1); f(1)', 'fib(n) = fib(n-1) + fib(n-2)',
  // huge matrices, ranges, loops
  'zeros(1e9)', 'ones(1e9, 1e9)', 'identity(1e6)', 'matrix(x)', 'range(1, 1e9)', '1:1e9', '1:1:1e9', 'concat(x, x)',
  'sqrt(zeros(1e9))', 'x[1e9]', 'size(x)', 'map(1:1e9, sqrt)', 'forEach(1:1e9, sqrt)', 'factorial(1e9)', 'gamma(1e9)',
  'combinations(1e9, 5e8)', 'random(1e9)', 'sum(1:1e9)', 'prod(1:1e9)', 'det(identity(1e4))',
  // strings, objects, conditionals
  '"a" + "b"', "'a'", 'x ? 1 : 2', '{a: 1}', '[1, 2, 3]', 'true', 'null', 'undefined', 'not 1', '1 == 1', '5!',
  // deep nesting and long input
  `${'('.repeat(300)}1${')'.repeat(300)}`, '('.repeat(5000), ')'.repeat(5000), `${'-'.repeat(3000)}1`, `${'2^'.repeat(999)}2`,
  `${'sqrt('.repeat(200)}1${')'.repeat(200)}`, `${'1+'.repeat(1500)}1`, 'x'.repeat(3000), `${'[' .repeat(500)}1${']'.repeat(500)}`,
  `${'max('.repeat(60)}1${')'.repeat(60)}`,
  // numbers and units at their limits
  '1e308^1e308', '10^1e9 mm', 'mm^1e9', '2^-1e9', `0x${'f'.repeat(500)}`, '1e309 mm', '-1e309 GHz', '0 mm / 0 mm',
  // odd characters
  '\u0000', '\uFEFF1', '\uD800', '1\u2028 2', '\u202e1 mm', '1\u0000 mm',
];

/** Where an attack is planted: a sheet around it, the line it sits on (0-based) and the column it starts at. */
export interface Placement {
  label: string;
  attack: string;
  text: string;
  line: number;
  column: number;
}

const BASE = [
  '# invented test sheet',
  'let f0 = 2.45 GHz',
  'substrate board: dk 2.55, df 0.0022, height 0.8 mm, copper 35 um',
  'line feed: microstrip on board, z0 50 ohm',
];

/** Templates with `@` where the attack goes; each becomes the sheet's fifth line. */
const TEMPLATES = [
  'let evil = @',
  'let evilband = 1 GHz .. @',
  'let eviltol = 1 mm ± @',
  'substrate evilsub: dk @, height 0.8 mm',
  'line evilline: microstrip on board, width @',
  'stub evilstub: short on feed, length @, at f0',
  'stub evilat: open on feed, capacitance 1 pF, at @',
  'stub evilband2: open on feed, length 5 mm, at f0, band 2 GHz .. @',
] as const;

/** Every attack in every template (the attack on line 4, 0-based). */
export function placements(attacks: readonly string[] = ATTACK_EXPRESSIONS, templates: readonly string[] = TEMPLATES): Placement[] {
  const out: Placement[] = [];
  for (const attack of attacks) {
    for (const t of templates) {
      const column = t.indexOf('@');
      const line = t.slice(0, column) + attack + t.slice(column + 1);
      out.push({ attack, label: `${t} ⇐ ${attack.length > 40 ? `${attack.slice(0, 40)}… (${attack.length})` : attack}`, text: [...BASE, line, ''].join('\n'), line: BASE.length, column });
    }
  }
  return out;
}

/** The templates (exported for tests that pick a few). */
export const ATTACK_TEMPLATES = TEMPLATES;
