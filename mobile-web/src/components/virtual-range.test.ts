import { describe, expect, it } from 'vitest';
import { visibleRows } from './virtual-range';

describe('visibleRows', () => {
  it('renders only the rows in view plus the spare rows, out of 2,000', () => {
    expect(visibleRows(0, 700, 88, 2000)).toEqual({ start: 0, end: 15 });
    const middle = visibleRows(88 * 1000, 700, 88, 2000);
    expect(middle).toEqual({ start: 994, end: 1015 });
    expect(middle.end - middle.start).toBeLessThan(30);
  });

  it('stops at the end of the list and copes with an empty one', () => {
    expect(visibleRows(88 * 2000 - 700, 700, 88, 2000)).toEqual({ start: 1986, end: 2000 });
    expect(visibleRows(0, 700, 88, 0)).toEqual({ start: 0, end: 0 });
    expect(visibleRows(-50, 700, 88, 3)).toEqual({ start: 0, end: 3 });
  });
});
