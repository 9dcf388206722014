/**
 * Likelihood 1–5 of a finding from the inspector's answers about the item. The questions and the
 * rules are data (shown on the "how this was computed" screen and tunable in one place). The rules
 * are common site practice: no published source fixes these steps.
 */
import { LIKELIHOOD_LABELS, RiskInputError, type LikelihoodLevel } from './risk-score.js';

export interface LikelihoodAnswers {
  /** Tied, tethered or fixed; in a closed container or behind a guard; or loose. */
  securing: 'secured' | 'contained' | 'loose';
  /** On or against the toe board (within about 0.3 m of the edge); within 1 m; further back. */
  edgeDistance: 'at-edge' | 'near-edge' | 'away';
  /** Work on this lift: none, light work, or handling materials, striking, dismantling, vibration. */
  activity: 'none' | 'light' | 'heavy';
  /** Calm (below Beaufort 4, < 5.5 m/s), breezy (Beaufort 4–5), strong (Beaufort 6 or more, ≥ 10.8 m/s). */
  wind: 'calm' | 'breezy' | 'strong';
  /** Below: nobody (zone closed off), occasional passers, frequent traffic (walkway, entrance, pavement). */
  footTraffic: 'none' | 'occasional' | 'frequent';
}

export type LikelihoodQuestion = keyof LikelihoodAnswers;

export interface LikelihoodQuestionSpec {
  readonly id: LikelihoodQuestion;
  readonly text: string;
  readonly answers: readonly { readonly id: string; readonly label: string }[];
}

export const LIKELIHOOD_QUESTIONS: readonly LikelihoodQuestionSpec[] = [
  { id: 'securing', text: 'Is the item secured?', answers: [
    { id: 'secured', label: 'Tied, tethered or fixed' },
    { id: 'contained', label: 'In a closed container or behind a guard' },
    { id: 'loose', label: 'Loose' },
  ] },
  { id: 'edgeDistance', text: 'How far is it from the open edge?', answers: [
    { id: 'at-edge', label: 'At the edge (on or against the toe board, within about 0.3 m)' },
    { id: 'near-edge', label: 'Within 1 m of the edge' },
    { id: 'away', label: 'More than 1 m back' },
  ] },
  { id: 'activity', text: 'What work goes on around it?', answers: [
    { id: 'none', label: 'None' },
    { id: 'light', label: 'Light work' },
    { id: 'heavy', label: 'Handling materials, striking, dismantling or vibration' },
  ] },
  { id: 'wind', text: 'How windy is it?', answers: [
    { id: 'calm', label: 'Calm or light air (below Beaufort 4, under 5.5 m/s)' },
    { id: 'breezy', label: 'Breezy (Beaufort 4–5, 5.5–10.7 m/s)' },
    { id: 'strong', label: 'Strong (Beaufort 6 or more, 10.8 m/s and above)' },
  ] },
  { id: 'footTraffic', text: 'Who passes below?', answers: [
    { id: 'none', label: 'Nobody: the zone below is closed off' },
    { id: 'occasional', label: 'Occasional passers' },
    { id: 'frequent', label: 'Frequent traffic: walkway, entrance or public pavement' },
  ] },
];

/** A rule: when the answer to `question` is `answer`, add `add` to the level, or cap it at `atMost`. */
export interface LikelihoodRule {
  readonly question: LikelihoodQuestion;
  readonly answer: string;
  readonly add?: number;
  readonly atMost?: LikelihoodLevel;
  readonly reason: string;
  readonly source: string;
}

const PRACTICE = 'common practice, no source';
const BEAUFORT = 'Beaufort wind scale (Met Office / WMO): force 4 from 5.5 m/s, force 6 "strong breeze" from 10.8 m/s (recalled from memory); the step itself is common practice, no source';

/** Start at 1 (Rare), apply every matching `add`, then every matching cap, and keep within 1–5. */
export const LIKELIHOOD_START: LikelihoodLevel = 1;

export const LIKELIHOOD_RULES: readonly LikelihoodRule[] = [
  { question: 'securing', answer: 'loose', add: 2, reason: 'A loose item can be knocked, kicked or blown off.', source: PRACTICE },
  { question: 'securing', answer: 'contained', add: 1, reason: 'A contained item can still fall with its container.', source: PRACTICE },
  { question: 'edgeDistance', answer: 'at-edge', add: 1, reason: 'At the edge a small knock is enough.', source: PRACTICE },
  { question: 'edgeDistance', answer: 'away', add: -1, reason: 'More than 1 m back it must travel to fall.', source: PRACTICE },
  { question: 'activity', answer: 'heavy', add: 1, reason: 'Handling, striking, dismantling or vibration moves items.', source: PRACTICE },
  { question: 'wind', answer: 'strong', add: 1, reason: 'A strong wind moves light and flat items.', source: BEAUFORT },
  { question: 'footTraffic', answer: 'frequent', add: 1, reason: 'Frequent traffic below makes a strike more likely.', source: PRACTICE },
  { question: 'footTraffic', answer: 'none', atMost: 1, reason: 'Nobody below while the zone stays closed.', source: PRACTICE },
];

export interface Likelihood {
  readonly level: LikelihoodLevel;
  readonly label: string;
  /** The reasons of the rules that applied, in order. */
  readonly reasons: readonly string[];
}

/** Likelihood 1–5 from the answers; throws RiskInputError naming the question with an unknown answer. */
export function likelihoodFromAnswers(answers: LikelihoodAnswers, rules: readonly LikelihoodRule[] = LIKELIHOOD_RULES): Likelihood {
  for (const question of LIKELIHOOD_QUESTIONS) {
    const given = (answers as unknown as Record<string, unknown> | undefined)?.[question.id];
    if (!question.answers.some((a) => a.id === given)) {
      throw new RiskInputError(question.id, 'not-an-option', `${question.text} Answer one of: ${question.answers.map((a) => a.id).join(', ')}.`);
    }
  }
  let level: number = LIKELIHOOD_START;
  let cap = 5;
  const reasons: string[] = [];
  for (const rule of rules) {
    if (answers[rule.question] !== rule.answer) continue;
    if (rule.add !== undefined) level += rule.add;
    if (rule.atMost !== undefined) cap = Math.min(cap, rule.atMost);
    reasons.push(rule.reason);
  }
  const final = Math.max(1, Math.min(cap, level)) as LikelihoodLevel;
  return { level: final, label: LIKELIHOOD_LABELS[final], reasons };
}
