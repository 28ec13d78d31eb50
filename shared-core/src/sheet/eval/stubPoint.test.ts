/** What a stub point says it acts as agrees with the R it reports; a reactance below resolution shows as 0. */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { evaluateSheet } from '../evaluate.js';
import { REACTANCE_RESOLUTION, shownReactance, stubPointAt, type StubBuild } from './stubPoint.js';

// Invented stubs on lossy lines of several kinds, each near a resonance at its "at".
const SHEET = [
  'substrate board: dk 2.55, df 0.0022, height 0.8 mm, copper 1 oz, roughness 1.5 um',
  'line feed: microstrip on board, z0 50 ohm',
  'line port: gcpw on board, z0 50 ohm, gap 0.15 mm',
  'line strip: stripline on board, z0 50 ohm',
  'line cable: coax, inner 0.9 mm, outer 2.95 mm, dk 2.05, df 0.0003',
  'stub trap: open on feed, angle 90 deg, at 4.9 GHz, resonant',
  'stub choke: short on feed, angle 90 deg, at 2.45 GHz, resonant, via 0.4 mm',
  'stub esd: short on port, angle 90 deg, at 2.45 GHz, resonant, via 0.3 mm',
  'stub half: open on strip, angle 180 deg, at 3 GHz, resonant',
  'stub coaxial: short on cable, angle 180 deg, at 1 GHz, resonant',
].join('\n');

const result = evaluateSheet(SHEET);
const builds = [...(result.models?.values() ?? [])].flatMap((m) => (m.kind === 'stub' ? [m.stub] : []));

describe('stubPointAt: behaviour, L and C read against the reported R', () => {
  it('the sheet evaluates every stub', () => {
    expect(result.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
    expect(builds).toHaveLength(5);
  });

  it('resonant exactly when |X| ≤ R, and an L or C exactly when not, near resonances of lossy stubs (property)', () => {
    fc.assert(fc.property(
      fc.constantFrom(...builds),
      // Relative detuning of the drawn length: on the resonance, inside its bandwidth, and out to ±3 %.
      fc.oneof(fc.double({ min: -0.03, max: 0.03, noNaN: true }), fc.double({ min: -1e-4, max: 1e-4, noNaN: true }), fc.constant(0)),
      (build: StubBuild, detune: number) => {
        const p = stubPointAt(build, build.frequencyHz, build.lengthM * (1 + detune));
        expect(p.lossyResistance).toBe(true);
        const resonant = !Number.isFinite(p.reactance) || p.reactance === 0 || Math.abs(p.reactance) <= p.resistance;
        expect(p.behaviour).toBe(resonant ? 'resonant' : p.reactance > 0 ? 'inductive' : 'capacitive');
        expect(p.inductance !== null).toBe(!resonant && p.reactance > 0);
        expect(p.capacitance !== null).toBe(!resonant && p.reactance < 0);
      },
    ), { numRuns: 300 });
  });
});

describe('shownReactance', () => {
  it('is 0 below 1e-9 · max(|Z0|, R), else the reactance itself', () => {
    expect(REACTANCE_RESOLUTION).toBe(1e-9);
    expect(shownReactance(-3.06e-15, 50, 0.173)).toBe(0);
    expect(shownReactance(4.9e-8, 50, 0)).toBe(0);
    expect(shownReactance(5.1e-8, 50, 0)).toBe(5.1e-8);
    expect(shownReactance(-1.7e-11, 50, 5218)).toBe(0); // R sets the scale when it is the larger
    expect(shownReactance(-6e-6, 50, 5218)).toBe(-6e-6);
    expect(shownReactance(-72.2, 50, 0.19)).toBe(-72.2);
    expect(shownReactance(Infinity, 50, 0)).toBe(Infinity);
  });
});
