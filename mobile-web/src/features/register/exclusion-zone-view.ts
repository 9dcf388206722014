import { LIMITS, type ExclusionZone, type ExclusionZonePut } from '@plummet/shared';
import { formatQuantity, formatWind, parseQuantity, parseWind, windUnitLabel, unitLabel, type Units, type WindUnits } from '../../lib/units';

export interface ZoneRuleLine {
  label: string;
  /** The width in the user's units, or words when the rule sets no figure. */
  width: string;
  source: string;
}

export interface ZoneView {
  title: string;
  facts: [label: string, value: string][];
  /** Null until an item and a wind speed are set. */
  suggestion: {
    width: string;
    parts: string[];
    rules: ZoneRuleLine[];
  } | null;
  /** What is still needed for a suggestion, in words; null when there is one. */
  missing: string | null;
  barriered: string;
  /** How the barriered width compares with the suggestion; null when either is missing. */
  comparison: { words: string; short: boolean } | null;
}

/** The card's words for one elevation's exclusion zone, in the user's units. */
export function describeExclusionZone(zone: ExclusionZone, units: Units, windUnits: WindUnits): ZoneView {
  const height = formatQuantity('height', zone.topWorkingHeightM, units);
  const item = zone.heaviestItem ? `${zone.heaviestItem.name} (${formatQuantity('mass', zone.heaviestItem.massKg, units)})` : 'Not chosen yet';
  const wind = zone.limitingWindMps === null ? 'Not set yet' : formatWind(zone.limitingWindMps, windUnits);
  const s = zone.suggestion;
  const missing = [zone.heaviestItem ? null : 'the heaviest item', zone.limitingWindMps === null ? 'the limiting wind speed' : null].filter((x) => x !== null);
  const barrieredM = zone.barrieredWidthM;
  let comparison: ZoneView['comparison'] = null;
  if (s && barrieredM !== null) {
    const gap = s.suggestedWidthM - barrieredM;
    comparison =
      gap > 0.05
        ? { words: `${formatQuantity('distance', gap, units)} narrower than suggested`, short: true }
        : { words: 'As wide as suggested, or wider', short: false };
  }
  return {
    title: `Below elevation ${zone.elevation}`,
    facts: [
      ['Top working height', height],
      ['Heaviest item handled there', item],
      ['Limiting wind (work stops above it)', wind],
    ],
    suggestion: s
      ? {
          width: formatQuantity('distance', s.suggestedWidthM, units),
          parts: [
            `Wind drift of the item falling ${height} in ${wind}: ${formatQuantity('distance', s.driftM, units)}`,
            `Allowance for bouncing and scattering on landing: ${formatQuantity('distance', s.bounceAllowanceM, units)} (common practice, no source)`,
          ],
          rules: s.rulesOfThumb.map((rule) => ({
            label: rule.label,
            width: rule.widthM === null ? 'No distance set' : formatQuantity('distance', rule.widthM, units),
            source: rule.source,
          })),
        }
      : null,
    missing: missing.length === 0 ? null : `Set ${missing.join(' and ')} to get a suggested width.`,
    barriered: barrieredM === null ? 'Not recorded yet' : formatQuantity('distance', barrieredM, units),
    comparison,
  };
}

export interface ZoneFormTexts {
  heaviestItemId: string | null;
  windText: string;
  widthText: string;
}

/** The form's text fields as typed, read into the PUT body (SI), with a problem per field. */
export function readZoneForm(
  form: ZoneFormTexts,
  units: Units,
  windUnits: WindUnits,
): { body: ExclusionZonePut | null; problems: { wind?: string; width?: string } } {
  const problems: { wind?: string; width?: string } = {};
  const wind = form.windText.trim() === '' ? null : parseWind(form.windText, windUnits);
  if (wind === undefined) problems.wind = `Enter a number in ${windUnitLabel(windUnits)}, or leave it empty.`;
  else if (wind !== null && (wind < 0 || wind > LIMITS.windMaxMps)) problems.wind = `Between 0 and ${formatWind(LIMITS.windMaxMps, windUnits)}.`;
  const width = form.widthText.trim() === '' ? null : parseQuantity('distance', form.widthText, units);
  if (width === undefined) problems.width = `Enter a number in ${unitLabel('distance', units)}, or leave it empty.`;
  else if (width !== null && (width < 0 || width > 100)) problems.width = `Between 0 and ${formatQuantity('distance', 100, units)}.`;
  if (problems.wind || problems.width) return { body: null, problems };
  return { body: { heaviestItemId: form.heaviestItemId, limitingWindMps: wind ?? null, barrieredWidthM: width ?? null }, problems };
}
