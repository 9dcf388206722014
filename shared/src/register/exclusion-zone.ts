/**
 * The exclusion zone below one elevation: a suggested width from the top working height and the
 * heaviest item handled there, shown beside height-based rules of thumb, with their sources.
 *
 * suggested width = wind drift of the item falling from the top working height at the site's
 * limiting wind speed (the shared drift integration) + a bounce allowance for items that bounce,
 * roll or scatter on landing (common practice, no source).
 *
 * The zone depends only on the height, the item and the wind: it does not shrink as findings are
 * fixed, since work above still drops things.
 */
import { CAUTION_TEXT } from '../caution.js';
import { assessDrop } from '../physics/assess.js';
import type { ShapeSpec } from '../physics/shape.js';

/** Added to the drift for bouncing and scattering on landing, m (common practice, no source). */
export const BOUNCE_ALLOWANCE_M = 2;

export interface ExclusionZoneInput {
  /** Height of the highest working platform of the elevation above the ground, m (> 0). */
  topWorkingHeightM: number;
  /** The heaviest item handled at that elevation, from the catalogue. */
  item: { name: string; massKg: number; shape?: ShapeSpec };
  /** Wind speed up to which the site works at height, m/s (≥ 0). */
  limitingWindMps: number;
}

export interface ZoneRuleOfThumb {
  label: string;
  /** Width out from the face, m; null when the rule sets no figure. */
  widthM: number | null;
  source: string;
}

export interface ExclusionZoneSuggestion {
  /** Horizontal distance the wind carries the item before it lands, m. */
  driftM: number;
  bounceAllowanceM: number;
  /** driftM + bounceAllowanceM, m. */
  suggestedWidthM: number;
  rulesOfThumb: ZoneRuleOfThumb[];
  /** How the suggestion was made, in words. */
  basis: string;
  caution: string;
}

export function suggestExclusionZone(input: ExclusionZoneInput): ExclusionZoneSuggestion {
  const h = input.topWorkingHeightM;
  const drop = assessDrop({ massKg: input.item.massKg, heightM: h, shape: input.item.shape, windSpeedMps: input.limitingWindMps });
  const driftM = drop.driftM;
  const suggestedWidthM = driftM + BOUNCE_ALLOWANCE_M;
  return {
    driftM,
    bounceAllowanceM: BOUNCE_ALLOWANCE_M,
    suggestedWidthM,
    rulesOfThumb: [
      {
        label: 'Barrier and covered walkway within a quarter of the height',
        widthM: h / 4,
        source: 'IBC 2021 Table 3306.1 (protection of pedestrians; fractions recalled from memory)',
      },
      {
        label: 'Barrier within half of the height',
        widthM: h / 2,
        source: 'IBC 2021 Table 3306.1 (protection of pedestrians; fractions recalled from memory)',
      },
      {
        label: 'Danger areas where objects may fall: marked, and nobody enters while work goes on above',
        widthM: null,
        source: 'UK WAHR 2005 reg. 11 (sets no distance)',
      },
    ],
    basis:
      `${input.item.name} (${input.item.massKg} kg) falling ${h} m in a steady ${input.limitingWindMps} m/s wind drifts ${driftM.toFixed(1)} m; ` +
      `plus ${BOUNCE_ALLOWANCE_M} m for bouncing and scattering on landing (common practice, no source).`,
    caution: CAUTION_TEXT,
  };
}
