// `npm run fuzz`: the fuzz, sandbox and code-action suites at full size. Large inputs
// (FUZZ_LARGE=1: 120 000-character lines, the whole attack corpus in every position, hundreds of
// documents through the server and the command line) and many runs (FC_RUNS, default 2000),
// seeded (FC_SEED, default a fresh one, printed first so that any failure can be replayed).
//
//   npm run fuzz                         # fresh seed, 2000 runs
//   npm run fuzz -- --runs 10000         # more runs
//   npm run fuzz -- --seed 1733139000123 # replay a seed (use the same --runs as the failing run)
//   npm run fuzz -- test/fuzz/evaluator.test.ts -t "bounded work"   # one file or test
//
// Exit status is vitest's. No timing is asserted; the evaluator suite prints its per-line figures.
import { spawnSync } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const args = process.argv.slice(2);
const take = (flag) => {
  const i = args.indexOf(flag);
  if (i < 0) return undefined;
  const [value] = args.splice(i, 2).slice(1);
  return value;
};
const runs = take('--runs') ?? process.env.FC_RUNS ?? '2000';
const seed = take('--seed') ?? process.env.FC_SEED ?? String(Date.now() % 2 ** 31);
const targets = args.some((a) => !a.startsWith('-')) ? [] : ['test/fuzz', 'test/sandbox', 'test/safety/codeActions.test.ts', 'test/lsp/abuse.test.ts'];

process.stderr.write(`fuzz: FC_SEED=${seed} FC_RUNS=${runs} FUZZ_LARGE=1\n`);
const started = Date.now();
const vitest = join(root, 'node_modules', 'vitest', 'vitest.mjs');
const r = spawnSync(process.execPath, [vitest, 'run', ...targets, ...args, '--testTimeout=3600000', '--hookTimeout=600000'], {
  cwd: root,
  stdio: 'inherit',
  env: { ...process.env, FUZZ_LARGE: '1', FC_RUNS: runs, FC_SEED: seed },
});
const seconds = ((Date.now() - started) / 1000).toFixed(0);
process.stderr.write(`fuzz: ${r.status === 0 ? 'passed' : 'FAILED'} in ${seconds} s (FC_SEED=${seed} FC_RUNS=${runs}); replay with: npm run fuzz -- --seed ${seed} --runs ${runs}\n`);
process.exit(r.status ?? 1);
