import { describe, expect, it } from 'vitest';
import { CONTROLS } from './control-check.schema.js';
import { CONTROL_CRITERIA, controlCriterion } from './control-criteria.js';
import { outcomePrompts, outcomeWords } from './inspection-outcome.js';
import { InspectionFinishSchema } from './inspection.schema.js';

const report = {
  reportFor: 'Client Ltd',
  location: 'Quayside, scaffold A',
  equipment: 'Independent tied scaffold',
  mattersGivingRisk: 'None',
  actionTaken: 'None',
  furtherAction: 'None',
  reporterName: 'Ann Inspector',
  reporterPosition: 'Scaffold inspector',
};

describe('inspection outcome', () => {
  it('needs the restriction in words when the scaffold is limited', () => {
    const res = InspectionFinishSchema.safeParse({ ...report, tagStatus: 'limited', restriction: '  ', accessTagsChanged: true });
    expect(res.success).toBe(false);
    expect(res.error?.issues.map((i) => i.path.join('.'))).toEqual(['restriction']);
    expect(InspectionFinishSchema.safeParse({ ...report, tagStatus: 'limited', restriction: 'Lifts 1-2 only, 1.5 kN/m²', accessTagsChanged: true }).success).toBe(true);
  });

  it('needs the answer about the access-point tags once a status is given', () => {
    const res = InspectionFinishSchema.safeParse({ ...report, tagStatus: 'cleared' });
    expect(res.error?.issues.map((i) => i.path.join('.'))).toEqual(['accessTagsChanged']);
  });

  it('still accepts a finish queued before the outcome was asked for, recording none', () => {
    const res = InspectionFinishSchema.parse(report);
    expect(res).toMatchObject({ tagStatus: null, restriction: '', accessTagsChanged: null });
    expect(outcomeWords(res)).toEqual({ status: 'Not recorded', restriction: null, tags: 'Not recorded' });
  });

  it('prompts for limited or closed when a High finding is open on a scaffold recorded cleared', () => {
    expect(outcomePrompts({ tagStatus: 'cleared', accessTagsChanged: true }, 1).map((p) => p.code)).toEqual(['open-high-on-cleared']);
    expect(outcomePrompts({ tagStatus: 'cleared', accessTagsChanged: true }, 2)[0].message).toMatch(/^2 High findings are still open/);
    expect(outcomePrompts({ tagStatus: 'limited', accessTagsChanged: true }, 1)).toEqual([]);
    expect(outcomePrompts({ tagStatus: 'cleared', accessTagsChanged: true }, 0)).toEqual([]);
    expect(outcomePrompts({ tagStatus: 'closed', accessTagsChanged: false }, 0).map((p) => p.code)).toEqual(['tags-not-changed']);
  });
});

describe('control criteria', () => {
  it('gives every control a criterion and a source in both jurisdictions', () => {
    for (const control of CONTROLS) {
      for (const jurisdiction of ['uk', 'us'] as const) {
        const c = CONTROL_CRITERIA[control][jurisdiction];
        expect(c.criterion.length, `${control} ${jurisdiction}`).toBeGreaterThan(10);
        expect(c.source, `${control} ${jurisdiction}`).toMatch(jurisdiction === 'uk' ? /^UK WAHR 2005/ : /^US OSHA 29 CFR/);
      }
    }
  });

  it('asks for toe boards of 150 mm in UK practice and 3.5 in under OSHA 29 CFR 1926.451(h)(4)', () => {
    expect(controlCriterion('toe-boards', 'uk').criterion).toContain('150 mm');
    expect(controlCriterion('toe-boards', 'us')).toMatchObject({ source: 'US OSHA 29 CFR 1926.451(h)(4)' });
    expect(controlCriterion('toe-boards', 'us').criterion).toContain('3.5 in');
  });

  it('names reg. 10 for chutes (nothing thrown or tipped) and 1926.451(h) for gates and mesh', () => {
    expect(controlCriterion('chutes-and-lowering', 'uk')).toMatchObject({ source: 'UK WAHR 2005 reg. 10' });
    expect(controlCriterion('chutes-and-lowering', 'uk').criterion).toContain('nothing is thrown or tipped');
    expect(controlCriterion('loading-bay-gates', 'us').source).toBe('US OSHA 29 CFR 1926.451(h)');
    expect(controlCriterion('guardrail-mesh', 'us').source).toBe('US OSHA 29 CFR 1926.451(h)');
    expect(controlCriterion('exclusion-zone-barriers', 'uk').source).toBe('UK WAHR 2005 reg. 11');
  });
});
