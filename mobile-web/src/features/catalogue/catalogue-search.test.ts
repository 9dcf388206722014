import { describe, expect, it } from 'vitest';
import { searchCatalogue, wordsOf } from './catalogue-search';

const items = [
  { name: 'Double coupler', words: wordsOf('Double coupler') },
  { name: 'Putlog coupler', words: wordsOf('Putlog coupler') },
  { name: 'Scaffold hammer', words: wordsOf('Scaffold hammer') },
  { name: 'Podger spanner (21 mm)', words: wordsOf('Podger spanner (21 mm)') },
];

describe('catalogue search', () => {
  it('splits a name into lower-case words', () => {
    expect(wordsOf('Podger spanner (21 mm)')).toEqual(['podger', 'spanner', '21', 'mm']);
  });

  it('finds items by the start of any words, in any order, best match first', () => {
    expect(searchCatalogue(items, 'coup').map((item) => item.name)).toEqual(['Double coupler', 'Putlog coupler']);
    expect(searchCatalogue(items, 'coup dou').map((item) => item.name)).toEqual(['Double coupler']);
    expect(searchCatalogue(items, 'put').map((item) => item.name)).toEqual(['Putlog coupler']);
    expect(searchCatalogue(items, '  ')).toEqual([]);
    expect(searchCatalogue(items, 'crane')).toEqual([]);
  });
});
