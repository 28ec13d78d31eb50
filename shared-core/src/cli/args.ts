/**
 * Command-line parsing for `stubwright` (pure: argv in, a command or a usage error out).
 * Flags take `--flag value` or `--flag=value`; `--` ends the flags; a flag given twice is an error.
 */

/** Report formats of `check`. */
export type CheckFormat = 'text' | 'json' | 'sarif';

/** Sub-commands that have their own help text. */
export type Topic = 'eval' | 'check';

/** A parsed command line. */
export type CliCommand =
  | { kind: 'help'; topic?: Topic }
  | { kind: 'version' }
  | { kind: 'eval'; files: string[]; json: boolean; marginPct?: number }
  | { kind: 'check'; files: string[]; format: CheckFormat; strict: boolean; marginPct?: number; output?: string };

/** `parseArgs` result: a command, or a one-line usage error (exit code 2). */
export type ParseResult = { ok: true; command: CliCommand } | { ok: false; message: string; topic?: Topic };

const VALUE_FLAGS: Record<Topic, readonly string[]> = { eval: ['--margin'], check: ['--margin', '--format', '--output'] };
const BOOLEAN_FLAGS: Record<Topic, readonly string[]> = { eval: ['--json'], check: ['--strict'] };

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
  if (first === undefined) return { ok: false, message: 'missing command: use `stubwright eval FILE…` or `stubwright check FILE…`' };
  if (first === '--help' || first === '-h') return { ok: true, command: { kind: 'help' } };
  if (first === 'help') {
    const topic = rest[0];
    if (topic === undefined) return { ok: true, command: { kind: 'help' } };
    if (topic === 'eval' || topic === 'check') return { ok: true, command: { kind: 'help', topic } };
    return { ok: false, message: `no help for '${topic}': commands are eval and check` };
  }
  if (first === '--version' || first === '-v') return { ok: true, command: { kind: 'version' } };
  if (first !== 'eval' && first !== 'check') {
    const hint = first.startsWith('-') ? `unknown option '${first}'` : `unknown command '${first}'`;
    return { ok: false, message: `${hint}: commands are eval and check (see stubwright --help)` };
  }
  return parseCommand(first, rest);
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
  if (files.length === 0) return fail(`no sheet given: stubwright ${topic} FILE…`);

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
