/**
 * ngspice as a reference for S-parameters of one- and two-ports, measured the way a network analyser
 * defines them: a source of open-circuit voltage 2 V behind the reference resistance Z0 drives port 1
 * (so the incident wave is 1 V), port 2 is terminated in Z0, and
 *   S11 = V(port 1) − 1,   S21 = V(port 2)
 * (incident and reflected voltage waves of a matched-source measurement; common practice, no source).
 * The circuit under test is given as netlist cards between the port nodes and ground `0`; for a
 * shunt element across a through connection both ports are the same node; a one-port has no port 2. ngspice quirks: see
 * ./ngspice.ts (an AC analysis needs a DC operating point; `ac lin 2` analyses one point only, so
 * every frequency gets its own one-point analysis here).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Complex } from '../../shared-core/src/engine/complex.js';
import { spiceNumber } from './ngspice.js';

export interface TwoPortPoint {
  frequencyHz: number;
  s11: Complex;
  s21: Complex;
}

/**
 * S11 and S21 of `cards` between `port1`, `port2` and ground, at each frequency (one analysis each).
 * With `port2` null the circuit is a one-port (no load at a second port; s21 then repeats port 1).
 */
export function ngspiceTwoPortS(cards: string, ports: { port1: string; port2: string | null }, referenceOhm: number, frequenciesHz: readonly number[], binary = 'ngspice'): TwoPortPoint[] {
  const dir = mkdtempSync(join(tmpdir(), 'stubwright-ngspice-2p-'));
  try {
    const netlist = [
      '* stubwright two-port S-parameter cross-check',
      'Vsrc src 0 DC 0 AC 2',
      `Rsrc src ${ports.port1} ${spiceNumber(referenceOhm)}`,
      ...(ports.port2 === null ? [] : [`Rload ${ports.port2} 0 ${spiceNumber(referenceOhm)}`]),
      cards,
      '.control',
      'set noaskquit',
      'set numdgt=16',
      'set appendwrite',
      ...frequenciesHz.flatMap((f) => [`ac lin 1 ${spiceNumber(f)} ${spiceNumber(f)}`, `wrdata s.txt v(${ports.port1}) v(${ports.port2 ?? ports.port1})`]),
      'quit 0',
      '.endc',
      '.end',
      '',
    ].join('\n');
    writeFileSync(join(dir, 'twoport.cir'), netlist);
    const run = spawnSync(binary, ['-b', 'twoport.cir'], { cwd: dir, encoding: 'utf8', timeout: 60_000 });
    if (run.error) throw new Error(`ngspice did not run: ${run.error.message}`);
    const log = `${run.stdout ?? ''}\n${run.stderr ?? ''}`;
    const problems = log.split('\n').filter((line) => /error|abort|singular|warning/i.test(line));
    if (run.status !== 0 || problems.length > 0) throw new Error(`ngspice exit ${run.status}: ${problems.join(' | ') || log.trim()}`);
    const rows = readFileSync(join(dir, 's.txt'), 'utf8').split('\n').map((l) => l.trim()).filter(Boolean).map((l) => l.split(/\s+/).map(Number));
    if (rows.length !== frequenciesHz.length) throw new Error(`ngspice wrote ${rows.length} rows, expected ${frequenciesHz.length}`);
    return rows.map((r, i) => {
      const [f, v1re, v1im, , v2re, v2im] = r as [number, number, number, number, number, number];
      const want = frequenciesHz[i]!;
      if (r.length !== 6 || r.some((x) => !Number.isFinite(x)) || Math.abs(f - want) > 1e-12 * want) throw new Error(`unreadable ngspice row ${i}: ${r.join(' ')}`);
      return { frequencyHz: f, s11: { re: v1re - 1, im: v1im }, s21: { re: v2re, im: v2im } };
    });
  } finally {
    if (process.env.KEEP_NGSPICE) process.stderr.write(`ngspice netlist kept in ${dir}\n`);
    else rmSync(dir, { recursive: true, force: true });
  }
}
