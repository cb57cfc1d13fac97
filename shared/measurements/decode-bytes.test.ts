import { describe, expect, test } from 'vitest';
import { decodeCsvBytes, detectCsvEncoding } from './decode-bytes';

// Byte values: UTF-8 (RFC 3629) encodes U+00B0 ° as C2 B0 and U+00B5 µ as C2 B5; Windows-1252
// (Microsoft code page table, identical to ISO-8859-1 in A0–FF) has ° = B0, µ = B5; UTF-16 byte-order
// marks are FF FE (little endian) and FE FF (big endian) (Unicode Standard, ch. 23.8).
describe('decodeCsvBytes', () => {
  const text = 'T (°C),eta (µPa s)\n25,22.5\n';
  test('UTF-8 with and without a byte-order mark', () => {
    const utf8 = new TextEncoder().encode(text);
    expect(Array.from(utf8.slice(3, 5))).toEqual([0xc2, 0xb0]);
    expect(decodeCsvBytes(utf8)).toBe(text);
    expect(decodeCsvBytes(new Uint8Array([0xef, 0xbb, 0xbf, ...utf8]))).toBe(text);
  });
  test('Windows-1252 bytes for ° and µ', () => {
    const bytes = new Uint8Array(Array.from(text, (c) => c.charCodeAt(0)));
    expect(bytes[3]).toBe(0xb0);
    expect(detectCsvEncoding(bytes)).toBe('windows-1252');
    expect(decodeCsvBytes(bytes)).toBe(text);
  });
  test('UTF-16 little and big endian with byte-order marks', () => {
    const le = [0xff, 0xfe];
    const be = [0xfe, 0xff];
    for (const c of text) {
      const u = c.charCodeAt(0);
      le.push(u & 0xff, u >> 8);
      be.push(u >> 8, u & 0xff);
    }
    expect(decodeCsvBytes(new Uint8Array(le))).toBe(text);
    expect(decodeCsvBytes(new Uint8Array(be))).toBe(text);
  });
});
