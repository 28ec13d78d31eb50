/** The command line's evaluator: every file shares one locked-down expression instance. */
import { evaluateSheet } from '../sheet/evaluate.js';
import { createSafeMath, type SafeMath } from '../sheet/expr/index.js';
import type { SheetOptions, SheetResult } from '../sheet/types.js';

/**
 * `evaluateSheet` (cold, no `previous`) with one SafeMath for all calls, built on the first call:
 * building one costs about 0.2 s, so a check of many files must not build one per file, and
 * `--help` or a usage error must not build one at all.
 */
export function sharedEvaluator(makeMath: () => SafeMath = createSafeMath): (text: string, options: SheetOptions) => SheetResult {
  let math: SafeMath | undefined;
  return (text, options) => evaluateSheet(text, undefined, { ...options, math: (math ??= makeMath()) });
}
