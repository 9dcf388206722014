import { describe, expect, it } from 'vitest';
import { assessDrop } from '../physics/assess.js';
import { STANDARD_GRAVITY as G } from '../physics/constants.js';
import { DEFAULT_SEVERITY_TABLE, SEVERITY_LABELS, type SeverityTable } from './severity-table.js';
import { plainSeverity, rateSeverity, SEVERITY_RELATIVE_TOLERANCE, SeverityTableError } from './severity.js';

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

  it('explains a level 1 by the estimate\'s own figures and the lowest references', () => {
    const s = rateSeverity(0.5, 100, 'bare-head');
    expect(s.level).toBe(1); // 0.5 J < 1.41 J and 100 N < 450 N (default table margins, common practice, no source)
    expect(s.basis).toMatch(/^Impact energy 0\.5 J and peak force 100 N, below every reference for a bare head: under 1\.41 J/);
  });

  it('quotes the estimate\'s own figure first, then the threshold it reaches', () => {
    const s = rateSeverity(10, 21_600, 'bare-head');
    expect(s.level).toBe(5); // 21.6 kN ≥ 14.1 kN, highest skull-fracture force (Yoganandan et al. 1995)
    expect(s.basis).toMatch(/^Peak force 21\.6 kN reaches 14\.1 kN, the highest skull-fracture force/);
    expect(rateSeverity(34.505, 0, 'helmet').basis).toMatch(/^Impact energy 34\.5 J reaches 24\.5 J/);
  });

  it('places each side of every default threshold on its own side, within the stated relative tolerance', () => {
    expect(SEVERITY_RELATIVE_TOLERANCE).toBe(1e-9);
    for (const exposure of ['bare-head', 'helmet'] as const) {
      for (const t of DEFAULT_SEVERITY_TABLE[exposure]) {
        const rate = (value: number) => (t.quantity === 'energy' ? rateSeverity(value, 0, exposure) : rateSeverity(0, value, exposure)).level;
        const where = `${exposure} ${t.quantity} ${t.atLeast}`;
        expect(rate(t.atLeast * (1 + 1e-6)), where).toBe(t.level); // just above: this level
        expect(rate(t.atLeast), where).toBe(t.level); // at the threshold: this level ("at least")
        expect(rate(t.atLeast * (1 - 1e-12)), where).toBe(t.level); // inside the tolerance: still this level
        expect(rate(t.atLeast * (1 - 1e-6)), where).toBe(t.level - 1); // just below: the level under it
      }
    }
  });

  it('rates the EN 397 striker on the EN 397 helmet spring at its 5.0 kN limit the same whatever the rounding', () => {
    const drop = assessDrop({ massKg: 5, heightM: 1, exposure: 'helmet' }); // EN 397: 5 kg from 1 m
    expect(Math.abs(drop.peakForceN - 5000)).toBeLessThan(1e-6); // the preset spring passes through the EN 397 limit (5.0 kN)
    expect(drop.severity.level).toBe(4); // reaches 5.0 kN, EN 397 transmitted-force limit, however the last bit rounds
  });

  it('rates the ANSI/ISEA Z89.1 Type I striker on a helmet as Major (the EN 397 spring is stiffer than Z89.1 allows)', () => {
    const drop = assessDrop({ massKg: 3.6, heightM: (5.5 * 5.5) / (2 * G), exposure: 'helmet' }); // 3.6 kg at 5.5 m/s
    expect(drop.impactEnergyJ).toBeCloseTo(54.45, 9); // ½ × 3.6 × 5.5² (ANSI/ISEA Z89.1-2014 Type I striker)
    expect(drop.severity.level).toBe(4); // peak ≈ 5.27 kN ≥ 5.0 kN (EN 397 limit): the preset errs high for a Z89.1 helmet
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

  it('takes the highest level reached whatever the order of the table, and names the rule listed first on a tie', () => {
    const rule = (level: 2 | 3 | 4 | 5, quantity: 'energy' | 'force', atLeast: number, reference: string) =>
      ({ level, quantity, atLeast, reference, source: 'an organisation\'s own bands (test data)' }) as const;
    const shuffled: SeverityTable = {
      'bare-head': [rule(2, 'energy', 1, 'two by energy'), rule(4, 'force', 100, 'four by force'), rule(3, 'energy', 5, 'three by energy'), rule(4, 'energy', 10, 'four by energy')],
      helmet: [],
    };
    expect(rateSeverity(6, 50, 'bare-head', shuffled).basis).toMatch(/three by energy/);
    expect(rateSeverity(20, 50, 'bare-head', shuffled).basis).toMatch(/four by energy/);
    expect(rateSeverity(20, 200, 'bare-head', shuffled).basis).toMatch(/four by force/); // both level 4: the force rule is listed first
    expect(rateSeverity(0.5, 50, 'bare-head', shuffled).level).toBe(1);
    expect(rateSeverity(100, 1e6, 'helmet', shuffled).level).toBe(1); // an empty list rates everything 1
  });

  it('words the basis when read and carries it in JSON and in a plain copy', () => {
    const s = rateSeverity(80, 0, 'bare-head');
    expect(JSON.parse(JSON.stringify(s))).toEqual({ level: 5, label: 'Catastrophic', basis: s.basis }); // 80 J ≥ 68.5 J (Yoganandan et al. 1995)
    expect(plainSeverity(s)).toEqual({ level: 5, label: 'Catastrophic', basis: s.basis });
    expect(s.basis).toMatch(/^Impact energy 80 J reaches 68\.5 J/);
  });
});
