/**
 * Entry point of the `stubwright` command (bundled to `shared-core/dist/cli.js`). Thin: wires Node
 * I/O and the evaluator into `runCli` and sets the exit code; all behaviour lives in `run.ts`.
 */
import { sharedEvaluator } from './evaluator.js';
import { nodeDeps } from './nodeDeps.js';
import { runCli } from './run.js';

// `stubwright eval … | head` closes the pipe early: stop quietly. Any other output failure is exit 2.
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (e: NodeJS.ErrnoException) => process.exit(e.code === 'EPIPE' ? (process.exitCode ?? 0) : 2));
}

const evaluate = sharedEvaluator();

runCli(process.argv.slice(2), { ...nodeDeps(process.cwd()), evaluate }).then(
  (code) => {
    process.exitCode = code;
  },
  (e: unknown) => {
    process.stderr.write(`stubwright: internal error (please report it): ${e instanceof Error ? (e.stack ?? e.message) : String(e)}\n`);
    process.exitCode = 2;
  },
);
