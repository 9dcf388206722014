/**
 * The estimate of a finding, computed the same way on the phone and on the server (which always
 * recomputes it and never stores a client's figure): the shared drop physics for the item and
 * height, its severity for who is below, the likelihood from the inspector's answers, and the
 * risk score.
 */
import { assessDrop } from '../physics/assess.js';
import type { AssessOptions, DropAssessment } from '../physics/drop.types.js';
import type { Exposure } from '../physics/exposure.js';
import type { ShapeSpec } from '../physics/shape.js';
import { likelihoodFromAnswers, type LikelihoodAnswers } from '../risk/likelihood.js';
import { riskScore, type RiskBand } from '../risk/risk-score.js';
import { plainSeverity } from '../risk/severity.js';

export const FINDING_EXPOSURES = ['public', 'hard-hats', 'zone-closed'] as const;
export type FindingExposure = (typeof FINDING_EXPOSURES)[number];

/**
 * Whose head the severity is rated for. A closed zone is rated as a bare head, the worst case: a
 * barrier changes how likely a strike is (the foot-traffic answer), not what the item does to a
 * head when someone is there anyway.
 */
export const PHYSICS_EXPOSURE: Readonly<Record<FindingExposure, Exposure>> = {
  public: 'bare-head',
  'hard-hats': 'helmet',
  'zone-closed': 'bare-head',
};

export interface FindingEstimateInput {
  /** kg */
  massKg: number;
  /** m, from the item down to the struck level */
  heightM: number;
  /** null: no drag at all (vacuum), the worst case */
  shape: ShapeSpec | null;
  exposure: FindingExposure;
  likelihoodAnswers: LikelihoodAnswers;
  /** Steady wind at the time of the inspection, m/s, for the drift; none when unknown. */
  windSpeedMps?: number | null;
}

/** The stored estimate: the drop assessment made JSON-safe (terminal speed null when unbounded) plus the likelihood. */
export interface FindingEstimate extends Omit<DropAssessment, 'terminalVelocityMps'> {
  /** m/s; null when there is no drag (the speed has no bound). */
  terminalVelocityMps: number | null;
  likelihood: { level: number; label: string; reasons: readonly string[] };
}

export interface FindingEstimateResult {
  estimate: FindingEstimate;
  severity: number;
  likelihood: number;
  riskScore: number;
  riskBand: RiskBand;
}

/** Throws the physics' DropInputError or the risk's RiskInputError (each naming the field) for invalid input. */
export function estimateFinding(input: FindingEstimateInput, options?: AssessOptions): FindingEstimateResult {
  const drop = assessDrop(
    {
      massKg: input.massKg,
      heightM: input.heightM,
      ...(input.shape ? { shape: input.shape } : {}),
      ...(input.windSpeedMps != null && input.windSpeedMps > 0 ? { windSpeedMps: input.windSpeedMps } : {}),
      exposure: PHYSICS_EXPOSURE[input.exposure],
    },
    options,
  );
  const likelihood = likelihoodFromAnswers(input.likelihoodAnswers);
  const risk = riskScore(drop.severity.level, likelihood.level);
  return {
    estimate: {
      ...drop,
      // A plain copy: the estimate is stored (IndexedDB, PostgreSQL) and sent as JSON.
      severity: plainSeverity(drop.severity),
      terminalVelocityMps: Number.isFinite(drop.terminalVelocityMps) ? drop.terminalVelocityMps : null,
      likelihood: { level: likelihood.level, label: likelihood.label, reasons: likelihood.reasons },
    },
    severity: drop.severity.level,
    likelihood: likelihood.level,
    riskScore: risk.score,
    riskBand: risk.band,
  };
}
