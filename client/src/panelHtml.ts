/**
 * The plot panel's page, built by a pure function so that a test can load exactly what the webview
 * shows in headless Chromium. Everything is inline (one nonce'd style, one nonce'd script) under a
 * strict content security policy: nothing is loaded from anywhere, images only as data: URLs.
 *
 * The server's SVG is inserted inline (so its `var(--vscode-…, fallback)` colours follow the editor
 * theme), after dropping anything active from it. The script speaks the messages of
 * panelMessages.ts: it renders `plot`, shows `error`, and posts `ready`, `view`, `export` and, for
 * PNG, the picture as seen (theme colours resolved, editor background filled) as a data URL.
 */

/** What the page needs from the webview. */
export interface PanelHtmlOptions {
  /** `webview.cspSource`: the origin of the webview's own resources. */
  cspSource: string;
  /** A fresh random nonce per page (base64 or hex; no quotes). */
  nonce: string;
}

/** The content security policy of the page. */
export function panelCsp({ cspSource, nonce }: PanelHtmlOptions): string {
  return [
    "default-src 'none'",
    `img-src data: ${cspSource}`,
    `style-src 'nonce-${nonce}'`,
    `script-src 'nonce-${nonce}'`,
    "base-uri 'none'",
    "form-action 'none'",
  ].join('; ');
}

const attr = (s: string) => s.replace(/&/g, '&amp;').replace(/"/g, '&quot;').replace(/</g, '&lt;').replace(/>/g, '&gt;');

/** The whole HTML document of the plot panel. */
export function panelHtml(options: PanelHtmlOptions): string {
  if (!/^[A-Za-z0-9+/=_-]{16,}$/.test(options.nonce)) throw new Error('panelHtml: the nonce must be at least 16 base64 characters');
  const nonce = attr(options.nonce);
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="${attr(panelCsp(options))}">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>Stubwright plot</title>
<style nonce="${nonce}">${PANEL_CSS}</style>
</head>
<body>
<header class="bar">
  <div class="heading">
    <h1 id="title">Plot</h1>
    <span id="subtitle" class="muted"></span>
  </div>
  <div class="group" role="group" aria-label="Horizontal axis">
    <button type="button" class="seg" id="view-frequency" data-view="frequency" aria-pressed="true">vs frequency</button>
    <button type="button" class="seg" id="view-length" data-view="length" aria-pressed="false">vs length</button>
  </div>
  <div class="group" role="group" aria-label="Save">
    <span class="muted">Save</span>
    <button type="button" class="act" id="export-svg" data-export="svg" title="The plot as an SVG file (portable colours)">SVG</button>
    <button type="button" class="act" id="export-png" data-export="png" title="The picture as shown, as a PNG file">PNG</button>
    <button type="button" class="act" id="export-touchstone" data-export="touchstone" title="A one-port Touchstone sweep from the server">Touchstone</button>
    <button type="button" class="act" id="export-csv" data-export="csv" title="The sweep as CSV from the server">CSV</button>
  </div>
</header>
<div id="status" class="status" role="status" aria-live="polite"></div>
<main>
  <figure id="plot" class="plot" aria-busy="true"><p class="muted empty">Waiting for the plot…</p></figure>
  <ul id="readout" class="readout" aria-label="Markers"></ul>
</main>
<script nonce="${nonce}">${PANEL_SCRIPT}</script>
</body>
</html>
`;
}

/** Page style: VS Code's theme variables, each with a neutral fallback for a plain browser. */
const PANEL_CSS = `
:root { color-scheme: light dark; }
body {
  margin: 0; padding: 0 16px 16px;
  background: var(--vscode-editor-background, #fbfbfa);
  color: var(--vscode-foreground, #1f1f1f);
  font-family: var(--vscode-font-family, system-ui, sans-serif);
  font-size: var(--vscode-font-size, 13px);
}
.bar { display: flex; flex-wrap: wrap; align-items: center; gap: 8px 20px; padding: 10px 0;
  border-bottom: 1px solid var(--vscode-panel-border, rgba(128,128,128,.35)); }
.heading { flex: 1 1 16em; min-width: 0; }
h1 { display: inline; margin: 0 8px 0 0; font-size: 1.15em; font-weight: 600; }
.muted { color: var(--vscode-descriptionForeground, #6b6b6b); }
.group { display: inline-flex; align-items: center; gap: 4px; }
button { font: inherit; cursor: pointer; border-radius: 3px; padding: 3px 10px;
  border: 1px solid var(--vscode-button-border, transparent); }
button:focus-visible { outline: 1px solid var(--vscode-focusBorder, #2f6fd0); outline-offset: 1px; }
.seg { background: transparent; color: var(--vscode-foreground, #1f1f1f);
  border-color: var(--vscode-panel-border, rgba(128,128,128,.45)); }
.seg[aria-pressed="true"] { background: var(--vscode-button-background, #2f6fd0); color: var(--vscode-button-foreground, #ffffff);
  border-color: var(--vscode-button-background, #2f6fd0); }
.act { background: var(--vscode-button-secondaryBackground, #e4e4e2); color: var(--vscode-button-secondaryForeground, #1f1f1f); }
.act:hover { background: var(--vscode-button-secondaryHoverBackground, #d6d6d3); }
.status { min-height: 1.4em; padding: 6px 0 0; }
.status.error { color: var(--vscode-errorForeground, #b3261e); }
.plot { margin: 8px 0 0; }
.plot svg { display: block; width: 100%; height: auto; max-height: calc(100vh - 150px); }
.plot.stale svg { opacity: .45; }
.empty { padding: 40px 0; text-align: center; }
.readout { list-style: none; display: flex; flex-wrap: wrap; gap: 6px 18px; margin: 8px 0 0; padding: 0; }
.readout li::before { content: ""; display: inline-block; width: .7em; height: .7em; margin-right: .4em;
  border-radius: 50%; background: var(--vscode-charts-orange, #c2571a); }
.readout li.operating::before { border-radius: 0; transform: rotate(45deg) scale(.8);
  background: var(--vscode-charts-green, #2e8540); }
`;

/**
 * The page script (plain ES2020, runs in the webview). It never builds markup from strings: the
 * server's SVG is parsed as XML, cleaned of anything active, and imported as nodes.
 */
const PANEL_SCRIPT = String.raw`
(function () {
  'use strict';
  var vscode = acquireVsCodeApi();
  var SVG_NS = 'http://www.w3.org/2000/svg';
  var plot = document.getElementById('plot');
  var statusEl = document.getElementById('status');
  var titleEl = document.getElementById('title');
  var subtitleEl = document.getElementById('subtitle');
  var readout = document.getElementById('readout');
  var current = null;

  function setStatus(text, isError) {
    statusEl.textContent = text || '';
    statusEl.className = isError ? 'status error' : 'status';
    statusEl.setAttribute('role', isError ? 'alert' : 'status');
  }

  /**
   * Drops scripts, foreign content, style elements, event handlers and non-local references. Style
   * attributes arrive renamed to data-sw-style (see parseSvg) and are applied through CSSOM after
   * import, without any url() other than a local #reference.
   */
  function clean(node) {
    var drop = [];
    var all = [node].concat(Array.prototype.slice.call(node.getElementsByTagName('*')));
    all.forEach(function (el) {
      var name = el.localName;
      if (el.namespaceURI !== SVG_NS || name === 'script' || name === 'foreignObject' || name === 'style') { drop.push(el); return; }
      Array.prototype.slice.call(el.attributes).forEach(function (a) {
        var n = a.name.toLowerCase();
        var isRef = n === 'href' || n === 'xlink:href' || n === 'src';
        if (n === 'style') { el.removeAttribute(a.name); el.setAttribute('data-sw-style', a.value); }
        else if (n.indexOf('on') === 0 || (isRef && a.value.charAt(0) !== '#')) el.removeAttribute(a.name);
        else if (n !== 'data-sw-style' && /url\(\s*['"]?[^#'"\s]/i.test(a.value)) el.removeAttribute(a.name);
      });
    });
    drop.forEach(function (el) { if (el !== node && el.parentNode) el.parentNode.removeChild(el); });
    return drop.indexOf(node) < 0;
  }

  /** Applies the kept-aside style declarations through CSSOM (allowed under the CSP). */
  function applyStyles(root) {
    [root].concat(Array.prototype.slice.call(root.querySelectorAll('[data-sw-style]'))).forEach(function (el) {
      var text = el.getAttribute('data-sw-style');
      if (text === null) return;
      el.removeAttribute('data-sw-style');
      text.split(';').forEach(function (decl) {
        var i = decl.indexOf(':');
        if (i < 0) return;
        var prop = decl.slice(0, i).trim().toLowerCase();
        var value = decl.slice(i + 1).trim();
        var important = /!important$/i.test(value);
        if (important) value = value.replace(/\s*!important$/i, '');
        if (!/^-?[a-z][a-z-]*$/.test(prop) || /url\(\s*['"]?[^#'"\s]/i.test(value)) return;
        el.style.setProperty(prop, value, important ? 'important' : '');
      });
    });
  }

  /**
   * Parses the server's SVG. A document made by DOMParser inherits this page's policy, so style
   * attributes are renamed in the text first (parsing them would be reported as CSP violations).
   */
  function parseSvg(text) {
    var doc = new DOMParser().parseFromString(text.replace(/(\s)style(\s*=\s*["'])/g, '$1data-sw-style$2'), 'image/svg+xml');
    var root = doc.documentElement;
    if (!root || root.localName !== 'svg' || root.namespaceURI !== SVG_NS || doc.getElementsByTagName('parsererror').length) return null;
    if (!clean(root)) return null;
    var svg = document.importNode(root, true);
    applyStyles(svg);
    return svg;
  }

  function showReadout(markers) {
    readout.replaceChildren();
    (markers || []).forEach(function (m) {
      var li = document.createElement('li');
      li.className = m.kind;
      li.textContent = (m.kind === 'operating' ? 'operating point ' : (m.resonanceType ? m.resonanceType + ' resonance ' : 'resonance ')) + m.label;
      readout.appendChild(li);
    });
  }

  function render(result, sheet) {
    var svg = parseSvg(result.svg);
    if (!svg) { setStatus('The server sent a picture that is not a usable SVG.', true); return; }
    svg.removeAttribute('width');
    svg.removeAttribute('height');
    svg.setAttribute('role', 'img');
    svg.setAttribute('aria-label', result.title);
    plot.replaceChildren(svg);
    plot.classList.remove('stale');
    plot.setAttribute('aria-busy', 'false');
    current = result;
    titleEl.textContent = result.name;
    subtitleEl.textContent = (result.entryKind === 'line' ? 'line' : 'stub') + (sheet ? ' in ' + sheet : '');
    document.querySelectorAll('[data-view]').forEach(function (b) {
      b.setAttribute('aria-pressed', String(b.getAttribute('data-view') === result.view));
    });
    showReadout(result.markers);
    setStatus('', false);
  }

  window.addEventListener('message', function (event) {
    var m = event.data;
    if (!m || typeof m !== 'object') return;
    if (m.type === 'plot' && m.result && typeof m.result.svg === 'string') render(m.result, m.sheet);
    else if (m.type === 'error') {
      if (current) plot.classList.add('stale');
      plot.setAttribute('aria-busy', 'false');
      setStatus(String(m.message), true);
    }
  });

  document.querySelectorAll('[data-view]').forEach(function (b) {
    b.addEventListener('click', function () {
      if (b.getAttribute('aria-pressed') === 'true') return;
      vscode.postMessage({ type: 'view', view: b.getAttribute('data-view') });
    });
  });

  document.querySelectorAll('[data-export]').forEach(function (b) {
    b.addEventListener('click', function () {
      var format = b.getAttribute('data-export');
      if (!current) { setStatus('Nothing to save yet.', true); return; }
      if (format === 'png') exportPng();
      else vscode.postMessage({ type: 'export', format: format });
    });
  });

  /* var(--name, fallback) → the theme's value (or the fallback); fallbacks may hold one level of parentheses. */
  var VAR = /var\(\s*(--[\w-]+)\s*(?:,\s*((?:[^()]|\([^()]*\))*))?\)/g;
  function resolveVars(value, style) {
    for (var i = 0; i < 4 && value.indexOf('var(') >= 0; i++) {
      value = value.replace(VAR, function (_, name, fallback) {
        var v = style.getPropertyValue(name).trim();
        return v || (fallback || '').trim();
      });
    }
    return value;
  }

  /** The SVG as shown: theme colours written in, the editor background filled, 2× pixels. */
  function themedSvg() {
    var live = plot.querySelector('svg');
    var svg = live.cloneNode(true);
    var vb = (svg.getAttribute('viewBox') || '').split(/[\s,]+/).map(Number);
    var w = vb[2] > 0 ? vb[2] : live.getBoundingClientRect().width;
    var h = vb[3] > 0 ? vb[3] : live.getBoundingClientRect().height;
    var bg = document.createElementNS(SVG_NS, 'rect');
    bg.setAttribute('x', String(vb.length === 4 ? vb[0] : 0));
    bg.setAttribute('y', String(vb.length === 4 ? vb[1] : 0));
    bg.setAttribute('width', String(w));
    bg.setAttribute('height', String(h));
    bg.setAttribute('fill', getComputedStyle(document.body).backgroundColor);
    svg.insertBefore(bg, svg.firstChild);
    svg.setAttribute('width', String(2 * w));
    svg.setAttribute('height', String(2 * h));
    if (!svg.getAttribute('font-family')) svg.setAttribute('font-family', getComputedStyle(document.body).fontFamily);
    // Resolved in the text: setting style attributes on the clone would count as inline style here.
    var text = resolveVars(new XMLSerializer().serializeToString(svg), getComputedStyle(document.documentElement));
    return { text: text, width: 2 * w, height: 2 * h };
  }

  function exportPng() {
    var pic;
    try { pic = themedSvg(); } catch (e) { vscode.postMessage({ type: 'exportFailed', message: String(e) }); return; }
    var img = new Image();
    img.onload = function () {
      try {
        var canvas = document.createElement('canvas');
        canvas.width = Math.round(pic.width);
        canvas.height = Math.round(pic.height);
        canvas.getContext('2d').drawImage(img, 0, 0, canvas.width, canvas.height);
        vscode.postMessage({ type: 'exportPng', dataUrl: canvas.toDataURL('image/png') });
      } catch (e) {
        vscode.postMessage({ type: 'exportFailed', message: String(e) });
      }
    };
    img.onerror = function () { vscode.postMessage({ type: 'exportFailed', message: 'the SVG could not be rendered to PNG' }); };
    img.src = 'data:image/svg+xml;charset=utf-8,' + encodeURIComponent(pic.text);
  }

  vscode.postMessage({ type: 'ready' });
})();
`;
