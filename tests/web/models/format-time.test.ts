import { exactTime, timeAgo } from '@web/features/models/format-time';

// Noon UTC, so the calendar day is the same in every time zone the tests may run in.
const NOW = Date.UTC(2026, 10, 14, 12);
const ago = (ms: number) => new Date(NOW - ms).toISOString();
const MINUTE = 60_000;
const DAY = 86_400_000;

describe('timeAgo', () => {
  it.each([
    [ago(2 * 1000), 'just now'],
    [ago(20 * 1000), '20 seconds ago'],
    [ago(5 * MINUTE), '5 minutes ago'],
    [ago(3 * 60 * MINUTE), '3 hours ago'],
    [ago(DAY), 'yesterday'],
    [ago(4 * DAY), '4 days ago'],
    [ago(15 * DAY), '2 weeks ago'],
    [ago(29 * DAY), '4 weeks ago'],
    [new Date(NOW + 6 * DAY).toISOString(), 'in 6 days'],
  ])('says %s relatively: %s', (iso, words) => {
    expect(timeAgo(iso, { now: NOW, locale: 'en-GB' })).toBe(words);
  });

  it('gives the date, not a vague count, from about a month away', () => {
    expect(timeAgo(ago(31 * DAY), { now: NOW, locale: 'en-GB' })).toBe('14 Oct 2026');
    // About 20 months back: the date, where counting gave "2 years ago".
    expect(timeAgo(new Date(Date.UTC(2025, 2, 14, 12)).toISOString(), { now: NOW, locale: 'en-GB' })).toBe(
      '14 Mar 2025',
    );
    expect(timeAgo(new Date(Date.UTC(2025, 2, 14, 12)).toISOString(), { now: NOW, locale: 'en-US' })).toBe(
      'Mar 14, 2025',
    );
    expect(timeAgo(new Date(NOW + 45 * DAY).toISOString(), { now: NOW, locale: 'en-GB' })).toBe('29 Dec 2026');
  });

  it('keeps the exact moment for the tooltip', () => {
    expect(exactTime(new Date(Date.UTC(2025, 2, 14, 12)).toISOString(), 'en-GB')).toMatch(/^14 Mar 2025, \d{2}:00$/);
  });
});
