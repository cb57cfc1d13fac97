import type { Db, Tx } from '../../db/database';
import { insertOutboxRow } from './mail.repository';

export interface OutgoingMail {
  /** Recipient addresses; duplicates and blanks are dropped. */
  to: string[];
  subject: string;
  /** Plain-text part; the sender appends the link as a full address. */
  text: string;
  /** HTML part (a fragment); the sender appends the link as an anchor. */
  html: string;
  /** Path inside the app (`/parameter-sets/12`) or a full URL; made absolute with PUBLIC_URL when sent. */
  link?: string;
  /** Why the mail exists, for the outbox listing (e.g. `parameterSet.submitted`). Never shown to recipients. */
  reason: string;
}

/**
 * Puts a message in the outbox inside the caller's transaction: if the change rolls back, the mail
 * is never sent; if it commits, the sender loop delivers it later, so a slow or broken SMTP server
 * never blocks or fails the change. Returns the outbox id, or null when no recipient is left.
 * Never put secrets (passwords, session ids, tokens) in a mail.
 */
export async function queueMail(executor: Db | Tx, message: OutgoingMail): Promise<number | null> {
  const to = [...new Set(message.to.map((a) => a.trim().toLowerCase()).filter((a) => a.length > 0))];
  if (to.length === 0) return null;
  const now = new Date().toISOString();
  return insertOutboxRow(executor, {
    toJson: JSON.stringify(to),
    subject: message.subject,
    text: message.text,
    html: message.html,
    link: message.link ?? null,
    reason: message.reason,
    status: 'queued',
    nextAttemptAt: now,
    createdAt: now,
  });
}

const HTML_ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };
export const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => HTML_ESCAPES[c]);

/**
 * Builds both parts from plain paragraphs, escaping them for HTML, so callers write the words once:
 * `queueMail(tx, { to, subject, ...mailBody(['Norrane v3 was submitted for review.']), link, reason })`.
 */
export function mailBody(paragraphs: string[]): { text: string; html: string } {
  return {
    text: paragraphs.join('\n\n'),
    html: paragraphs.map((p) => `<p>${escapeHtml(p).replace(/\n/g, '<br>')}</p>`).join('\n'),
  };
}
