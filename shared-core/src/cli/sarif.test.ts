import { describe, expect, it } from 'vitest';
import type { DiagnosticCode } from '../sheet/types.js';
import { RULE_DESCRIPTIONS, RULE_IDS } from './rules.js';
import { SARIF_SCHEMA, toSarif } from './sarif.js';
import { DEMO_RESULT, EMPTY_RESULT } from './testFixtures.js';

type Json = Record<string, any>;

describe('toSarif', () => {
  const log = toSarif([{ uri: 'sheets/demo.rfsheet', result: DEMO_RESULT }], { version: '1.2.3', srcRoot: 'file:///work/' }) as Json;
  const run = log['runs'][0] as Json;

  it('is a SARIF 2.1.0 log with one run of stubwright', () => {
    expect(log['$schema']).toBe(SARIF_SCHEMA);
    expect(log['version']).toBe('2.1.0');
    expect(log['runs']).toHaveLength(1);
    expect(run['tool'].driver).toMatchObject({ name: 'stubwright', version: '1.2.3' });
    expect(run['columnKind']).toBe('utf16CodeUnits');
    expect(run['originalUriBaseIds']).toEqual({ '%SRCROOT%': { uri: 'file:///work/' } });
    expect(run['invocations']).toEqual([{ executionSuccessful: true }]);
  });

  it('has one rule with a short description per diagnostic code', () => {
    const rules = run['tool'].driver.rules as Json[];
    expect(rules.map((r) => r['id'])).toEqual(RULE_IDS);
    for (const r of rules) expect(r['shortDescription'].text).toBe(RULE_DESCRIPTIONS[r['id'] as DiagnosticCode]);
    expect(new Set(RULE_IDS).size).toBe(RULE_IDS.length);
  });

  it('maps each diagnostic to a result with a 1-based region', () => {
    const results = run['results'] as Json[];
    expect(results).toHaveLength(2);
    expect(results[0]).toEqual({
      ruleId: 'near-resonance',
      ruleIndex: RULE_IDS.indexOf('near-resonance'),
      level: 'warning',
      message: { text: 'choke is 0.4 % from its λ/4 resonance at 2.44 GHz (margin 10 %)' },
      locations: [{
        physicalLocation: {
          artifactLocation: { uri: 'sheets/demo.rfsheet', uriBaseId: '%SRCROOT%' },
          region: { startLine: 6, startColumn: 1, endLine: 6, endColumn: 59 },
        },
      }],
    });
    expect(results[1]).toMatchObject({ ruleId: 'unknown-name', level: 'error' });
    expect(results[1]!['relatedLocations']).toEqual([{
      id: 0,
      message: { text: 'a line declared here' },
      physicalLocation: {
        artifactLocation: { uri: 'sheets/demo.rfsheet', uriBaseId: '%SRCROOT%' },
        region: { startLine: 5, startColumn: 6, endLine: 5, endColumn: 10 },
      },
    }]);
  });

  it('maps info to note, lists each artifact once and reports unreadable files as notifications', () => {
    const info = { ...EMPTY_RESULT, diagnostics: [{ ...DEMO_RESULT.diagnostics[0]!, severity: 'info' as const }] };
    const two = toSarif(
      [{ uri: 'a.rfsheet', result: info }, { uri: 'a.rfsheet', result: EMPTY_RESULT }],
      { version: '0.1.0', failures: [{ uri: 'missing.rfsheet', message: 'missing.rfsheet: no such file or directory' }] },
    ) as Json;
    const r = two['runs'][0] as Json;
    expect(r['results'][0].level).toBe('note');
    expect(r['results'][0].locations[0].physicalLocation.artifactLocation).toEqual({ uri: 'a.rfsheet' });
    expect(r['originalUriBaseIds']).toBeUndefined();
    expect(r['artifacts']).toEqual([{ location: { uri: 'a.rfsheet' } }, { location: { uri: 'missing.rfsheet' } }]);
    expect(r['invocations'][0]).toEqual({
      executionSuccessful: false,
      toolExecutionNotifications: [{
        level: 'error',
        message: { text: 'missing.rfsheet: no such file or directory' },
        locations: [{ physicalLocation: { artifactLocation: { uri: 'missing.rfsheet' } } }],
      }],
    });
  });
});
