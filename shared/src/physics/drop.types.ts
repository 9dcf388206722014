/**
 * The contract of a fall estimate. Inputs and outputs are plain numbers in SI units, the
 * unit named in each field; the branded types of ../units are for the functions underneath.
 */
import type { Pulse, ItemHardness } from './contact.js';
import type { Exposure } from './exposure.js';
import type { ShapeSpec } from './shape.js';
import type { Severity } from '../risk/severity.js';
import type { SeverityTable } from '../risk/severity-table.js';

/** How the item meets what it strikes. Give a duration or a stopping distance, or let a preset decide. */
export interface ContactInput {
  /** Contact duration, s (> 0). Mean force = m v / Δt. */
  durationS?: number;
  /** Stopping distance, m (> 0). Mean force = E / d. */
  stoppingDistanceM?: number;
  /** Pulse shape for the peak force; default half-sine. */
  pulse?: Pulse;
  /** Picks the preset when neither duration nor distance is given; default hard (the higher force). */
  item?: ItemHardness;
}

export interface DropInput {
  /** Mass, kg (> 0). */
  massKg: number;
  /** Vertical distance from the item down to the struck level, m (> 0). */
  heightM: number;
  /** Vertical release speed, m/s: positive thrown downward, negative tossed upward; default 0. */
  initialVelocityMps?: number;
  /** Drag area Cd·A, m² (≥ 0); when absent it comes from `shape`; with neither, no drag (vacuum). */
  dragAreaM2?: number;
  /** Box, plate, cylinder, rod or sphere with dimensions (m) and orientation. */
  shape?: ShapeSpec;
  /** Air density, kg/m³; default 1.225 (ISA sea level, ICAO Doc 7488). */
  airDensityKgM3?: number;
  /** Gravity, m/s²; default 9.80665 (standard gravity). */
  gravityMps2?: number;
  /** Steady horizontal wind for drift, m/s (≥ 0); default 0. */
  windSpeedMps?: number;
  contact?: ContactInput;
  /** Who is struck; default bare head (the worst case). */
  exposure?: Exposure;
}

/** Options of an estimate that belong to the organisation rather than the item. */
export interface AssessOptions {
  /** The organisation's own severity thresholds; default DEFAULT_SEVERITY_TABLE. */
  severityTable?: SeverityTable;
}

/** Where the drag area came from. */
export type DragAreaSource = 'input' | 'shape' | 'none';

export interface ResolvedContact {
  /** Contact duration used, s. */
  durationS?: number;
  /** Stopping distance used, m. */
  stoppingDistanceM?: number;
  pulse: Pulse;
  /** Preset id when a preset supplied the duration or distance. */
  presetId?: string;
}

/** Every value the estimate used, with the defaults applied. */
export interface ResolvedDropInput {
  massKg: number;
  heightM: number;
  initialVelocityMps: number;
  dragAreaM2: number;
  dragAreaSource: DragAreaSource;
  airDensityKgM3: number;
  gravityMps2: number;
  windSpeedMps: number;
  exposure: Exposure;
  contact: ResolvedContact;
  /** Names of the input fields that took their default, e.g. ["airDensityKgM3", "contact"]. */
  defaultsApplied: readonly string[];
}

/** Which impact the headline figures and the severity use. */
export type GoverningImpact = 'still-air' | 'wind';

/**
 * The estimate. With a wind given, the item lands with a sideways speed from the wind as well as
 * its fall, and crosswind drag also slows its fall a little: both impacts are computed and the
 * headline figures (impact speed, energy, forces, severity) use the worse (faster) one, in line with
 * every other worst-case default. Without wind (or without drag) the two are the same.
 */
export interface DropAssessment {
  /** Terminal speed in still air, m/s; Infinity when Cd·A is 0. */
  terminalVelocityMps: number;
  /** Speed at the struck level of the governing impact (the higher of still air and over the ground in the wind), m/s. */
  impactVelocityMps: number;
  /** Speed at the struck level with no drag at all (the worst case), m/s. */
  vacuumImpactVelocityMps: number;
  /** Time from release to the struck level in still air (closed form; an upward toss includes its rise), s. */
  fallTimeS: number;
  /** Height of the apex above the release point for an upward toss, m; 0 otherwise. */
  riseM: number;
  /** m v² / 2 at impactVelocityMps, J. */
  impactEnergyJ: number;
  /** From the contact duration (m v / Δt) or stopping distance (E / d) at impactVelocityMps, N. */
  meanForceN: number;
  /** Mean × pulse factor (rectangular 1, half-sine π/2, triangular 2), N. */
  peakForceN: number;
  /** Horizontal distance carried by the wind before the struck level, m; 0 without wind. */
  driftM: number;
  /** 'wind' when the ground speed in the wind is the higher, else 'still-air'. */
  governingImpact: GoverningImpact;
  /** Speed at the struck level in still air (closed form), m/s. */
  stillAirImpactVelocityMps: number;
  /** m v² / 2 at the still-air speed, J. */
  stillAirImpactEnergyJ: number;
  /** Peak force at the still-air speed, N. */
  stillAirPeakForceN: number;
  /**
   * Ground speed at the struck level in the wind (from the drift integration: the sideways speed
   * the wind gave the item and its vertical speed), m/s; equal to the still-air speed without wind.
   */
  windImpactVelocityMps: number;
  /** m v² / 2 at the ground speed in the wind, J. */
  windImpactEnergyJ: number;
  /** Peak force at the ground speed in the wind (same contact), N. */
  windPeakForceN: number;
  severity: Severity;
  resolved: ResolvedDropInput;
}
