/**
 * The plot panel's page (client/src/panelHtml.ts) in headless Chromium, fed the real SVG the
 * service draws for the demo sheet (examples/sensor-node.rfsheet), as VS Code would show it: the
 * theme's --vscode-* variables set on the root element, `acquireVsCodeApi` provided, the plot
 * posted as a message. Checks what is drawn on screen:
 * - each resonance marker's screen x is its data-x through the SVG's axis mapping
 *   (data-x-min/max → data-plot-left/width → viewBox → CSS pixels), and that data-x is the
 *   resonance the evaluator reports for the stub;
 * - the band's shading spans the sheet's band on screen;
 * - the traces take the theme's colours (computed style), not the fallbacks;
 * - nothing is fetched and nothing violates the content security policy, even for a hostile SVG;
 * - the page's buttons post the messages the extension handles, and the PNG export renders the
 *   picture as seen (theme background) without tainting the canvas.
 * Screenshots and the exported PNG go to test/artifacts/panel/.
 *
 * Needs Chromium (Debian `chromium`, or $CHROMIUM); skipped without it unless REQUIRE_CHROMIUM=1.
 */
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { panelCsp, panelHtml } from '../../client/src/panelHtml.js';
import type { PlotResult } from '../../client/src/protocol.js';
import { createSheetService } from '../../shared-core/src/service/sheetService.js';

/* The project compiles without the DOM library; inside page.evaluate callbacks the page's globals are untyped. */
declare const window: any;
declare const document: any;
declare const getComputedStyle: any;
declare const Image: any;
type SVGSVGElement = any;
type SVGLineElement = any;
type SVGElement = any;
type SVGGraphicsElement = any;
type SVGRectElement = any;

const CHROMIUM = process.env.CHROMIUM || '/usr/bin/chromium';
const available = existsSync(CHROMIUM);
const required = process.env.REQUIRE_CHROMIUM === '1';
const ARTIFACTS = fileURLToPath(new URL('../artifacts/panel/', import.meta.url));
const DEMO_PATH = fileURLToPath(new URL('../../examples/sensor-node.rfsheet', import.meta.url));
const DEMO = readFileSync(DEMO_PATH, 'utf8');
/** What `webview.cspSource` is in VS Code 1.9x. */
const CSP_SOURCE = "'self' https://*.vscode-cdn.net";
const NONCE = 'dGVzdC1ub25jZS0wMTIzNDU2Nzg5';

/** Colours of VS Code's default dark and light themes for the variables the page and the SVG use. */
const THEMES: Record<'dark' | 'light', Record<string, string>> = {
  dark: {
    'editor-background': '#1f1f1f', 'editor-foreground': '#cccccc', foreground: '#cccccc', descriptionForeground: '#9d9d9d',
    'editorWidget-border': '#454545', 'panel-border': '#2b2b2b', 'button-background': '#0078d4', 'button-foreground': '#ffffff',
    'button-secondaryBackground': '#313131', 'button-secondaryForeground': '#cccccc', focusBorder: '#0078d4', errorForeground: '#f85149',
    'charts-foreground': '#cccccc', 'charts-lines': '#cccccc80', 'charts-red': '#f14c4c', 'charts-blue': '#3794ff', 'charts-yellow': '#cca700',
    'charts-orange': '#d18616', 'charts-green': '#89d185', 'charts-purple': '#b180d7', 'font-family': 'system-ui, sans-serif', 'font-size': '13px',
  },
  light: {
    'editor-background': '#ffffff', 'editor-foreground': '#3b3b3b', foreground: '#3b3b3b', descriptionForeground: '#3b3b3b',
    'editorWidget-border': '#c8c8c8', 'panel-border': '#e5e5e5', 'button-background': '#005fb8', 'button-foreground': '#ffffff',
    'button-secondaryBackground': '#e5e5e5', 'button-secondaryForeground': '#3b3b3b', focusBorder: '#005fb8', errorForeground: '#f85149',
    'charts-foreground': '#616161', 'charts-lines': '#61616180', 'charts-red': '#e51400', 'charts-blue': '#1a85ff', 'charts-yellow': '#bf8803',
    'charts-orange': '#d18616', 'charts-green': '#388a34', 'charts-purple': '#652d90', 'font-family': 'system-ui, sans-serif', 'font-size': '13px',
  },
};

const service = createSheetService();
const doc = service.evaluate(pathToFileURL(DEMO_PATH).href, 1, DEMO);
const results = (name: string) => doc.result.entries.find((e) => e.name === name)!.results;
function plotOf(name: string, view: 'frequency' | 'length' = 'frequency', range: { fromHz?: number; toHz?: number } = {}): PlotResult {
  const r = service.getPlot(doc, name, { view, ...range });
  if ('error' in r) throw new Error(r.error);
  return r;
}

/** Hex (#rgb, #rrggbb, #rrggbbaa) → the `rgb(…)`/`rgba(…)` a computed style reports. */
function rgb(hex: string): string {
  const h = hex.replace('#', '');
  const full = h.length === 3 ? [...h].map((c) => c + c).join('') : h;
  const [r, g, b, a] = [0, 2, 4, 6].map((i) => parseInt(full.slice(i, i + 2), 16));
  return full.length === 8 ? `rgba(${r}, ${g}, ${b}, ${Math.round((a! / 255) * 1000) / 1000})` : `rgb(${r}, ${g}, ${b})`;
}

/** Everything observed on one page. */
interface Watch {
  requests: string[];
  problems: string[];
}

if (required && !available) {
  describe('plot panel in headless Chromium (required by REQUIRE_CHROMIUM=1)', () => {
    it('has Chromium', () => expect.fail(`REQUIRE_CHROMIUM=1 but there is no Chromium at ${CHROMIUM} (apt-get install chromium)`));
  });
}

describe.skipIf(!available)(`plot panel in headless Chromium${available ? '' : ` — skipped: no Chromium at ${CHROMIUM}`}`, () => {
  let browser: Browser;
  const pageFile = join(ARTIFACTS, 'panel.html');

  beforeAll(async () => {
    mkdirSync(ARTIFACTS, { recursive: true });
    writeFileSync(pageFile, panelHtml({ cspSource: CSP_SOURCE, nonce: NONCE }));
    browser = await chromium.launch({
      executablePath: CHROMIUM,
      args: ['--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    });
  }, 60_000);
  afterAll(async () => {
    await browser?.close();
  });

  /** Opens the panel page with a theme, the webview API stub and watchers, as VS Code's webview host would. */
  async function openPanel(theme: 'dark' | 'light'): Promise<{ page: Page; watch: Watch }> {
    const page = await browser.newPage({ viewport: { width: 1000, height: 720 } });
    const watch: Watch = { requests: [], problems: [] };
    const pageUrl = pathToFileURL(pageFile).href;
    page.on('request', (r) => { if (r.url() !== pageUrl) watch.requests.push(r.url()); });
    page.on('pageerror', (e) => watch.problems.push(`page error: ${e.message}`));
    page.on('console', (m) => { if (m.type() === 'error' || m.type() === 'warning') watch.problems.push(`console ${m.type()}: ${m.text()}`); });
    await page.addInitScript((vars: Record<string, string>) => {
      const w = window as unknown as { __posted: unknown[]; __csp: string[]; acquireVsCodeApi: () => unknown };
      w.__posted = [];
      w.__csp = [];
      document.addEventListener('securitypolicyviolation', (e: { violatedDirective: string; blockedURI: string }) => w.__csp.push(`${e.violatedDirective} ${e.blockedURI}`));
      w.acquireVsCodeApi = () => ({ postMessage: (m: unknown) => w.__posted.push(m), getState: () => undefined, setState: () => undefined });
    });
    await page.goto(pageUrl);
    // As VS Code's webview host does: the theme's variables on the root element, the theme kind as a body class.
    await page.evaluate(({ vars, kind }) => {
      for (const [k, v] of Object.entries(vars)) document.documentElement.style.setProperty(`--vscode-${k}`, v);
      document.body.classList.add(`vscode-${kind}`);
    }, { vars: THEMES[theme], kind: theme });
    return { page, watch };
  }

  const posted = (page: Page) => page.evaluate(() => (window as unknown as { __posted: { type: string }[] }).__posted);
  /** CSP violations so far (reported as queued events: two task turns are let run first). */
  const violations = (page: Page) => page.evaluate(async () => {
    for (let i = 0; i < 2; i++) await new Promise((r) => setTimeout(r, 0));
    return (window as unknown as { __csp: string[] }).__csp;
  });
  async function showPlot(page: Page, result: PlotResult): Promise<void> {
    await page.evaluate((r) => window.postMessage({ type: 'plot', result: r, sheet: 'sensor-node.rfsheet' }, '*'), result);
    await page.waitForFunction((title) => document.querySelector('#plot svg')?.getAttribute('aria-label') === title, result.title);
  }

  /** Screen x (CSS px) of data value x, from the root's data attributes and its box (viewBox, xMidYMid meet). */
  const screenX = (page: Page, x: number) => page.evaluate((value) => {
    const svg = document.querySelector('#plot svg') as SVGSVGElement;
    const n = (a: string) => Number(svg.getAttribute(a));
    const vb = svg.viewBox.baseVal;
    const box = svg.getBoundingClientRect();
    const scale = Math.min(box.width / vb.width, box.height / vb.height);
    const left = box.left + (box.width - vb.width * scale) / 2;
    const userX = n('data-plot-left') + ((value - n('data-x-min')) / (n('data-x-max') - n('data-x-min'))) * n('data-plot-width');
    return left + (userX - vb.x) * scale;
  }, x);

  /** The vertical line of each element of a class: its screen x and its data-x. */
  const markerLines = (page: Page, selector: string) => page.evaluate((sel) =>
    [...document.querySelectorAll(`#plot svg ${sel}`)].map((el) => {
      const line = (el.localName === 'line' ? el : el.querySelector('line')) as SVGLineElement;
      const r = line.getBoundingClientRect();
      return { dataX: Number(el.getAttribute('data-x')), screenX: r.left + r.width / 2, label: el.querySelector('text')?.textContent ?? '' };
    }), selector);

  it('frequency view, dark theme: resonances where the evaluator puts them, labelled, operating point, theme colours', async () => {
    const { page, watch } = await openPanel('dark');
    expect(await posted(page)).toEqual([{ type: 'ready' }]);
    const result = plotOf('choke');
    await showPlot(page, result);

    const resonances = await markerLines(page, '.sw-resonance');
    const fromService = result.markers.filter((m) => m.kind === 'resonance');
    expect(resonances.length).toBe(fromService.length);
    expect(resonances.length).toBeGreaterThan(0);
    // The choke is a quarter-wave short stub marked resonant: its nearest resonance, from the evaluator, is drawn.
    const nearest = results('choke').resonance_nearest_hz as number;
    expect(resonances.some((r) => Math.abs(r.dataX - nearest) <= 1e-6 * nearest), JSON.stringify(resonances)).toBe(true);
    for (const r of resonances) {
      expect(Math.abs(r.screenX - (await screenX(page, r.dataX))), `resonance at ${r.dataX} Hz`).toBeLessThan(1);
      expect(r.label, 'label next to the marker').toBe(fromService.find((m) => m.x === r.dataX)!.label);
      expect(r.label).toMatch(/\d\s*GHz/);
    }
    const [operating] = await markerLines(page, '.sw-operating');
    expect(operating!.dataX).toBe(results('choke').frequency_hz);
    expect(Math.abs(operating!.screenX - (await screenX(page, operating!.dataX)))).toBeLessThan(1);

    // Theme: the reactance trace takes the colour of the variable it names, not the fallback; the page takes the editor background.
    const trace = await page.evaluate(() => {
      const el = document.querySelector('#plot svg .sw-trace[data-quantity="reactance"]') as SVGElement;
      return { computed: getComputedStyle(el).stroke, declared: el.style.getPropertyValue('stroke') || el.getAttribute('stroke') || '' };
    });
    const variable = /var\(--vscode-([\w-]+)\s*,\s*(#[0-9a-fA-F]+)\)/.exec(trace.declared);
    expect(variable, trace.declared).not.toBeNull();
    expect(THEMES.dark[variable![1]!], `the test theme sets --vscode-${variable![1]}`).toBeDefined();
    expect(trace.computed).toBe(rgb(THEMES.dark[variable![1]!]!));
    expect(trace.computed).not.toBe(rgb(variable![2]!));
    expect(await page.evaluate(() => getComputedStyle(document.body).backgroundColor)).toBe(rgb(THEMES.dark['editor-background']!));
    const titleFill = await page.evaluate(() => getComputedStyle(document.querySelector('#plot svg .sw-title')!).fill);
    expect(titleFill).toBe(rgb(THEMES.dark['editor-foreground']!));

    expect(await page.locator('#readout li').allTextContents()).toEqual(expect.arrayContaining([expect.stringContaining(fromService[0]!.label)]));
    await page.screenshot({ path: join(ARTIFACTS, 'plot-choke-frequency-dark.png') });
    expect(watch.requests).toEqual([]);
    expect(await violations(page)).toEqual([]);
    expect(watch.problems).toEqual([]);
    await page.close();
  });

  it('band shading spans the sheet\'s band on screen (light theme); the second resonance is marked too', async () => {
    const { page, watch } = await openPanel('light');
    const result = plotOf('tune', 'frequency', { fromHz: 1e9, toHz: 14e9 });
    expect(result.band).toEqual([2.4e9, 2.5e9]);
    await showPlot(page, result);
    const band = await page.evaluate(() => {
      const el = document.querySelector('#plot svg .sw-band') as SVGGraphicsElement;
      const r = el.getBoundingClientRect();
      return { from: Number(el.getAttribute('data-from')), to: Number(el.getAttribute('data-to')), left: r.left, right: r.right, height: r.height, fill: getComputedStyle(el).fill };
    });
    expect([band.from, band.to]).toEqual(result.band);
    expect(Math.abs(band.left - (await screenX(page, 2.4e9)))).toBeLessThan(1);
    expect(Math.abs(band.right - (await screenX(page, 2.5e9)))).toBeLessThan(1);
    expect(band.height).toBeGreaterThan(50);
    expect(band.fill).not.toBe('none');
    const resonances = await markerLines(page, '.sw-resonance');
    expect(resonances.length).toBeGreaterThanOrEqual(2);
    for (const r of resonances) expect(Math.abs(r.screenX - (await screenX(page, r.dataX)))).toBeLessThan(1);
    await page.screenshot({ path: join(ARTIFACTS, 'plot-tune-frequency-light.png') });
    expect(watch.requests).toEqual([]);
    expect(await violations(page)).toEqual([]);
    expect(watch.problems).toEqual([]);
    await page.close();
  });

  it('length view: markers in metres at the same mapping, the operating point at the drawn length', async () => {
    const { page, watch } = await openPanel('dark');
    const result = plotOf('tune', 'length');
    await showPlot(page, result);
    expect(await page.getAttribute('#plot svg', 'data-view')).toBe('length');
    expect(await page.getAttribute('#view-length', 'aria-pressed')).toBe('true');
    expect(await page.getAttribute('#view-frequency', 'aria-pressed')).toBe('false');
    const [operating] = await markerLines(page, '.sw-operating');
    expect(operating!.dataX).toBeCloseTo(results('tune').length_m as number, 12);
    for (const m of [operating!, ...(await markerLines(page, '.sw-resonance'))]) {
      expect(Math.abs(m.screenX - (await screenX(page, m.dataX)))).toBeLessThan(1);
    }
    await page.screenshot({ path: join(ARTIFACTS, 'plot-tune-length-dark.png') });
    expect(watch.requests).toEqual([]);
    expect(await violations(page)).toEqual([]);
    await page.close();
  });

  it('buttons post what the extension handles; PNG export renders the picture as seen', async () => {
    const { page, watch } = await openPanel('dark');
    const result = plotOf('trap');
    await showPlot(page, result);
    await page.click('#view-length');
    await page.click('#view-frequency'); // already shown: posts nothing
    await page.click('#export-svg');
    await page.click('#export-touchstone');
    await page.click('#export-csv');
    await page.click('#export-png');
    await page.waitForFunction(() => (window as unknown as { __posted: { type: string }[] }).__posted.some((m) => m.type === 'exportPng' || m.type === 'exportFailed'));
    const messages = (await posted(page)) as { type: string; dataUrl?: string; message?: string }[];
    expect(messages.map((m) => (m.type === 'exportPng' ? 'exportPng' : JSON.stringify(m)))).toEqual([
      '{"type":"ready"}', '{"type":"view","view":"length"}', '{"type":"export","format":"svg"}',
      '{"type":"export","format":"touchstone"}', '{"type":"export","format":"csv"}', 'exportPng',
    ]);
    const png = Buffer.from(messages.at(-1)!.dataUrl!.replace(/^data:image\/png;base64,/, ''), 'base64');
    writeFileSync(join(ARTIFACTS, 'export-trap.png'), png);
    expect([...png.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    const [w, h] = [png.readUInt32BE(16), png.readUInt32BE(20)];
    const vb = await page.evaluate(() => {
      const { width, height } = (document.querySelector('#plot svg') as SVGSVGElement).viewBox.baseVal;
      return { width, height };
    });
    expect([w, h]).toEqual([2 * vb.width, 2 * vb.height]);
    // The PNG shows the theme: its corner is the editor background, and some pixel has the reactance trace's colour.
    const pixels = await page.evaluate(async (url) => {
      const img = new Image();
      img.src = url;
      await img.decode();
      const c = document.createElement('canvas');
      c.width = img.width;
      c.height = img.height;
      const g = c.getContext('2d')!;
      g.drawImage(img, 0, 0);
      const data = g.getImageData(0, 0, c.width, c.height).data;
      const at = (i: number) => `rgb(${data[i]}, ${data[i + 1]}, ${data[i + 2]})`;
      const seen = new Set<string>();
      for (let i = 0; i < data.length; i += 4) seen.add(at(i));
      return { corner: at(0), colours: [...seen] };
    }, messages.at(-1)!.dataUrl!);
    expect(pixels.corner).toBe(rgb(THEMES.dark['editor-background']!));
    expect(pixels.colours).toContain(rgb(THEMES.dark['charts-blue']!));
    expect(watch.requests).toEqual([]);
    expect(await violations(page)).toEqual([]);
    expect(watch.problems).toEqual([]);
    await page.close();
  });

  it('shows an error from the server over the last plot, and cleans a hostile SVG: no script runs, nothing is fetched', async () => {
    const { page, watch } = await openPanel('dark');
    await showPlot(page, plotOf('trap'));
    await page.evaluate(() => window.postMessage({ type: 'error', message: 'no stub, line or sweep named "trapp" in this sheet' }, '*'));
    await page.waitForFunction(() => document.getElementById('status')!.textContent!.includes('trapp'));
    expect(await page.getAttribute('#status', 'role')).toBe('alert');
    expect(await page.getAttribute('#plot', 'class')).toContain('stale');
    expect(await page.locator('#plot svg').count()).toBe(1);

    const hostile: PlotResult = {
      ...plotOf('trap'),
      title: 'hostile',
      svg: '<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" viewBox="0 0 100 50" onload="window.__pwned=1">'
        + '<script>window.__pwned=2</script><style>rect{fill:red}</style>'
        + '<foreignObject width="10" height="10"><img xmlns="http://www.w3.org/1999/xhtml" src="http://127.0.0.1:9/x.png"/></foreignObject>'
        + '<image href="http://127.0.0.1:9/y.png" width="5" height="5"/><use xlink:href="http://127.0.0.1:9/z.svg#a"/>'
        + '<rect class="ok" width="10" height="10" style="fill: url(http://127.0.0.1:9/p.svg#q); stroke: var(--vscode-charts-red, #f00)" onclick="window.__pwned=3"/>'
        + '</svg>',
    };
    await showPlot(page, hostile);
    const after = await page.evaluate(() => {
      const svg = document.querySelector('#plot svg')!;
      const rect = svg.querySelector('rect.ok') as SVGRectElement;
      return {
        pwned: (window as unknown as { __pwned?: number }).__pwned ?? null,
        tags: [...svg.querySelectorAll('*')].map((e) => e.localName),
        attrs: [...svg.querySelectorAll('*')].flatMap((e) => [...e.attributes].map((a) => `${a.name}=${a.value}`)),
        rectStroke: getComputedStyle(rect).stroke,
      };
    });
    expect(after.pwned).toBeNull();
    expect(after.tags).not.toContain('script');
    expect(after.tags).not.toContain('style');
    expect(after.tags).not.toContain('foreignObject');
    expect(after.attrs.filter((a) => /^on|http:|url\(/i.test(a))).toEqual([]);
    expect(after.rectStroke).toBe(rgb(THEMES.dark['charts-red']!));
    expect(watch.requests).toEqual([]);
    // The inline handlers and the style element are refused by the policy already while parsing (the parsed document inherits it): reported, never applied.
    const reported = await violations(page);
    expect(reported.length).toBeGreaterThan(0);
    for (const v of reported) expect(v).toMatch(/^(script-src-attr|style-src-elem) inline$/);
    await page.close();
  });
});

describe('plot panel page', () => {
  it('the page\'s policy loads nothing from anywhere and runs only its own nonce\'d script and style', () => {
    const html = panelHtml({ cspSource: CSP_SOURCE, nonce: NONCE });
    const csp = panelCsp({ cspSource: CSP_SOURCE, nonce: NONCE });
    expect(csp.split('; ')).toEqual([
      "default-src 'none'", `img-src data: ${CSP_SOURCE}`, `style-src 'nonce-${NONCE}'`, `script-src 'nonce-${NONCE}'`, "base-uri 'none'", "form-action 'none'",
    ]);
    expect(html).toContain(`<meta http-equiv="Content-Security-Policy" content="${csp}">`);
    expect(html.match(/<script\b[^>]*>/g)).toEqual([`<script nonce="${NONCE}">`]);
    expect(html.match(/<style\b[^>]*>/g)).toEqual([`<style nonce="${NONCE}">`]);
    expect(html.replaceAll(CSP_SOURCE, '')).not.toMatch(/https?:\/\/(?!www\.w3\.org\/)/);
    expect(html).not.toMatch(/\sstyle="/);
    expect(() => panelHtml({ cspSource: CSP_SOURCE, nonce: "x' 'unsafe-inline" })).toThrow(/nonce/);
  });
});
