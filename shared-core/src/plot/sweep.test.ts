import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { cabs, cmul, csub, electricalLengthAt, nearestResonances, phaseConstant, resonanceFrequency } from '../engine/index.js';
import { evaluateSheet } from '../sheet/evaluate.js';
import type { StubBuild } from '../sheet/eval/stubPoint.js';
import { example } from '../sheet/testUtil.js';
import {
  defaultLengthSpan, defaultStubSpan, lineSectionAbcd, linearGrid, resonanceLength, stubLengthResonances, stubResonances, sweepStubFrequency, sweepStubLength,
} from './sweep.js';

// Invented stubs on invented boards: every kind of end, lossy and lossless lines, given and synthesized lengths.
const SHEET = [
  'let f0 = 2.45 GHz',
  'substrate board: dk 2.55 ± 0.04, df 0.0022, height 0.8 mm, copper 1 oz',
  'substrate bare: dk 4.3, df 0.02, height 1.6 mm',
  'line feed: microstrip on board, z0 50 ohm, at f0',
  'line thin: microstrip on board, width 0.4 mm',
  'line air: ideal, z0 60 ohm, velocity 0.8',
  'line lossyideal: ideal, z0 75 ohm, dk 2.2, df 0.001',
  'line cable: coax, inner 0.9 mm, outer 2.95 mm, dk 2.05, df 0.0003',
  'line strip: stripline on board, width 0.6 mm',
  'line cp: gcpw on bare, width 1 mm, gap 0.3 mm',
  'stub choke: short on thin, length 22.1 mm, at f0, resonant',
  'stub tune: open on feed, capacitance 0.9 pF, at f0, band 2.4 GHz .. 2.5 GHz',
  'stub viaed: short on feed, inductance 2.2 nH, at f0, via 0.4 mm',
  'stub idealopen: open on feed, length 12 mm, at f0, end ideal',
  'stub lossless: short on air, length 10 mm, at 3 GHz',
  'stub dk: open on lossyideal, length 30 mm, at 1 GHz',
  'stub coaxstub: short on cable, length 25 mm, at 1.5 GHz',
  'stub striped: open on strip, angle 60 deg, at 5 GHz',
  'stub cpstub: short on cp, length 8 mm, at 2 GHz',
  '',
].join('\n');

const result = evaluateSheet(SHEET);
const stubs = [...(result.models ?? new Map()).entries()].flatMap(([name, m]) => (m.kind === 'stub' ? [[name, m.stub] as [string, StubBuild]] : []));
const entry = (name: string) => result.entries.find((e) => e.name === name)!;

describe('stub sweeps use the sheet\'s own functions', () => {
  it('the sheet evaluates every stub (no errors)', () => {
    expect(result.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
    expect(stubs.map(([n]) => n)).toEqual(['choke', 'tune', 'viaed', 'idealopen', 'lossless', 'dk', 'coaxstub', 'striped', 'cpstub']);
  });

  it.each(stubs.map(([n]) => n))('a sweep point at the stub\'s "at" is exactly the sheet\'s reactance_ohm and resistance_ohm (%s)', (name) => {
    const build = stubs.find(([n]) => n === name)![1];
    const r = entry(name).results;
    const grid = linearGrid(build.frequencyHz * 0.5, build.frequencyHz * 1.5, 5); // the middle point is `at`
    expect(grid[2]).toBe(build.frequencyHz);
    const point = sweepStubFrequency(build, grid)[2]!.point;
    expect(point.reactance).toBe(r.reactance_ohm ?? Infinity);
    expect(point.resistance).toBe(r.resistance_ohm);
    expect(point.inductance).toBe(r.inductance_h);
    expect(point.capacitance).toBe(r.capacitance_f);
    expect(point.behaviour).toBe(r.behaviour);
    expect(point.effectiveLengthM).toBeCloseTo(r.effective_length_m as number, 15);
    // The length view at the drawn length is the same point.
    expect(sweepStubLength(build, [build.lengthM])[0]!.point).toEqual(point);
  });

  it('the resonances in a span are the engine\'s, equal to the sheet\'s nearest ones', () => {
    for (const [name, build] of stubs) {
      const r = entry(name).results;
      const found = stubResonances(build, 0, 4 * build.frequencyHz).map((x) => x.frequencyHz);
      expect(found, name).toContain(r.resonance_above_hz);
      if (r.resonance_below_hz !== null) expect(found, name).toContain(r.resonance_below_hz);
      for (const f of found) {
        // θ(f) at the sheet's effective length is a whole number of quarter waves there.
        const q = electricalLengthAt(build.line.model, resonanceLength(build), f) / (Math.PI / 2);
        expect(Math.abs(q - Math.round(q)), name).toBeLessThan(1e-9);
      }
    }
  });

  it('on a lossless line the reactance changes sign across each resonance and nowhere else in between', () => {
    const build = stubs.find(([n]) => n === 'lossless')![1];
    const res = stubResonances(build, 0.1e9, 25e9);
    expect(res.length).toBe(4); // λ/4 at 6 GHz: 6, 12, 18, 24 GHz
    const grid = linearGrid(0.1e9, 25e9, 997);
    const xs = sweepStubFrequency(build, grid).map((s) => s.point.reactance);
    for (let i = 1; i < xs.length; i++) {
      const between = res.some((r) => r.frequencyHz > grid[i - 1]! && r.frequencyHz <= grid[i]!);
      expect(Math.sign(xs[i]!) !== Math.sign(xs[i - 1]!), `${grid[i]} Hz`).toBe(between);
    }
    for (const r of res) {
      const [below, above] = sweepStubFrequency(build, [r.frequencyHz * (1 - 1e-6), r.frequencyHz * (1 + 1e-6)]).map((s) => s.point.reactance);
      expect(Math.sign(below!)).toBe(-Math.sign(above!));
      // A parallel resonance is a pole (|X| huge), a series one a zero.
      if (r.type === 'parallel') expect(Math.abs(below!)).toBeGreaterThan(1e5);
      else expect(Math.abs(below!)).toBeLessThan(1e-2);
    }
  });

  it('resonant drawn lengths at "at" are where the stub of that length resonates at "at"', () => {
    for (const [name, build] of stubs) {
      const span = defaultLengthSpan(build);
      const found = stubLengthResonances(build, span.from, span.to);
      expect(found.length, name).toBeGreaterThan(0);
      for (const r of found) {
        const extra = resonanceLength(build) - build.lengthM;
        const f = resonanceFrequency(build.line.model, r.lengthM + extra, r.quarterWaves);
        expect(f / build.frequencyHz, `${name} n=${r.quarterWaves}`).toBeCloseTo(1, 9);
      }
    }
  });

  it('default spans hold "at", the band widened by the margin, and the nearest resonance above when it is within 3.5 × at', () => {
    for (const [name, build] of stubs) {
      const span = defaultStubSpan(build);
      const f = build.frequencyHz;
      expect(span.from, name).toBeLessThan(f);
      expect(span.to, name).toBeGreaterThanOrEqual(2 * f);
      expect(span.to, name).toBeLessThan(4.1 * f);
      const above = entry(name).results.resonance_above_hz as number;
      if (above <= 3.5 * f) expect(span.to, name).toBeGreaterThan(above);
      const below = entry(name).results.resonance_below_hz;
      if (typeof below === 'number') expect(span.from, name).toBeLessThan(below);
      if (build.band) {
        expect(span.from).toBeLessThanOrEqual(build.band[0] * 0.9);
        expect(span.to).toBeGreaterThanOrEqual(build.band[1] * 1.1);
      }
    }
  });

  it('the example sheets\' stubs all sweep without throwing and give finite R', () => {
    for (const file of ['sensor-node', 'warnings-tour', 'power-check'] as const) {
      const r = evaluateSheet(example(file));
      for (const m of r.models?.values() ?? []) {
        if (m.kind !== 'stub') continue;
        const span = defaultStubSpan(m.stub);
        for (const s of sweepStubFrequency(m.stub, linearGrid(span.from, span.to, 101))) expect(Number.isFinite(s.point.resistance)).toBe(true);
      }
    }
  });
});

/** Every example sheet of the repository (examples/*.rfsheet), by file name. */
const EXAMPLES_DIR = fileURLToPath(new URL('../../../examples/', import.meta.url));
const EXAMPLE_FILES = readdirSync(EXAMPLES_DIR).filter((f) => f.endsWith('.rfsheet')).sort();

/** Share of the span between x and the nearer end ([from, to]); negative outside. */
const room = (span: { from: number; to: number }, x: number) => Math.min(x - span.from, span.to - x) / (span.to - span.from);

/** Checks that `at`, and the resonance nearest it where that lies within 3.5·at, sit inside the span with ≥ 5 % of it on each side. */
function expectRoom(build: StubBuild, span: { from: number; to: number }, what: string) {
  const f = build.frequencyHz;
  expect(room(span, f), `${what}: room around "at" ${f} Hz in ${span.from} … ${span.to}`).toBeGreaterThanOrEqual(0.05);
  const nearest = nearestResonances(build.kind, build.line.model, resonanceLength(build), f).nearest.frequencyHz;
  if (nearest <= 3.5 * f) expect(room(span, nearest), `${what}: room around the nearest resonance ${nearest} Hz in ${span.from} … ${span.to}`).toBeGreaterThanOrEqual(0.05);
}

describe('default frequency spans leave room on both sides of "at" and of its nearest resonance', () => {
  it('has example sheets to check', () => {
    expect(EXAMPLE_FILES.length).toBeGreaterThanOrEqual(4);
  });

  it.each(EXAMPLE_FILES)('every stub of examples/%s', (file) => {
    const r = evaluateSheet(readFileSync(join(EXAMPLES_DIR, file), 'utf8'));
    const built = [...(r.models?.values() ?? [])].flatMap((m) => (m.kind === 'stub' ? [m.stub] : []));
    const declared = r.entries.filter((e) => e.kind === 'stub');
    expect(built.length, file).toBe(declared.length);
    expect(built.length, file).toBeGreaterThan(0);
    for (const [i, build] of built.entries()) expectRoom(build, defaultStubSpan(build, 10), `${file} ${declared[i]!.name}`);
  });

  it('a stub exactly on its resonance (the demo\'s trap, λ/4 open at 2·f0) is drawn from near DC to past its next resonance', () => {
    const r = evaluateSheet(readFileSync(join(EXAMPLES_DIR, 'sensor-node.rfsheet'), 'utf8'));
    const m = r.models!.get('trap');
    if (m?.kind !== 'stub') throw new Error('no trap');
    const f = m.stub.frequencyHz;
    const span = defaultStubSpan(m.stub, 10);
    const next = stubResonances(m.stub, 1.01 * f, 3.5 * f)[0]!.frequencyHz; // the λ/2 parallel resonance
    expect(span.from).toBeLessThanOrEqual(0.05 * f);
    expect(span.to).toBeGreaterThan(next);
    expect(room(span, f)).toBeGreaterThan(0.3);
  });

  it('any stub length, on or off a resonance, short or many wavelengths long, with or without a band (property)', () => {
    const withBand = (build: StubBuild, band: boolean): StubBuild => ({ ...build, band: band ? [0.97 * build.frequencyHz, 1.03 * build.frequencyHz] : null });
    fc.assert(fc.property(
      fc.constantFrom(...stubs.map(([, b]) => b)),
      fc.integer({ min: 0, max: 60 }),
      fc.oneof(fc.constant(0), fc.constantFrom(1e-9, -1e-9, 1e-4, -1e-4), fc.double({ min: -0.49, max: 0.49, noNaN: true })),
      fc.boolean(),
      (build, quarterWaves, detune, band) => {
        // Drawn length for quarterWaves + detune quarter waves at `at` (effective length minus what the end adds).
        const f = build.frequencyHz;
        const quarter = Math.PI / 2 / phaseConstant(build.line.model(f).epsEff, f);
        const extra = resonanceLength(build) - build.lengthM;
        const lengthM = (quarterWaves + detune) * quarter - extra;
        fc.pre(lengthM > 1e-4);
        const b = withBand({ ...build, lengthM }, band);
        const span = defaultStubSpan(b, 10);
        expect(span.from).toBeGreaterThan(0);
        expectRoom(b, span, `${quarterWaves}${detune >= 0 ? '+' : ''}${detune} quarter waves`);
        if (b.band) {
          expect(span.from).toBeLessThanOrEqual(b.band[0] * 0.9);
          expect(span.to).toBeGreaterThanOrEqual(b.band[1] * 1.1);
        }
      },
    ), { numRuns: 150 });
  });
});

describe('linearGrid', () => {
  it('has the ends exactly and the asked number of points', () => {
    fc.assert(fc.property(fc.double({ min: 1, max: 1e10, noNaN: true }), fc.double({ min: 1e-6, max: 10, noNaN: true }), fc.integer({ min: 2, max: 2000 }), (from, width, points) => {
      const to = from * (1 + width);
      const g = linearGrid(from, to, points);
      expect(g).toHaveLength(points);
      expect(g[0]).toBe(from);
      expect(g[points - 1]).toBe(to);
      for (let i = 1; i < g.length; i++) expect(g[i]!).toBeGreaterThan(g[i - 1]!);
    }));
  });

  it.each([[1, 2, 1], [1, 2, 1.5], [1, 2, 10_002], [2, 1, 10], [1, 1, 10], [Number.NaN, 1, 10], [1, Infinity, 10]])('refuses from %d to %d with %d points', (from, to, points) => {
    expect(() => linearGrid(from, to, points)).toThrow(RangeError);
  });
});

describe('line sections (ABCD)', () => {
  const line = (name: string) => {
    const m = result.models!.get(name)!;
    if (m.kind !== 'line') throw new Error(name);
    return m.line;
  };

  it('a lossless quarter-wave section is the impedance inverter [0, jZ0; j/Z0, 0] (Pozar 4th ed. §5.5, from memory)', () => {
    const air = line('air');
    const f = 3e9;
    const quarter = Math.PI / 2 / phaseConstant(air.model(f).epsEff, f);
    const m = lineSectionAbcd(air, quarter, f);
    expect(cabs(m.a)).toBeLessThan(1e-12);
    expect(cabs(m.d)).toBeLessThan(1e-12);
    expect(m.b.im).toBeCloseTo(60, 9);
    expect(m.c.im).toBeCloseTo(1 / 60, 12);
  });

  it('every section is reciprocal and symmetric: AD − BC = 1, A = D (property)', () => {
    const names = ['feed', 'thin', 'air', 'lossyideal', 'cable', 'strip', 'cp'];
    fc.assert(fc.property(fc.constantFrom(...names), fc.double({ min: 1e-4, max: 0.3, noNaN: true }), fc.double({ min: 1e7, max: 2e10, noNaN: true }), (name, l, f) => {
      const m = lineSectionAbcd(line(name), l, f);
      const det = csub(cmul(m.a, m.d), cmul(m.b, m.c));
      expect(cabs(csub(det, { re: 1, im: 0 }))).toBeLessThan(1e-9 * Math.max(1, cabs(cmul(m.a, m.d))));
      expect(m.a).toEqual(m.d);
    }));
  });

  it('refuses a length that is not positive', () => {
    expect(() => lineSectionAbcd(line('feed'), 0, 1e9)).toThrow(RangeError);
  });
});
