/**
 * A small MIME reader for the local fake mail service: enough of RFC 5322 (header unfolding),
 * RFC 2045 (quoted-printable, base64), RFC 2046 (multipart) and RFC 2047 (encoded words) to read
 * what nodemailer writes (text/plain + text/html in multipart/alternative, possibly inside
 * multipart/mixed). No installed package parses mail (smtp-server only hands over the raw stream),
 * so this is our own; attachments are skipped.
 */

export interface ParsedMail {
  from: string;
  to: string[];
  subject: string;
  messageId: string | null;
  text: string | null;
  html: string | null;
}

type Headers = Map<string, string[]>;

interface Part {
  headers: Headers;
  /** Body bytes as a latin1 string (one char per byte), still transfer-encoded. */
  body: string;
}

/** Splits a message (latin1 string, one char per byte) into unfolded headers and the body. */
function splitPart(raw: string): Part {
  const match = /\r?\n\r?\n/.exec(raw);
  const headerBlock = match ? raw.slice(0, match.index) : raw;
  const body = match ? raw.slice(match.index + match[0].length) : '';
  const headers: Headers = new Map();
  // RFC 5322 §2.2.3: a line starting with white space continues the previous header.
  const unfolded = headerBlock.replace(/\r?\n(?=[ \t])/g, '');
  for (const line of unfolded.split(/\r?\n/)) {
    const colon = line.indexOf(':');
    if (colon <= 0) continue;
    const name = line.slice(0, colon).trim().toLowerCase();
    const value = Buffer.from(line.slice(colon + 1).trim(), 'latin1').toString('utf8');
    headers.set(name, [...(headers.get(name) ?? []), value]);
  }
  return { headers, body };
}

const first = (h: Headers, name: string) => h.get(name)?.[0] ?? null;

/** `type/subtype; a=b; c="d e"` → value and lower-case parameter names (RFC 2045 §5.1). */
export function parseHeaderParams(value: string): { value: string; params: Record<string, string> } {
  const [head, ...rest] = value.match(/(?:[^;"]+|"(?:[^"\\]|\\.)*")+/g) ?? [''];
  const params: Record<string, string> = {};
  for (const p of rest) {
    const eq = p.indexOf('=');
    if (eq < 0) continue;
    let v = p.slice(eq + 1).trim();
    if (v.startsWith('"') && v.endsWith('"')) v = v.slice(1, -1).replace(/\\(.)/g, '$1');
    params[p.slice(0, eq).trim().toLowerCase()] = v;
  }
  return { value: head.trim().toLowerCase(), params };
}

/** RFC 2045 §6.7: `=XX` is a byte, `=` at a line end is a soft break. Returns the bytes. */
export function decodeQuotedPrintable(input: string): Buffer {
  const text = input.replace(/[ \t]+(?=\r?\n)/g, '').replace(/=\r?\n/g, '');
  const bytes: number[] = [];
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (c === '=' && /^[0-9A-Fa-f]{2}$/.test(text.slice(i + 1, i + 3))) {
      bytes.push(parseInt(text.slice(i + 1, i + 3), 16));
      i += 2;
    } else {
      bytes.push(text.charCodeAt(i) & 0xff);
    }
  }
  return Buffer.from(bytes);
}

function decodeCharset(bytes: Buffer, charset: string | undefined): string {
  try {
    return new TextDecoder(charset || 'utf-8').decode(bytes);
  } catch {
    return bytes.toString('utf8');
  }
}

/** RFC 2047 encoded words (`=?UTF-8?Q?caf=C3=A9?=`, `=?utf-8?B?...?=`); white space between two words is dropped (§6.2). */
export function decodeEncodedWords(value: string): string {
  const word = /=\?([^?*]+)(?:\*[^?]*)?\?([QqBb])\?([^?]*)\?=/g;
  return value.replace(/(\?=)\s+(?==\?)/g, '$1').replace(word, (_m, charset: string, enc: string, text: string) => {
    const bytes = enc.toUpperCase() === 'B' ? Buffer.from(text, 'base64') : decodeQuotedPrintable(text.replace(/_/g, ' '));
    return decodeCharset(bytes, charset);
  });
}

function decodeBody(part: Part): string {
  const { params } = parseHeaderParams(first(part.headers, 'content-type') ?? 'text/plain');
  const encoding = (first(part.headers, 'content-transfer-encoding') ?? '7bit').trim().toLowerCase();
  const bytes =
    encoding === 'quoted-printable'
      ? decodeQuotedPrintable(part.body)
      : encoding === 'base64'
        ? Buffer.from(part.body.replace(/\s+/g, ''), 'base64')
        : Buffer.from(part.body, 'latin1');
  return decodeCharset(bytes, params.charset).replace(/\r\n/g, '\n');
}

/** Walks the MIME tree and keeps the first text/plain and text/html parts that are not attachments. */
function collectBodies(part: Part, out: { text: string | null; html: string | null }, depth = 0): void {
  const { value: type, params } = parseHeaderParams(first(part.headers, 'content-type') ?? 'text/plain');
  if (type.startsWith('multipart/') && params.boundary && depth < 10) {
    const delimiter = `--${params.boundary}`;
    const sections = part.body.split(new RegExp(`(?:^|\\r?\\n)${delimiter.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}(?:--)?[ \\t]*(?:\\r?\\n|$)`));
    // sections[0] is the preamble; the one after the closing delimiter is the epilogue.
    const closing = part.body.indexOf(`${delimiter}--`);
    const inner = sections.slice(1, closing >= 0 ? sections.length - 1 : sections.length);
    for (const section of inner) collectBodies(splitPart(section), out, depth + 1);
    return;
  }
  const disposition = (first(part.headers, 'content-disposition') ?? '').toLowerCase();
  if (disposition.startsWith('attachment')) return;
  if (type === 'text/plain' && out.text === null) out.text = decodeBody(part);
  else if (type === 'text/html' && out.html === null) out.html = decodeBody(part);
}

/** Addresses out of an address-list header: the part in angle brackets, else the bare address. */
export function addressesOf(value: string | null): string[] {
  if (!value) return [];
  const withoutQuoted = value.replace(/"(?:[^"\\]|\\.)*"/g, '');
  return withoutQuoted
    .split(',')
    .map((a) => (/<([^>]+)>/.exec(a)?.[1] ?? a).trim())
    .filter((a) => a.includes('@'));
}

/** Reads one received message (the raw bytes after DATA). */
export function parseMail(raw: Buffer): ParsedMail {
  const root = splitPart(raw.toString('latin1'));
  // The line break that ends a single-part message belongs to the transport (SMTP DATA ends with CRLF.CRLF), not to the text.
  if (!parseHeaderParams(first(root.headers, 'content-type') ?? 'text/plain').value.startsWith('multipart/')) root.body = root.body.replace(/\r?\n$/, '');
  const bodies = { text: null as string | null, html: null as string | null };
  collectBodies(root, bodies);
  return {
    from: decodeEncodedWords(first(root.headers, 'from') ?? ''),
    to: [...addressesOf(first(root.headers, 'to')), ...addressesOf(first(root.headers, 'cc'))],
    subject: decodeEncodedWords(first(root.headers, 'subject') ?? ''),
    messageId: first(root.headers, 'message-id'),
    text: bodies.text,
    html: bodies.html,
  };
}
