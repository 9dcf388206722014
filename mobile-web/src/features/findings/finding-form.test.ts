import { describe, expect, it } from 'vitest';
import { formOfFinding, newFindingForm, readFindingForm, windAnswerFor } from './finding-form';

const context = { units: 'si' as const, liftHeightM: 2, windSpeedMps: null };
const hammer = { id: 'c-1', name: 'Scaffold hammer', massKg: 0.7, shape: { kind: 'box' as const, lengthM: 0.33, widthM: 0.11, heightM: 0.035 } };

describe('the finding form', () => {
  it('takes the height from the lift, or the measured height in the user’s units', () => {
    const form = { ...newFindingForm({ elevation: 'North', lift: 5, bay: 4 }, null), catalogueItemId: 'c-1' };
    expect(readFindingForm(form, { ...context, catalogueItem: hammer }).input?.heightM).toBe(10);
    const measured = { ...form, heightMode: 'measured' as const, heightText: '20' };
    // 20 ft = 20 × 0.3048 m = 6.096 m (NIST SP 811 (2008), App. B.9: 1 ft = 0.3048 m exactly).
    expect(readFindingForm(measured, { ...context, units: 'imperial', catalogueItem: hammer }).input?.heightM).toBeCloseTo(6.096, 10);
  });

  it('says what is missing instead of estimating from half an item', () => {
    const form = { ...newFindingForm({ elevation: 'North', lift: 2, bay: 1 }, null), itemMode: 'custom' as const, dimensionTexts: { lengthM: '20' } };
    const reading = readFindingForm(form, context);
    expect(reading.input).toBeUndefined();
    expect(reading.problems).toMatchObject({ name: 'Name the item.', mass: 'Enter the mass (more than zero).' });
  });

  it('reads a described item in centimetres into a shape in metres', () => {
    const form = {
      ...newFindingForm({ elevation: 'North', lift: 2, bay: 1 }, null),
      itemMode: 'custom' as const,
      customName: 'Brick',
      massText: '2,3',
      shape: 'box' as const,
      dimensionTexts: { lengthM: '21.5', widthM: '10.25', heightM: '6.5' },
    };
    const { input, item } = readFindingForm(form, context);
    expect(item).toMatchObject({ name: 'Brick', massKg: 2.3, catalogueItemId: null });
    expect(input?.shape).toEqual({ kind: 'box', lengthM: 0.215, widthM: 0.1025, heightM: 0.065, orientation: 'tumbling' });
  });

  it('asks how an item was made safe', () => {
    const form = { ...newFindingForm({ elevation: 'North', lift: 2, bay: 1 }, null), catalogueItemId: 'c-1', madeSafe: true };
    expect(readFindingForm(form, { ...context, catalogueItem: hammer }).problems.madeSafeNote).toBe('Say how it was made safe.');
  });

  it('answers the wind question from the measured wind (Beaufort 4 from 5.5 m/s, 6 from 10.8 m/s)', () => {
    expect([null, 5.4, 5.5, 10.7, 10.8].map(windAnswerFor)).toEqual(['calm', 'calm', 'breezy', 'breezy', 'strong']);
  });

  it('round-trips a saved finding into the form, measured heights included', () => {
    const saved = {
      elevation: 'East',
      lift: 3,
      bay: 2,
      heightM: 5.5,
      item: { catalogueItemId: null, name: 'Brick', massKg: 2.3, shape: { kind: 'sphere' as const, diameterM: 0.1 } },
      exposure: 'public' as const,
      likelihoodAnswers: newFindingForm({ elevation: 'East', lift: 3, bay: 2 }, null).answers,
      notes: 'n',
      state: 'open',
      madeSafeNote: null,
    };
    const form = formOfFinding(saved, { units: 'si', liftHeightM: 2 });
    expect(form).toMatchObject({ heightMode: 'measured', heightText: '5.5', itemMode: 'custom', massText: '2.3', shape: 'sphere', dimensionTexts: { diameterM: '10' } });
    expect(readFindingForm(form, context).input?.heightM).toBe(5.5);
  });
});
