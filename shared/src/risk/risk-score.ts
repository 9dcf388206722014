/**
 * Risk score = severity × likelihood on the generic 5 × 5 risk matrix, with the bands the product
 * uses: Low 1–4, Medium 5–10, High 12–25 (product brief; 11 cannot occur as a product of 1–5).
 */
import type { SeverityLevel } from './severity-table.js';

export type LikelihoodLevel = 1 | 2 | 3 | 4 | 5;

export const LIKELIHOOD_LABELS: Readonly<Record<LikelihoodLevel, string>> = {
  1: 'Rare',
  2: 'Unlikely',
  3: 'Possible',
  4: 'Likely',
  5: 'Almost certain',
};

export type RiskBand = 'Low' | 'Medium' | 'High';

export interface RiskBandRule {
  readonly band: RiskBand;
  readonly min: number;
  readonly max: number;
  readonly source: string;
}

export const RISK_BANDS: readonly RiskBandRule[] = [
  { band: 'Low', min: 1, max: 4, source: "Plummet's default bands (an organisation may set its own)" },
  { band: 'Medium', min: 5, max: 10, source: "Plummet's default bands (an organisation may set its own)" },
  { band: 'High', min: 12, max: 25, source: "Plummet's default bands (an organisation may set its own)" },
];

export interface RiskScore {
  readonly score: number;
  readonly band: RiskBand;
}

/** Invalid answers or levels given to the risk helpers; `field` names the input at fault. */
export class RiskInputError extends Error {
  constructor(
    readonly field: string,
    readonly code: 'not-a-level' | 'not-an-option',
    message: string,
  ) {
    super(message);
    this.name = 'RiskInputError';
  }
}

const isLevel = (value: unknown): value is 1 | 2 | 3 | 4 | 5 =>
  value === 1 || value === 2 || value === 3 || value === 4 || value === 5;

/** Score 1–25 and band for a severity 1–5 and a likelihood 1–5. */
export function riskScore(severity: SeverityLevel, likelihood: LikelihoodLevel): RiskScore {
  if (!isLevel(severity)) throw new RiskInputError('severity', 'not-a-level', 'Severity must be a whole number from 1 to 5.');
  if (!isLevel(likelihood)) throw new RiskInputError('likelihood', 'not-a-level', 'Likelihood must be a whole number from 1 to 5.');
  const score = severity * likelihood;
  return { score, band: score <= 4 ? 'Low' : score <= 10 ? 'Medium' : 'High' };
}
