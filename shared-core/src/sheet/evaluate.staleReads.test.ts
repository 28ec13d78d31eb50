/**
 * Incremental evaluation must not keep an error that a later edit cleared. Found by `npm run fuzz`:
 * a stub's `band NAME` that named a let which failed (or was missing) recorded no read of that
 * name, so once the let was fixed the stub kept its stale "band wants a range" error until its
 * own line was edited.
 */
import { describe, expect, it } from 'vitest';
import { evaluateSheet } from './evaluate.js';
import { createSafeMath } from './expr/index.js';
import { observable } from './testUtil.js';

const math = createSafeMath();
const sheet = (bandLine: string) => [
  'let f0 = 2.45 GHz',
  bandLine,
  'substrate board: dk 2.55, df 0.0022, height 0.8 mm, copper 35 um',
  'line feed: microstrip on board, z0 50 ohm',
  'stub edge: short on feed, length 18.9 mm, at f0, band band',
  '',
].join('\n');

describe('a stub reading a range let by name, across edits of that let', () => {
  it.each([
    ['broken', 'let band = 2.40 GHz .. (2.50 GHz'],
    ['a single value', 'let band = 2.40 GHz'],
    ['removed', '# let band = 2.40 GHz .. 2.50 GHz'],
    ['renamed', 'let bands = 2.40 GHz .. 2.50 GHz'],
  ])('the let %s, then restored: the stub is evaluated as cold', (_what, changed) => {
    const good = sheet('let band = 2.40 GHz .. 2.50 GHz');
    const first = evaluateSheet(good, undefined, { math });
    expect(first.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
    const during = evaluateSheet(sheet(changed), first, { math });
    expect(during.diagnostics.some((d) => d.range.start.line === 4 || d.range.start.line === 1)).toBe(true);
    const restored = evaluateSheet(good, during, { math });
    expect(observable(restored)).toEqual(observable(evaluateSheet(good, undefined, { math })));
    expect(restored.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
  });
});
