/**
 * CSV export (RFC 4180: comma-separated, CRLF line ends, a header row, fields quoted only when they
 * hold a comma, quote or line break). Numbers are SI and written so they read back exactly; an
 * undefined value (an L where the stub is capacitive) is an empty field. Pure.
 */
import { numberText } from './touchstone.js';

export type CsvValue = number | string | null;

function field(v: CsvValue): string {
  if (v === null || (typeof v === 'number' && !Number.isFinite(v))) return '';
  const text = typeof v === 'number' ? numberText(v) : v;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** The CSV text of a header and rows of the same length. */
export function renderCsv(header: readonly string[], rows: readonly (readonly CsvValue[])[]): string {
  for (const [i, row] of rows.entries()) {
    if (row.length !== header.length) throw new RangeError(`row ${i + 1} has ${row.length} fields, the header ${header.length}`);
  }
  return [header, ...rows].map((r) => r.map(field).join(',')).join('\r\n') + '\r\n';
}

/** Reads CSV written by renderCsv (or any RFC 4180 text) into rows of fields. */
export function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let cur = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i]!;
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') {
        cur += '"';
        i++;
      } else if (ch === '"') quoted = false;
      else cur += ch;
    } else if (ch === '"' && cur === '') quoted = true;
    else if (ch === ',') {
      row.push(cur);
      cur = '';
    } else if (ch === '\r' || ch === '\n') {
      if (ch === '\r' && text[i + 1] === '\n') i++;
      row.push(cur);
      rows.push(row);
      row = [];
      cur = '';
    } else cur += ch;
  }
  if (cur !== '' || row.length > 0) {
    row.push(cur);
    rows.push(row);
  }
  return rows;
}
