import { describe, expect, it } from 'vitest';
import { csvCell, csvLine, neutraliseCell } from './csv-cell.js';

describe('CSV cells of an export', () => {
  it('prefix every formula start listed by OWASP CSV Injection with a single quote', () => {
    for (const start of ['=', '+', '-', '@', '\t', '\r']) expect(neutraliseCell(`${start}SUM(A1:A2)`)).toBe(`'${start}SUM(A1:A2)`);
  });

  it('leave ordinary text alone', () => {
    expect(neutraliseCell('Loose coupler')).toBe('Loose coupler');
    expect(csvCell('Board offcut (1 m)')).toBe('Board offcut (1 m)');
  });

  it('quote commas, quotes and line breaks, doubling the quotes', () => {
    expect(csvCell('a, b')).toBe('"a, b"');
    expect(csvCell('say "hi"')).toBe('"say ""hi"""');
    expect(csvCell('two\nlines')).toBe('"two\nlines"');
    expect(csvCell('=HYPERLINK("x")')).toBe('"\'=HYPERLINK(""x"")"');
  });

  it('write numbers as numbers, even negative ones, and empty cells for nothing', () => {
    expect(csvCell(-3.5)).toBe('-3.5');
    expect(csvCell(null)).toBe('');
    expect(csvCell(Number.NaN)).toBe('');
    expect(csvLine(['a', 1, true, null])).toBe('a,1,yes,\r\n');
  });
});
