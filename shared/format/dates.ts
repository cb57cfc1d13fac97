/**
 * Dates for people, one form everywhere: "2 Dec 2026, 05:58" (day, short English month, year, 24-hour time).
 * Numeric forms like 12/2/2026 read differently on each side of the Atlantic, so they are never used.
 * Local time by default; pass `timeZone: 'UTC'` where the reader's zone is unknown (mail, exports).
 */
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

type When = string | number | Date | null | undefined;

function parts(when: When, timeZone?: 'UTC') {
  if (when === null || when === undefined || when === '') return null;
  const d = when instanceof Date ? when : new Date(when);
  if (Number.isNaN(d.getTime())) return null;
  const utc = timeZone === 'UTC';
  return {
    day: utc ? d.getUTCDate() : d.getDate(),
    month: MONTHS[utc ? d.getUTCMonth() : d.getMonth()],
    year: utc ? d.getUTCFullYear() : d.getFullYear(),
    hh: String(utc ? d.getUTCHours() : d.getHours()).padStart(2, '0'),
    mm: String(utc ? d.getUTCMinutes() : d.getMinutes()).padStart(2, '0'),
  };
}

/** "2 Dec 2026" — or "—" for a missing or unreadable date. */
export function formatDate(when: When, options: { timeZone?: 'UTC' } = {}): string {
  const p = parts(when, options.timeZone);
  return p ? `${p.day} ${p.month} ${p.year}` : '—';
}

/** "2 Dec 2026, 05:58" (with " UTC" appended when asked for UTC) — or "—". */
export function formatDateTime(when: When, options: { timeZone?: 'UTC' } = {}): string {
  const p = parts(when, options.timeZone);
  return p ? `${p.day} ${p.month} ${p.year}, ${p.hh}:${p.mm}${options.timeZone === 'UTC' ? ' UTC' : ''}` : '—';
}

/** "05:58" — for times within a day shown next to a full date. */
export function formatTime(when: When, options: { timeZone?: 'UTC' } = {}): string {
  const p = parts(when, options.timeZone);
  return p ? `${p.hh}:${p.mm}` : '—';
}
