/**
 * Bracketed root finding for monotone engine functions (stub resonances and lengths).
 * Illinois-modified regula falsi: superlinear, never leaves the bracket
 * (Dowell & Jarratt, BIT 11, 1971, pp. 168–174).
 */

export interface RootOptions {
  /** Relative tolerance on x (default 1e-12). */
  relTol?: number;
  maxIter?: number;
}

/**
 * Finds x in [lo, hi] with g(x) = 0, given g(lo) and g(hi) of opposite sign (or zero).
 * Throws RangeError when the bracket does not straddle a root.
 */
export function findRoot(g: (x: number) => number, lo: number, hi: number, opts: RootOptions = {}): number {
  const relTol = opts.relTol ?? 1e-12;
  const maxIter = opts.maxIter ?? 200;
  let a = lo;
  let b = hi;
  let fa = g(a);
  let fb = g(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (!(Math.sign(fa) !== Math.sign(fb))) throw new RangeError('root is not bracketed');
  let side = 0;
  for (let i = 0; i < maxIter; i++) {
    const c = (a * fb - b * fa) / (fb - fa);
    const fc = g(c);
    if (fc === 0 || Math.abs(b - a) <= relTol * Math.max(Math.abs(a), Math.abs(b))) return c;
    if (Math.sign(fc) === Math.sign(fb)) {
      b = c;
      fb = fc;
      if (side === -1) fa /= 2;
      side = -1;
    } else {
      a = c;
      fa = fc;
      if (side === 1) fb /= 2;
      side = 1;
    }
  }
  return (a + b) / 2;
}


/**
 * Solves a decreasing g on [lo, hi] (g(lo) ≥ 0 ≥ g(hi)), first narrowing the bracket to
 * start·(1 ± rel) when a good closed-form start is known, which saves most iterations.
 */
export function findRootNearStart(g: (x: number) => number, lo: number, hi: number, start: number, rel = 0.05, opts: RootOptions = {}): number {
  let [a, b] = [lo, hi];
  if (Number.isFinite(start) && start > lo && start < hi) {
    const [sLo, sHi] = [Math.max(start / (1 + rel), lo), Math.min(start * (1 + rel), hi)];
    const [gsLo, gsHi] = [g(sLo), g(sHi)];
    if (gsLo >= 0 && gsHi <= 0) [a, b] = [sLo, sHi];
    else if (gsLo < 0) b = sLo;
    else a = sHi;
  }
  return findRoot(g, a, b, opts);
}
