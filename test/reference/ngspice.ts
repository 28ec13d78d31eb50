/**
 * ngspice as an independent reference for one-port input impedances.
 *
 * ngspice is a general-purpose open-source circuit simulator. `ngspiceInputImpedance` writes a
 * netlist to a temporary directory, drives node `in` with a 1 A AC current source (V(in) = Zin) or a
 * 1 V AC source (Zin = −1/I(Vdrive); SPICE counts a source's current as flowing in at its + node),
 * runs `ngspice -b` with a `.control` block of AC analyses, and parses the `wrdata` rows back.
 *
 * The builders use the element syntax of the ngspice User's Manual, chapter on transmission lines:
 * `T` (lossless line, Z0 and TD) and `O` with an `LTRA` model (R, L, G, C, LEN).
 * ngspice-39 behaviour found by running it, kept here so callers need not rediscover it:
 *  - LTRA refuses a line with both series and shunt loss ("Nonzero G (except RG) line not supported
 *    yet"): only LC, RLC, RC and RG lines run. Its AC load is the exact exponential form, so an RLC
 *    LTRA line is a reference to round-off.
 *  - TXL has no real AC model: AC analysis reads back a constant √(L/C) whatever the length and
 *    termination. CPL gives a singular matrix in AC. Neither is usable here.
 *  - A general RLGC line therefore needs a lumped ladder (`rlgcLadder`), whose error is of order
 *    (βΔ)²; extrapolate from several ladders. ngspice's own solution of a long ladder drifts from an
 *    exact ladder recursion by about 1e-9 (100 sections) to 6e-7 (1600 sections).
 *  - Every AC analysis first solves a DC operating point, which must exist even though it does not
 *    affect a linear AC result. An open line driven by a current source has no DC path to ground
 *    (gmin stepping; an open LTRA line fails outright); a shorted LC line driven by a voltage source
 *    closes a loop of voltage sources through the line's DC short (singular). Hence the drive is
 *    chosen per termination (`OnePort.drive`). `.options noopac` would skip the operating point, but
 *    ngspice honours it only for circuits of R, L and C alone.
 *  - `ac lin 2 f1 f2` analyses f1 only.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Complex } from '../../shared-core/src/engine/complex.js';

/** Result of looking for the ngspice binary. */
export type NgspiceProbe =
  | { readonly available: true; readonly binary: string; readonly version: string }
  | { readonly available: false; readonly binary: string; readonly reason: string };

/** How the far end of a line is terminated. */
export type Termination = 'short' | 'open';

/** Per-unit-length line parameters: Ω/m, H/m, S/m, F/m; length in m. */
export interface Rlgc {
  readonly r: number;
  readonly l: number;
  readonly g: number;
  readonly c: number;
  readonly lengthM: number;
}

/** One AC point read back from ngspice. */
export interface AcPoint {
  readonly frequencyHz: number;
  /** Input impedance seen at node `in`, Ω. */
  readonly z: Complex;
}

const DEFAULT_BINARY = 'ngspice';

/**
 * Look for ngspice (`$NGSPICE` or `ngspice` on PATH) and read its version banner.
 * Never throws: a missing or broken binary is reported with a reason.
 */
export function probeNgspice(binary: string = process.env.NGSPICE ?? DEFAULT_BINARY): NgspiceProbe {
  const run = spawnSync(binary, ['-v'], { encoding: 'utf8', timeout: 10_000 });
  if (run.error) {
    const code = (run.error as NodeJS.ErrnoException).code;
    const reason = code === 'ENOENT' ? 'ngspice not installed' : `ngspice failed to start: ${run.error.message}`;
    return { available: false, binary, reason };
  }
  const version = /ngspice-[\w.]+/.exec(`${run.stdout}${run.stderr}`)?.[0];
  if (version === undefined) return { available: false, binary, reason: 'ngspice -v printed no version banner' };
  return { available: true, binary, version };
}

/** A number in a form ngspice reads back exactly (17 significant digits, no unit suffix). */
export const spiceNumber = (x: number): string => {
  if (!Number.isFinite(x)) throw new RangeError(`not a finite netlist value: ${x}`);
  return x.toExponential(16);
};

/** How node `in` is driven: a 1 A current source (V(in) = Zin) or a 1 V source (Zin = −1/I). */
export type Drive = 'current' | 'voltage';

/** A one-port between node `in` and ground `0`, with the drive under which its DC point exists. */
export interface OnePort {
  /** Netlist cards (elements and models); may use internal nodes other than `in` and `0`. */
  readonly cards: string;
  readonly drive: Drive;
}

/**
 * A line from `in` to `out` closed by `termination`: a 0 V source at `out` for a short (driven by a
 * current source, the short being the DC path to ground), nothing for an open (driven by a voltage
 * source, which is then the DC path).
 */
function terminated(lineCards: readonly string[], termination: Termination): OnePort {
  return termination === 'short'
    ? { cards: [...lineCards, 'Vshort out 0 DC 0'].join('\n'), drive: 'current' }
    : { cards: lineCards.join('\n'), drive: 'voltage' };
}

/** Lossless `T` line of impedance `z0` and delay `delayS` (ngspice User's Manual, lossless transmission lines). */
export function losslessLine(z0: number, delayS: number, termination: Termination): OnePort {
  return terminated([`T1 in 0 out 0 Z0=${spiceNumber(z0)} TD=${spiceNumber(delayS)}`], termination);
}

/**
 * `O` element with an LTRA model (ngspice User's Manual, lossy transmission lines).
 * ngspice-39 rejects R > 0 together with G > 0; use `rlgcLadder` for that case.
 */
export function ltraLine(line: Rlgc, termination: Termination): OnePort {
  const { r, l, g, c, lengthM } = line;
  const model = `.model stubline LTRA R=${spiceNumber(r)} L=${spiceNumber(l)} G=${spiceNumber(g)} C=${spiceNumber(c)} LEN=${spiceNumber(lengthM)}`;
  return terminated(['O1 in 0 out 0 stubline', model], termination);
}

/**
 * A line as `sections` symmetric T sections (series RΔ/2 + LΔ/2, shunt GΔ ∥ CΔ, series RΔ/2 + LΔ/2,
 * adjacent halves merged). Its input impedance tends to the distributed line's with an error in even
 * powers of 1/sections only (the T section's image impedance and propagation constant are functions
 * of (γΔ)²), so Richardson extrapolation works. For an open end the last half-series element carries
 * no current and is left out.
 */
export function rlgcLadder(line: Rlgc, sections: number, termination: Termination): OnePort {
  if (!Number.isInteger(sections) || sections < 1) throw new RangeError(`sections must be a positive integer: ${sections}`);
  const d = line.lengthM / sections;
  const cards: string[] = [];
  const series = (name: string, from: string, to: string, fraction: number): void => {
    const mid = `${name}m`;
    if (line.r > 0) cards.push(`R${name} ${from} ${mid} ${spiceNumber(line.r * d * fraction)}`);
    cards.push(`L${name} ${line.r > 0 ? mid : from} ${to} ${spiceNumber(line.l * d * fraction)}`);
  };
  series('s0', 'in', 'n1', 0.5);
  for (let k = 1; k <= sections; k++) {
    const node = `n${k}`;
    cards.push(`C${k} ${node} 0 ${spiceNumber(line.c * d)}`);
    if (line.g > 0) cards.push(`Rg${k} ${node} 0 ${spiceNumber(1 / (line.g * d))}`);
    if (k < sections) series(`s${k}`, node, `n${k + 1}`, 1);
  }
  if (termination === 'short') series(`s${sections}`, `n${sections}`, 'out', 0.5);
  return terminated(cards, termination);
}

/** A linear AC sweep: `points` frequencies from `startHz` to `stopHz` inclusive (one point: start = stop). */
export interface AcSweep {
  readonly startHz: number;
  readonly stopHz: number;
  readonly points: number;
}

/** Single-frequency sweeps at each of `frequenciesHz`. Each is its own analysis, so use few. */
export const atFrequencies = (frequenciesHz: readonly number[]): AcSweep[] =>
  frequenciesHz.map((f) => ({ startHz: f, stopHz: f, points: 1 }));

/** Options for `ngspiceInputImpedance`. */
export interface RunOptions {
  readonly binary?: string;
  readonly timeoutMs?: number;
}

/**
 * Input impedance of `port` over `sweeps`, from ngspice AC analysis, in sweep order. Each point
 * carries the frequency ngspice itself used (printed with 17 significant digits, so it round-trips
 * exactly). Throws with ngspice's own messages when it reports an error or warning (`quit 0` makes
 * the exit status useless for that), or when the rows read back do not fit the sweeps.
 */
export function ngspiceInputImpedance(port: OnePort, sweeps: readonly AcSweep[], options: RunOptions = {}): AcPoint[] {
  if (sweeps.length === 0) return [];
  for (const s of sweeps) {
    // ngspice-39 quirk, found by running it: `ac lin 2 f1 f2` analyses f1 only. Refuse 2 points.
    const ok =
      Number.isInteger(s.points) && s.points >= 1 && s.points !== 2 && s.startHz > 0 &&
      (s.points === 1 ? s.stopHz === s.startHz : s.stopHz > s.startHz);
    if (!ok) throw new RangeError(`bad AC sweep ${JSON.stringify(s)} (1 point with start = stop, or 3 or more)`);
  }
  const dir = mkdtempSync(join(tmpdir(), 'stubwright-ngspice-'));
  try {
    const zin = port.drive === 'current' ? 'v(in)' : '-1/i(vdrive)';
    const analyses = sweeps.flatMap((s) => [
      `ac lin ${s.points} ${spiceNumber(s.startHz)} ${spiceNumber(s.stopHz)}`,
      `wrdata zin.txt ${zin}`,
    ]);
    const netlist = [
      '* stubwright ngspice cross-check',
      port.drive === 'current' ? 'Idrive 0 in DC 0 AC 1' : 'Vdrive in 0 DC 0 AC 1',
      port.cards,
      '.control',
      'set noaskquit',
      'set numdgt=16',
      'set appendwrite',
      ...analyses,
      'quit 0',
      '.endc',
      '.end',
      '',
    ].join('\n');
    writeFileSync(join(dir, 'stub.cir'), netlist);
    const run = spawnSync(options.binary ?? DEFAULT_BINARY, ['-b', 'stub.cir'], {
      cwd: dir,
      encoding: 'utf8',
      timeout: options.timeoutMs ?? 30_000,
    });
    if (run.error) throw new Error(`ngspice did not run: ${run.error.message}`);
    const log = `${run.stdout ?? ''}\n${run.stderr ?? ''}`;
    const problems = log.split('\n').filter((line) => /error|abort|singular|warning/i.test(line));
    if (run.status !== 0 || problems.length > 0) {
      throw new Error(`ngspice exit ${run.status}: ${problems.join(' | ') || log.trim()}`);
    }
    return parseWrdata(readFileSync(join(dir, 'zin.txt'), 'utf8'), sweeps);
  } finally {
    if (process.env.KEEP_NGSPICE) process.stderr.write(`ngspice netlist kept in ${dir}\n`);
    else rmSync(dir, { recursive: true, force: true });
  }
}

/**
 * Parse `wrdata` rows of `frequency re im` and check they fit `sweeps`: the right count, and each
 * row on its sweep's linear grid to 1e-12 relative.
 */
export function parseWrdata(text: string, sweeps: readonly AcSweep[]): AcPoint[] {
  const rows = text
    .split('\n')
    .map((line) => line.trim())
    .filter((line) => line.length > 0)
    .map((line) => line.split(/\s+/).map(Number));
  const expected = sweeps.flatMap((s) =>
    Array.from({ length: s.points }, (_, i) => (s.points === 1 ? s.startHz : s.startHz + ((s.stopHz - s.startHz) * i) / (s.points - 1))),
  );
  if (rows.length !== expected.length) throw new Error(`ngspice wrote ${rows.length} rows, expected ${expected.length}`);
  return rows.map((row, i) => {
    const [f, re, im] = row;
    const want = expected[i] as number;
    if (row.length !== 3 || f === undefined || re === undefined || im === undefined || row.some((x) => !Number.isFinite(x))) {
      throw new Error(`unreadable ngspice row ${i}: ${row.join(' ')}`);
    }
    if (Math.abs(f - want) > 1e-12 * want) throw new Error(`ngspice row ${i} is at ${f} Hz, expected ${want} Hz`);
    return { frequencyHz: f, z: { re, im } };
  });
}
