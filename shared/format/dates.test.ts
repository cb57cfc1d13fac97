import { describe, expect, it } from 'vitest';
import { formatDate, formatDateTime, formatTime } from './dates';

// Unambiguous day-month-year with a written month (common practice, no source).
describe('dates for people', () => {
  it('writes the day, a short month name, the year and 24-hour time', () => {
    expect(formatDateTime('2026-12-02T05:58:09Z', { timeZone: 'UTC' })).toBe('2 Dec 2026, 05:58 UTC');
    expect(formatDate('2026-02-12T23:10:00Z', { timeZone: 'UTC' })).toBe('12 Feb 2026');
    expect(formatTime('2026-02-12T23:10:00Z', { timeZone: 'UTC' })).toBe('23:10');
  });
  it('answers a dash for a missing or unreadable date', () => {
    expect(formatDateTime(null)).toBe('—');
    expect(formatDate('not a date')).toBe('—');
  });
  it('uses local time by default', () => {
    const d = new Date(2026, 11, 2, 5, 58);
    expect(formatDateTime(d)).toBe('2 Dec 2026, 05:58');
  });
});
