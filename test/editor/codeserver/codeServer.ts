/**
 * code-server for the end-to-end test: installed by install-code-server.sh (cached), run on
 * 127.0.0.1 with its own user-data, extensions and XDG folders, stopped by killing its own process
 * group. The extension under test is installed from its .vsix with `--install-extension`.
 */
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { mkdirSync, openSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { join } from 'node:path';
import { codeServerDir, INSTALL_SCRIPT } from './paths.js';
import { WaitAborted, waitFor } from './wait.js';

/** A running code-server. */
export interface CodeServer {
  url: string;
  /** User-data folder (logs live in `logs/`). */
  userDataDir: string;
  /** Stops the server and everything it started (its process group). */
  stop(): Promise<void>;
}

/** Installs code-server if needed (first build about 160–240 s, later ~2 s) and returns its entry script. */
export function installCodeServer(): string {
  const dir = codeServerDir();
  execFileSync('bash', [INSTALL_SCRIPT, dir], { stdio: ['ignore', 'ignore', 'inherit'] });
  return join(dir, 'node_modules/code-server/out/node/entry.js');
}

/** Settings for a quiet, offline workbench with inlay hints always shown. */
const USER_SETTINGS = {
  'telemetry.telemetryLevel': 'off',
  'security.workspace.trust.enabled': false,
  'workbench.startupEditor': 'none',
  'workbench.tips.enabled': false,
  'workbench.enableExperiments': false,
  'workbench.welcomePage.walkthroughs.openOnInstall': false,
  'extensions.autoCheckUpdates': false,
  'extensions.autoUpdate': false,
  'extensions.ignoreRecommendations': true,
  'update.mode': 'none',
  'chat.commandCenter.enabled': false,
  'git.enabled': false,
  'editor.inlayHints.enabled': 'on',
  'editor.hover.delay': 300,
  'editor.minimap.enabled': false,
  'window.restoreWindows': 'none',
  'files.hotExit': 'off',
};

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer().listen(0, '127.0.0.1', () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    }).on('error', reject);
  });
}

/** Folder layout and environment of one isolated code-server instance. */
class Instance {
  readonly userDataDir: string;
  readonly extensionsDir: string;
  readonly env: NodeJS.ProcessEnv;

  constructor(readonly entry: string, readonly runDir: string) {
    this.userDataDir = join(runDir, 'user-data');
    this.extensionsDir = join(runDir, 'extensions');
    for (const d of [join(this.userDataDir, 'User'), this.extensionsDir]) mkdirSync(d, { recursive: true });
    writeFileSync(join(runDir, 'config.yaml'), 'auth: none\ncert: false\n');
    this.env = {
      ...process.env, XDG_CONFIG_HOME: join(runDir, 'xdg-config'), XDG_DATA_HOME: join(runDir, 'xdg-data'),
      VSCODE_PROXY_URI: '', http_proxy: '', https_proxy: '', HTTP_PROXY: '', HTTPS_PROXY: '',
    };
  }

  args(): string[] {
    return ['--user-data-dir', this.userDataDir, '--extensions-dir', this.extensionsDir, '--config', join(this.runDir, 'config.yaml')];
  }

  cli(...args: string[]): string {
    return execFileSync(process.execPath, [this.entry, ...this.args(), ...args], { env: this.env, encoding: 'utf8' });
  }
}

/**
 * Installs the .vsix files into a fresh instance under `runDir`, starts code-server on a free port
 * with `workspace` as its folder, and waits for its health endpoint. Returns the installed ids.
 */
export async function startCodeServer(entry: string, runDir: string, vsixes: string[], workspace: string): Promise<CodeServer & { extensionIds: string[] }> {
  const inst = new Instance(entry, runDir);
  const installLog = vsixes.map((v) => inst.cli('--force', '--install-extension', v)).join('\n');
  writeFileSync(join(runDir, 'install-extension.log'), installLog);
  const listed = inst.cli('--list-extensions').split('\n').map((s) => s.trim()).filter(Boolean);
  if (listed.length !== vsixes.length) throw new Error(`expected ${vsixes.length} installed extensions, got ${JSON.stringify(listed)}:\n${installLog}`);
  writeFileSync(join(inst.userDataDir, 'User', 'settings.json'), JSON.stringify(USER_SETTINGS, null, 2));

  const port = await freePort();
  const log = openSync(join(runDir, 'code-server.log'), 'w');
  const child: ChildProcess = spawn(process.execPath, [entry, ...inst.args(), '--bind-addr', `127.0.0.1:${port}`, '--auth', 'none',
    '--disable-telemetry', '--disable-update-check', '--disable-workspace-trust', '--disable-getting-started-override',
    '--disable-file-downloads', '--ignore-last-opened', workspace], { env: inst.env, stdio: ['ignore', log, log], detached: true });
  const url = `http://127.0.0.1:${port}`;
  const stop = async () => {
    if (child.exitCode !== null || child.signalCode !== null) return;
    const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
    try { process.kill(-child.pid!, 'SIGTERM'); } catch { /* already gone */ }
    const timer = setTimeout(() => { try { process.kill(-child.pid!, 'SIGKILL'); } catch { /* gone */ } }, 5000);
    await exited;
    clearTimeout(timer);
  };
  try {
    await waitFor('code-server health check', 30_000, async () => {
      if (child.exitCode !== null) throw new WaitAborted(`code-server exited (${child.exitCode}); see ${join(runDir, 'code-server.log')}`);
      return fetch(`${url}/healthz`).then((r) => r.ok, () => false);
    });
  } catch (e) {
    await stop();
    throw e;
  }
  return { url, userDataDir: inst.userDataDir, stop, extensionIds: listed };
}

/** Text of the remote extension host logs (activation events are logged there). */
export function extensionHostLog(userDataDir: string): string {
  const out: string[] = [];
  const walk = (dir: string) => {
    let entries;
    try { entries = readdirSync(dir, { withFileTypes: true }); } catch { return; }
    for (const e of entries) {
      const p = join(dir, e.name);
      if (e.isDirectory()) walk(p);
      else if (/exthost\.log$/.test(e.name)) out.push(readFileSync(p, 'utf8'));
    }
  };
  walk(join(userDataDir, 'logs'));
  return out.join('\n');
}
