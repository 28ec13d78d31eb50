/**
 * Renders a plot description to a self-contained SVG string (pure string building, no DOM). The
 * same bytes go to the editor's panel and to `stubwright plot --svg`.
 *
 * - Colours only through CSS custom properties with fallbacks (`var(--vscode-charts-blue, #3b6fd6)`),
 *   set in `style` attributes, so a webview follows the editor's theme and a file still renders.
 * - No script, no external reference, no foreignObject.
 * - The first child is a background rectangle over the whole viewBox in the editor's background
 *   colour (`var(--vscode-editor-background, #ffffff)`): the file reads on any page (dark ones too),
 *   and in the panel it is the theme's own background.
 * - Stacked panels share one linear x axis; every trace is clipped to its panel's y range (a
 *   segment leaving the range ends at the edge) and is broken where the model says (poles).
 * - Classes and data attributes are the interface tests and the panel rely on (see the contract):
 *   sw-plot, sw-trace[data-quantity], sw-band[data-from][data-to], sw-resonance[data-x][data-type],
 *   sw-resonance-label, sw-operating[data-x], sw-axis-x, sw-axis-y.
 */
import { formatQuantity, MINUS } from '../sheet/format.js';

export type AxisQuantity = 'frequency' | 'length' | 'impedance' | 'inductance' | 'capacitance' | 'ratio' | 'db' | 'db-per-m';

export interface Trace {
  /** data-quantity: reactance, resistance, inductance, capacitance, z0, eps-eff, loss, s11-db, s21-db. */
  quantity: string;
  label: string;
  /** Colour name: a `--vscode-charts-*` variable. */
  colour: ChartColour;
  /** Continuous pieces of the curve (x, y in SI); the renderer never joins two pieces. */
  segments: [number, number][][];
  dashed?: boolean;
}

export interface Panel {
  yQuantity: AxisQuantity;
  yLabel: string;
  yMin: number;
  yMax: number;
  traces: Trace[];
  /** Where the operating point sits on this panel (y in SI), when it has one. */
  operatingY?: number | null;
}

export interface Marker {
  kind: 'resonance';
  x: number;
  label: string;
  type: 'series' | 'parallel';
}

export interface PlotModel {
  title: string;
  subtitle?: string;
  view: 'frequency' | 'length';
  xQuantity: 'frequency' | 'length';
  xLabel: string;
  xMin: number;
  xMax: number;
  lengthUnit: 'mm' | 'mil';
  panels: Panel[];
  /** Shaded band (x in Hz), when the view is over frequency and the stub has one. */
  band?: [number, number];
  resonances: Marker[];
  operating?: { x: number; label: string };
}

export type ChartColour = 'blue' | 'orange' | 'green' | 'red' | 'purple' | 'yellow';

const FALLBACK: Record<ChartColour, string> = {
  blue: '#3b6fd6', orange: '#c8681c', green: '#2f8a3a', red: '#c72e2e', purple: '#8f45c9', yellow: '#b89500',
};
const chart = (c: ChartColour) => `var(--vscode-charts-${c}, ${FALLBACK[c]})`;
const FOREGROUND = 'var(--vscode-editor-foreground, #1f1f1f)';
const MUTED = 'var(--vscode-descriptionForeground, #6a6a6a)';
const GRID = 'var(--vscode-editorWidget-border, #c8c8c8)';
const FONT = 'var(--vscode-font-family, sans-serif)';
const BACKGROUND = 'var(--vscode-editor-background, #ffffff)';

export const WIDTH = 760;
const LEFT = 74;
const RIGHT = 22;
const TOP = 68;
const PANEL_HEIGHT = 190;
const GAP = 34;
const BOTTOM = 46;

/** Escapes text for element content and attribute values. */
export function escapeXml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' })[c]!);
}

/** A coordinate in viewBox units, two decimals, no exponent. */
const n = (v: number) => {
  const r = Math.round(v * 100) / 100;
  return Object.is(r, -0) ? '0' : String(r);
};

/** SI number as a data attribute (exact round trip). */
const d = (v: number) => String(v);

/** 1-2-5 ticks covering [min, max], about `count` of them (the two ends when the range is below float resolution). */
export function niceTicks(min: number, max: number, count = 6): number[] {
  if (!(max > min) || !Number.isFinite(max - min)) return [min];
  const raw = (max - min) / count;
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 2.5, 5, 10].map((k) => k * mag).find((s) => s >= raw) ?? 10 * mag;
  const first = Math.ceil(min / step - 1e-9);
  const last = Math.floor(max / step + 1e-9);
  if (!(last - first <= 4 * count) || step < Math.max(Math.abs(min), Math.abs(max)) * 1e-12) return [min, max];
  const out: number[] = [];
  for (let k = first; k <= last; k++) out.push(k === 0 ? 0 : k * step);
  return out;
}

/** The display unit of an axis: the scale SI values are divided by, and its name. */
export function axisUnit(q: AxisQuantity, maxAbs: number, lengthUnit: 'mm' | 'mil' = 'mm'): { scale: number; unit: string } {
  const pick = (rungs: [number, string][]) => {
    let chosen = rungs[0]!;
    for (const r of rungs) if (maxAbs >= r[0]) chosen = r;
    return { scale: chosen[0], unit: chosen[1] };
  };
  switch (q) {
    case 'frequency':
      return pick([[1, 'Hz'], [1e3, 'kHz'], [1e6, 'MHz'], [1e9, 'GHz'], [1e12, 'THz']]);
    case 'length':
      return lengthUnit === 'mil' ? { scale: 25.4e-6, unit: 'mil' } : maxAbs < 1e-4 ? { scale: 1e-6, unit: 'µm' } : maxAbs >= 1 ? { scale: 1, unit: 'm' } : { scale: 1e-3, unit: 'mm' };
    case 'impedance':
      return maxAbs >= 1e4 ? { scale: 1e3, unit: 'kΩ' } : { scale: 1, unit: 'Ω' };
    case 'inductance':
      return pick([[1e-12, 'pH'], [1e-9, 'nH'], [1e-6, 'µH'], [1e-3, 'mH'], [1, 'H']]);
    case 'capacitance':
      return pick([[1e-15, 'fF'], [1e-12, 'pF'], [1e-9, 'nF'], [1e-6, 'µF'], [1, 'F']]);
    case 'db':
      return { scale: 1, unit: 'dB' };
    case 'db-per-m':
      return { scale: 1, unit: 'dB/m' };
    case 'ratio':
      return { scale: 1, unit: '' };
  }
}

const tickText = (v: number, scale: number) => {
  const x = Number((v / scale).toPrecision(6));
  const s = String(x);
  return x < 0 ? `${MINUS}${s.slice(1)}` : s;
};

/**
 * Clips a polyline to y in [lo, hi]: pieces outside are cut at the edge (linear interpolation); a
 * jump from beyond one edge to beyond the other between two samples is left out (a pole).
 */
export function clipSegment(points: readonly [number, number][], lo: number, hi: number): [number, number][][] {
  const out: [number, number][][] = [];
  let cur: [number, number][] = [];
  const inside = (y: number) => y >= lo && y <= hi;
  const edge = (a: [number, number], b: [number, number]): [number, number] => {
    const yEdge = (a[1] < lo) !== (b[1] < lo) ? lo : hi;
    const t = (yEdge - a[1]) / (b[1] - a[1]);
    return [a[0] + t * (b[0] - a[0]), yEdge];
  };
  for (let i = 0; i < points.length; i++) {
    const p = points[i]!;
    const prev = points[i - 1];
    if (inside(p[1])) {
      if (prev && !inside(prev[1])) cur.push(edge(prev, p));
      cur.push(p);
    } else if (prev && inside(prev[1])) {
      cur.push(edge(prev, p));
      out.push(cur);
      cur = [];
    }
    // A jump over the whole range between two samples (across a pole) is not drawn.
  }
  if (cur.length > 0) out.push(cur);
  return out.filter((s) => s.length >= 2);
}

/** The SVG text of a plot. */
export function renderSvg(m: PlotModel): string {
  const plotW = WIDTH - LEFT - RIGHT;
  const height = TOP + m.panels.length * PANEL_HEIGHT + (m.panels.length - 1) * GAP + BOTTOM;
  const xOf = (x: number) => LEFT + ((x - m.xMin) / (m.xMax - m.xMin)) * plotW;
  const xUnit = axisUnit(m.xQuantity, Math.max(Math.abs(m.xMin), Math.abs(m.xMax)), m.lengthUnit);
  const xTicks = niceTicks(m.xMin, m.xMax, 8);
  const out: string[] = [];
  out.push(
    `<svg xmlns="http://www.w3.org/2000/svg" class="sw-plot" viewBox="0 0 ${WIDTH} ${height}" width="${WIDTH}" height="${height}" role="img"` +
      ` data-view="${m.view}" data-x-min="${d(m.xMin)}" data-x-max="${d(m.xMax)}" data-plot-left="${LEFT}" data-plot-width="${plotW}"` +
      ` font-family="sans-serif" style="font-family: ${FONT}; color: ${FOREGROUND}">`,
    `<rect class="sw-background" x="0" y="0" width="${WIDTH}" height="${height}" style="fill: ${BACKGROUND}"/>`,
    `<title>${escapeXml(m.title)}</title>`,
    `<text class="sw-title" x="${LEFT}" y="20" font-size="14" font-weight="600" style="fill: ${FOREGROUND}">${escapeXml(m.title)}</text>`,
  );
  if (m.subtitle) {
    const sub = m.subtitle.length > 110 ? `${m.subtitle.slice(0, 109).trimEnd()}…` : m.subtitle;
    out.push(`<text class="sw-subtitle" x="${LEFT}" y="38" font-size="11" style="fill: ${MUTED}">${escapeXml(sub)}</text>`);
  }
  // Legend, right-aligned on the title lines.
  const legend = m.panels.flatMap((p) => p.traces).filter((t, i, all) => all.findIndex((u) => u.quantity === t.quantity) === i);
  let lx = WIDTH - RIGHT;
  for (const t of [...legend].reverse()) {
    const w = 26 + t.label.length * 6.2;
    lx -= w;
    out.push(
      `<g class="sw-legend" data-quantity="${escapeXml(t.quantity)}"><line x1="${n(lx)}" y1="52" x2="${n(lx + 18)}" y2="52" stroke-width="2.5"${t.dashed ? ' stroke-dasharray="5 3"' : ''} style="stroke: ${chart(t.colour)}"/>` +
        `<text x="${n(lx + 22)}" y="56" font-size="11" style="fill: ${FOREGROUND}">${escapeXml(t.label)}</text></g>`,
    );
  }
  const panelTop = (i: number) => TOP + i * (PANEL_HEIGHT + GAP);
  const top = panelTop(0);
  const bottom = panelTop(m.panels.length - 1) + PANEL_HEIGHT;
  const clipId = (i: number) => `sw-clip-${i}`;
  out.push('<defs>');
  m.panels.forEach((_, i) => out.push(`<clipPath id="${clipId(i)}"><rect x="${LEFT}" y="${panelTop(i)}" width="${plotW}" height="${PANEL_HEIGHT}"/></clipPath>`));
  out.push('</defs>');

  m.panels.forEach((p, i) => {
    const y0 = panelTop(i);
    const yOf = (y: number) => y0 + PANEL_HEIGHT - ((y - p.yMin) / (p.yMax - p.yMin)) * PANEL_HEIGHT;
    const yUnit = axisUnit(p.yQuantity, Math.max(Math.abs(p.yMin), Math.abs(p.yMax)), m.lengthUnit);
    out.push(`<g class="sw-panel" data-panel="${i}" data-y-min="${d(p.yMin)}" data-y-max="${d(p.yMax)}">`);
    if (m.band) {
      const [a, b] = [Math.max(m.band[0], m.xMin), Math.min(m.band[1], m.xMax)];
      if (b > a) {
        out.push(`<rect class="sw-band" data-from="${d(m.band[0])}" data-to="${d(m.band[1])}" x="${n(xOf(a))}" y="${y0}" width="${n(xOf(b) - xOf(a))}" height="${PANEL_HEIGHT}" style="fill: ${chart('yellow')}; fill-opacity: 0.16"/>`);
      }
    }
    // Grid and y axis.
    const yTicks = niceTicks(p.yMin, p.yMax, 5);
    out.push(`<g class="sw-axis-y" data-quantity="${p.yQuantity}" data-unit="${escapeXml(yUnit.unit)}">`);
    for (const t of yTicks) {
      const y = yOf(t);
      out.push(
        `<line x1="${LEFT}" y1="${n(y)}" x2="${LEFT + plotW}" y2="${n(y)}" stroke-width="${t === 0 ? 1 : 0.5}" style="stroke: ${t === 0 ? MUTED : GRID}"/>`,
        `<text x="${LEFT - 6}" y="${n(y + 4)}" font-size="10.5" text-anchor="end" style="fill: ${FOREGROUND}">${tickText(t, yUnit.scale)}</text>`,
      );
    }
    const label = yUnit.unit ? `${p.yLabel} (${yUnit.unit})` : p.yLabel;
    out.push(`<text x="16" y="${n(y0 + PANEL_HEIGHT / 2)}" font-size="11" text-anchor="middle" transform="rotate(-90 16 ${n(y0 + PANEL_HEIGHT / 2)})" style="fill: ${FOREGROUND}">${escapeXml(label)}</text>`);
    out.push('</g>');
    for (const t of xTicks) out.push(`<line x1="${n(xOf(t))}" y1="${y0}" x2="${n(xOf(t))}" y2="${y0 + PANEL_HEIGHT}" stroke-width="0.5" style="stroke: ${GRID}"/>`);
    out.push(`<rect x="${LEFT}" y="${y0}" width="${plotW}" height="${PANEL_HEIGHT}" fill="none" stroke-width="1" style="stroke: ${MUTED}"/>`);
    // Traces.
    for (const t of p.traces) {
      const pieces = t.segments.flatMap((s) => clipSegment(s, p.yMin, p.yMax));
      const path = pieces.map((s) => s.map(([x, y], k) => `${k === 0 ? 'M' : 'L'}${n(xOf(x))} ${n(yOf(y))}`).join(' ')).join(' ');
      out.push(
        `<path class="sw-trace" data-quantity="${escapeXml(t.quantity)}" data-segments="${pieces.length}" d="${path || `M${LEFT} ${y0}`}" fill="none" stroke-width="2" stroke-linejoin="round"` +
          `${t.dashed ? ' stroke-dasharray="5 3"' : ''}${path ? '' : ' visibility="hidden"'} clip-path="url(#${clipId(i)})" style="stroke: ${chart(t.colour)}"/>`,
      );
    }
    if (m.operating && p.operatingY !== undefined && p.operatingY !== null && Number.isFinite(p.operatingY)) {
      const y = Math.min(Math.max(p.operatingY, p.yMin), p.yMax);
      out.push(`<circle class="sw-operating-point" data-x="${d(m.operating.x)}" data-y="${d(p.operatingY)}" cx="${n(xOf(m.operating.x))}" cy="${n(yOf(y))}" r="5" stroke-width="2" style="fill: ${chart('purple')}; stroke: ${FOREGROUND}"/>`);
    }
    out.push('</g>');
  });

  // Resonances across all panels, labelled with their frequency (or length), labels staggered.
  m.resonances.forEach((r, k) => {
    if (r.x < m.xMin || r.x > m.xMax) return;
    const x = xOf(r.x);
    const ly = top + 13 + (k % 2) * 13;
    const anchor = x > LEFT + plotW - 60 ? 'end' : 'start';
    out.push(
      `<g class="sw-resonance" data-x="${d(r.x)}" data-type="${r.type}">` +
        `<line x1="${n(x)}" y1="${top}" x2="${n(x)}" y2="${bottom}" stroke-width="1.2" stroke-dasharray="4 3" style="stroke: ${chart('red')}"/>` +
        `<text class="sw-resonance-label" x="${n(anchor === 'end' ? x - 4 : x + 4)}" y="${ly}" font-size="10.5" text-anchor="${anchor}" style="fill: ${chart('red')}">${escapeXml(r.label)}</text></g>`,
    );
  });
  if (m.operating && m.operating.x >= m.xMin && m.operating.x <= m.xMax) {
    const x = xOf(m.operating.x);
    const anchor = x > LEFT + plotW - 160 ? 'end' : 'start';
    out.push(
      `<g class="sw-operating" data-x="${d(m.operating.x)}">` +
        `<line x1="${n(x)}" y1="${top}" x2="${n(x)}" y2="${bottom}" stroke-width="1.4" stroke-dasharray="1 3" style="stroke: ${chart('purple')}"/>` +
        `<text x="${n(anchor === 'end' ? x - 6 : x + 6)}" y="${bottom - 8}" font-size="11" font-weight="600" text-anchor="${anchor}" style="fill: ${chart('purple')}">${escapeXml(m.operating.label)}</text></g>`,
    );
  }
  // x axis under the last panel.
  out.push(`<g class="sw-axis-x" data-quantity="${m.xQuantity}" data-unit="${escapeXml(xUnit.unit)}">`);
  for (const t of xTicks) {
    out.push(`<text x="${n(xOf(t))}" y="${bottom + 15}" font-size="10.5" text-anchor="middle" style="fill: ${FOREGROUND}">${tickText(t, xUnit.scale)}</text>`);
  }
  out.push(`<text x="${n(LEFT + plotW / 2)}" y="${bottom + 36}" font-size="11" text-anchor="middle" style="fill: ${FOREGROUND}">${escapeXml(`${m.xLabel} (${xUnit.unit})`)}</text>`);
  out.push('</g>');
  out.push('</svg>');
  return `${out.join('\n')}\n`;
}

/** A frequency or length as a marker label. */
export function markerLabel(x: number, quantity: 'frequency' | 'length', lengthUnit: 'mm' | 'mil'): string {
  return formatQuantity(x, quantity, { lengthUnit });
}
