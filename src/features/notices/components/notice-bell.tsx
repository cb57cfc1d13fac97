import { useEffect, useId, useRef, useState } from 'react';
import { Link } from 'react-router-dom';
import { formatDateTime } from '@shared/format/dates';
import { useMarkNoticeRead, useNotices } from '../api/notices';

/**
 * The signed-in person's notices: a button with the number unread, opening a short list (newest first).
 * Following a notice marks it read; "Mark read" does so without leaving the page. Escape closes the list.
 */
export function NoticeBell() {
  const notices = useNotices();
  const markRead = useMarkNoticeRead();
  const [open, setOpen] = useState(false);
  const listId = useId();
  const box = useRef<HTMLDivElement>(null);
  const button = useRef<HTMLButtonElement>(null);
  useEffect(() => {
    if (!open) return;
    const onKey = (e: KeyboardEvent) => {
      if (e.key === 'Escape') {
        setOpen(false);
        button.current?.focus();
      }
    };
    const onClick = (e: MouseEvent) => {
      if (box.current && !box.current.contains(e.target as Node)) setOpen(false);
    };
    window.addEventListener('keydown', onKey);
    window.addEventListener('mousedown', onClick);
    return () => {
      window.removeEventListener('keydown', onKey);
      window.removeEventListener('mousedown', onClick);
    };
  }, [open]);
  const unread = notices.data?.unread ?? 0;
  const list = notices.data?.notices ?? [];
  return (
    <div ref={box} className="relative">
      <button
        ref={button}
        type="button"
        aria-expanded={open}
        aria-controls={listId}
        aria-label={unread ? `Notices, ${unread} unread` : 'Notices'}
        onClick={() => setOpen((o) => !o)}
        className="inline-flex items-center gap-1.5 rounded-md border border-rule bg-paper-raised px-2.5 py-1.5 text-sm font-semibold text-ink hover:bg-paper-deep"
      >
        <svg width="16" height="16" viewBox="0 0 16 16" aria-hidden="true">
          <path
            d="M8 1.8a4 4 0 0 0-4 4v2.6L2.6 11h10.8L12 8.4V5.8a4 4 0 0 0-4-4ZM6.3 12.6a1.8 1.8 0 0 0 3.4 0"
            fill="none"
            stroke="currentColor"
            strokeWidth="1.5"
            strokeLinejoin="round"
          />
        </svg>
        {unread > 0 && (
          <span className="num rounded-full bg-copper px-1.5 text-xs text-white" data-testid="notice-count">
            {unread}
          </span>
        )}
      </button>
      {open && (
        <div
          id={listId}
          role="region"
          aria-label="Notices"
          className="absolute right-0 z-40 mt-2 w-[min(22rem,calc(100vw-2rem))] rounded-lg border border-rule bg-paper-raised p-2 shadow-lg"
        >
          {notices.isPending ? (
            <p className="px-2 py-3 text-sm text-ink-soft">Loading your notices…</p>
          ) : notices.isError ? (
            <p role="alert" className="px-2 py-3 text-sm text-changes">
              Your notices could not be loaded: {notices.error.message}
            </p>
          ) : list.length === 0 ? (
            <p className="px-2 py-3 text-sm text-ink-soft">No notices. You hear here when a fit of yours finishes or fails.</p>
          ) : (
            <ul className="max-h-80 divide-y divide-rule/70 overflow-auto">
              {list.map((n) => (
                <li key={n.id} className={`px-2 py-2 text-sm ${n.readAt ? 'text-ink-soft' : ''}`}>
                  <div className="flex items-start justify-between gap-2">
                    {n.link ? (
                      <Link
                        to={n.link}
                        className={`underline decoration-rule underline-offset-4 hover:decoration-copper ${n.readAt ? '' : 'font-semibold'}`}
                        onClick={() => {
                          if (!n.readAt) markRead.mutate(n.id);
                          setOpen(false);
                        }}
                      >
                        {n.text}
                      </Link>
                    ) : (
                      <span className={n.readAt ? '' : 'font-semibold'}>{n.text}</span>
                    )}
                    {!n.readAt && (
                      <button
                        type="button"
                        className="shrink-0 text-xs font-semibold text-copper hover:underline"
                        onClick={() => markRead.mutate(n.id)}
                      >
                        Mark read
                      </button>
                    )}
                  </div>
                  <div className="num mt-0.5 text-xs text-ink-faint">{formatDateTime(n.createdAt)}</div>
                </li>
              ))}
            </ul>
          )}
        </div>
      )}
    </div>
  );
}
