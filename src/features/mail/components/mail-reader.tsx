import { useState } from 'react';
import { formatDateTime } from '@shared/format/dates';
import type { MailboxMessage } from '../api/mailbox';

/** A plain frame style so the HTML part reads like the rest of the page; the message's own styles still apply after it. */
const FRAME_HEAD =
  '<!doctype html><meta charset="utf-8"><style>body{font:15px/1.55 system-ui,sans-serif;color:#18223a;margin:12px}</style>';

/** One message: headers, then the plain-text part or the HTML part in a sandboxed frame (no scripts, no same-origin access). */
export function MailReader({ message }: { message: MailboxMessage }) {
  const [view, setView] = useState<'text' | 'html'>('text');
  const showHtml = view === 'html' && message.html !== null;
  return (
    <article aria-label={`Message ${message.subject}`}>
      <header className="border-b border-rule pb-3">
        <h3 className="text-lg font-semibold">{message.subject || '(no subject)'}</h3>
        <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-sm">
          <dt className="text-ink-faint">From</dt>
          <dd>{message.from}</dd>
          <dt className="text-ink-faint">To</dt>
          <dd>{message.to.join(', ')}</dd>
          <dt className="text-ink-faint">Received</dt>
          <dd className="num">{formatDateTime(message.receivedAt)}</dd>
        </dl>
        {message.html !== null && (
          <div role="group" aria-label="Part shown" className="mt-3 inline-flex rounded-md border border-rule text-sm">
            {(['text', 'html'] as const).map((v) => (
              <button
                key={v}
                type="button"
                aria-pressed={view === v}
                onClick={() => setView(v)}
                className={`px-3 py-1 first:rounded-l-md last:rounded-r-md ${view === v ? 'bg-ink text-paper' : 'hover:bg-paper-deep'}`}
              >
                {v === 'text' ? 'Plain text' : 'HTML'}
              </button>
            ))}
          </div>
        )}
      </header>
      {showHtml ? (
        <iframe
          title={`HTML part of ${message.subject}`}
          sandbox=""
          srcDoc={FRAME_HEAD + (message.html ?? '')}
          className="mt-3 block h-80 w-full rounded-md border border-rule bg-white"
        />
      ) : (
        <pre className="mt-3 whitespace-pre-wrap break-words font-sans text-sm leading-relaxed">{message.text || '(no text part)'}</pre>
      )}
    </article>
  );
}
