/**
 * Deterministic generator of realistic sheets for the benchmark: a header of lets and substrates,
 * then repeated blocks of `let`, `line … microstrip …` and `stub …` declarations with unique names
 * and a few comments, exactly `lines` lines long. Seeded, so every run measures the same text.
 */

/** Small fast seeded PRNG (mulberry32). */
export function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** What a generated stub asks for: enough for the raw-engine baseline to mirror it. */
export interface StubSpec {
  line: number;
  name: string;
  kind: 'open' | 'short';
  on: string;
  /** Given length in m, or a synthesis target. */
  lengthM?: number;
  target?: { kind: 'capacitance'; farads: number } | { kind: 'inductance'; henries: number };
  band: boolean;
}

export interface LineSpec {
  line: number;
  name: string;
  board: 'fr' | 'ptfe';
  widthM?: number;
  z0?: number;
}

export interface GeneratedSheet {
  text: string;
  lines: string[];
  stubs: StubSpec[];
  microstrips: LineSpec[];
}

/** The header's boards, in SI, for the raw-engine baseline (nominal values, no tolerances). */
export const BOARDS = {
  fr: { dk: 4.3, df: 0.017, heightM: 1.6e-3, thicknessM: 35e-6, roughnessM: 1e-6 },
  ptfe: { dk: 3.0, df: 0.0013, heightM: 0.76e-3, thicknessM: 17.5e-6, roughnessM: 0.5e-6 },
} as const;
export const F0 = 2.45e9;
export const BAND: [number, number] = [2.4e9, 2.5e9];

const HEADER = [
  '# Generated benchmark sheet (deterministic): a 2.45 GHz board with many stubs.',
  'let f0 = 2.45 GHz',
  'let band = 2.40 GHz .. 2.50 GHz',
  'substrate fr: dk 4.3 ± 0.1, df 0.017, height 1.6 mm ± 0.1 mm, copper 1 oz, roughness 1 um',
  'substrate ptfe: dk 3.0, df 0.0013, height 0.76 mm, copper 0.5 oz, roughness 0.5 um',
  '',
];

const fmt = (x: number, digits = 2) => x.toFixed(digits);

/** A sheet of exactly `total` lines (total ≥ header length). */
export function generateSheet(total: number, seed = 1): GeneratedSheet {
  const random = rng(seed);
  const lines = [...HEADER];
  const stubs: StubSpec[] = [];
  const microstrips: LineSpec[] = [];
  let block = 0;
  let currentLine = '';
  const push = (s: string) => lines.length < total && lines.push(s);
  while (lines.length < total) {
    const b = block++;
    if (b % 5 === 0) push(`# block ${b}: bias network and tuning stubs`);
    // A line every other block, so several stubs share a line.
    if (b % 2 === 0 && lines.length < total) {
      const board = random() < 0.5 ? 'fr' : 'ptfe';
      const name = `ln${b}`;
      if (random() < 0.5) {
        const widthMm = 0.3 + random() * 2.5;
        microstrips.push({ line: lines.length, name, board, widthM: widthMm * 1e-3 });
        push(`line ${name}: microstrip on ${board}, width ${fmt(widthMm)} mm, at f0`);
      } else {
        const z0 = [35, 50, 75, 90][Math.floor(random() * 4)]!;
        microstrips.push({ line: lines.length, name, board, z0 });
        push(`line ${name}: microstrip on ${board}, z0 ${z0} Ω`);
      }
      currentLine = name;
    }
    if (lines.length < total) push(`let len${b} = ${fmt(2 + random() * 8)} mm`);
    // Three stubs per block: a given length (from the let), a capacitance and an inductance target.
    for (let k = 0; k < 3 && lines.length < total; k++) {
      const name = `s${b}_${k}`;
      const kind: 'open' | 'short' = k === 1 ? 'open' : k === 2 ? 'short' : random() < 0.5 ? 'open' : 'short';
      const band = random() < 0.7;
      const tail = `, at f0${band ? ', band band' : ''}`;
      const comment = random() < 0.15 ? '   # tuning' : '';
      const line = lines.length;
      if (k === 0) {
        const lengthMm = Number(lines[lines.length - 1 - k]!.match(/= ([\d.]+) mm/)?.[1] ?? 5);
        stubs.push({ line, name, kind, on: currentLine, lengthM: lengthMm * 1e-3, band });
        push(`stub ${name}: ${kind} on ${currentLine}, length len${b}${tail}${comment}`);
      } else if (k === 1) {
        const pf = 0.2 + random() * 1.5;
        stubs.push({ line, name, kind, on: currentLine, target: { kind: 'capacitance', farads: Number(fmt(pf)) * 1e-12 }, band });
        push(`stub ${name}: ${kind} on ${currentLine}, capacitance ${fmt(pf)} pF${tail}${comment}`);
      } else {
        const nh = 0.5 + random() * 3;
        stubs.push({ line, name, kind, on: currentLine, target: { kind: 'inductance', henries: Number(fmt(nh)) * 1e-9 }, band });
        push(`stub ${name}: ${kind} on ${currentLine}, inductance ${fmt(nh)} nH${tail}${comment}`);
      }
    }
  }
  return { text: lines.join('\n'), lines, stubs, microstrips };
}
