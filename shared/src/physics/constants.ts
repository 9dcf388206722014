/**
 * Default conditions of a fall estimate, each with its source.
 */
import type { KilogramsPerCubicMetre, MetresPerSecondSquared } from '../units/quantities.js';

/** Standard acceleration of gravity, 9.80665 m/s² (3rd CGPM, 1901; NIST SP 811 App. B). */
export const STANDARD_GRAVITY = 9.80665 as MetresPerSecondSquared;

/** Air density of the ICAO Standard Atmosphere at mean sea level, 1.225 kg/m³ (ICAO Doc 7488/3). */
export const ISA_SEA_LEVEL_AIR_DENSITY = 1.225 as KilogramsPerCubicMetre;

/** Where each default of a fall estimate comes from, for the "how this was computed" screen. */
export const DEFAULT_SOURCES = {
  gravityMps2: 'Standard gravity 9.80665 m/s² (3rd CGPM 1901; NIST SP 811, Appendix B)',
  airDensityKgM3: 'ISA sea-level air density 1.225 kg/m³ (ICAO Doc 7488/3, Manual of the ICAO Standard Atmosphere)',
  initialVelocityMps: 'Released at rest (no throw) unless the inspector says otherwise',
  windSpeedMps: 'Still air (no drift) unless a wind speed is given',
  dragAreaM2: 'No drag area and no shape: no air drag at all (vacuum), the worst case',
  exposure: 'Bare head, the worst case, unless the exposure below is workers in helmets',
} as const;
