/**
 * Invented demo scenario (not a real product): a 2.45 GHz sensor node on a 0.8 mm glass-PTFE board.
 * A 50 Ω feed, a quarter-wave bias choke on a thin line, a second-harmonic trap and a tuning stub.
 */
import {
  analyseBand, analyseStub, copperThicknessPerOz, microstripLine, microstripStatic, microstripWidthForZ0,
  nearestResonances, synthesizeStub, type LineModel, type StubKind, type StubTarget,
} from '../engine/index.js';

export const f0 = 2.45e9;
export const band = { lowHz: 2.4e9, highHz: 2.5e9 };
export const board = { dk: 2.55, df: 0.0022, heightM: 0.8e-3, thicknessM: copperThicknessPerOz };

export interface DemoLine {
  name: string;
  widthM: number;
  z0: number;
  epsEff: number;
  model: LineModel;
}

export interface DemoStub {
  name: string;
  role: string;
  kind: StubKind;
  line: string;
  lengthM: number;
  frequencyHz: number;
  electricalDeg: number;
  resistance: number;
  reactance: number;
  inductance: number | null;
  capacitance: number | null;
  behaviour: string;
  resonanceBelowHz: number | null;
  resonanceAboveHz: number;
  marginPct: number;
  bandSpreadPct: number | null;
}

function line(name: string, spec: { widthM: number } | { z0: number }): DemoLine {
  const widthM = 'widthM' in spec ? spec.widthM : microstripWidthForZ0({ z0: spec.z0, ...board }).widthM;
  const geometry = { widthM, heightM: board.heightM, dk: board.dk, thicknessM: board.thicknessM };
  const stat = microstripStatic(geometry);
  return { name, widthM, z0: stat.z0, epsEff: stat.epsEff, model: microstripLine({ ...geometry, df: board.df }) };
}

function stub(name: string, role: string, kind: StubKind, on: DemoLine, target: StubTarget | { lengthM: number }, frequencyHz: number): DemoStub {
  const lengthM = 'lengthM' in target ? target.lengthM : synthesizeStub(kind, on.model, target, frequencyHz).lengthM;
  const a = analyseStub(kind, on.model, lengthM, frequencyHz);
  const r = nearestResonances(kind, on.model, lengthM, frequencyHz);
  const b = analyseBand(kind, on.model, lengthM, band.lowHz, band.highHz);
  return {
    name, role, kind, line: on.name, lengthM, frequencyHz,
    electricalDeg: a.electricalDeg, resistance: a.resistance, reactance: a.reactance, inductance: a.inductance, capacitance: a.capacitance,
    behaviour: a.behaviour, resonanceBelowHz: r.below?.frequencyHz ?? null, resonanceAboveHz: r.above.frequencyHz,
    marginPct: r.marginPct, bandSpreadPct: b.spreadPct,
  };
}

/** Evaluates the whole scenario with the engine. */
export function evaluateScenario(): { lines: DemoLine[]; stubs: DemoStub[] } {
  const feed = line('feed', { z0: 50 });
  const thin = line('thin', { widthM: 0.4e-3 });
  const stubs = [
    stub('choke', 'bias choke (λ/4 short: open at f0)', 'short', thin, { kind: 'angle', radians: Math.PI / 2 }, f0),
    stub('trap', '2nd-harmonic trap (λ/4 open at 2·f0)', 'open', feed, { kind: 'angle', radians: Math.PI / 2 }, 2 * f0),
    stub('tune', 'tuning capacitor 0.9 pF', 'open', feed, { kind: 'capacitance', farads: 0.9e-12 }, f0),
  ];
  // The trap is built for 2·f0 but sits on the feed at f0 too: show what it does there.
  const trapAtF0 = stub('trap@f0', 'the same trap seen at f0', 'open', feed, { lengthM: stubs[1]!.lengthM }, f0);
  return { lines: [feed, thin], stubs: [...stubs, trapAtF0] };
}
