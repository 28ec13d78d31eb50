import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { decodeSheet, firstInvalidUtf8 } from './decode.js';

const bytes = (...b: number[]) => new Uint8Array(b);
const utf8 = (s: string) => new TextEncoder().encode(s);

describe('decodeSheet', () => {
  it('decodes UTF-8, keeps µ, Ω and ±, and drops one byte-order mark', () => {
    expect(decodeSheet(utf8('let x = 35 µm ± 2 Ω\n'))).toEqual({ ok: true, text: 'let x = 35 µm ± 2 Ω\n' });
    expect(decodeSheet(bytes(0xef, 0xbb, 0xbf, 0x61))).toEqual({ ok: true, text: 'a' });
    expect(decodeSheet(bytes())).toEqual({ ok: true, text: '' });
  });

  it('refuses binary data, UTF-16 and invalid UTF-8 with a located message', () => {
    expect(decodeSheet(bytes(0x61, 0x00, 0x62))).toEqual({ ok: false, message: expect.stringMatching(/binary file \(NUL byte at offset 1\)/) });
    expect(decodeSheet(bytes(0xff, 0xfe, 0x61, 0x00))).toEqual({ ok: false, message: expect.stringMatching(/UTF-16/) });
    const latin1 = bytes(...utf8('let a = 1\nlet caf'), 0xe9, 0x20);
    expect(decodeSheet(latin1)).toEqual({ ok: false, message: expect.stringMatching(/not UTF-8 text \(byte 0xE9 at line 2, byte 8\)/) });
  });

  it('finds exactly the bytes TextDecoder refuses', () => {
    const fatal = new TextDecoder('utf-8', { fatal: true, ignoreBOM: true });
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 24 }), (b) => {
        let valid = true;
        try {
          fatal.decode(b);
        } catch {
          valid = false;
        }
        expect(firstInvalidUtf8(b) === -1).toBe(valid);
      }),
      { numRuns: 2000 },
    );
  });

  it('accepts every valid UTF-8 string', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'binary' }), (s) => {
        expect(firstInvalidUtf8(utf8(s))).toBe(-1);
      }),
    );
  });
});
