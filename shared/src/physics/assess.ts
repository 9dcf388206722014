/**
 * assessDrop: the fall estimate behind every finding. Still-air values come from closed forms;
 * drift is integrated only when there is wind and drag, and then the faster of the still-air impact
 * and the impact over the ground in the wind governs. The still-air path allocates only the result
 * objects it returns.
 */
import { rateSeverity } from '../risk/severity.js';
import { ISA_SEA_LEVEL_AIR_DENSITY, STANDARD_GRAVITY } from './constants.js';
import { contactPreset, meanImpactForce, PULSE_FACTORS, springContactDuration, type ContactPreset, type Pulse } from './contact.js';
import { dragAreaFromShape } from './drag.js';
import { integrateDrift } from './drift.js';
import type { AssessOptions, DragAreaSource, DropAssessment, DropInput } from './drop.types.js';
import type { Exposure } from './exposure.js';
import { stillAirFallInto, terminalVelocity, type StillAirFall } from './fall.js';
import { assertFiniteResult, DropInputError, firstDropInputIssue, validateDropInput } from './validation.js';

/** Input fields that can take a default, in the order of their bit in the defaults mask. */
const DEFAULTABLE = [
  'initialVelocityMps',
  'dragAreaM2',
  'airDensityKgM3',
  'gravityMps2',
  'windSpeedMps',
  'exposure',
  'contact',
  'contact.pulse',
  'contact.item',
  'shape.orientation',
] as const;
const defaultsCache: (readonly string[] | undefined)[] = [];

function defaultsFor(mask: number): readonly string[] {
  let names = defaultsCache[mask];
  if (names === undefined) {
    names = Object.freeze(DEFAULTABLE.filter((_, bit) => (mask & (1 << bit)) !== 0));
    defaultsCache[mask] = names;
  }
  return names;
}

const HALF_SINE_FACTOR = PULSE_FACTORS['half-sine'];
const scratch: StillAirFall = { speedMps: 0, timeS: 0, riseM: 0 };

/** Throws DropInputError (every issue, the first named in `field`) when the input is invalid. */
export function assertValidDropInput(input: DropInput): void {
  if (firstDropInputIssue(input) !== undefined) throw new DropInputError(validateDropInput(input));
}

/**
 * Impact speed, energy, forces, drift and severity of an item falling `heightM` metres.
 * SI units throughout (see DropInput). Throws DropInputError for invalid input; never returns NaN.
 */
export function assessDrop(input: DropInput, options?: AssessOptions): DropAssessment {
  assertValidDropInput(input);
  let mask = 0;
  const mass = input.massKg;
  const height = input.heightM;
  let v0 = input.initialVelocityMps;
  if (v0 == null) { v0 = 0; mask |= 1; }

  let dragArea: number;
  let dragAreaSource: DragAreaSource;
  if (input.dragAreaM2 != null) {
    dragArea = input.dragAreaM2;
    dragAreaSource = 'input';
  } else if (input.shape != null) {
    dragArea = dragAreaFromShape(input.shape);
    dragAreaSource = 'shape';
    if (input.shape.orientation == null) mask |= 512;
  } else {
    dragArea = 0;
    dragAreaSource = 'none';
    mask |= 2;
  }
  let rho = input.airDensityKgM3;
  if (rho == null) { rho = ISA_SEA_LEVEL_AIR_DENSITY; mask |= 4; }
  let g = input.gravityMps2;
  if (g == null) { g = STANDARD_GRAVITY; mask |= 8; }
  let wind = input.windSpeedMps;
  if (wind == null) { wind = 0; mask |= 16; }
  let exposure: Exposure | undefined = input.exposure;
  if (exposure == null) { exposure = 'bare-head'; mask |= 32; }

  const vt = terminalVelocity(mass, dragArea, rho, g);
  const fall = stillAirFallInto(scratch, height, v0, vt, g);
  const stillSpeed = fall.speedMps;
  const fallTime = fall.timeS;
  const rise = fall.riseM;

  const contact = input.contact;
  let durationS: number | undefined;
  let stoppingDistanceM: number | undefined;
  let preset: ContactPreset | undefined;
  if (contact == null) mask |= 64;
  if (contact != null && (contact.durationS != null || contact.stoppingDistanceM != null)) {
    durationS = contact.durationS ?? undefined;
    stoppingDistanceM = contact.stoppingDistanceM ?? undefined;
  } else {
    const item = contact?.item;
    if (contact != null && item == null) mask |= 256;
    preset = contactPreset(item ?? 'hard', exposure);
    if (preset.model === 'spring') durationS = springContactDuration(mass, preset.stiffnessNPerM!);
    else stoppingDistanceM = preset.stoppingDistanceM;
  }
  let pulse: Pulse | undefined = contact?.pulse;
  if (pulse == null) {
    pulse = preset !== undefined ? preset.pulse : 'half-sine';
    if (contact != null) mask |= 128;
  }
  const pulseFactor = pulse === 'half-sine' ? HALF_SINE_FACTOR : PULSE_FACTORS[pulse];
  const stillEnergy = 0.5 * mass * stillSpeed * stillSpeed;
  const stillMean = meanImpactForce(mass, stillSpeed, stillEnergy, durationS, stoppingDistanceM);

  let drift = 0;
  let windSpeed = stillSpeed;
  let windEnergy = stillEnergy;
  let windMean = stillMean;
  if (wind > 0 && vt < Infinity) {
    const carried = integrateDrift(height, v0, vt, g, wind, fallTime);
    drift = carried.driftM;
    windSpeed = Math.hypot(carried.horizontalSpeedMps, carried.verticalSpeedMps);
    windEnergy = 0.5 * mass * windSpeed * windSpeed;
    windMean = meanImpactForce(mass, windSpeed, windEnergy, durationS, stoppingDistanceM);
  }
  // The worse impact governs: the faster one (energy and force both rise with speed for one contact).
  const byWind = windSpeed > stillSpeed;
  const speed = byWind ? windSpeed : stillSpeed;
  const energy = byWind ? windEnergy : stillEnergy;
  const meanForce = byWind ? windMean : stillMean;
  const peakForce = meanForce * pulseFactor;

  const vacuumSpeed = Math.sqrt(v0 * v0 + 2 * g * height);
  // One check on the sum covers the usual case (a NaN or infinity anywhere makes it non-finite).
  if (!Number.isFinite(vacuumSpeed + stillSpeed + fallTime + stillEnergy + stillMean + drift + windSpeed + windEnergy + windMean * pulseFactor)) {
    assertFiniteResult(vacuumSpeed, 'vacuumImpactVelocityMps');
    assertFiniteResult(stillSpeed, 'impactVelocityMps');
    assertFiniteResult(fallTime, 'fallTimeS');
    assertFiniteResult(stillEnergy, 'impactEnergyJ');
    assertFiniteResult(stillMean * pulseFactor, 'peakForceN');
    assertFiniteResult(drift, 'driftM');
    assertFiniteResult(windSpeed, 'windImpactVelocityMps');
    assertFiniteResult(windEnergy, 'windImpactEnergyJ');
    assertFiniteResult(windMean * pulseFactor, 'windPeakForceN');
  }

  return {
    terminalVelocityMps: vt,
    impactVelocityMps: speed,
    vacuumImpactVelocityMps: vacuumSpeed,
    fallTimeS: fallTime,
    riseM: rise,
    impactEnergyJ: energy,
    meanForceN: meanForce,
    peakForceN: peakForce,
    driftM: drift,
    governingImpact: byWind ? 'wind' : 'still-air',
    stillAirImpactVelocityMps: stillSpeed,
    stillAirImpactEnergyJ: stillEnergy,
    stillAirPeakForceN: stillMean * pulseFactor,
    windImpactVelocityMps: windSpeed,
    windImpactEnergyJ: windEnergy,
    windPeakForceN: windMean * pulseFactor,
    severity: rateSeverity(energy, peakForce, exposure, options?.severityTable),
    resolved: {
      massKg: mass,
      heightM: height,
      initialVelocityMps: v0,
      dragAreaM2: dragArea,
      dragAreaSource,
      airDensityKgM3: rho,
      gravityMps2: g,
      windSpeedMps: wind,
      exposure,
      contact: { durationS, stoppingDistanceM, pulse, presetId: preset?.id },
      defaultsApplied: defaultsFor(mask),
    },
  };
}
