/**
 * Evaluation of `stub` declarations: analysis of a given length or synthesis of the length for a
 * target L, C, X or angle; nearest resonances; band behaviour; and the resonance checks
 * (near-resonance, resonance-in-band, detuned), taken at the worst tolerance corner.
 */
import {
  analyseBand, analyseEndedStub, analyseStub, stubResonanceBandwidth, electricalLengthAt, nearestResonances, resonancesInRange, synthesizeEndedStub, synthesizeStub,
  type LineModel, type NearestResonances, type Resonance, type StubEnd, type StubKind, type StubTarget,
} from '../../engine/index.js';
import { formatQuantity } from '../format.js';
import type { LocalDiagnostic, ParsedDeclaration } from '../parse/lineParser.js';
import { STUB_KEYS, STUB_KINDS, STUB_TARGETS } from '../schema.js';
import { finish, lookup, validityDiagnostics, type Resolved } from './declarations.js';
import { readItems, si, tol, type ItemValues } from './items.js';
import type { Outcome } from './outcome.js';
import { powerStress } from './stubPower.js';
import { resolveEnd } from './stubEnds.js';
import { shownReactance, stubPointAt, type StubBuild, type StubPoint } from './stubPoint.js';
import type { LineBuild } from './lineTypes.js';
import { ValueReader, type SheetScope } from './values.js';

const quarterName = (n: number) => (n % 2 === 0 ? `${n / 2 === 1 ? '' : n / 2}λ/2` : `${n === 1 ? '' : n}λ/4`);
const describe = (r: Resonance) => `${r.type} resonance at ${formatQuantity(r.frequencyHz, 'frequency')} (${quarterName(r.quarterWaves)})`;

function targetOf(values: ItemValues): StubTarget | null {
  const get = (k: string) => si(values, k);
  if (get('inductance') !== undefined) return { kind: 'inductance', henries: get('inductance')! };
  if (get('capacitance') !== undefined) return { kind: 'capacitance', farads: get('capacitance')! };
  if (get('reactance') !== undefined) return { kind: 'reactance', ohms: get('reactance')! };
  if (get('angle') !== undefined) return { kind: 'angle', radians: get('angle')! };
  return null;
}

export function evalStub(decl: ParsedDeclaration, scope: SheetScope, resolved: Resolved, marginPct: number): Outcome {
  const reader = new ValueReader(scope);
  const head = decl.head;
  if (!head) return finish(reader);
  if (!(STUB_KINDS as readonly string[]).includes(head.word.text)) {
    reader.error(head.word.start, head.word.end, 'syntax', `a stub is "short on LINE" or "open on LINE", not "${head.word.text}"`);
    return finish(reader);
  }
  const kind = head.word.text as StubKind;
  const values = readItems(reader, STUB_KEYS, decl.items, 'stub', decl.name);
  if (!head.on) {
    reader.error(head.word.start, head.word.end, 'missing', `say which line the stub is made of: "${kind} on LINE"`);
    return finish(reader);
  }
  const line = lookup(reader, head.on, 'line', resolved.line(head.on.text))?.line;
  const f = si(values, 'at');
  if (!line || f === undefined) return finish(reader);
  const atItem = values.get('at')!.item;
  if (!(f > 0)) {
    reader.error(atItem.value!.start, atItem.value!.end, 'range', 'the design frequency must be positive');
    return finish(reader);
  }
  const ended = resolveEnd(kind, values, line, line.model(f), f, reader);
  if (!ended) return finish(reader);
  const target = targetOf(values);
  const lengthKey = STUB_TARGETS.find((k) => values.has(k));
  if (!lengthKey) return finish(reader);
  const lengthItem = values.get(lengthKey)!;
  const valueSpan = lengthItem.item.value!;

  let lengthM: number;
  if (target) {
    try {
      lengthM = synthesizeEndedStub(ended.end, line.model, target, f, values.get('solution')?.count ?? 1).drawnLengthM;
    } catch (e) {
      if (!(e instanceof RangeError)) throw e;
      reader.error(valueSpan.start, valueSpan.end, 'range', e.message);
      return finish(reader);
    }
  } else {
    lengthM = si(values, 'length')!;
    if (!(lengthM > 0)) {
      reader.error(valueSpan.start, valueSpan.end, 'range', 'a stub length must be positive');
      return finish(reader);
    }
  }
  // Resonance searches work on the effective length: drawn + open-end extension or via equivalent.
  const effectiveM = lengthM + ended.extraM;
  const a = analyseEndedStub(ended.end, line.model, lengthM, f);
  const point = stubPointAt({ kind, end: ended.end, line, lengthM }, f, lengthM, a);
  const near = nearestResonances(kind, line.model, effectiveM, f);
  const finite = (x: number) => (Number.isFinite(x) ? x : null);
  const results: Outcome['results'] = {
    length_m: lengthM, frequency_hz: f, electrical_deg: a.electricalDeg, wavelength_fraction: a.wavelengthFraction,
    reactance_ohm: finite(point.reactance), resistance_ohm: finite(point.resistance), inductance_h: point.inductance, capacitance_f: point.capacitance,
    behaviour: point.behaviour, resonance_below_hz: near.below?.frequencyHz ?? null, resonance_above_hz: near.above.frequencyHz,
    resonance_margin_pct: near.marginPct, resonance_nearest_hz: near.nearest.frequencyHz, resonant_intended: values.has('resonant'),
    effective_length_m: effectiveM, guided_wavelength_m: a.guidedWavelengthM, end_extension_m: ended.endExtensionM, via_inductance_h: ended.viaInductanceH,
  };
  const lc = point.inductance !== null ? `≈ ${formatQuantity(point.inductance, 'inductance')}` : point.capacitance !== null ? `≈ ${formatQuantity(point.capacitance, 'capacitance')}` : 'neither an L nor a C here';
  const x = shownReactance(point.reactance, a.line.z0, point.resistance);
  const details = [
    `length ${formatQuantity(lengthM, 'length')}${target ? ' (synthesized)' : ''}; effective θ ${a.electricalDeg.toFixed(1)}° = ${a.wavelengthFraction.toFixed(4)} λg at ${formatQuantity(f, 'frequency')}`,
    ...ended.details,
    `Zin ${formatQuantity(point.resistance, 'resistance')} ${x >= 0 ? '+' : '−'} j${formatQuantity(Math.abs(x), 'impedance')}: ${point.behaviour}, ${lc}`,
    `nearest resonances: below ${near.below ? describe(near.below) : 'none'}; above ${describe(near.above)}; margin ${near.marginPct.toFixed(1)} %`,
  ];

  // Tolerance corners: every line corner × length ± tolerance (the nominal case included).
  const lengthTol = target ? 0 : tol(values, 'length');
  const models: LineModel[] = [line.model, ...line.corners()];
  const lengths = lengthTol > 0 ? [effectiveM, effectiveM - lengthTol, effectiveM + lengthTol] : [effectiveM];
  const corners = models.flatMap((m) => lengths.filter((l) => l > 0).map((l) => ({ m, l })));
  const { worst, best, all } = cornerMargins(kind, models, effectiveM, lengthTol, f);
  const toleranced = corners.length > 1;
  if (toleranced) {
    details.push(`tolerance corners (${corners.length}): margin ${worst.marginPct.toFixed(1)} … ${best.marginPct.toFixed(1)} %`);
    Object.assign(results, cornerRanges(kind, corners, f, all));
  }

  // Only what changes with frequency: the line's static notes are already shown on the line.
  const staticNotes = new Set(validityDiagnostics(line, 0, atItem.value!).map((d) => d.message));
  const diagnostics: LocalDiagnostic[] = validityDiagnostics(line, f, atItem.value!).filter((d) => !staticNotes.has(d.message));
  for (const message of ended.notes) {
    const endKey = values.get('via')?.item ?? atItem;
    diagnostics.push({ start: endKey.value!.start, end: endKey.value!.end, severity: 'warning', code: 'model-validity', message: `${message}: the end-effect model is used outside its published range` });
  }
  // Fix lengths are found on the effective length, then the end's extra length is taken off again.
  const drawn = (effective: number | null) => (effective === null || effective - ended.extraM <= 0 ? null : effective - ended.extraM);
  const resonant = values.has('resonant');
  const related = [{ name: head.on.text, message: `the line ${head.on.text} sets Z0 and εeff` }];
  const cornerNote = toleranced ? ' at the worst tolerance corner' : '';
  if (!resonant && worst.marginPct < marginPct) {
    diagnostics.push({
      start: valueSpan.start, end: valueSpan.end, severity: 'warning', code: 'near-resonance', related,
      message: `${decl.name.text} is ${worst.marginPct.toFixed(1)} % from its ${describe(worst.nearest)}${cornerNote}, inside the ${marginPct} % margin: it no longer acts as a clean ${point.behaviour === 'capacitive' ? 'C' : 'L'}. Shorten or lengthen it, or mark it "resonant" if intended`,
      ...(target ? {} : withLength(drawn(escapeLength(kind, models, effectiveM, lengthTol, f, marginPct)))),
    });
  }
  if (resonant && best.marginPct > marginPct) {
    diagnostics.push({
      start: valueSpan.start, end: valueSpan.end, severity: 'warning', code: 'detuned', related,
      message: `${decl.name.text} is marked resonant but its nearest resonance is ${best.marginPct.toFixed(1)} % away${cornerNote} (${describe(best.nearest)}), outside the ${marginPct} % margin: retune the length`,
      ...(target ? {} : withLength(drawn(retuneLength(kind, line.model, f, best.nearest.quarterWaves)))),
    });
  }
  const band = values.get('band')?.range;
  const bandCount = band ? bandResonanceCount(corners, band, marginPct) : 0;
  if (band && !(bandCount <= MAX_BAND_RESONANCES)) {
    const bandSpan = values.get('band')!.item.value!;
    diagnostics.push({
      start: bandSpan.start, end: bandSpan.end, severity: 'error', code: 'limit',
      message: `the band widened by the ${marginPct} % margin holds about ${bandCount < 1e6 ? Math.round(bandCount) : bandCount.toExponential(1)} resonances of this stub, more than ${MAX_BAND_RESONANCES} are not checked: check the length, its unit and the band`,
    });
  } else if (band) {
    const b = analyseBand(kind, line.model, effectiveM, band[0], band[1]);
    Object.assign(results, { band_min: b.min, band_max: b.max, band_spread_pct: b.spreadPct });
    if (b.quantity && b.spreadPct !== null) {
      details.push(`band ${formatQuantity(band[0], 'frequency')} … ${formatQuantity(band[1], 'frequency')}: ${b.quantity === 'inductance' ? 'L' : 'C'} ${formatQuantity(b.min, b.quantity)} … ${formatQuantity(b.max, b.quantity)} (spread ${b.spreadPct.toFixed(1)} %)`);
    }
    const lo = band[0] * (1 - marginPct / 100);
    const hi = band[1] * (1 + marginPct / 100);
    const inBand = corners.flatMap(({ m, l }) => resonancesInRange(kind, m, l, lo, hi));
    if (inBand.length > 0) {
      const r = inBand.reduce((x, y) => (Math.abs(y.frequencyHz - f) < Math.abs(x.frequencyHz - f) ? y : x));
      const bandSpan = values.get('band')!.item.value!;
      diagnostics.push({
        start: bandSpan.start, end: bandSpan.end, severity: 'warning', code: 'resonance-in-band', related,
        message: `${describe(r)} falls inside the band widened by the ${marginPct} % margin (${formatQuantity(lo, 'frequency')} … ${formatQuantity(hi, 'frequency')})${cornerNote}: the stub does not act as an L or C across the band. ${r.frequencyHz > f ? 'Shorten it to move that resonance above' : 'Lengthen it to move that resonance below'} the band`,
      });
    }
  }
  Object.assign(results, lossFigures(kind, line, point, effectiveM, f, near.nearest.quarterWaves, values.has('resonant')));
  if (!target && Number.isFinite(a.reactance) && a.reactance !== 0) {
    const swapped = swapLength(kind, line, a.reactance, f);
    if (swapped !== null) results.swap_length_m = swapped;
  }
  const power = values.get('power');
  if (power) diagnostics.push(...powerStress(results, power, ended, line, lengthM, f, a.zin, decl.name.text));
  details.push(`line ${head.on.text}: ${line.modelName}`);
  const synthesized = target ? [{ key: 'length', valueSI: lengthM, start: lengthItem.item.span.start, end: lengthItem.item.span.end }] : [];
  const stub: StubBuild = { kind, end: ended.end, line, lineName: head.on.text, lengthM, frequencyHz: f, band: band ?? null, resonant };
  return finish(reader, { results, details, synthesized, diagnostics, stub });
}

/** Most resonances a band check enumerates (a stub hundreds of wavelengths long, or a band decades wide). */
export const MAX_BAND_RESONANCES = 1000;

/** Number of resonances in the band widened by the margin, at the corner that holds the most. */
function bandResonanceCount(corners: { m: LineModel; l: number }[], band: [number, number], marginPct: number): number {
  const lo = band[0] * (1 - marginPct / 100);
  const hi = band[1] * (1 + marginPct / 100);
  return Math.max(...corners.map(({ m, l }) => (electricalLengthAt(m, l, hi) - electricalLengthAt(m, l, Math.max(0, lo))) / (Math.PI / 2)));
}

const withLength = (lengthM: number | null) => (lengthM === null ? {} : { data: { lengthM } });

/** Nearest-resonance margins over every tolerance corner (line corners × length ± tolerance). */
function cornerMargins(kind: StubKind, models: LineModel[], lengthM: number, lengthTol: number, f: number) {
  const lengths = lengthTol > 0 ? [lengthM, lengthM - lengthTol, lengthM + lengthTol] : [lengthM];
  const all = models.flatMap((m) => lengths.filter((l) => l > 0).map((l) => nearestResonances(kind, m, l, f)));
  const worst = all.reduce((w, c) => (c.marginPct < w.marginPct ? c : w));
  const best = all.reduce((w, c) => (c.marginPct > w.marginPct ? c : w));
  return { worst, best, all };
}

/** `*_min` / `*_max` companions over the tolerance corners: L or C, the nearest resonance and the margin. */
function cornerRanges(kind: StubKind, corners: { m: LineModel; l: number }[], f: number, margins: NearestResonances[]): Outcome['results'] {
  const span = (values: (number | null)[], key: string): Outcome['results'] => {
    const v = values.filter((x): x is number => x !== null && Number.isFinite(x));
    return v.length === values.length && v.length > 0 ? { [`${key}_min`]: Math.min(...v), [`${key}_max`]: Math.max(...v) } : {};
  };
  const stubs = corners.map(({ m, l }) => analyseStub(kind, m, l, f));
  return {
    ...span(stubs.map((a) => a.inductance), 'inductance_h'),
    ...span(stubs.map((a) => a.capacitance), 'capacitance_f'),
    ...span(margins.map((r) => r.nearest.frequencyHz), 'resonance_nearest_hz'),
    ...span(margins.map((r) => r.marginPct), 'resonance_margin_pct'),
  };
}

/**
 * A length that moves the nearest resonance out of the margin (plus 0.5 % headroom) at every
 * tolerance corner, moving away from that resonance; null when no such length is found nearby.
 * Uses f_res ∝ 1/l as the step and re-solves the resonances with the full model each time.
 */
export function escapeLength(kind: StubKind, models: LineModel[], lengthM: number, lengthTol: number, f: number, marginPct: number): number | null {
  const goal = marginPct + 0.5;
  let l = lengthM;
  for (let i = 0; i < 12; i++) {
    const { worst } = cornerMargins(kind, models, l, lengthTol, f);
    if (worst.marginPct >= goal) return l;
    const r = worst.nearest.frequencyHz;
    const aim = r > f ? f * (1 + goal / 100) : f * (1 - goal / 100);
    l *= r / aim;
    if (!(l > lengthTol)) return null;
  }
  return null;
}

/** The length that puts resonance number n (quarter waves) exactly at f. */
function retuneLength(kind: StubKind, model: LineModel, f: number, quarterWaves: number): number | null {
  try {
    return synthesizeStub(kind, model, { kind: 'angle', radians: (quarterWaves * Math.PI) / 2 }, f).lengthM;
  } catch {
    return null;
  }
}

/**
 * Drawn length of the opposite kind of stub (open ↔ short, ideal short, corrected open end) with the
 * same reactance at f: the shortest solution. Null where it cannot be reached.
 */
function swapLength(kind: StubKind, line: LineBuild, reactance: number, f: number): number | null {
  const end: StubEnd = kind === 'short' ? { kind: 'open', extensionM: line.openEnd?.().extensionM ?? 0 } : { kind: 'short' };
  try {
    return synthesizeEndedStub(end, line.model, { kind: 'reactance', ohms: reactance }, f).drawnLengthM;
  } catch {
    return null;
  }
}

/**
 * Loss figures: the series resistance from the line's R′L′G′C′ (complex Z0, which the real-Z0 form
 * underestimates away from resonance), the element Q = |X|/R, and for an intended resonance its
 * resonator Q and 3 dB bandwidth. Lines without a loss split keep the real-Z0 resistance.
 */
function lossFigures(kind: StubKind, line: LineBuild, point: StubPoint, effectiveM: number, f: number, quarterWaves: number, resonant: boolean): Outcome['results'] {
  const out: Outcome['results'] = {};
  if (point.lossyResistance) out.q = Number.isFinite(point.reactance) ? Math.abs(point.reactance) / point.resistance : null;
  if (resonant && line.model(f).alpha > 0) {
    const r = stubResonanceBandwidth(kind, line.model, effectiveM, quarterWaves);
    out.resonator_q = r.q;
    out.bandwidth_hz = r.bandwidthHz;
  }
  return out;
}
