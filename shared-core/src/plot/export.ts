/**
 * Export data of a stub, a line section and a line over a frequency grid: Touchstone network data
 * and CSV tables, from the same sweep functions the plots use. Pure.
 */
import type { LineBuild } from '../sheet/eval/lineTypes.js';
import type { StubBuild } from '../sheet/eval/stubPoint.js';
import { renderCsv, type CsvValue } from './csv.js';
import { abcdToS, onePortS, shuntS } from './sparams.js';
import { lineSectionAbcd, sweepLine, sweepStubFrequency } from './sweep.js';
import type { NetworkData } from './touchstone.js';

/** A stub as a one-port to ground (`ports` 1) or in shunt across a through line (`ports` 2). */
export function stubNetwork(build: StubBuild, frequenciesHz: readonly number[], ports: 1 | 2, referenceOhm: number, comments: string[]): NetworkData {
  const s = sweepStubFrequency(build, frequenciesHz).map(({ point }) => {
    if (ports === 1) return [onePortS(point.zin, referenceOhm)];
    const t = shuntS(point.zin, referenceOhm);
    return [t.s11, t.s21, t.s12, t.s22];
  });
  return { ports, referenceOhm, frequenciesHz: [...frequenciesHz], s, comments };
}

/** A line section of length l as a two-port. */
export function lineSectionNetwork(line: LineBuild, lengthM: number, frequenciesHz: readonly number[], referenceOhm: number, comments: string[]): NetworkData {
  const s = frequenciesHz.map((f) => {
    const t = abcdToS(lineSectionAbcd(line, lengthM, f), referenceOhm);
    return [t.s11, t.s21, t.s12, t.s22];
  });
  return { ports: 2, referenceOhm, frequenciesHz: [...frequenciesHz], s, comments };
}

/** Columns of a stub's CSV. */
export const STUB_CSV_HEADER = ['frequency_hz', 'resistance_ohm', 'reactance_ohm', 'inductance_h', 'capacitance_f', 's11_re', 's11_im'] as const;

/** R, X, the equivalent L or C and the one-port S11 of a stub per frequency (SI; empty where undefined). */
export function stubCsv(build: StubBuild, frequenciesHz: readonly number[], referenceOhm: number): string {
  const rows: CsvValue[][] = sweepStubFrequency(build, frequenciesHz).map(({ frequencyHz, point }) => {
    const s = onePortS(point.zin, referenceOhm);
    return [frequencyHz, point.resistance, Number.isFinite(point.reactance) ? point.reactance : null, point.inductance, point.capacitance, s.re, s.im];
  });
  return renderCsv(STUB_CSV_HEADER, rows);
}

export const SECTION_CSV_HEADER = ['frequency_hz', 's11_re', 's11_im', 's21_re', 's21_im', 's12_re', 's12_im', 's22_re', 's22_im'] as const;

/** S-parameters of a line section per frequency. */
export function lineSectionCsv(line: LineBuild, lengthM: number, frequenciesHz: readonly number[], referenceOhm: number): string {
  const net = lineSectionNetwork(line, lengthM, frequenciesHz, referenceOhm, []);
  return renderCsv(SECTION_CSV_HEADER, net.frequenciesHz.map((f, i) => [f, ...net.s[i]!.flatMap((z) => [z.re, z.im])]));
}

export const LINE_CSV_HEADER = ['frequency_hz', 'z0_ohm', 'eps_eff', 'alpha_db_per_m'] as const;

/** Z0, εeff and attenuation of a line per frequency. */
export function lineCsv(line: LineBuild, frequenciesHz: readonly number[]): string {
  return renderCsv(LINE_CSV_HEADER, sweepLine(line.model, frequenciesHz).map((p) => [p.frequencyHz, p.z0, p.epsEff, (p.alphaNpPerM * 20) / Math.LN10]));
}
