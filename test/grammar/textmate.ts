/**
 * Loads the extension's TextMate grammar (client/syntaxes/rfsheet.tmLanguage.json) with the same
 * engine VS Code uses (vscode-textmate + the oniguruma wasm) and tokenizes lines into
 * `{ text, scopes }` pairs, for grammar tests.
 */
import { readFile } from 'node:fs/promises';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import * as oniguruma from 'vscode-oniguruma';
import * as textmate from 'vscode-textmate';

const require = createRequire(import.meta.url);
const GRAMMAR = fileURLToPath(new URL('../../client/syntaxes/rfsheet.tmLanguage.json', import.meta.url));

/** One token: its source text and its scope stack (outermost first). */
export interface ScopedToken {
  text: string;
  scopes: string[];
}

/** A loaded grammar: tokenizes one line at a time, each line starting from the initial state. */
export interface SheetTokenizer {
  tokenizeLine(line: string): ScopedToken[];
}

/** Loads the oniguruma wasm and the rfsheet grammar. */
export async function loadSheetGrammar(): Promise<SheetTokenizer> {
  const wasm = await readFile(require.resolve('vscode-oniguruma/release/onig.wasm'));
  await oniguruma.loadWASM(wasm.buffer.slice(wasm.byteOffset, wasm.byteOffset + wasm.byteLength) as ArrayBuffer);
  const registry = new textmate.Registry({
    onigLib: Promise.resolve({
      createOnigScanner: (sources: string[]) => new oniguruma.OnigScanner(sources),
      createOnigString: (text: string) => new oniguruma.OnigString(text),
    }),
    loadGrammar: async (scopeName: string) => {
      if (scopeName !== 'source.rfsheet') return null;
      return textmate.parseRawGrammar(await readFile(GRAMMAR, 'utf8'), GRAMMAR);
    },
  });
  const grammar = await registry.loadGrammar('source.rfsheet');
  if (!grammar) throw new Error(`grammar source.rfsheet did not load from ${GRAMMAR}`);
  return {
    tokenizeLine(line) {
      const { tokens } = grammar.tokenizeLine(line, textmate.INITIAL);
      return tokens.map((t) => ({ text: line.slice(t.startIndex, t.endIndex), scopes: t.scopes }));
    },
  };
}
