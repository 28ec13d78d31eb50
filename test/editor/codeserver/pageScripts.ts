/**
 * Functions that run inside the workbench page (passed to `page.evaluate`): each must be
 * self-contained. They read what a user sees from VS Code 1.100's DOM; the selectors are that
 * version's internals (see the editor harness README's "Known limits").
 */

/* The project compiles without the DOM library; inside these functions the page's globals are untyped. */
declare const document: any;

/** One rendered editor line: its number, its text without inlay hints, and the hints on it. */
export interface EditorLine {
  line: number;
  text: string;
  hints: string;
}

/**
 * Rendered lines of the active editor. Inlay hints are injected spans whose dynamic class
 * (`dyn-rule-*`) is styled with the `--vscode-editorInlayHint-*` colours.
 */
export function readEditorLines(): EditorLine[] {
  const hintClasses = new Set<string>();
  for (const sheet of Array.from(document.styleSheets) as any[]) {
    let rules: any;
    try { rules = sheet.cssRules; } catch { continue; }
    for (const r of Array.from(rules ?? []) as any[]) {
      if (r.selectorText && /dyn-rule-/.test(r.selectorText) && /editorInlayHint/.test(r.cssText)) {
        for (const m of (r.selectorText as string).matchAll(/\.(dyn-rule-[\w-]+)/g)) hintClasses.add(m[1]!);
      }
    }
  }
  const editor = document.querySelector('.editor-group-container.active .monaco-editor');
  if (!editor) return [];
  const numbers = new Map<string, number>();
  for (const el of Array.from(editor.querySelectorAll('.margin-view-overlays > div')) as any[]) {
    const n = el.querySelector('.line-numbers');
    if (n) numbers.set(el.style.top, Number(n.textContent.trim()));
  }
  const clean = (s: string) => s.replace(/\u00a0/g, ' ').replace(/\u200a/g, '');
  const out: EditorLine[] = [];
  for (const view of Array.from(editor.querySelectorAll('.view-lines .view-line')) as any[]) {
    let text = '';
    let hints = '';
    for (const span of Array.from(view.querySelectorAll('span > span')) as any[]) {
      const isHint = (Array.from(span.classList) as string[]).some((c) => hintClasses.has(c));
      if (isHint) hints += span.textContent;
      else text += span.textContent;
    }
    const line = numbers.get(view.style.top);
    if (line !== undefined) out.push({ line, text: clean(text), hints: clean(hints).trim() });
  }
  return out.sort((a, b) => a.line - b.line);
}

/** Counts in the status bar's problems item (complete, unlike the virtualized Problems list). */
export function readProblemsStatus(): { errors: number; warnings: number; infos: number } | null {
  const el = document.querySelector('#status\\.problems');
  if (!el) return null;
  const label: string = el.getAttribute('aria-label') || el.textContent || '';
  const count = (re: RegExp) => Number(label.match(re)?.[1] ?? 0);
  return { errors: count(/Errors?:\s*(\d+)/i), warnings: count(/Warnings?:\s*(\d+)/i), infos: count(/Infos?:\s*(\d+)/i) };
}

/** One marker row of the Problems panel. */
export interface ProblemRow {
  severity: string | null;
  line: number | null;
  column: number | null;
  message: string;
  source: string | null;
  code: string | null;
}

/** Marker rows visible in the Problems panel (related-information rows are skipped). */
export function readProblemRows(): ProblemRow[] {
  const rows: ProblemRow[] = [];
  for (const row of Array.from(document.querySelectorAll('.markers-panel .monaco-list-row')) as any[]) {
    const icon = row.querySelector('.marker-icon');
    if (!icon) continue;
    const aria: string = row.getAttribute('aria-label') || '';
    const q = (sel: string): string | null => row.querySelector(sel)?.textContent.trim() || null;
    const pos = aria.match(/line (\d+) and character (\d+)/i) || (row.innerText as string).match(/\[Ln (\d+), Col (\d+)\]/);
    rows.push({
      severity: (String(icon.className).match(/codicon-(error|warning|info)/) ?? aria.match(/^(error|warning|info)/i) ?? [])[1]?.toLowerCase() ?? null,
      line: pos ? Number(pos[1]) : null,
      column: pos ? Number(pos[2]) : null,
      message: q('.marker-message') ?? '',
      source: q('.marker-source'),
      code: q('.marker-code'),
    });
  }
  return rows;
}

/** Text of the visible hover widget(s), or null when none shows. */
export function readHover(): string | null {
  const shown = (Array.from(document.querySelectorAll('.monaco-hover:not(.hidden)')) as any[])
    .filter((e) => e.offsetParent !== null && e.getBoundingClientRect().height > 0)
    .map((e) => (e.innerText as string).trim())
    .filter(Boolean);
  return shown.length ? shown.join('\n---\n') : null;
}

/** Items of the open code-action menu (Ctrl+.), by their visible label. */
export function readActionMenu(): string[] {
  return (Array.from(document.querySelectorAll('.action-widget .monaco-list-row.action')) as any[])
    .map((r) => ((r.getAttribute('aria-label') as string) || (r.innerText as string) || '').trim())
    .filter(Boolean);
}

/** Label of the focused item of the open code-action menu, or null. */
export function readFocusedAction(): string | null {
  return document.querySelector('.action-widget .monaco-list-row.action.focused')?.getAttribute('aria-label') ?? null;
}

/** Cursor position shown in the status bar, e.g. "Ln 17, Col 7". */
export function readCursorStatus(): string {
  return (document.querySelector('#status\\.editor\\.selection')?.textContent ?? '').trim();
}
