import { Injectable } from '@nestjs/common';
import type { RiskBand, Trends, TrendsQuery, TrendsWeek } from '@plummet/shared';
import type { AuthUser } from '../auth/auth.types.js';
import { AppError } from '../common/app-error.js';
import { OverviewRepository } from '../overview/overview.repository.js';
import { TrendsRepository, type WeekBandCount } from './trends.repository.js';

const BANDS: RiskBand[] = ['Low', 'Medium', 'High'];
const WEEK_MS = 7 * 86_400_000;

/** Monday 00:00 UTC of the week holding `at`. */
export function weekStartUtc(at: Date): Date {
  const day = new Date(Date.UTC(at.getUTCFullYear(), at.getUTCMonth(), at.getUTCDate()));
  const sinceMonday = (day.getUTCDay() + 6) % 7;
  return new Date(day.getTime() - sinceMonday * 86_400_000);
}

@Injectable()
export class TrendsService {
  constructor(
    private readonly trends: TrendsRepository,
    private readonly overview: OverviewRepository,
  ) {}

  async get(user: AuthUser, query: TrendsQuery, now = new Date()): Promise<Trends> {
    const org = user.organisationId;
    if (query.siteId && (await this.overview.sites(org, query.siteId)).length === 0) throw AppError.notFound('Site');
    const since = new Date(weekStartUtc(now).getTime() - (query.weeks - 1) * WEEK_MS);
    const [raised, closed, timeToFix, repeatLocations] = await Promise.all([
      this.trends.raisedPerWeek(org, since, query.siteId),
      this.trends.closedPerWeek(org, since, query.siteId),
      this.trends.timeToFix(org, since, query.siteId),
      this.trends.repeatLocations(org, query.siteId),
    ]);
    const weeks: TrendsWeek[] = Array.from({ length: query.weeks }, (_, i) => ({
      weekStart: new Date(since.getTime() + i * WEEK_MS).toISOString(),
      raised: { Low: 0, Medium: 0, High: 0 },
      closed: { Low: 0, Medium: 0, High: 0 },
    }));
    const place = (counts: WeekBandCount[], key: 'raised' | 'closed') => {
      for (const c of counts) {
        const index = Math.round((c.weekStart.getTime() - since.getTime()) / WEEK_MS);
        if (index >= 0 && index < weeks.length) weeks[index][key][c.band] += c.count;
      }
    };
    place(raised, 'raised');
    place(closed, 'closed');
    return {
      generatedAt: now.toISOString(),
      siteId: query.siteId ?? null,
      weeks,
      timeToFix: BANDS.map((band) => timeToFix.find((t) => t.band === band) ?? { band, medianHours: null, fixes: 0 }),
      repeatLocations,
    };
  }
}
