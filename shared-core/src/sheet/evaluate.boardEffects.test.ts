import { describe, expect, it } from 'vitest';
import {
  analyseEndedStub, coplanarConductorAlpha, coplanarStatic, goldfarbPucelInductance, microstripLossyLine, openEndExtension, striplineStatic,
} from '../engine/index.js';
import { c0 } from '../engine/constants.js';
import { evaluateSheet } from './evaluate.js';
import { only } from './testUtil.js';

const BOARD = 'substrate b: dk 3.5 ± 0.05, df 0.002, height 0.8 mm, copper 35 um, roughness 1 um';
const results = (text: string, name: string) => {
  const r = evaluateSheet(text);
  return { r, e: r.entries.find((x) => x.name === name)!.results };
};

describe('line types beyond microstrip', () => {
  it('stripline: synthesized width reproduces the target with the engine model, conductor loss reported', () => {
    const { r, e } = results(`${BOARD}\nline s: stripline on b, z0 50 ohm, at 5 GHz`, 's');
    expect(r.diagnostics).toEqual([]);
    const z0 = striplineStatic({ widthM: e.width_m as number, heightM: 0.8e-3, dk: 3.5, thicknessM: 35e-6 }).z0;
    expect(z0).toBeCloseTo(50, 6);
    expect(e.alpha_c_db_per_m).toBeGreaterThan(0);
    expect(e.alpha_db_per_m).toBeCloseTo((e.alpha_c_db_per_m as number) + (e.alpha_d_db_per_m as number), 10);
    expect(e.alpha_np_per_m as number).toBeCloseTo((e.alpha_db_per_m as number) * Math.LN10 / 20, 12); // 1 Np = 20/ln 10 dB
  });

  it('cpw and gcpw need a gap, and a ground below raises εeff and lowers Z0', () => {
    expect(only(`${BOARD}\nline c: cpw on b, width 1 mm`).code).toBe('missing');
    const text = `substrate t: dk 3.5, height 0.8 mm\nline c: cpw on t, width 1 mm, gap 0.3 mm\nline g: gcpw on t, width 1 mm, gap 0.3 mm`;
    const r = evaluateSheet(text);
    expect(r.diagnostics).toEqual([]);
    const [c, g] = ['c', 'g'].map((n) => r.entries.find((x) => x.name === n)!.results);
    expect(c!.z0_ohm).toBeCloseTo(coplanarStatic({ widthM: 1e-3, gapM: 0.3e-3, heightM: 0.8e-3, dk: 3.5, grounded: false }).z0, 9);
    expect(g!.z0_ohm as number).toBeLessThan(c!.z0_ohm as number);
    expect(g!.eps_eff as number).toBeGreaterThan(c!.eps_eff as number);
    expect(c!.alpha_c_db_per_m ?? null).toBeNull(); // no `at`: no loss figures
  });

  it('cpw and gcpw with copper: slot-wall thickness lowers Z0, conductor loss by Owyang–Wu, Q of a stub finite', () => {
    const text = `substrate t: dk 3.5, df 0.002, height 0.8 mm, copper 35 um
line c: cpw on t, width 1 mm, gap 0.3 mm, at 2.45 GHz
line bare: cpw on t, width 1 mm, gap 0.3 mm, at 2.45 GHz
substrate n: dk 3.5, df 0.002, height 0.8 mm
line nc: cpw on n, width 1 mm, gap 0.3 mm, at 2.45 GHz
stub s: short on c, inductance 1 nH, at 2.45 GHz`;
    const r = evaluateSheet(text);
    expect(r.diagnostics).toEqual([]);
    const get = (n: string) => r.entries.find((x) => x.name === n)!;
    const c = get('c').results;
    const thin = get('nc').results;
    const geometry = { widthM: 1e-3, gapM: 0.3e-3, heightM: 0.8e-3, dk: 3.5, grounded: false, thicknessM: 35e-6 };
    expect(c.z0_ohm).toBeCloseTo(coplanarStatic(geometry).z0, 9);
    expect(c.z0_ohm as number).toBeLessThan(thin.z0_ohm as number);
    const alphaC = coplanarConductorAlpha({ widthM: 1e-3, gapM: 0.3e-3, thicknessM: 35e-6 }, coplanarStatic(geometry).z0, 2.45e9);
    expect(c.alpha_c_db_per_m).toBeCloseTo(alphaC * (20 / Math.LN10), 9);
    expect(thin.alpha_c_db_per_m).toBe(0);
    expect(get('nc').details.join('\n')).toMatch(/conductor loss needs the copper thickness/);
    expect(get('c').details.join('\n')).toMatch(/Owyang–Wu/);
    const q = get('s').results.q as number;
    expect(q).toBeGreaterThan(10);
    expect(q).toBeLessThan(1000);
  });
});

describe('end effects', () => {
  const LINE = `${BOARD}\nline m: microstrip on b, width 1.7 mm`;
  const geometry = { widthM: 1.7e-3, heightM: 0.8e-3, dk: 3.5, thicknessM: 35e-6 };

  it('an open stub reports the open-end extension and is drawn that much shorter for the same C', () => {
    const corrected = results(`${LINE}\nstub s: open on m, capacitance 1 pF, at 2.45 GHz`, 's').e;
    const ideal = results(`${LINE}\nstub s: open on m, capacitance 1 pF, at 2.45 GHz, end ideal`, 's').e;
    const dl = openEndExtension(geometry).extensionM;
    expect(corrected.end_extension_m).toBeCloseTo(dl, 12);
    expect(ideal.end_extension_m).toBeNull();
    expect((ideal.length_m as number) - (corrected.length_m as number)).toBeCloseTo(dl, 9);
    expect(corrected.capacitance_f as number).toBeCloseTo(1e-12, 15);
  });

  it('a via adds its Goldfarb–Pucel inductance; the synthesized drawn length still gives the target', () => {
    const { e } = results(`${LINE}\nstub s: short on m, inductance 2 nH, at 2.45 GHz, via 0.4 mm`, 's');
    expect(e.via_inductance_h).toBeCloseTo(goldfarbPucelInductance(0.8e-3, 0.2e-3), 18);
    const plain = results(`${LINE}\nstub s: short on m, inductance 2 nH, at 2.45 GHz`, 's').e;
    expect(e.length_m as number).toBeLessThan(plain.length_m as number);
    const line = microstripLossyLine({ ...geometry, df: 0.002, conductivity: 5.8e7, roughnessM: 1e-6 });
    const a = analyseEndedStub({ kind: 'short', viaInductanceH: e.via_inductance_h as number }, line, e.length_m as number, 2.45e9);
    expect(a.inductance! / 2e-9).toBeCloseTo(1, 6);
  });

  it('refuses a via on an open stub, "end" on a short stub, and a via on a line with no board', () => {
    expect(only(`${LINE}\nstub s: open on m, length 5 mm, at 2.45 GHz, via 0.4 mm`).code).toBe('conflict');
    expect(only(`${LINE}\nstub s: short on m, length 5 mm, at 2.45 GHz, end ideal`).code).toBe('conflict');
    expect(only('line i: ideal, z0 50 ohm, dk 2\nstub s: short on i, length 5 mm, at 2.45 GHz, via 0.4 mm').code).toBe('range');
    expect(only(`${LINE}\nstub s: open on m, length 5 mm, at 2.45 GHz, end maybe`).code).toBe('syntax');
  });
});

describe('loss, Q and bandwidth', () => {
  it('a resonant stub reports its resonator Q and 3 dB bandwidth = f_res / Q', () => {
    const { e } = results(`${BOARD}\nline m: microstrip on b, width 1.7 mm\nstub c: short on m, angle 90 deg, at 2.45 GHz, resonant`, 'c');
    expect(e.resonator_q as number).toBeGreaterThan(20);
    expect(e.bandwidth_hz as number).toBeCloseTo((e.resonance_nearest_hz as number) / (e.resonator_q as number), 0);
  });

  it('rougher copper gives more conductor loss and a lower stub Q', () => {
    const sheet = (rough: string) => `substrate b: dk 3.5, df 0.002, height 0.8 mm, copper 35 um, roughness ${rough}\nline m: microstrip on b, width 1.7 mm, at 5 GHz\nstub s: short on m, length 4 mm, at 5 GHz`;
    const smooth = evaluateSheet(sheet('0 um'));
    const rough = evaluateSheet(sheet('2 um'));
    const get = (r: typeof smooth, n: string, k: string) => r.entries.find((x) => x.name === n)!.results[k] as number;
    expect(get(rough, 'm', 'alpha_c_db_per_m')).toBeGreaterThan(get(smooth, 'm', 'alpha_c_db_per_m'));
    expect(get(rough, 's', 'q')).toBeLessThan(get(smooth, 's', 'q'));
  });
});

describe('power', () => {
  it('reports peak voltage and current, and stays quiet at low power', () => {
    const text = (p: string) => `line l: ideal, z0 50 ohm, dk 4\nstub p: open on l, length 30 mm, at 1 GHz, power ${p}`;
    const low = evaluateSheet(text('100 mW'));
    expect(low.diagnostics).toEqual([]);
    const e = low.entries.find((x) => x.name === 'p')!.results;
    // Lossless open stub at θ ≈ 72°: Zin = −j50·cot θ; junction voltage √(2·P·Z0)·|2/(2 + Z0/Zin)|,
    // end voltage V_j/|cos βl| (line equations; Pozar, Microwave Engineering, 4th ed., §2.1, from memory).
    const theta = (2 * Math.PI * 1e9 * 2 * 0.03) / c0;
    const zin = -50 / Math.tan(theta);
    const vj = Math.sqrt(2 * 0.1 * 50) * Math.abs(2 / Math.hypot(2, 50 / zin));
    expect(e.voltage_peak_v as number).toBeCloseTo(vj / Math.cos(theta), 6);
    expect(evaluateSheet(text('100 W')).diagnostics.map((d) => d.code)).toEqual(['power']);
  });

  it('wants a power', () => {
    expect(only('line l: ideal, z0 50 ohm, dk 4\nstub p: open on l, length 30 mm, at 1 GHz, power 3 V').code).toBe('unit');
  });
});
