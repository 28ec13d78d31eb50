/**
 * `stubwright export` and `stubwright plot` end to end: the built bundle as a child process on a real
 * sheet. The files it writes are the service's bytes (the editor panel shows the same SVG), it
 * writes only the file it is told to, never the sheet it reads, and fails with plain, located
 * messages and the usual exit codes. The bundle is built here as test/cli.test.ts builds it.
 */
import { spawnSync } from 'node:child_process';
import { link, mkdtemp, readdir, readFile, rename, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseCsv } from '../shared-core/src/plot/csv.js';
import { parseTouchstone } from '../shared-core/src/plot/touchstone.js';
import { createSheetService } from '../shared-core/src/service/sheetService.js';
import { parseXml } from './reference/xml.js';

const ROOT = fileURLToPath(new URL('..', import.meta.url));
const CLI = join(ROOT, 'shared-core', 'dist', 'cli.js');

// Invented example: a 2.45 GHz front end.
const SHEET = [
  'let f0 = 2.45 GHz',
  'substrate board: dk 2.55, df 0.0022, height 0.8 mm, copper 1 oz',
  'line feed: microstrip on board, z0 50 ohm, at f0',
  'stub tune: open on feed, capacitance 0.9 pF, at f0, band 2.4 GHz .. 2.5 GHz',
  'stub lost: short on nowhere, length 5 mm, at f0',
  'sweep wide: of tune, over 1 GHz .. 6 GHz, points 11',
  'sweep sec: of feed, length 20 mm, over 0.5 GHz .. 5 GHz, points 4',
  '',
].join('\n');

let work = '';
const cli = (...args: string[]) => {
  const r = spawnSync(process.execPath, [CLI, ...args], { cwd: work, encoding: 'utf8', timeout: 60_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
};
const listing = async () => (await readdir(work)).sort();
const service = createSheetService();
const doc = service.evaluate('file:///front.rfsheet', 1, SHEET);

beforeAll(async () => {
  const temp = `${CLI}.${process.pid}.export.tmp`;
  await build({
    entryPoints: [join(ROOT, 'shared-core', 'src', 'cli', 'main.ts')],
    bundle: true, platform: 'node', target: 'node20', format: 'esm', banner: { js: '#!/usr/bin/env node' }, outfile: temp, logLevel: 'warning',
  });
  await rename(temp, CLI);
  work = await mkdtemp(join(tmpdir(), 'stubwright-export-'));
  await writeFile(join(work, 'front.rfsheet'), SHEET);
}, 120_000);

afterAll(async () => {
  if (work) await rm(work, { recursive: true, force: true });
});

describe('stubwright export', () => {
  it('--touchstone OUT.s1p writes the service\'s one-port, and only that file', async () => {
    const r = cli('export', 'front.rfsheet', '--name', 'tune', '--touchstone', 'tune.s1p');
    expect(r).toEqual({ code: 0, stdout: '', stderr: 'stubwright: wrote tune.s1p (touchstone of tune)\n' });
    expect(await listing()).toEqual(['front.rfsheet', 'tune.s1p']);
    const text = await readFile(join(work, 'tune.s1p'), 'utf8');
    const expected = service.getExport(doc, 'tune', 'touchstone', { source: 'front.rfsheet' });
    expect('text' in expected && expected.text).toBe(text);
    const net = parseTouchstone(text, 1);
    expect(net.frequenciesHz).toHaveLength(401);
    expect(net.referenceOhm).toBe(50);
    await rm(join(work, 'tune.s1p'));
  });

  it('--touchstone OUT.s2p of a sweep: its range; of a line section: the two-port', async () => {
    expect(cli('export', 'front.rfsheet', '--name=wide', '--touchstone=wide.s2p').code).toBe(0);
    const stub = parseTouchstone(await readFile(join(work, 'wide.s2p'), 'utf8'), 2);
    expect([stub.frequenciesHz.length, stub.frequenciesHz[0], stub.frequenciesHz[10]]).toEqual([11, 1e9, 6e9]);
    expect(cli('export', 'front.rfsheet', '--name', 'sec', '--touchstone', 'sec.s2p', '--points', '7').code).toBe(0);
    expect(parseTouchstone(await readFile(join(work, 'sec.s2p'), 'utf8'), 2).frequenciesHz).toHaveLength(7);
    expect(await listing()).toEqual(['front.rfsheet', 'sec.s2p', 'wide.s2p']);
    await rm(join(work, 'wide.s2p'));
    await rm(join(work, 'sec.s2p'));
  });

  it('--csv with --from, --to and --points', async () => {
    expect(cli('export', 'front.rfsheet', '--name', 'tune', '--csv', 'tune.csv', '--from', '1GHz', '--to', '3 GHz', '--points', '5').code).toBe(0);
    const rows = parseCsv(await readFile(join(work, 'tune.csv'), 'utf8'));
    expect(rows.map((r) => r[0])).toEqual(['frequency_hz', '1000000000', '1500000000', '2000000000', '2500000000', '3000000000']);
    await rm(join(work, 'tune.csv'));
  });
});

describe('stubwright plot', () => {
  it('--svg writes the same SVG the editor panel shows, as XML', async () => {
    const r = cli('plot', 'front.rfsheet', '--name', 'tune', '--svg', 'tune.svg');
    expect(r.code).toBe(0);
    expect(r.stderr).toMatch(/^stubwright: wrote tune\.svg \(tune: open stub on feed/);
    const svg = await readFile(join(work, 'tune.svg'), 'utf8');
    const panel = service.getPlot(doc, 'tune');
    expect('svg' in panel && panel.svg).toBe(svg);
    expect(parseXml(svg).attributes.class).toBe('sw-plot');
    expect(cli('plot', 'front.rfsheet', '--name', 'tune', '--svg', 'len.svg', '--view', 'length', '--from', '1mm', '--to', '800mil', '--length-unit', 'mil').code).toBe(0);
    const length = await readFile(join(work, 'len.svg'), 'utf8');
    expect(length).toContain('data-view="length" data-x-min="0.001" data-x-max="0.02032"');
    expect(await listing()).toEqual(['front.rfsheet', 'len.svg', 'tune.svg']);
    await rm(join(work, 'tune.svg'));
    await rm(join(work, 'len.svg'));
  });
});

describe('export and plot refuse and fail plainly', () => {
  it('never writes over the sheet it reads, however it is named', async () => {
    await link(join(work, 'front.rfsheet'), join(work, 'hard.rfsheet'));
    for (const out of ['front.rfsheet', './front.rfsheet', join(work, 'front.rfsheet'), 'hard.rfsheet']) {
      const r = cli('export', 'front.rfsheet', '--name', 'tune', '--csv', out);
      expect(r.code, out).toBe(2);
      expect(r.stderr).toMatch(/refusing to write .*: it is the sheet being read; choose another output file/);
    }
    expect(cli('plot', 'front.rfsheet', '--name', 'tune', '--svg', 'front.rfsheet').code).toBe(2);
    expect(await readFile(join(work, 'front.rfsheet'), 'utf8')).toBe(SHEET);
    await rm(join(work, 'hard.rfsheet'));
    expect(await listing()).toEqual(['front.rfsheet']);
  });

  it.each([
    [['export', 'front.rfsheet', '--name', 'nope', '--csv', 'x.csv'], 2, /^stubwright: front\.rfsheet: no stub, line or sweep named "nope" in this sheet\n$/],
    [['export', 'front.rfsheet', '--name', 'lost', '--csv', 'x.csv'], 1, /^front\.rfsheet:5:6: error lost \(line 5\) could not be evaluated.*\nfront\.rfsheet:5:21: error \[unknown-name\] no line named nowhere/],
    [['export', 'front.rfsheet', '--name', 'feed', '--touchstone', 'x.s2p'], 2, /front\.rfsheet:3:6: error a line needs a length to be a two-port/],
    [['export', 'front.rfsheet', '--name', 'sec', '--touchstone', 'x.s1p'], 2, /sec is a line section, a two-port: export it as \.s2p/],
    [['export', 'missing.rfsheet', '--name', 'tune', '--csv', 'x.csv'], 2, /^stubwright: missing\.rfsheet: no such file or directory\n$/],
    [['export', 'front.rfsheet', '--name', 'tune', '--csv', join('no', 'dir', 'x.csv')], 2, /^stubwright: cannot write no\/dir\/x\.csv: no such file or directory\n$/],
    [['export', 'front.rfsheet', '--csv', 'x.csv'], 2, /say which stub, line or sweep: --name NAME/],
    [['export', 'front.rfsheet', '--name', 'tune'], 2, /say what to write: --touchstone OUT\.s1p/],
    [['export', 'front.rfsheet', '--name', 'tune', '--csv', 'a.csv', '--touchstone', 'b.s1p'], 2, /give one of --touchstone OUT and --csv OUT/],
    [['export', 'front.rfsheet', '--name', 'tune', '--touchstone', 'x.txt'], 2, /ending in \.s1p \(a one-port\) or \.s2p/],
    [['export', 'front.rfsheet', '--name', 'tune', '--csv', 'x.csv', '--from', '3GHz', '--to', '2GHz'], 2, /--from must be below --to/],
    [['export', 'front.rfsheet', '--name', 'tune', '--csv', 'x.csv', '--from', '7GHz'], 2, /the range must go from low to high: 7 GHz … /],
    [['plot', 'front.rfsheet', '--name', 'tune', '--svg', 'x.svg', '--view', 'length', '--from', '5'], 2, /a positive length with its unit/],
    [['plot', 'front.rfsheet', '--name', 'tune'], 2, /--svg OUT\.svg/],
    [['plot', 'front.rfsheet', 'other.rfsheet', '--name', 'tune', '--svg', 'x.svg'], 2, /plot takes one sheet, got 2/],
  ])('%j exits %i', async (args, code, message) => {
    const r = cli(...args);
    expect(r.code).toBe(code);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(message);
    expect(await listing()).toEqual(['front.rfsheet']);
  });

  it('help for both commands', () => {
    expect(cli('export', '--help').stdout).toMatch(/^Usage: stubwright export FILE --name NAME/);
    expect(cli('help', 'plot').stdout).toMatch(/^Usage: stubwright plot FILE --name NAME --svg OUT/);
    expect(cli('--help').stdout).toMatch(/export FILE --name NAME/);
  });
});
