/**
 * assessDrop: the drop estimate behind every finding. Still-air values come from closed forms;
 * drift is integrated only when there is wind and drag, and then the faster of the still-air impact
 * and the impact over the ground in the wind governs. The still-air path allocates only the result
 * objects it returns.
 */
import { rateSeverity } from '../risk/severity.js';
import { ISA_SEA_LEVEL_AIR_DENSITY, STANDARD_GRAVITY } from './constants.js';
import { contactPreset, meanImpactForce, PULSE_FACTORS, springContactDuration, type ContactPreset, type Pulse } from './contact.js';
import { dragAreaFromShape } from './drag.js';
import { integrateDrift } from './drift.js';
import type { AssessOptions, DragAreaSource, DropAssessment, DropInput, GoverningImpact, ResolvedContact, ResolvedDropInput } from './drop.types.js';
import type { Severity } from '../risk/severity.js';
import type { Exposure } from './exposure.js';
import { stillAirFallInto, type StillAirFall } from './fall.js';
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

/*
 * The result objects are built by constructors rather than object literals, and each shape is seeded
 * once with nulls when this module loads. V8 otherwise keeps a field that has only ever held numbers
 * as a "double" field, which needs a number box of its own in every new object; a seeded field is
 * tagged, so a zero needs no box and one box serves every field holding the same value. Measured
 * with `npm run bench:physics`: about a third of the still-air estimate's time. The objects carry
 * own data properties only, like literals (JSON, structured clone and spreads see every field).
 */

class Contact implements ResolvedContact {
  declare durationS: number | undefined;
  declare stoppingDistanceM: number | undefined;
  declare pulse: Pulse;
  declare presetId: string | undefined;

  constructor(durationS: number | undefined, stoppingDistanceM: number | undefined, pulse: Pulse, presetId: string | undefined) {
    this.durationS = durationS;
    this.stoppingDistanceM = stoppingDistanceM;
    this.pulse = pulse;
    this.presetId = presetId;
  }
}

class Resolved implements ResolvedDropInput {
  declare massKg: number;
  declare heightM: number;
  declare initialVelocityMps: number;
  declare dragAreaM2: number;
  declare dragAreaSource: DragAreaSource;
  declare airDensityKgM3: number;
  declare gravityMps2: number;
  declare windSpeedMps: number;
  declare exposure: Exposure;
  declare contact: ResolvedContact;
  declare defaultsApplied: readonly string[];

  constructor(
    massKg: number,
    heightM: number,
    initialVelocityMps: number,
    dragAreaM2: number,
    dragAreaSource: DragAreaSource,
    airDensityKgM3: number,
    gravityMps2: number,
    windSpeedMps: number,
    exposure: Exposure,
    contact: ResolvedContact,
    defaultsApplied: readonly string[],
  ) {
    this.massKg = massKg;
    this.heightM = heightM;
    this.initialVelocityMps = initialVelocityMps;
    this.dragAreaM2 = dragAreaM2;
    this.dragAreaSource = dragAreaSource;
    this.airDensityKgM3 = airDensityKgM3;
    this.gravityMps2 = gravityMps2;
    this.windSpeedMps = windSpeedMps;
    this.exposure = exposure;
    this.contact = contact;
    this.defaultsApplied = defaultsApplied;
  }
}

class Assessment implements DropAssessment {
  declare terminalVelocityMps: number;
  declare impactVelocityMps: number;
  declare vacuumImpactVelocityMps: number;
  declare fallTimeS: number;
  declare riseM: number;
  declare impactEnergyJ: number;
  declare meanForceN: number;
  declare peakForceN: number;
  declare driftM: number;
  declare governingImpact: GoverningImpact;
  declare stillAirImpactVelocityMps: number;
  declare stillAirImpactEnergyJ: number;
  declare stillAirPeakForceN: number;
  declare windImpactVelocityMps: number;
  declare windImpactEnergyJ: number;
  declare windPeakForceN: number;
  declare severity: Severity;
  declare resolved: ResolvedDropInput;

  constructor(
    terminalVelocityMps: number,
    impactVelocityMps: number,
    vacuumImpactVelocityMps: number,
    fallTimeS: number,
    riseM: number,
    impactEnergyJ: number,
    meanForceN: number,
    peakForceN: number,
    driftM: number,
    governingImpact: GoverningImpact,
    stillAirImpactVelocityMps: number,
    stillAirImpactEnergyJ: number,
    stillAirPeakForceN: number,
    windImpactVelocityMps: number,
    windImpactEnergyJ: number,
    windPeakForceN: number,
    severity: Severity,
    resolved: ResolvedDropInput,
  ) {
    this.terminalVelocityMps = terminalVelocityMps;
    this.impactVelocityMps = impactVelocityMps;
    this.vacuumImpactVelocityMps = vacuumImpactVelocityMps;
    this.fallTimeS = fallTimeS;
    this.riseM = riseM;
    this.impactEnergyJ = impactEnergyJ;
    this.meanForceN = meanForceN;
    this.peakForceN = peakForceN;
    this.driftM = driftM;
    this.governingImpact = governingImpact;
    this.stillAirImpactVelocityMps = stillAirImpactVelocityMps;
    this.stillAirImpactEnergyJ = stillAirImpactEnergyJ;
    this.stillAirPeakForceN = stillAirPeakForceN;
    this.windImpactVelocityMps = windImpactVelocityMps;
    this.windImpactEnergyJ = windImpactEnergyJ;
    this.windPeakForceN = windPeakForceN;
    this.severity = severity;
    this.resolved = resolved;
  }
}

// The seeds (see above): nulls in every field make each field tagged for good.
const seed = null as never;
new Contact(seed, seed, seed, seed);
new Resolved(seed, seed, seed, seed, seed, seed, seed, seed, seed, seed, seed);
new Assessment(seed, seed, seed, seed, seed, seed, seed, seed, seed, seed, seed, seed, seed, seed, seed, seed, seed, seed);

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

  // v_t = √(2 m g / (ρ Cd·A)) as terminalVelocity gives it, written out to keep this function small for the compiler.
  const resistance = rho * dragArea;
  const vt = resistance > 0 ? Math.sqrt((2 * mass * g) / resistance) : Infinity;
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

  const severity = rateSeverity(energy, peakForce, exposure, options?.severityTable);
  const resolvedContact = new Contact(durationS, stoppingDistanceM, pulse, preset?.id);
  const resolved = new Resolved(mass, height, v0, dragArea, dragAreaSource, rho, g, wind, exposure, resolvedContact, defaultsCache[mask] ?? defaultsFor(mask));
  return new Assessment(
    vt,
    speed,
    vacuumSpeed,
    fallTime,
    rise,
    energy,
    meanForce,
    peakForce,
    drift,
    byWind ? 'wind' : 'still-air',
    stillSpeed,
    stillEnergy,
    stillMean * pulseFactor,
    windSpeed,
    windEnergy,
    windMean * pulseFactor,
    severity,
    resolved,
  );
}
