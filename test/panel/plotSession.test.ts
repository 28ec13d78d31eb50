/**
 * The plot panel's behaviour without VS Code (client/src/plotSession.ts): what it asks the server,
 * what it posts to the webview, how it debounces live updates and drops overtaken answers, and that
 * every save goes through the host's save dialog (a cancelled dialog writes nothing).
 */
import { describe, expect, it } from 'vitest';
import type { ToWebview } from '../../client/src/panelMessages.js';
import { PlotSession, REFRESH_DEBOUNCE_MS, pngBytes, safeFileName, type PlotSessionHost, type SaveRequest } from '../../client/src/plotSession.js';
import { EXPORT_REQUEST, PLOT_REQUEST, type PlotResult } from '../../client/src/protocol.js';

const URI = 'file:///work/sheets/demo.rfsheet';

const plot = (name: string, view: 'frequency' | 'length' = 'frequency', svg = `<svg id="${name}-${view}"/>`): PlotResult => ({
  name, entryKind: 'stub', view, title: `${name} vs ${view}`, svg, markers: [{ kind: 'operating', x: 2.45e9, label: '2.45 GHz' }],
});

interface Call { method: string; params: Record<string, unknown>; resolve(v: unknown): void; reject(e: unknown): void }

/** A host whose requests stay pending until the test answers them, with a manual clock. */
function fakeHost(saveAnswer: (r: SaveRequest) => string | undefined = (r) => `/chosen/${r.fileName}`) {
  const calls: Call[] = [];
  const posted: ToWebview[] = [];
  const saved: SaveRequest[] = [];
  const errors: string[] = [];
  const infos: string[] = [];
  const timers = new Map<number, { fn: () => void; ms: number }>();
  let nextTimer = 1;
  const host: PlotSessionHost = {
    request: (method, params) => new Promise((resolve, reject) => calls.push({ method, params: params as Record<string, unknown>, resolve, reject })),
    post: (m) => void posted.push(m),
    save: async (r) => {
      saved.push(r);
      return saveAnswer(r);
    },
    showError: (m) => void errors.push(m),
    showInfo: (m) => void infos.push(m),
    setTimeout: (fn, ms) => {
      const id = nextTimer++;
      timers.set(id, { fn, ms });
      return id;
    },
    clearTimeout: (id) => void timers.delete(id as number),
  };
  const fireTimers = () => {
    const due = [...timers.values()];
    timers.clear();
    for (const t of due) t.fn();
  };
  return { host, calls, posted, saved, errors, infos, timers, fireTimers };
}

/** Lets pending promise callbacks run. */
const settle = () => new Promise((r) => setTimeout(r, 0));

describe('plot session', () => {
  it('asks the server for the entry on the frequency axis and posts the plot with the sheet name', async () => {
    const f = fakeHost();
    const s = new PlotSession(f.host, URI, 'demo.rfsheet', 'trap');
    const done = s.refresh();
    expect(f.calls).toHaveLength(1);
    expect(f.calls[0]).toMatchObject({ method: PLOT_REQUEST, params: { uri: URI, name: 'trap', view: 'frequency' } });
    f.calls[0]!.resolve(plot('trap'));
    await done;
    expect(f.posted).toEqual([{ type: 'plot', result: plot('trap'), sheet: 'demo.rfsheet' }]);
  });

  it('drops an answer that a newer request has overtaken', async () => {
    const f = fakeHost();
    const s = new PlotSession(f.host, URI, 'demo.rfsheet', 'trap');
    const first = s.refresh();
    const second = s.refresh();
    f.calls[1]!.resolve(plot('trap', 'frequency', '<svg id="new"/>'));
    await second;
    f.calls[0]!.resolve(plot('trap', 'frequency', '<svg id="old"/>'));
    await first;
    expect(f.posted.map((m) => (m.type === 'plot' ? m.result.svg : m.message))).toEqual(['<svg id="new"/>']);
  });

  it('debounces live updates: a burst of edits gives one request after the quiet time', async () => {
    const f = fakeHost();
    const s = new PlotSession(f.host, URI, 'demo.rfsheet', 'tune');
    for (let i = 0; i < 5; i++) s.scheduleRefresh();
    expect(f.timers.size).toBe(1);
    expect([...f.timers.values()][0]!.ms).toBe(REFRESH_DEBOUNCE_MS);
    expect(f.calls).toHaveLength(0);
    f.fireTimers();
    expect(f.calls).toHaveLength(1);
    f.calls[0]!.resolve(plot('tune'));
    await settle();
    expect(f.posted).toHaveLength(1);
  });

  it('shows the server\'s error result and a protocol error in the panel', async () => {
    const f = fakeHost();
    const s = new PlotSession(f.host, URI, 'demo.rfsheet', 'gone');
    const a = s.refresh();
    f.calls[0]!.resolve({ error: 'no stub or line named gone' });
    await a;
    const b = s.refresh();
    f.calls[1]!.reject(new Error('file:///x is not open in the Stubwright server'));
    await b;
    const c = s.refresh();
    f.calls[2]!.resolve({ unexpected: true });
    await c;
    expect(f.posted).toEqual([
      { type: 'error', message: 'no stub or line named gone' },
      { type: 'error', message: 'file:///x is not open in the Stubwright server' },
      { type: 'error', message: expect.stringMatching(/no plot/) },
    ]);
  });

  it('switches the axis on the webview\'s request and ignores a switch to the axis already shown', async () => {
    const f = fakeHost();
    const s = new PlotSession(f.host, URI, 'demo.rfsheet', 'trap');
    void s.onMessage({ type: 'view', view: 'frequency' });
    expect(f.calls).toHaveLength(0);
    void s.onMessage({ type: 'view', view: 'length' });
    expect(f.calls[0]!.params).toMatchObject({ name: 'trap', view: 'length' });
    void s.onMessage({ type: 'view', view: 'sideways' });
    expect(f.calls).toHaveLength(1);
    f.calls[0]!.resolve(plot('trap', 'length'));
    await settle();
    void s.showEntry('tune');
    expect(f.calls[1]!.params).toMatchObject({ name: 'tune', view: 'frequency' });
  });

  it('answers "ready" (a reloaded webview) with the last plot at once, then a fresh one', async () => {
    const f = fakeHost();
    const s = new PlotSession(f.host, URI, 'demo.rfsheet', 'trap');
    const first = s.refresh();
    f.calls[0]!.resolve(plot('trap'));
    await first;
    void s.onMessage({ type: 'ready' });
    expect(f.posted).toHaveLength(2);
    expect(f.posted[1]).toEqual(f.posted[0]);
    expect(f.calls).toHaveLength(2);
  });

  it('saves the SVG text of the plot on screen under a suggested name, only through the save dialog', async () => {
    const f = fakeHost();
    const s = new PlotSession(f.host, URI, 'demo.rfsheet', 'trap');
    await s.onMessage({ type: 'export', format: 'svg' });
    expect(f.saved).toEqual([]);
    expect(f.errors[0]).toMatch(/no plot to save/);
    const r = s.refresh();
    f.calls[0]!.resolve(plot('trap', 'frequency', '<svg class="sw-plot"/>'));
    await r;
    await s.onMessage({ type: 'export', format: 'svg' });
    expect(f.saved).toEqual([{ fileName: 'trap-frequency.svg', data: '<svg class="sw-plot"/>', filters: { 'SVG image': ['svg'] } }]);
    expect(f.infos).toEqual(['Stubwright: saved /chosen/trap-frequency.svg']);
  });

  it('a cancelled dialog writes nothing and says nothing; a failed write is reported', async () => {
    let answer: () => string | undefined = () => undefined;
    const f = fakeHost(() => answer());
    const s = new PlotSession(f.host, URI, 'demo.rfsheet', 'trap');
    const r = s.refresh();
    f.calls[0]!.resolve(plot('trap'));
    await r;
    await s.onMessage({ type: 'export', format: 'svg' });
    expect(f.infos).toEqual([]);
    expect(f.errors).toEqual([]);
    answer = () => { throw new Error('EACCES: permission denied'); };
    await s.onMessage({ type: 'export', format: 'svg' });
    expect(f.errors).toEqual(['Stubwright: could not save trap-frequency.svg: EACCES: permission denied']);
  });

  it('exports Touchstone and CSV through the server\'s export request and saves its text', async () => {
    const f = fakeHost();
    const s = new PlotSession(f.host, URI, 'demo.rfsheet', 'trap');
    const t = s.onMessage({ type: 'export', format: 'touchstone' });
    expect(f.calls[0]).toMatchObject({ method: EXPORT_REQUEST, params: { uri: URI, name: 'trap', format: 'touchstone' } });
    f.calls[0]!.resolve({ text: '! sweep\n# HZ S RI R 50\n', fileName: 'trap.s1p' });
    await t;
    expect(f.saved[0]).toEqual({ fileName: 'trap.s1p', data: '! sweep\n# HZ S RI R 50\n', filters: { Touchstone: ['s1p'] } });

    const c = s.onMessage({ type: 'export', format: 'csv' });
    f.calls[1]!.resolve({ error: 'no stub or line named trap' });
    await c;
    expect(f.saved).toHaveLength(1);
    expect(f.errors).toEqual(['Stubwright: no stub or line named trap']);

    const d = s.onMessage({ type: 'export', format: 'csv' });
    f.calls[2]!.resolve({ text: 'f,x\n', fileName: '../../etc/passwd' });
    await d;
    expect(f.saved[1]!.fileName).toBe('passwd');
  });

  it('saves the PNG the webview rendered as its bytes', async () => {
    const f = fakeHost();
    const s = new PlotSession(f.host, URI, 'demo.rfsheet', 'tune');
    const bytes = Uint8Array.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 255]);
    await s.onMessage({ type: 'exportPng', dataUrl: `data:image/png;base64,${Buffer.from(bytes).toString('base64')}` });
    expect(f.saved[0]!.fileName).toBe('tune-frequency.png');
    expect([...(f.saved[0]!.data as Uint8Array)]).toEqual([...bytes]);
    await s.onMessage({ type: 'exportPng', dataUrl: 'data:text/html;base64,PHNjcmlwdD4=' });
    await s.onMessage({ type: 'exportFailed', message: 'canvas is tainted' });
    expect(f.saved).toHaveLength(1);
    expect(f.errors).toEqual(['Stubwright: the PNG could not be made: canvas is tainted']);
  });

  it('after dispose, ignores answers still on their way and cancels the pending update', async () => {
    const f = fakeHost();
    const s = new PlotSession(f.host, URI, 'demo.rfsheet', 'trap');
    const r = s.refresh();
    s.scheduleRefresh();
    s.dispose();
    expect(f.timers.size).toBe(0);
    f.calls[0]!.resolve(plot('trap'));
    await r;
    expect(f.posted).toEqual([]);
  });
});

describe('file names', () => {
  it('keeps one harmless path segment of a suggested name', () => {
    expect(safeFileName('trap.s1p', 'x')).toBe('trap.s1p');
    expect(safeFileName('a/b\\c.csv', 'x')).toBe('c.csv');
    expect(safeFileName('..', 'fallback.csv')).toBe('fallback.csv');
    expect(safeFileName('.hidden', 'x')).toBe('hidden');
    expect(safeFileName('we:ird*name?.s1p', 'x')).toBe('we_ird_name_.s1p');
  });

  it('decodes a PNG data URL', () => {
    expect([...pngBytes('data:image/png;base64,AAEC/w==')]).toEqual([0, 1, 2, 255]);
  });
});
