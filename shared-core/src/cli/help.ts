/** Help texts of the `stubwright` command line (pure). */
import type { Topic } from './args.js';

const OVERVIEW = `Usage: stubwright <command> [options] FILE...

Evaluates and checks *.rfsheet design notes: line impedance, effective permittivity,
stub reactance, equivalent L and C, and how close each stub sits to a resonance.

Commands:
  eval FILE...     print each sheet with its key results as aligned trailing notes
  check FILE...    report diagnostics (for editors and CI)

Options:
  -h, --help       show help (also: stubwright <command> --help, stubwright help <command>)
  -v, --version    print the version

FILE is a UTF-8 text file of at most 1 MiB.
Exit status: 0 clean, 1 errors found (check --strict: warnings too), 2 usage or file error.
Results are design estimates: confirm them by measurement before relying on them.
`;

const MARGIN = `  --margin PCT     resonance margin in percent, greater than 0 and at most 100 (default 10):
                   a stub closer than this to a resonance is reported`;

const JSON_SHAPE = `JSON (stable; keys are only ever added): for one FILE an object, for several FILEs an
array of such objects in the order given (files that cannot be read are left out and
reported on stderr):
  {"file", "entries": [{"line", "kind", "name", "results": {...SI numbers...}}],
   "diagnostics": [{"line", "column", "endLine", "endColumn", "severity", "code", "message"}]}
Lines and columns are 1-based (columns count UTF-16 code units; end column is exclusive).`;

const EVAL = `Usage: stubwright eval [--json] [--margin PCT] FILE...

Prints each sheet unchanged, with the key figures of each declaration appended as a
trailing comment at an aligned column (line: Z0, εeff, width; stub: length, X, L or C,
margin to the nearest resonance; let: its value), then the diagnostics of that file.
Several FILEs are separated by a "==> FILE <==" header.

Options:
  --json           print the results as JSON instead (see below)
${MARGIN}
  -h, --help       show this help

Exit status: 0 no errors, 1 errors in a sheet, 2 usage or file error.

${JSON_SHAPE}
`;

const CHECK = `Usage: stubwright check [--format text|json|sarif] [--strict] [--margin PCT]
                        [--output FILE] FILE...

Reports the diagnostics of each sheet.
  text   one line per diagnostic: FILE:LINE:COL: SEVERITY [CODE] MESSAGE (1-based)
  json   the same JSON as \`stubwright eval --json\` (see below)
  sarif  SARIF 2.1.0, one run, a rule per diagnostic code (for code-scanning tools)

Options:
  --format FORMAT  text (default), json or sarif
  --strict         warnings fail the check too (exit 1)
${MARGIN}
  --output FILE    write the report to FILE (atomically) instead of standard output;
                   without it nothing is ever written to disk
  -h, --help       show this help

Exit status: 0 clean, 1 errors (or warnings with --strict), 2 usage or file error.

${JSON_SHAPE}
`;

/** The help text for a command, or the overview. */
export function helpText(topic?: Topic): string {
  if (topic === 'eval') return EVAL;
  if (topic === 'check') return CHECK;
  return OVERVIEW;
}
