import { describe, expect, it } from 'vitest';
import { catalogueFormOf, newCatalogueForm, readCatalogueForm } from './catalogue-form';

describe('an organisation’s own catalogue item', () => {
  it('reads sizes typed in centimetres and a mass in kilograms into the item the physics takes', () => {
    const form = { ...newCatalogueForm(), name: 'Clip-on level', category: 'hand-tool' as const, mass: '0.6', kind: 'rod' as const, sizes: { lengthM: '60', diameterM: '4' }, source: 'Weighed on site' };
    const read = readCatalogueForm(form, 'si');
    expect(read.ok).toBe(true);
    if (read.ok) {
      expect(read.body).toMatchObject({ name: 'Clip-on level', massKg: 0.6, shape: { kind: 'rod' } });
      expect(read.body.shape).toMatchObject({ lengthM: expect.closeTo(0.6, 9), diameterM: expect.closeTo(0.04, 9) });
    }
  });

  it('names a missing or non-positive size with the physics’ shape rules, and each other field', () => {
    const form = { ...newCatalogueForm(), kind: 'box' as const, sizes: { lengthM: '30', widthM: '0' } };
    const read = readCatalogueForm(form, 'si');
    expect(read.ok).toBe(false);
    if (!read.ok) {
      expect(read.errors).toMatchObject({
        name: 'Give the item a name',
        massKg: 'A mass is needed',
        'shape.widthM': 'Width: more than 0',
        'shape.heightM': 'Height: a size is needed',
        source: 'Say where the mass and size come from (a data sheet, a measurement…)',
      });
      expect(read.errors['shape.lengthM']).toBeUndefined();
    }
  });

  it('puts a saved item back in the form in the user’s units', () => {
    const form = catalogueFormOf(
      {
        id: '0c000000-0000-4000-8000-000000000001',
        name: 'Brick',
        category: 'material',
        massKg: 2.5,
        shape: { kind: 'box', lengthM: 0.215, widthM: 0.1025, heightM: 0.065 },
        source: 'BS EN 771-1 work size',
        builtIn: false,
        createdAt: '2026-01-01T00:00:00.000Z',
        updatedAt: '2026-01-01T00:00:00.000Z',
        version: 3,
      },
      'si',
    );
    expect(form).toMatchObject({ name: 'Brick', mass: '2.5', kind: 'box', sizes: { lengthM: '21.5', widthM: '10.25', heightM: '6.5' } });
  });
});
