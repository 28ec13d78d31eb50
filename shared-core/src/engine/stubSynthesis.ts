/**
 * Stub synthesis: the physical length of a short or open stub that presents a target
 * reactance X (or inductance L → X = ωL, capacitance C → X = −1/(ωC)) at frequency f.
 *
 * Lossless solutions (Pozar, Microwave Engineering, 4th ed., §2.3 eqs. 2.44/2.45 solved for βl):
 *   short: tan θ = X/Z0      open: cot θ = −X/Z0
 * The k-th solution (k = 1 shortest) is θ1 + (k−1)·π. On a lossy line the length is then refined so
 * that Im(Zin) = X exactly; a target beyond what the loss allows near resonance is an error.
 * Validity: as the line model at f.
 */
import { findRoot } from './rootFind.js';
import { phaseConstant, propagationConstant, stubInputImpedance, type StubKind } from './stub.js';
import type { LineModel } from './types.js';

export type StubTarget =
  | { kind: 'reactance'; ohms: number }
  | { kind: 'inductance'; henries: number }
  | { kind: 'capacitance'; farads: number }
  | { kind: 'angle'; radians: number };

/** Reactance a target asks for at frequency f, Ω (angles have none). */
export function targetReactance(target: StubTarget, frequencyHz: number): number {
  const omega = 2 * Math.PI * frequencyHz;
  switch (target.kind) {
    case 'reactance':
      return target.ohms;
    case 'inductance':
      if (!(target.henries > 0)) throw new RangeError(`inductance must be positive, got ${target.henries} H`);
      return omega * target.henries;
    case 'capacitance':
      if (!(target.farads > 0)) throw new RangeError(`capacitance must be positive, got ${target.farads} F`);
      return -1 / (omega * target.farads);
    case 'angle':
      throw new RangeError('an electrical angle is not a reactance');
  }
}

/** Shortest lossless electrical length θ in (0, π] giving reactance X on a stub with impedance z0. */
export function losslessStubAngle(kind: StubKind, z0: number, reactance: number): number {
  if (!Number.isFinite(reactance)) throw new RangeError('target reactance must be finite');
  if (kind === 'short') {
    if (reactance === 0) return Math.PI; // series resonance at λ/2
    const t = Math.atan(reactance / z0);
    return t > 0 ? t : t + Math.PI;
  }
  if (reactance === 0) return Math.PI / 2; // series resonance at λ/4
  const t = Math.atan(-z0 / reactance); // θ with cot θ = −X/Z0
  return t > 0 ? t : t + Math.PI;
}

export interface StubSynthesis {
  lengthM: number;
  /** Electrical length at f, rad. */
  thetaRad: number;
  /** Which solution this is (1 = shortest). */
  solution: number;
  reactance: number;
}

/**
 * Length of the `solution`-th shortest stub giving `target` at f on `line`.
 * Throws RangeError with a fix-oriented message when the target cannot be reached.
 */
export function synthesizeStub(kind: StubKind, line: LineModel, target: StubTarget, frequencyHz: number, solution = 1): StubSynthesis {
  if (!(frequencyHz > 0)) throw new RangeError(`frequency must be positive, got ${frequencyHz} Hz`);
  if (!(Number.isInteger(solution) && solution >= 1)) throw new RangeError('solution number must be an integer ≥ 1');
  const at = line(frequencyHz);
  const beta = phaseConstant(at.epsEff, frequencyHz);
  if (target.kind === 'angle') {
    if (!(target.radians > 0)) throw new RangeError('electrical angle must be positive');
    const theta = target.radians + (solution - 1) * Math.PI;
    return { lengthM: theta / beta, thetaRad: theta, solution, reactance: Number.NaN };
  }
  const x = targetReactance(target, frequencyHz);
  const theta0 = losslessStubAngle(kind, at.z0, x) + (solution - 1) * Math.PI;
  if (at.alpha === 0 || x === 0) return { lengthM: theta0 / beta, thetaRad: theta0, solution, reactance: x };
  return refineLossy(kind, line, frequencyHz, x, theta0, beta, solution);
}

/** Solves Im(Zin(l)) = X on the lossy line inside the same quarter-wave branch as the lossless answer. */
function refineLossy(kind: StubKind, line: LineModel, f: number, x: number, theta0: number, beta: number, solution: number): StubSynthesis {
  const at = line(f);
  const gamma = propagationConstant(at, f);
  const imZ = (theta: number) => stubInputImpedance(kind, at.z0, gamma, theta / beta).im - x;
  // Im(Zin) rises monotonically between the series resonance below and the parallel peak above.
  const quarter = Math.PI / 2;
  const branch = Math.floor(theta0 / quarter);
  const seriesEdge = (kind === 'short') === (branch % 2 === 0) ? branch * quarter : (branch + 1) * quarter;
  // An open stub's first capacitive branch starts at θ → 0, where −Im(Zin) grows without bound.
  const parallelPeak = !(x > 0) && seriesEdge === quarter ? theta0 * 1e-3 : findPeak(imZ, seriesEdge, x > 0);
  const [a, b] = x > 0 ? [seriesEdge, parallelPeak] : [parallelPeak, seriesEdge];
  if (Math.sign(imZ(a)) === Math.sign(imZ(b))) {
    throw new RangeError(
      `a ${x > 0 ? 'positive' : 'negative'} reactance of ${Math.abs(x).toPrecision(4)} Ω is beyond what this lossy ${kind} stub can reach near resonance; lower the target or use a lower-loss line`,
    );
  }
  const theta = findRoot(imZ, a, b);
  return { lengthM: theta / beta, thetaRad: theta, solution, reactance: x };
}

/** Electrical length of the reactance extremum next to a series edge (the lossy parallel resonance). */
function findPeak(imZ: (t: number) => number, seriesEdge: number, upward: boolean): number {
  const quarter = Math.PI / 2;
  const center = upward ? seriesEdge + quarter : seriesEdge - quarter;
  // Im(Zin) crosses zero exactly at the lossless resonance angle; its maximum lies just below it and its
  // minimum just above. Golden-section search on that one side.
  let a = upward ? center - quarter * 0.5 : center;
  let b = upward ? center : center + quarter * 0.5;
  const sign = upward ? -1 : 1;
  const phi = (Math.sqrt(5) - 1) / 2;
  for (let i = 0; i < 200 && b - a > 1e-13 * quarter; i++) {
    const c = b - phi * (b - a);
    const d = a + phi * (b - a);
    if (sign * imZ(c) < sign * imZ(d)) b = d;
    else a = c;
  }
  return (a + b) / 2;
}
