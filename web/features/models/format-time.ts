// Times as a pilot reads them in a list: "3 hours ago" or "in 6 days" while recent, and
// the date ("14 Mar 2025" or "Mar 14, 2025", as the browser's language writes it) once
// counting back would be vague: "20 months ago" says less than the date. The exact
// moment stays for a tooltip and the <time> element.

const DAY_MS = 86_400_000;
/** Beyond this, before or after now, a time is shown as its date. */
export const RELATIVE_LIMIT_MS = 30 * DAY_MS;

const STEPS: [Intl.RelativeTimeFormatUnit, number][] = [
  ['second', 60],
  ['minute', 60],
  ['hour', 24],
  ['day', 7],
  ['week', Number.POSITIVE_INFINITY],
];

// Formatters are built once per language: lists format many times each render.
const formatters = new Map<string, Intl.DateTimeFormat | Intl.RelativeTimeFormat>();
function formatter<T extends Intl.DateTimeFormat | Intl.RelativeTimeFormat>(
  key: string,
  locale: string | undefined,
  make: () => T,
): T {
  const id = `${key}|${locale ?? ''}`;
  let found = formatters.get(id);
  if (!found) formatters.set(id, (found = make()));
  return found as T;
}

export interface TimeFormatOptions {
  now?: number;
  /** The browser's language when not given. */
  locale?: string;
}

/** Whether `iso` is near enough to now to be said relatively. */
export function isRecent(iso: string, now: number = Date.now()): boolean {
  return Math.abs(new Date(iso).getTime() - now) < RELATIVE_LIMIT_MS;
}

export function timeAgo(iso: string, { now = Date.now(), locale }: TimeFormatOptions = {}): string {
  if (!isRecent(iso, now)) return dateOnly(iso, locale);
  let amount = (new Date(iso).getTime() - now) / 1000;
  // The formatter's own word for this is "now", which reads wrongly after a verb
  // ("approved this revision now"); the screens' words are English in any case.
  if (Math.abs(amount) < 10) return 'just now';
  const relative = formatter('relative', locale, () => new Intl.RelativeTimeFormat(locale, { numeric: 'auto' }));
  for (const [unit, size] of STEPS) {
    if (Math.abs(amount) < size) return relative.format(Math.round(amount), unit);
    amount /= size;
  }
  return dateOnly(iso, locale);
}

export const dateOnly = (iso: string, locale?: string): string =>
  formatter(
    'date',
    locale,
    () => new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'short', year: 'numeric' }),
  ).format(new Date(iso));

export const exactTime = (iso: string, locale?: string): string =>
  formatter('exact', locale, () => new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeStyle: 'short' })).format(
    new Date(iso),
  );
