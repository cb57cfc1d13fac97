/**
 * Reads a message the local fake mail service received (the raw bytes after DATA) with mailparser, the
 * MIME parser from nodemailer's authors: headers (RFC 5322), transfer encodings (RFC 2045), multipart
 * bodies (RFC 2046) and encoded words (RFC 2047). Attachments are not kept: the Mailbox shows text and HTML.
 */
import { simpleParser, type AddressObject } from 'mailparser';

export interface ParsedMail {
  from: string;
  to: string[];
  subject: string;
  messageId: string | null;
  text: string | null;
  html: string | null;
}

/** Addresses of a To or Cc header (display names dropped). */
function addresses(header: AddressObject | AddressObject[] | undefined): string[] {
  const list = header === undefined ? [] : Array.isArray(header) ? header : [header];
  return list.flatMap((h) => h.value.map((a) => a.address ?? '')).filter((a) => a.includes('@'));
}

/** The From header as "Name <address>" (or the bare address), without the quotes a writer may add. */
function sender(header: AddressObject | undefined): string {
  return (header?.value ?? []).map((a) => (a.name ? `${a.name} <${a.address ?? ''}>` : (a.address ?? ''))).join(', ');
}

export async function parseMail(raw: Buffer): Promise<ParsedMail> {
  const mail = await simpleParser(raw, { skipHtmlToText: true, skipTextToHtml: true, skipImageLinks: true, skipTextLinks: true });
  // The line break that ends a single-part message belongs to the transport (SMTP DATA ends with CRLF.CRLF), not to the text.
  const text = mail.text === undefined ? null : mail.text.replace(/\r?\n$/, '');
  return {
    from: sender(mail.from),
    to: [...addresses(mail.to), ...addresses(mail.cc)],
    subject: mail.subject ?? '',
    messageId: mail.messageId ?? null,
    text,
    html: typeof mail.html === 'string' ? mail.html : null,
  };
}
