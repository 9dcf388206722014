/**
 * What-ifs of the calculator: the same item and place with one control applied, to show what
 * each buys. Each is a full estimate with the shared code; nothing here is a rule of its own.
 */
import type { FindingEstimateInput, FindingEstimateResult } from '@plummet/shared';
import { tryEstimate } from '../findings/finding-record';

export type ScenarioId = 'now' | 'tethered' | 'moved-back' | 'lowered' | 'all';

export interface Scenario {
  id: ScenarioId;
  label: string;
  input: FindingEstimateInput;
  result?: FindingEstimateResult;
}

/** The lowest drop the calculator will consider after lowering, m (an item on the ground cannot fall). */
export const MIN_LOWERED_HEIGHT_M = 0.1;

export function whatIfs(base: FindingEstimateInput, lowerByM: number, loweredLabel: string): Scenario[] {
  const loweredHeight = Math.max(MIN_LOWERED_HEIGHT_M, base.heightM - Math.max(0, lowerByM));
  const tethered = { ...base.likelihoodAnswers, securing: 'secured' as const };
  const movedBack = { ...base.likelihoodAnswers, edgeDistance: 'away' as const };
  const scenarios: Omit<Scenario, 'result'>[] = [
    { id: 'now', label: 'As it is now', input: base },
    { id: 'tethered', label: 'Tethered or tied', input: { ...base, likelihoodAnswers: tethered } },
    { id: 'moved-back', label: 'Moved more than 1 m back from the edge', input: { ...base, likelihoodAnswers: movedBack } },
    { id: 'lowered', label: loweredLabel, input: { ...base, heightM: loweredHeight } },
    {
      id: 'all',
      label: 'All three',
      input: { ...base, heightM: loweredHeight, likelihoodAnswers: { ...base.likelihoodAnswers, securing: 'secured', edgeDistance: 'away' } },
    },
  ];
  return scenarios.map((scenario) => ({ ...scenario, result: tryEstimate(scenario.input).result }));
}

/** "High 16 → Medium 8 (score −8)", "no change", for a scenario against the current state. */
export function describeChange(now: FindingEstimateResult | undefined, scenario: FindingEstimateResult | undefined): string {
  if (!now || !scenario) return '';
  const delta = scenario.riskScore - now.riskScore;
  if (delta === 0) return 'No change in risk score';
  const band = scenario.riskBand === now.riskBand ? `still ${scenario.riskBand}` : `${now.riskBand} → ${scenario.riskBand}`;
  return `${delta < 0 ? 'Lower' : 'Higher'} by ${Math.abs(delta)} (${band})`;
}
