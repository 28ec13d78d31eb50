/**
 * Band analysis of a fixed stub: equivalent L or C at the band edges and centre, its spread,
 * and any resonance inside the band (where the stub stops being an L or a C).
 * Uses the exact X/ω and −1/(ωX) at each frequency, never the low-frequency Z0·τ or τ/Z0 forms.
 */
import { resonancesInRange, type Resonance } from './resonance.js';
import { analyseStub, type StubAnalysis, type StubKind } from './stub.js';
import type { LineModel } from './types.js';

export interface BandAnalysis {
  lowHz: number;
  centerHz: number;
  highHz: number;
  low: StubAnalysis;
  center: StubAnalysis;
  high: StubAnalysis;
  /** 'inductance' or 'capacitance' as seen at the centre; null when the centre is resonant. */
  quantity: 'inductance' | 'capacitance' | null;
  /** Smallest and largest L (H) or C (F) over the three points; null when undefined at any point. */
  min: number | null;
  max: number | null;
  /** (max − min) / centre value · 100; null when undefined. */
  spreadPct: number | null;
  resonancesInBand: Resonance[];
}

/** Analyses a stub over [lowHz, highHz]; the centre is the arithmetic mean. */
export function analyseBand(kind: StubKind, line: LineModel, lengthM: number, lowHz: number, highHz: number): BandAnalysis {
  if (!(lowHz > 0 && highHz > lowHz)) throw new RangeError('band must satisfy 0 < low < high');
  const centerHz = (lowHz + highHz) / 2;
  const low = analyseStub(kind, line, lengthM, lowHz);
  const center = analyseStub(kind, line, lengthM, centerHz);
  const high = analyseStub(kind, line, lengthM, highHz);
  const resonancesInBand = resonancesInRange(kind, line, lengthM, lowHz, highHz);
  const quantity = center.behaviour === 'resonant' ? null : center.behaviour === 'inductive' ? 'inductance' : 'capacitance';
  let min: number | null = null;
  let max: number | null = null;
  let spreadPct: number | null = null;
  if (quantity && resonancesInBand.length === 0) {
    const values = [low, center, high].map((a) => a[quantity]);
    if (values.every((v): v is number => v !== null)) {
      min = Math.min(...values);
      max = Math.max(...values);
      spreadPct = ((max - min) / (center[quantity] as number)) * 100;
    }
  }
  return { lowHz, centerHz, highHz, low, center, high, quantity, min, max, spreadPct, resonancesInBand };
}
