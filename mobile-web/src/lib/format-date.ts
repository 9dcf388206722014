import { lazyFormat } from './lazy-format';

const dateTime = lazyFormat(() => new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' }));
const dateOnly = lazyFormat(() => new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric' }));
const dayOnly = lazyFormat(() => new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' }));

/** "3 Mar 2026, 09:12" in the phone's time zone; "—" for none. */
export function formatDateTime(iso: string | null | undefined): string {
  return iso ? dateTime(new Date(iso)) : '—';
}

/** "Tue, 3 Mar 2026"; "—" for none. */
export function formatDate(iso: string | null | undefined): string {
  return iso ? dateOnly(new Date(iso)) : '—';
}

/** "3 Mar 2026", for table cells; "—" for none. */
export function formatDay(iso: string | null | undefined): string {
  return iso ? dayOnly(new Date(iso)) : '—';
}

/** True when the instant has passed. */
export function isPast(iso: string | null | undefined, now: Date = new Date()): boolean {
  return !!iso && Date.parse(iso) < now.getTime();
}
