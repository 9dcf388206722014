import { lazyFormat } from './lazy-format';

/*
 * The first Intl formatter a page makes loads the phone's locale data, tens of milliseconds on
 * a phone (more than drawing the home), and the home shows dates as soon as it has its sites. The
 * two formats without a weekday are therefore put together by hand from the phone's clock, with
 * the same words as Intl's en-GB ones (format-date.test.ts holds them to that).
 */
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sept', 'Oct', 'Nov', 'Dec'] as const;

const twoDigits = (value: number) => String(value).padStart(2, '0');

/** "3 Mar 2026" in the phone's time zone. */
function day(date: Date): string {
  return `${date.getDate()} ${MONTHS[date.getMonth()]} ${date.getFullYear()}`;
}

const dateOnly = lazyFormat(() => new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric' }));

/** "3 Mar 2026, 09:12" in the phone's time zone; "—" for none. */
export function formatDateTime(iso: string | null | undefined): string {
  if (!iso) return '—';
  const date = new Date(iso);
  return `${day(date)}, ${twoDigits(date.getHours())}:${twoDigits(date.getMinutes())}`;
}

/** "Tue, 3 Mar 2026"; "—" for none. */
export function formatDate(iso: string | null | undefined): string {
  return iso ? dateOnly(new Date(iso)) : '—';
}

/** "3 Mar 2026", for table cells; "—" for none. */
export function formatDay(iso: string | null | undefined): string {
  return iso ? day(new Date(iso)) : '—';
}

/** True when the instant has passed. */
export function isPast(iso: string | null | undefined, now: Date = new Date()): boolean {
  return !!iso && Date.parse(iso) < now.getTime();
}
