/**
 * Drives the VS Code workbench in headless chromium the way a user would: Quick Open, Go to Line,
 * mouse hover, the Problems panel, the quick-fix menu. Every step waits on a visible condition.
 */
import { basename } from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { chromiumPath } from './availability.js';
import { readActionMenu, readCursorStatus, readEditorLines, readFocusedAction, readHover, type EditorLine } from './pageScripts.js';
import { waitFor } from './wait.js';

/** Flags from ENGINEERING.md: headless, no sandbox (CI runs as root), nothing phoning home. */
const CHROMIUM_FLAGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync', '--disable-dev-shm-usage'];

/** Browser viewport: wide enough that the whole example sheet and the Problems panel show. */
export const VIEWPORT = { width: 1600, height: 1000 };

/** Launches chromium with an empty profile in `profileDir` and opens the workbench on `folder`. */
export async function openWorkbench(url: string, folder: string, profileDir: string): Promise<{ context: BrowserContext; page: Page }> {
  const context = await chromium.launchPersistentContext(profileDir, {
    executablePath: chromiumPath(), headless: true, args: CHROMIUM_FLAGS, viewport: VIEWPORT,
  });
  const page = context.pages()[0] ?? await context.newPage();
  await page.goto(`${url}/?folder=${encodeURIComponent(folder)}`, { waitUntil: 'domcontentloaded' });
  await page.waitForSelector('.monaco-workbench .part.editor', { timeout: 60_000 });
  await page.waitForSelector('#status\\.problems', { timeout: 60_000 });
  return { context, page };
}

/** Opens a workspace file with Quick Open (Ctrl+P), retrying while the file search warms up. */
export async function quickOpen(page: Page, relativePath: string): Promise<void> {
  const tab = page.locator(`.tabs-container .tab[aria-label*="${basename(relativePath)}"]`);
  await waitFor(`${relativePath} open in an editor tab`, 60_000, async () => {
    await page.keyboard.press('Escape');
    await page.keyboard.press('Control+p');
    const input = page.locator('.quick-input-widget input');
    await input.waitFor({ state: 'visible', timeout: 10_000 });
    await input.fill(relativePath);
    const row = page.locator('.quick-input-widget .monaco-list-row', { hasText: basename(relativePath) }).first();
    await row.waitFor({ state: 'visible', timeout: 15_000 });
    await page.keyboard.press('Enter');
    await tab.waitFor({ state: 'visible', timeout: 8_000 });
    return true;
  }, 0);
  await page.locator('.editor-group-container.active .monaco-editor .view-lines').waitFor({ state: 'visible' });
}

/** Moves the cursor with Go to Line (Ctrl+G) to 1-based `line:col` and waits for the status bar to show it. */
export async function gotoPosition(page: Page, line: number, col: number): Promise<void> {
  await page.keyboard.press('Escape');
  await page.keyboard.press('Control+1');
  await page.locator('.editor-group-container.active .monaco-editor.focused').waitFor({ state: 'attached', timeout: 5_000 });
  await page.keyboard.press('Control+g');
  await page.locator('.quick-input-widget input').waitFor({ state: 'visible' });
  await page.keyboard.type(`${line}:${col}`);
  await page.keyboard.press('Enter');
  await waitFor(`cursor at Ln ${line}, Col ${col}`, 5_000, async () => (await page.evaluate(readCursorStatus)).startsWith(`Ln ${line}, Col ${col}`));
}

/** Rendered editor lines (text without inlay hints, and the hints), waiting until `ready` holds. */
export async function editorLines(page: Page, what: string, ready: (lines: EditorLine[]) => boolean, timeoutMs = 30_000): Promise<EditorLine[]> {
  return waitFor(what, timeoutMs, async () => {
    const lines = await page.evaluate(readEditorLines);
    return ready(lines) ? lines : null;
  });
}

/**
 * Hovers the character at `line:col` with the mouse (as a user does), falling back to the keyboard
 * hover (Ctrl+K Ctrl+I) when the mouse hover does not show; returns the hover text and how it came.
 */
export async function hoverAt(page: Page, line: number, col: number): Promise<{ text: string; via: 'mouse' | 'keyboard' }> {
  await gotoPosition(page, line, col);
  await page.mouse.move(20, VIEWPORT.height / 2);
  const cursor = await page.locator('.editor-group-container.active .monaco-editor .cursors-layer .cursor').first().boundingBox();
  if (cursor) {
    await page.mouse.move(cursor.x + 4, cursor.y + cursor.height / 2, { steps: 4 });
    const text = await waitFor('mouse hover', 5_000, () => page.evaluate(readHover)).catch(() => null);
    if (text) return { text, via: 'mouse' };
  }
  await page.keyboard.press('Control+k');
  await page.keyboard.press('Control+i');
  return { text: await waitFor('keyboard hover', 5_000, () => page.evaluate(readHover)), via: 'keyboard' };
}

/** Opens the Problems panel (Ctrl+Shift+M). */
export async function showProblems(page: Page): Promise<void> {
  await page.keyboard.press('Escape');
  await page.mouse.move(20, VIEWPORT.height / 2);
  await page.keyboard.press('Control+Shift+m');
  await page.locator('.markers-panel').waitFor({ state: 'visible', timeout: 10_000 });
}

/**
 * Opens the quick-fix menu (Ctrl+.) at `line:col` and waits for an item matching `title`. `pick`
 * chooses that item as a keyboard user does: arrow keys until it is focused, then Enter.
 */
export async function openQuickFixMenu(page: Page, line: number, col: number, title: RegExp): Promise<{ items: string[]; pick(): Promise<string> }> {
  await gotoPosition(page, line, col);
  await page.keyboard.press('Control+.');
  const items = await waitFor(`a quick fix matching ${title}`, 15_000, async () => {
    const labels = await page.evaluate(readActionMenu);
    return labels.some((l) => title.test(l)) ? labels : null;
  });
  return {
    items,
    async pick() {
      const label = items.find((l) => title.test(l))!;
      await waitFor(`"${label}" focused in the quick-fix menu`, 10_000, async () => {
        if ((await page.evaluate(readFocusedAction)) === label) return true;
        await page.keyboard.press('ArrowDown');
        return false;
      }, 100);
      await page.keyboard.press('Enter');
      await page.locator('.action-widget').waitFor({ state: 'hidden', timeout: 5_000 });
      return label;
    },
  };
}

/** Runs a command from the Command Palette (F1) by its title, as a user would. */
export async function runCommand(page: Page, title: string): Promise<void> {
  await page.keyboard.press('Escape');
  await page.keyboard.press('F1');
  const input = page.locator('.quick-input-widget input');
  await input.waitFor({ state: 'visible' });
  await input.fill(`>${title}`);
  await page.locator('.quick-input-widget .monaco-list-row.focused', { hasText: title }).waitFor({ state: 'visible', timeout: 10_000 });
  await page.keyboard.press('Enter');
}
