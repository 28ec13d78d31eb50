/** Help texts of the `stubwright` command line (pure). */
import type { Topic } from './args.js';

const OVERVIEW = `Usage: stubwright <command> [options] FILE...

Evaluates and checks *.rfsheet design notes: line impedance, effective permittivity,
stub reactance, equivalent L and C, and how close each stub sits to a resonance.

Commands:
  eval FILE...     print each sheet with its key results as aligned trailing notes
  check FILE...    report diagnostics (for editors and CI)
  export FILE --name NAME --touchstone OUT.s1p|OUT.s2p | --csv OUT.csv
                   write a sweep of a stub, line section or line (Touchstone 1.1 or CSV)
  plot FILE --name NAME --svg OUT.svg
                   draw a stub's reactance and equivalent L or C (or a line) as SVG

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

const SWEEP_OPTIONS = `  --name NAME      the stub, line or sweep (a "sweep NAME: of …" declaration) to use
  --from F, --to F frequency range (2.4GHz, 2.4 GHz, 2.4e9; a bare number is Hz); default:
                   the sweep's range, else a span around the stub's "at" that shows the
                   resonances on either side of it with room around both (its band included),
                   or 0.02 … 2 × a line's "at" (without one: around the "at" of its stubs)
  --points N       number of points, evenly spaced, ends included, 2 … 10001 (default: the
                   sweep's, else 401)
${MARGIN}`;

const EXPORT = `Usage: stubwright export FILE --name NAME (--touchstone OUT | --csv OUT)
                         [--from F] [--to F] [--points N] [--margin PCT]

Writes a frequency sweep of one declaration to OUT, atomically (a temporary file, then a
rename); nothing else is written, and OUT may not be the sheet itself.
  --touchstone OUT.s1p  Touchstone 1.1 one-port: a stub from its input to ground
  --touchstone OUT.s2p  Touchstone 1.1 two-port: a stub in shunt across a through line, or a
                        line section (a sweep of a line with a length)
  --csv OUT.csv         CSV, SI units: a stub's R, X, L or C and S11; a section's S-parameters;
                        a line's Z0, εeff and loss
S-parameters are referred to the sweep's "ref" (default 50 Ω), stated in the option line
("# Hz S RI R 50"); the "!" header says what was swept.

Options:
${SWEEP_OPTIONS}
  -h, --help       show this help

Exit status: 0 written, 1 the declaration has errors, 2 usage, name, file or write error.
`;

const PLOT = `Usage: stubwright plot FILE --name NAME --svg OUT [--view frequency|length]
                       [--from F] [--to F] [--points N] [--length-unit mm|mil] [--margin PCT]

Draws the same picture as the editor's plot panel, as a self-contained SVG file (no script,
nothing loaded from elsewhere; its own background, white outside an editor), written
atomically to OUT.
  stub   reactance X (and resistance R on a lossy line) and the equivalent L or C, over
         frequency; resonances marked and labelled, the band shaded, the operating point shown
  line   Z0, εeff and loss over frequency; a sweep of a line section: |S11| and |S21| in dB

Options:
  --svg OUT        where to write the picture
  --view VIEW      frequency (default) or length: a stub's X over its drawn length at its "at";
                   then --from and --to are lengths with a unit (5mm, 200mil)
  --length-unit U  mm (default) or mil, for lengths on the picture
${SWEEP_OPTIONS}
  -h, --help       show this help

Exit status: 0 written, 1 the declaration has errors, 2 usage, name, file or write error.
`;

/** The help text for a command, or the overview. */
export function helpText(topic?: Topic): string {
  if (topic === 'eval') return EVAL;
  if (topic === 'check') return CHECK;
  if (topic === 'export') return EXPORT;
  if (topic === 'plot') return PLOT;
  return OVERVIEW;
}
