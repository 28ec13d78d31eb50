/**
 * Touchstone version 1.1 files (the open industry format for network data, published by the IBIS
 * Open Forum): `!` comment lines, one option line `# Hz S RI R 50` (frequency unit, parameter,
 * number format, reference resistance), then one line per frequency in increasing order. A one-port
 * line is `f re(S11) im(S11)`; a two-port line is `f S11 S21 S12 S22`, each as a re im pair (the
 * version 1 two-port order: S21 before S12). Pure; the reader is used for checks and round trips.
 */
import { type Complex, complex } from '../engine/index.js';

/** Network data of a one- or two-port: S per frequency, in Touchstone order ([S11] or [S11, S21, S12, S22]). */
export interface NetworkData {
  ports: 1 | 2;
  /** Reference resistance of every port, Ω. */
  referenceOhm: number;
  frequenciesHz: number[];
  s: Complex[][];
  /** Comment lines (without the leading `!`). */
  comments: string[];
}

/** Shortest text that reads back as the same double; never `Infinity` or `NaN`. */
export function numberText(x: number): string {
  if (!Number.isFinite(x)) throw new RangeError(`not a finite number: ${x}`);
  return Object.is(x, -0) ? '0' : String(x);
}

const cleanComment = (c: string) => c.replace(/[\r\n]+/g, ' ');

/** The file text: comments, option line, data (LF line ends, ending in one). */
export function renderTouchstone(data: NetworkData): string {
  const per = data.ports === 1 ? 1 : 4;
  if (data.s.length !== data.frequenciesHz.length) throw new RangeError('one set of S-parameters per frequency');
  const lines = data.comments.map((c) => `! ${cleanComment(c)}`.trimEnd());
  lines.push(`# Hz S RI R ${numberText(data.referenceOhm)}`);
  data.frequenciesHz.forEach((f, i) => {
    const row = data.s[i]!;
    if (row.length !== per) throw new RangeError(`a ${data.ports}-port row has ${per} S-parameters`);
    if (i > 0 && !(f > data.frequenciesHz[i - 1]!)) throw new RangeError('Touchstone frequencies must increase');
    lines.push([numberText(f), ...row.flatMap((z) => [numberText(z.re), numberText(z.im)])].join(' '));
  });
  return `${lines.join('\n')}\n`;
}

const UNITS: Record<string, number> = { HZ: 1, KHZ: 1e3, MHZ: 1e6, GHZ: 1e9 };

/** A Touchstone reading problem with its 1-based line. */
export class TouchstoneError extends Error {
  constructor(readonly line: number, message: string) {
    super(`line ${line}: ${message}`);
  }
}

/**
 * Reads a version 1 one- or two-port file of S-parameters (RI, MA or DB). Throws a TouchstoneError
 * for anything else: another parameter, a second option line, a bad number, a row of the wrong
 * length, frequencies that do not increase.
 */
export function parseTouchstone(text: string, ports: 1 | 2): NetworkData {
  let unit = 1e9;
  let format = 'MA';
  let referenceOhm = 50;
  let sawOption = false;
  const comments: string[] = [];
  const frequenciesHz: number[] = [];
  const s: Complex[][] = [];
  const per = ports === 1 ? 1 : 4;
  const pair = (a: number, b: number): Complex => {
    if (format === 'RI') return complex(a, b);
    const mag = format === 'DB' ? 10 ** (a / 20) : a;
    const rad = (b * Math.PI) / 180;
    return complex(mag * Math.cos(rad), mag * Math.sin(rad));
  };
  text.split(/\r\n|\r|\n/).forEach((raw, i) => {
    const n = i + 1;
    const bang = raw.indexOf('!');
    if (bang >= 0) comments.push(raw.slice(bang + 1).trim());
    const body = (bang >= 0 ? raw.slice(0, bang) : raw).trim();
    if (body === '') return;
    if (body.startsWith('#')) {
      if (sawOption) throw new TouchstoneError(n, 'a second option line');
      if (frequenciesHz.length > 0) throw new TouchstoneError(n, 'the option line comes before the data');
      sawOption = true;
      const words = body.slice(1).trim().split(/\s+/).filter(Boolean).map((w) => w.toUpperCase());
      for (let k = 0; k < words.length; k++) {
        const w = words[k]!;
        if (w in UNITS) unit = UNITS[w]!;
        else if (w === 'RI' || w === 'MA' || w === 'DB') format = w;
        else if (w === 'S') continue;
        else if (w === 'R') {
          referenceOhm = Number(words[++k]);
          if (!(referenceOhm > 0)) throw new TouchstoneError(n, 'R needs a positive reference resistance');
        } else throw new TouchstoneError(n, `unsupported option "${w}" (S-parameters in Hz/kHz/MHz/GHz, RI/MA/DB only)`);
      }
      return;
    }
    const values = body.split(/\s+/).map(Number);
    if (values.some((v) => !Number.isFinite(v))) throw new TouchstoneError(n, `not a number in "${body}"`);
    if (values.length !== 1 + 2 * per) throw new TouchstoneError(n, `a ${ports}-port row has ${1 + 2 * per} numbers, found ${values.length}`);
    const f = values[0]! * unit;
    if (frequenciesHz.length > 0 && !(f > frequenciesHz[frequenciesHz.length - 1]!)) throw new TouchstoneError(n, 'frequencies must increase');
    frequenciesHz.push(f);
    s.push(Array.from({ length: per }, (_, k) => pair(values[1 + 2 * k]!, values[2 + 2 * k]!)));
  });
  if (!sawOption) throw new TouchstoneError(1, 'no option line (# Hz S RI R 50)');
  return { ports, referenceOhm, frequenciesHz, s, comments };
}
