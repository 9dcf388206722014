import { type ExclusionZone, suggestExclusionZone } from '@plummet/shared';
import { describe, expect, it } from 'vitest';
import { describeExclusionZone, readZoneForm } from './exclusion-zone-view';

const base: ExclusionZone = {
  scaffoldId: '00000000-0000-4000-8000-000000000001',
  elevation: 'North',
  topWorkingHeightM: 12,
  heaviestItem: null,
  limitingWindMps: null,
  barrieredWidthM: null,
  suggestion: null,
  updatedAt: null,
};

/** A zone as the server shapes it: 12 m, a 0.7 kg hammer, work stops above 10 m/s. */
function setZone(barrieredWidthM: number | null): ExclusionZone {
  const item = { id: '00000000-0000-4000-8000-000000000002', name: 'Scaffold hammer', massKg: 0.7 };
  return {
    ...base,
    heaviestItem: item,
    limitingWindMps: 10,
    barrieredWidthM,
    suggestion: suggestExclusionZone({ topWorkingHeightM: 12, item, limitingWindMps: 10 }),
  };
}

describe('the exclusion zone card', () => {
  it('says what is missing before an item and a wind speed are set, and that nothing is barriered yet', () => {
    const view = describeExclusionZone(base, 'si', 'mps');
    expect(view.title).toBe('Below elevation North');
    expect(view.suggestion).toBeNull();
    expect(view.missing).toBe('Set the heaviest item and the limiting wind speed to get a suggested width.');
    expect(view.facts).toContainEqual(['Top working height', '12 m']);
    expect(view.barriered).toBe('Not recorded yet');
    expect(view.comparison).toBeNull();
  });

  it('shows the suggested width as drift plus the bounce allowance, with the rules of thumb and their sources', () => {
    const zone = setZone(null);
    const s = zone.suggestion!;
    const view = describeExclusionZone(zone, 'si', 'mps');
    expect(view.missing).toBeNull();
    expect(view.suggestion!.parts[0]).toContain(`${Number(s.driftM.toPrecision(3))} m`);
    // The allowance is 2 m (common practice, no source) and is labelled so.
    expect(view.suggestion!.parts[1]).toBe('Allowance for bouncing and scattering on landing: 2 m (common practice, no source)');
    expect(view.suggestion!.width).toBe(`${Number((s.driftM + 2).toPrecision(3))} m`);
    // Height-based rules: a quarter and a half of 12 m (IBC 2021 Table 3306.1, fractions recalled from memory); WAHR 2005 reg. 11 sets no distance.
    expect(view.suggestion!.rules.map((r) => r.width)).toEqual(['3 m', '6 m', 'No distance set']);
    expect(view.suggestion!.rules[0]!.source).toMatch(/IBC 2021 Table 3306\.1/);
    expect(view.suggestion!.rules[2]!.source).toMatch(/WAHR 2005 reg\. 11/);
  });

  it("shows heights and widths in feet and the wind in the user's own wind unit", () => {
    const view = describeExclusionZone(setZone(3.048), 'imperial', 'mph');
    // 12 m / 0.3048 m per ft = 39.37 ft; 10 m/s / 0.44704 m/s per mph = 22.37 mph (exact factors, NIST SP 811).
    expect(view.facts).toContainEqual(['Top working height', '39.4 ft']);
    expect(view.facts).toContainEqual(['Limiting wind (work stops above it)', '22.4 mph']);
    expect(view.facts).toContainEqual(['Heaviest item handled there', 'Scaffold hammer (1.54 lb)']);
    expect(view.barriered).toBe('10 ft');
  });

  it('flags a barriered width narrower than the suggestion, by how much', () => {
    const zone = setZone(1);
    const gap = zone.suggestion!.suggestedWidthM - 1;
    expect(describeExclusionZone(zone, 'si', 'mps').comparison).toEqual({ words: `${Number(gap.toPrecision(3))} m narrower than suggested`, short: true });
    expect(describeExclusionZone(setZone(50), 'si', 'mps').comparison).toEqual({ words: 'As wide as suggested, or wider', short: false });
  });
});

describe('the exclusion zone form', () => {
  it('reads the wind in the user unit and the width in display units into SI', () => {
    // 20 mph = 8.9408 m/s; 10 ft = 3.048 m (exact by definition, NIST SP 811).
    const { body, problems } = readZoneForm({ heaviestItemId: 'x', windText: '20', widthText: '10' }, 'imperial', 'mph');
    expect(problems).toEqual({});
    expect(body!.heaviestItemId).toBe('x');
    expect(body!.limitingWindMps).toBeCloseTo(8.9408, 6);
    expect(body!.barrieredWidthM).toBeCloseTo(3.048, 6);
  });

  it('accepts empty fields as not set, a decimal comma, and refuses text or widths out of range', () => {
    expect(readZoneForm({ heaviestItemId: null, windText: '', widthText: '4,5' }, 'si', 'kmh').body).toEqual({ heaviestItemId: null, limitingWindMps: null, barrieredWidthM: 4.5 });
    const bad = readZoneForm({ heaviestItemId: null, windText: 'windy', widthText: '150' }, 'si', 'mps');
    expect(bad.body).toBeNull();
    expect(bad.problems.wind).toBe('Enter a number in m/s, or leave it empty.');
    expect(bad.problems.width).toBe('Between 0 and 100 m.');
  });
});
