import { describe, expect, it } from 'vitest';
import { filtersFromSearch, filtersToParams, filtersToSearch } from './finding-filters';

describe('the findings table’s filters in the URL', () => {
  it('read back what they wrote', () => {
    const filters = filtersFromSearch(new URLSearchParams('riskBand=High,Medium&state=open&overdue=true&q=clip&sort=dueAt&order=asc'));
    expect(filters).toMatchObject({ riskBand: ['High', 'Medium'], state: ['open'], overdue: true, q: 'clip', sort: 'dueAt', order: 'asc' });
    expect(filtersFromSearch(filtersToSearch(filters))).toEqual(filters);
  });

  it('fall back to highest risk first for an unknown sort', () => {
    expect(filtersFromSearch(new URLSearchParams('sort=drop table'))).toMatchObject({ sort: 'riskScore', order: 'desc' });
  });

  it('send the raised-between days as instants, the second one including its whole day', () => {
    const params = filtersToParams({ sort: 'riskScore', order: 'desc', raisedFrom: '2026-03-01', raisedTo: '2026-03-01' });
    expect(Date.parse(params.get('raisedTo')!) - Date.parse(params.get('raisedFrom')!)).toBe(86_400_000);
  });
});
