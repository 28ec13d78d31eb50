/**
 * The attack corpus (attacks.ts) planted in whole sheets, at every kind of value position, run
 * through the evaluator and every language-service feature in this process with traps armed on
 * the file system, child processes, sockets and workers:
 * - each attack gets an error diagnostic on its own line, inside the attack's text;
 * - no trap fires, no global or built-in prototype gains a property, nothing named PWNED appears;
 * - the shared expression instance still computes the same figures afterwards (no unit or
 *   setting was redefined).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createSheetService } from '../../shared-core/src/service/sheetService.js';
import { evaluateSheet } from '../../shared-core/src/sheet/evaluate.js';
import { createSafeMath } from '../../shared-core/src/sheet/expr/index.js';
import { observable } from '../../shared-core/src/sheet/testUtil.js';
import { EXAMPLES, LARGE } from '../fuzz/hostile.js';
import { expectSound } from '../fuzz/invariants.js';
import { ATTACK_EXPRESSIONS, ATTACK_TEMPLATES, PWNED, placements } from './attacks.js';
import { armTraps, globalShape } from './traps.js';

/**
 * Attacks that are harmless arithmetic once the text is read: they may evaluate to a plain number
 * or unit where the key takes one (`2^-1e9` is 0, `mm^1e9` a bare unit, a byte-order mark is white
 * space before `1`), and are then refused by the key's own checks or accepted as that value.
 */
const PLAIN_ARITHMETIC = new Set(['2^-1e9', 'mm^1e9', '\uFEFF1']);

const math = createSafeMath();
const ALL = placements();
let before: ReturnType<typeof globalShape>;
const baseline = new Map([...EXAMPLES].map(([n, t]) => [n, observable(evaluateSheet(t, undefined, { math }))]));

beforeAll(() => {
  before = globalShape();
});

afterAll(() => {
  expect(globalShape()).toEqual(before);
});

describe('attack corpus planted in whole sheets (evaluator, in process, traps armed)', () => {
  it(`covers ${ATTACK_EXPRESSIONS.length} attacks in ${ALL.length / ATTACK_EXPRESSIONS.length} positions`, () => {
    expect(ALL.length).toBeGreaterThan(500);
  });

  it('each planted attack yields a located error on its own line; nothing escapes', () => {
    const traps = armTraps();
    const failures: string[] = [];
    try {
      for (const p of ALL) {
        const result = evaluateSheet(p.text, undefined, { math });
        expectSound(p.text, result);
        const errors = result.diagnostics.filter((d) => d.severity === 'error' && d.range.start.line === p.line);
        const inside = errors.filter((d) => d.range.start.character >= p.column);
        const evaluatedClean = errors.length === 0;
        if (evaluatedClean && !PLAIN_ARITHMETIC.has(p.attack)) failures.push(`no error: ${p.label}`);
        else if (!evaluatedClean && inside.length === 0) failures.push(`error outside the attack: ${p.label}: ${errors.map((e) => `${e.range.start.character} ${e.message}`).join('; ')}`);
        // Other lines of the sheet are untouched by the attack.
        expect(result.diagnostics.filter((d) => d.range.start.line !== p.line && d.severity === 'error'), p.label).toEqual([]);
      }
    } finally {
      traps.disarm();
    }
    expect(traps.calls).toEqual([]);
    expect(failures).toEqual([]);
    expect((globalThis as Record<string, unknown>)[PWNED]).toBeUndefined();
    expect(({} as Record<string, unknown>)[PWNED]).toBeUndefined();
  });

  it('every service feature on every attacked line answers without reaching outside', () => {
    const service = createSheetService();
    // CI: every attack in two positions; `npm run fuzz`: every position.
    const chosen = LARGE ? ALL : ALL.filter((_, i) => i % ATTACK_TEMPLATES.length === Math.floor(i / ATTACK_TEMPLATES.length) % ATTACK_TEMPLATES.length || i % ATTACK_TEMPLATES.length === 0);
    const traps = armTraps();
    try {
      for (const [i, p] of chosen.entries()) {
        const doc = service.evaluate(`file:///attack/${i}.rfsheet`, 1, p.text);
        const line = doc.lines[p.line]!;
        for (const character of [0, p.column, Math.floor((p.column + line.length) / 2), line.length]) {
          const at = { line: p.line, character };
          service.getHover(doc, at);
          service.getCompletions(doc, at);
          service.getDefinition(doc, at);
          service.getReferences(doc, at, true);
          service.prepareRename(doc, at);
          service.getRename(doc, at, 'renamed');
        }
        const range = { start: { line: 0, character: 0 }, end: { line: doc.lines.length, character: 0 } };
        service.getInlayHints(doc, range);
        service.getCodeActions(doc, range, service.getDiagnostics(doc));
        service.getSymbols(doc);
        service.close(`file:///attack/${i}.rfsheet`);
      }
    } finally {
      traps.disarm();
    }
    expect(traps.calls).toEqual([]);
  });

  it('the shared expression instance computes the examples exactly as before the attacks', () => {
    for (const [name, text] of EXAMPLES) expect(observable(evaluateSheet(text, undefined, { math })), name).toEqual(baseline.get(name));
  });

  it('the traps themselves fire (the check above can fail)', async () => {
    const traps = armTraps();
    const { createRequire } = await import('node:module');
    const fs = createRequire(import.meta.url)('node:fs') as typeof import('node:fs');
    try {
      expect(() => fs.writeFileSync('/nonexistent/never', 'x')).toThrow(/sandbox trap/);
    } finally {
      traps.disarm();
    }
    expect(traps.calls).toEqual(['fs.writeFileSync']);
  });
});
