/**
 * `power P` on a stub: peak voltage and current on the stub when it shunts a matched line of the
 * stub's own impedance carrying P at the stub's `at` frequency (engine: power.ts), with a caution
 * above the common-practice thresholds. The junction voltage is the incident peak √(2·P·Z0) times
 * the transmission through a shunt impedance Zin, |2/(2 + Z0/Zin)| (a shunt element on a matched
 * line; Pozar, Microwave Engineering, 4th ed., ch. 4, from memory), so a trap at its series
 * resonance, which shorts the line, is not credited with the full line voltage.
 * A caution, never a rating: defer to local codes and licensed practice.
 */
import {
  cabs, cadd, cdiv, complex, matchedLineVoltagePeak, stubStress, stubStressCautions, type Complex, type LineModel,
} from '../../engine/index.js';
import type { LocalDiagnostic } from '../parse/lineParser.js';
import type { ItemValue } from './items.js';
import type { LineBuild } from './lineTypes.js';
import type { Outcome } from './outcome.js';
import type { ResolvedEnd } from './stubEnds.js';

export function powerStress(results: Outcome['results'], power: ItemValue, ended: ResolvedEnd, line: LineBuild, lengthM: number, f: number, zin: Complex, name: string): LocalDiagnostic[] {
  const model: LineModel = line.model;
  const at = model(f);
  const incident = matchedLineVoltagePeak(power.quantity!.si, at.z0);
  const shunt = cabs(cdiv(complex(2), cadd(complex(2), cdiv(complex(at.z0), zin))));
  const junctionVoltagePeak = incident * (Number.isFinite(shunt) ? shunt : 1);
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
