// Times as a pilot reads them in a list: "3 hours ago", with the exact moment kept for
// a tooltip and the <time> element.

const relative = new Intl.RelativeTimeFormat(undefined, { numeric: 'auto' });
const exact = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });

const STEPS: [Intl.RelativeTimeFormatUnit, number][] = [
  ['second', 60],
  ['minute', 60],
  ['hour', 24],
  ['day', 7],
  ['week', 4.35],
  ['month', 12],
  ['year', Number.POSITIVE_INFINITY],
];

export function timeAgo(iso: string, now: number = Date.now()): string {
  let amount = (new Date(iso).getTime() - now) / 1000;
  for (const [unit, size] of STEPS) {
    if (Math.abs(amount) < size) return relative.format(Math.round(amount), unit);
    amount /= size;
  }
  return exact.format(new Date(iso));
}

export const exactTime = (iso: string): string => exact.format(new Date(iso));
