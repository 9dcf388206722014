/**
 * "How this was computed": the formulas, inputs, defaults and sources of a fall estimate, as data
 * for a screen or a report to lay out (no wording of the UI beyond labels).
 */
import { CAUTION_TEXT } from '../caution.js';
import { DEFAULT_SOURCES } from './constants.js';
import { CONTACT_PRESETS } from './contact.js';
import { assessDrop } from './assess.js';
import type { AssessOptions, DropAssessment, DropInput } from './drop.types.js';

export interface FormulaDescription {
  readonly id: string;
  readonly name: string;
  /** Plain-text formula. */
  readonly expression: string;
  readonly appliesWhen: string;
  readonly source: string;
}

const TAYLOR = 'Closed form of dv/dt = g − k v², k = ρ Cd A / 2m (e.g. Taylor, Classical Mechanics, 2005, §2.4)';

export const DROP_FORMULAS: readonly FormulaDescription[] = [
  { id: 'terminal-velocity', name: 'Terminal speed', expression: 'v_t = √(2 m g / (ρ Cd·A))', appliesWhen: 'always (infinite without drag)', source: TAYLOR },
  { id: 'speed-from-rest', name: 'Impact speed from rest', expression: 'v = v_t √(1 − e^(−2 g h / v_t²))', appliesWhen: 'released at rest', source: TAYLOR },
  { id: 'speed-thrown-down', name: 'Impact speed, thrown down', expression: 'v² = v_t² + (v0² − v_t²) e^(−2 g h / v_t²)', appliesWhen: 'thrown downward, below or above terminal speed', source: TAYLOR },
  { id: 'rise', name: 'Rise of an upward toss', expression: 'H = (v_t² / 2g) ln(1 + u² / v_t²),  t_up = (v_t / g) atan(u / v_t)', appliesWhen: 'tossed upward at speed u; then it falls h + H from rest', source: TAYLOR },
  { id: 'fall-time', name: 'Fall time', expression: 't = h / v_t + (v_t / g) ln((v_t + v) / (v_t + v0))', appliesWhen: 'every downward leg (v0 = 0 from rest or from the apex)', source: TAYLOR },
  { id: 'vacuum', name: 'Worst case, no air', expression: 'v = √(v0² + 2 g h)', appliesWhen: 'shown beside every estimate', source: 'Energy conservation (free fall)' },
  { id: 'energy', name: 'Impact energy', expression: 'E = m v² / 2', appliesWhen: 'always', source: 'Kinetic energy' },
  { id: 'force-duration', name: 'Mean force from a contact time', expression: 'F = m v / Δt', appliesWhen: 'a contact duration is given or a spring preset applies; the item stops without bouncing', source: 'Impulse–momentum theorem' },
  { id: 'force-distance', name: 'Mean force from a stopping distance', expression: 'F = E / d', appliesWhen: 'a stopping distance is given or a soft-item preset applies', source: 'Work–energy theorem' },
  { id: 'spring-contact', name: 'Contact time of a spring stop', expression: 'Δt = (π/2) √(m / k)  (peak = v √(k m) with a half-sine)', appliesWhen: 'hard item on a bare head or helmet', source: 'Linear spring, quarter period; k from Yoganandan et al. 1995 or EN 397' },
  { id: 'peak-force', name: 'Peak force', expression: 'F_peak = F_mean × (1 rectangular, π/2 half-sine, 2 triangular)', appliesWhen: 'always', source: 'Peak-to-mean ratio of the pulse shape; half-sine as in shock testing (IEC 60068-2-27)' },
  { id: 'drift', name: 'Wind drift and ground speed', expression: 'dv/dt = g ŷ − k |v − w| (v − w), integrated to the struck level; ground speed |v| there', appliesWhen: 'wind speed > 0 and Cd·A > 0; the faster of this impact and the still-air one governs', source: 'Runge–Kutta 5(4), Dormand & Prince 1980, adaptive step; crossing by quintic Hermite interpolation' },
];

export const DROP_ASSUMPTIONS: readonly string[] = [
  'The item falls as a rigid body with a constant drag coefficient (subcritical Reynolds numbers); no lift from spin.',
  'Flat items can flutter, glide and swoop; their real path and speed differ from a steady fall. The tumbling average stands in for this.',
  'The item stops on impact without bouncing; a bounce would raise the impulse by up to a factor of two.',
  'Fall time in still air. With wind, the faster of the still-air impact and the impact over the ground sets the figures; drift and ground speed assume a steady uniform wind, no gusts, no updraughts along the facade.',
  'Air density and gravity at sea level unless given.',
];

export interface ExplainedInput {
  readonly field: string;
  readonly label: string;
  readonly value: number | string;
  readonly unit: string;
  readonly defaulted: boolean;
  readonly source?: string;
}

/** One impact of the estimate: in still air, or over the ground with the wind. */
export interface ExplainedImpact {
  readonly id: 'still-air' | 'wind';
  readonly label: string;
  /** m/s */
  readonly speedMps: number;
  /** J */
  readonly energyJ: number;
  /** N */
  readonly peakForceN: number;
  /** True for the impact the headline figures and the severity use (the faster). */
  readonly governs: boolean;
}

export interface DropExplanation {
  /** Still air always; over the ground with the wind when a wind carried the item. */
  readonly impacts: readonly ExplainedImpact[];
  /** Which impact governs, in words. */
  readonly governingReason: string;
  readonly formulas: readonly FormulaDescription[];
  readonly inputs: readonly ExplainedInput[];
  readonly assumptions: readonly string[];
  readonly contactPreset?: { readonly id: string; readonly reasoning: string; readonly source: string };
  readonly severityBasis: string;
  readonly caution: string;
}

/**
 * The formulas that applied to an estimate, every input with its unit, default and source, and the
 * caution. Pass the assessment already computed, or the input (it is assessed here).
 */
export function explainDrop(estimate: DropAssessment | DropInput, options?: AssessOptions): DropExplanation {
  const assessment = 'resolved' in estimate ? estimate : assessDrop(estimate, options);
  const r = assessment.resolved;
  const defaulted = (field: string) => r.defaultsApplied.includes(field);
  const v0 = r.initialVelocityMps;
  const applies = new Set(['terminal-velocity', 'fall-time', 'vacuum', 'energy', 'peak-force']);
  applies.add(v0 > 0 ? 'speed-thrown-down' : 'speed-from-rest');
  if (v0 < 0) applies.add('rise');
  if (r.contact.durationS !== undefined) applies.add('force-duration');
  if (r.contact.stoppingDistanceM !== undefined) applies.add('force-distance');
  const preset = CONTACT_PRESETS.find((p) => p.id === r.contact.presetId);
  if (preset?.model === 'spring') applies.add('spring-contact');
  if (assessment.driftM > 0) applies.add('drift');

  const inputs: ExplainedInput[] = [
    { field: 'massKg', label: 'Mass', value: r.massKg, unit: 'kg', defaulted: false },
    { field: 'heightM', label: 'Height to the struck level', value: r.heightM, unit: 'm', defaulted: false },
    { field: 'initialVelocityMps', label: 'Release speed (down +, up −)', value: v0, unit: 'm/s', defaulted: defaulted('initialVelocityMps'), source: defaulted('initialVelocityMps') ? DEFAULT_SOURCES.initialVelocityMps : undefined },
    { field: 'dragAreaM2', label: 'Drag area Cd·A', value: r.dragAreaM2, unit: 'm²', defaulted: r.dragAreaSource === 'none', source: r.dragAreaSource === 'none' ? DEFAULT_SOURCES.dragAreaM2 : r.dragAreaSource === 'shape' ? 'From the shape and handbook Cd values (see docs/physics.md)' : 'Given' },
    { field: 'airDensityKgM3', label: 'Air density', value: r.airDensityKgM3, unit: 'kg/m³', defaulted: defaulted('airDensityKgM3'), source: defaulted('airDensityKgM3') ? DEFAULT_SOURCES.airDensityKgM3 : undefined },
    { field: 'gravityMps2', label: 'Gravity', value: r.gravityMps2, unit: 'm/s²', defaulted: defaulted('gravityMps2'), source: defaulted('gravityMps2') ? DEFAULT_SOURCES.gravityMps2 : undefined },
    { field: 'windSpeedMps', label: 'Wind speed', value: r.windSpeedMps, unit: 'm/s', defaulted: defaulted('windSpeedMps'), source: defaulted('windSpeedMps') ? DEFAULT_SOURCES.windSpeedMps : undefined },
    { field: 'exposure', label: 'Exposure below', value: r.exposure, unit: '', defaulted: defaulted('exposure'), source: defaulted('exposure') ? DEFAULT_SOURCES.exposure : undefined },
    { field: 'contact.pulse', label: 'Pulse shape', value: r.contact.pulse, unit: '', defaulted: defaulted('contact') || defaulted('contact.pulse') },
  ];
  if (r.contact.durationS !== undefined) inputs.push({ field: 'contact.durationS', label: 'Contact duration', value: r.contact.durationS, unit: 's', defaulted: preset !== undefined, source: preset?.source });
  if (r.contact.stoppingDistanceM !== undefined) inputs.push({ field: 'contact.stoppingDistanceM', label: 'Stopping distance', value: r.contact.stoppingDistanceM, unit: 'm', defaulted: preset !== undefined, source: preset?.source });

  const withWind = assessment.driftM > 0;
  const impacts: ExplainedImpact[] = [
    {
      id: 'still-air',
      label: 'In still air',
      speedMps: assessment.stillAirImpactVelocityMps,
      energyJ: assessment.stillAirImpactEnergyJ,
      peakForceN: assessment.stillAirPeakForceN,
      governs: assessment.governingImpact === 'still-air',
    },
  ];
  if (withWind) {
    impacts.push({
      id: 'wind',
      label: 'Over the ground with the wind',
      speedMps: assessment.windImpactVelocityMps,
      energyJ: assessment.windImpactEnergyJ,
      peakForceN: assessment.windPeakForceN,
      governs: assessment.governingImpact === 'wind',
    });
  }
  const governingReason = !withWind
    ? 'No wind carried the item: the still-air impact is the estimate.'
    : assessment.governingImpact === 'wind'
      ? 'The wind adds sideways speed, so the item lands faster over the ground than in still air: that impact, the worse, sets the figures and the severity.'
      : 'Crosswind drag slows the fall a little more than the wind adds sideways, so the still-air impact is the worse and sets the figures and the severity.';

  return {
    impacts,
    governingReason,
    formulas: DROP_FORMULAS.filter((f) => applies.has(f.id)),
    inputs,
    assumptions: DROP_ASSUMPTIONS,
    contactPreset: preset ? { id: preset.id, reasoning: preset.reasoning, source: preset.source } : undefined,
    severityBasis: assessment.severity.basis,
    caution: CAUTION_TEXT,
  };
}
