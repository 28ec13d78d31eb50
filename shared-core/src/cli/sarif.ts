/**
 * SARIF 2.1.0 report (OASIS Static Analysis Results Interchange Format; schema
 * https://json.schemastore.org/sarif-2.1.0.json). Pure: paths arrive already as relative URIs.
 * One run; one rule per diagnostic code; regions are 1-based with exclusive end columns in
 * UTF-16 code units (`columnKind: utf16CodeUnits`), exactly the LSP range plus one.
 */
import type { Range, SheetResult, Severity } from '../sheet/types.js';
import { sortDiagnostics } from './jsonReport.js';
import { RULE_DESCRIPTIONS, RULE_IDS } from './rules.js';

/** `$schema` of the log. */
export const SARIF_SCHEMA = 'https://json.schemastore.org/sarif-2.1.0.json';

/** One evaluated sheet with its artifact URI (relative, `/`-separated, percent-encoded). */
export interface SarifInput {
  uri: string;
  result: SheetResult;
}

/** A file that could not be read, reported as a tool execution notification. */
export interface SarifFailure {
  uri: string;
  message: string;
}

/** Run-wide settings. */
export interface SarifOptions {
  version: string;
  /** `file://` URI of the directory the relative URIs start from (with a trailing slash). */
  srcRoot?: string;
  failures?: readonly SarifFailure[];
}

const LEVEL: Record<Severity, 'error' | 'warning' | 'note'> = { error: 'error', warning: 'warning', info: 'note' };

function region(r: Range): Record<string, number> {
  return {
    startLine: r.start.line + 1,
    startColumn: r.start.character + 1,
    endLine: r.end.line + 1,
    endColumn: r.end.character + 1,
  };
}

/** Builds the SARIF log object (serialize with `JSON.stringify`). */
export function toSarif(inputs: readonly SarifInput[], opts: SarifOptions): Record<string, unknown> {
  const base = opts.srcRoot === undefined ? {} : { uriBaseId: '%SRCROOT%' };
  const artifact = (uri: string): Record<string, unknown> => ({ uri, ...base });
  const results = inputs.flatMap(({ uri, result }) =>
    sortDiagnostics(result.diagnostics).map((d) => ({
      ruleId: d.code,
      ruleIndex: RULE_IDS.indexOf(d.code),
      level: LEVEL[d.severity],
      message: { text: d.message },
      locations: [{ physicalLocation: { artifactLocation: artifact(uri), region: region(d.range) } }],
      ...(d.related && d.related.length > 0
        ? {
            relatedLocations: d.related.map((r, id) => ({
              id,
              message: { text: r.message },
              physicalLocation: { artifactLocation: artifact(uri), region: region(r.range) },
            })),
          }
        : {}),
    })),
  );
  const failures = opts.failures ?? [];
  const run: Record<string, unknown> = {
    tool: {
      driver: {
        name: 'stubwright',
        version: opts.version,
        semanticVersion: opts.version,
        rules: RULE_IDS.map((id) => ({ id, shortDescription: { text: RULE_DESCRIPTIONS[id] } })),
      },
    },
    ...(opts.srcRoot === undefined ? {} : { originalUriBaseIds: { '%SRCROOT%': { uri: opts.srcRoot } } }),
    // `artifacts` must hold unique items: a file named twice is listed once.
    artifacts: [...new Set([...inputs.map((i) => i.uri), ...failures.map((f) => f.uri)])].map((uri) => ({
      location: artifact(uri),
    })),
    invocations: [
      {
        executionSuccessful: failures.length === 0,
        ...(failures.length === 0
          ? {}
          : {
              toolExecutionNotifications: failures.map((f) => ({
                level: 'error',
                message: { text: f.message },
                locations: [{ physicalLocation: { artifactLocation: artifact(f.uri) } }],
              })),
            }),
      },
    ],
    columnKind: 'utf16CodeUnits',
    results,
  };
  return { $schema: SARIF_SCHEMA, version: '2.1.0', runs: [run] };
}
