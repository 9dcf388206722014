import type { RiskBand } from '@plummet/shared';
import type { DueScaffold, OpenCount, OverdueFix } from './digest.repository.js';

export const BANDS: RiskBand[] = ['High', 'Medium', 'Low'];

/** One site's part of a digest. */
export interface DigestSite {
  siteId: string;
  siteName: string;
  openByBand: Record<RiskBand, number>;
  overdueFixes: OverdueFix[];
  dueScaffolds: DueScaffold[];
}

/** Groups the three reads by site (sites in name order); a site with nothing to say is left out. */
export function digestSites(open: OpenCount[], overdue: OverdueFix[], due: DueScaffold[]): DigestSite[] {
  const sites = new Map<string, DigestSite>();
  const site = (siteId: string, siteName: string) => {
    let s = sites.get(siteId);
    if (!s) {
      s = { siteId, siteName, openByBand: { High: 0, Medium: 0, Low: 0 }, overdueFixes: [], dueScaffolds: [] };
      sites.set(siteId, s);
    }
    return s;
  };
  for (const c of open) site(c.siteId, c.siteName).openByBand[c.band] += c.count;
  for (const f of overdue) site(f.siteId, f.siteName).overdueFixes.push(f);
  for (const d of due) site(d.siteId, d.siteName).dueScaffolds.push(d);
  return [...sites.values()].sort((a, b) => a.siteName.localeCompare(b.siteName) || a.siteId.localeCompare(b.siteId));
}

/** The organisation's local calendar day and hour at an instant (IANA zone, daylight saving included). */
export function localClock(at: Date, timeZone: string): { date: string; hour: number } {
  const parts = Object.fromEntries(
    new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', hourCycle: 'h23' })
      .formatToParts(at)
      .map((p) => [p.type, p.value]),
  );
  return { date: `${parts.year}-${parts.month}-${parts.day}`, hour: Number(parts.hour) };
}
