/**
 * Evaluation of `sweep` declarations: a stub, or a section of a line, over a frequency range.
 *
 *   sweep wide: of trap, over 1 GHz .. 6 GHz, points 201
 *   sweep feedsec: of feed, length 12 mm, over 0.5 GHz .. 8 GHz
 *
 * A stub sweep defaults to the span a plot of the stub shows (around its `at`, its band included);
 * a line sweep needs the section `length`, and `over` unless the line has an `at`. The results are
 * a summary (scalars, like every result); the points themselves go to plots and exports, computed
 * by the same engine functions (plot/sweep.ts).
 */
import { abcdToS } from '../../plot/sparams.js';
import {
  DEFAULT_POINTS, defaultLineSpan, defaultStubSpan, lineSectionAbcd, linearGrid, resonanceCount, stubResonances, sweepStubFrequency,
} from '../../plot/sweep.js';
import { cabs, type Resonance } from '../../engine/index.js';
import { formatQuantity } from '../format.js';
import type { ParsedDeclaration } from '../parse/lineParser.js';
import { SWEEP_KEYS } from '../schema.js';
import { finish } from './declarations.js';
import { readItems, si } from './items.js';
import type { LineBuild } from './lineTypes.js';
import type { Outcome } from './outcome.js';
import type { StubBuild } from './stubPoint.js';
import { ValueReader, type SheetScope } from './values.js';

/** A sweep as evaluated: its target and range. */
export interface SweepBuild {
  /** Name of the stub or line swept. */
  target: string;
  targetKind: 'stub' | 'line';
  stub?: StubBuild;
  line?: LineBuild;
  fromHz: number;
  toHz: number;
  points: number;
  /** Length of the line section (line sweeps only), m. */
  lengthM: number | null;
  /** Reference impedance of exported S-parameters, Ω. */
  referenceOhm: number;
}

export const DEFAULT_REFERENCE_OHM = 50;
/** Most resonances a stub sweep lists (a stub many wavelengths long over a wide span is refused). */
export const MAX_SWEEP_RESONANCES = 1000;

export interface SweepResolved {
  stub(name: string): Outcome | undefined;
  line(name: string): Outcome | undefined;
}

const quarterName = (n: number) => (n % 2 === 0 ? `${n / 2 === 1 ? '' : n / 2}λ/2` : `${n === 1 ? '' : n}λ/4`);
const describe = (r: Resonance) => `${formatQuantity(r.frequencyHz, 'frequency')} (${r.type}, ${quarterName(r.quarterWaves)})`;

export function evalSweep(decl: ParsedDeclaration, scope: SheetScope, resolved: SweepResolved, marginPct: number): Outcome {
  const reader = new ValueReader(scope);
  if (decl.items.length === 0) return finish(reader); // the parser reports the empty sweep
  const values = readItems(reader, SWEEP_KEYS, decl.items, 'sweep', decl.name);
  const of = values.get('of')?.name;
  if (!of) return finish(reader);
  reader.reads.add(of.text);
  const kind = scope.kinds.get(of.text);
  if (kind === undefined) {
    reader.error(of.start, of.end, 'unknown-name', `no stub or line named ${of.text}: declare it or fix the name`);
    return finish(reader);
  }
  reader.references.push({ name: of.text, start: of.start, end: of.end });
  if (kind !== 'stub' && kind !== 'line') {
    reader.error(of.start, of.end, 'unknown-name', `${of.text} is a ${kind}; a sweep is of a stub or a line`);
    return finish(reader);
  }
  // Items that failed to read are reported already and missing from `values`.
  const given = (key: string) => decl.items.find((i) => i.key.text === key);
  const lengthItem = values.get('length');
  if (kind === 'stub' && given('length')) {
    const key = given('length')!.key;
    reader.error(key.start, key.end, 'conflict', `a stub sweep uses the stub's own length: remove "length" (it is for a section of a line)`);
    return finish(reader);
  }
  if (kind === 'line' && !lengthItem) {
    if (!given('length')) reader.error(decl.name.start, decl.name.end, 'missing', `a sweep of the line ${of.text} sweeps a section of it: add ", length …"`);
    return finish(reader);
  }
  if ((given('over') && !values.has('over')) || (given('points') && !values.has('points')) || (given('ref') && !values.has('ref'))) return finish(reader);
  const target = kind === 'stub' ? resolved.stub(of.text) : resolved.line(of.text);
  const stub = target?.stub;
  const line = target?.line;
  // A target that could not be evaluated is reported on its own line.
  if (!(kind === 'stub' ? stub : line)) return finish(reader);

  const referenceOhm = si(values, 'ref') ?? DEFAULT_REFERENCE_OHM;
  const refItem = values.get('ref')?.item;
  if (refItem && !(referenceOhm > 0)) {
    reader.error(refItem.value!.start, refItem.value!.end, 'range', 'the reference impedance must be positive');
    return finish(reader);
  }
  const lengthM = si(values, 'length') ?? null;
  if (lengthItem && !(lengthM! > 0)) {
    reader.error(lengthItem.item.value!.start, lengthItem.item.value!.end, 'range', 'a line section length must be positive');
    return finish(reader);
  }
  const over = values.get('over');
  let span: { from: number; to: number };
  if (over?.range) {
    if (!(over.range[0] > 0)) {
      reader.error(over.item.value!.start, over.item.value!.end, 'range', 'a sweep starts above 0 Hz');
      return finish(reader);
    }
    span = { from: over.range[0], to: over.range[1] };
  } else if (stub) span = defaultStubSpan(stub, marginPct);
  else {
    const f = target?.results.frequency_hz;
    if (typeof f !== 'number') {
      reader.error(decl.name.start, decl.name.end, 'missing', `the line ${of.text} has no "at": give the sweep a range, ", over 1 GHz .. 6 GHz"`);
      return finish(reader);
    }
    span = defaultLineSpan(f);
  }
  const points = values.get('points')?.count ?? DEFAULT_POINTS;
  const sweep: SweepBuild = { target: of.text, targetKind: kind, fromHz: span.from, toHz: span.to, points, lengthM, referenceOhm, ...(stub ? { stub } : { line: line! }) };
  const range = `${formatQuantity(span.from, 'frequency')} … ${formatQuantity(span.to, 'frequency')}`;
  const grid = linearGrid(span.from, span.to, points);
  const base = { target: of.text, points, from_hz: span.from, to_hz: span.to, reference_ohm: referenceOhm };

  if (stub) {
    const count = resonanceCount(stub, span.from, span.to);
    if (!(count <= MAX_SWEEP_RESONANCES)) {
      const at = over?.item.value ?? decl.name;
      reader.error(at.start, at.end, 'limit', `the sweep holds about ${count < 1e6 ? Math.round(count) : count.toExponential(1)} resonances of ${of.text}, more than ${MAX_SWEEP_RESONANCES}: narrow the range`);
      return finish(reader);
    }
    const samples = sweepStubFrequency(stub, grid);
    const xs = samples.map((s) => s.point.reactance).filter(Number.isFinite);
    const rs = samples.map((s) => s.point.resistance).filter(Number.isFinite);
    const resonances = stubResonances(stub, span.from, span.to);
    return finish(reader, {
      sweep,
      results: {
        ...base, target_kind: 'stub',
        reactance_min_ohm: xs.length ? Math.min(...xs) : null, reactance_max_ohm: xs.length ? Math.max(...xs) : null,
        resistance_max_ohm: rs.length ? Math.max(...rs) : null,
        resonance_count: resonances.length,
        resonance_lowest_hz: resonances[0]?.frequencyHz ?? null, resonance_highest_hz: resonances[resonances.length - 1]?.frequencyHz ?? null,
      },
      details: [
        `sweep of the ${stub.kind} stub ${of.text}: ${points} points, ${range}${over ? '' : ' (default span)'}`,
        resonances.length === 0 ? 'no resonance in the range' : `resonances in the range: ${resonances.slice(0, 8).map(describe).join(', ')}${resonances.length > 8 ? `, … (${resonances.length} in all)` : ''}`,
      ],
    });
  }
  const s = grid.map((f) => abcdToS(lineSectionAbcd(line!, lengthM!, f), referenceOhm));
  const db = (x: number) => -20 * Math.log10(x);
  const insertion = s.map((p) => db(cabs(p.s21)));
  const returnLoss = s.map((p) => db(cabs(p.s11)));
  return finish(reader, {
    sweep,
    results: {
      ...base, target_kind: 'line', length_m: lengthM,
      insertion_loss_db_max: Math.max(...insertion), return_loss_db_min: Math.min(...returnLoss),
    },
    details: [
      `sweep of a ${formatQuantity(lengthM, 'length')} section of the line ${of.text} as a two-port: ${points} points, ${range}, reference ${formatQuantity(referenceOhm, 'impedance')}`,
    ],
  });
}
