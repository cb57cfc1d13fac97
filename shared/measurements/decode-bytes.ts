/**
 * Spreadsheets save CSV as UTF-8 (with or without a byte-order mark) or, in older European set-ups,
 * Windows-1252. Strict UTF-8 first; bytes that are not valid UTF-8 are read as Windows-1252.
 * TextDecoder exists in browsers and Node, so the preview and the server read a file the same way.
 */
export function decodeCsvBytes(bytes: Uint8Array): string {
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return new TextDecoder('windows-1252').decode(bytes);
  }
}
