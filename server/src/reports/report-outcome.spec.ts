import { describe, expect, it } from 'vitest';
import type { inspections } from '../db/schema/index.js';
import { outcomeLines } from './report-outcome.js';

type Row = typeof inspections.$inferSelect;
const row = (over: Partial<Row>) => ({ reason: 'scheduled', tagStatus: null, restriction: '', accessTagsChanged: null, ...over }) as Row;

describe('the outcome in the signed report and its e-mail', () => {
  it('names the reason, the tag status given, the restriction when limited and the access-point tags', () => {
    expect(outcomeLines(row({ reason: 'after-bad-weather', tagStatus: 'limited', restriction: 'Lifts 1–3 only', accessTagsChanged: true }))).toEqual([
      ['Reason for the inspection', 'After adverse weather'],
      ['Tag status recorded by the inspector', 'Limited use'],
      ['Restriction', 'Lifts 1–3 only'],
      ['Tags at the access points', 'Changed at every access point'],
    ]);
  });

  it('says "not recorded" for a report signed before the outcome was asked for', () => {
    expect(outcomeLines(row({ reason: 'pre-shift' }))).toEqual([
      ['Reason for the inspection', 'Before the shift'],
      ['Tag status recorded by the inspector', 'Not recorded'],
      ['Tags at the access points', 'Not recorded'],
    ]);
  });
});
