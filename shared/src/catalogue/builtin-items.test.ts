import { describe, expect, it } from 'vitest';
import { BUILTIN_ITEMS } from './builtin-items.js';
import { CatalogueItemCreateSchema } from './catalogue-item.schema.js';

describe('the built-in item catalogue', () => {
  it('holds about 25 items with distinct ids and names', () => {
    expect(BUILTIN_ITEMS.length).toBeGreaterThanOrEqual(20);
    expect(new Set(BUILTIN_ITEMS.map((i) => i.id)).size).toBe(BUILTIN_ITEMS.length);
    expect(new Set(BUILTIN_ITEMS.map((i) => i.name)).size).toBe(BUILTIN_ITEMS.length);
  });

  it.each(BUILTIN_ITEMS.map((i) => [i.name, i] as const))('%s passes the same validation as an added item', (_name, item) => {
    const { id: _id, ...fields } = item;
    expect(CatalogueItemCreateSchema.safeParse(fields).success).toBe(true);
  });

  it('says where every figure comes from', () => {
    for (const item of BUILTIN_ITEMS) expect(item.source.length).toBeGreaterThan(10);
  });

  it('gives the 3.9 m scaffold board the BS 2482 section of 225 × 38 mm', () => {
    const board = BUILTIN_ITEMS.find((i) => i.name === 'Scaffold board (3.9 m)');
    expect(board?.shape).toMatchObject({ kind: 'plate', lengthM: 3.9, widthM: 0.225, thicknessM: 0.038 });
    expect(board?.source).toContain('BS 2482');
  });
});
