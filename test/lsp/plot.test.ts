/**
 * Plots over the protocol: the bundled server (`node server/dist/server.js --stdio`) on the demo
 * sheet, examples/sensor-node.rfsheet. A "Plot" code lens above every stub and line, the
 * `stubwright/plot` request returning an SVG whose resonance markers sit at the resonances the
 * evaluator reports, the band and operating point, the length view, live updates after an edit,
 * `stubwright/export`, and clear errors for an unknown name, an unopened document and bad parameters.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  CodeLensRequest,
  DidChangeConfigurationNotification,
  ErrorCodes,
  LSPErrorCodes,
  ResponseError,
  type CodeLens,
} from 'vscode-languageserver-protocol/node';
import { evaluateSheet } from '../../shared-core/src/sheet/evaluate.js';
import { buildServer, startClient, type LspClient } from './lspClient.js';

const DEMO_PATH = fileURLToPath(new URL('../../examples/sensor-node.rfsheet', import.meta.url));
const DEMO = readFileSync(DEMO_PATH, 'utf8');
const DEMO_URI = pathToFileURL(DEMO_PATH).href;
const LINES = DEMO.split('\n');
/** The demo's stubs and lines with their evaluator results (what the plots must agree with). */
const EVALUATED = evaluateSheet(DEMO).entries.filter((e) => e.kind === 'stub' || e.kind === 'line' || e.kind === 'sweep');
const entry = (name: string) => EVALUATED.find((e) => e.name === name)!;
const num = (name: string, key: string) => entry(name).results[key] as number;

interface Marker { kind: 'resonance' | 'operating'; x: number; label: string; resonanceType?: 'series' | 'parallel' }
interface Plot { name: string; entryKind: 'stub' | 'line'; view: 'frequency' | 'length'; title: string; svg: string; markers: Marker[]; band?: [number, number] }
type Answer<T> = T | { error: string };

/** Elements of an SVG string whose class list has `cls`, with their attributes. */
function elements(svg: string, cls: string): Record<string, string>[] {
  return [...svg.matchAll(/<([a-zA-Z]+)((?:\s+[\w:-]+="[^"]*")*)\s*\/?>/g)]
    .map((m) => Object.fromEntries([...m[2]!.matchAll(/([\w:-]+)="([^"]*)"/g)].map((a) => [a[1]!, a[2]!])) as Record<string, string>)
    .filter((a) => (a.class ?? '').split(/\s+/).includes(cls));
}
const rootAttrs = (svg: string) => elements(svg, 'sw-plot')[0]!;
const close = (a: number, b: number, rel: number) => Math.abs(a - b) <= rel * Math.abs(b);

beforeAll(() => buildServer(), 120_000);

describe('plots over the language server protocol (demo sheet)', () => {
  let client: LspClient;
  const plot = (params: object) => client.connection.sendRequest('stubwright/plot', params) as Promise<Answer<Plot>>;
  const exportSweep = (params: object) => client.connection.sendRequest('stubwright/export', params) as Promise<Answer<{ text: string; fileName: string }>>;
  const ok = <T>(a: Answer<T>): T => {
    if (typeof a === 'object' && a !== null && 'error' in a) throw new Error(`unexpected error result: ${(a as { error: string }).error}`);
    return a as T;
  };

  beforeAll(async () => {
    client = await startClient();
    await client.open(DEMO_URI, DEMO);
  });
  afterAll(async () => {
    if (client.child.exitCode === null) expect(await client.shutdown()).toBe(0);
  });

  it('advertises code lenses and puts a "Plot" lens on the declaration line of every stub and line', async () => {
    expect(client.initializeResult.capabilities.codeLensProvider).toEqual({ resolveProvider: false });
    const lenses = (await client.connection.sendRequest(CodeLensRequest.type, { textDocument: { uri: DEMO_URI } })) as CodeLens[];
    expect(EVALUATED.length).toBeGreaterThanOrEqual(6);
    expect(lenses.map((l) => l.command?.arguments?.[1]).sort()).toEqual(EVALUATED.map((e) => e.name).sort());
    for (const lens of lenses) {
      const [uri, name] = lens.command!.arguments as [string, string];
      const e = entry(name);
      expect(uri).toBe(DEMO_URI);
      expect(lens.command!.command).toBe('stubwright.showPlot');
      expect(lens.command!.title, name).toBe(e.kind === 'line' ? 'Plot' : 'Plot reactance');
      expect(lens.range.start.line, name).toBe(e.line);
      expect(LINES[lens.range.start.line]).toMatch(new RegExp(`^(stub|line|sweep) ${name}:`));
    }
  });

  it('every lens opens a plot, not an error: the demo\'s feed has no "at" and is plotted around the stubs on it', async () => {
    const lenses = (await client.connection.sendRequest(CodeLensRequest.type, { textDocument: { uri: DEMO_URI } })) as CodeLens[];
    expect(lenses.map((l) => l.command!.arguments![1])).toContain('feed');
    expect(entry('feed').results.frequency_hz ?? null).toBeNull();
    for (const lens of lenses) {
      const [uri, name] = lens.command!.arguments as [string, string];
      const r = await plot({ uri, name });
      expect(r, name).not.toHaveProperty('error');
    }
    const feed = ok(await plot({ uri: DEMO_URI, name: 'feed' }));
    const root = rootAttrs(feed.svg);
    // Over the stubs built on it: tune and lbias at f0, trap at 2·f0.
    for (const stub of ['tune', 'lbias', 'trap']) {
      expect(num(stub, 'frequency_hz')).toBeGreaterThan(Number(root['data-x-min']));
      expect(num(stub, 'frequency_hz')).toBeLessThan(Number(root['data-x-max']));
    }
  });

  it('plots a resonant stub: self-contained SVG, resonance markers at the resonances the evaluator reports', async () => {
    const r = ok(await plot({ uri: DEMO_URI, name: 'trap' }));
    expect(r).toMatchObject({ name: 'trap', entryKind: 'stub', view: 'frequency' });
    expect(r.svg).toMatch(/^<svg\s/);
    expect(r.svg).not.toMatch(/<script|<foreignObject|href="http|url\(http/i);
    const root = rootAttrs(r.svg);
    expect(root['data-view']).toBe('frequency');
    const [xMin, xMax] = [Number(root['data-x-min']), Number(root['data-x-max'])];

    // The trap is a quarter-wave open stub at 2·f0 (angle 90° at 2*f0): its resonance is the evaluator's nearest one.
    const resonance = num('trap', 'resonance_nearest_hz');
    expect(close(resonance, 2 * 2.45e9, 1e-3)).toBe(true);
    const resonances = r.markers.filter((m) => m.kind === 'resonance');
    expect(resonances.some((m) => close(m.x, resonance, 1e-6)), JSON.stringify(resonances)).toBe(true);
    for (const m of resonances) {
      expect(m.x).toBeGreaterThanOrEqual(xMin);
      expect(m.x).toBeLessThanOrEqual(xMax);
    }

    // Every marker of the result is drawn, at the same x, and the resonances are labelled.
    const drawn = elements(r.svg, 'sw-resonance').map((a) => Number(a['data-x']));
    expect(drawn.sort((a, b) => a - b)).toEqual(resonances.map((m) => m.x).sort((a, b) => a - b));
    expect(elements(r.svg, 'sw-resonance-label')).toHaveLength(resonances.length);
    const operating = r.markers.find((m) => m.kind === 'operating');
    expect(operating && close(operating.x, num('trap', 'frequency_hz'), 1e-9)).toBe(true);
    expect(elements(r.svg, 'sw-operating').map((a) => Number(a['data-x']))).toEqual([operating!.x]);
    expect(elements(r.svg, 'sw-trace').map((a) => a['data-quantity'])).toContain('reactance');
  });

  it('shades the band of a stub that has one, from the sheet\'s band', async () => {
    const r = ok(await plot({ uri: DEMO_URI, name: 'tune' }));
    expect(r.band).toEqual([2.4e9, 2.5e9]);
    const [band] = elements(r.svg, 'sw-band');
    expect(band).toBeDefined();
    expect([Number(band!['data-from']), Number(band!['data-to'])]).toEqual([2.4e9, 2.5e9]);
    expect(elements(r.svg, 'sw-trace').map((a) => a['data-quantity'])).toContain('capacitance');
  });

  it('plots versus physical length at the fixed frequency, the operating point at the drawn length', async () => {
    const r = ok(await plot({ uri: DEMO_URI, name: 'tune', view: 'length' }));
    expect(r.view).toBe('length');
    expect(rootAttrs(r.svg)['data-view']).toBe('length');
    const operating = r.markers.find((m) => m.kind === 'operating');
    expect(operating && close(operating.x, num('tune', 'length_m'), 1e-9), JSON.stringify(r.markers)).toBe(true);
  });

  it('honours a requested frequency span', async () => {
    const r = ok(await plot({ uri: DEMO_URI, name: 'choke', fromHz: 1e9, toHz: 8e9, points: 101 }));
    const root = rootAttrs(r.svg);
    expect(Number(root['data-x-min'])).toBe(1e9);
    expect(Number(root['data-x-max'])).toBe(8e9);
  });

  it('follows the sheet live: after an edit the resonance moves', async () => {
    const uri = 'file:///stubwright-test/plot-live.rfsheet';
    await client.open(uri, DEMO);
    const before = ok(await plot({ uri, name: 'trap' })).markers.filter((m) => m.kind === 'resonance').map((m) => m.x);
    const line = LINES.findIndex((l) => l.startsWith('stub trap:'));
    const col = LINES[line]!.indexOf('90°');
    await client.change(uri, 2, [{ range: { start: { line, character: col }, end: { line, character: col + 3 } }, text: '60°' }]);
    const after = ok(await plot({ uri, name: 'trap' }));
    const edited = evaluateSheet(DEMO.replace('angle 90°', 'angle 60°')).entries.find((e) => e.name === 'trap')!;
    const resonance = edited.results.resonance_nearest_hz as number;
    // A shorter stub (60° instead of 90° at 2·f0) resonates higher, at about 90/60 of the old frequency.
    const old = num('trap', 'resonance_nearest_hz');
    expect(before.some((x) => close(x, old, 1e-6))).toBe(true);
    expect(resonance).toBeGreaterThan(old * 1.3);
    const moved = after.markers.filter((m) => m.kind === 'resonance').map((m) => m.x);
    expect(moved.some((x) => close(x, resonance, 1e-6)), JSON.stringify(after.markers)).toBe(true);
    expect(moved.some((x) => close(x, old, 1e-3))).toBe(false);
    await client.close(uri);
  });

  it('exports Touchstone and CSV sweeps', async () => {
    const s1p = ok(await exportSweep({ uri: DEMO_URI, name: 'trap', format: 'touchstone', points: 11 }));
    expect(s1p.fileName).toMatch(/^trap\.s1p$/i);
    expect(s1p.text).toMatch(/^#\s+\w+\s+S\s+\w+\s+R\s+[\d.]+/m);
    expect(s1p.text).toContain('sensor-node.rfsheet');
    const data = s1p.text.split('\n').filter((l) => /^\s*[\d.+-]/.test(l));
    expect(data).toHaveLength(11);
    const csv = ok(await exportSweep({ uri: DEMO_URI, name: 'tune', format: 'csv', points: 5 }));
    expect(csv.fileName).toMatch(/\.csv$/);
    expect(csv.text.trim().split('\n').length).toBeGreaterThanOrEqual(6);
  });

  it('answers an unknown name with an error result that names it', async () => {
    const r = await plot({ uri: DEMO_URI, name: 'nosuchstub' });
    expect(r).toEqual({ error: expect.stringContaining('nosuchstub') });
    const e = await exportSweep({ uri: DEMO_URI, name: 'nosuchstub', format: 'csv' });
    expect(e).toEqual({ error: expect.stringContaining('nosuchstub') });
  });

  it('refuses a document that is not open (RequestFailed) and malformed parameters (InvalidParams)', async () => {
    const notOpen = await plot({ uri: 'file:///nowhere/missing.rfsheet', name: 'trap' }).catch((e: unknown) => e);
    expect(notOpen).toBeInstanceOf(ResponseError);
    expect((notOpen as ResponseError<unknown>).code).toBe(LSPErrorCodes.RequestFailed);
    expect((notOpen as ResponseError<unknown>).message).toMatch(/not open/);
    for (const bad of [{ uri: DEMO_URI }, { uri: DEMO_URI, name: 'trap', view: 'sideways' }, { uri: DEMO_URI, name: 'trap', points: -3 }]) {
      const e = await plot(bad).catch((x: unknown) => x);
      expect((e as ResponseError<unknown>).code, JSON.stringify(bad)).toBe(ErrorCodes.InvalidParams);
    }
    const badFormat = await exportSweep({ uri: DEMO_URI, name: 'trap', format: 'pdf' }).catch((x: unknown) => x);
    expect((badFormat as ResponseError<unknown>).code).toBe(ErrorCodes.InvalidParams);
  });

  it('asks the editor to refresh code lenses when the settings change (the lenses can be switched off)', async () => {
    const after = client.events.length;
    await client.connection.sendNotification(DidChangeConfigurationNotification.type, { settings: null });
    await client.waitFor('workspace/codeLens/refresh', undefined, { after });
  });
});
