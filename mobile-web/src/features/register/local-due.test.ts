import { describe, expect, it } from 'vitest';
import type { ScaffoldRecord, SiteRecord } from '../../local-db/records';
import { localDueItems } from './local-due';

const site = { id: 's1', name: 'Quayside', regime: '7-day', timeZone: 'Europe/London' } as SiteRecord;
const scaffold = (id: string, nextDueAt: string | null, lastInspectedAt: string | null) =>
  ({ id, siteId: 's1', reference: id, status: 'cleared', nextDueAt, lastInspectedAt }) as ScaffoldRecord;

describe('the due list on the phone', () => {
  it('lists overdue, due today and never inspected scaffolds of the sites kept here, naming the regime (UK WAHR 2005 reg. 12(4)(a))', () => {
    const now = new Date('2026-03-09T08:00:00Z');
    const items = localDueItems(
      [
        scaffold('later', '2026-03-12T10:00:00Z', '2026-03-05T10:00:00Z'),
        scaffold('today', '2026-03-09T15:00:00Z', '2026-03-02T15:00:00Z'),
        scaffold('overdue', '2026-03-08T15:00:00Z', '2026-03-01T15:00:00Z'),
        scaffold('new', null, null),
        { ...scaffold('elsewhere', '2026-03-01T00:00:00Z', null), siteId: 'not-here' },
      ],
      [site],
      now,
    );
    expect(items.map((i) => [i.reference, i.state])).toEqual([
      ['new', 'first-inspection'],
      ['overdue', 'overdue'],
      ['today', 'due-today'],
    ]);
    expect(items[1]).toMatchObject({ regulation: 'UK WAHR 2005 reg. 12(4)(a)', suggestedReason: 'scheduled' });
  });
});
