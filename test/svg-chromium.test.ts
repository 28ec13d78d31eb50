/**
 * The plot SVG in a real browser engine: headless Chromium (Debian's `chromium`, driven by
 * playwright-core) parses it with its XML parser (DOMParser, image/svg+xml: a parse error shows
 * as a <parsererror> element), renders it inline as a webview does, loads nothing from anywhere,
 * and takes the trace colours from the editor's CSS custom properties, falling back to its own.
 *
 * Skips itself, with the reason in its title, without Chromium; REQUIRE_CHROMIUM=1 makes that a failure.
 */
import { existsSync } from 'node:fs';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createSheetService } from '../shared-core/src/service/sheetService.js';

const CHROMIUM = process.env.CHROMIUM || '/usr/bin/chromium';
const available = existsSync(CHROMIUM);
const required = process.env.REQUIRE_CHROMIUM === '1';

// Invented example: a 2.45 GHz choke and tuning stub.
const SHEET = [
  'substrate board: dk 2.55, df 0.0022, height 0.8 mm, copper 1 oz',
  'line feed: microstrip on board, z0 50 ohm, at 2.45 GHz',
  'line thin: microstrip on board, width 0.4 mm',
  'stub choke: short on thin, length 22.1 mm, at 2.45 GHz, resonant',
  'stub tune: open on feed, capacitance 0.9 pF, at 2.45 GHz, band 2.4 GHz .. 2.5 GHz',
  'sweep sec: of feed, length 20 mm, over 0.1 GHz .. 10 GHz',
].join('\n');

const service = createSheetService();
const doc = service.evaluate('file:///chromium.rfsheet', 1, SHEET);
const svgOf = (name: string, view: 'frequency' | 'length' = 'frequency') => {
  const r = service.getPlot(doc, name, { view });
  if ('error' in r) throw new Error(r.error);
  return r.svg;
};

if (required && !available) {
  describe('plot SVG in Chromium (required by REQUIRE_CHROMIUM=1)', () => {
    it('finds Chromium', () => expect.fail(`no chromium at ${CHROMIUM}`));
  });
}

describe.skipIf(!available)(available ? 'plot SVG in Chromium' : `plot SVG in Chromium (skipped: no chromium at ${CHROMIUM})`, () => {
  let browser: Browser;
  let page: Page;
  const requests: string[] = [];

  beforeAll(async () => {
    browser = await chromium.launch({
      executablePath: CHROMIUM,
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    });
    page = await browser.newPage();
    await page.route('**/*', (route) => {
      requests.push(route.request().url());
      return route.abort();
    });
  }, 60_000);

  afterAll(async () => {
    await browser?.close();
  });

  it.each([['tune', 'frequency'], ['choke', 'frequency'], ['tune', 'length'], ['sec', 'frequency'], ['feed', 'frequency']] as const)(
    '%s (%s view): Chromium\'s XML parser accepts it as SVG',
    async (name, view) => {
      const svg = svgOf(name, view);
      // Browser code as text: the test's TypeScript has no DOM types.
      const parsed = await page.evaluate(`(() => {
        const d = new DOMParser().parseFromString(${JSON.stringify(svg)}, 'image/svg+xml');
        const error = d.getElementsByTagName('parsererror')[0];
        return { error: error ? error.textContent : null, root: d.documentElement.namespaceURI + ' ' + d.documentElement.localName };
      })()`);
      expect(parsed).toEqual({ error: null, root: 'http://www.w3.org/2000/svg svg' });
    },
  );

  it('renders inline, loads nothing, and follows the editor\'s colour variables with fallbacks', async () => {
    requests.length = 0;
    await page.setContent(`<!doctype html><html><body style="margin:0">${svgOf('tune')}</body></html>`);
    const look = () => page.evaluate(`(() => {
      const trace = document.querySelector('.sw-trace[data-quantity="reactance"]');
      const box = trace.getBBox();
      return { stroke: getComputedStyle(trace).stroke, width: box.width, height: box.height, text: getComputedStyle(document.querySelector('.sw-axis-x text')).fill };
    })()`) as Promise<{ stroke: string; width: number; height: number; text: string }>;
    const plain = await look();
    expect(plain.stroke).toBe('rgb(59, 111, 214)'); // the fallback, #3b6fd6
    expect(plain.text).toBe('rgb(31, 31, 31)');
    expect(plain.width).toBeGreaterThan(100);
    expect(plain.height).toBeGreaterThan(10);
    await page.evaluate(`document.body.style.setProperty('--vscode-charts-blue', 'rgb(1, 2, 3)');
      document.body.style.setProperty('--vscode-editor-foreground', 'rgb(200, 201, 202)');`);
    const themed = await look();
    expect(themed.stroke).toBe('rgb(1, 2, 3)');
    expect(themed.text).toBe('rgb(200, 201, 202)');
    expect(requests.filter((u) => !u.startsWith('about:') && !u.startsWith('data:'))).toEqual([]);
  });

  it('as a file opened on a dark page (an image: no theme variables reach it) it brings its own white background; inline it takes the theme\'s', async () => {
    const svg = svgOf('tune');
    await page.setContent('<!doctype html><html><body style="margin:0; background: #000"></body></html>');
    // Drawn as an image onto a canvas: the corner pixel (outside the plot area) is what the reader sees there.
    const pixels = await page.evaluate(`new Promise((resolve, reject) => {
      const img = new Image();
      img.onload = () => {
        const c = document.createElement('canvas');
        c.width = img.naturalWidth;
        c.height = img.naturalHeight;
        const g = c.getContext('2d');
        g.drawImage(img, 0, 0);
        resolve({ corner: Array.from(g.getImageData(3, 3, 1, 1).data), width: c.width });
      };
      img.onerror = () => reject(new Error('the SVG did not load as an image'));
      img.src = 'data:image/svg+xml;charset=utf-8,' + encodeURIComponent(${JSON.stringify(svg)});
    })`) as { corner: number[]; width: number };
    expect(pixels.width).toBeGreaterThan(100);
    expect(pixels.corner).toEqual([255, 255, 255, 255]);
    // Inline in a themed page (the panel), the background is the editor's.
    await page.setContent(`<!doctype html><html><body style="margin:0; --vscode-editor-background: rgb(30, 31, 32)">${svg}</body></html>`);
    expect(await page.evaluate(`getComputedStyle(document.querySelector('.sw-background')).fill`)).toBe('rgb(30, 31, 32)');
  });
});
