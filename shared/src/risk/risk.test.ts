import { describe, expect, it } from 'vitest';
import { LIKELIHOOD_QUESTIONS, LIKELIHOOD_RULES, likelihoodFromAnswers, type LikelihoodAnswers } from './likelihood.js';
import { LIKELIHOOD_LABELS, RISK_BANDS, RiskInputError, riskScore, type LikelihoodLevel } from './risk-score.js';
import type { SeverityLevel } from './severity-table.js';

const levels = [1, 2, 3, 4, 5] as const;

describe('riskScore', () => {
  it('multiplies severity by likelihood into the bands Low 1–4, Medium 5–10, High 12–25', () => {
    expect(riskScore(1, 4)).toEqual({ score: 4, band: 'Low' }); // product brief: Low 1–4
    expect(riskScore(5, 1)).toEqual({ score: 5, band: 'Medium' }); // product brief: Medium 5–10
    expect(riskScore(2, 5)).toEqual({ score: 10, band: 'Medium' }); // product brief: Medium 5–10
    expect(riskScore(3, 4)).toEqual({ score: 12, band: 'High' }); // product brief: High 12–25
    expect(riskScore(5, 5)).toEqual({ score: 25, band: 'High' }); // product brief: High 12–25
  });

  it('bands every product of the 5 × 5 matrix as the product brief lists them', () => {
    // Product brief: Low 1–4, Medium 5–10, High 12–25 (11 cannot occur as a product of 1–5).
    const low = [1, 2, 3, 4];
    const medium = [5, 6, 8, 9, 10];
    const high = [12, 15, 16, 20, 25];
    for (const s of levels) {
      for (const l of levels) {
        const { score, band } = riskScore(s as SeverityLevel, l as LikelihoodLevel);
        expect(score).toBe(s * l);
        const expected = low.includes(score) ? 'Low' : medium.includes(score) ? 'Medium' : high.includes(score) ? 'High' : 'none';
        expect(band, `${s} × ${l}`).toBe(expected);
      }
    }
    expect(RISK_BANDS.map((b) => [b.band, b.min, b.max])).toEqual([['Low', 1, 4], ['Medium', 5, 10], ['High', 12, 25]]); // product brief
  });

  it('rejects levels outside 1–5 with a typed error naming the field', () => {
    expect(() => riskScore(0 as SeverityLevel, 3)).toThrow(RiskInputError);
    expect(() => riskScore(3, 2.5 as LikelihoodLevel)).toThrow(expect.objectContaining({ field: 'likelihood', code: 'not-a-level' }));
  });
});

describe('likelihoodFromAnswers', () => {
  const base: LikelihoodAnswers = { securing: 'secured', edgeDistance: 'away', activity: 'none', wind: 'calm', footTraffic: 'occasional' };

  it('rates a secured item well back from the edge as Rare', () => {
    expect(likelihoodFromAnswers(base).level).toBe(1); // rules as data, common practice, no source
  });

  it('rates a loose item at the edge during heavy work in strong wind over a walkway as Almost certain', () => {
    const worst = likelihoodFromAnswers({ securing: 'loose', edgeDistance: 'at-edge', activity: 'heavy', wind: 'strong', footTraffic: 'frequent' });
    expect(worst.level).toBe(5); // 1 + 2 + 1 + 1 + 1 + 1, capped at 5 (rules as data, common practice, no source)
    expect(worst.label).toBe('Almost certain'); // product brief likelihood words
    expect(worst.reasons).toHaveLength(5);
  });

  it('rates a loose item near the edge as Possible and at the edge as Likely', () => {
    expect(likelihoodFromAnswers({ ...base, securing: 'loose', edgeDistance: 'near-edge' }).level).toBe(3); // 1 + 2
    expect(likelihoodFromAnswers({ ...base, securing: 'loose', edgeDistance: 'at-edge' }).level).toBe(4); // 1 + 2 + 1
  });

  it('caps at Rare when the zone below is closed', () => {
    const closed = likelihoodFromAnswers({ securing: 'loose', edgeDistance: 'at-edge', activity: 'heavy', wind: 'strong', footTraffic: 'none' });
    expect(closed.level).toBe(1); // 'zone closed' caps at Rare (rules as data, common practice, no source)
    expect(closed.reasons.at(-1)).toMatch(/zone/);
  });

  it('writes its rules and questions as data, each rule with a source and every answer of every rule a real option', () => {
    for (const rule of LIKELIHOOD_RULES) {
      expect(rule.source.length).toBeGreaterThan(5);
      const question = LIKELIHOOD_QUESTIONS.find((q) => q.id === rule.question);
      expect(question?.answers.map((a) => a.id)).toContain(rule.answer);
    }
    expect(Object.values(LIKELIHOOD_LABELS)).toEqual(['Rare', 'Unlikely', 'Possible', 'Likely', 'Almost certain']); // product brief
  });

  it('names the question of an unknown answer', () => {
    expect(() => likelihoodFromAnswers({ ...base, wind: 'gale' as never })).toThrow(RiskInputError);
    expect(() => likelihoodFromAnswers({ ...base, footTraffic: undefined as never })).toThrow(
      expect.objectContaining({ field: 'footTraffic', code: 'not-an-option' }),
    );
  });
});
