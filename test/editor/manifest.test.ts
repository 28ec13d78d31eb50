/**
 * The extension manifest (client/package.json) and what it points to: activation only on rfsheet
 * documents, an engine range that accepts the VS Code the editor tests run (1.100), contributed
 * files present, settings in step with the language service's defaults and the server's bounds, snippets that expand to
 * lines the sheet parser accepts, and a client that imports nothing of ours.
 */
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS } from '../../shared-core/src/service/types.js';
import { toServiceSettings } from '../../server/src/settings.js';
import { LINE_TYPES } from '../../shared-core/src/sheet/eval/lineTypes.js';
import { parseLine } from '../../shared-core/src/sheet/parse/lineParser.js';
import { STUB_KINDS } from '../../shared-core/src/sheet/schema.js';
import { CONFIGURATION_SECTION, LANGUAGE_ID, PLOT_CODE_LENS_SETTING, SERVER_MODULE } from '../../client/src/names.js';
import { SHOW_PLOT_COMMAND } from '../../client/src/protocol.js';

const CLIENT = new URL('../../client/', import.meta.url).pathname;
const read = (rel: string): string => readFileSync(join(CLIENT, rel), 'utf8');
const manifest = JSON.parse(read('package.json'));

/** True when a caret range `^X.Y.Z` accepts `version` (major equal, not lower). */
function caretAccepts(range: string, version: string): boolean {
  const m = /^\^(\d+)\.(\d+)\.(\d+)$/.exec(range);
  if (!m) return false;
  const want = m.slice(1).map(Number);
  const have = version.split('.').map(Number);
  if (have[0] !== want[0]) return false;
  for (let i = 1; i < 3; i++) if (have[i] !== want[i]) return have[i]! > want[i]!;
  return true;
}

/** A snippet body with every placeholder replaced by its default (a choice by its first option). */
function expandSnippet(body: string[]): string {
  return body.join('\n')
    .replace(/\$\{\d+\|([^,|]*)[^}]*\|\}/g, '$1')
    .replace(/\$\{\d+:([^}]*)\}/g, '$1')
    .replace(/\$\d+/g, '');
}

describe('extension manifest', () => {
  it('activates only on rfsheet documents and runs on VS Code 1.91 through 1.100', () => {
    expect(manifest.activationEvents).toEqual([`onLanguage:${LANGUAGE_ID}`]);
    expect(manifest.main).toBe('./dist/extension.js');
    for (const v of ['1.91.0', '1.100.0', '1.100.3']) expect(caretAccepts(manifest.engines.vscode, v), v).toBe(true);
    expect(manifest.capabilities.untrustedWorkspaces.supported).toBe(true);
  });

  it('contributes the language, grammar and snippets from files that exist', () => {
    const [language] = manifest.contributes.languages;
    expect(language).toMatchObject({ id: LANGUAGE_ID, extensions: ['.rfsheet'] });
    const [grammar] = manifest.contributes.grammars;
    expect(grammar).toMatchObject({ language: LANGUAGE_ID, scopeName: 'source.rfsheet' });
    const [snippets] = manifest.contributes.snippets;
    for (const rel of [language.configuration, grammar.path, snippets.path]) expect(existsSync(join(CLIENT, rel)), rel).toBe(true);
    expect(JSON.parse(read(grammar.path)).scopeName).toBe('source.rfsheet');
    expect(JSON.parse(read(language.configuration)).comments.lineComment).toBe('#');
  });

  it('contributes the plot command, in the palette and the editor title only for sheets', () => {
    const commands: { command: string; title: string; category?: string }[] = manifest.contributes.commands;
    expect(commands.map((c) => c.command)).toEqual([SHOW_PLOT_COMMAND]);
    expect(commands[0]).toMatchObject({ title: 'Show Plot', category: 'Stubwright' });
    const { commandPalette, 'editor/title': title } = manifest.contributes.menus;
    expect(commandPalette).toEqual([{ command: SHOW_PLOT_COMMAND, when: `editorLangId == ${LANGUAGE_ID}` }]);
    expect(title).toEqual([expect.objectContaining({ command: SHOW_PLOT_COMMAND, when: `resourceLangId == ${LANGUAGE_ID}` })]);
  });

  it('declares the settings, the server\'s four with the language service defaults, and the plot lenses on by default', () => {
    const props = manifest.contributes.configuration.properties;
    const key = (k: string) => `${CONFIGURATION_SECTION}.${k}`;
    expect(Object.keys(props).sort()).toEqual(['inlayHints', 'lengthUnit', 'manufacturingGrid', PLOT_CODE_LENS_SETTING, 'resonanceMargin'].map(key));
    expect(props[key(PLOT_CODE_LENS_SETTING)]).toMatchObject({ type: 'boolean', default: true });
    expect(props[key('resonanceMargin')].default).toBe(DEFAULT_SETTINGS.marginPct);
    expect(props[key('manufacturingGrid')].default * 1e-3).toBeCloseTo(DEFAULT_SETTINGS.gridM, 12);
    expect(props[key('lengthUnit')].default).toBe(DEFAULT_SETTINGS.lengthUnit);
    expect(props[key('lengthUnit')].enum).toEqual(['mm', 'mil']);
    expect(props[key('inlayHints')].default).toBe(DEFAULT_SETTINGS.inlayHints);
    for (const p of Object.values<Record<string, unknown>>(props)) expect(p.markdownDescription).toEqual(expect.any(String));
  });

  it('bounds each numeric setting where the server starts refusing it', () => {
    const props = manifest.contributes.configuration.properties;
    for (const k of ['resonanceMargin', 'manufacturingGrid'] as const) {
      const p = props[`${CONFIGURATION_SECTION}.${k}`];
      const warnings: string[] = [];
      const accepts = (v: number) => {
        const before = warnings.length;
        toServiceSettings({ [k]: v }, (w) => warnings.push(w));
        return warnings.length === before;
      };
      const low = p.minimum ?? p.exclusiveMinimum;
      expect(low, `${k} lower bound`).toEqual(expect.any(Number));
      expect(accepts(low), `${k} = ${low}`).toBe(p.minimum !== undefined);
      expect(accepts(low - 1e-9), `${k} just below ${low}`).toBe(false);
      expect(accepts(p.maximum), `${k} = ${p.maximum}`).toBe(true);
      expect(accepts(p.maximum + 1e-9), `${k} just above ${p.maximum}`).toBe(false);
    }
  });

  it('has a snippet for every declaration kind, line type and stub kind, each a line the parser accepts', () => {
    const snippets: Record<string, { prefix: string; body: string[] }> = JSON.parse(read(manifest.contributes.snippets[0].path));
    const lines = Object.values(snippets).map((s) => expandSnippet(s.body));
    for (const line of lines) expect(parseLine(line).errors, line).toEqual([]);
    const heads = lines.map((l) => parseLine(l).declaration!).map((d) => `${d.kind} ${d.head?.word.text ?? ''}`.trim());
    const wanted = ['let', 'substrate', ...Object.keys(LINE_TYPES).map((t) => `line ${t}`), ...STUB_KINDS.map((k) => `stub ${k}`), 'sweep'];
    for (const w of wanted) expect(heads, w).toContain(w);
  });

  it('client code imports only vscode, the language client, node built-ins and its own files', () => {
    const src = join(CLIENT, 'src');
    for (const file of readdirSync(src).filter((f) => f.endsWith('.ts'))) {
      const imports = [...readFileSync(join(src, file), 'utf8').matchAll(/from '([^']+)'/g)].map((m) => m[1]!);
      for (const spec of imports) expect(spec, `${file}: ${spec}`).toMatch(/^(vscode|vscode-languageclient\/node|node:[a-z/]+|\.\/[\w]+)$/);
    }
    expect(SERVER_MODULE).toBe('server.js');
  });
});
