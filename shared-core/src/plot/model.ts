/**
 * Plot descriptions of a stub (reactance and resistance, and the equivalent L or C, over frequency
 * or over drawn length), a line (Z0, εeff and loss over frequency) and a line section (|S11| and
 * |S21| in dB). Pure: the SVG comes from svg.ts.
 *
 * Reactance near poles: the y axis is clipped symmetrically at max(3·Z0, min(1.5·|X at the
 * operating point|, 20·Z0)), and the trace is broken at every parallel resonance (a pole of X on a
 * lossless line, a near-vertical swing on a lossy one) found by the engine, so no line is drawn
 * across a pole. The L or C panel shows the quantity the stub is at its `at`, from 0 to 3 × its value
 * there, broken wherever the stub is not that kind of element.
 */
import { cabs, phaseConstant } from '../engine/index.js';
import { formatQuantity } from '../sheet/format.js';
import type { LineBuild } from '../sheet/eval/lineTypes.js';
import { shownReactance, stubPointAt, type StubBuild } from '../sheet/eval/stubPoint.js';
import { abcdToS } from './sparams.js';
import {
  lineSectionAbcd, linearGrid, resonanceCount, stubLengthResonances, stubResonances, sweepLine, sweepStubFrequency, sweepStubLength, type StubSample,
} from './sweep.js';
import { markerLabel, type Marker, type Panel, type PlotModel, type Trace } from './svg.js';

export interface Grid {
  from: number;
  to: number;
  points: number;
}

/** Splits samples into runs where `value` is defined, also breaking between two samples that straddle a break x. */
export function segmentsOf(xs: readonly number[], value: (i: number) => number | null, breaks: readonly number[] = []): [number, number][][] {
  const out: [number, number][][] = [];
  let cur: [number, number][] = [];
  const sorted = [...breaks].sort((a, b) => a - b);
  let k = 0;
  for (let i = 0; i < xs.length; i++) {
    const x = xs[i]!;
    let broke = false;
    while (k < sorted.length && sorted[k]! <= x) {
      if (i > 0 && sorted[k]! > xs[i - 1]!) broke = true;
      k++;
    }
    const v = value(i);
    if (broke || v === null || !Number.isFinite(v)) {
      if (cur.length > 1) out.push(cur);
      cur = [];
    }
    if (v !== null && Number.isFinite(v)) cur.push([x, v]);
  }
  if (cur.length > 1) out.push(cur);
  return out;
}

const reactanceLimit = (z0: number, xOp: number) => Math.max(3 * z0, Math.min(1.5 * (Number.isFinite(xOp) ? Math.abs(xOp) : 0), 20 * z0));

/** Which element the stub is at `at`: its own behaviour, or, on a resonance, what it is just below. */
function elementKind(build: StubBuild): 'inductance' | 'capacitance' {
  const p = stubPointAt(build, build.frequencyHz);
  if (p.inductance !== null) return 'inductance';
  if (p.capacitance !== null) return 'capacitance';
  const below = stubPointAt(build, build.frequencyHz * 0.98);
  return below.reactance > 0 ? 'inductance' : 'capacitance';
}

function stubPanels(build: StubBuild, xs: number[], samples: StubSample[], poles: number[], opLength: number): Panel[] {
  const z0 = build.line.model(build.frequencyHz).z0;
  const op = stubPointAt(build, build.frequencyHz, opLength);
  const limit = reactanceLimit(z0, op.reactance);
  const traces: Trace[] = [{ quantity: 'reactance', label: 'X', colour: 'blue', segments: segmentsOf(xs, (i) => samples[i]!.point.reactance, poles) }];
  if (samples.some((s) => s.point.resistance > 0)) {
    traces.push({ quantity: 'resistance', label: 'R', colour: 'orange', dashed: true, segments: segmentsOf(xs, (i) => samples[i]!.point.resistance, []) });
  }
  const kind = elementKind(build);
  const value = (i: number) => samples[i]!.point[kind];
  const opValue = op[kind];
  const finite = samples.map((_, i) => value(i)).filter((v): v is number => v !== null && Number.isFinite(v)).sort((a, b) => a - b);
  const ref = opValue ?? finite[Math.floor(finite.length / 2)] ?? 1e-9;
  const lc: Panel = {
    yQuantity: kind, yLabel: kind === 'inductance' ? 'equivalent L' : 'equivalent C', yMin: 0, yMax: 3 * ref,
    traces: [{ quantity: kind, label: kind === 'inductance' ? 'L = X/ω' : 'C = −1/(ωX)', colour: 'green', segments: segmentsOf(xs, value, poles) }],
    operatingY: opValue,
  };
  return [
    { yQuantity: 'impedance', yLabel: 'reactance X, resistance R', yMin: -limit, yMax: limit, traces, operatingY: op.reactance },
    lc,
  ];
}

const stubTitle = (name: string, b: StubBuild, unit: 'mm' | 'mil') =>
  `${name}: ${b.kind} stub on ${b.lineName}, ${formatQuantity(b.lengthM, 'length', { lengthUnit: unit })}`;

/**
 * The operating point's label: on a resonance (|X| ≤ R, the sheet's `resonant`, or X below what the
 * computation resolves) "resonant" with R; otherwise X and the equivalent L or C.
 */
export const operatingLabel = (b: StubBuild, unit: 'mm' | 'mil') => {
  const p = stubPointAt(b, b.frequencyHz);
  const where = `at ${formatQuantity(b.frequencyHz, 'frequency')}, ${formatQuantity(b.lengthM, 'length', { lengthUnit: unit })}`;
  const x = shownReactance(p.reactance, b.line.model(b.frequencyHz).z0, p.resistance);
  if (p.behaviour === 'resonant' || x === 0) return `resonant (R ${formatQuantity(p.resistance, 'resistance')}) ${where}`;
  const lc = p.inductance !== null ? ` ≈ ${formatQuantity(p.inductance, 'inductance')}` : p.capacitance !== null ? ` ≈ ${formatQuantity(p.capacitance, 'capacitance')}` : '';
  return `X ${formatQuantity(x, 'reactance')}${lc} ${where}`;
};

/** Most resonances a plot marks; a wider range is refused (the picture would be a comb). */
export const MAX_PLOT_RESONANCES = 200;

const tooMany = (count: number) =>
  new RangeError(`the range holds about ${Math.round(count)} resonances of the stub, more than ${MAX_PLOT_RESONANCES}: narrow it`);

/** A stub over frequency, its drawn length fixed. */
export function stubFrequencyPlot(name: string, build: StubBuild, grid: Grid, lengthUnit: 'mm' | 'mil'): PlotModel {
  const count = resonanceCount(build, grid.from, grid.to);
  if (!(count <= MAX_PLOT_RESONANCES)) throw tooMany(count);
  const xs = linearGrid(grid.from, grid.to, grid.points);
  const samples = sweepStubFrequency(build, xs);
  const resonances = stubResonances(build, grid.from, grid.to);
  const poles = resonances.filter((r) => r.type === 'parallel').map((r) => r.frequencyHz);
  const markers: Marker[] = resonances.map((r) => ({ kind: 'resonance', x: r.frequencyHz, type: r.type, label: markerLabel(r.frequencyHz, 'frequency', lengthUnit) }));
  return {
    title: `${stubTitle(name, build, lengthUnit)}: reactance vs frequency`,
    subtitle: `line ${build.lineName}; resonances from the engine (dashed), operating point at ${formatQuantity(build.frequencyHz, 'frequency')}${build.band ? ', band shaded' : ''}`,
    view: 'frequency', xQuantity: 'frequency', xLabel: 'frequency', xMin: grid.from, xMax: grid.to, lengthUnit,
    panels: stubPanels(build, xs, samples, poles, build.lengthM),
    ...(build.band ? { band: build.band } : {}),
    resonances: markers,
    operating: { x: build.frequencyHz, label: operatingLabel(build, lengthUnit) },
  };
}

/** A stub over drawn length, at its `at`. */
export function stubLengthPlot(name: string, build: StubBuild, grid: Grid, lengthUnit: 'mm' | 'mil'): PlotModel {
  const quarter = Math.PI / 2 / phaseConstant(build.line.model(build.frequencyHz).epsEff, build.frequencyHz);
  if (!((grid.to - grid.from) / quarter <= MAX_PLOT_RESONANCES)) throw tooMany((grid.to - grid.from) / quarter);
  const xs = linearGrid(grid.from, grid.to, grid.points);
  const samples = sweepStubLength(build, xs);
  const resonances = stubLengthResonances(build, grid.from, grid.to);
  const poles = resonances.filter((r) => r.type === 'parallel').map((r) => r.lengthM);
  const markers: Marker[] = resonances.map((r) => ({ kind: 'resonance', x: r.lengthM, type: r.type, label: markerLabel(r.lengthM, 'length', lengthUnit) }));
  const at = build.line.model(build.frequencyHz);
  const lambda = (2 * Math.PI) / phaseConstant(at.epsEff, build.frequencyHz);
  return {
    title: `${stubTitle(name, build, lengthUnit)}: reactance vs length at ${formatQuantity(build.frequencyHz, 'frequency')}`,
    subtitle: `line ${build.lineName}, λg ${formatQuantity(lambda, 'length', { lengthUnit })}; resonant drawn lengths dashed, the drawn length marked`,
    view: 'length', xQuantity: 'length', xLabel: 'drawn length', xMin: grid.from, xMax: grid.to, lengthUnit,
    panels: stubPanels(build, xs, samples, poles, build.lengthM),
    resonances: markers,
    operating: { x: build.lengthM, label: operatingLabel(build, lengthUnit) },
  };
}

/** A line on its own: Z0, εeff and loss over frequency. */
export function linePlot(name: string, line: LineBuild, atHz: number | null, grid: Grid, lengthUnit: 'mm' | 'mil'): PlotModel {
  const xs = linearGrid(grid.from, grid.to, grid.points);
  const s = sweepLine(line.model, xs);
  const range = (v: number[], pad: number, floor?: number) => {
    const lo = Math.min(...v);
    const hi = Math.max(...v);
    const m = Math.max((hi - lo) * pad, Math.abs(hi) * 0.01, 1e-12);
    return [floor !== undefined ? Math.max(floor, lo - m) : lo - m, hi + m] as const;
  };
  const z0 = range(s.map((p) => p.z0), 0.1);
  const eps = range(s.map((p) => p.epsEff), 0.1);
  const lossDb = s.map((p) => (p.alphaNpPerM * 20) / Math.LN10);
  const loss = range(lossDb, 0.1, 0);
  const op = atHz !== null ? line.model(atHz) : null;
  return {
    title: `${name}: line over frequency`,
    subtitle: line.modelName,
    view: 'frequency', xQuantity: 'frequency', xLabel: 'frequency', xMin: grid.from, xMax: grid.to, lengthUnit,
    panels: [
      { yQuantity: 'impedance', yLabel: 'Z0', yMin: z0[0], yMax: z0[1], traces: [{ quantity: 'z0', label: 'Z0', colour: 'blue', segments: segmentsOf(xs, (i) => s[i]!.z0) }], operatingY: op?.z0 ?? null },
      { yQuantity: 'ratio', yLabel: 'εeff', yMin: eps[0], yMax: eps[1], traces: [{ quantity: 'eps-eff', label: 'εeff', colour: 'green', segments: segmentsOf(xs, (i) => s[i]!.epsEff) }], operatingY: op?.epsEff ?? null },
      { yQuantity: 'db-per-m', yLabel: 'loss', yMin: loss[0], yMax: loss[1], traces: [{ quantity: 'loss', label: 'loss', colour: 'orange', segments: segmentsOf(xs, (i) => lossDb[i]!) }], operatingY: op ? (op.alpha * 20) / Math.LN10 : null },
    ],
    resonances: [],
    ...(atHz !== null && op ? { operating: { x: atHz, label: `Z0 ${formatQuantity(op.z0, 'impedance')}, εeff ${op.epsEff.toFixed(3)} at ${formatQuantity(atHz, 'frequency')}` } } : {}),
  };
}

/** A section of a line as a two-port: |S11| and |S21| in dB over frequency. */
export function lineSectionPlot(name: string, lineName: string, line: LineBuild, lengthM: number, referenceOhm: number, grid: Grid, lengthUnit: 'mm' | 'mil'): PlotModel {
  const xs = linearGrid(grid.from, grid.to, grid.points);
  const s = xs.map((f) => abcdToS(lineSectionAbcd(line, lengthM, f), referenceOhm));
  const db = (x: number) => 20 * Math.log10(Math.max(x, 1e-15));
  const s11 = s.map((p) => db(cabs(p.s11)));
  const s21 = s.map((p) => db(cabs(p.s21)));
  const s21Low = Math.min(...s21);
  const s11Low = Math.max(-80, Math.min(...s11) - 3);
  return {
    title: `${name}: ${formatQuantity(lengthM, 'length', { lengthUnit })} of line ${lineName} as a two-port`,
    subtitle: `S-parameters referred to ${formatQuantity(referenceOhm, 'impedance')}`,
    view: 'frequency', xQuantity: 'frequency', xLabel: 'frequency', xMin: grid.from, xMax: grid.to, lengthUnit,
    panels: [
      {
        yQuantity: 'db', yLabel: '|S21|', yMin: Math.min(s21Low - 0.1 * Math.abs(s21Low), -0.01), yMax: 0,
        traces: [{ quantity: 's21-db', label: '|S21|', colour: 'blue', segments: segmentsOf(xs, (i) => s21[i]!) }],
      },
      {
        yQuantity: 'db', yLabel: '|S11|', yMin: s11Low, yMax: Math.max(0, Math.max(...s11) + 3),
        traces: [{ quantity: 's11-db', label: '|S11|', colour: 'orange', segments: segmentsOf(xs, (i) => s11[i]!) }],
      },
    ],
    resonances: [],
  };
}
