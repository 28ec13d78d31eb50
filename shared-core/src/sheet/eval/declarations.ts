/**
 * Evaluation of `let`, `substrate` and `line` declarations against the sheet scope.
 * Stubs, which carry the resonance checks, are in stub.ts.
 */
import { sigmaCopperAnnealed } from '../../engine/constants.js';
import { lossBreakdownDb } from '../../engine/lineLoss.js';
import { c0 } from '../../engine/constants.js';
import { formatValue, quantityKind, toSI, type Value } from '../expr/index.js';
import { formatQuantity } from '../format.js';
import type { LocalDiagnostic, ParsedDeclaration } from '../parse/lineParser.js';
import { SUBSTRATE_KEYS } from '../schema.js';
import { readItems, si, tol } from './items.js';
import { LINE_TYPES, type LineBuild } from './lineTypes.js';
import type { Outcome } from './outcome.js';
import { ValueReader, type SheetScope } from './values.js';

/** Resolved declarations a line or stub can stand on. */
export interface Resolved {
  substrate(name: string): Outcome | undefined;
  line(name: string): Outcome | undefined;
}

export const NEPER_TO_DB = 20 / Math.LN10;

/** Assembles an outcome; non-finite numbers in the results become null (results are JSON-safe). */
export function finish(reader: ValueReader, partial: Partial<Outcome> = {}): Outcome {
  const results = Object.fromEntries(Object.entries(partial.results ?? {}).map(([k, v]) => [k, typeof v === 'number' && !Number.isFinite(v) ? null : v]));
  return {
    details: [], synthesized: [], ...partial, results,
    diagnostics: [...reader.diagnostics, ...(partial.diagnostics ?? [])],
    reads: reader.reads, references: reader.references,
  };
}

export function evalLet(decl: ParsedDeclaration, scope: SheetScope): Outcome {
  const reader = new ValueReader(scope);
  const value = reader.letValue(decl.value!);
  if (!value) return finish(reader);
  const shown = value.type === 'range'
    ? `${formatValue(value.low)} .. ${formatValue(value.high)}`
    : `${formatValue(value.value)}${value.tolerance ? ` ± ${formatValue(value.tolerance.value)}${value.tolerance.percent ? ' %' : ''}` : ''}`;
  const si = (v: Value) => toSI(v, quantityKind(v)) ?? null;
  const results: Outcome['results'] = value.type === 'range'
    ? { value: shown, quantity: quantityKind(value.low), low_si: si(value.low), high_si: si(value.high) }
    : { value: shown, quantity: quantityKind(value.value), value_si: si(value.value) };
  return finish(reader, { letValue: value, details: [`${decl.name.text} = ${shown}`], results });
}

export function evalSubstrate(decl: ParsedDeclaration, scope: SheetScope): Outcome {
  const reader = new ValueReader(scope);
  const values = readItems(reader, SUBSTRATE_KEYS, decl.items, 'substrate', decl.name);
  const dk = si(values, 'dk');
  const height = si(values, 'height');
  if (dk === undefined || height === undefined) return finish(reader);
  const range = (key: string, ok: boolean, message: string) => {
    if (ok) return true;
    const item = values.get(key)!.item;
    reader.error(item.value!.start, item.value!.end, 'range', message);
    return false;
  };
  const df = si(values, 'df') ?? 0;
  const copper = si(values, 'copper') ?? 0;
  const valid = [
    range('dk', dk >= 1, `dk must be at least 1 (vacuum), got ${dk}`),
    range('height', height > 0, 'height must be positive'),
    !values.has('df') || range('df', df >= 0 && df < 1, `df is a loss tangent between 0 and 1, got ${df}`),
    !values.has('copper') || range('copper', copper >= 0 && copper < height * 10, 'copper thickness must be zero or positive (and thinner than ten board heights)'),
  ].every(Boolean);
  if (!valid) return finish(reader);
  const substrate = {
    dk, dkTol: tol(values, 'dk'), df, heightM: height, heightTol: tol(values, 'height'), copperM: copper,
    conductivity: si(values, 'conductivity') ?? sigmaCopperAnnealed, roughnessM: si(values, 'roughness') ?? 0,
  };
  return finish(reader, {
    substrate,
    results: { dk, df, height_m: height, copper_m: copper, conductivity_s_per_m: si(values, 'conductivity') ?? sigmaCopperAnnealed },
    details: [
      `Dk ${dk}${substrate.dkTol ? ` ± ${substrate.dkTol.toPrecision(3)}` : ''}, Df ${df}`,
      `height ${formatQuantity(height, 'length')}${substrate.heightTol ? ` ± ${formatQuantity(substrate.heightTol, 'length')}` : ''}, copper ${formatQuantity(copper, 'length')}`,
    ],
  });
}

export function evalLine(decl: ParsedDeclaration, scope: SheetScope, resolved: Resolved): Outcome {
  const reader = new ValueReader(scope);
  const head = decl.head;
  if (!head) return finish(reader);
  const type = LINE_TYPES[head.word.text];
  if (!type) {
    reader.error(head.word.start, head.word.end, 'syntax', `unknown line type "${head.word.text}"; expected one of: ${Object.keys(LINE_TYPES).join(', ')}`);
    return finish(reader);
  }
  const values = readItems(reader, type.keys, decl.items, `${head.word.text} line`, decl.name);
  let substrate;
  if (type.needsSubstrate) {
    if (!head.on) {
      reader.error(head.word.start, head.word.end, 'missing', `a ${head.word.text} line needs a substrate: "${head.word.text} on NAME"`);
      return finish(reader);
    }
    substrate = lookup(reader, head.on, 'substrate', resolved.substrate(head.on.text))?.substrate;
    if (!substrate) return finish(reader);
  } else if (head.on) {
    reader.error(head.on.start, head.on.end, 'syntax', `${/^[aeiou]/i.test(head.word.text) ? 'an' : 'a'} ${head.word.text} line needs no substrate: remove "on ${head.on.text}"`);
  }
  if (type.keys.required.some((g) => !g.some((k) => values.has(k)))) return finish(reader);
  let build: LineBuild;
  try {
    build = type.build(values, substrate ?? null);
  } catch (e) {
    if (!(e instanceof RangeError)) throw e;
    // Point at the key the engine names ("velocity factor must…", "widthM must…", "Z0 = … is not
    // reachable"), else at the width or z0 that sets the geometry.
    const all = [...values.values()];
    const named = all.find((v) => new RegExp(`^${v.key}M?\\b`, 'i').test(e.message));
    const target = (named ?? all.find((v) => v.key === 'z0' || v.key === 'width'))?.item ?? decl.items[0];
    const at = target?.value ?? decl.name;
    reader.error(at.start, at.end, 'range', e.message.replace(/\b(width|height|thickness|gap|innerDiameter|outerDiameter)M\b/g, '$1'));
    return finish(reader);
  }
  if (!(Number.isFinite(build.z0) && build.z0 > 0 && Number.isFinite(build.epsEff) && build.epsEff > 0)) {
    // Extreme input (a width of 1e-300 m) can take a closed-form model past what floating point holds.
    const at = ([...values.values()].find((v) => v.key === 'z0' || v.key === 'width')?.item ?? decl.items[0])?.value ?? decl.name;
    reader.error(at.start, at.end, 'range', `the ${head.word.text} model gives no finite Z0 and εeff for these values: check them and their units`);
    return finish(reader);
  }
  const f = si(values, 'at');
  const diagnostics: LocalDiagnostic[] = validityDiagnostics(build, f ?? 0, head.word);
  const results: Outcome['results'] = { z0_ohm: build.z0, eps_eff: build.epsEff, width_m: build.widthM };
  const corners = build.corners().map((m) => m(0));
  if (corners.length > 0) {
    const z0s = corners.map((c) => c.z0);
    const eps = corners.map((c) => c.epsEff);
    Object.assign(results, { z0_ohm_min: Math.min(...z0s), z0_ohm_max: Math.max(...z0s), eps_eff_min: Math.min(...eps), eps_eff_max: Math.max(...eps) });
  }
  const details = [
    `Z0 ${formatQuantity(build.z0, 'impedance')}, εeff ${build.epsEff.toFixed(4)} (static)${build.widthM !== null ? `, width ${formatQuantity(build.widthM, 'length')}${build.synthesizedWidthM !== null ? ' (synthesized)' : ''}` : ''}`,
  ];
  if (f !== undefined) {
    const at = build.model(f);
    const wavelength = c0 / (f * Math.sqrt(at.epsEff));
    const loss = build.lossy ? lossBreakdownDb(build.lossy(f)) : { alphaCDbPerM: null, alphaDDbPerM: at.alpha * NEPER_TO_DB, alphaDbPerM: at.alpha * NEPER_TO_DB };
    Object.assign(results, {
      frequency_hz: f, eps_eff_at_f: at.epsEff, z0_at_f_ohm: at.z0, wavelength_m: wavelength, loss_db_per_m: loss.alphaDbPerM,
      alpha_db_per_m: loss.alphaDbPerM, alpha_c_db_per_m: loss.alphaCDbPerM, alpha_d_db_per_m: loss.alphaDDbPerM,
      alpha_np_per_m: loss.alphaDbPerM / NEPER_TO_DB,
    });
    const split = loss.alphaCDbPerM === null ? 'dielectric only' : `conductor ${loss.alphaCDbPerM.toPrecision(3)} + dielectric ${loss.alphaDDbPerM.toPrecision(3)}`;
    details.push(`at ${formatQuantity(f, 'frequency')}: Z0 ${formatQuantity(at.z0, 'impedance')}, εeff ${at.epsEff.toFixed(4)}, λg ${formatQuantity(wavelength, 'length')}, loss ${loss.alphaDbPerM.toPrecision(3)} dB/m = ${(loss.alphaDbPerM / NEPER_TO_DB).toPrecision(3)} Np/m (${split})`);
    if (build.lossNote) details.push(build.lossNote);
  }
  details.push(`model: ${build.modelName}`);
  const synthesized = build.synthesizedWidthM !== null
    ? [{ key: 'width', valueSI: build.synthesizedWidthM, start: values.get('z0')!.item.span.start, end: values.get('z0')!.item.span.end }]
    : [];
  return finish(reader, { line: build, results, details, synthesized, diagnostics });
}

/** Validity notes of a line at f as `model-validity` warnings on `at` (deduplicated by message). */
export function validityDiagnostics(build: LineBuild, f: number, at: { start: number; end: number }): LocalDiagnostic[] {
  const seen = new Set<string>();
  return build.notes(f).filter((n) => !seen.has(n.message) && seen.add(n.message)).map((n) => ({
    start: at.start, end: at.end, severity: 'warning' as const, code: 'model-validity' as const,
    message: `${n.message}: results are outside the model's published range`,
  }));
}

/** Resolves `on NAME` to a declaration of the wanted kind, reporting a located error otherwise. */
export function lookup(reader: ValueReader, on: { text: string; start: number; end: number }, kind: 'substrate' | 'line', outcome: Outcome | undefined): Outcome | undefined {
  reader.reads.add(on.text);
  const actual = reader.scope.kinds.get(on.text);
  if (actual === undefined) {
    reader.error(on.start, on.end, 'unknown-name', `no ${kind} named ${on.text}: declare "${kind} ${on.text}: …" or fix the name`);
    return undefined;
  }
  reader.references.push({ name: on.text, start: on.start, end: on.end });
  if (actual !== kind) {
    reader.error(on.start, on.end, 'unknown-name', `${on.text} is a ${actual}; ${kind === 'substrate' ? 'a line goes on a substrate' : 'a stub goes on a line'}`);
    return undefined;
  }
  return outcome;
}
