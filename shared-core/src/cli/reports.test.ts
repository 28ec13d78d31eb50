import { describe, expect, it } from 'vitest';
import { annotateSheet, displayWidth } from './annotate.js';
import { renderJson, toJsonReport } from './jsonReport.js';
import { entryNote } from './notes.js';
import { evaluateSheet } from '../sheet/evaluate.js';
import { at, DEMO_RESULT, DEMO_TEXT, EMPTY_RESULT, entry, sheetResult } from './testFixtures.js';
import { countDiagnostics, formatDiagnosticLine, formatDiagnostics, formatSummary } from './textReport.js';

describe('notes', () => {
  it('give the inlay-hint figures of lines and stubs, nothing for lets and substrates', () => {
    const text = [
      'let f0 = 2.45 GHz',
      'substrate core: dk 2.55, df 0.0022, height 0.8 mm, copper 35 um',
      'line feed: microstrip on core, z0 50 ohm',
      'stub tune: open on feed, capacitance 0.9 pF, at f0',
    ].join('\n');
    const [f0, core, feed, tune] = evaluateSheet(text).entries;
    expect(entryNote(f0!)).toBeNull();
    expect(entryNote(core!)).toBeNull();
    expect(entryNote(feed!)).toMatch(/^# → w = 2\.2 mm · εeff 2\.10\d$/);
    expect(entryNote(tune!)).toMatch(/^# → ℓ = 7\.73 mm · ≈ 0\.9 pF · X −72\.2 Ω$/);
    expect(entryNote(feed!, { lengthUnit: 'mil' })).toMatch(/w = 86\.\d mil/);
    expect(entryNote(entry(0, 'line', 'broken', {}))).toBeNull();
  });
});

describe('annotateSheet', () => {
  const out = annotateSheet(DEMO_TEXT, DEMO_RESULT);
  const lines = out.split('\n');

  it('prints the sheet unchanged apart from appended notes', () => {
    const original = DEMO_TEXT.split('\n');
    expect(lines.length).toBe(original.length);
    lines.forEach((line, i) => expect(line.startsWith(original[i]!.trimEnd())).toBe(true));
    expect(out.endsWith('\n')).toBe(true);
  });

  it('starts every note at one column, except after lines longer than the limit', () => {
    const columns = lines.filter((l) => l.includes('# →')).map((l) => displayWidth(l.slice(0, l.indexOf('# →'))));
    expect(new Set(columns.filter((c) => c !== 76)).size).toBe(1);
    expect(columns).toContain(76);
    expect(lines[4]).toMatch(/# width is synthesized {2}# → Z0/);
  });

  it('counts tabs and non-ASCII characters as display columns', () => {
    expect(displayWidth('\tab')).toBe(10);
    expect(displayWidth('a\tb')).toBe(9);
    expect(displayWidth('dk 2.55 ± 0.04 µ')).toBe(16);
    const text = 'let a = 1\n\tlet bb = 2\n';
    const line = { z0_ohm: 50, eps_eff: 2 };
    const result = sheetResult([entry(0, 'line', 'a', line, 9), entry(1, 'line', 'bb', line, 11)]);
    expect(annotateSheet(text, result)).toBe('let a = 1           # → Z0 50 Ω · εeff 2.000\n\tlet bb = 2  # → Z0 50 Ω · εeff 2.000\n');
  });

  it('keeps CRLF sheets on the same lines as the language service', () => {
    const result = sheetResult([entry(1, 'line', 'b', { z0_ohm: 50, eps_eff: 2 }, 9)]);
    expect(annotateSheet('let a = 1\r\nlet b = 2\r\n', result)).toBe('let a = 1\nlet b = 2  # → Z0 50 Ω · εeff 2.000\n');
  });

  it('handles an empty sheet and entries outside the text', () => {
    expect(annotateSheet('', EMPTY_RESULT)).toBe('\n');
    expect(annotateSheet('x', sheetResult([entry(7, 'let', 'gone', { value: 1 })]))).toBe('x\n');
  });
});

describe('text diagnostics', () => {
  it('prints FILE:LINE:COL: SEVERITY [CODE] MESSAGE, 1-based, in reading order', () => {
    expect(formatDiagnostics('demo.rfsheet', DEMO_RESULT)).toBe(
      'demo.rfsheet:6:1: warning [near-resonance] choke is 0.4 % from its λ/4 resonance at 2.44 GHz (margin 10 %)\n' +
        "demo.rfsheet:6:14: error [unknown-name] 'thin' is not declared: declare `line thin: …` or use an existing line\n",
    );
    expect(formatDiagnostics('x', EMPTY_RESULT)).toBe('');
  });

  it('keeps one diagnostic on one line', () => {
    const d = { range: at(0, 0, 1), severity: 'info' as const, code: 'limit' as const, message: 'first\r\n  second\nthird' };
    expect(formatDiagnosticLine('x', d)).toBe('x:1:1: info [limit] first second third');
  });

  it('counts and summarizes', () => {
    const counts = countDiagnostics([DEMO_RESULT, DEMO_RESULT, EMPTY_RESULT]);
    expect(counts).toEqual({ error: 2, warning: 2, info: 0 });
    expect(formatSummary(3, counts)).toBe('3 files: 2 errors, 2 warnings, 0 infos');
    expect(formatSummary(1, { error: 1, warning: 0, info: 1 })).toBe('1 file: 1 error, 0 warnings, 1 info');
  });
});

describe('JSON report', () => {
  const report = toJsonReport('sheets/demo.rfsheet', DEMO_RESULT);

  it('has the pinned shape with 1-based positions', () => {
    expect(Object.keys(report)).toEqual(['file', 'entries', 'diagnostics']);
    expect(report.entries[3]).toEqual({ line: 5, kind: 'line', name: 'feed', results: { z0_ohm: 50.01, eps_eff: 2.0912, width_m: 2.1934e-3 } });
    expect(report.diagnostics[0]).toEqual({
      line: 6, column: 1, endLine: 6, endColumn: 59, severity: 'warning', code: 'near-resonance',
      message: 'choke is 0.4 % from its λ/4 resonance at 2.44 GHz (margin 10 %)',
    });
    expect(report.diagnostics[1]?.related).toEqual([{ line: 5, column: 6, endLine: 5, endColumn: 10, message: 'a line declared here' }]);
  });

  it('turns non-finite numbers into null', () => {
    const r = toJsonReport('x', sheetResult([entry(0, 'stub', 's', { reactance: Infinity, x: Number.NaN, kind: 'open' })]));
    expect(r.entries[0]?.results).toEqual({ reactance: null, x: null, kind: 'open' });
  });

  it('prints an object for one file and an array for several', () => {
    expect(JSON.parse(renderJson([report], true))).toEqual(report);
    expect(JSON.parse(renderJson([report, report], false))).toEqual([report, report]);
    expect(JSON.parse(renderJson([report], false))).toEqual([report]);
    expect(renderJson([], false)).toBe('[]\n');
  });
});
