/**
 * Number and quantity formatting with a fixed number of significant digits, so that
 * `0.3 mm * 1.05` reads `0.315 mm`, not `0.31499999999999995 mm`.
 */
import { isUnit, type Unit } from 'mathjs';
import type { Value } from './types.js';

/** Default significant digits in messages. */
export const MESSAGE_PRECISION = 4;

/** Formats a number with `precision` significant digits, trailing zeros dropped (`2.45e+9`, `0.315`). */
export function formatNumber(x: number, precision = MESSAGE_PRECISION): string {
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return '0';
  return x.toPrecision(precision).replace(/(\.\d*?)0+(?=$|e)/, '$1').replace(/\.(?=$|e)/, '');
}

/** Formats a sheet value: `0.315 mm`, `2.4 GHz`, `2.55`; a bare unit prints as its name (`mm`). */
export function formatValue(value: Value, precision = MESSAGE_PRECISION): string {
  if (typeof value === 'number') return formatNumber(value, precision);
  if (isUnit(value)) return (value as Unit).format({ precision });
  return String(value);
}
