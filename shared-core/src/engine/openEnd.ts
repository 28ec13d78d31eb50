/**
 * Microstrip open end: the fringing field beyond the end of the strip makes an open stub behave
 * as if it were longer by Δl per open end. Δl uses the quasi-static εeff (never εeff(f)).
 *
 * Default model: M. Kirschning, R. H. Jansen and N. H. L. Koster, "Accurate model for open end
 * effect of microstrip lines", Electronics Letters 17(3), 1981, pp. 123–125:
 *   Δl/h = ξ1·ξ3·ξ5/ξ4, with u = w/h,
 *   ξ1 = 0.434907·(εeff^0.81 + 0.26)/(εeff^0.81 − 0.189)·(u^0.8544 + 0.236)/(u^0.8544 + 0.87),
 *   ξ2 = 1 + u^0.371/(2.358·εr + 1),
 *   ξ3 = 1 + 0.5274·arctan(0.084·u^(1.9413/ξ2))/εeff^0.9236,
 *   ξ4 = 1 + 0.0377·arctan(0.067·u^1.456)·[6 − 5·exp(0.036·(1 − εr))],
 *   ξ5 = 1 − 0.218·exp(−7.5u).
 * The constants were checked against several independent restatements that agree digit for digit;
 * the paper itself was not available, so no equation numbers are quoted. Validity 0.01 ≤ w/h ≤ 100,
 * εr ≤ 128 (from memory, as restated in later surveys; not confirmed against the paper).
 *
 * Alternative: E. O. Hammerstad and F. Bekkadal, "Microstrip Handbook", ELAB report STF44 A74169,
 * University of Trondheim, 1975:
 *   Δl/h = 0.412·(εeff + 0.3)(u + 0.264) / [(εeff − 0.258)(u + 0.8)].
 * No validity range of its own was confirmed; the same w/h and εr guard is applied (common
 * practice, no source).
 *
 * The two agree within about 8 % for 0.3 ≤ w/h ≤ 3 and 2.2 ≤ εr ≤ 10 (ordinary board lines) and
 * drift apart outside it (over 20 % for w/h ≤ 0.05 or w/h ≥ 10): always name the model used.
 * Neither includes radiation or the frequency dependence of Δl; both assume h ≪ λ.
 */
import { type MicrostripGeometry, microstripStatic } from './microstripStatic.js';
import type { ValidityNote } from './types.js';

export const KJK_MODEL = 'Kirschning–Jansen–Koster 1981';
export const HB_MODEL = 'Hammerstad–Bekkadal 1975';

export type OpenEndModel = 'kirschning-jansen-koster' | 'hammerstad-bekkadal';

/** The model used when none is named: Kirschning–Jansen–Koster 1981. */
export const OPEN_END_DEFAULT_MODEL: OpenEndModel = 'kirschning-jansen-koster';

const MODEL_NAMES: Record<OpenEndModel, string> = {
  'kirschning-jansen-koster': KJK_MODEL,
  'hammerstad-bekkadal': HB_MODEL,
};

export interface OpenEndResult {
  /** Length extension Δl of one open end, m. */
  extensionM: number;
  /** Δl/h. */
  normalized: number;
  /** Published name of the model used, e.g. "Kirschning–Jansen–Koster 1981". */
  model: string;
  /** Quasi-static εeff the model was fed (Hammerstad–Jensen 1980, with thickness). */
  epsEff: number;
  notes: ValidityNote[];
}

/**
 * Kirschning–Jansen–Koster 1981 open-end extension Δl/h (formula in the file header).
 * @param u normalised width w/h (> 0)
 * @param dk substrate εr (≥ 1)
 * @param epsEff quasi-static effective permittivity of the line
 */
export function kjkOpenEndNormalized(u: number, dk: number, epsEff: number): number {
  const e81 = Math.pow(epsEff, 0.81);
  const u8544 = Math.pow(u, 0.8544);
  const xi1 = (0.434907 * (e81 + 0.26) * (u8544 + 0.236)) / ((e81 - 0.189) * (u8544 + 0.87));
  const xi2 = 1 + Math.pow(u, 0.371) / (2.358 * dk + 1);
  const xi3 = 1 + (0.5274 * Math.atan(0.084 * Math.pow(u, 1.9413 / xi2))) / Math.pow(epsEff, 0.9236);
  const xi4 = 1 + 0.0377 * Math.atan(0.067 * Math.pow(u, 1.456)) * (6 - 5 * Math.exp(0.036 * (1 - dk)));
  const xi5 = 1 - 0.218 * Math.exp(-7.5 * u);
  return (xi1 * xi3 * xi5) / xi4;
}

/**
 * Hammerstad–Bekkadal 1975 open-end extension:
 * Δl/h = 0.412·(εeff + 0.3)(u + 0.264) / [(εeff − 0.258)(u + 0.8)].
 * @param u normalised width w/h (> 0)
 * @param epsEff quasi-static effective permittivity of the line (≥ 1)
 */
export function hbOpenEndNormalized(u: number, epsEff: number): number {
  return (0.412 * (epsEff + 0.3) * (u + 0.264)) / ((epsEff - 0.258) * (u + 0.8));
}

function rangeNote(model: string, parameter: string, value: number, min: number | undefined, max: number | undefined, why: string): ValidityNote | null {
  if ((min === undefined || value >= min) && (max === undefined || value <= max)) return null;
  const range = `${min ?? '−∞'} … ${max ?? '∞'}`;
  return { model, parameter, value, min, max, message: `${parameter} = ${value.toPrecision(4)} is outside ${range} (${why})` };
}

/**
 * Length extension Δl of one open end of a microstrip line, m, with the quasi-static εeff of the
 * same geometry (thickness included). A stub with one open end is electrically l + Δl long.
 * Throws a RangeError for impossible geometry (see microstripStatic); out-of-range inputs give
 * ValidityNotes from this model and from the static line model.
 */
export function openEndExtension(g: MicrostripGeometry, model: OpenEndModel = OPEN_END_DEFAULT_MODEL): OpenEndResult {
  const line = microstripStatic(g);
  const u = line.u;
  const normalized = model === 'hammerstad-bekkadal' ? hbOpenEndNormalized(u, line.epsEff) : kjkOpenEndNormalized(u, g.dk, line.epsEff);
  const name = MODEL_NAMES[model];
  const why = model === 'hammerstad-bekkadal' ? 'no published range confirmed; the Kirschning–Jansen–Koster range is used as a guard' : 'range restated for Kirschning–Jansen–Koster 1981';
  const notes = [
    rangeNote(name, 'w/h', u, 0.01, 100, why),
    rangeNote(name, 'εr', g.dk, undefined, 128, why),
    ...line.notes,
  ].filter((n): n is ValidityNote => n !== null);
  return { extensionM: normalized * g.heightM, normalized, model: name, epsEff: line.epsEff, notes };
}
