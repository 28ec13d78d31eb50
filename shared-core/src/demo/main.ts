/** `npm start`: prints the invented demo scenario evaluated by the engine. */
import { board, evaluateScenario, f0 } from './scenario.js';

const mm = (m: number) => `${(m * 1e3).toFixed(2)} mm`;
const ghz = (hz: number | null) => (hz === null ? '—' : `${(hz / 1e9).toFixed(3)} GHz`);
const ohm = (x: number) => (Number.isFinite(x) ? `${(x + 0).toFixed(1).replace(/^-0\.0$/, '0.0')} Ω` : '∞');
const lc = (l: number | null, c: number | null) => (l !== null ? `${(l * 1e9).toFixed(2)} nH` : c !== null ? `${(c * 1e12).toFixed(3)} pF` : '—');

function table(headers: string[], rows: string[][]): string {
  const widths = headers.map((h, i) => Math.max(h.length, ...rows.map((r) => (r[i] ?? '').length)));
  const fmt = (r: string[]) => r.map((c, i) => c.padEnd(widths[i]!)).join('  ').trimEnd();
  return [fmt(headers), widths.map((w) => '─'.repeat(w)).join('  '), ...rows.map(fmt)].join('\n');
}

const { lines, stubs } = evaluateScenario();
console.log('Stubwright demo (invented scenario): 2.45 GHz sensor node');
console.log(`Board: Dk ${board.dk}, Df ${board.df}, h ${mm(board.heightM)}, copper ${(board.thicknessM * 1e6).toFixed(1)} µm (1 oz/ft²); f0 = ${ghz(f0)}\n`);
console.log(table(
  ['line', 'width', 'Z0', 'εeff (static)'],
  lines.map((l) => [l.name, mm(l.widthM), ohm(l.z0), l.epsEff.toFixed(4)]),
));
console.log('');
console.log(table(
  ['stub', 'kind', 'on', 'length', 'at', 'θ', 'R', 'X', 'L / C', 'acts as', 'resonance below', 'above', 'margin', 'band spread'],
  stubs.map((s) => [
    s.name, s.kind, s.line, mm(s.lengthM), ghz(s.frequencyHz), `${s.electricalDeg.toFixed(1)}°`, ohm(s.resistance), ohm(s.reactance),
    lc(s.inductance, s.capacitance), s.behaviour, ghz(s.resonanceBelowHz), ghz(s.resonanceAboveHz),
    `${s.marginPct.toFixed(1)} %`, s.bandSpreadPct === null ? '—' : `${s.bandSpreadPct.toFixed(1)} %`,
  ]),
));
console.log('\nRoles: ' + stubs.map((s) => `${s.name}: ${s.role}`).join('; '));
console.log('Loss: dielectric (Df) only; conductor loss is not modelled yet, so R here is a lower bound.');
console.log('Design estimates: confirm by measurement. At high RF power a resonant open end can arc; see README "Safety".');
