/**
 * Command-line parsing for `stubwright` (pure: argv in, a command or a usage error out).
 * Flags take `--flag value` or `--flag=value`; `--` ends the flags; a flag given twice is an error.
 */

/** Report formats of `check`. */
export type CheckFormat = 'text' | 'json' | 'sarif';

/** Sub-commands that have their own help text. */
export type Topic = 'eval' | 'check' | 'export' | 'plot';

const TOPICS: readonly Topic[] = ['eval', 'check', 'export', 'plot'];
const COMMANDS_TEXT = 'commands are eval, check, export and plot';

/** A parsed command line. */
export type CliCommand =
  | { kind: 'help'; topic?: Topic }
  | { kind: 'version' }
  | { kind: 'eval'; files: string[]; json: boolean; marginPct?: number }
  | { kind: 'check'; files: string[]; format: CheckFormat; strict: boolean; marginPct?: number; output?: string }
  | { kind: 'export'; file: string; name: string; format: 'touchstone' | 'csv'; output: string; ports?: 1 | 2; range: SweepRange; marginPct?: number }
  | { kind: 'plot'; file: string; name: string; output: string; view: 'frequency' | 'length'; lengthUnit?: 'mm' | 'mil'; range: SweepRange; marginPct?: number };

/** `--from`, `--to` (Hz, or m in the length view) and `--points` of export and plot. */
export interface SweepRange {
  from?: number;
  to?: number;
  points?: number;
}

/** `parseArgs` result: a command, or a one-line usage error (exit code 2). */
export type ParseResult = { ok: true; command: CliCommand } | { ok: false; message: string; topic?: Topic };

const SWEEP_FLAGS = ['--name', '--from', '--to', '--points', '--margin'] as const;
const VALUE_FLAGS: Record<Topic, readonly string[]> = {
  eval: ['--margin'],
  check: ['--margin', '--format', '--output'],
  export: [...SWEEP_FLAGS, '--touchstone', '--csv'],
  plot: [...SWEEP_FLAGS, '--svg', '--view', '--length-unit'],
};
const BOOLEAN_FLAGS: Record<Topic, readonly string[]> = { eval: ['--json'], check: ['--strict'], export: [], plot: [] };

const FREQUENCY_UNITS: Record<string, number> = { hz: 1, khz: 1e3, mhz: 1e6, ghz: 1e9, thz: 1e12 };
const LENGTH_UNITS: Record<string, number> = { m: 1, cm: 1e-2, mm: 1e-3, um: 1e-6, 'µm': 1e-6, mil: 25.4e-6, in: 25.4e-3 };

/**
 * Parses a positive frequency (`2.4GHz`, `2.4 GHz`, `2.4e9`: a bare number is Hz) or, with
 * `length`, a positive length with its unit (`12mm`, `500 mil`). Returns null when it is not one.
 */
export function parseQuantityArg(text: string, kind: 'frequency' | 'length'): number | null {
  const m = /^\s*\+?((?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)\s*([A-Za-zµ]*)\s*$/.exec(text);
  if (!m?.[1]) return null;
  const unit = m[2] ?? '';
  const units = kind === 'frequency' ? FREQUENCY_UNITS : LENGTH_UNITS;
  const scale = unit === '' ? (kind === 'frequency' ? 1 : undefined) : units[kind === 'frequency' ? unit.toLowerCase() : unit];
  if (scale === undefined) return null;
  const value = Number(m[1]) * scale;
  return Number.isFinite(value) && value > 0 ? value : null;
}

/**
 * Parses a resonance margin given on the command line: a percentage greater than 0 and at most 100,
 * optionally followed by `%` (`10`, `7.5`, `12%`). Returns null when it is not one.
 */
export function parseMarginPct(text: string): number | null {
  const m = /^\s*\+?((?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)\s*%?\s*$/.exec(text);
  if (!m?.[1]) return null;
  const value = Number(m[1]);
  return Number.isFinite(value) && value > 0 && value <= 100 ? value : null;
}

/** Parses `stubwright` arguments (without `node` and the script path). */
export function parseArgs(argv: readonly string[]): ParseResult {
  const [first, ...rest] = argv;
  if (first === undefined) return { ok: false, message: 'missing command: use `stubwright eval FILE…`, `stubwright check FILE…`, `stubwright export …` or `stubwright plot …`' };
  if (first === '--help' || first === '-h') return { ok: true, command: { kind: 'help' } };
  if (first === 'help') {
    const topic = rest[0];
    if (topic === undefined) return { ok: true, command: { kind: 'help' } };
    if ((TOPICS as readonly string[]).includes(topic)) return { ok: true, command: { kind: 'help', topic: topic as Topic } };
    return { ok: false, message: `no help for '${topic}': ${COMMANDS_TEXT}` };
  }
  if (first === '--version' || first === '-v') return { ok: true, command: { kind: 'version' } };
  if (!(TOPICS as readonly string[]).includes(first)) {
    const hint = first.startsWith('-') ? `unknown option '${first}'` : `unknown command '${first}'`;
    return { ok: false, message: `${hint}: ${COMMANDS_TEXT} (see stubwright --help)` };
  }
  return parseCommand(first as Topic, rest);
}

function parseCommand(topic: Topic, args: readonly string[]): ParseResult {
  const fail = (message: string): ParseResult => ({ ok: false, message, topic });
  const files: string[] = [];
  const values = new Map<string, string>();
  const booleans = new Set<string>();
  let flagsEnded = false;
  for (let i = 0; i < args.length; i++) {
    const arg = args[i] as string;
    if (flagsEnded || !arg.startsWith('-')) {
      files.push(arg);
      continue;
    }
    if (arg === '--') {
      flagsEnded = true;
      continue;
    }
    if (arg === '--help' || arg === '-h') return { ok: true, command: { kind: 'help', topic } };
    if (arg === '-') return fail("reading a sheet from standard input ('-') is not supported: give a file path");
    const eq = arg.indexOf('=');
    const name = eq >= 0 ? arg.slice(0, eq) : arg;
    if (BOOLEAN_FLAGS[topic].includes(name)) {
      if (eq >= 0) return fail(`${name} takes no value`);
      if (booleans.has(name)) return fail(`${name} given twice`);
      booleans.add(name);
      continue;
    }
    if (!VALUE_FLAGS[topic].includes(name)) return fail(`unknown option '${name}' for ${topic} (see stubwright ${topic} --help)`);
    if (values.has(name)) return fail(`${name} given twice`);
    let value: string | undefined;
    if (eq >= 0) value = arg.slice(eq + 1);
    else {
      const next = args[i + 1];
      if (next !== undefined && !next.startsWith('--')) {
        value = next;
        i++;
      }
    }
    if (value === undefined || value === '') return fail(`${name} needs a value`);
    values.set(name, value);
  }
  if (files.length === 0) return fail(`no sheet given: stubwright ${topic} FILE${topic === 'export' || topic === 'plot' ? ' --name NAME …' : '…'}`);

  let marginPct: number | undefined;
  const marginText = values.get('--margin');
  if (marginText !== undefined) {
    const parsed = parseMarginPct(marginText);
    if (parsed === null) {
      return fail(`--margin must be a percentage greater than 0 and at most 100, e.g. --margin 10 (got '${marginText}')`);
    }
    marginPct = parsed;
  }
  const withMargin = marginPct === undefined ? {} : { marginPct };
  if (topic === 'export' || topic === 'plot') return parseSweepCommand(topic, files, values, withMargin, fail);
  if (topic === 'eval') return { ok: true, command: { kind: 'eval', files, json: booleans.has('--json'), ...withMargin } };

  const formatText = values.get('--format') ?? 'text';
  if (formatText !== 'text' && formatText !== 'json' && formatText !== 'sarif') {
    return fail(`--format must be text, json or sarif (got '${formatText}')`);
  }
  const output = values.get('--output');
  return {
    ok: true,
    command: {
      kind: 'check', files, format: formatText, strict: booleans.has('--strict'), ...withMargin,
      ...(output === undefined ? {} : { output }),
    },
  };
}

/** `export FILE --name NAME --touchstone OUT|--csv OUT …` and `plot FILE --name NAME --svg OUT …`. */
function parseSweepCommand(
  topic: 'export' | 'plot', files: string[], values: Map<string, string>, withMargin: { marginPct?: number }, fail: (m: string) => ParseResult,
): ParseResult {
  if (files.length > 1) return fail(`${topic} takes one sheet, got ${files.length}: ${files.join(', ')}`);
  const file = files[0]!;
  const name = values.get('--name');
  if (name === undefined) return fail(`say which stub, line or sweep: --name NAME`);
  if (!/^[A-Za-z_][A-Za-z0-9_]*$/.test(name)) return fail(`--name takes a declared name, e.g. --name tune (got '${name}')`);
  let view: 'frequency' | 'length' = 'frequency';
  if (topic === 'plot') {
    const v = values.get('--view') ?? 'frequency';
    if (v !== 'frequency' && v !== 'length') return fail(`--view must be frequency or length (got '${v}')`);
    view = v;
  }
  const range: SweepRange = {};
  for (const flag of ['--from', '--to'] as const) {
    const text = values.get(flag);
    if (text === undefined) continue;
    const value = parseQuantityArg(text, view);
    if (value === null) {
      return fail(view === 'length'
        ? `${flag} in the length view is a positive length with its unit, e.g. ${flag} 5mm (got '${text}')`
        : `${flag} is a positive frequency, e.g. ${flag} 2.4GHz or ${flag} 2.4e9 (got '${text}')`);
    }
    range[flag === '--from' ? 'from' : 'to'] = value;
  }
  if (range.from !== undefined && range.to !== undefined && !(range.to > range.from)) return fail('--from must be below --to');
  const pointsText = values.get('--points');
  if (pointsText !== undefined) {
    const points = /^\d+$/.test(pointsText.trim()) ? Number(pointsText) : NaN;
    if (!(Number.isInteger(points) && points >= 2 && points <= 10001)) return fail(`--points is a whole number from 2 to 10001 (got '${pointsText}')`);
    range.points = points;
  }
  if (topic === 'plot') {
    const output = values.get('--svg');
    if (output === undefined) return fail('say where to write the picture: --svg OUT.svg');
    const unit = values.get('--length-unit');
    if (unit !== undefined && unit !== 'mm' && unit !== 'mil') return fail(`--length-unit must be mm or mil (got '${unit}')`);
    return { ok: true, command: { kind: 'plot', file, name, output, view, range, ...(unit ? { lengthUnit: unit } : {}), ...withMargin } };
  }
  const touchstone = values.get('--touchstone');
  const csv = values.get('--csv');
  if (touchstone !== undefined && csv !== undefined) return fail('give one of --touchstone OUT and --csv OUT');
  if (csv !== undefined) return { ok: true, command: { kind: 'export', file, name, format: 'csv', output: csv, range, ...withMargin } };
  if (touchstone === undefined) return fail('say what to write: --touchstone OUT.s1p (or .s2p) or --csv OUT.csv');
  const ext = /\.s([12])p$/i.exec(touchstone);
  if (!ext) return fail(`--touchstone wants a file name ending in .s1p (a one-port) or .s2p (a two-port), got '${touchstone}'`);
  return { ok: true, command: { kind: 'export', file, name, format: 'touchstone', output: touchstone, ports: ext[1] === '1' ? 1 : 2, range, ...withMargin } };
}
