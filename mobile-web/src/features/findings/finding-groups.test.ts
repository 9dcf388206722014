import { describe, expect, it } from 'vitest';
import { groupByScaffoldAndLift, matchesSearch } from './finding-groups';

const finding = (id: string, scaffoldId: string, lift: number, riskScore: number, name = 'Scaffold clip') => ({ id, scaffoldId, lift, riskScore, item: { name } });
const references: Record<string, string> = { s1: 'QL-2', s2: 'QL-1', s3: 'QL-10' };

describe('the findings list grouped by scaffold and lift', () => {
  it('puts a heading with its count before each scaffold and lift, scaffolds by reference (numbers in order), lifts from the bottom', () => {
    const entries = groupByScaffoldAndLift(
      [finding('a', 's1', 2, 5), finding('b', 's2', 3, 8), finding('c', 's2', 1, 2), finding('d', 's1', 2, 9), finding('e', 's3', 1, 1)],
      (id) => references[id]!,
    );
    expect(entries.map((e) => (e.kind === 'heading' ? `${e.text} (${e.count})` : e.finding.id))).toEqual([
      'QL-1 · lift 1 (1)',
      'c',
      'QL-1 · lift 3 (1)',
      'b',
      'QL-2 · lift 2 (2)',
      'd',
      'a',
      'QL-10 · lift 1 (1)',
      'e',
    ]);
  });

  it('gives nothing for no findings', () => {
    expect(groupByScaffoldAndLift([], () => '')).toEqual([]);
  });
});

describe('searching the findings by item', () => {
  it('matches every word of the search anywhere in the item name, ignoring case and accents', () => {
    expect(matchesSearch(finding('a', 's', 1, 1, 'Loose scaffold clip'), 'CLIP loose')).toBe(true);
    expect(matchesSearch(finding('a', 's', 1, 1, 'Tube end café sign'), 'cafe')).toBe(true);
    expect(matchesSearch(finding('a', 's', 1, 1, 'Loose scaffold clip'), 'board')).toBe(false);
    expect(matchesSearch(finding('a', 's', 1, 1, 'Anything'), '   ')).toBe(true);
  });
});
