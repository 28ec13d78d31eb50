/**
 * An independent LSP client: Debian's headless Neovim (0.7+) with its built-in client runs
 * test/lsp/nvim/lsp-check.lua against the bundled server, opens examples/warnings-tour.rfsheet,
 * waits for the pushed diagnostics (Neovim 0.7 does not pull), asks for a hover and inlay hints,
 * and prints JSON that is asserted here.
 *
 * The suite skips itself, with the reason in its title, when nvim is missing; REQUIRE_NVIM=1
 * (set in CI) turns a missing nvim into a failing test instead. NVIM_BIN picks another binary.
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SERVER_BUNDLE, buildServer } from './lspClient.js';

const SCRIPT = fileURLToPath(new URL('./nvim/lsp-check.lua', import.meta.url));
const TOUR = fileURLToPath(new URL('../../examples/warnings-tour.rfsheet', import.meta.url));
const LINES = readFileSync(TOUR, 'utf8').split('\n');
const NVIM = process.env.NVIM_BIN || 'nvim';

function probeNvim(): { available: true; version: string } | { available: false; reason: string } {
  const r = spawnSync(NVIM, ['--version'], { encoding: 'utf8' });
  if (r.error || r.status !== 0) return { available: false, reason: `${NVIM} not found (Debian package neovim)` };
  return { available: true, version: r.stdout.split('\n')[0]!.trim() };
}
const nvim = probeNvim();
const requireNvim = process.env.REQUIRE_NVIM === '1';

interface CheckResult {
  ok: boolean;
  server: { name: string; version: string };
  capabilities: { hoverProvider: boolean; inlayHintProvider: boolean; diagnosticProvider: boolean };
  diagnostics: { range: { start: { line: number; character: number } }; severity: number; code: string; source: string; message: string }[];
  diagnosticsVersion: number;
  hovers: { text: string | null; kind: string; error?: string }[];
  inlayHints: { position: { line: number }; label: string }[] | null;
  errors: string[];
  exit: { code: number; signal: number } | null;
}

// Registered only when it must fail, so a normal run does not count a skipped test for it.
if (requireNvim && !nvim.available) {
  describe('Neovim LSP client (required by REQUIRE_NVIM=1)', () => {
    it('finds nvim', () => {
      expect.fail(nvim.available ? 'unreachable' : nvim.reason);
    });
  });
}

describe.skipIf(!nvim.available)(
  nvim.available ? `Neovim LSP client (${nvim.version})` : `Neovim LSP client (skipped: ${nvim.available ? '' : nvim.reason})`,
  () => {
    let dir: string;
    let result: CheckResult;
    const lload = LINES.findIndex((l) => l.startsWith('stub lload'));

    beforeAll(() => {
      buildServer();
      dir = mkdtempSync(join(tmpdir(), 'stubwright-nvim-'));
      const xdg = (name: string) => {
        const p = join(dir, name);
        mkdirSync(p);
        return p;
      };
      const out = join(dir, 'result.json');
      const run = spawnSync(NVIM, ['--headless', '--clean', '-n', '-i', 'NONE', '--cmd', 'set noswapfile', '-c', `luafile ${SCRIPT}`], {
        encoding: 'utf8',
        timeout: 60_000,
        stdio: ['ignore', 'pipe', 'pipe'],
        env: {
          ...process.env,
          XDG_CONFIG_HOME: xdg('config'), XDG_DATA_HOME: xdg('data'), XDG_STATE_HOME: xdg('state'), XDG_CACHE_HOME: xdg('cache'),
          NVIM_LOG_FILE: join(dir, 'nvim.log'),
          CHECK_CMD: JSON.stringify([process.execPath, SERVER_BUNDLE, '--stdio']),
          CHECK_FILE: TOUR,
          CHECK_HOVERS: JSON.stringify([{ line: lload, character: 6 }]),
          CHECK_DIAGNOSTICS: '4',
          CHECK_OUT: out,
        },
      });
      try {
        result = JSON.parse(readFileSync(out, 'utf8')) as CheckResult;
      } catch {
        throw new Error(`nvim wrote no result (status ${run.status}, signal ${run.signal}):\n${run.stdout}\n${run.stderr}`);
      }
    }, 120_000);
    afterAll(() => {
      if (dir) rmSync(dir, { recursive: true, force: true });
    });

    it('runs without errors and the server exits cleanly on shutdown', () => {
      expect(result.errors).toEqual([]);
      expect(result.ok).toBe(true);
      expect(result.server.name).toBe('stubwright');
      expect(result.exit).toEqual({ code: 0, signal: 0 });
    });

    it('receives the tour warnings as pushed diagnostics (Neovim 0.7 does not pull)', () => {
      expect(result.capabilities.diagnosticProvider).toBe(false);
      expect(result.diagnostics.map((d) => d.code).sort()).toEqual(['detuned', 'model-validity', 'near-resonance', 'resonance-in-band']);
      expect(result.diagnostics.every((d) => d.source === 'stubwright' && d.severity === 2)).toBe(true);
      const near = result.diagnostics.find((d) => d.code === 'near-resonance')!;
      expect(near.range.start).toEqual({ line: lload, character: LINES[lload]!.indexOf('20.5 mm') });
      expect(result.diagnosticsVersion).toEqual(expect.any(Number));
    });

    it("hovers with the stub's figures in Markdown", () => {
      const [hover] = result.hovers;
      expect(hover?.error).toBeUndefined();
      expect(hover?.kind).toBe('markdown');
      expect(hover?.text).toContain('**lload** · stub');
      expect(hover?.text).toContain('20.5 mm');
      expect(hover?.text).toMatch(/87\.7°/);
      expect(hover?.text).toMatch(/nH/);
    });

    it('answers a raw inlay-hint request', () => {
      const hint = result.inlayHints?.find((h) => h.position.line === lload);
      expect(hint?.label).toMatch(/% to res\.$/);
    });
  },
);
