/**
 * The extension checked through VS Code's own API, from inside an extension host: activation on
 * opening a sheet, diagnostics, hover, inlay hints, the near-resonance quick fix and the plot code
 * lenses, all through the same provider commands the editor UI uses. Runs under @vscode/test-electron (index.ts) and, in
 * the code-server end-to-end test, from a probe extension (probe.ts).
 */
import * as assert from 'node:assert/strict';
import * as vscode from 'vscode';

const EXTENSION_ID = 'stubwright.stubwright';
const EXPECTED_CODES = ['model-validity', 'detuned', 'near-resonance', 'resonance-in-band'];

/** Polls `condition` every 100 ms until it returns a truthy value, or fails after `ms`. */
async function waitFor<T>(what: string, ms: number, condition: () => T | Promise<T>): Promise<NonNullable<T>> {
  const end = Date.now() + ms;
  for (;;) {
    const value = await condition();
    if (value) return value as NonNullable<T>;
    if (Date.now() > end) throw new Error(`timed out after ${ms} ms waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

const codeOf = (d: vscode.Diagnostic): string => String(typeof d.code === 'object' ? d.code.value : d.code);
const textOf = (c: vscode.MarkdownString | vscode.MarkedString): string => (typeof c === 'string' ? c : c.value);
const labelOf = (h: vscode.InlayHint): string => (typeof h.label === 'string' ? h.label : h.label.map((p) => p.value).join(''));

/**
 * Runs every check on the sheet at `sheet` (a copy of examples/warnings-tour.rfsheet; the quick fix
 * edits it), the last one opening plot panels from the code lenses. Returns the names of the checks
 * passed; throws on the first failure.
 */
export async function runApiChecks(sheet: vscode.Uri): Promise<string[]> {
  const passed: string[] = [];
  const check = async (name: string, fn: () => Promise<void>) => {
    await fn();
    passed.push(name);
    console.log(`  ✓ ${name}`);
  };
  const ext = vscode.extensions.getExtension(EXTENSION_ID);
  assert.ok(ext, `${EXTENSION_ID} is installed`);
  const doc = await vscode.workspace.openTextDocument(sheet);
  await vscode.window.showTextDocument(doc);
  const stubLines = doc.getText().split('\n').flatMap((t, i) => (/^stub\s/.test(t) ? [i] : []));

  await check('activates on opening an rfsheet document', async () => {
    assert.equal(doc.languageId, 'rfsheet');
    await waitFor('activation', 20_000, () => ext.isActive);
  });

  let near: vscode.Diagnostic | undefined;
  await check('publishes the resonance and validity warnings', async () => {
    const diags = await waitFor('diagnostics', 20_000, () => {
      const d = vscode.languages.getDiagnostics(doc.uri);
      return EXPECTED_CODES.every((c) => d.some((x) => codeOf(x) === c)) ? d : null;
    });
    for (const d of diags) assert.equal(d.severity, vscode.DiagnosticSeverity.Warning, d.message);
    near = diags.find((d) => codeOf(d) === 'near-resonance')!;
    assert.ok(stubLines.includes(near.range.start.line), 'near-resonance is on a stub line');
  });

  await check('hover on a stub name shows its figures', async () => {
    const line = doc.lineAt(near!.range.start.line).text;
    const name = /^stub\s+(\w+)/.exec(line)![1]!;
    const at = new vscode.Position(near!.range.start.line, line.indexOf(name) + 1);
    const hovers = await vscode.commands.executeCommand<vscode.Hover[]>('vscode.executeHoverProvider', doc.uri, at);
    const text = hovers.flatMap((h) => h.contents.map(textOf)).join('\n');
    assert.match(text, new RegExp(`\\b${name}\\b`));
    assert.match(text, /\d+(\.\d+)?\s*(nH|pF)/);
  });

  const hintOn = async (line: number): Promise<string> => {
    const range = new vscode.Range(line, 0, line + 1, 0);
    const hints = await vscode.commands.executeCommand<vscode.InlayHint[]>('vscode.executeInlayHintProvider', doc.uri, range);
    return hints.filter((h) => h.position.line === line).map(labelOf).join(' ');
  };

  await check('inlay hints on every stub line', async () => {
    for (const line of stubLines) assert.match(await hintOn(line), /\d/, `inlay hint on line ${line + 1}`);
  });

  await check('the near-resonance quick fix moves the length out of the margin', async () => {
    const line = near!.range.start.line;
    const before = doc.lineAt(line).text;
    const hintBefore = await hintOn(line);
    const actions = await vscode.commands.executeCommand<(vscode.CodeAction | vscode.Command)[]>(
      'vscode.executeCodeActionProvider', doc.uri, near!.range, vscode.CodeActionKind.QuickFix.value);
    const fix = actions.find((a): a is vscode.CodeAction => 'edit' in a && /resonance margin/.test(a.title));
    assert.ok(fix?.edit, `a resonance-margin quick fix among: ${actions.map((a) => a.title).join(' | ')}`);
    assert.ok(await vscode.workspace.applyEdit(fix.edit));
    assert.notEqual(doc.lineAt(line).text, before);
    await waitFor('the near-resonance warning to clear', 20_000,
      () => !vscode.languages.getDiagnostics(doc.uri).some((d) => codeOf(d) === 'near-resonance'));
    const hintAfter = await hintOn(line);
    assert.match(hintAfter, /\d/);
    assert.notEqual(hintAfter, hintBefore, 'the inlay hint is recomputed for the new length');
  });

  await check('a "Plot" code lens above every stub opens its plot panel, one panel per sheet', async () => {
    const lenses = await waitFor('plot code lenses', 20_000, async () => {
      const all = await vscode.commands.executeCommand<vscode.CodeLens[]>('vscode.executeCodeLensProvider', doc.uri);
      const plots = all.filter((l) => l.command?.command === 'stubwright.showPlot');
      return plots.length > 0 ? plots : null;
    });
    for (const line of stubLines) {
      const lens = lenses.find((l) => l.range.start.line === line);
      const name = /^stub\s+(\w+)/.exec(doc.lineAt(line).text)![1]!;
      assert.ok(lens, `a plot lens on line ${line + 1}`);
      assert.equal(lens.command!.title, 'Plot reactance');
      assert.deepEqual(lens.command!.arguments, [doc.uri.toString(), name]);
    }
    const sheetName = doc.uri.path.slice(doc.uri.path.lastIndexOf('/') + 1);
    const plotTabs = () => vscode.window.tabGroups.all.flatMap((g) => g.tabs)
      .filter((t) => t.input instanceof vscode.TabInputWebview && t.input.viewType.includes('stubwright.plot') && t.label.endsWith(`(${sheetName})`));
    const [first, second] = lenses.filter((l) => stubLines.includes(l.range.start.line));
    for (const lens of [first!, second!]) {
      const name = lens.command!.arguments![1] as string;
      await vscode.commands.executeCommand(lens.command!.command, ...lens.command!.arguments!);
      await waitFor(`the plot panel of ${name}`, 20_000, () => plotTabs().some((t) => t.label.startsWith(`Plot: ${name} `)));
    }
    assert.equal(plotTabs().length, 1, `the second stub of the same sheet reuses the panel: ${plotTabs().map((t) => t.label).join(', ')}`);
    await vscode.window.tabGroups.close(plotTabs());
  });
  return passed;
}
