/**
 * Hovers: on a name, the value it stands for; anywhere else on a declaration, a Markdown summary
 * of every result for that line (electrical length, Zin, L/C, resonances and margin, band, model).
 */
import { shownReactance } from '../sheet/eval/stubPoint.js';
import { formatQuantity } from '../sheet/format.js';
import type { Position, SheetEntry } from '../sheet/types.js';
import { equivalent, num, shower } from './display.js';
import { entryOnLine, symbolAt } from './locate.js';
import type { EvaluatedDocument, Hover } from './types.js';

export function getHover(doc: EvaluatedDocument, p: Position): Hover | null {
  const hit = symbolAt(doc, p);
  if (hit) {
    const entry = doc.result.entries.find((e) => e.name === hit.symbol.name && e.line === hit.symbol.declaration.start.line);
    if (!entry) return null;
    const isDeclaration = hit.range === hit.symbol.declaration;
    return { contents: isDeclaration ? summary(entry, doc) : brief(entry, doc), range: hit.range };
  }
  const entry = entryOnLine(doc, p.line);
  if (!entry || p.character > entry.range.end.character) return null;
  return { contents: summary(entry, doc), range: entry.range };
}

/** One line about a referenced name. */
function brief(entry: SheetEntry, doc: EvaluatedDocument): string {
  const show = shower(entry.results, doc.settings);
  const head = `**${entry.name}** (${entry.kind})`;
  switch (entry.kind) {
    case 'let':
      return `${head} = ${entry.results.value ?? '—'}`;
    case 'substrate':
      return `${head}: Dk ${entry.results.dk ?? '—'}, height ${show('height_m', 'length')}`;
    case 'line':
      return `${head}: Z0 ${show('z0_ohm', 'impedance')}, εeff ${num(entry.results, 'eps_eff')?.toFixed(4) ?? '—'}`;
    case 'stub':
      return `${head}: ${show('length_m', 'length')}, ${equivalent(entry, show) ?? 'resonant'} at ${show('frequency_hz', 'frequency')}`;
    case 'sweep':
      return `${head}: ${sweepLine(entry, show)}`;
  }
}

const row = (label: string, value: string) => `| ${label} | ${value} |`;

/** A sweep in one line: what, over which range, how many points. */
function sweepLine(entry: SheetEntry, show: ReturnType<typeof shower>): string {
  const r = entry.results;
  if (num(r, 'points') === null) return 'not evaluated';
  return `${r.target_kind === 'line' ? `${show('length_m', 'length')} of line` : 'stub'} ${r.target}, ${show('from_hz', 'frequency')} … ${show('to_hz', 'frequency')}, ${num(r, 'points')} points`;
}

/** The full story of one declaration as a Markdown table plus model notes. */
function summary(entry: SheetEntry, doc: EvaluatedDocument): string {
  const r = entry.results;
  const show = shower(r, doc.settings);
  const rows: string[] = [];
  /** " (min … max over tolerances)" when the result has toleranced companions. */
  const spread = (key: string, q: Parameters<typeof formatQuantity>[1]) =>
    num(r, `${key}_min`) !== null && num(r, `${key}_max`) !== null
      ? ` (${formatQuantity(num(r, `${key}_min`), q)} … ${formatQuantity(num(r, `${key}_max`), q)} over tolerances)`
      : '';
  const synth = (key: string) => (entry.synthesized.some((s) => s.key === key) ? ' (synthesized)' : '');
  if (entry.kind === 'line' && num(r, 'z0_ohm') !== null) {
    rows.push(row('Z0 (static)', show('z0_ohm', 'impedance') + spread('z0_ohm', 'impedance')), row('εeff (static)', num(r, 'eps_eff')!.toFixed(4)));
    if (num(r, 'width_m') !== null) rows.push(row('width', show('width_m', 'length') + synth('width')));
    if (num(r, 'frequency_hz') !== null) {
      const c = num(r, 'alpha_c_db_per_m');
      const split = c === null ? 'dielectric only' : `conductor ${c.toPrecision(3)} + dielectric ${num(r, 'alpha_d_db_per_m')!.toPrecision(3)}`;
      rows.push(
        row(`at ${show('frequency_hz', 'frequency')}`, `Z0 ${show('z0_at_f_ohm', 'impedance')}, εeff ${num(r, 'eps_eff_at_f')!.toFixed(4)}`),
        row('guided wavelength λg', show('wavelength_m', 'length')),
        row('loss', `${num(r, 'alpha_db_per_m')!.toPrecision(3)} dB/m (${split})`),
      );
    }
  } else if (entry.kind === 'stub' && num(r, 'length_m') !== null) {
    const model = doc.result.models?.get(entry.name);
    const z0 = model?.kind === 'stub' ? model.stub.line.model(model.stub.frequencyHz).z0 : 0;
    const computed = num(r, 'reactance_ohm');
    const x = computed === null ? null : shownReactance(computed, z0, num(r, 'resistance_ohm') ?? 0);
    const reactance = x === null ? '∞ (open circuit)' : `${x >= 0 ? '+' : '−'}j${formatQuantity(Math.abs(x), 'impedance')}`;
    const margin = num(r, 'resonance_margin_pct')!;
    rows.push(
      row('length', show('length_m', 'length') + synth('length')),
      row('electrical length', `${num(r, 'electrical_deg')!.toFixed(1)}° = ${num(r, 'wavelength_fraction')!.toFixed(4)} λg at ${show('frequency_hz', 'frequency')}`),
      row('Zin', `${show('resistance_ohm', 'resistance')} ${reactance}`),
      row('acts as', `${r.behaviour}${equivalent(entry, show) ? `, ${equivalent(entry, show)}` : ''}${spread('inductance_h', 'inductance')}${spread('capacitance_f', 'capacitance')}`),
      row('resonance below / above', `${show('resonance_below_hz', 'frequency')} / ${show('resonance_above_hz', 'frequency')}`),
      row('margin to nearest', `${margin.toFixed(1)} %${spread('resonance_margin_pct', 'percent')} (warning below ${doc.settings.marginPct} %)`),
    );
    if (num(r, 'q') !== null) rows.push(row('Q as an L or C (X / R)', x === 0 ? '0' : num(r, 'q')!.toPrecision(3)));
    if (num(r, 'bandwidth_hz') !== null) {
      rows.push(row('resonator Q · 3 dB bandwidth', `${num(r, 'resonator_q')!.toPrecision(3)} · ${show('bandwidth_hz', 'frequency')}`));
    }
    if (num(r, 'end_extension_m') !== null) rows.push(row('open-end extension', `+${show('end_extension_m', 'length')} (effective ${show('effective_length_m', 'length')})`));
    if (num(r, 'via_inductance_h') !== null) rows.push(row('via inductance', `${show('via_inductance_h', 'inductance')} (effective ${show('effective_length_m', 'length')})`));
    if (num(r, 'power_w') !== null) {
      rows.push(row(`at ${formatQuantity(num(r, 'power_w'), 'ratio')} W`, `peak ${formatQuantity(num(r, 'voltage_peak_v'), 'ratio')} V, ${formatQuantity(num(r, 'current_peak_a'), 'ratio')} A on the stub (estimate: confirm by measurement)`));
    }
    if (num(r, 'band_spread_pct') !== null) {
      const q = num(r, 'inductance_h') !== null ? 'inductance' : 'capacitance';
      rows.push(row('across the band', `${formatQuantity(num(r, 'band_min'), q)} … ${formatQuantity(num(r, 'band_max'), q)} (spread ${num(r, 'band_spread_pct')!.toFixed(1)} %)`));
    }
  }
  if (entry.kind === 'sweep' && num(r, 'points') !== null) {
    rows.push(row('sweep of', sweepLine(entry, show)));
    if (r.target_kind === 'stub') {
      rows.push(
        row('reactance over the range', `${show('reactance_min_ohm', 'reactance')} … ${show('reactance_max_ohm', 'reactance')} (at the sampled points)`),
        row('resonances in the range', num(r, 'resonance_count') === 0 ? 'none' : `${num(r, 'resonance_count')}: ${show('resonance_lowest_hz', 'frequency')} … ${show('resonance_highest_hz', 'frequency')}`),
      );
    } else {
      rows.push(row('insertion loss, worst', `${num(r, 'insertion_loss_db_max')!.toFixed(3)} dB`), row('return loss, worst', `${num(r, 'return_loss_db_min')!.toFixed(1)} dB`));
    }
    rows.push(row('export reference', show('reference_ohm', 'impedance')));
  }
  const head = `**${entry.name}** · ${entry.kind}`;
  const notes = entry.details.filter((d) => /^(model|line |tolerance|band |resonances in|no resonance)/.test(d) || rows.length === 0);
  const table = rows.length ? ['', '| | |', '|---|---|', ...rows].join('\n') : '';
  return [head + table, ...notes.map((n) => `\n_${n}_`)].join('\n');
}
