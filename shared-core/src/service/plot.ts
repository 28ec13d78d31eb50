/**
 * Plots and exports of a sheet's stubs, lines and sweeps: the SVG picture (the editor panel and
 * `stubwright plot` show the same bytes), its markers, the plot targets for code lenses, and
 * Touchstone / CSV exports. Names are resolved against the evaluated document; every problem is a
 * plain `{ error }`, never a throw.
 */
import { stubLengthPlot, stubFrequencyPlot, linePlot, lineSectionPlot, type Grid } from '../plot/model.js';
import { lineCsv, lineSectionCsv, lineSectionNetwork, stubCsv, stubNetwork } from '../plot/export.js';
import { renderSvg, type PlotModel } from '../plot/svg.js';
import { DEFAULT_POINTS, MAX_POINTS, MIN_POINTS, defaultLengthSpan, defaultLineSpan, defaultStubSpan, linearGrid, type Span } from '../plot/sweep.js';
import { renderTouchstone } from '../plot/touchstone.js';
import type { EntryModel } from '../sheet/eval/models.js';
import type { StubBuild } from '../sheet/eval/stubPoint.js';
import { DEFAULT_REFERENCE_OHM } from '../sheet/eval/sweep.js';
import { formatQuantity } from '../sheet/format.js';
import type { EvaluatedDocument, ExportOptions, ExportResult, PlotMarker, PlotOptions, PlotResult, PlotTarget } from './types.js';

type Failure = { error: string };

/** The model of a declared name, or why there is none. */
function resolve(doc: EvaluatedDocument, name: string): EntryModel | Failure {
  const model = doc.result.models?.get(name);
  if (model) return model;
  const entry = doc.result.entries.find((e) => e.name === name);
  if (!entry) return { error: `no stub, line or sweep named "${name}" in this sheet` };
  if (entry.kind === 'let' || entry.kind === 'substrate') return { error: `${name} is a ${entry.kind}: plots and exports are of stubs, lines and sweeps` };
  return { error: `${name} (line ${entry.line + 1}) could not be evaluated: fix the errors on that line first` };
}

const isFailure = (x: unknown): x is Failure => typeof x === 'object' && x !== null && 'error' in x;

/** The `at` of every evaluated stub built on line `name`, Hz. */
function stubFrequenciesOn(doc: EvaluatedDocument, name: string): number[] {
  const out: number[] = [];
  for (const m of doc.result.models?.values() ?? []) if (m.kind === 'stub' && m.stub.lineName === name) out.push(m.stub.frequencyHz);
  return out;
}

/**
 * Default span of a line: around its own `at` (0.02·at … 2·at), or, for a line without one, around
 * the `at` of the stubs built on it (0.02 × the lowest … 2 × the highest); null when it has neither.
 */
function lineSpan(doc: EvaluatedDocument, name: string, atHz: number | null): Span | null {
  if (atHz !== null) return defaultLineSpan(atHz);
  const fs = stubFrequenciesOn(doc, name);
  if (fs.length === 0) return null;
  return { from: defaultLineSpan(Math.min(...fs)).from, to: defaultLineSpan(Math.max(...fs)).to };
}

/** Checks a requested range and point count against defaults; a one-sided range keeps the other default end. */
function gridOf(what: string, unit: 'frequency' | 'length', from: number | undefined, to: number | undefined, points: number | undefined, fallback: Span | null, defaultPoints = DEFAULT_POINTS): Grid | Failure {
  for (const [key, v] of [['from', from], ['to', to]] as const) {
    if (v !== undefined && !(Number.isFinite(v) && v > 0)) return { error: `${key} must be a positive ${unit === 'frequency' ? 'frequency' : 'length'}` };
  }
  if (points !== undefined && !(Number.isInteger(points) && points >= MIN_POINTS && points <= MAX_POINTS)) {
    return { error: `points must be a whole number from ${MIN_POINTS} to ${MAX_POINTS}, got ${points}` };
  }
  const lo = from ?? fallback?.from;
  const hi = to ?? fallback?.to;
  if (lo === undefined || hi === undefined) return { error: `${what} has no "at", and no stub on it has one, to centre a span on: give the range (from and to)` };
  if (!(hi > lo)) {
    const show = (v: number) => formatQuantity(v, unit);
    return { error: `the range must go from low to high: ${show(lo)} … ${show(hi)}` };
  }
  return { from: lo, to: hi, points: points ?? defaultPoints };
}

function markersOf(model: PlotModel): PlotMarker[] {
  const out: PlotMarker[] = model.resonances.map((r) => ({ kind: 'resonance', x: r.x, label: r.label, resonanceType: r.type }));
  if (model.operating) out.push({ kind: 'operating', x: model.operating.x, label: model.operating.label });
  return out;
}

function result(name: string, entryKind: 'stub' | 'line', model: PlotModel): PlotResult {
  return {
    name, entryKind, view: model.view, title: model.title, svg: renderSvg(model), markers: markersOf(model),
    ...(model.band ? { band: model.band } : {}),
  };
}

function stubPlot(doc: EvaluatedDocument, name: string, stub: StubBuild, options: PlotOptions, span: Span, points: number, label = name): PlotResult | Failure {
  const unit = options.lengthUnit ?? doc.settings.lengthUnit;
  if ((options.view ?? 'frequency') === 'length') {
    const grid = gridOf(name, 'length', options.fromM, options.toM, options.points, defaultLengthSpan(stub));
    return isFailure(grid) ? grid : result(name, 'stub', stubLengthPlot(label, stub, grid, unit));
  }
  const grid = gridOf(name, 'frequency', options.fromHz, options.toHz, options.points, span, points);
  return isFailure(grid) ? grid : result(name, 'stub', stubFrequencyPlot(label, stub, grid, unit));
}

/** The picture of a stub, line or sweep. */
export function getPlot(doc: EvaluatedDocument, name: string, options: PlotOptions = {}): PlotResult | Failure {
  try {
    const model = resolve(doc, name);
    if (isFailure(model)) return model;
    const unit = options.lengthUnit ?? doc.settings.lengthUnit;
    const lengthView = options.view === 'length';
    if (model.kind === 'stub') return stubPlot(doc, name, model.stub, options, defaultStubSpan(model.stub, doc.settings.marginPct), DEFAULT_POINTS);
    if (model.kind === 'line') {
      if (lengthView) return { error: `the length view is for stubs: ${name} is a line` };
      const grid = gridOf(name, 'frequency', options.fromHz, options.toHz, options.points, lineSpan(doc, name, model.frequencyHz));
      return isFailure(grid) ? grid : result(name, 'line', linePlot(name, model.line, model.frequencyHz, grid, unit));
    }
    const sweep = model.sweep;
    const span = { from: sweep.fromHz, to: sweep.toHz };
    if (sweep.stub) return stubPlot(doc, name, sweep.stub, options, span, sweep.points, `${name} (sweep of ${sweep.target})`);
    if (lengthView) return { error: `the length view is for stubs: ${name} sweeps a line section` };
    const grid = gridOf(name, 'frequency', options.fromHz, options.toHz, options.points, span, sweep.points);
    return isFailure(grid) ? grid : result(name, 'line', lineSectionPlot(name, sweep.target, sweep.line!, sweep.lengthM!, sweep.referenceOhm, grid, unit));
  } catch (e) {
    if (e instanceof RangeError) return { error: `${name}: ${e.message}` };
    return { error: `the plot of ${name} could not be made: ${e instanceof Error ? e.message : String(e)}` };
  }
}

/**
 * Every evaluated stub, line and sweep that plots without being given a range, for code lenses:
 * a line without `at` and without stubs on it is left out (its plot would only be an error).
 */
export function getPlotTargets(doc: EvaluatedDocument): PlotTarget[] {
  const models = doc.result.models;
  if (!models) return [];
  const stubLines = new Set<string>();
  for (const m of models.values()) if (m.kind === 'stub') stubLines.add(m.stub.lineName);
  return doc.result.entries.flatMap((e): PlotTarget[] => {
    const m = models.get(e.name);
    if (!m) return [];
    if (m.kind === 'line' && m.frequencyHz === null && !stubLines.has(e.name)) return [];
    if (m.kind === 'sweep') return [{ name: e.name, kind: m.sweep.targetKind, range: e.range, sweepOf: m.sweep.target }];
    return [{ name: e.name, kind: m.kind, range: e.range }];
  });
}

/** Touchstone comments are kept to ASCII, which every reader takes. */
export function ascii(text: string): string {
  const map: Record<string, string> = { 'Ω': 'ohm', 'µ': 'u', '−': '-', '…': '..', 'λ': 'lambda', 'ε': 'eps', '≈': '~', '°': ' deg', '·': '*', '–': '-', '—': '-' };
  return text.replace(/[^\x20-\x7e]/g, (c) => map[c] ?? '?');
}

/** Touchstone or CSV of a stub, line section (a sweep of a line) or line. */
export function getExport(doc: EvaluatedDocument, name: string, format: 'touchstone' | 'csv', options: ExportOptions = {}): ExportResult | Failure {
  try {
    const model = resolve(doc, name);
    if (isFailure(model)) return model;
    if (options.referenceOhm !== undefined && !(options.referenceOhm > 0 && Number.isFinite(options.referenceOhm))) return { error: 'the reference impedance must be a positive number of ohms' };
    if (options.ports !== undefined && options.ports !== 1 && options.ports !== 2) return { error: 'ports is 1 or 2' };
    const stub = model.kind === 'stub' ? model.stub : model.kind === 'sweep' ? model.sweep.stub : undefined;
    const sweep = model.kind === 'sweep' ? model.sweep : undefined;
    const reference = options.referenceOhm ?? sweep?.referenceOhm ?? DEFAULT_REFERENCE_OHM;
    const span = sweep ? { from: sweep.fromHz, to: sweep.toHz } : stub ? defaultStubSpan(stub, doc.settings.marginPct)
      : model.kind === 'line' ? lineSpan(doc, name, model.frequencyHz) : null;
    const grid = gridOf(name, 'frequency', options.fromHz, options.toHz, options.points, span, sweep?.points);
    if (isFailure(grid)) return grid;
    const xs = linearGrid(grid.from, grid.to, grid.points);
    const show = (v: number, q: 'frequency' | 'length' | 'impedance') => formatQuantity(v, q);
    const header = [
      `Stubwright export of ${name}${options.source ? ` from ${options.source}` : ''}`,
      `${grid.points} points, ${show(grid.from, 'frequency')} .. ${show(grid.to, 'frequency')}; S-parameters referred to ${show(reference, 'impedance')} at every port`,
      'Design estimate from published line models: confirm by measurement',
    ];
    if (stub) {
      if (format === 'csv') return { text: stubCsv(stub, xs, reference), fileName: `${name}.csv` };
      const ports = options.ports ?? 1;
      const what = `${stub.kind} stub on line ${stub.lineName}, drawn length ${show(stub.lengthM, 'length')}, at ${show(stub.frequencyHz, 'frequency')}${sweep ? ` (sweep of ${sweep.target})` : ''}`;
      const comments = [header[0]!, what, ports === 1 ? 'one-port: the stub from its input (where it joins the line) to ground' : 'two-port: the stub in shunt across a through connection (port 1 and port 2 at the junction)', ...header.slice(1)];
      return { text: renderTouchstone(stubNetwork(stub, xs, ports, reference, comments.map(ascii))), fileName: `${name}.s${ports}p` };
    }
    if (sweep) {
      const line = sweep.line!;
      if (format === 'csv') return { text: lineSectionCsv(line, sweep.lengthM!, xs, reference), fileName: `${name}.csv` };
      if (options.ports === 1) return { error: `${name} is a line section, a two-port: export it as .s2p` };
      const comments = [header[0]!, `two-port: a ${show(sweep.lengthM!, 'length')} section of line ${sweep.target} (${line.modelName})`, ...header.slice(1)];
      return { text: renderTouchstone(lineSectionNetwork(line, sweep.lengthM!, xs, reference, comments.map(ascii))), fileName: `${name}.s2p` };
    }
    if (model.kind !== 'line') return { error: `${name} cannot be exported` };
    if (format === 'csv') return { text: lineCsv(model.line, xs), fileName: `${name}.csv` };
    return { error: `a line needs a length to be a two-port: declare "sweep NAME: of ${name}, length …" and export that sweep` };
  } catch (e) {
    return { error: `the export of ${name} could not be made: ${e instanceof Error ? e.message : String(e)}` };
  }
}
