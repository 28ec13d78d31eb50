/**
 * The `stubwright` command line as a function: argv and injected I/O in, exit code out.
 * Everything Node-specific arrives through `CliDeps` (see `nodeDeps.ts`), so tests run it in memory.
 *
 * Exit codes: 0 clean; 1 error diagnostics (with `check --strict`, warnings too; for `export` and
 * `plot`, errors on the named declaration's line that keep it from being swept);
 * 2 usage error (an unknown name included), unreadable input, unwritable output, or an internal failure.
 */
import { getExport, getPlot } from '../service/plot.js';
import { DEFAULT_SETTINGS, type EvaluatedDocument } from '../service/types.js';
import type { SheetOptions, SheetResult } from '../sheet/types.js';
import { annotateSheet } from './annotate.js';
import { parseArgs, type CliCommand } from './args.js';
import type { DecodeResult } from './decode.js';
import { helpText } from './help.js';
import { renderJson, toJsonReport } from './jsonReport.js';
import { toSarif } from './sarif.js';
import { countDiagnostics, formatDiagnostics, formatSummary } from './textReport.js';

/** What the command line needs from the outside world. */
export interface CliDeps {
  /** The sheet evaluator (`evaluateSheet` without the incremental `previous`). */
  evaluate(text: string, options: SheetOptions): SheetResult;
  /** Reads and decodes one sheet file; never throws. */
  readSheet(file: string): Promise<DecodeResult>;
  /** Writes `content` to `file` atomically; throws an Error with a readable message on failure. */
  writeFileAtomic(file: string, content: string): Promise<void>;
  stdout(text: string): void;
  stderr(text: string): void;
  /** SARIF artifact URI of a file as given (relative to `srcRoot`, `/`-separated, percent-encoded). */
  artifactUri(file: string): string;
  /** `file://` URI of the working directory, with a trailing slash. */
  srcRoot?: string;
  /** Version printed by `--version` and put in SARIF. */
  version: string;
  /**
   * True when two paths name the same file (after resolving, and following links where both
   * exist): `check --output`, `export` and `plot` refuse to write over a sheet they read.
   * Default: the same string (artifact URI for `check`).
   */
  sameFile?(a: string, b: string): Promise<boolean>;
}

/** Exit codes. */
export const EXIT = { ok: 0, problems: 1, usage: 2 } as const;

interface Evaluated {
  file: string;
  text: string;
  result: SheetResult;
}

interface Failure {
  file: string;
  message: string;
}

type SheetCommand = Extract<CliCommand, { kind: 'eval' | 'check' }>;
type SweepCommand = Extract<CliCommand, { kind: 'export' | 'plot' }>;

const errorText = (e: unknown): string => (e instanceof Error ? e.message : String(e));

async function evaluateFiles(cmd: SheetCommand, deps: CliDeps): Promise<{ done: Evaluated[]; failed: Failure[] }> {
  const options: SheetOptions = cmd.marginPct === undefined ? {} : { marginPct: cmd.marginPct };
  const done: Evaluated[] = [];
  const failed: Failure[] = [];
  for (const file of cmd.files) {
    const read = await deps.readSheet(file);
    if (!read.ok) {
      failed.push({ file, message: read.message });
      deps.stderr(`stubwright: ${file}: ${read.message}\n`);
      continue;
    }
    try {
      done.push({ file, text: read.text, result: deps.evaluate(read.text, options) });
    } catch (e) {
      const message = `internal error while evaluating (please report it with the sheet): ${errorText(e)}`;
      failed.push({ file, message });
      deps.stderr(`stubwright: ${file}: ${message}\n`);
    }
  }
  return { done, failed };
}

function exitCode(done: readonly Evaluated[], failed: readonly Failure[], strict: boolean): number {
  if (failed.length > 0) return EXIT.usage;
  const counts = countDiagnostics(done.map((d) => d.result));
  return counts.error > 0 || (strict && counts.warning > 0) ? EXIT.problems : EXIT.ok;
}

function evalText(done: readonly Evaluated[], several: boolean): string {
  return done
    .map(({ file, text, result }) => {
      const header = several ? `==> ${file} <==\n` : '';
      const diagnostics = formatDiagnostics(file, result);
      return `${header}${annotateSheet(text, result)}${diagnostics ? `\n${diagnostics}` : ''}`;
    })
    .join('\n');
}

function checkReport(cmd: Extract<CliCommand, { kind: 'check' }>, done: Evaluated[], failed: Failure[], deps: CliDeps): string | null {
  const single = cmd.files.length === 1;
  if (cmd.format === 'text') return done.map((d) => formatDiagnostics(d.file, d.result)).join('');
  if (cmd.format === 'json') {
    return single && done.length === 0 ? null : renderJson(done.map((d) => toJsonReport(d.file, d.result)), single);
  }
  const sarif = toSarif(
    done.map((d) => ({ uri: deps.artifactUri(d.file), result: d.result })),
    {
      version: deps.version,
      ...(deps.srcRoot === undefined ? {} : { srcRoot: deps.srcRoot }),
      failures: failed.map((f) => ({ uri: deps.artifactUri(f.file), message: `${f.file}: ${f.message}` })),
    },
  );
  return `${JSON.stringify(sarif, null, 2)}\n`;
}

/** The input sheet that `output` would overwrite, if any. */
async function inputAt(output: string, files: readonly string[], deps: CliDeps): Promise<string | undefined> {
  const same = deps.sameFile ?? (async (a: string, b: string) => deps.artifactUri(a) === deps.artifactUri(b));
  for (const file of files) if (await same(output, file)) return file;
  return undefined;
}

/** Runs `stubwright` with `argv` (without `node` and the script) and returns the exit code. Never throws. */
export async function runCli(argv: readonly string[], deps: CliDeps): Promise<number> {
  const parsed = parseArgs(argv);
  if (!parsed.ok) {
    const more = parsed.topic ? `stubwright ${parsed.topic} --help` : 'stubwright --help';
    deps.stderr(`stubwright: ${parsed.message}\nTry '${more}' for usage.\n`);
    return EXIT.usage;
  }
  const cmd = parsed.command;
  if (cmd.kind === 'help') {
    deps.stdout(helpText(cmd.topic));
    return EXIT.ok;
  }
  if (cmd.kind === 'version') {
    deps.stdout(`${deps.version}\n`);
    return EXIT.ok;
  }
  if (cmd.kind === 'export' || cmd.kind === 'plot') return runSweepCommand(cmd, deps);
  if (cmd.kind === 'check' && cmd.output !== undefined) {
    const clash = await inputAt(cmd.output, cmd.files, deps);
    if (clash !== undefined) {
      deps.stderr(`stubwright: --output ${cmd.output} is the sheet ${clash}: refusing to overwrite it with a report\n`);
      return EXIT.usage;
    }
  }
  const { done, failed } = await evaluateFiles(cmd, deps);
  if (cmd.kind === 'eval') {
    const single = cmd.files.length === 1;
    if (cmd.json) {
      if (!(single && done.length === 0)) deps.stdout(renderJson(done.map((d) => toJsonReport(d.file, d.result)), single));
    } else if (done.length > 0) deps.stdout(evalText(done, !single));
    return exitCode(done, failed, false);
  }

  const report = checkReport(cmd, done, failed, deps);
  const counts = countDiagnostics(done.map((d) => d.result));
  const summary = formatSummary(done.length, counts);
  if (cmd.output !== undefined) {
    if (report !== null) {
      try {
        await deps.writeFileAtomic(cmd.output, report);
      } catch (e) {
        deps.stderr(`stubwright: cannot write ${cmd.output}: ${errorText(e)}\n`);
        return EXIT.usage;
      }
      deps.stderr(`stubwright: wrote ${cmd.output} (${summary})\n`);
    }
  } else {
    if (report) deps.stdout(report);
    if (cmd.format === 'text' && counts.error + counts.warning + counts.info > 0) deps.stderr(`${summary}\n`);
  }
  return exitCode(done, failed, cmd.strict);
}

/** `export` and `plot`: evaluate one sheet, sweep one declaration, write one file atomically. */
async function runSweepCommand(cmd: SweepCommand, deps: CliDeps): Promise<number> {
  const fail = (message: string, code: number = EXIT.usage) => {
    deps.stderr(`stubwright: ${message}\n`);
    return code;
  };
  const same = deps.sameFile ?? (async (a: string, b: string) => a === b);
  if (await same(cmd.output, cmd.file)) return fail(`refusing to write ${cmd.output}: it is the sheet being read; choose another output file`);
  const read = await deps.readSheet(cmd.file);
  if (!read.ok) return fail(`${cmd.file}: ${read.message}`);
  let result: SheetResult;
  try {
    result = deps.evaluate(read.text, cmd.marginPct === undefined ? {} : { marginPct: cmd.marginPct });
  } catch (e) {
    return fail(`${cmd.file}: internal error while evaluating (please report it with the sheet): ${errorText(e)}`);
  }
  const settings = { ...DEFAULT_SETTINGS, ...(cmd.marginPct === undefined ? {} : { marginPct: cmd.marginPct }), ...(cmd.kind === 'plot' && cmd.lengthUnit ? { lengthUnit: cmd.lengthUnit } : {}) };
  const doc: EvaluatedDocument = { text: read.text, lines: read.text.split(/\r\n|\r|\n/), result, settings };
  const { from, to, points } = cmd.range;
  const made = cmd.kind === 'plot'
    ? getPlot(doc, cmd.name, cmd.view === 'length'
      ? { view: 'length', ...(from === undefined ? {} : { fromM: from }), ...(to === undefined ? {} : { toM: to }), ...(points === undefined ? {} : { points }) }
      : { view: 'frequency', ...(from === undefined ? {} : { fromHz: from }), ...(to === undefined ? {} : { toHz: to }), ...(points === undefined ? {} : { points }) })
    : getExport(doc, cmd.name, cmd.format, {
      ...(from === undefined ? {} : { fromHz: from }), ...(to === undefined ? {} : { toHz: to }), ...(points === undefined ? {} : { points }),
      ...(cmd.ports === undefined ? {} : { ports: cmd.ports }), source: cmd.file,
    });
  if ('error' in made) {
    const entry = result.entries.find((e) => e.name === cmd.name);
    if (!entry) return fail(`${cmd.file}: ${made.error}`);
    const errors = result.diagnostics.filter((d) => d.severity === 'error' && d.range.start.line === entry.line);
    deps.stderr(`${cmd.file}:${entry.line + 1}:${entry.nameRange.start.character + 1}: error ${made.error}\n`);
    if (errors.length > 0) deps.stderr(formatDiagnostics(cmd.file, { ...result, diagnostics: errors }));
    return errors.length > 0 ? EXIT.problems : EXIT.usage;
  }
  const content = 'svg' in made ? made.svg : made.text;
  try {
    await deps.writeFileAtomic(cmd.output, content);
  } catch (e) {
    return fail(`cannot write ${cmd.output}: ${errorText(e)}`);
  }
  deps.stderr(`stubwright: wrote ${cmd.output} (${'svg' in made ? made.title : `${cmd.kind === 'export' ? cmd.format : ''} of ${cmd.name}`})\n`);
  return EXIT.ok;
}
