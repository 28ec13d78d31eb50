import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { coplanarStatic } from './coplanarStatic.js';
import { coplanarWidthForZ0 } from './coplanarSynthesis.js';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('coplanar synthesis: analysis(synthesis(Z)) = Z', () => {
  const g = fc.double({ min: 0.01e-3, max: 1e-3, noNaN: true });
  const h = fc.double({ min: 0.05e-3, max: 3e-3, noNaN: true });
  const dk = fc.double({ min: 1, max: 13, noNaN: true });

  it('property: with and without backing, 1e-9 relative or better, in under 30 evaluations', () => {
    fc.assert(
      fc.property(g, h, dk, fc.boolean(), fc.double({ min: 0, max: 1, noNaN: true }), (gg, hh, er, grounded, pick) => {
        const geometry = { gapM: gg, heightM: hh, dk: er, grounded };
        // Pick a target inside the reachable range for this gap (s/g = 1e-2 … 1e2).
        const zNarrow = coplanarStatic({ ...geometry, widthM: 1e-2 * gg }).z0;
        const zWide = coplanarStatic({ ...geometry, widthM: 1e2 * gg }).z0;
        const z0 = zWide * (zNarrow / zWide) ** pick;
        const r = coplanarWidthForZ0({ z0, ...geometry });
        expect(rel(coplanarStatic({ ...geometry, widthM: r.widthM }).z0, z0)).toBeLessThan(1e-9);
        expect(rel(r.z0, z0)).toBeLessThan(1e-9);
        expect(r.evaluations).toBeLessThan(30);
      }),
    );
  });

  it('with a backing plane the same 50 Ω needs a narrower strip', () => {
    // The backing plane adds capacitance (Z0 falls), so the same Z0 needs a narrower strip.
    const common = { z0: 50, gapM: 0.2e-3, heightM: 1.5e-3, dk: 4.4 };
    const free = coplanarWidthForZ0({ ...common, grounded: false });
    const backed = coplanarWidthForZ0({ ...common, grounded: true });
    expect(backed.widthM).toBeLessThan(free.widthM);
    expect(free.notes).toEqual([]);
  });
});

describe('coplanar synthesis: unreachable targets and bad input', () => {
  it('throws RangeError for non-positive targets and impossible geometry', () => {
    const ok = { gapM: 0.2e-3, heightM: 1e-3, dk: 4.4, grounded: false };
    for (const z of [0, -50, Number.NaN]) expect(() => coplanarWidthForZ0({ z0: z, ...ok })).toThrow(RangeError);
    expect(() => coplanarWidthForZ0({ z0: 50, ...ok, gapM: 0 })).toThrow(/gapM/);
    expect(() => coplanarWidthForZ0({ z0: 50, ...ok, dk: 0.2 })).toThrow(/dk/);
  });

  it('throws RangeError naming the reachable range and the way out (change the gap)', () => {
    // g = 0.2 mm, h = 1.5 mm, εr = 4.4, no backing: s/g = 1e3 still gives 27 Ω.
    expect(() => coplanarWidthForZ0({ z0: 20, gapM: 0.2e-3, heightM: 1.5e-3, dk: 4.4, grounded: false })).toThrow(
      /not reachable.* Ω down to 26\.99 Ω; change the gap/,
    );
    expect(() => coplanarWidthForZ0({ z0: 1000, gapM: 0.2e-3, heightM: 1.5e-3, dk: 4.4, grounded: false })).toThrow(RangeError);
  });
});
