import { describe, expect, it } from 'vitest';
import { assessDrop } from '../physics/assess.js';
import { STANDARD_GRAVITY as G } from '../physics/constants.js';
import { DEFAULT_SEVERITY_TABLE, SEVERITY_LABELS, type SeverityTable } from './severity-table.js';
import { rateSeverity, SeverityTableError } from './severity.js';

describe('severity thresholds', () => {
  it('carry a source string and a reference in words on every threshold', () => {
    for (const list of Object.values(DEFAULT_SEVERITY_TABLE)) {
      for (const t of list) {
        expect(t.source.length).toBeGreaterThan(10);
        expect(t.reference.length).toBeGreaterThan(10);
      }
    }
  });

  it('use the cited reference values', () => {
    const find = (exposure: 'bare-head' | 'helmet', source: RegExp, quantity: 'energy' | 'force') =>
      DEFAULT_SEVERITY_TABLE[exposure].filter((t) => source.test(t.source) && t.quantity === quantity).map((t) => t.atLeast);
    expect(find('helmet', /^EN 397/, 'energy')).toEqual([49.0]); // EN 397: 5 kg × 9.80665 × 1 m ≈ 49 J
    expect(find('helmet', /^ANSI\/ISEA Z89.1/, 'force')).toEqual([4450]); // ANSI/ISEA Z89.1 Type I: ≤ 4450 N
    expect(find('helmet', /^ANSI\/ISEA Z89.1/, 'energy')).toEqual([54.5]); // ANSI/ISEA Z89.1 Type I: 3.6 kg at 5.5 m/s
    expect(find('helmet', /^EN 397/, 'force')).toEqual([5000]); // EN 397: transmitted force ≤ 5.0 kN
    expect(find('helmet', /^EN 14052/, 'energy')).toEqual([100]); // EN 14052: 100 J crown impact
    expect(find('bare-head', /^Yoganandan/, 'energy')).toEqual([14.1, 68.5]); // Yoganandan et al. 1995: 14.1–68.5 J
    expect(find('bare-head', /^Yoganandan/, 'force')).toEqual([4500, 14100]); // Yoganandan et al. 1995: 4.5–14.1 kN
  });

  it('differ for a bare head and a helmet', () => {
    expect(rateSeverity(20, 1000, 'bare-head').level).toBe(4); // above 14.1 J, lowest skull-fracture energy (Yoganandan 1995)
    expect(rateSeverity(20, 1000, 'helmet').level).toBe(1); // below half the EN 397 test energy (24.5 J, common practice)
  });
});

describe('rateSeverity', () => {
  it('labels the five levels with the generic risk-matrix words', () => {
    expect(Object.values(SEVERITY_LABELS)).toEqual(['Negligible', 'Minor', 'Moderate', 'Major', 'Catastrophic']); // product brief
  });

  it('says which reference the estimate crossed', () => {
    const s = rateSeverity(50, 3000, 'helmet');
    expect(s.level).toBe(3); // 50 J ≥ 49 J, EN 397 test energy; 3 kN below the 4.45 kN ANSI/ISEA Z89.1 limit
    expect(s.basis).toMatch(/EN 397/);
    const catastrophic = rateSeverity(120, 3000, 'helmet');
    expect(catastrophic.label).toBe('Catastrophic');
    expect(catastrophic.basis).toMatch(/EN 14052/);
  });

  it('rates by force when force crosses a higher reference than energy', () => {
    const s = rateSeverity(2, 5000, 'bare-head'); // small hard item: little energy, sharp blow
    expect(s.level).toBe(4); // 5.0 kN ≥ 4.5 kN, lowest skull-fracture force (Yoganandan 1995)
    expect(s.basis).toMatch(/Peak force/);
  });

  it('explains a level 1 by the lowest references', () => {
    const s = rateSeverity(0.5, 100, 'bare-head');
    expect(s.level).toBe(1); // 0.5 J < 1.41 J and 100 N < 450 N (default table margins, common practice, no source)
    expect(s.basis).toMatch(/^Below every reference for a bare head/);
  });

  it('rates the EN 397 striker on a helmet as Moderate (at the test energy, force at its limit)', () => {
    const drop = assessDrop({ massKg: 5, heightM: 1, exposure: 'helmet' }); // EN 397: 5 kg from 1 m
    expect(drop.severity.level).toBe(3); // 49.03 J ≥ 49 J (EN 397); peak 5.0 kN by construction, not above the EN 397 limit
  });

  it('rates the ANSI/ISEA Z89.1 Type I striker on a helmet as Major (beyond both test energies)', () => {
    const drop = assessDrop({ massKg: 3.6, heightM: (5.5 * 5.5) / (2 * G), exposure: 'helmet' }); // 54.45 J
    expect(drop.impactEnergyJ).toBeLessThan(54.5); // ½ × 3.6 × 5.5² = 54.45 J (ANSI/ISEA Z89.1 Type I), just under the 54.5 J threshold
    expect(drop.severity.level).toBe(4); // peak 5.5 × √(254929 × 3.6) ≈ 5.27 kN > 5.0 kN EN 397 limit with the EN 397-derived helmet spring
  });

  it('accepts an organisation table and rejects a malformed one', () => {
    const strict: SeverityTable = {
      'bare-head': [{ level: 5, quantity: 'energy', atLeast: 5, reference: 'our site rule for the public', source: 'Acme Build site rules 2025' }],
      helmet: [{ level: 2, quantity: 'energy', atLeast: 5, reference: 'our site rule for workers', source: 'Acme Build site rules 2025' }],
    };
    expect(assessDrop({ massKg: 1, heightM: 1 }, { severityTable: strict }).severity.level).toBe(5); // 9.8 J ≥ the organisation's 5 J rule
    expect(assessDrop({ massKg: 1, heightM: 1, exposure: 'helmet' }, { severityTable: strict }).severity.basis).toMatch(/Acme/);
    const broken = { 'bare-head': [{ level: 7, quantity: 'energy', atLeast: 5, reference: 'x', source: 'y' }], helmet: [] } as unknown as SeverityTable;
    expect(() => rateSeverity(1, 1, 'bare-head', broken)).toThrow(SeverityTableError);
    const unsourced = { 'bare-head': [{ level: 3, quantity: 'energy', atLeast: 5, reference: 'a rule', source: ' ' }], helmet: [] } as unknown as SeverityTable;
    expect(() => rateSeverity(1, 1, 'bare-head', unsourced)).toThrow(/source/);
  });

  it('returns the same frozen object for the same threshold, so rating allocates nothing', () => {
    const a = rateSeverity(80, 0, 'bare-head');
    const b = rateSeverity(90, 0, 'bare-head');
    expect(a).toBe(b);
    expect(Object.isFrozen(a)).toBe(true);
  });
});
