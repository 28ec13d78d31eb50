/**
 * `power P` on a stub: peak voltage and current on the stub when it shunts a matched line of the
 * stub's own impedance carrying P at the stub's `at` frequency (engine: power.ts), with a caution
 * above the common-practice thresholds. The junction voltage accounts for the stub's own shunt
 * loading (engine: shuntJunctionVoltagePeak).
 * A caution, never a rating: defer to local codes and licensed practice.
 */
import {
  shuntJunctionVoltagePeak, stubStress, stubStressCautions, type Complex, type LineModel,
} from '../../engine/index.js';
import type { LocalDiagnostic } from '../parse/lineParser.js';
import type { ItemValue } from './items.js';
import type { LineBuild } from './lineTypes.js';
import type { Outcome } from './outcome.js';
import type { ResolvedEnd } from './stubEnds.js';

export function powerStress(results: Outcome['results'], power: ItemValue, ended: ResolvedEnd, line: LineBuild, lengthM: number, f: number, zin: Complex, name: string): LocalDiagnostic[] {
  const model: LineModel = line.model;
  const at = model(f);
  const junctionVoltagePeak = shuntJunctionVoltagePeak(power.quantity!.si, at.z0, zin);
  const stress = stubStress({ powerW: power.quantity!.si, lineZ0: at.z0, junctionVoltagePeak, end: ended.end, stubLine: at, drawnLengthM: lengthM, frequencyHz: f });
  const finite = (x: number) => (Number.isFinite(x) ? x : null);
  Object.assign(results, {
    power_w: power.quantity!.si,
    voltage_peak_v: finite(stress.maxVoltagePeak),
    current_peak_a: finite(stress.maxCurrentPeak),
  });
  const span = power.item.value!;
  const cautions = stubStressCautions(stress);
  if (cautions.length === 0) return [];
  return [{
    start: span.start, end: span.end, severity: 'warning', code: 'power',
    message: `${name}: ${cautions.map((c) => c.message).join("; ")}. A prompt to check, not a rating: follow local codes and licensed practice`,
  }];
}
