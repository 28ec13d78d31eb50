/**
 * Stub synthesis with real ends: the length to DRAW on the board so that the stub, with its open
 * end extension or its via, presents the target reactance at f.
 *
 * - Open end: the ideal open stub from synthesizeStub is electrically l + Δl long, so
 *   drawn = l_ideal − Δl (Δl per open end, openEnd.ts). When Δl exceeds l_ideal the stub would be
 *   shorter than its own end effect, and that solution does not exist.
 * - Short through a via (Z_L = R_via + jωL_via): solve Im Zin(l) = X with the terminated-line
 *   formula (terminatedStub.ts). On a lossless line with R_via = 0 this is closed-form,
 *   Zin = jZ0·tan(βl + θv) with θv = atan(ωL_via/Z0), so βl = θ_ideal − θv (Pozar, Microwave
 *   Engineering, 4th ed., §2.3, solved for l). Otherwise the root is bracketed on the branch
 *   of that lossless solution and found with rootFind.ts. The via adds inductance, so the drawn
 *   stub is shorter than the ideal one; for an inductive target below the via's own reactance the
 *   first solution does not exist.
 * Solution k is the one on the same branch as synthesizeStub's k-th solution (θ_ideal + (k−1)·π).
 * Validity: that of the line model and of the end models.
 */
import { findRoot } from './rootFind.js';
import { checkPositiveInput } from './microstripStatic.js';
import { phaseConstant } from './stub.js';
import { losslessStubAngle, synthesizeStub, targetReactance, type StubTarget } from './stubSynthesis.js';
import { endedStubInputImpedance, type StubEnd } from './terminatedStub.js';
import type { LineAtFrequency, LineModel } from './types.js';

export interface EndedStubSynthesis {
  /** Length to draw on the board, m. */
  drawnLengthM: number;
  /**
   * How much shorter the drawn stub is than the ideal one, m: Δl for an open end, the via's
   * equivalent length atan(ωL/Z0)/β for a short (exact on a lossless line, an estimate otherwise).
   */
  endCorrectionM: number;
  /** drawnLengthM + endCorrectionM: the ideal open or short stub for the same target, m. */
  idealLengthM: number;
  /** Electrical length of the drawn stub at f, rad. */
  thetaRad: number;
  /** Which solution this is (1 = shortest branch, as in synthesizeStub). */
  solution: number;
  /** Target reactance, Ω (NaN for an angle target). */
  reactance: number;
}

const mm = (m: number): string => `${(m * 1e3).toPrecision(4)} mm`;

/**
 * Drawn length of the `solution`-th stub with end `end` giving `target` at f on `line`.
 * For an angle target the angle is that of the equivalent ideal stub. Throws a RangeError with a
 * fix-oriented message when the end alone already exceeds the target or the target is out of reach.
 */
export function synthesizeEndedStub(end: StubEnd, line: LineModel, target: StubTarget, frequencyHz: number, solution = 1): EndedStubSynthesis {
  if (!(frequencyHz > 0)) throw new RangeError(`frequency must be positive, got ${frequencyHz} Hz`);
  if (!(Number.isInteger(solution) && solution >= 1)) throw new RangeError('solution number must be an integer ≥ 1');
  if (end.kind === 'open') return synthesizeOpenEnded(end.extensionM ?? 0, line, target, frequencyHz, solution);
  const viaL = end.viaInductanceH ?? 0;
  const viaR = end.viaResistanceOhm ?? 0;
  checkPositiveInput('viaInductanceH', viaL, true);
  checkPositiveInput('viaResistanceOhm', viaR, true);
  if (viaL === 0 && viaR === 0) {
    const ideal = synthesizeStub('short', line, target, frequencyHz, solution);
    return { drawnLengthM: ideal.lengthM, endCorrectionM: 0, idealLengthM: ideal.lengthM, thetaRad: ideal.thetaRad, solution, reactance: ideal.reactance };
  }
  return synthesizeViaShorted(end, line, target, frequencyHz, solution);
}

function synthesizeOpenEnded(extensionM: number, line: LineModel, target: StubTarget, f: number, solution: number): EndedStubSynthesis {
  checkPositiveInput('extensionM', extensionM, true);
  const ideal = synthesizeStub('open', line, target, f, solution);
  const drawnLengthM = ideal.lengthM - extensionM;
  if (!(drawnLengthM > 0)) {
    throw new RangeError(
      `the open stub would be shorter than its own end effect: solution ${solution} is ${mm(ideal.lengthM)} long electrically but the open end alone adds Δl = ${mm(extensionM)}; use solution ${solution + 1}, a short stub, or a narrower line (smaller Δl)`,
    );
  }
  const beta = phaseConstant(line(f).epsEff, f);
  return { drawnLengthM, endCorrectionM: extensionM, idealLengthM: ideal.lengthM, thetaRad: drawnLengthM * beta, solution, reactance: ideal.reactance };
}

function synthesizeViaShorted(end: Extract<StubEnd, { kind: 'short' }>, line: LineModel, target: StubTarget, f: number, solution: number): EndedStubSynthesis {
  const at = line(f);
  const beta = phaseConstant(at.epsEff, f);
  const xVia = 2 * Math.PI * f * (end.viaInductanceH ?? 0);
  const thetaVia = Math.atan(xVia / at.z0);
  const result = (theta: number, x: number): EndedStubSynthesis => ({
    drawnLengthM: theta / beta,
    endCorrectionM: thetaVia / beta,
    idealLengthM: (theta + thetaVia) / beta,
    thetaRad: theta,
    solution,
    reactance: x,
  });
  const unreachable = (x: number) =>
    new RangeError(
      `the via alone is already ${xVia.toPrecision(4)} Ω at this frequency, at or above the ${x.toPrecision(4)} Ω asked for, so solution ${solution} of a short stub through it does not exist; use solution ${solution + 1}, a smaller via inductance (wider drill, several vias, thinner substrate) or an open stub`,
    );
  if (target.kind === 'angle') {
    if (!(target.radians > 0)) throw new RangeError('electrical angle must be positive');
    const theta = target.radians + (solution - 1) * Math.PI - thetaVia;
    if (!(theta > 0)) throw new RangeError(`the via alone is already ${((thetaVia * 180) / Math.PI).toPrecision(4)}° of line; ask for a longer angle or use solution ${solution + 1}`);
    return result(theta, Number.NaN);
  }
  const x = targetReactance(target, f);
  const thetaIdeal = losslessStubAngle('short', at.z0, x) + (solution - 1) * Math.PI;
  if (at.alpha === 0 && (end.viaResistanceOhm ?? 0) === 0) {
    const theta = thetaIdeal - thetaVia;
    if (!(theta > 0)) throw unreachable(x);
    return result(theta, x);
  }
  return result(solveLossyBranch(end, at, f, beta, x, thetaIdeal - thetaVia, thetaVia, unreachable), x);
}

/**
 * Solves Im Zin(θ/β) = X on a lossy line or with a resistive via, on the monotone branch of the
 * lossless answer θ0: Im Zin rises from the reactance trough just above one parallel resonance to the
 * peak just below the next. Parallel resonances sit near θ = π/2 + mπ − θv.
 */
function solveLossyBranch(
  end: StubEnd,
  at: LineAtFrequency,
  f: number,
  beta: number,
  x: number,
  theta0: number,
  thetaVia: number,
  unreachable: (x: number) => RangeError,
): number {
  const imZ = (theta: number) => endedStubInputImpedance(end, at, theta / beta, f).im - x;
  const half = Math.PI / 2;
  // The lossless parallel resonance just above θ0, and the one before it.
  const upperPole = Math.ceil((theta0 + thetaVia - half) / Math.PI) * Math.PI + half - thetaVia;
  const lowerPole = upperPole - Math.PI;
  const hi = extremum(imZ, Math.max(0, upperPole - half / 2), upperPole, true);
  const lo = lowerPole <= 0 ? 0 : extremum(imZ, lowerPole, lowerPole + half / 2, false);
  const gLo = imZ(lo);
  if (lo === 0 && gLo >= 0) throw unreachable(x);
  if (!(gLo < 0 && imZ(hi) > 0)) {
    throw new RangeError(
      `a ${x > 0 ? 'positive' : 'negative'} reactance of ${Math.abs(x).toPrecision(4)} Ω is beyond what this lossy short stub through a via can reach near resonance; lower the target or use a lower-loss line`,
    );
  }
  return findRoot(imZ, lo, hi);
}

/** Golden-section search for the maximum (or minimum) of g on [a, b]. */
function extremum(g: (t: number) => number, a: number, b: number, maximum: boolean): number {
  const sign = maximum ? -1 : 1;
  const phi = (Math.sqrt(5) - 1) / 2;
  let lo = a;
  let hi = b;
  for (let i = 0; i < 200 && hi - lo > 1e-13 * Math.max(1, b); i++) {
    const c = hi - phi * (hi - lo);
    const d = lo + phi * (hi - lo);
    if (sign * g(c) < sign * g(d)) hi = d;
    else lo = c;
  }
  return (lo + hi) / 2;
}
