/**
 * External check of conductor and dielectric loss in stubs against ngspice.
 *
 * A copper microstrip (w 1.7 mm, h 0.762 mm, εr 3.5, t 35 µm, 0.4 µm rms roughness) is turned into
 * per-metre R′L′G′C′ at the λ/4 resonance f_res of a stub, from the engine's own line model:
 *   R′ = 2·Z0·α_c, G′ = 2·α_d/Z0, L′ = Z0·√εeff/c0, C′ = √εeff/(Z0·c0)   (lineLoss.ts, rlgcOf).
 * ngspice-39 then simulates that line as a stub: its LTRA element (exact for an R-only line, i.e.
 * tanδ = 0) and, with tanδ = 0.004, a lumped RLGC ladder of 100, 200 and 400 sections
 * Richardson-extrapolated twice (LTRA refuses R and G together); see ./reference/ngspice.ts.
 * ngspice sees one frequency's R′L′G′C′, so the engine side uses the same line state frozen at
 * f_res (no dispersion, no √f growth of α_c) except at f_res itself, where the two coincide.
 *
 * Checked, with the figures measured while writing the test (tolerances in the assertions):
 * - at f_res (Q0 ≈ 400): the resonant Re Zin of the engine's stub analysis (real Z0, dispersive
 *   line) against LTRA: 3.9e-7 (short) and 7.7e-7 (open), i.e. O(1/Q0²);
 * - the 3 dB bandwidth f_res/Q0 of stubQ.ts: |Z|² at f_res ± BW/2 is off half/double by 0.25/Q0
 *   (LTRA) and 0.005/Q0 (ladder);
 * - well below resonance (10°, 30°, 60°): the complex-Z0 stub impedance of stubQ.ts equals LTRA's to
 *   1e-15, while the real-Z0 resistance of analyseStub is 0.51, 0.55 and 0.71 of it;
 * - conductor + dielectric loss (Q0 ≈ 166): the complex-Z0 impedance within 1.5e-7 of |Z| of the
 *   extrapolated ladders over f_res ± 1 %. Closed forms: Zin = Z0·tanh γl / Z0·coth γl (Pozar,
 * Microwave Engineering, 4th ed., §2.7, eq. 2.91, from memory); Q0 = β/2α (Pozar §6.3, from memory).
 *
 * Skips itself, with the reason in its title, without ngspice; REQUIRE_NGSPICE=1 makes that a failure.
 */
import { describe, expect, it } from 'vitest';
import { type Complex, cabs } from '../shared-core/src/engine/complex.js';
import { c0, sigmaCopperAnnealed } from '../shared-core/src/engine/constants.js';
import { type LossyLineAtFrequency, type LossyLineModel, rlgcOf } from '../shared-core/src/engine/lineLoss.js';
import { microstripLine, microstripLossyLine } from '../shared-core/src/engine/microstripLine.js';
import { type StubKind, analyseStub } from '../shared-core/src/engine/stub.js';
import { lossyStubImpedance, reactanceQ, stubElementQ, stubResonanceBandwidth } from '../shared-core/src/engine/stubQ.js';
import { type AcPoint, type AcSweep, type OnePort, type Rlgc, atFrequencies, ltraLine, ngspiceInputImpedance, probeNgspice, rlgcLadder } from './reference/ngspice.js';

const probe = probeNgspice();
const requireNgspice = process.env.REQUIRE_NGSPICE === '1';
const simulate = (port: OnePort, sweeps: readonly AcSweep[]): AcPoint[] => ngspiceInputImpedance(port, sweeps, { binary: probe.binary });

const GEOMETRY = { widthM: 1.7e-3, heightM: 0.762e-3, dk: 3.5, thicknessM: 35e-6, conductivity: sigmaCopperAnnealed, roughnessM: 0.4e-6 };
const F0 = 2e9;
const KINDS: readonly StubKind[] = ['short', 'open'];

/** A λ/4 stub at F0 on the line with loss tangent `df`, its resonance, and the line frozen there. */
function setup(df: number) {
  const input = { ...GEOMETRY, df };
  const line = microstripLossyLine(input);
  const lengthM = c0 / (4 * F0 * Math.sqrt(line(F0).epsEff));
  const at: LossyLineAtFrequency = line(stubResonanceBandwidth('short', line, lengthM, 1).frequencyHz);
  const frozen: LossyLineModel = () => at;
  const rlgc: Rlgc = { ...rlgcOf(at), lengthM };
  return { input, line, lengthM, frozen, at, rlgc };
}

const relError = (z: Complex, ref: Complex): number => Math.hypot(z.re - ref.re, z.im - ref.im) / cabs(ref);

if (requireNgspice && !probe.available) {
  describe('ngspice lossy-stub cross-check (required by REQUIRE_NGSPICE=1)', () => {
    it('finds the ngspice binary', () => {
      expect.fail(probe.available ? 'unreachable' : `${probe.reason} (looked for "${probe.binary}")`);
    });
  });
}

describe.skipIf(!probe.available)(
  probe.available ? `ngspice lossy-stub cross-check (${probe.version})` : `ngspice lossy-stub cross-check (skipped: ${probe.reason})`,
  () => {
    // Reference: ngspice-39 LTRA (exact RLC line) at f_res and at f_res ± BW/2.
    it('conductor loss only (LTRA): resonant Re Zin within 1e-5, |Z|² halved/doubled at f_res ± BW/2', () => {
      const { input, lengthM, frozen, at, rlgc } = setup(0);
      expect(at.alphaD).toBe(0);
      for (const kind of KINDS) {
        const r = stubResonanceBandwidth(kind, frozen, lengthM, 1);
        expect(r.q).toBeGreaterThan(100);
        const [peak, below, above] = simulate(ltraLine(rlgc, kind), atFrequencies([r.frequencyHz, r.frequencyHz - r.bandwidthHz / 2, r.frequencyHz + r.bandwidthHz / 2])) as [AcPoint, AcPoint, AcPoint];
        // At f_res the engine's own (dispersive) microstrip and the frozen RLGC line coincide.
        const ours = analyseStub(kind, microstripLine(input), lengthM, r.frequencyHz).zin;
        expect(Math.abs(ours.re / peak.z.re - 1), kind).toBeLessThan(1e-5);
        const want = r.type === 'parallel' ? 0.5 : 2;
        for (const p of [below, above]) {
          const ratio = cabs(p.z) ** 2 / cabs(peak.z) ** 2;
          expect(Math.abs(ratio / want - 1), `${kind} at ${p.frequencyHz} Hz`).toBeLessThan(1 / r.q);
        }
      }
    });

    // Reference: ngspice-39 LTRA; a short-circuited stub of 10°, 30° and 60°.
    it('well below resonance: the complex-Z0 stub impedance is the simulator’s; the real-Z0 R is about half', () => {
      const { lengthM, frozen, at, rlgc } = setup(0);
      const fs = [1 / 9, 1 / 3, 2 / 3].map((x) => x * F0);
      const points = simulate(ltraLine(rlgc, 'short'), atFrequencies(fs));
      for (const p of points) {
        const exact = lossyStubImpedance('short', at, lengthM, p.frequencyHz);
        expect(relError(exact, p.z), `${p.frequencyHz} Hz`).toBeLessThan(1e-12);
        expect(Math.abs(exact.re / p.z.re - 1)).toBeLessThan(1e-12);
        expect(Math.abs(stubElementQ('short', frozen, lengthM, p.frequencyHz) / reactanceQ(p.z) - 1)).toBeLessThan(1e-12);
        const realZ0 = analyseStub('short', frozen, lengthM, p.frequencyHz).resistance;
        expect(realZ0 / p.z.re).toBeGreaterThan(0.45);
        expect(realZ0 / p.z.re).toBeLessThan(0.75);
      }
    });

    // Reference: ngspice-39 AC analysis of lumped RLGC ladders (100, 200, 400 sections, twice
    // Richardson-extrapolated), the line with conductor and dielectric loss (tanδ = 0.004).
    it('conductor + dielectric loss (ladder): Zin within 1e-6 of |Z| over f_res ± 1 %, bandwidth within 1/Q0', () => {
      const { lengthM, frozen, at, rlgc } = setup(0.004);
      expect(at.alphaD).toBeGreaterThan(0.3 * at.alphaC);
      for (const kind of KINDS) {
        const r = stubResonanceBandwidth(kind, frozen, lengthM, 1);
        const sweep: AcSweep[] = [
          { startHz: r.frequencyHz * 0.99, stopHz: r.frequencyHz * 1.01, points: 41 },
          ...atFrequencies([r.frequencyHz, r.frequencyHz - r.bandwidthHz / 2, r.frequencyHz + r.bandwidthHz / 2]),
        ];
        const [coarse, middle, fine] = [100, 200, 400].map((n) => simulate(rlgcLadder(rlgc, n, kind), sweep)) as [AcPoint[], AcPoint[], AcPoint[]];
        const step = (a: Complex, b: Complex, k: number): Complex => ({ re: (k * b.re - a.re) / (k - 1), im: (k * b.im - a.im) / (k - 1) });
        const ref = fine.map((p, i) => {
          const a = (coarse[i] as AcPoint).z;
          const b = (middle[i] as AcPoint).z;
          return { frequencyHz: p.frequencyHz, z: step(step(a, b, 4), step(b, p.z, 4), 16) };
        });
        for (const p of ref) {
          expect(relError(lossyStubImpedance(kind, at, lengthM, p.frequencyHz), p.z), `${kind} at ${p.frequencyHz} Hz`).toBeLessThan(1e-6);
        }
        const [peak, below, above] = ref.slice(-3) as [AcPoint, AcPoint, AcPoint];
        const want = r.type === 'parallel' ? 0.5 : 2;
        for (const p of [below, above]) {
          expect(Math.abs(cabs(p.z) ** 2 / cabs(peak.z) ** 2 / want - 1), `${kind} at ${p.frequencyHz} Hz`).toBeLessThan(1 / r.q);
        }
      }
    });
  },
);
