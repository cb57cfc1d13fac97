/**
 * Decodes the bytes of an uploaded CSV to text, in the browser and on the server (TextDecoder, no
 * Node Buffer API). Spreadsheets save CSV as UTF-8 (often with a byte-order mark), as UTF-16 with a
 * byte-order mark ("Unicode text"), or in the Windows code page, where ° and µ are single bytes
 * 0xB0 and 0xB5 that are not valid UTF-8.
 */
export type CsvEncoding = 'utf-8' | 'utf-16le' | 'utf-16be' | 'windows-1252';

/** Picks the encoding from a byte-order mark, else UTF-8 if the bytes are valid UTF-8, else Windows-1252. */
export function detectCsvEncoding(bytes: Uint8Array): CsvEncoding {
  if (bytes.length >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) return 'utf-8';
  if (bytes.length >= 2 && bytes[0] === 0xff && bytes[1] === 0xfe) return 'utf-16le';
  if (bytes.length >= 2 && bytes[0] === 0xfe && bytes[1] === 0xff) return 'utf-16be';
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(bytes);
    return 'utf-8';
  } catch {
    return 'windows-1252';
  }
}

/** Text of the file, without a byte-order mark. */
export function decodeCsvBytes(bytes: Uint8Array): string {
  const encoding = detectCsvEncoding(bytes);
  // TextDecoder drops the BOM by default (ignoreBOM: false).
  return new TextDecoder(encoding).decode(bytes);
}
