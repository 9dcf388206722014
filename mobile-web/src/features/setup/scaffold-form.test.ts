import { describe, expect, it } from 'vitest';
import { scaffold } from '../../local-db/testing';
import { newScaffoldForm, previewOf, readScaffoldChange, readScaffoldForm, resizeLiftHeights, scaffoldFormOf } from './scaffold-form';

const SITE = '7d1f4c52-0000-4000-8000-000000000000';

describe('the scaffold form', () => {
  it('makes a new scaffold’s body in metres, following the site’s regime by default', () => {
    const form = { ...newScaffoldForm('si'), reference: 'QL-C', elevations: 'North, East', lifts: '3', baysPerElevation: '6' };
    const read = readScaffoldForm(form, SITE, 'si');
    expect(read.ok).toBe(true);
    if (read.ok) expect(read.body).toMatchObject({ siteId: SITE, reference: 'QL-C', elevations: ['North', 'East'], lifts: 3, liftHeightM: 2, liftHeightsM: [], regime: null, foremanId: null });
  });

  it('reads heights typed in feet as metres', () => {
    const form = { ...newScaffoldForm('imperial'), reference: 'B', liftHeight: '6.5', liftsDiffer: true, lifts: '2', liftHeights: ['8', '6.5'] };
    const read = readScaffoldForm(form, SITE, 'imperial');
    expect(read.ok).toBe(true);
    if (read.ok) {
      expect(read.body.liftHeightM).toBeCloseTo(1.9812, 4); // 6.5 ft × 0.3048 m/ft (exact by definition)
      expect(read.body.liftHeightsM[0]).toBeCloseTo(2.4384, 4);
    }
  });

  it('names each field the shared schema refuses', () => {
    const form = { ...newScaffoldForm('si'), reference: '', lifts: 'two', elevations: '', handedOverOn: '31/02/2026' };
    const read = readScaffoldForm(form, SITE, 'si');
    expect(read.ok).toBe(false);
    if (!read.ok) {
      expect(read.errors).toMatchObject({
        reference: 'Give the scaffold a reference, e.g. A1',
        lifts: 'A whole number of lifts',
        elevations: 'At least one elevation',
        handedOverOn: 'A date as YYYY-MM-DD, e.g. 2026-03-04',
      });
    }
  });

  it('gives new lifts the usual height when lifts are added', () => {
    const form = { ...newScaffoldForm('si'), lifts: '3', liftHeight: '2', liftsDiffer: true, liftHeights: ['2.5'] };
    expect(resizeLiftHeights(form)).toEqual(['2.5', '2', '2']);
    expect(resizeLiftHeights({ ...form, lifts: 'x' })).toEqual(['2.5']);
  });

  it('previews the last sensible reading while a number is half typed', () => {
    const form = { ...newScaffoldForm('si'), lifts: '', baysPerElevation: '12', elevations: 'A,B', liftsDiffer: true, liftHeights: ['3', ''] };
    expect(previewOf(form, 'si')).toEqual({ elevations: ['A', 'B'], lifts: 1, bays: 12, liftHeightM: 2, liftHeightsM: [3] });
    expect(previewOf({ ...form, lifts: '2' }, 'si').liftHeightsM).toEqual([3, 2]);
  });

  it('sends only what changed, with the version it was read at', () => {
    const existing = { ...scaffold, liftHeightsM: [], regime: null };
    const form = { ...scaffoldFormOf(existing, 'imperial'), regime: 'pre-shift' as const, designReference: 'Sheet 4' };
    const read = readScaffoldChange(form, existing, 'imperial');
    expect(read).toEqual({ ok: true, body: { version: 1, regime: 'pre-shift', designReference: 'Sheet 4' } });
    expect(readScaffoldChange(scaffoldFormOf(existing, 'si'), existing, 'si')).toEqual({ ok: false, errors: { '': 'Nothing has changed' } });
  });
});
