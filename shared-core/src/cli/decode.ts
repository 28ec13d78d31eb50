/**
 * Bytes of a sheet file → text, refusing what is not UTF-8 text (pure).
 * A UTF-8 byte-order mark is dropped (editors hide it too, so columns agree with the editor).
 */

/** Decoded text, or why the bytes are not a sheet. */
export type DecodeResult = { ok: true; text: string } | { ok: false; message: string };

/** Byte length of the UTF-8 sequence starting at `i`, or 0 when it is not a valid one. */
function sequenceLength(bytes: Uint8Array, i: number): number {
  const b0 = bytes[i] as number;
  if (b0 < 0x80) return 1;
  let n: number;
  let min: number;
  let max = 0xbf;
  if (b0 >= 0xc2 && b0 <= 0xdf) {
    n = 2;
    min = 0x80;
  } else if (b0 >= 0xe0 && b0 <= 0xef) {
    n = 3;
    min = b0 === 0xe0 ? 0xa0 : 0x80; // no overlong forms
    if (b0 === 0xed) max = 0x9f; // no UTF-16 surrogates
  } else if (b0 >= 0xf0 && b0 <= 0xf4) {
    n = 4;
    min = b0 === 0xf0 ? 0x90 : 0x80;
    if (b0 === 0xf4) max = 0x8f; // nothing above U+10FFFF
  } else return 0;
  for (let k = 1; k < n; k++) {
    const b = bytes[i + k];
    if (b === undefined) return 0;
    if (b < (k === 1 ? min : 0x80) || b > (k === 1 ? max : 0xbf)) return 0;
  }
  return n;
}

/** Offset of the first byte that is not part of valid UTF-8, or -1 when all of it is valid. */
export function firstInvalidUtf8(bytes: Uint8Array): number {
  let i = 0;
  while (i < bytes.length) {
    const n = sequenceLength(bytes, i);
    if (n === 0) return i;
    i += n;
  }
  return -1;
}

/** 1-based line and byte column of `offset`. */
function lineColumn(bytes: Uint8Array, offset: number): { line: number; column: number } {
  let line = 1;
  let lineStart = 0;
  for (let i = 0; i < offset; i++) {
    if (bytes[i] === 0x0a) {
      line++;
      lineStart = i + 1;
    }
  }
  return { line, column: offset - lineStart + 1 };
}

/** Decodes a sheet file's bytes; refuses binary data, UTF-16 and invalid UTF-8 with a message that says what to do. */
export function decodeSheet(bytes: Uint8Array): DecodeResult {
  if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) {
    return { ok: false, message: 'is UTF-16 text: save it as UTF-8' };
  }
  const body = bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf ? bytes.subarray(3) : bytes;
  const nul = body.indexOf(0);
  if (nul >= 0) return { ok: false, message: `is a binary file (NUL byte at offset ${nul}), not a sheet` };
  const bad = firstInvalidUtf8(body);
  if (bad >= 0) {
    const { line, column } = lineColumn(body, bad);
    const hex = (body[bad] as number).toString(16).toUpperCase().padStart(2, '0');
    return { ok: false, message: `is not UTF-8 text (byte 0x${hex} at line ${line}, byte ${column}): save it as UTF-8` };
  }
  return { ok: true, text: new TextDecoder('utf-8', { ignoreBOM: true }).decode(body) };
}
